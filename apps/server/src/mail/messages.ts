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

/** UTC, spelled out, so the reader's time zone cannot make it ambiguous. */
function formatInstant(instant: Date): string {
  return `${instant.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

function trimSlash(origin: string): string {
  return origin.replace(/\/+$/, '');
}
