import { readFileSync } from 'node:fs';
import { findDuplicateKey } from '@seinework/contracts';
import { WebError } from '@seinework/network-analysis';

/**
 * What every command-line entry point shares (METHODS.md §11): read JSON files, print exactly one
 * JSON document on success, and on bad input print one line on stderr and exit with code 2 —
 * never a stack trace, never anything on stdout. A line lists at most the first 20 problems and
 * counts the rest (WebError's message); output piped into a reader that stops early (`| head`) ends quietly.
 */

// the reader went away (EPIPE): there is nobody left to tell anything to
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code !== 'EPIPE') throw error;
    process.exit(process.exitCode ?? 0);
  });
}

export class InputError extends Error {}

export function readJsonFile(path: string | undefined, what: string): unknown {
  if (!path) throw new InputError(`missing ${what} file argument`);
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    throw new InputError(code === 'ENOENT' ? `${what} file not found: ${path}` : `cannot read ${what} file ${path} (${code ?? 'error'})`);
  }
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    throw new InputError(`${what} file ${path} is not valid JSON: ${(error as Error).message}`);
  }
  // JSON.parse keeps the last of two equal keys without a word: refuse them instead
  const duplicate = findDuplicateKey(text);
  if (duplicate) throw new InputError(`${what} file ${path}: ${duplicate}`);
  return value;
}

/** Runs a command body; known input errors exit 2 with one line, anything else exits 1 with one line. */
export async function runCommand(name: string, body: () => unknown | Promise<unknown>): Promise<void> {
  try {
    const result = await body();
    process.stdout.write(`${JSON.stringify(result)}\n`);
  } catch (error) {
    if (error instanceof InputError || error instanceof WebError) {
      // METHODS.md §0: an unbalanced web comes with the offer to balance it (§7)
      const offer = error instanceof WebError && error.kind === 'unbalanced' ? ' — balance it with: npm run --silent balance -- WEB.json [least-change|input|output|average]' : '';
      process.stderr.write(`${name}: ${oneLine(error.message)}${offer}\n`);
      process.exitCode = 2;
    } else {
      process.stderr.write(`${name}: internal error: ${oneLine(error instanceof Error ? error.message : String(error))}\n`);
      process.exitCode = 1;
    }
  }
}

function oneLine(message: string): string {
  return message.replace(/\s*\n\s*/g, '; ');
}
