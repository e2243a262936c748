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
  switch (e.action) {
    case "proof.created":
      return `${who} started the proof.`;
    case "proof.edited":
      return `${who} edited the proof's title or statement.`;
    case "case.created":
      return `${who} added ${where}.`;
    case "case.edited":
      return `${who} edited ${where}.`;
    case "case.moved":
      return `${who} moved ${where}.`;
    case "case.reparented":
      return withDetail(`${who} moved ${where} under another case`);
    case "case.deleted":
      return `${who} deleted ${where}.`;
    case "case.restored":
      return `${who} restored ${where}.`;
    case "step.created":
      return `${who} added ${where}.`;
    case "step.revised":
      return `${who} saved ${rev ? `revision ${rev}` : "a revision"} of ${where}.`;
    case "step.moved":
      return `${who} moved ${where}.`;
    case "revision.created":
      return `${who} saved ${rev ? `revision ${rev}` : "a revision"} of ${where}.`;
    case "demo.reviews":
      return `${who} added the demonstration reviews.`;
    case "demo.rounds":
      return `${who} added the demonstration rounds.`;
    case "claim.attached":
      return `${who} attached a claim to ${where}${detail ? ` (${detail})` : ""}.`;
    case "claim.decided":
      return withDetail(`A claim on ${where} was decided`);
    case "claim.rechecked":
      return `${who} asked for a claim on ${where} to be checked again.`;
    case "claim.cancelled":
      return `${who} cancelled the check of a claim on ${where}.`;
    case "claim.withdrawn":
      return `${who} withdrew a claim from ${where}${detail ? ` (${detail})` : ""}.`;
    case "review.vouched":
      return `${who} vouched for ${where}${atRevision}.`;
    case "review.disputed":
      return `${who} raised a dispute on ${where}${atRevision}.`;
    case "dispute.answered":
      return `${who} answered the dispute on ${where}.`;
    case "dispute.withdrawn":
      return `${who} withdrew the dispute on ${where}.`;
    case "dispute.upheld":
      return `${who} upheld the dispute on ${where}.`;
    case "batch.created":
      return `${who} attached a batch claim to ${where}${detail ? ` (${detail})` : ""}.`;
    case "batch.cancelled":
      return `${who} cancelled a batch claim on ${where}${detail ? ` (${detail})` : ""}.`;
    case "file.uploaded":
      return `${who} uploaded a file to ${where}${detail ? ` (${detail})` : ""}.`;
    case "comment.added":
      if (e.subjectType === "proof") return `${who} commented on the statement.`;
      if (e.subjectType === "case") return `${who} commented on the condition of ${where}.`;
      return `${who} commented on ${where}${e.detail?.startsWith("in dispute") ? " in a dispute thread" : ""}.`;
    case "invitation.sent":
      return withDetail(`${who} invited a referee`);
    case "invitation.revoked":
      return withDetail(`${who} revoked an invitation`);
    case "invitation.accepted":
      return `${who} accepted an invitation to referee.`;
    case "member.scope_changed":
      return withDetail(`${who} changed which cases a referee sees`);
    case "member.scope_shared":
      return withDetail(`${who} shared the whole proof with a referee`);
    case "member.owner_changed":
      return withDetail(`${who} handed over the proof`);
    case "member.left":
      return withDetail(`${who} left the proof`);
    case "member.removed":
      return withDetail(`${who} removed a member`);
    case "settings.required_approvals":
      return withDetail(`${who} changed how many vouches a step needs`);
    case "settings.review_policy":
      return withDetail(`${who} changed the review policy`);
    case "round.opened":
      return withDetail(`${who} opened a round of refereeing`);
    case "round.due_date_set":
      return withDetail(`${who} set a due date`);
    case "round.decided":
      return withDetail(`${who} recorded a decision`);
    case "report.submitted":
      return withDetail(`${who} submitted a report`);
    case "report.correction_started":
      return withDetail(`${who} reopened a report for correction`);
    case "export.certified":
      return withDetail(`${who} made a certified export`);
    case "export.draft":
      return withDetail(`${who} made a draft export`);
    // An action added later without its own sentence still reads as words, never as the code.
    default:
      return withDetail(`${who}: ${e.action.replace(/[._]/g, " ")}, on ${where}`);
  }
}
