import type { OptionBrief } from '@seinework/contracts';
import type { BriefDocument } from '../brief-document';

/** The fitness curve and the trophic ladder, drawn as vectors. */
export function chartsSection(pdf: BriefDocument, brief: OptionBrief): void {
  pdf.heading(brief.fitnessCurve.title, brief.fitnessCurve.height);
  pdf.chart(brief.fitnessCurve);
  pdf.heading(brief.trophicLadder.title, brief.trophicLadder.height);
  pdf.chart(brief.trophicLadder);
}
