/// <reference lib="dom" />
import type { APIRequestContext, Page } from '@playwright/test';
import type { OutboxMessage, Page as Paged } from '@seinework/contracts';
import { demoEmail, expect, shot, signIn, signOut, test } from './support/fixtures';
import { asAdmin } from './support/outbox';

/**
 * Workflow 6 of PRODUCT.md in the browser: the demo analyst opens an option for public comment
 * from its share panel and follows its discussion; the demo stakeholder finds it on their welcome
 * page and comments on an indicator; the analyst's e-mail notice arrives (read back from the fake
 * SMTP outbox) and its links work; staff hide the comment with a reason, which its author and
 * staff still see, marked, and everyone else sees only a placeholder.
 *
 * The option is the seeded mid-water predator quota rise, shared for council review only: the
 * spec adds a public share and withdraws it again at the end, so the council still sees the same
 * three options and stakeholders only the forage-fish cut, as the other specs expect.
 */

const DEMO_WEB = 'Brannock Bay baseline (invented demo data)';
const OPTION = 'Raise the mid-water predator quota by 25 %';
const COMMENT = 'Our longliners land most of the mid-water predator. If its quota rises by a quarter, what happens to the total catch of the other fleets in the bay? (e2e)';
const REASON = 'Hidden in the end-to-end test: a moderator can hide any comment, with a reason.';
const STAKEHOLDER = 'Sten Demo (stakeholder)';
const NOTICE_SUBJECT = 'A new comment on an option you follow';
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

function escaped(text: string): RegExp {
  return new RegExp(text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&'));
}

/** The e-mailed notice of the new comment to an address, once the mail queue has sent it through SMTP. */
async function noticeTo(admin: APIRequestContext, to: string, quote: string): Promise<OutboxMessage> {
  let found: OutboxMessage | undefined;
  await expect
    .poll(
      async () => {
        const response = await admin.get('/api/admin/outbox', { params: { page: 1, pageSize: 50 } });
        expect(response.ok()).toBe(true);
        const outbox = (await response.json()) as Paged<OutboxMessage>;
        found = outbox.items.find((m) => m.to.toLowerCase().includes(to) && m.subject === NOTICE_SUBJECT && m.text.includes(quote));
        return found !== undefined;
      },
      { message: `a new-comment notice to ${to} in the outbox`, timeout: 20_000, intervals: [250, 500, 1000] },
    )
    .toBe(true);
  return found!;
}

/** The discussion card of the option on /discussions or /welcome: the public one, when there are two. */
function publicCard(page: Page) {
  return page.getByRole('link', { name: escaped(OPTION) }).filter({ hasText: 'Public comment' });
}

test('an option opened for public comment: comment on an indicator, the follower is told, staff hide it', async ({ page, request }) => {
  test.setTimeout(180_000);

  // 1. the analyst opens the option for public comment from its share panel
  await signIn(page, 'analyst');
  await page.getByRole('link', { name: DEMO_WEB }).click();
  await page.getByRole('list', { name: 'Harvest options' }).getByRole('link', { name: OPTION, exact: true }).click();
  await expect(page.getByRole('heading', { level: 1, name: OPTION, exact: true })).toBeVisible();
  const optionId = /\/options\/([0-9a-f-]+)$/.exec(page.url())![1]!;
  // the seed queues the option's run as the server starts
  await expect(page.getByRole('table', { name: 'Runs' }).getByRole('row').nth(1)).toContainText('Done', { timeout: 60_000 });
  const shares = page.getByRole('list', { name: 'Active shares' });
  await expect(shares).toContainText('Shared for council review by Ana Demo (analyst)');
  await expect(shares).not.toContainText('Open for public comment');

  const closes = new Date(Date.now() + 5 * 24 * 3600 * 1000);
  const closesOn = closes.toISOString().slice(0, 10);
  const closesWords = `${closes.getUTCDate()} ${MONTHS[closes.getUTCMonth()]} ${closes.getUTCFullYear()}`;
  await page.getByLabel('Comments close on (optional)').fill(closesOn);
  // the date in words under the field, whatever order the browser writes it in
  const inWords = (options: Intl.DateTimeFormatOptions) => closes.toLocaleDateString('en-GB', { ...options, timeZone: 'UTC' });
  await expect(page.getByText(`At the end of ${inWords({ weekday: 'long' })} ${closes.getUTCDate()} ${inWords({ month: 'long' })} ${closes.getUTCFullYear()} (23:59 UTC)`)).toBeVisible();
  await shot(page, 'public-comment-option-share-panel');
  await page.getByRole('button', { name: 'Open for public comment' }).click();
  const publicShare = shares.getByRole('listitem').filter({ hasText: 'Open for public comment' });
  await expect(publicShare).toContainText('Open for public comment by Ana Demo (analyst)');
  await expect(publicShare).toContainText(`comments close ${closesWords}`);
  await expect(page.getByRole('button', { name: 'Open for public comment' })).toBeDisabled();
  await shot(page, 'public-comment-option-opened');

  // the analyst follows the public discussion: from the option page's Discussion link, on to the list through the toolbar
  await expect(page.getByRole('navigation', { name: 'About this option' }).getByRole('link', { name: 'Discussion' })).toHaveAttribute('href', `/discussions/${optionId}`);
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Discussions' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Discussions' })).toBeVisible();
  await expect(publicCard(page)).toContainText(`Open until ${closesWords}`);
  await shot(page, 'public-comment-discussions-analyst');
  await publicCard(page).click();
  await expect(page).toHaveURL(new RegExp(`/discussions/${optionId}$`));
  await expect(page.getByRole('heading', { level: 1, name: `Discussion: ${OPTION}`, exact: true })).toBeVisible();
  const state = page.getByRole('region', { name: 'State of the discussion' });
  await expect(state).toContainText(`Open for public comment until ${closes.getUTCDate()} ${closes.toLocaleString('en-GB', { month: 'long', timeZone: 'UTC' })} ${closes.getUTCFullYear()}, 23:59 UTC.`);
  // the analyst reads both discussions of the option on this page, so it says which one theirs join
  await expect(state).toContainText('This option also has a council review discussion');
  await state.getByRole('button', { name: 'Follow by e-mail' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'You will get an e-mail for each new comment.' })).toBeVisible();
  await expect(state.getByRole('button', { name: 'Stop following' })).toBeVisible();
  await shot(page, 'public-comment-discussion-analyst-following');
  await signOut(page);

  // 2. the stakeholder finds it on their welcome page and comments on an indicator
  await signIn(page, 'stakeholder');
  await expect(page.getByRole('heading', { level: 2, name: 'Open for comment' })).toBeVisible();
  await expect(publicCard(page)).toContainText(`Open until ${closesWords}`);
  await shot(page, 'public-comment-welcome-stakeholder');
  await publicCard(page).click();
  await expect(page.getByRole('heading', { level: 1, name: `Discussion: ${OPTION}`, exact: true })).toBeVisible();
  await expect(page.getByText('No comments yet. Be the first to comment.')).toBeVisible();
  await expect(page.getByRole('region', { name: 'State of the discussion' })).not.toContainText('council review');
  await shot(page, 'public-comment-discussion-stakeholder');
  // the option's own page reads for a stakeholder too: its inputs and the run the share shows, and no way to the webs they are refused
  await expect(page.getByRole('link', { name: 'Read the result' })).toBeVisible();
  await page.getByRole('link', { name: "The option's inputs" }).click();
  await expect(page.getByRole('heading', { level: 1, name: OPTION, exact: true })).toBeVisible();
  const crumbs = page.getByRole('navigation', { name: 'Where you are' });
  await expect(crumbs.getByRole('link', { name: 'Discussions' })).toBeVisible();
  await expect(crumbs.getByRole('link', { name: 'Webs' })).toHaveCount(0);
  // once the baseline is read (its name in words), no refusal is shown: the runs list a stakeholder may not ask for is not asked
  await expect(page.locator('p.baseline')).toContainText(/Stands on\s+version \d+ of /);
  await expect(page.getByRole('alert')).toHaveCount(0);
  await shot(page, 'public-comment-option-stakeholder');
  await page.goBack();
  await expect(page.getByRole('heading', { level: 1, name: `Discussion: ${OPTION}`, exact: true })).toBeVisible();

  await page.getByLabel('Your comment').fill(COMMENT);
  await page.getByRole('combobox', { name: 'About (optional)' }).click();
  await page.getByRole('option', { name: 'Total catch', exact: true }).click();
  await expect(page.getByRole('combobox', { name: 'About (optional)' })).toContainText('Total catch');
  await expect(page.getByRole('listbox')).toHaveCount(0);
  await shot(page, 'public-comment-form-filled');
  await page.getByRole('button', { name: 'Post comment' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Your comment was posted.' })).toBeVisible();
  const mine = page.getByRole('article', { name: `Comment by ${STAKEHOLDER}` });
  await expect(mine).toContainText(COMMENT);
  const about = mine.getByRole('link', { name: 'Total catch' });
  await expect(about).toHaveAttribute('href', /^\/runs\/[0-9a-f-]+#indicator-totalCatch$/);
  await expect(page.getByRole('heading', { level: 2, name: 'Comments (1)' })).toBeVisible();
  // posting follows the discussion
  await expect(page.getByRole('button', { name: 'Stop following' })).toBeVisible();
  await shot(page, 'public-comment-posted');

  // the anchor opens the indicator on the result page the public share shows
  await about.click();
  await expect(page).toHaveURL(/\/runs\/[0-9a-f-]+#indicator-totalCatch$/);
  await expect(page.getByRole('heading', { level: 1 })).toContainText(OPTION);
  // brought into view, with the comment counted beside it
  await expect(page.locator('#indicator-totalCatch')).toBeInViewport();
  await expect(page.locator('#indicator-totalCatch sw-comment-badge button')).toHaveAccessibleName('1 comment on this: show them');
  await expect(page.locator('#comments-indicator-totalCatch')).toContainText(COMMENT);
  await shot(page, 'public-comment-result-stakeholder');

  // 3. the analyst, who follows, is e-mailed; the stakeholder, who wrote it, is not
  const admin = await asAdmin(request);
  const notice = await noticeTo(admin, demoEmail('analyst'), COMMENT.slice(0, 60));
  expect(notice.to).toContain(demoEmail('analyst'));
  expect(notice.text).toContain(`${STAKEHOLDER} commented on the harvest option "${OPTION}"`);
  const discussionLink = new RegExp(`https?://[^\\s]+/options/${optionId}/discussion`).exec(notice.text)?.[0];
  const unsubscribeLink = /https?:\/\/[^\s]+\/api\/notifications\/unsubscribe\?token=[A-Za-z0-9_%-]+/.exec(notice.text)?.[0];
  expect(discussionLink, 'the notice links to the discussion').toBeTruthy();
  expect(unsubscribeLink, 'the notice has an unsubscribe link').toBeTruthy();
  const outbox = (await (await admin.get('/api/admin/outbox', { params: { page: 1, pageSize: 50 } })).json()) as Paged<OutboxMessage>;
  expect(outbox.items.filter((m) => m.to.includes(demoEmail('stakeholder')) && m.text.includes(COMMENT.slice(0, 60)))).toHaveLength(0);
  await signOut(page);

  // 4. staff hide the comment with a reason; they still read it, marked with the reason
  await signIn(page, 'staff');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Discussions' }).click();
  await publicCard(page).click();
  await expect(page.getByRole('heading', { level: 1, name: `Discussion: ${OPTION}`, exact: true })).toBeVisible();
  await shot(page, 'public-comment-discussion-staff');
  await mine.getByRole('button', { name: 'Hide' }).click();
  const dialog = page.getByRole('dialog', { name: 'Hide this comment' });
  await expect(dialog.getByRole('button', { name: 'Hide comment' })).toBeDisabled();
  await dialog.getByLabel('Reason for hiding').fill(REASON);
  await shot(page, 'public-comment-hide-dialog');
  await dialog.getByRole('button', { name: 'Hide comment' }).click();
  await expect(dialog).toHaveCount(0);
  await expect(page.getByRole('status').filter({ hasText: 'The comment is hidden' })).toBeVisible();
  await expect(mine.getByRole('note')).toContainText('Hidden by staff: only its author and staff see it.');
  await expect(mine.getByRole('note')).toContainText(`Reason: ${REASON}`);
  await expect(mine).toContainText(COMMENT);
  await expect(mine.getByRole('button', { name: 'Hide' })).toHaveCount(0);
  // staff read both discussions of the option: each comment says which it belongs to
  await expect(mine).toContainText('Public comment');
  await shot(page, 'public-comment-hidden-staff');
  await signOut(page);

  // its author still reads it, marked, with the reason
  await signIn(page, 'stakeholder');
  await publicCard(page).click();
  await expect(mine.getByRole('note')).toContainText('Hidden by staff: only its author and staff see it.');
  await expect(mine.getByRole('note')).toContainText(`Reason: ${REASON}`);
  await expect(mine).toContainText(COMMENT);
  await shot(page, 'public-comment-hidden-author');
  await signOut(page);

  // 5. the analyst follows the e-mailed link: a placeholder, without the text or what it was about
  await signIn(page, 'analyst');
  await page.goto(new URL(discussionLink!).pathname);
  await expect(page).toHaveURL(new RegExp(`/discussions/${optionId}$`));
  await expect(mine.getByRole('note')).toHaveText(/This comment was hidden by staff\./);
  await expect(mine).not.toContainText(COMMENT);
  await expect(mine).not.toContainText(REASON);
  await expect(mine.getByRole('link', { name: 'Total catch' })).toHaveCount(0);
  await shot(page, 'public-comment-hidden-others');

  // the unsubscribe link works without signing in, and stops the analyst following the option
  const unsubscribe = new URL(unsubscribeLink!);
  await page.goto(`${unsubscribe.pathname}${unsubscribe.search}`);
  // opening the link only asks (mail scanners open every link); the button does it
  await expect(page.getByRole('heading', { level: 1, name: 'Stop these e-mails?' })).toBeVisible();
  await expect(page.locator('body')).toContainText(`Stop the e-mails about new comments on “${OPTION}”`);
  await shot(page, 'public-comment-unsubscribe-asked');
  await page.getByRole('button', { name: 'Stop these e-mails' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'You are unsubscribed' })).toBeVisible();
  await expect(page.locator('body')).toContainText(`You no longer follow the discussion of “${OPTION}”`);
  await expect(page.locator('body')).toContainText('To follow it again, open its discussion in Seinework');
  await shot(page, 'public-comment-unsubscribed');
  await page.goto(`/discussions/${optionId}`);
  await expect(page.getByRole('region', { name: 'State of the discussion' }).getByRole('button', { name: 'Follow by e-mail' })).toBeVisible();

  // put things back: withdraw the public share, so the option is shared for council review only again
  await page.goto(`/options/${optionId}`);
  await publicShare.getByRole('button', { name: 'Withdraw' }).click();
  await expect(shares.getByRole('listitem')).toHaveCount(1);
  await expect(shares).toContainText('Shared for council review');
  await expect(page.getByRole('button', { name: 'Open for public comment' })).toBeEnabled();
  await shot(page, 'public-comment-withdrawn');
});
