import type { OptionBrief } from '@seinework/contracts';
import { formatNumber } from '../../brief-words';
import type { BriefDocument } from '../brief-document';

const pair = (before: number | null, after: number | null) => `${formatNumber(before)} to ${formatNumber(after)}`;

/** Each fleet's catch, value, mean trophic level of the catch and primary production required; its mixed trophic impact on the main compartments. */
export function fleetsSection(pdf: BriefDocument, brief: OptionBrief): void {
  pdf.heading('Fleet effects', 100);
  if (brief.fleets.length === 0) return pdf.paragraph('No fleet fishes this web.');
  pdf.table(
    [
      { title: 'Fleet', width: 20 },
      { title: `Catch (${brief.web.unit})`, width: 20, align: 'right' },
      { title: 'Value per year', width: 20, align: 'right' },
      { title: 'Mean trophic level of the catch', width: 20, align: 'right' },
      { title: 'Primary production required', width: 20, align: 'right' },
    ],
    brief.fleets.map((f) => [f.fleet, pair(f.catchBefore, f.catchAfter), pair(f.valueBefore, f.valueAfter), pair(f.meanTrophicLevelBefore, f.meanTrophicLevelAfter), pair(f.pprBefore, f.pprAfter)]),
  );
  pdf.paragraph('Each figure: baseline to with the option.', { muted: true, size: 8.5 });
  if (brief.mainCompartments.length === 0) return;
  pdf.paragraph('Mixed trophic impact of each fleet on the compartments it affects most, with the option (positive: the fleet’s growth would favour the compartment; negative: harm it).', { size: 9 });
  pdf.table(
    [{ title: 'Fleet', width: 20 }, ...brief.mainCompartments.map((name) => ({ title: name, width: 80 / brief.mainCompartments.length, align: 'right' as const }))],
    brief.fleets.map((f) => [f.fleet, ...f.impacts.map((v) => formatNumber(v, 3))]),
    { size: 8 },
  );
}
