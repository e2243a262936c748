/**
 * The permission matrix of the pages, generated from the file tree: every page.tsx under app/ × every
 * standing (tests/e2e/access-fixture.ts). The expected outcome of each cell is in EXPECTED below, one
 * table; each answer is checked for its HTTP status, and every page a case-limited reviewer can open
 * is checked for titles of cases outside their scope. The API's own matrix is in tests/integration.
 */
import { describe, expect, inject, it } from "vitest";
import { fixtureForFile, ROLES, type Role } from "./access-fixture";
import { pageRoutes } from "./page-routes";

const baseUrl = inject("baseUrl");
const fx = fixtureForFile(baseUrl);

type Outcome = 200 | 403 | 404 | "sign-in" | "redirect";
const ALL = (o: Outcome) => Object.fromEntries(ROLES.map((r) => [r, o])) as Record<Role, Outcome>;
const SIGNED_IN = (o: Outcome) => ({ ...ALL(o), anonymous: "sign-in" as Outcome });
const MEMBERS = (o: Outcome, limited: Outcome = o) => ({ ...SIGNED_IN(404), caseLimited: limited, reviewer: o, coauthor: o, owner: o, editor: o });

/**
 * The one table. A page variant is the route with its parameters filled: `:in` a step in the case-limited
 * reviewer's case, `:out` a step outside it, `:gone` a step under a deleted case. Outsiders get 404 for
 * anything of the proof (a page does not tell them it exists); a member whose standing the access table
 * refuses gets 403.
 */
const EXPECTED: Record<string, Record<Role, Outcome>> = {
  "/": ALL(200),
  "/sign-in": { ...ALL("redirect"), anonymous: 200 },
  "/invitations/[token]": ALL(200), // an unknown token is explained on the page
  "/admin/mail": { ...SIGNED_IN(403), admin: 200 },
  "/notifications": SIGNED_IN(200),
  "/account": SIGNED_IN(200),
  "/queue": SIGNED_IN(200),
  "/verdicts": SIGNED_IN(200), // the full text behind the verdict note; no proof data
  "/proofs": SIGNED_IN(200),
  "/proofs/new": SIGNED_IN(200),
  "/proofs/[proofId]": MEMBERS(200),
  "/proofs/[proofId]/members": MEMBERS(200),
  "/proofs/[proofId]/timeline": MEMBERS(200),
  "/proofs/[proofId]/export": MEMBERS(200, 403),
  "/proofs/[proofId]/print/[exportId]": MEMBERS(200, 403),
  "/proofs/[proofId]/rounds": MEMBERS(200),
  "/proofs/[proofId]/desk": { ...MEMBERS(403), editor: 200 },
  "/proofs/[proofId]/steps/[stepId]:in": MEMBERS(200),
  "/proofs/[proofId]/steps/[stepId]:out": MEMBERS(200, 404),
  "/proofs/[proofId]/steps/[stepId]:gone": MEMBERS(404),
  "/queue/[proofId]/[stepId]:in": MEMBERS(200),
  "/queue/[proofId]/[stepId]:out": MEMBERS(200, 404),
  "/queue/[proofId]/[stepId]:gone": MEMBERS(404),
};

function urlOf(variant: string): string {
  const [route, which] = variant.split(":");
  const step = which === "out" ? fx.stepOut : which === "gone" ? fx.stepGone : fx.stepIn;
  return route
    .replace("[proofId]", String(fx.proofId))
    .replace("[stepId]", String(step))
    .replace("[exportId]", String(fx.exportId))
    .replace("[token]", "no-such-invitation-token-0000000000");
}

describe("the page permission matrix", () => {
  it("has an expected outcome for every page in the file tree, and no stale row", () => {
    const routes = pageRoutes().sort();
    expect(routes.length).toBeGreaterThan(10);
    expect([...new Set(Object.keys(EXPECTED).map((v) => v.split(":")[0]))].sort()).toEqual(routes);
  });

  it("answers every page × standing as the table says, with no out-of-scope case title for the case-limited reviewer", async () => {
    const mismatches: string[] = [];
    let cells = 0;
    for (const [variant, row] of Object.entries(EXPECTED)) {
      for (const role of ROLES) {
        cells++;
        const res = await fx.contexts[role].request.get(`${baseUrl}${urlOf(variant)}`, { maxRedirects: 0 });
        const status = res.status();
        const location = res.headers()["location"] ?? "";
        const got: Outcome | number = status >= 300 && status < 400 ? (location.includes("/sign-in") && role === "anonymous" ? "sign-in" : "redirect") : status;
        if (got !== row[role]) mismatches.push(`${variant} as ${role}: expected ${row[role]}, got ${got}`);
        // The site admin's outgoing-mail page shows every message as sent (mail now names proof, case and step):
        // that is its purpose, so case titles there are not a leak. Every other page is checked for them.
        const mailLog = variant === "/admin/mail" && role === "admin";
        if (
          status === 200 &&
          !mailLog &&
          (role === "caseLimited" || role === "nonmember" || role === "otherProof" || role === "admin" || role === "anonymous")
        ) {
          const html = await res.text();
          const leaked = (role === "caseLimited" ? fx.outOfScopeTitles : [...fx.outOfScopeTitles, ...fx.inScopeTitles]).filter((t) => html.includes(t));
          if (leaked.length) mismatches.push(`${variant} as ${role}: shows ${leaked.map((t) => `"${t}"`).join(", ")}`);
        }
      }
    }
    console.log(
      `[access matrix] pages: ${Object.keys(EXPECTED).length} variants × ${ROLES.length} standings = ${cells} cells, ${mismatches.length} mismatches`,
    );
    expect(mismatches).toEqual([]);
  }, 300_000);
});
