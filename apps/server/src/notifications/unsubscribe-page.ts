import type { Unsubscribed } from './notification-service';

/**
 * The pages an unsubscribe link answers: self-contained (no script, no outside resource; its own
 * Content-Security-Policy), in plain words, with anything stored escaped. Opening the link only asks;
 * the button posts the token back (mail scanners open every link in a message, and must not
 * unsubscribe anyone by doing so).
 */

export const UNSUBSCRIBE_PAGE_CSP = "default-src 'none'; style-src 'unsafe-inline'; base-uri 'none'; form-action 'self'; frame-ancestors 'none'";

/** What the link would stop, with one button that does it. */
export function confirmUnsubscribePage(outcome: Unsubscribed, token: string): string {
  const what =
    outcome.kind === 'newComment'
      ? `Stop the e-mails about new comments on “${escapeHtml(outcome.optionName ?? 'this harvest option')}” (you will no longer follow its discussion)?`
      : outcome.kind === 'optionShared'
        ? 'Stop the e-mails Seinework sends when a harvest option is shared with you?'
        : 'Stop the e-mails Seinework sends when public comment on an option you follow is about to close?';
  const form = `<form method="post" action="/api/notifications/unsubscribe"><input type="hidden" name="token" value="${escapeHtml(token)}"><button type="submit">Stop these e-mails</button></form>`;
  return page('Stop these e-mails?', what, 'Nothing changes until you press the button.', form);
}

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

function page(title: string, said: string, next: string, form = ''): string {
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
button { font: inherit; padding: 0.5rem 1.25rem; border: 0; border-radius: 999px; background: #1f6f68; color: #fff; cursor: pointer; }
button:focus-visible { outline: 3px solid #e0a030; outline-offset: 2px; }
</style>
</head>
<body>
<main>
<h1>${title}</h1>
<p>${said}</p>
<p>${next}</p>
${form}
</main>
</body>
</html>
`;
}

export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}
