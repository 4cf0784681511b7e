import fc from 'fast-check';
import MailComposer from 'nodemailer/lib/mail-composer';
import { decodeHeader, decodeQuotedPrintable, parseMessage } from './parse-message';

/** Messages composed by nodemailer itself (the sender Seinework uses) must read back exactly. */

function compose(fields: { to: string; subject: string; text: string; html?: string }): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    new MailComposer({ from: 'seinework@example.test', ...fields }).compile().build((error, message) => (error ? reject(error) : resolve(message)));
  });
}

// Printable text of any script, with spaces, tabs, '=' and '?' that encoders must escape.
const line = fc.string({ unit: fc.oneof(fc.constantFrom(' ', '\t', '=', '?', '_', '.', 'é', '—', 'ß', '水', '🐟'), fc.string({ unit: 'grapheme', minLength: 1, maxLength: 1 })), maxLength: 120 }).map((value) => value.replace(/[\u0000-\u001f\u007f-\u009f\u2028\u2029]/g, 'x'));
// A text that itself ends with a line break cannot be told from one that does not (the message's
// last line break is not text); Seinework's messages end with their signature.
const text = fc.array(line, { minLength: 1, maxLength: 8 }).map((lines) => lines.join('\n')).filter((value) => !value.endsWith('\n'));
const subject = line.map((value) => value.replace(/\s+/g, ' ').trim()).filter((value) => value.length > 0);
const address = fc.emailAddress();

describe('parseMessage', () => {
  it('reads back To, Subject and the text of a plain-text message', async () => {
    await fc.assert(
      fc.asyncProperty(address, subject, text, async (to, subjectValue, textValue) => {
        const parsed = parseMessage(await compose({ to, subject: subjectValue, text: textValue }));
        expect(parsed).toEqual({ to, subject: subjectValue, text: textValue });
      }),
      { numRuns: 150 },
    );
  });

  it('takes the text/plain part of a multipart/alternative message', async () => {
    await fc.assert(
      fc.asyncProperty(address, subject, text, async (to, subjectValue, textValue) => {
        const parsed = parseMessage(await compose({ to, subject: subjectValue, text: textValue, html: '<p>not this</p>' }));
        expect(parsed.text).toBe(textValue);
      }),
      { numRuns: 50 },
    );
  });

  it('reads base64 bodies, raw UTF-8 headers and folded headers', () => {
    const raw = Buffer.from(
      ['To: Zoë <zoe@example.test>', 'Subject: a folded', ' subject', 'Content-Type: text/plain; charset="utf-8"', 'Content-Transfer-Encoding: base64', '', Buffer.from('Grüße\r\nzwei').toString('base64')].join('\r\n'),
      'utf8',
    );
    expect(parseMessage(raw)).toEqual({ to: 'Zoë <zoe@example.test>', subject: 'a folded subject', text: 'Grüße\nzwei' });
  });

  it('gives an empty text for a message with no plain-text part rather than guessing', () => {
    const raw = Buffer.from('To: a@example.test\r\nSubject: s\r\nContent-Type: text/html\r\n\r\n<p>hi</p>');
    expect(parseMessage(raw)).toEqual({ to: 'a@example.test', subject: 's', text: '' });
  });

  it('decodes quoted-printable soft breaks and escapes, and encoded words in other charsets', () => {
    expect(decodeQuotedPrintable('a=3Db=\r\nc =C3=A9').toString('utf8')).toBe('a=bc é');
    expect(decodeHeader('=?iso-8859-1?Q?caf=E9?= =?utf-8?B?4oCU?= ok')).toBe('café— ok');
  });
});
