import { SMTPServer } from 'smtp-server';
import { parseMessage, type ParsedMessage } from './parse-message';

/**
 * The demo's and the tests' mail server: a real SMTP server (the `smtp-server` package) on
 * 127.0.0.1 only, on a port the system picks, that accepts every message without authentication
 * and hands it to `store` (the database outbox) instead of delivering it. Nothing leaves the machine.
 */

export interface FakeSmtpOptions {
  /** Keeps one received message; a failure is answered 451 so the sender knows it was not kept. */
  readonly store: (message: ParsedMessage) => Promise<void>;
  /** Larger messages are refused with 552; Seinework's own messages are a few kilobytes. */
  readonly maxBytes?: number;
  /** Where a failure to keep a message is reported (the server's log by default). */
  readonly logStoreFailure?: (error: unknown) => void;
}

export interface FakeSmtp {
  /** `smtp://127.0.0.1:<port>`, for `createMailer`. */
  readonly url: string;
  readonly port: number;
  close(): Promise<void>;
}

export const DEFAULT_MAX_BYTES = 256 * 1024;

export async function startFakeSmtp(options: FakeSmtpOptions): Promise<FakeSmtp> {
  const maxBytes = options.maxBytes ?? DEFAULT_MAX_BYTES;
  const server = new SMTPServer({
    secure: false,
    authOptional: true,
    // No TLS certificate to offer and no accounts to check: plain SMTP on loopback.
    disabledCommands: ['AUTH', 'STARTTLS'],
    size: maxBytes,
    logger: false,
    banner: 'Seinework local outbox (messages are kept, never delivered)',
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      let length = 0;
      stream.on('data', (chunk: Buffer) => {
        length += chunk.length;
        // Past the limit, keep draining the stream without holding on to what arrives.
        if (length <= maxBytes) chunks.push(chunk);
      });
      stream.on('error', (error) => callback(error));
      stream.on('end', () => {
        if (stream.sizeExceeded || length > maxBytes) {
          callback(smtpError(552, `Message is larger than ${maxBytes} bytes`));
          return;
        }
        const parsed = parseMessage(Buffer.concat(chunks));
        const envelopeTo = session.envelope.rcptTo.map((recipient) => recipient.address).join(', ');
        options.store({ ...parsed, to: parsed.to || envelopeTo }).then(
          () => callback(),
          (error: unknown) => {
            (options.logStoreFailure ?? ((failure) => console.error('The local outbox could not keep a message:', failure)))(error);
            callback(smtpError(451, 'The message could not be kept; try again later'));
          },
        );
      });
    },
  });
  // A client that drops its connection mid-talk is its own problem, not a reason to stop Seinework
  // (an 'error' event without a listener would end the process).
  server.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code !== 'ECONNRESET') console.error('The local SMTP server met an error:', error.message);
  });
  await new Promise<void>((resolve, reject) => {
    server.server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      server.server.off('error', reject);
      resolve();
    });
  });
  const address = server.server.address();
  if (address === null || typeof address === 'string') throw new Error('The fake SMTP server has no TCP port');
  return {
    url: `smtp://127.0.0.1:${address.port}`,
    port: address.port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

function smtpError(responseCode: number, message: string): Error {
  return Object.assign(new Error(message), { responseCode });
}

