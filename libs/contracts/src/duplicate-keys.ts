/**
 * JSON.parse keeps the last of two equal keys and says nothing, so a web with two "value"s in one
 * flow would be analysed with whichever came last. This scanner finds the first object with a
 * repeated key in text that JSON.parse has already accepted, in one pass (each character read
 * once; only the keys of the objects still open are held), and names it with its JSON path.
 */

interface OpenValue {
  /** Keys seen so far in an object; null for an array. */
  readonly keys: Set<string> | null;
  /** The path part of the member being read: its key, or its index in an array. */
  part: string | number;
}

/** The first duplicate key as a readable problem (`flows[3]: duplicate key "value"`), or null. */
export function findDuplicateKey(text: string): string | null {
  const open: OpenValue[] = [];
  let expectKey = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === 0x22 /* " */) {
      const end = stringEnd(text, i);
      const top = open.at(-1);
      if (expectKey && top?.keys) {
        const raw = text.slice(i + 1, end);
        const key = raw.includes('\\') ? (JSON.parse(text.slice(i, end + 1)) as string) : raw;
        if (top.keys.has(key)) return `${pathOf(open, 1)}duplicate key ${JSON.stringify(key)}`;
        top.keys.add(key);
        top.part = key;
        expectKey = false;
      }
      i = end;
    } else if (c === 0x7b /* { */) {
      open.push({ keys: new Set(), part: '' });
      expectKey = true;
    } else if (c === 0x5b /* [ */) {
      open.push({ keys: null, part: 0 });
    } else if (c === 0x7d /* } */ || c === 0x5d /* ] */) {
      open.pop();
    } else if (c === 0x2c /* , */) {
      const top = open.at(-1);
      if (top?.keys) expectKey = true;
      else if (top) top.part = (top.part as number) + 1;
    }
  }
  return null;
}

/** Index of the closing quote of the string that opens at `start`. */
function stringEnd(text: string, start: number): number {
  let i = start + 1;
  for (;;) {
    const quote = text.indexOf('"', i);
    if (quote < 0) return text.length;
    let backslashes = 0;
    for (let k = quote - 1; text.charCodeAt(k) === 0x5c; k--) backslashes++;
    if (backslashes % 2 === 0) return quote;
    i = quote + 1;
  }
}

/** `flows[3]: ` for the objects open around the duplicate, leaving out the innermost `drop` levels. */
function pathOf(open: readonly OpenValue[], drop: number): string {
  // the outermost value is the document itself: its members start the path
  const parts = open.slice(0, open.length - drop).map((value) => value.part);
  const path = parts.map((part, k) => (typeof part === 'number' ? `[${part}]` : `${k === 0 ? '' : '.'}${part}`)).join('');
  return path ? `${path}: ` : '';
}
