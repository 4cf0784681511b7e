import { formatNumber, INDICATOR_NAMES, type Adjustment, type ResponseRule } from '@seinework/contracts';

export { formatDate, formatNumber, formatSigned } from '@seinework/contracts';

/** The words a brief uses for an option's inputs and for the indicators (PRODUCT.md vocabulary). */

export const CAUTION =
  'Steady-state network results are indicative, carry data uncertainty, and do not replace stock assessments, ' +
  "the advice of the council's scientific body, or the law that governs the fishery.";

const LABELS: Readonly<Record<string, string>> = INDICATOR_NAMES;

export function indicatorLabel(key: string): string {
  return Object.hasOwn(LABELS, key) ? LABELS[key]! : key;
}

/** The indicators a brief lists, in the order a council member reads them. */
export const KEY_INDICATORS = [
  'relativeAscendency',
  'robustness',
  'finnCyclingIndex',
  'totalCatch',
  'meanTrophicLevelOfCatch',
  'primaryProductionRequired',
  'primaryProductionRequiredShare',
  'fishingInBalance',
  'tst',
  'ascendency',
  'developmentCapacity',
  'averageMutualInformation',
  'effectiveConnectance',
  'effectiveRoles',
] as const;

export function responseInWords(response: ResponseRule): string {
  return response === 'least-change'
    ? 'Least change: catches and primary production are held at their targets and every other flow moves as little as it can to keep the web balanced.'
    : 'Bottom-up: each compartment keeps the proportions of what it passes on, respires and exports, and gives up (or takes back) what its catch takes.';
}

function amount(value: number, unit: string): string {
  return `${formatNumber(value)} ${unit}`;
}

function percent(value: number): string {
  return value >= 0 ? `by ${formatNumber(value)} %` : `by ${formatNumber(-value)} %`;
}

export function adjustmentInWords(adjustment: Adjustment, nameOf: (id: string) => string, unit: string): string {
  switch (adjustment.type) {
    case 'scale-catch':
      return `${adjustment.percent >= 0 ? 'Raise' : 'Cut'} the ${adjustment.fleet} catch of ${nameOf(adjustment.compartment)} ${percent(adjustment.percent)}.`;
    case 'set-catch':
      return `Set the ${adjustment.fleet} catch of ${nameOf(adjustment.compartment)} to ${amount(adjustment.amount, unit)}.`;
    case 'close-fleet':
      return `Close the ${adjustment.fleet} fleet.`;
    case 'open-fishery':
      return `Open a new ${adjustment.fleet} fishery on ${nameOf(adjustment.compartment)}, catching ${amount(adjustment.amount, unit)}.`;
    case 'scale-production':
      return `${adjustment.percent >= 0 ? 'Raise' : 'Lower'} the primary production of ${nameOf(adjustment.compartment)} ${percent(adjustment.percent)}.`;
  }
}

/** Compared options are lettered A, B, C… in the order they were listed. */
export function letter(index: number): string {
  return String.fromCharCode(65 + index);
}
