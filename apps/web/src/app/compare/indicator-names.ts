import { INDICATOR_NAMES, type IndicatorKey } from '@seinework/contracts';

export { INDICATOR_NAMES, type IndicatorKey };


/** The indicators charted side by side: the ones a council member reads first. */
export const KEY_INDICATORS: readonly IndicatorKey[] = ['relativeAscendency', 'finnCyclingIndex', 'totalCatch', 'meanTrophicLevelOfCatch', 'primaryProductionRequiredShare'];

const figure = new Intl.NumberFormat('en-GB', { maximumSignificantDigits: 4 });
const large = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 1 });
const change = new Intl.NumberFormat('en-GB', { maximumSignificantDigits: 3, signDisplay: 'exceptZero' });

/** A value to four significant figures (whole numbers from 1,000 up), or a dash. */
export function formatFigure(value: number | null): string {
  if (value === null) return '—';
  return Math.abs(value) >= 1000 ? large.format(value) : figure.format(value);
}

/** A difference with its sign, to three significant figures, or a dash; a true minus sign. */
export function formatChange(value: number | null): string {
  if (value === null) return '—';
  return change.format(value).replace('-', '−');
}

const IN_FLOW_UNIT: readonly IndicatorKey[] = ['tst', 'totalSystemThroughflow', 'totalCatch', 'primaryProductionRequired'];
const IN_FLOW_BITS: readonly IndicatorKey[] = ['developmentCapacity', 'ascendency', 'overhead'];
const IN_BITS: readonly IndicatorKey[] = ['averageMutualInformation', 'flowDiversity'];

/** The unit an indicator is shown in (METHODS.md: information indices in bits, times the flow unit for A, C, Φ); '' for ratios. */
export function unitOf(key: IndicatorKey, flowUnit: string): string {
  if (IN_FLOW_UNIT.includes(key)) return flowUnit;
  if (IN_FLOW_BITS.includes(key)) return `${flowUnit}·bits`;
  if (IN_BITS.includes(key)) return 'bits';
  return '';
}
