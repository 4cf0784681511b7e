import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';

/** Runs one of the project's command-line tools as a user would, with tsx, and captures everything. */
export const repositoryRoot = resolve(import.meta.dirname, '../..');

export interface CommandResult {
  readonly status: number | null;
  readonly stdout: string;
  readonly stderr: string;
}

export function runTool(tool: string, args: readonly string[]): CommandResult {
  const result = spawnSync(join(repositoryRoot, 'node_modules/.bin/tsx'), [join(repositoryRoot, 'tools', tool), ...args], {
    cwd: repositoryRoot,
    encoding: 'utf8',
    timeout: 120_000,
  });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

/** Writes text (or a value as JSON) to a fresh temporary file and returns its path. */
export function temporaryFile(name: string, content: unknown): string {
  const path = join(mkdtempSync(join(tmpdir(), 'seinework-')), name);
  writeFileSync(path, typeof content === 'string' ? content : JSON.stringify(content));
  return path;
}
