import { WebError } from '../web-error';

/** The WebError that `run` throws, for assertions on its kind and problems; fails the test otherwise. */
export function catchWebError(run: () => unknown): WebError {
  try {
    run();
  } catch (error) {
    if (error instanceof WebError) return error;
    throw error;
  }
  throw new Error('expected a WebError');
}
