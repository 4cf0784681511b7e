import type { OptionBrief } from '@seinework/contracts';
import { formatDate } from '../brief-words';
import { BriefDocument } from './brief-document';
import { chartsSection } from './sections/charts';
import { dependenceSection } from './sections/dependence';
import { fleetsSection } from './sections/fleets';
import { indicatorsSection } from './sections/indicators';
import { inputsSection } from './sections/inputs';
import { cautionSection, commentsSection, preferencesSection } from './sections/record';

/** The PDF brief of one option's run: the sections in the order a council member reads them. */
export function optionBriefPdf(brief: OptionBrief): Promise<Buffer> {
  const pdf = new BriefDocument({
    title: `Brief: ${brief.option.name}`,
    subject: `Harvest option on ${brief.web.name}, version ${brief.web.versionNumber}`,
    dated: new Date(brief.dated),
    footer: `Seinework brief · run ${brief.run.id} · ${formatDate(brief.dated)}`,
  });
  inputsSection(pdf, brief);
  cautionSection(pdf);
  indicatorsSection(pdf, brief);
  pdf.newPage();
  chartsSection(pdf, brief);
  dependenceSection(pdf, brief);
  fleetsSection(pdf, brief);
  preferencesSection(pdf, brief.preferences);
  commentsSection(pdf, brief);
  return pdf.finish();
}
