import { SCALAR_INDICATORS, type FleetSummary, type OptionPreview } from '@seinework/contracts';

/**
 * The brief of an option's deterministic run for the option form: scalars before / after /
 * difference and the fleets (every fleet of the baseline or the option, baseline order first).
 * Takes the run's document `{baseline, option, difference, web}`.
 */
export function optionPreview(document: { baseline: Record<string, unknown>; option: Record<string, unknown>; difference: Record<string, unknown> }): OptionPreview {
  const scalar = (part: Record<string, unknown>, key: string) => {
    const value = Object.hasOwn(part, key) ? part[key] : null;
    return typeof value === 'number' ? value : null;
  };
  const fleetsOf = (part: Record<string, unknown>) => (part['fleets'] ?? {}) as Record<string, FleetSummary>;
  const before = fleetsOf(document.baseline);
  const after = fleetsOf(document.option);
  const changes = fleetsOf(document.difference) as unknown as Record<string, Record<string, unknown>>;
  const names = [...new Set([...Object.keys(before), ...Object.keys(after)])];
  return {
    indicators: [
      ...SCALAR_INDICATORS.map((key) => ({ key, baseline: scalar(document.baseline, key), option: scalar(document.option, key), difference: scalar(document.difference, key) })),
      { key: 'fishingInBalance' as const, baseline: null, option: null, difference: scalar(document.difference, 'fishingInBalance') },
    ],
    fleets: names.map((fleet) => ({
      fleet,
      baseline: Object.hasOwn(before, fleet) ? before[fleet]! : null,
      option: Object.hasOwn(after, fleet) ? after[fleet]! : null,
      fishingInBalance: Object.hasOwn(changes, fleet) ? scalar(changes[fleet]!, 'fishingInBalance') : null,
    })),
  };
}
