/**
 * Audit events as the server records them (`auth.signed-in`, `user:<uuid>`) in words for the table:
 * the code stays available (title, monospace) for whoever needs to trace it.
 */

/** `auth.sign-in-failed` → "Sign in failed"; `web.version-published` → "Web: version published". */
export function actionInWords(action: string): string {
  const [area, ...rest] = action.split('.');
  const what = rest.join(' ').replace(/[-_]/g, ' ').trim();
  if (!what) return sentence(area.replace(/[-_]/g, ' '));
  // sign-in events speak for themselves; other areas name what was changed
  return area === 'auth' ? sentence(what) : `${sentence(area)}: ${what}`;
}

/** `user:2cbcece5-f456-…` → kind "user" and the id's first block, enough to tell rows apart. */
export function subjectInWords(subject: string): { kind: string; id: string } {
  const colon = subject.indexOf(':');
  if (colon < 0) return { kind: subject, id: '' };
  const id = subject.slice(colon + 1);
  return { kind: subject.slice(0, colon), id: id.split('-')[0] ?? id };
}

function sentence(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
