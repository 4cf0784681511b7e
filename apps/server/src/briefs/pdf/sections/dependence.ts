import type { OptionBrief } from '@seinework/contracts';
import { formatSigned } from '../../brief-words';
import type { BriefDocument } from '../brief-document';

const percent = (share: number) => `${(share * 100).toFixed(1)} %`;

/** The largest changes in indirect diet dependence. */
export function dependenceSection(pdf: BriefDocument, brief: OptionBrief): void {
  pdf.heading('Who depends on whom: the largest changes');
  pdf.paragraph('Share of a compartment’s food that passed, directly or indirectly, through another compartment (total dependency), before and after the option.', { muted: true, size: 8.5 });
  if (brief.dependence.length === 0) return pdf.paragraph('The option changes no dependence.');
  pdf.table(
    [
      { title: 'Compartment', width: 26 },
      { title: 'depends on', width: 26 },
      { title: 'Baseline', width: 14, align: 'right' },
      { title: 'With the option', width: 16, align: 'right' },
      { title: 'Change (points)', width: 16, align: 'right' },
    ],
    brief.dependence.map((d) => [d.to, d.from, percent(d.before), percent(d.after), formatSigned(d.change * 100, 3)]),
  );
}
