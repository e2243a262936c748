import { describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { actAs, jsonRequest, params } from "./helpers";
import { reviewProofsForFile, latestRevision, mailsTo, waitForMail } from "./review-fixtures";
import { models } from "@/models";
import { listProofEvents } from "@/lib/data/audit";
import * as notifications from "@/app/api/notifications/route";
import * as preferences from "@/app/api/notifications/preferences/route";
import * as reviews from "@/app/api/proofs/[proofId]/steps/[stepId]/reviews/route";
import * as settings from "@/app/api/proofs/[proofId]/settings/route";

const [fx] = reviewProofsForFile(["notifications"], { afterDrop: () => models().NotificationPreference.destroy({ where: {} }) });
const BRAM = "bram.theroux@tarnhollow.example";

const dispute = async (stepKey: string, comment: string) => {
  await actAs("reviewer");
  const rev = await latestRevision(fx.steps[stepKey]);
  return reviews.POST(
    jsonRequest("/x", "POST", { revisionId: rev.id, verdict: "dispute", comment }),
    params({ proofId: String(fx.proofId), stepId: String(fx.steps[stepKey]) }),
  );
};

describe("notifications", () => {
  it("lists one's own notifications (401 without a session) and marks them read, never another person's", async () => {
    expect((await dispute("1.1", "First objection.")).status).toBe(201);
    await actAs(null);
    expect((await notifications.GET(new Request("http://localhost/x"), params({}))).status).toBe(401);
    await actAs("coauthor");
    const body = await (await notifications.GET(new Request("http://localhost/x"), params({}))).json();
    const mine = body.notifications.filter((n: { link: string }) => n.link.startsWith(`/queue/${fx.proofId}/${fx.steps["1.1"]}#`));
    expect(mine).toHaveLength(1);
    expect(mine[0]).toMatchObject({ kind: "dispute_raised", read: false });
    // A sentence naming proof, case and step with the pages' labels, and a link to the dispute itself.
    const raised = await models().Review.findOne({ where: { stepId: fx.steps["1.1"], verdict: "dispute" } });
    const title = (await models().Proof.findByPk(fx.proofId))!.title;
    expect(mine[0].message).toBe(`A referee raised a dispute on revision 1 of step 1(a) (case 1, “Small”) of “${title}”, a step you are an author of.`);
    expect(mine[0].link).toBe(`/queue/${fx.proofId}/${fx.steps["1.1"]}#dispute-${raised!.id}`);
    expect(body.unread).toBeGreaterThanOrEqual(1);

    const authorsNotice = await models().Notification.findOne({ where: { userId: fx.ids.author, stepId: fx.steps["1.1"] } });
    const mark = await notifications.POST(jsonRequest("/x", "POST", { ids: [mine[0].id, authorsNotice!.id] }), params({}));
    expect(mark.status).toBe(200);
    expect((await mark.json()).marked).toBe(1);
    expect((await authorsNotice!.reload()).readAt).toBeNull();
    expect((await notifications.POST(jsonRequest("/x", "POST", { ids: "some" }), params({}))).status).toBe(422);
    expect((await notifications.POST(jsonRequest("/x", "POST", { ids: "all" }), params({}))).status).toBe(200);
    expect((await (await notifications.GET(new Request("http://localhost/x"), params({}))).json()).unread).toBe(0);
  });

  it("lets a person turn e-mail off per kind: the in-app notice still comes, the mail does not", async () => {
    await actAs(null);
    expect((await preferences.PUT(jsonRequest("/x", "PUT", { kind: "dispute_raised", email: false }), params({}))).status).toBe(401);
    await actAs("coauthor");
    expect((await preferences.PUT(jsonRequest("/x", "PUT", { kind: "everything", email: false }), params({}))).status).toBe(422);
    expect((await preferences.PUT(jsonRequest("/x", "PUT", { kind: "dispute_raised", email: "no" }), params({}))).status).toBe(422);
    const res = await preferences.PUT(jsonRequest("/x", "PUT", { kind: "dispute_raised", email: false }), params({}));
    expect(res.status).toBe(200);
    expect((await res.json()).email).toMatchObject({ dispute_raised: false, dispute_answered: true });

    await waitForMail(BRAM, /A new dispute on your step/); // the first dispute's mail went out
    const before = mailsTo(BRAM).length;
    expect((await dispute("2.1", "Second objection.")).status).toBe(201);
    await waitForMail("ada.quenby@tarnhollow.example", /A new dispute/); // Ada still gets hers…
    await new Promise((r) => setTimeout(r, 500));
    expect(mailsTo(BRAM).length).toBe(before); // …Bram does not
    expect(await models().Notification.count({ where: { userId: fx.ids.coauthor, stepId: fx.steps["2.1"], kind: "dispute_raised" } })).toBe(1);
    await actAs("coauthor");
    expect((await (await preferences.GET(new Request("http://localhost/x"), params({}))).json()).email.dispute_raised).toBe(false);
  });
});

describe("settings and the audit trail", () => {
  it("GET settings: 401, 403 for a non-member, 404 for a missing proof, 200 with the roll-up for members", async () => {
    const get = (proofId: number) => settings.GET(new Request("http://localhost/x"), params({ proofId: String(proofId) }));
    await actAs(null);
    expect((await get(fx.proofId)).status).toBe(401);
    await actAs("outsider");
    expect((await get(fx.proofId)).status).toBe(403);
    await actAs("reviewer");
    expect((await get(999_999)).status).toBe(404);
    const body = await (await get(fx.proofId)).json();
    expect(body.readiness.cases.map((c: { number: string; state: string }) => `${c.number}:${c.state}`)).toEqual(["1:disputed", "2:disputed", "2.1:drafting"]);
  });

  it("keeps the events of a proof, newest first, with the actor's name", async () => {
    const events = await listProofEvents(fx.proofId);
    expect(events[0]).toMatchObject({
      action: "review.disputed",
      actorName: "Celia Marwood",
      subjectType: "step",
      subjectId: fx.steps["2.1"],
      subjectLabel: "step 2(a) (case 2, “Large”)",
      sentence: "Celia Marwood raised a dispute on step 2(a) (case 2, “Large”) at revision 1.",
      href: `/proofs/${fx.proofId}/steps/${fx.steps["2.1"]}`,
    });
    expect(events.map((e) => e.action).filter((a) => a === "review.disputed")).toHaveLength(2);
  });
});
