/** Where global setup leaves the running server for the tests and for teardown (environment variables reach both). */
export const BASE_URL_VARIABLE = 'SEINEWORK_E2E_BASE_URL';
export const SERVER_PID_VARIABLE = 'SEINEWORK_E2E_SERVER_PID';
export const WORK_DIR_VARIABLE = 'SEINEWORK_E2E_WORK_DIR';

export function baseUrl(): string {
  const url = process.env[BASE_URL_VARIABLE];
  if (!url) throw new Error(`${BASE_URL_VARIABLE} is not set: run the end-to-end tests through playwright.config.ts (its global setup starts the server)`);
  return url;
}
