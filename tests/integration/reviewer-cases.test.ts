/** Changing a referee's cases after the invitation: PUT /api/proofs/[proofId]/settings/scopes/[userId]. */
import { describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { actAs, jsonRequest, params } from "./helpers";
import { reviewProofsForFile } from "./review-fixtures";
import { models } from "@/models";
import { visibleCaseIds } from "@/lib/access";
import { listProofEvents } from "@/lib/data/audit";
import * as scopes from "@/app/api/proofs/[proofId]/settings/scopes/[userId]/route";

const [fx, other] = reviewProofsForFile(["reviewer cases", "other"]);

const put = (userId: number, body: unknown, proofId = fx.proofId) =>
  scopes.PUT(jsonRequest("/x", "PUT", body), params({ proofId: String(proofId), userId: String(userId) }));

describe("PUT /api/proofs/[proofId]/settings/scopes/[userId]", () => {
  it("refuses anonymous (401), authors other than the owner and referees (403), a non-referee or missing proof (404), bad lists (422)", async () => {
    const body = { caseIds: [fx.cases["1"]] };
    await actAs(null);
    expect((await put(fx.ids.reviewer, body)).status).toBe(401);
    for (const who of ["coauthor", "reviewer", "outsider"]) {
      await actAs(who);
      expect((await put(fx.ids.reviewer, body)).status, who).toBe(403);
    }
    await actAs("editor");
    expect((await put(fx.ids.author, body)).status).toBe(404);
    expect((await put(fx.ids.reviewer, body, 999_999)).status).toBe(404);
    expect((await put(fx.ids.reviewer, { caseIds: [] })).status).toBe(422);
    expect((await put(fx.ids.reviewer, { caseIds: "1" })).status).toBe(422);
    const foreign = await put(fx.ids.reviewer, { caseIds: [other.cases["1"]] });
    expect(foreign.status).toBe(422);
    expect((await foreign.json()).error.issues[0].path).toBe("caseIds");
    expect(await visibleCaseIds(fx.proofId, fx.ids.reviewer)).toBeNull(); // still the whole proof
  });

  it("lets the editor narrow a referee to case 2 (with 2.1 below it) and widen again with DELETE; the audit log records both", async () => {
    await actAs("editor");
    const res = await put(fx.ids.reviewer, { caseIds: [fx.cases["2"]] });
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ scope: "case 2" });
    expect([...(await visibleCaseIds(fx.proofId, fx.ids.reviewer))!].sort()).toEqual([fx.cases["2"], fx.cases["2.1"]].sort());
    expect((await scopes.DELETE(jsonRequest("/x", "DELETE"), params({ proofId: String(fx.proofId), userId: String(fx.ids.reviewer) }))).status).toBe(200);
    expect(await visibleCaseIds(fx.proofId, fx.ids.reviewer)).toBeNull();
    const actions = (await listProofEvents(fx.proofId)).map((e) => e.action);
    expect(actions).toEqual(expect.arrayContaining(["member.scope_changed", "member.scope_shared"]));
    expect(await models().ReviewerScope.count({ where: { proofId: fx.proofId } })).toBe(0);
  });

  it("lets the proof's owner (an author) change the cases too", async () => {
    await actAs("author");
    expect((await put(fx.ids.reviewer, { caseIds: [fx.cases["1"]] })).status).toBe(200);
    expect([...(await visibleCaseIds(fx.proofId, fx.ids.reviewer))!]).toEqual([fx.cases["1"]]);
  });
});
