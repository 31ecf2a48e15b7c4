// The error of a refused zod safeParse, for tests that look at its issues: fails the test when the parse succeeded,
// so no assertion is skipped behind `if (result.success) return`.

/**
 * The error of a failed `safeParse`; throws (failing the test) when the input was accepted.
 *
 * @example
 * const paths = refusalOf(schema.safeParse(input)).issues.map((issue) => issue.path.join('.'));
 */
export function refusalOf<E>(result: { success: true; data: unknown } | { success: false; error: E }): E {
  if (result.success) throw new Error(`expected a refusal, but the input was accepted as ${JSON.stringify(result.data)}`);
  return result.error;
}
