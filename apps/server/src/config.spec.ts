import { readConfig } from './config';

describe('readConfig', () => {
  it('has defaults for everything', () => {
    expect(readConfig({})).toEqual({ port: 4300, host: '127.0.0.1', dataDir: './data', databaseUrl: undefined, smtpUrl: undefined, publicOrigin: 'http://127.0.0.1:4300', nodeEnv: 'development', demoMode: true });
  });

  it('reads every variable; empty ones count as unset', () => {
    const config = readConfig({ PORT: '8080', HOST: '0.0.0.0', DATA_DIR: '/var/lib/seinework', DATABASE_URL: 'postgres://db/seinework', SMTP_URL: 'smtp://mail:587', PUBLIC_ORIGIN: 'https://seinework.example.org/', NODE_ENV: 'production' });
    expect(config).toEqual({ port: 8080, host: '0.0.0.0', dataDir: '/var/lib/seinework', databaseUrl: 'postgres://db/seinework', smtpUrl: 'smtp://mail:587', publicOrigin: 'https://seinework.example.org', nodeEnv: 'production', demoMode: false });
    expect(readConfig({ DATABASE_URL: '', PORT: ' ' })).toMatchObject({ databaseUrl: undefined, port: 4300 });
  });

  it('takes the public origin from host and port when unset', () => {
    expect(readConfig({ PORT: '5000', HOST: 'localhost' }).publicOrigin).toBe('http://localhost:5000');
    expect(readConfig({ HOST: '::1' }).publicOrigin).toBe('http://[::1]:4300');
  });

  it.each([
    [{ PORT: 'eighty' }, /PORT must be a whole number/],
    [{ PORT: '70000' }, /PORT must be a whole number/],
    [{ PUBLIC_ORIGIN: 'seinework.example.org' }, /PUBLIC_ORIGIN must be a URL/],
    [{ PUBLIC_ORIGIN: 'ftp://seinework.example.org' }, /must start with http/],
  ])('refuses %o with a readable message', (env, message) => {
    expect(() => readConfig(env)).toThrow(message);
  });
});
