/**
 * Reading model rows into the plain objects the data layer returns: the name of an included user
 * (`include: [{ model: User, as }]`) and a row's own columns copied as they are.
 */

/** The `name` of the user included under `as`, or "" when it was not included (or the user is gone). */
export const nameOf = (row: unknown, as: string): string => (row as Record<string, { name?: string } | null | undefined>)[as]?.name ?? "";

/** The named columns of a row, copied into a plain object. */
export function pick<T, K extends keyof T>(row: T, keys: readonly K[]): Pick<T, K> {
  const out = {} as Pick<T, K>;
  for (const k of keys) out[k] = row[k];
  return out;
}
