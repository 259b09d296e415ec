import { Checkbox, Fieldset, HStack, Text } from '@chakra-ui/react';
import type { LikelihoodSetEntry } from '@sixtyfold/shared';
import { SelectField } from '@/components/ui/select-field';
import { likelihoodRef, type ChosenLikelihoods } from '../hooks/use-chosen-likelihoods';

const optionLabel = (set: LikelihoodSetEntry) => `${set.name} (${set.key} v${set.version})`;

/** Says so when the list of sets could not be read, so that no region silently goes missing. */
function ListFailed({ choice }: { choice: ChosenLikelihoods }) {
  return choice.list.isError ? (
    <Text fontSize="sm" color="fg.error" pb="2">
      Could not load the likelihood sets: {choice.list.error.message}
    </Text>
  ) : null;
}

/** Picks the one likelihood set a scan's views judge and draw by. */
export function LikelihoodSetSelect({ choice, value = choice.refs[0] }: { choice: ChosenLikelihoods; value?: string }) {
  if (choice.list.isError) return <ListFailed choice={choice} />;
  const sets = choice.list.data ?? [];
  const options = sets.map((set) => ({ value: likelihoodRef(set), label: optionLabel(set) }));
  // Until the list is loaded (or for a reference without a version) the choice shows as it is written.
  const shown = options.some((option) => option.value === value) ? value : (options.find((option) => option.value.split('@')[0] === value)?.value ?? value);
  return <SelectField label="Likelihood set" value={shown} options={options.length ? options : [{ value, label: value }]} onChange={(ref) => choice.choose([ref])} minW="72" />;
}

/** Picks several sets at once, for pages that draw each one's regions side by side. */
export function LikelihoodSetChecks({ choice }: { choice: ChosenLikelihoods }) {
  if (choice.list.isError) return <ListFailed choice={choice} />;
  const sets = choice.list.data ?? [];
  const isChosen = (set: LikelihoodSetEntry) => choice.sets.some((c) => c.key === set.key && c.version === set.version);
  const toggle = (set: LikelihoodSetEntry, on: boolean) => choice.choose(sets.filter((s) => (s === set ? on : isChosen(s))).map(likelihoodRef));
  return (
    <Fieldset.Root w="auto">
      <Fieldset.Legend fontSize="sm">Likelihood sets</Fieldset.Legend>
      <HStack gap="4" wrap="wrap">
        {sets.map((set) => (
          <Checkbox.Root key={likelihoodRef(set)} checked={isChosen(set)} onCheckedChange={(details) => toggle(set, details.checked === true)} colorPalette="ember" size="sm">
            <Checkbox.HiddenInput />
            <Checkbox.Control />
            <Checkbox.Label>{optionLabel(set)}</Checkbox.Label>
          </Checkbox.Root>
        ))}
      </HStack>
    </Fieldset.Root>
  );
}
