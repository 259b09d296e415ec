import { OBSERVATIONAL_LIMITS } from '@sixtyfold/shared';
import { SelectField } from '@/components/ui/select-field';

const LIMIT_SETS = OBSERVATIONAL_LIMITS.map((limits) => ({ value: limits.key, label: limits.label }));

/** Picks one of the published limit sets; each names its source wherever it is drawn. */
export function LimitSetSelect({ value, onChange }: { value: string; onChange: (key: string) => void }) {
  return <SelectField label="Observational limits" value={value} options={LIMIT_SETS} onChange={onChange} minW="56" />;
}
