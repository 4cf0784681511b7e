import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';

/** The engine's version as runs record it (the package's): the demo seed's runs and the queue's (runs/run-service.ts). */
export const ENGINE_VERSION = `seinework ${(JSON.parse(readFileSync(resolve(import.meta.dirname, '../../../../package.json'), 'utf8')) as { version: string }).version}`;
