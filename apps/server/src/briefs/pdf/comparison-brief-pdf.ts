import type { ComparisonBrief } from '@seinework/contracts';
import { formatDate, formatNumber, formatSigned, letter } from '../brief-words';
import { BriefDocument } from './brief-document';
import { cautionSection, preferencesSection } from './sections/record';

/**
 * The PDF brief of a comparison: the compared options (lettered), every indicator side by side
 * with a mark where the difference exceeds the uncertainty, the options on the fitness curve, the
 * preferences and the caution.
 */
export function comparisonBriefPdf(brief: ComparisonBrief): Promise<Buffer> {
  const pdf = new BriefDocument({
    title: `Comparison of ${brief.options.length} harvest options`,
    subject: `Harvest options on ${brief.web.name}, version ${brief.web.versionNumber}`,
    dated: new Date(brief.dated),
    footer: `Seinework comparison brief · runs ${brief.options.map((o) => o.runId.slice(0, 8)).join(', ')} · ${formatDate(brief.dated)}`,
  });
  pdf.title(`Comparison of ${brief.options.length} harvest options`, `On ${brief.web.name}, version ${brief.web.versionNumber} (${brief.web.versionId}); flows in ${brief.web.unit}`);
  pdf.heading('The options compared');
  brief.options.forEach((option, k) => {
    pdf.paragraph(`${letter(k)}. ${option.optionName}`, { bold: true });
    if (option.purpose) pdf.paragraph(option.purpose, { size: 9 });
    pdf.bullets(option.adjustments);
    pdf.paragraph(`${option.responseInWords} Run ${option.runId}, engine ${option.engineVersion}, ${option.draws > 0 ? `${option.draws} draws, seed ${option.seed}` : 'no uncertainty draws'}, finished ${formatDate(option.finishedAt)}.`, { muted: true, size: 8.5 });
  });
  cautionSection(pdf);
  pdf.heading('Indicators side by side', 120);
  pdf.table(
    [
      { title: 'Indicator', width: 24 },
      { title: 'Baseline', width: 12, align: 'right' },
      ...brief.options.map((_o, k) => ({ title: `${letter(k)}: difference`, width: 64 / brief.options.length, align: 'right' as const })),
    ],
    brief.indicators.map((indicator) => [
      indicator.label,
      formatNumber(indicator.baseline),
      ...indicator.values.map((v) => (v.difference === null ? '—' : `${formatSigned(v.difference, 3)}${v.exceedsUncertainty ? ' •' : ''}`)),
    ]),
    { size: 8 },
  );
  pdf.paragraph('Difference: with the option minus the baseline. • marks a difference whose 5–95 % band excludes zero (it exceeds the uncertainty); without draws no difference is marked.', { muted: true, size: 8.5 });
  pdf.heading(brief.fitnessCurve.title, brief.fitnessCurve.height);
  pdf.chart(brief.fitnessCurve);
  preferencesSection(pdf, brief.preferences);
  return pdf.finish();
}
