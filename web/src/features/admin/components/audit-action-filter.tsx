import { Button, Field, HStack, Input } from '@chakra-ui/react';
import { useEffect, useState, type FormEvent } from 'react';

interface AuditActionFilterProps {
  value: string;
  onChange: (action: string) => void;
}

/** Filters the audit log by action name, e.g. auth.login; applied on submit, not per keystroke. */
export function AuditActionFilter({ value, onChange }: AuditActionFilterProps) {
  const [draft, setDraft] = useState(value);
  useEffect(() => setDraft(value), [value]);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    onChange(draft.trim());
  };

  return (
    <form onSubmit={submit} role="search" aria-label="Filter audit events">
      <HStack gap="2" align="end">
        <Field.Root maxW="64">
          <Field.Label fontSize="sm">Action</Field.Label>
          <Input size="sm" bg="bg.panel" fontFamily="mono" placeholder="e.g. auth.login" value={draft} onChange={(e) => setDraft(e.target.value)} />
        </Field.Root>
        <Button type="submit" size="sm" colorPalette="ink">
          Filter
        </Button>
        {value && (
          <Button size="sm" variant="ghost" onClick={() => onChange('')}>
            Show all
          </Button>
        )}
      </HStack>
    </form>
  );
}
