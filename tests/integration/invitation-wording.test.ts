/** The wording of invitation mails: a whole-proof invitation names the proof once. */
import { describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { actAs, jsonRequest, params } from "./helpers";
import { reviewProofsForFile, waitForMail } from "./review-fixtures";
import { models } from "@/models";
import * as invitations from "@/app/api/proofs/[proofId]/invitations/route";

const [fx] = reviewProofsForFile(["wording"]);

describe("invitation mail", () => {
  it("reads 'to review the proof “…”' for the whole proof, never 'the whole proof of the proof'", async () => {
    await actAs("editor");
    const email = `wren.ashby.${Date.now()}@moorfield.example`;
    const res = await invitations.POST(jsonRequest("/x", "POST", { email, scope: "proof" }), params({ proofId: String(fx.proofId) }));
    expect(res.status).toBe(201);
    const title = (await models().Proof.findByPk(fx.proofId))!.title;
    const mail = await waitForMail(email, /invites you to review/);
    expect(mail.text).toContain(`invites you to review the proof “${title}” in Cairn.`);
    expect(mail.text).not.toContain("of the proof of");
    expect(mail.text).not.toContain("whole proof of the proof");
  });
});
