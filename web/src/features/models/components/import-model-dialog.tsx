import { Button, Dialog, Field, Input, Stack, Text } from '@chakra-ui/react';
import type { MembershipSummary, PotentialModel } from '@sixtyfold/shared';
import { useState } from 'react';
import { DialogFrame } from '@/components/ui/dialog-frame';
import { FailureAlert } from '@/components/ui/failure-alert';
import { SelectField } from '@/components/ui/select-field';
import { useImportModel } from '../api/model-files';

interface ImportModelDialogProps {
  open: boolean;
  /** The groups the user may add models to. */
  groups: MembershipSummary[];
  onClose: () => void;
  onImported: (model: PotentialModel) => void;
}

/** Adds a model to a group from a model file (format sixtyfold.potential, see DEVELOPERS.md). */
export function ImportModelDialog({ open, groups, onClose, onImported }: ImportModelDialogProps) {
  const [groupId, setGroupId] = useState(String(groups[0]?.groupId ?? ''));
  const [file, setFile] = useState<File | null>(null);
  const importing = useImportModel({ onSuccess: onImported });
  const close = () => {
    importing.reset();
    setFile(null);
    onClose();
  };

  return (
    <DialogFrame
      open={open}
      title="Import a model file"
      onClose={close}
      footer={
        <>
          <Dialog.ActionTrigger asChild>
            <Button variant="outline">Cancel</Button>
          </Dialog.ActionTrigger>
          <Button
            colorPalette="ember"
            disabled={!file || !groupId}
            loading={importing.isPending}
            loadingText="Importing…"
            onClick={() => file && importing.mutate({ groupId: Number(groupId), file })}
          >
            Import
          </Button>
        </>
      }
    >
      <Stack gap="4">
        <Text fontSize="sm" color="fg.muted">
          A JSON file in the Sixtyfold model format, as Export file writes it. The model is checked like one typed into the form.
        </Text>
        <SelectField
          label="Group"
          value={groupId}
          options={groups.map((g) => ({ value: String(g.groupId), label: g.groupName }))}
          onChange={setGroupId}
        />
        <Field.Root>
          <Field.Label>Model file (.json, at most 256 kB)</Field.Label>
          <Input
            type="file"
            accept=".json,application/json"
            p="1"
            onChange={(event) => {
              importing.reset();
              setFile(event.target.files?.[0] ?? null);
            }}
          />
        </Field.Root>
        {importing.isError && (
          <FailureAlert title="The file was not imported">{importing.error.message}</FailureAlert>
        )}
      </Stack>
    </DialogFrame>
  );
}
