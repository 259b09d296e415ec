import { SCAN_METHODS } from '@sixtyfold/shared';
import { methodLabels } from '@/lib/method-labels';

/** The methods as the options of a select, in one order with one set of labels. */
export function MethodOptions() {
  return SCAN_METHODS.map((m) => (
    <option key={m} value={m}>
      {methodLabels[m]}
    </option>
  ));
}
