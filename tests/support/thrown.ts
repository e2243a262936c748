/** Test support: the error `run` throws, or null when it returns (tests of refusals read its message or its type). */
export function thrownBy(run: () => unknown): Error | null {
  try {
    run();
  } catch (e) {
    return e as Error;
  }
  return null;
}
