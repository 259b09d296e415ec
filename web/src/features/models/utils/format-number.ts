const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹',
};

/**
 * A result for reading, with `digits` significant digits: plain between 10⁻³ and 10⁵, otherwise
 * as m × 10ⁿ; a true minus sign; "—" for a missing value.
 */
export function formatNumber(value: number | null | undefined, digits = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const magnitude = Math.abs(value);
  let text: string;
  if (value === 0 || (magnitude >= 1e-3 && magnitude < 1e5)) {
    text = Number(value.toPrecision(digits)).toString();
  } else {
    const [mantissa, exponent] = value.toExponential(digits - 1).split('e');
    const power = String(Number(exponent)).replace(/./g, (c) => SUPERSCRIPT[c] ?? c);
    text = `${Number(mantissa)} × 10${power}`;
  }
  return text.replace('-', '−');
}
