/** The claim form's fields for the unit tests of its kinds: the empty form with some fields filled in. */
import { expect } from "vitest";
import { claimFromForm, emptyClaimForm, type ClaimForm } from "@/lib/validations/claim";

/** What the form makes of these fields (on top of the empty form): a claim, or the issues it reports on its fields. */
export const fromForm = (fields: Partial<ClaimForm>) => claimFromForm({ ...emptyClaimForm, ...fields });

/** The claim the form builds from these fields; fails the test (naming the issues) when the form refuses them. */
export function claimOf(fields: Partial<ClaimForm>) {
  const built = fromForm(fields);
  expect("claim" in built, JSON.stringify(built)).toBe(true);
  if (!("claim" in built)) throw new Error("expected a claim");
  return built.claim;
}
