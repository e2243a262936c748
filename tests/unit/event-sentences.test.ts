/** The timeline speaks in sentences naming proof, case and step with the pages' labels, never in event codes. */
import { describe, expect, it } from "vitest";
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join } from "node:path";
import { eventSentence, placePhrase } from "@/lib/review/event-sentences";

const root = join(import.meta.dirname, "..", "..");
function sources(dir: string): string[] {
  return readdirSync(dir).flatMap((f) => {
    const p = join(dir, f);
    return statSync(p).isDirectory() ? sources(p) : /\.tsx?$/.test(f) && !/\.test\./.test(f) ? [p] : [];
  });
}

/** Every audit action the code records ("step.revised", `dispute.${to}` → answered/withdrawn/upheld, …). */
function recordedActions(): string[] {
  const found = new Set<string>();
  for (const file of [...sources(join(root, "lib", "data")), ...sources(join(root, "seeders"))]) {
    const text = readFileSync(file, "utf8");
    // Every dotted name on a line that sets an action, ternaries included ("member.left" : "member.removed").
    for (const line of text.split("\n").filter((l) => /action: /.test(l))) for (const m of line.matchAll(/"([a-z_]+\.[a-z_]+)"/g)) found.add(m[1]);
    for (const m of text.matchAll(/audit\([^,]+, [^,]+, "([a-z_]+\.[a-z_]+)"/g)) found.add(m[1]);
    // The demo seeders write events through a local helper: event("revision.created", …), "demo.reviews".
    for (const m of text.matchAll(/event\("([a-z_]+\.[a-z_]+)"|"(demo\.[a-z_]+)"/g)) found.add(m[1] ?? m[2]);
  }
  for (const to of ["answered", "withdrawn", "upheld"]) found.add(`dispute.${to}`);
  for (const kind of ["certified", "draft"]) found.add(`export.${kind}`);
  for (const a of ["case.created", "case.edited", "case.moved", "case.reparented", "case.deleted", "case.restored"]) found.add(a);
  return [...found].sort();
}

const place = { step: "2.1(a)", caseNumber: "2.1", caseTitle: "Legs 1 and 2" };

describe("event sentences", () => {
  it("name the step with the pages' label and its case with number and title", () => {
    expect(placePhrase(place)).toBe("step 2.1(a) (case 2.1, “Legs 1 and 2”)");
    expect(placePhrase({ step: null, caseNumber: "3", caseTitle: "Large" })).toBe("case 3, “Large”");
    expect(placePhrase({ step: null, caseNumber: null, caseTitle: null })).toBe("the proof");
    expect(eventSentence({ action: "review.vouched", subjectType: "step", actorName: "Celia Marwood", detail: "revision 2", place })).toBe(
      "Celia Marwood vouched for step 2.1(a) (case 2.1, “Legs 1 and 2”) at revision 2.",
    );
  });

  it("drop the database ids older details carried ('raised → withdrawn; step 8')", () => {
    const s = eventSentence({ action: "dispute.withdrawn", subjectType: "review", actorName: "Celia Marwood", detail: "raised → withdrawn; step 8", place });
    expect(s).toBe("Celia Marwood withdrew the dispute on step 2.1(a) (case 2.1, “Legs 1 and 2”).");
  });

  it("word every action the code records, with no event code, review number or bare id left", () => {
    const actions = recordedActions();
    expect(actions.length).toBeGreaterThan(25);
    for (const action of actions) {
      const s = eventSentence({ action, subjectType: "step", actorName: "Ada Quenby", detail: null, place });
      expect(s, action).toMatch(/^Ada Quenby|^A claim /);
      expect(s, action).not.toContain(action);
      expect(s, action).not.toMatch(/#\d/);
      expect(s.endsWith("."), action).toBe(true);
    }
  });

  it("give every action known today a sentence of its own (not the fallback)", () => {
    const known = [
      "proof.created",
      "proof.edited",
      "case.created",
      "case.edited",
      "case.moved",
      "case.reparented",
      "case.deleted",
      "case.restored",
      "step.created",
      "step.revised",
      "step.moved",
      "revision.created",
      "claim.attached",
      "claim.decided",
      "claim.rechecked",
      "claim.cancelled",
      "claim.withdrawn",
      "batch.created",
      "batch.cancelled",
      "file.uploaded",
      "review.vouched",
      "review.disputed",
      "dispute.answered",
      "dispute.withdrawn",
      "dispute.upheld",
      "comment.added",
      "invitation.sent",
      "invitation.revoked",
      "invitation.accepted",
      "member.scope_changed",
      "member.scope_shared",
      "member.owner_changed",
      "member.left",
      "member.removed",
      "settings.required_approvals",
      "settings.review_policy",
      "round.opened",
      "round.due_date_set",
      "round.decided",
      "report.submitted",
      "report.correction_started",
      "export.certified",
      "export.draft",
      "demo.reviews",
      "demo.rounds",
    ];
    for (const action of known)
      expect(eventSentence({ action, subjectType: "step", actorName: "Ada Quenby", detail: null, place }), action).not.toMatch(/^Ada Quenby: /);
  });
});
