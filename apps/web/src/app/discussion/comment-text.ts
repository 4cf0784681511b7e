import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

/** One piece of a comment: text shown as typed, or a web address shown as a link. */
export type TextPiece = { kind: 'text'; text: string } | { kind: 'link'; text: string; href: string };

/**
 * Web addresses in a comment (http and https only: a `javascript:` or `data:` address stays
 * text). Trailing punctuation is left out of the link, as in "see https://example.org/report."
 */
const ADDRESS = /\bhttps?:\/\/[^\s<>"']+/giu;
const TRAILING = /[.,;:!?)\]}'"»”’]+$/u;

/** Splits plain text into text and links; the pieces joined give back the text exactly. */
export function linkPieces(text: string): TextPiece[] {
  const pieces: TextPiece[] = [];
  let last = 0;
  for (const match of text.matchAll(ADDRESS)) {
    const address = match[0].replace(TRAILING, '');
    const start = match.index;
    if (address.length <= 'https://'.length) continue;
    if (start > last) pieces.push({ kind: 'text', text: text.slice(last, start) });
    pieces.push({ kind: 'link', text: address, href: address });
    last = start + address.length;
  }
  if (last < text.length) pieces.push({ kind: 'text', text: text.slice(last) });
  return pieces;
}

/**
 * A comment's text as plain text: Angular interpolation escapes everything, so HTML and scripts
 * are shown as the characters typed; line breaks are kept by `white-space: pre-wrap`; `dir="auto"`
 * isolates right-to-left text so that it cannot reorder the page around it.
 */
@Component({
  selector: 'sw-comment-text',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `<p dir="auto">@for (piece of pieces(); track $index) {@if (piece.kind === 'link') {<a [href]="piece.href" rel="nofollow noopener noreferrer ugc" target="_blank">{{ piece.text }}</a>} @else {{{ piece.text }}}}</p>`,
  styles: `
    p {
      margin: 0;
      white-space: pre-wrap;
      overflow-wrap: anywhere;
      unicode-bidi: isolate;
    }
    a {
      color: var(--mat-sys-primary);
    }
  `,
})
export class CommentText {
  readonly text = input.required<string>();
  protected readonly pieces = computed(() => linkPieces(this.text()));
}
