/**
 * The "coverage" claim kind: a case split covers every graph of an enumeration setting up to N
 * vertices (families/coverage.ts). The conditions are in the claim, so the offline checker re-checks
 * it from the bundle alone.
 */
import type { CoverageClaim } from "./claim-schema";
import type { ClaimHandler } from "./claim-support";
import { checkCoverage, coveragePart, coverageStatement, recheckCoverage, type CoveragePartResult } from "../families/coverage";
import { claimEnumerationSetting } from "../families/enumeration";

export const COVERAGE_HANDLER: ClaimHandler<CoverageClaim> = {
  statement: (c) => coverageStatement(c.maxVertices, c.cases, claimEnumerationSetting(c)),
  limit: () => undefined, // maxVertices and the number of sub-cases are capped by validateClaim
  verify: (c, _inputs, budget) => checkCoverage(c.maxVertices, c.cases, budget, claimEnumerationSetting(c)),
  recheck: (c, _inputs, outcome, evidence, budget, parts) =>
    recheckCoverage(c.maxVertices, c.cases, outcome, evidence, budget, claimEnumerationSetting(c), parts as readonly CoveragePartResult[] | undefined),
  part: (c, _inputs, part, parts, budget) => coveragePart(c.maxVertices, c.cases, claimEnumerationSetting(c), part, parts, budget),
  fromParts: (c, _inputs, parts, budget) => checkCoverage(c.maxVertices, c.cases, budget, claimEnumerationSetting(c), parts as readonly CoveragePartResult[]),
};
