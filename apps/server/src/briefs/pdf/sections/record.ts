import type { PreferenceSummary } from '@seinework/contracts';
import type { OptionBrief } from '@seinework/contracts';
import { CAUTION, formatDate } from '../../brief-words';
import type { BriefDocument } from '../brief-document';

/** The council's recorded preferences. */
export function preferencesSection(pdf: BriefDocument, preferences: readonly PreferenceSummary[]): void {
  pdf.heading('Preferences recorded', 50);
  if (preferences.length === 0) return pdf.paragraph('No council member has recorded a preference.');
  pdf.table(
    [
      { title: 'Member', width: 18 },
      { title: 'Prefers', width: 24 },
      { title: 'Reason', width: 40 },
      { title: 'Recorded', width: 18 },
    ],
    preferences.map((p) => [p.member, p.optionName, p.reason, formatDate(p.createdAt)]),
  );
}

/** The discussion in numbers (hidden comments left out). */
export function commentsSection(pdf: BriefDocument, brief: OptionBrief): void {
  pdf.heading('Discussion', 50);
  const { total, replies, byAnchor } = brief.comments;
  if (total === 0) return pdf.paragraph('No comments have been posted on this option.');
  pdf.paragraph(`${total} ${total === 1 ? 'comment' : 'comments'} on this option (${replies} of them ${replies === 1 ? 'a reply' : 'replies'}); comments hidden by moderators are not counted.`);
  if (byAnchor.length > 0) {
    pdf.table(
      [
        { title: 'Comments pointing at', width: 70 },
        { title: 'Comments', width: 30, align: 'right' },
      ],
      byAnchor.map((a) => [`${a.label} (${a.kind})`, String(a.count)]),
    );
  }
}

export function cautionSection(pdf: BriefDocument): void {
  pdf.heading('Caution', 40);
  pdf.paragraph(CAUTION, { bold: true });
}
