const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹',
};

/**
 * How a number too small or large to write plainly shows its power of ten. `e` (tables, hover
 * texts, axis ticks) writes 1.2346e-10 with ASCII signs, so a copied value reads back as a number,
 * with one digit fewer in the mantissa to keep columns narrow; `power` (prose, results read at a
 * glance) writes 1.2346 × 10⁻¹⁰ with a true minus sign.
 */
export type ExponentStyle = 'e' | 'power';

/**
 * A number with `digits` significant digits: plain between 10⁻³ and 10⁵ (enough digits to tell
 * neighbouring grid points apart: n_s differs in the 4th decimal across a typical scan), otherwise
 * with a power of ten in the given style; "—" for a missing value.
 */
export function formatNumber(value: number | null | undefined, digits = 6, style: ExponentStyle = 'e'): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const magnitude = Math.abs(value);
  const plain = value === 0 || (magnitude >= 1e-3 && magnitude < 1e5);
  if (style === 'e') return plain ? String(Number(value.toPrecision(digits))) : value.toExponential(digits - 2);
  let text: string;
  if (plain) {
    text = Number(value.toPrecision(digits)).toString();
  } else {
    const [mantissa, exponent] = value.toExponential(digits - 1).split('e');
    const power = String(Number(exponent)).replace(/./g, (c) => SUPERSCRIPT[c] ?? c);
    text = `${Number(mantissa)} × 10${power}`;
  }
  return text.replace('-', '−');
}
