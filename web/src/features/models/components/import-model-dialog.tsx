import { Alert, Button, CloseButton, Dialog, Field, Input, Portal, Stack, Text } from '@chakra-ui/react';
import type { MembershipSummary, PotentialModel } from '@sixtyfold/shared';
import { useState } from 'react';
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
    <Dialog.Root open={open} onOpenChange={(details) => !details.open && close()} placement="center">
      <Portal>
        <Dialog.Backdrop />
        <Dialog.Positioner>
          <Dialog.Content>
            <Dialog.Header>
              <Dialog.Title>Import a model file</Dialog.Title>
            </Dialog.Header>
            <Dialog.Body>
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
                  <Alert.Root status="error" variant="subtle" borderRadius="md" role="alert">
                    <Alert.Indicator />
                    <Alert.Content>
                      <Alert.Title>The file was not imported</Alert.Title>
                      <Alert.Description>{importing.error.message}</Alert.Description>
                    </Alert.Content>
                  </Alert.Root>
                )}
              </Stack>
            </Dialog.Body>
            <Dialog.Footer>
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
            </Dialog.Footer>
            <Dialog.CloseTrigger asChild>
              <CloseButton size="sm" />
            </Dialog.CloseTrigger>
          </Dialog.Content>
        </Dialog.Positioner>
      </Portal>
    </Dialog.Root>
  );
}
