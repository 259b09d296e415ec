import { Field, Input, Stack, Textarea } from '@chakra-ui/react';
import type { FieldErrors, UseFormRegister } from 'react-hook-form';

interface GroupFieldValues {
  name?: string;
  description?: string;
  pointLimit?: number;
}

/** Name, point limit and description: the fields of both the create and the settings form. */
export function GroupFields({ register, errors }: {
  register: UseFormRegister<GroupFieldValues>;
  errors: FieldErrors<GroupFieldValues>;
}) {
  return (
    <>
      <Stack direction={{ base: 'column', md: 'row' }} gap="4" align={{ base: 'stretch', md: 'start' }}>
        <Field.Root invalid={!!errors.name} flex="2">
          <Field.Label>Name</Field.Label>
          <Input placeholder="e.g. Reheating Studies" bg="bg.panel" autoComplete="off" {...register('name')} />
          <Field.ErrorText>{errors.name?.message}</Field.ErrorText>
        </Field.Root>
        <Field.Root invalid={!!errors.pointLimit} flex="1">
          <Field.Label>Point limit</Field.Label>
          <Input type="number" bg="bg.panel" {...register('pointLimit', { valueAsNumber: true })} />
          <Field.HelperText>Largest scan the group may submit, in points.</Field.HelperText>
          <Field.ErrorText>{errors.pointLimit?.message}</Field.ErrorText>
        </Field.Root>
      </Stack>
      <Field.Root invalid={!!errors.description}>
        <Field.Label>Description</Field.Label>
        <Textarea rows={2} bg="bg.panel" {...register('description')} />
        <Field.ErrorText>{errors.description?.message}</Field.ErrorText>
      </Field.Root>
    </>
  );
}
