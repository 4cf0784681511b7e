import type { OptionBrief } from '@seinework/contracts';
import { formatNumber, formatSigned } from '../../brief-words';
import type { BriefDocument } from '../brief-document';

/** Key indicators before, after and their difference, with the 5–95 % band of the difference and whether it is robust. */
export function indicatorsSection(pdf: BriefDocument, brief: OptionBrief): void {
  pdf.heading('Key indicators before and after', 120);
  pdf.table(
    [
      { title: 'Indicator', width: 30 },
      { title: 'Baseline', width: 14, align: 'right' },
      { title: 'With the option', width: 14, align: 'right' },
      { title: 'Difference', width: 14, align: 'right' },
      { title: '5–95 % band of the difference', width: 20, align: 'right' },
      { title: 'Robust', width: 10 },
    ],
    brief.indicators.map((i) => [
      i.label,
      formatNumber(i.baseline),
      formatNumber(i.option),
      formatSigned(i.difference),
      i.band ? `${formatSigned(i.band.p5, 3)} to ${formatSigned(i.band.p95, 3)}` : '—',
      i.robust === null ? '—' : i.robust ? 'yes' : 'no',
    ]),
  );
  pdf.paragraph(
    brief.run.draws > 0
      ? 'Robust: the difference has the same sign in at least 90 % of the uncertainty draws. A difference that is not robust may be no difference at all.'
      : 'This run had no uncertainty draws: there are no bands, and small differences should not be read as real.',
    { muted: true, size: 8.5 },
  );
}
