/** A figure as the option screens print it: enough digits to see a small difference, none to spare. */
export function figure(value: number | null, signed = false): string {
  if (value === null || !Number.isFinite(value)) return '—';
  const size = Math.abs(value);
  const digits = size >= 100 ? 0 : size >= 1 ? 2 : 3;
  const options: Intl.NumberFormatOptions =
    size !== 0 && size < 1 ? { minimumSignificantDigits: digits, maximumSignificantDigits: digits } : { minimumFractionDigits: digits, maximumFractionDigits: digits };
  const text = value.toLocaleString('en-GB', options);
  return signed && value > 0 ? `+${text}` : text.replace('-', '−');
}
