/**
 * Numbers as the result page shows them: shares as percentages (a difference of shares in
 * percentage points), differences with their sign, and a value too small for the usual decimals in
 * two significant digits instead of a misleading 0.000.
 */
export function formatValue(value: number | null | undefined, format: 'percent' | 'number', decimals: number, signed = false): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const shown = format === 'percent' ? value * 100 : value;
  // below 1e-12 is the rounding of the arithmetic, not a change
  const magnitude = Math.abs(shown) < 1e-12 ? 0 : Math.abs(shown);
  const tiny = magnitude > 0 && magnitude < 0.5 * 10 ** -decimals;
  const text = tiny
    ? magnitude.toLocaleString('en-GB', { maximumSignificantDigits: 2 })
    : magnitude.toLocaleString('en-GB', { minimumFractionDigits: decimals, maximumFractionDigits: decimals });
  const zero = magnitude === 0 || Number(text.replaceAll(',', '')) === 0;
  const sign = shown < 0 && !zero ? '−' : signed && shown > 0 && !zero ? '+' : '';
  return `${sign}${text}${format === 'percent' ? (signed ? ' pts' : ' %') : ''}`;
}

/** A plain number with a sensible number of decimals for its size (for table cells without a label). */
export function formatAuto(value: number | null | undefined, signed = false): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const magnitude = Math.abs(value);
  const decimals = magnitude >= 1000 ? 0 : magnitude >= 10 ? 1 : magnitude >= 1 ? 2 : 3;
  return formatValue(value, 'number', decimals, signed);
}

/** A small change (per 1 %, say) in three significant digits with its sign; very small ones as a power of ten. */
export function formatSmall(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  if (value === 0) return '0';
  const sign = value < 0 ? '−' : '+';
  const magnitude = Math.abs(value);
  if (magnitude >= 1e-3) return sign + magnitude.toLocaleString('en-GB', { maximumSignificantDigits: 3 });
  const exponent = Math.floor(Math.log10(magnitude));
  const mantissa = magnitude / 10 ** exponent;
  const superscript = String(exponent).replace('-', '⁻').replace(/\d/g, (d) => '⁰¹²³⁴⁵⁶⁷⁸⁹'[Number(d)]);
  return `${sign}${mantissa.toLocaleString('en-GB', { maximumSignificantDigits: 3 })} × 10${superscript}`;
}

/** A heat-map cell: fixed decimals and no unit, so the map stays compact; what rounds to zero shows as 0. */
export function formatCell(value: number | null | undefined, format: 'percent' | 'number', decimals: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const shown = format === 'percent' ? value * 100 : value;
  const text = Math.abs(shown).toLocaleString('en-GB', { minimumFractionDigits: decimals, maximumFractionDigits: decimals });
  if (Number(text.replaceAll(',', '')) === 0) return '0';
  return `${shown < 0 ? '−' : '+'}${text}`;
}
