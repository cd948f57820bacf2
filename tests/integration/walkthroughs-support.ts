/** Helpers shared by the walkthrough and measure integration tests. */
import { HttpError } from '../../src/server/http';

/** The HttpError a service call fails with; fails the test when it succeeds or throws anything else. */
export async function rejects(p: Promise<unknown>): Promise<HttpError> {
  try {
    await p;
  } catch (e) {
    if (e instanceof HttpError) return e;
    throw e;
  }
  throw new Error('expected an HttpError');
}
