/**
 * A diverging colour for a signed value scaled by the largest magnitude shown: teal for positive,
 * amber for negative (the app's primary and tertiary hues), white at zero.
 */
export function heatColour(value: number | null, extent: number): string {
  if (value === null || !Number.isFinite(value) || extent <= 0) return 'transparent';
  const t = Math.min(1, Math.abs(value) / extent);
  const [r, g, b] = value >= 0 ? [29, 107, 111] : [181, 101, 42];
  const mix = (c: number) => Math.round(255 + (c - 255) * t * 0.85);
  return `rgb(${mix(r)}, ${mix(g)}, ${mix(b)})`;
}

export function largestMagnitude(values: Iterable<number | null>): number {
  let most = 0;
  for (const v of values) if (v !== null && Number.isFinite(v)) most = Math.max(most, Math.abs(v));
  return most;
}
