/**
 * The timeline in sentences: "Celia Marwood vouched for step 2.1(a) (case 2.1, “Legs 1 and 2”) at
 * revision 2." instead of an event code. Pure: the data layer resolves what an event is about (the
 * step label from lib/proof-tree.ts, as the pages show it) and this module only words it.
 */

/** What an event is about, resolved by the data layer. */
export interface EventPlace {
  /** "1.1(b)" (stepLabel) when the event concerns a step, or a revision, claim, review or comment of one. */
  step: string | null;
  /** The case number and title, when known. */
  caseNumber: string | null;
  caseTitle: string | null;
}

export interface EventFacts {
  action: string;
  subjectType: string;
  actorName: string | null;
  detail: string | null;
  place: EventPlace;
}

/** "step 2.1(a) (case 2.1, “Legs 1 and 2”)", "case 2.1, “Legs 1 and 2”", or "the proof". */
export function placePhrase(p: EventPlace): string {
  const caseText = p.caseNumber ? `case ${p.caseNumber}${p.caseTitle ? `, “${p.caseTitle}”` : ""}` : null;
  if (p.step) return `step ${p.step}${caseText ? ` (${caseText})` : ""}`;
  return caseText ?? "the proof";
}

/** Details written before events were worded (e.g. "raised → answered; step 8" named a database id) lose the code part. */
function cleanDetail(detail: string | null): string | null {
  if (!detail) return null;
  const d = detail
    .replace(/;\s*step \d+$/, "")
    .replace(/^in dispute #\d+$/, "in a dispute thread")
    .trim();
  return d.length ? d : null;
}

const revisionOf = (detail: string | null) => /revision (\d+)/.exec(detail ?? "")?.[1] ?? null;

/** Actions worded “<who> <phrase> <place>.” */
const ON_PLACE: Record<string, string> = {
  "case.created": "added",
  "case.edited": "edited",
  "case.moved": "moved",
  "case.deleted": "deleted",
  "case.restored": "restored",
  "step.created": "added",
  "step.moved": "moved",
  "claim.cancelled": "cancelled the check of a claim on",
  "dispute.answered": "answered the dispute on",
  "dispute.withdrawn": "withdrew the dispute on",
  "dispute.upheld": "upheld the dispute on",
};

/** Actions worded “<who> <phrase> <place> (<detail>).” */
const ON_PLACE_NOTED: Record<string, string> = {
  "claim.attached": "attached a claim to",
  "claim.withdrawn": "withdrew a claim from",
  "batch.created": "attached a batch claim to",
  "batch.cancelled": "cancelled a batch claim on",
  "file.uploaded": "uploaded a file to",
};

/** Actions worded “<who> <phrase>: <detail>.” */
const WITH_DETAIL: Record<string, string> = {
  "invitation.sent": "invited a referee",
  "invitation.revoked": "revoked an invitation",
  "member.scope_changed": "changed which cases a referee sees",
  "member.scope_shared": "shared the whole proof with a referee",
  "member.owner_changed": "handed over the proof",
  "member.left": "left the proof",
  "member.removed": "removed a member",
  "settings.required_approvals": "changed how many vouches a step needs",
  "settings.review_policy": "changed the review policy",
  "round.opened": "opened a round of refereeing",
  "round.due_date_set": "set a due date",
  "round.decided": "recorded a decision",
  "report.submitted": "submitted a report",
  "report.correction_started": "reopened a report for correction",
  "export.certified": "made a certified export",
  "export.draft": "made a draft export",
};

/**
 * One sentence for a timeline event, naming who, what and where with the labels of the pages.
 * Unknown actions still read as a sentence ("… recorded “x.y” on …"), never as a bare code.
 */
export function eventSentence(e: EventFacts): string {
  const who = e.actorName ?? "Cairn";
  const where = placePhrase(e.place);
  const detail = cleanDetail(e.detail);
  const rev = revisionOf(e.detail);
  const atRevision = rev ? ` at revision ${rev}` : "";
  const withDetail = (s: string) => `${s}${detail ? `: ${detail}` : ""}.`;
  if (Object.hasOwn(ON_PLACE, e.action)) return `${who} ${ON_PLACE[e.action]} ${where}.`;
  if (Object.hasOwn(ON_PLACE_NOTED, e.action)) return `${who} ${ON_PLACE_NOTED[e.action]} ${where}${detail ? ` (${detail})` : ""}.`;
  if (Object.hasOwn(WITH_DETAIL, e.action)) return withDetail(`${who} ${WITH_DETAIL[e.action]}`);
  switch (e.action) {
    case "proof.created":
      return `${who} started the proof.`;
    case "proof.edited":
      return `${who} edited the proof's title or statement.`;
    case "case.reparented":
      return withDetail(`${who} moved ${where} under another case`);
    case "step.revised":
    case "revision.created":
      return `${who} saved ${rev ? `revision ${rev}` : "a revision"} of ${where}.`;
    case "demo.reviews":
      return `${who} added the demonstration reviews.`;
    case "demo.rounds":
      return `${who} added the demonstration rounds.`;
    case "claim.decided":
      return withDetail(`A claim on ${where} was decided`);
    case "claim.rechecked":
      return `${who} asked for a claim on ${where} to be checked again.`;
    case "review.vouched":
      return `${who} vouched for ${where}${atRevision}.`;
    case "review.disputed":
      return `${who} raised a dispute on ${where}${atRevision}.`;
    case "comment.added":
      if (e.subjectType === "proof") return `${who} commented on the statement.`;
      if (e.subjectType === "case") return `${who} commented on the condition of ${where}.`;
      return `${who} commented on ${where}${e.detail?.startsWith("in dispute") ? " in a dispute thread" : ""}.`;
    case "invitation.accepted":
      return `${who} accepted an invitation to referee.`;
    // An action added later without its own sentence still reads as words, never as the code.
    default:
      return withDetail(`${who}: ${e.action.replace(/[._]/g, " ")}, on ${where}`);
  }
}
