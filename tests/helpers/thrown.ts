// The error a call throws or a promise rejects with, for tests that look at its fields (issues, kind, code) after
// `expect(…).toThrow(…)`: fails the test when nothing was thrown, so no assertion hides inside a catch.

/**
 * Call `action` and return what it threw; throw an error of our own (failing the test) when it returned normally.
 *
 * @example
 * const error = thrownBy(() => parseBundle({}));
 * expect(error).toBeInstanceOf(BundleError);
 */
export function thrownBy(action: () => unknown): unknown {
  try {
    action();
  } catch (error) {
    return error;
  }
  throw new Error('expected the call to throw, but it returned');
}

/**
 * Await `promise` and return what it rejected with; throw (failing the test) when it resolved.
 *
 * @example
 * const error = await rejectionOf(tx.transaction(…));
 */
export async function rejectionOf(promise: Promise<unknown>): Promise<unknown> {
  try {
    await promise;
  } catch (error) {
    return error;
  }
  throw new Error('expected the promise to reject, but it resolved');
}
