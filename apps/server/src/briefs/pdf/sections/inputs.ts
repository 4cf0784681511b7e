import type { OptionBrief } from '@seinework/contracts';
import { formatDate } from '../../brief-words';
import type { BriefDocument } from '../brief-document';

/** The option's title, purpose and exact inputs: web version, run, seed and draws, adjustments, response rule. */
export function inputsSection(pdf: BriefDocument, brief: OptionBrief): void {
  pdf.title(brief.option.name, `Brief of a harvest option on ${brief.web.name}, version ${brief.web.versionNumber}`);
  if (brief.option.purpose) pdf.paragraph(brief.option.purpose);
  pdf.heading('What the option changes');
  pdf.bullets(brief.option.adjustments.length > 0 ? brief.option.adjustments : ['No adjustment: the option is the baseline itself.']);
  pdf.paragraph(`How the web responds. ${brief.option.responseInWords}`);
  pdf.heading('Where these numbers come from', 60);
  const draws = brief.run.draws > 0 ? `${brief.run.draws} draws (${brief.run.succeeded ?? brief.run.draws} succeeded), flow cv ${brief.run.cv}, seed ${brief.run.seed}` : 'No uncertainty draws (the deterministic run alone)';
  pdf.facts([
    ['Web and version', `${brief.web.name}, version ${brief.web.versionNumber} (${brief.web.versionId})`],
    ['Unit of flows', brief.web.unit],
    ['Run', brief.run.id],
    ['Finished', formatDate(brief.run.finishedAt)],
    ['Engine version', brief.run.engineVersion],
    ['Uncertainty', draws],
  ]);
}
