/**
 * dynkin-data claims on the diagrams with a multiple bond (B_n, C_n, F4, G2) through the API: attached to a step, checked
 * in the worker pool, the verdict and its reasons read back; names outside Bourbaki's ranges answer 422 naming the field.
 */
import { beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { actAs, jsonRequest, params, closeAfterAll } from "./helpers";
import { draftCaseStep, dropProofs } from "./workspace-fixture";
import { models } from "@/models";
import * as claimsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/claims/route";
import * as claimRoute from "@/app/api/proofs/[proofId]/claims/[claimId]/route";

let proofId: string;
let stepId: string;
const dynkin = (o: object) => ({ format: "cairn-claim/1", kind: "dynkin-data", ...o });

closeAfterAll(() => dropProofs([proofId]), { pool: true });
beforeAll(async () => {
  ({ proofId, stepId } = await draftCaseStep(
    "Weyl groups with a double bond",
    "The diagram has a double bond",
    "Then it is $B_n$ or $C_n$, and $|W| = 2^n n!$.",
  ));
});

const attachAndWait = (claims: unknown) => claimsRoute.POST(jsonRequest("/x?wait=60", "POST", { claims }), params({ proofId, stepId }));
const getClaim = async (id: number) => (await (await claimRoute.GET(new Request("http://localhost/x"), params({ proofId, claimId: String(id) }))).json()).claim;

describe("dynkin-data claims on B_n, C_n, F4, G2 through the API", () => {
  it("B5 with its published data is verified; a forged |W(F4)| is refuted naming the value; the card reads the diagram by type", async () => {
    await actAs("author");
    // B5 (Bourbaki, Plate II): h = 10, exponents 1, 3, 5, 7, 9, highest root α1 + 2α2 + 2α3 + 2α4 + 2α5, f = 2;
    // |W(B5)| = 2⁵·5! = 3840 (Humphreys, Reflection Groups and Coxeter Groups, Table 2.4).
    const b5 = dynkin({
      type: "B5",
      coxeterNumber: 10,
      spectralRadius: "2cos(pi/10)",
      exponents: [1, 3, 5, 7, 9],
      marks: [1, 2, 2, 2, 2],
      indexOfConnection: 2,
      weylGroupOrder: "3840",
    });
    // |W(F4)| = 1152 (Table 2.4; Plate VIII), not 2304.
    const f4 = dynkin({ type: "F4", weylGroupOrder: "2304" });
    const res = await attachAndWait([b5, f4]);
    expect(res.status).toBe(200);
    const [good, bad] = (await res.json()).claims as Array<{ id: number; status: string; statement: string }>;
    expect(good).toMatchObject({ status: "verified" });
    expect(good.statement).toMatch(/^B5: h = 10; ρ\(M\), M_ij = 2cos\(π\/m_ij\) on the Coxeter graph, = 2cos\(pi\/10\); exponents 1, 3, 5, 7, 9/);
    expect(bad.status).toBe("refuted");
    await actAs("reviewer");
    const refuted = await getClaim(bad.id);
    expect(refuted.reason).toMatch(/^\|W\(F4\)\| = 1152, not 2304\./);
    const shown = await getClaim(good.id);
    expect(shown.reason).toMatch(/h = 1 \+ Σa_i = 10/);
    expect(shown.certificateKind).toMatch(/Cartan matrix, highest root, Coxeter graph's characteristic polynomial/);
    expect(shown.inputs.entries.map((e: { label: string }) => e.label)).toEqual([
      "type",
      "diagram",
      "Coxeter number h",
      "spectral radius ρ(M) of the Coxeter graph's matrix M_ij = 2cos(π/m_ij)",
      "exponents m_i",
      "marks a_i of the highest root (Bourbaki's numbering)",
      "index of connection f",
      "order of the Weyl group |W|",
    ]);
    // The picture draws the path α1 — … — α5 with the double bond α4 = α5 as a double edge.
    const picture = shown.picture.pictures[0];
    expect(picture.n).toBe(5);
    expect(picture.edges).toContainEqual([3, 4, 2]);
  });

  it("answers 422 naming the type or graph for B1, C2, G3 and a graph given with B3; nothing is saved", async () => {
    await actAs("author");
    const before = await models().Claim.count({ where: { stepId: Number(stepId) } });
    const cases: [object, string, RegExp][] = [
      [{ type: "B1" }, "claims.0.type", /B_n starts at n = 2/],
      [{ type: "C2" }, "claims.0.type", /C_n is taken for n ≥ 3 .* write "B2"/],
      [{ type: "G3" }, "claims.0.type", /G2 is the only type G/],
      [{ type: "B3", graph: { format: "named", text: "path(3)" } }, "claims.0.graph", /leave out "graph" and give only "type"/],
    ];
    for (const [json, path, message] of cases) {
      const res = await attachAndWait([dynkin(json)]);
      expect(res.status, JSON.stringify(json)).toBe(422);
      expect((await res.json()).error.issues[0]).toMatchObject({ path, message: expect.stringMatching(message) });
    }
    expect(await models().Claim.count({ where: { stepId: Number(stepId) } })).toBe(before);
  });
});
