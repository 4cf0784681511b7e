import type { Role } from '@seinework/contracts';
import type { OutgoingMessage } from './mailer';

/** The words of Seinework's e-mail: plain text, one link each, what happens next and when it expires. */

const ROLE_WORDS: Readonly<Record<Role, string>> = {
  admin: 'an administrator (you will manage people, roles and invitations)',
  analyst: 'an analyst (you will bring in webs, edit and publish versions, and build harvest options)',
  council: 'a council member (you will read and compare what is shared for council review)',
  stakeholder: 'a stakeholder (you will read and comment on options opened for public comment)',
  staff: 'a member of staff (you will read what is shared and prepare briefs)',
};

export interface InvitationMessageInput {
  readonly to: string;
  readonly role: Role;
  readonly invitedBy: string;
  readonly token: string;
  readonly publicOrigin: string;
  readonly expiresAt: Date;
}

export function invitationMessage(input: InvitationMessageInput): OutgoingMessage {
  const link = `${trimSlash(input.publicOrigin)}/invitation/${encodeURIComponent(input.token)}`;
  return {
    to: input.to,
    subject: 'You are invited to Seinework',
    text: [
      'Hello,',
      '',
      `${input.invitedBy} has invited you to Seinework, where your council's food webs and harvest options are kept, as ${ROLE_WORDS[input.role]}.`,
      '',
      'To accept, open this link, choose the name others will see and a password:',
      '',
      link,
      '',
      `The link works once and until ${formatInstant(input.expiresAt)}. If it has expired, ask ${input.invitedBy} to invite you again.`,
      '',
      'If you did not expect this invitation, you can ignore this message: no account is made until the link is used.',
      '',
      '— Seinework',
    ].join('\n'),
  };
}

export interface PasswordResetMessageInput {
  readonly to: string;
  readonly name: string;
  readonly token: string;
  readonly publicOrigin: string;
  readonly expiresAt: Date;
}

export function passwordResetMessage(input: PasswordResetMessageInput): OutgoingMessage {
  const link = `${trimSlash(input.publicOrigin)}/reset-password/${encodeURIComponent(input.token)}`;
  return {
    to: input.to,
    subject: 'Choose a new Seinework password',
    text: [
      `Hello ${input.name},`,
      '',
      'Someone (we hope you) asked to choose a new password for your Seinework account. Open this link to set one:',
      '',
      link,
      '',
      `The link works once and until ${formatInstant(input.expiresAt)}. Setting a new password signs you out everywhere else.`,
      '',
      'If you did not ask for this, ignore this message: your password stays as it is.',
      '',
      '— Seinework',
    ].join('\n'),
  };
}

/** What every notice carries: where to read, and the one-click way to stop this kind of notice. */
export interface NoticeInput {
  readonly to: string;
  readonly name: string;
  readonly publicOrigin: string;
  readonly optionId: string;
  readonly optionName: string;
  /** The token of the unsubscribe link (`GET /api/notifications/unsubscribe?token=…`). */
  readonly unsubscribeToken: string;
}

export function discussionLink(publicOrigin: string, optionId: string): string {
  return `${trimSlash(publicOrigin)}/options/${encodeURIComponent(optionId)}/discussion`;
}

export function unsubscribeLink(publicOrigin: string, token: string): string {
  return `${trimSlash(publicOrigin)}/api/notifications/unsubscribe?token=${encodeURIComponent(token)}`;
}

function noticeFooter(input: NoticeInput, what: string): string[] {
  return ['', `To stop ${what}, open this link (no need to sign in):`, '', unsubscribeLink(input.publicOrigin, input.unsubscribeToken), '', 'You can turn every kind of notice on or off again in Seinework, under your account.', '', '— Seinework'];
}

export interface OptionSharedMessageInput extends NoticeInput {
  readonly audience: 'council' | 'public';
  readonly sharedBy: string;
  readonly closesAt: Date | null;
}

export function optionSharedMessage(input: OptionSharedMessageInput): OutgoingMessage {
  const forWhat = input.audience === 'public' ? 'for public comment' : 'for council review';
  return {
    to: input.to,
    subject: input.audience === 'public' ? `Open for public comment: ${oneLine(input.optionName)}` : `Shared for council review: ${oneLine(input.optionName)}`,
    text: [
      `Hello ${oneLine(input.name)},`,
      '',
      `${oneLine(input.sharedBy)} has shared the harvest option "${oneLine(input.optionName)}" ${forWhat}.`,
      input.closesAt ? `Comments close at ${formatInstant(input.closesAt)}.` : 'There is no closing date yet.',
      '',
      'Read it and its discussion here (sign in first):',
      '',
      discussionLink(input.publicOrigin, input.optionId),
      ...noticeFooter(input, 'e-mail when an option is shared with you'),
    ].join('\n'),
  };
}

export interface NewCommentMessageInput extends NoticeInput {
  readonly author: string;
  readonly excerpt: string;
}

export const NEW_COMMENT_SUBJECT = 'A new comment on an option you follow';

export function newCommentMessage(input: NewCommentMessageInput): OutgoingMessage {
  return {
    to: input.to,
    subject: NEW_COMMENT_SUBJECT,
    text: [
      `Hello ${oneLine(input.name)},`,
      '',
      `${oneLine(input.author)} commented on the harvest option "${oneLine(input.optionName)}", whose discussion you follow:`,
      '',
      ...input.excerpt.split('\n').map((line) => `> ${line}`),
      '',
      'Read the whole discussion and answer here (sign in first):',
      '',
      discussionLink(input.publicOrigin, input.optionId),
      ...noticeFooter(input, `following the discussion of "${oneLine(input.optionName)}"`),
    ].join('\n'),
  };
}

export interface ClosingSoonMessageInput extends NoticeInput {
  readonly closesAt: Date;
}

export function closingSoonMessage(input: ClosingSoonMessageInput): OutgoingMessage {
  return {
    to: input.to,
    subject: `Public comment closes soon: ${oneLine(input.optionName)}`,
    text: [
      `Hello ${oneLine(input.name)},`,
      '',
      `Public comment on the harvest option "${oneLine(input.optionName)}" closes at ${formatInstant(input.closesAt)}. After that the discussion can still be read, but no longer added to.`,
      '',
      discussionLink(input.publicOrigin, input.optionId),
      ...noticeFooter(input, 'e-mail when public comment is about to close'),
    ].join('\n'),
  };
}

/** Names and subjects on one line: a line break in an option's name must not shape the message. */
function oneLine(text: string): string {
  return text.replace(/[\r\n]+/g, ' ');
}

/** UTC, spelled out, so the reader's time zone cannot make it ambiguous. */
export function formatInstant(instant: Date): string {
  return `${instant.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

function trimSlash(origin: string): string {
  return origin.replace(/\/+$/, '');
}
