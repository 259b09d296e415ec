import { Button, Field, HStack, Input, NativeSelect, Stack, Text } from '@chakra-ui/react';
import { AUDIT_ACTIONS, AUDIT_TARGET_TYPES } from '@sixtyfold/shared';
import { useState, type FormEvent } from 'react';
import { AUDIT_FILTER_KEYS, hasAuditFilters, readAuditFilters, type AuditFilters } from '../utils/audit-filters';

export interface AuditFilterOption {
  id: number;
  label: string;
}

interface AuditFiltersFormProps {
  value: AuditFilters;
  onChange: (filters: AuditFilters) => void;
  actors: AuditFilterOption[];
  groups: AuditFilterOption[];
}

type Draft = Record<(typeof AUDIT_FILTER_KEYS)[number], string>;

const draftOf = (filters: AuditFilters): Draft =>
  Object.fromEntries(AUDIT_FILTER_KEYS.map((key) => [key, filters[key] === undefined ? '' : String(filters[key])])) as Draft;

interface SelectOption {
  value: string;
  label: string;
}

const byId = (options: AuditFilterOption[]): SelectOption[] => options.map((o) => ({ value: String(o.id), label: o.label }));
const byName = (names: readonly string[]): SelectOption[] => names.map((name) => ({ value: name, label: name }));

/** A value from the address that is not among the options still shows, so the select never lies. */
function withCurrent(options: SelectOption[], current: string | number | undefined, noun: string): SelectOption[] {
  if (current === undefined || options.some((o) => o.value === String(current))) return options;
  return [...options, { value: String(current), label: `${noun} ${current}` }];
}

/**
 * Filters the audit log by action, actor, group, target type and a range of UTC days; applied on
 * submit. The fields start from `value`: key the form on it so Back or a link resets them.
 */
export function AuditFiltersForm({ value, onChange, actors, groups }: AuditFiltersFormProps) {
  const [draft, setDraft] = useState<Draft>(() => draftOf(value));
  const [rangeError, setRangeError] = useState<string | null>(null);

  const set = (key: keyof Draft) => (event: { target: { value: string } }) => setDraft((d) => ({ ...d, [key]: event.target.value }));

  const submit = (event: FormEvent) => {
    event.preventDefault();
    // ISO days compare as text.
    if (draft.from && draft.to && draft.from > draft.to) {
      setRangeError('The end day comes before the start day.');
      return;
    }
    setRangeError(null);
    onChange(readAuditFilters(new URLSearchParams(draft)));
  };

  // Actions and target types come from the shared lists the API checks against.
  const select = (key: 'action' | 'actorId' | 'groupId' | 'targetType', label: string, any: string, options: SelectOption[]) => (
    <Field.Root w="auto" minW="44" maxW="60">
      <Field.Label fontSize="sm">{label}</Field.Label>
      <NativeSelect.Root size="sm">
        <NativeSelect.Field bg="bg.panel" value={draft[key]} onChange={set(key)}>
          <option value="">{any}</option>
          {withCurrent(options, value[key], label.toLowerCase()).map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </NativeSelect.Field>
        <NativeSelect.Indicator />
      </NativeSelect.Root>
    </Field.Root>
  );

  return (
    <form onSubmit={submit} role="search" aria-label="Filter audit events" noValidate>
      <Stack gap="3">
        <HStack gap="3" align="end" wrap="wrap">
          {select('action', 'Action', 'Any action', byName(AUDIT_ACTIONS))}
          {select('actorId', 'Actor', 'Anyone', [{ value: 'none', label: 'No one (automatic)' }, ...byId(actors)])}
          {select('groupId', 'Group', 'Any group', byId(groups))}
          {select('targetType', 'Target type', 'Any target', byName(AUDIT_TARGET_TYPES))}
          <Field.Root w="auto" invalid={!!rangeError}>
            <Field.Label fontSize="sm">From</Field.Label>
            <Input size="sm" bg="bg.panel" type="date" value={draft.from} onChange={set('from')} />
          </Field.Root>
          <Field.Root w="auto" invalid={!!rangeError}>
            <Field.Label fontSize="sm">To</Field.Label>
            <Input size="sm" bg="bg.panel" type="date" value={draft.to} onChange={set('to')} />
          </Field.Root>
        </HStack>
        {rangeError && (
          <Text color="fg.error" fontSize="sm" role="alert">
            {rangeError}
          </Text>
        )}
        <HStack gap="2">
          <Button type="submit" size="sm" colorPalette="ink">
            Filter
          </Button>
          {hasAuditFilters(value) && (
            <Button size="sm" variant="ghost" onClick={() => onChange({})}>
              Clear filters
            </Button>
          )}
          <Text fontSize="xs" color="fg.muted">
            Days are UTC; both ends included.
          </Text>
        </HStack>
      </Stack>
    </form>
  );
}
