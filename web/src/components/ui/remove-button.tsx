import { Button } from '@chakra-ui/react';
import type { ReactNode } from 'react';

interface RemoveButtonProps {
  /** Names what goes, for screen readers: "Remove Lucía Marín". */
  label: string;
  onClick: () => void;
  /** The visible verb: Remove, Delete, Revoke. */
  children: ReactNode;
}

/** The small red button of a row or item that takes it away; the dialog it opens does the asking. */
export function RemoveButton({ label, onClick, children }: RemoveButtonProps) {
  return (
    <Button size="xs" variant="ghost" colorPalette="red" aria-label={label} onClick={onClick}>
      {children}
    </Button>
  );
}
