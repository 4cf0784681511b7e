import { INDICATOR_NAMES, type Adjustment, type OptionPreview, type ResponseRule, type Web } from '@seinework/contracts';

/** How options read to a council member: each adjustment, the response rule and the indicators in words. */

export const ADJUSTMENT_KINDS: readonly { type: Adjustment['type']; label: string }[] = [
  { type: 'scale-catch', label: 'Change a catch by a percentage' },
  { type: 'set-catch', label: 'Set a catch to an amount' },
  { type: 'close-fleet', label: 'Close a fleet' },
  { type: 'open-fishery', label: 'Open a new fishery' },
  { type: 'scale-production', label: 'Change primary production by a percentage' },
];

export const RESPONSE_RULES: readonly { rule: ResponseRule; label: string; explain: string }[] = [
  { rule: 'bottom-up', label: 'Bottom-up', explain: 'each compartment keeps the proportions of its other outputs, which give up or take back what its catch changes; what flows in from outside stays as it is' },
  { rule: 'least-change', label: 'Least change', explain: 'catches and primary production are held; every other flow moves as little as it can to rebalance the web' },
];

export function responseLabel(rule: ResponseRule): string {
  return RESPONSE_RULES.find((r) => r.rule === rule)?.label ?? rule;
}

/** "Cut the Purse seine fleet's catch of Forage fish by 30 %". */
export function adjustmentInWords(adjustment: Adjustment, web: Web | null): string {
  const name = (id: string) => web?.compartments.find((c) => c.id === id)?.name ?? id;
  const unit = web?.unit ?? '';
  switch (adjustment.type) {
    case 'scale-catch':
      return `${direction(adjustment.percent)} the ${adjustment.fleet} fleet's catch of ${name(adjustment.compartment)}${by(adjustment.percent)}`;
    case 'set-catch':
      return `Set the ${adjustment.fleet} fleet's catch of ${name(adjustment.compartment)} to ${amount(adjustment.amount)} ${unit}`.trim();
    case 'close-fleet':
      return `Close the ${adjustment.fleet} fleet: all its catches end`;
    case 'open-fishery':
      return `Open a ${adjustment.fleet} fishery on ${name(adjustment.compartment)} landing ${amount(adjustment.amount)} ${unit}`.trim();
    case 'scale-production':
      return `${direction(adjustment.percent)} the primary production of ${name(adjustment.compartment)}${by(adjustment.percent)}`;
  }
}

function direction(percent: number): string {
  if (percent < 0) return 'Cut';
  return percent > 0 ? 'Raise' : 'Keep';
}

function by(percent: number): string {
  return percent === 0 ? ' as it is' : ` by ${amount(Math.abs(percent))} %`;
}

function amount(value: number): string {
  return value.toLocaleString('en-GB', { maximumFractionDigits: 6 });
}

type IndicatorKey = OptionPreview['indicators'][number]['key'];

/**
 * The indicators the option form previews, in the order a council member reads them: their names,
 * whether they are in the web's flow unit, and whether they are shares (printed as per cent).
 */
export const KEY_INDICATORS: readonly { key: IndicatorKey; label: string; inFlowUnit?: boolean; share?: boolean }[] = [
  { key: 'totalCatch', label: INDICATOR_NAMES.totalCatch, inFlowUnit: true },
  { key: 'meanTrophicLevelOfCatch', label: INDICATOR_NAMES.meanTrophicLevelOfCatch },
  { key: 'primaryProductionRequiredShare', label: INDICATOR_NAMES.primaryProductionRequiredShare, share: true },
  { key: 'relativeAscendency', label: INDICATOR_NAMES.relativeAscendency },
  { key: 'robustness', label: INDICATOR_NAMES.robustness },
  { key: 'finnCyclingIndex', label: INDICATOR_NAMES.finnCyclingIndex, share: true },
  { key: 'totalSystemThroughflow', label: INDICATOR_NAMES.totalSystemThroughflow, inFlowUnit: true },
  { key: 'fishingInBalance', label: `${INDICATOR_NAMES.fishingInBalance} against the baseline` },
];