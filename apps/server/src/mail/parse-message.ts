/**
 * Just enough of RFC 5322 / MIME (RFC 2045-2047) to read back what the fake SMTP server receives:
 * the To and Subject headers (encoded words decoded) and the plain-text body (7bit, 8bit,
 * quoted-printable or base64, the first text/plain part of a multipart message). Seinework only
 * ever sends plain text; attachments and HTML parts are ignored.
 */

export interface ParsedMessage {
  readonly to: string;
  readonly subject: string;
  readonly text: string;
}

const MAX_MULTIPART_DEPTH = 5;

export function parseMessage(raw: Buffer): ParsedMessage {
  // latin1 maps each byte to one code unit, so the split below is byte-exact whatever the charset.
  const entity = splitEntity(raw.toString('latin1'));
  return {
    to: decodeHeader(entity.headers.get('to') ?? ''),
    subject: decodeHeader(entity.headers.get('subject') ?? ''),
    text: textOf(entity, 0),
  };
}

interface Entity {
  readonly headers: Map<string, string>;
  readonly body: string;
}

function splitEntity(source: string): Entity {
  const match = /\r?\n\r?\n/.exec(source);
  const head = match ? source.slice(0, match.index) : source;
  const body = match ? source.slice(match.index + match[0].length) : '';
  const headers = new Map<string, string>();
  // Unfold: a line starting with white space continues the previous header.
  for (const line of head.replace(/\r?\n(?=[ \t])/g, '').split(/\r?\n/)) {
    const colon = line.indexOf(':');
    if (colon <= 0) continue;
    const name = line.slice(0, colon).trim().toLowerCase();
    // The first occurrence wins: a message has one To and one Subject.
    if (!headers.has(name)) headers.set(name, line.slice(colon + 1).trim());
  }
  return { headers, body };
}

function textOf(entity: Entity, depth: number): string {
  const contentType = parseContentType(entity.headers.get('content-type') ?? 'text/plain');
  if (contentType.type.startsWith('multipart/')) {
    const boundary = contentType.params.get('boundary');
    if (!boundary || depth >= MAX_MULTIPART_DEPTH) return '';
    for (const part of multipartParts(entity.body, boundary)) {
      const partEntity = splitEntity(part);
      const partType = parseContentType(partEntity.headers.get('content-type') ?? 'text/plain').type;
      if (partType === 'text/plain' || partType.startsWith('multipart/')) {
        const text = textOf(partEntity, depth + 1);
        if (text) return text;
      }
    }
    return '';
  }
  if (contentType.type !== 'text/plain') return '';
  // Every line of a message ends with a line break (RFC 5322 §2.1); the last one is not text the sender wrote.
  const body = depth === 0 ? entity.body.replace(/\r?\n$/, '') : entity.body;
  const bytes = decodeTransfer(body, (entity.headers.get('content-transfer-encoding') ?? '7bit').trim().toLowerCase());
  return decodeCharset(bytes, contentType.params.get('charset') ?? 'us-ascii').replace(/\r\n/g, '\n');
}

function parseContentType(value: string): { type: string; params: Map<string, string> } {
  const [type = '', ...rest] = value.split(';');
  const params = new Map<string, string>();
  for (const param of rest) {
    const equals = param.indexOf('=');
    if (equals < 0) continue;
    params.set(param.slice(0, equals).trim().toLowerCase(), param.slice(equals + 1).trim().replace(/^"(.*)"$/, '$1'));
  }
  return { type: type.trim().toLowerCase(), params };
}

function multipartParts(body: string, boundary: string): string[] {
  const delimiter = `--${boundary}`;
  const parts: string[] = [];
  let current: string[] | undefined;
  for (const line of body.split(/\r?\n/)) {
    if (line.trimEnd() === `${delimiter}--`) break;
    if (line.trimEnd() === delimiter) {
      if (current) parts.push(current.join('\r\n'));
      current = [];
    } else if (current) {
      current.push(line);
    }
  }
  if (current) parts.push(current.join('\r\n'));
  return parts;
}

function decodeTransfer(body: string, encoding: string): Buffer {
  if (encoding === 'base64') return Buffer.from(body.replace(/[^A-Za-z0-9+/=]/g, ''), 'base64');
  if (encoding === 'quoted-printable') return decodeQuotedPrintable(body);
  return Buffer.from(body, 'latin1');
}

/** RFC 2045 §6.7: `=XX` is a byte, `=` at the end of a line is a soft line break. */
export function decodeQuotedPrintable(body: string): Buffer {
  const unwrapped = body.replace(/[ \t]+(?=\r?\n)/g, '').replace(/=\r?\n/g, '');
  const bytes: number[] = [];
  for (let index = 0; index < unwrapped.length; index++) {
    const char = unwrapped[index]!;
    const hex = char === '=' ? unwrapped.slice(index + 1, index + 3) : '';
    if (/^[0-9A-Fa-f]{2}$/.test(hex)) {
      bytes.push(Number.parseInt(hex, 16));
      index += 2;
    } else {
      bytes.push(char.charCodeAt(0) & 0xff);
    }
  }
  return Buffer.from(bytes);
}

/** RFC 2047 encoded words (`=?utf-8?Q?...?=`, `=?utf-8?B?...?=`); raw 8-bit headers are read as UTF-8 (RFC 6532). */
export function decodeHeader(value: string): string {
  // Encoded words are ASCII, so reading the raw bytes as UTF-8 first leaves them intact.
  const utf8 = Buffer.from(value, 'latin1').toString('utf8');
  return utf8
    .replace(/(\?=)\s+(?==\?)/g, '$1')
    .replace(/=\?([^?]+)\?([QqBb])\?([^?]*)\?=/g, (_word, charset: string, kind: string, encoded: string) => {
      const bytes = kind.toUpperCase() === 'B' ? Buffer.from(encoded, 'base64') : decodeQuotedPrintable(encoded.replace(/_/g, ' '));
      // RFC 2231 allows a language after the charset (`utf-8*en`).
      return decodeCharset(bytes, charset.replace(/\*.*$/, ''));
    });
}

function decodeCharset(bytes: Buffer, charset: string): string {
  const label = charset.trim().toLowerCase();
  if (label === 'us-ascii' || label === 'ascii') return bytes.toString('utf8');
  try {
    return new TextDecoder(label).decode(bytes);
  } catch {
    return bytes.toString('latin1');
  }
}
