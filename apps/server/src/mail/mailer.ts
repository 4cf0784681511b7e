import { createTransport } from 'nodemailer';
import type { SMTPTransportOptions } from 'nodemailer/lib/smtp-transport';

/**
 * Sends Seinework's e-mail (invitations, password resets) over SMTP with nodemailer.
 *
 * A failed send throws a `MailError` whose message is safe to log and to show an administrator
 * (it names the server, never its credentials). Callers store what the message is about (the
 * invitation, the reset token) BEFORE sending, so a mail server that is down loses nothing: the
 * administrator sees the send failed and can invite the same address again.
 */

export interface OutgoingMessage {
  readonly to: string;
  readonly subject: string;
  readonly text: string;
}

export interface Mailer {
  send(message: OutgoingMessage): Promise<void>;
  /** Where the mail goes, for the start-up line (`smtp://127.0.0.1:2525`, no credentials). */
  readonly destination: string;
  close(): void;
}

export class MailError extends Error {}

export interface MailerOptions {
  /** The From header; a real server usually insists it is one of its own addresses. */
  readonly from?: string;
}

export const DEFAULT_FROM = 'Seinework <no-reply@seinework.localhost>';

// A request that sends mail waits for it: fail within seconds rather than hang the request.
const TIMEOUT_MS = 10_000;

/**
 * `smtpUrl` is `smtp://[user:password@]host[:port]` (STARTTLS when the server offers it, required
 * unless the server is on this machine) or `smtps://…` (TLS from the first byte). Append
 * `?requireTLS=false` to talk in clear to a relay on a trusted network that has no TLS at all.
 */
export function createMailer(smtpUrl: string, options: MailerOptions = {}): Mailer {
  const transportOptions = transportOptionsOf(smtpUrl);
  const transport = createTransport(transportOptions, { from: options.from ?? DEFAULT_FROM });
  const destination = `${transportOptions.secure ? 'smtps' : 'smtp'}://${transportOptions.host}:${transportOptions.port}`;
  return {
    destination,
    async send(message) {
      try {
        await transport.sendMail({ to: message.to, subject: message.subject, text: message.text });
      } catch (error) {
        throw new MailError(`The mail server at ${destination} did not take the message: ${reasonOf(error)}`);
      }
    },
    close() {
      transport.close();
    },
  };
}

export function transportOptionsOf(smtpUrl: string): SMTPTransportOptions {
  let url: URL;
  try {
    url = new URL(smtpUrl);
  } catch {
    throw new MailError('SMTP_URL is not a URL: expected smtp://host:port or smtps://host:port');
  }
  if (url.protocol !== 'smtp:' && url.protocol !== 'smtps:') {
    throw new MailError(`SMTP_URL must start with smtp:// or smtps://, not ${url.protocol}//`);
  }
  const secure = url.protocol === 'smtps:';
  const host = url.hostname.replace(/^\[|\]$/g, '');
  if (!host) throw new MailError('SMTP_URL names no host');
  // Traffic to this machine never crosses a network, and the demo's fake server offers no TLS.
  const local = isLoopback(host);
  const requireTLS = !secure && !local && url.searchParams.get('requireTLS') !== 'false';
  return {
    host,
    port: url.port ? Number(url.port) : secure ? 465 : 587,
    secure,
    ignoreTLS: !secure && local,
    requireTLS,
    auth: url.username ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } : undefined,
    connectionTimeout: TIMEOUT_MS,
    greetingTimeout: TIMEOUT_MS,
    socketTimeout: TIMEOUT_MS,
  };
}

function isLoopback(host: string): boolean {
  return host === 'localhost' || host === '::1' || /^127\.\d+\.\d+\.\d+$/.test(host);
}

function reasonOf(error: unknown): string {
  if (error instanceof Error) {
    const code = (error as { code?: unknown }).code;
    return typeof code === 'string' ? `${code}: ${error.message}` : error.message;
  }
  return String(error);
}
