import type { Unsubscribed } from './notification-service';

/**
 * The page an unsubscribe link answers: self-contained (no script, no outside resource; its own
 * Content-Security-Policy), in plain words, with anything stored escaped.
 */

export const UNSUBSCRIBE_PAGE_CSP = "default-src 'none'; style-src 'unsafe-inline'; base-uri 'none'; form-action 'none'; frame-ancestors 'none'";

export function unsubscribedPage(outcome: Unsubscribed): string {
  const said =
    outcome.kind === 'newComment'
      ? `You no longer follow the discussion of “${escapeHtml(outcome.optionName ?? 'this harvest option')}”: Seinework will not e-mail you about its new comments.`
      : outcome.kind === 'optionShared'
        ? 'Seinework will no longer e-mail you when a harvest option is shared with you.'
        : 'Seinework will no longer e-mail you when public comment on an option you follow is about to close.';
  const next =
    outcome.kind === 'newComment'
      ? 'To follow it again, open its discussion in Seinework and choose “Follow by e-mail”.'
      : 'You can turn notices on again in Seinework, under your account.';
  return page('You are unsubscribed', said, next);
}

export function unknownLinkPage(): string {
  return page('This link is not known', 'This unsubscribe link is not one Seinework sent, or it was copied incompletely.', 'You can turn notices on or off in Seinework, under your account.');
}

function page(title: string, said: string, next: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex">
<title>${title} — Seinework</title>
<style>
body { font: 16px/1.5 system-ui, sans-serif; margin: 0; background: #f4f7f6; color: #1d2b2a; }
main { max-width: 34rem; margin: 4rem auto; padding: 2rem; background: #fff; border-radius: 8px; border-top: 6px solid #1f6f68; }
h1 { font-size: 1.4rem; margin-top: 0; }
</style>
</head>
<body>
<main>
<h1>${title}</h1>
<p>${said}</p>
<p>${next}</p>
</main>
</body>
</html>
`;
}

export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}
