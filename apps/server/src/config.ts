/** The server's settings, read once from the environment (every variable is optional). */
export interface Config {
  readonly port: number;
  readonly host: string;
  /** PGlite's folder when DATABASE_URL is unset. */
  readonly dataDir: string;
  /** A PostgreSQL server instead of the embedded database. */
  readonly databaseUrl?: string;
  /** A real SMTP server; unset in demo mode means the local fake. */
  readonly smtpUrl?: string;
  /** Where people reach the app (links in e-mail, the Origin check, Secure cookies). */
  readonly publicOrigin: string;
  readonly nodeEnv: string;
  /** Demo users and data are seeded, and the fake SMTP runs, unless NODE_ENV=production. */
  readonly demoMode: boolean;
}

export function readConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const port = portOf(env['PORT']);
  const host = nonEmpty(env['HOST']) ?? '127.0.0.1';
  const nodeEnv = nonEmpty(env['NODE_ENV']) ?? 'development';
  const publicOrigin = originOf(nonEmpty(env['PUBLIC_ORIGIN']) ?? `http://${host.includes(':') ? `[${host}]` : host}:${port}`);
  return {
    port,
    host,
    dataDir: nonEmpty(env['DATA_DIR']) ?? './data',
    databaseUrl: nonEmpty(env['DATABASE_URL']),
    smtpUrl: nonEmpty(env['SMTP_URL']),
    publicOrigin,
    nodeEnv,
    demoMode: nodeEnv !== 'production',
  };
}

function nonEmpty(value: string | undefined): string | undefined {
  return value === undefined || value.trim() === '' ? undefined : value.trim();
}

function portOf(value: string | undefined): number {
  const text = nonEmpty(value);
  if (text === undefined) return 4300;
  const port = Number(text);
  if (!Number.isInteger(port) || port < 0 || port > 65535) throw new Error(`PORT must be a whole number from 0 to 65535, not "${text}"`);
  return port;
}

function originOf(value: string): string {
  let url: URL;
  try {
    url = new URL(value);
  } catch {
    throw new Error(`PUBLIC_ORIGIN must be a URL such as https://seinework.example.org, not "${value}"`);
  }
  if (url.protocol !== 'http:' && url.protocol !== 'https:') throw new Error(`PUBLIC_ORIGIN must start with http:// or https://, not "${value}"`);
  return url.origin;
}
