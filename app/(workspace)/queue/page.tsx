import type { Metadata } from "next";
import { requireUser } from "@/lib/session";
import { listProofsForUser } from "@/lib/data/proofs";
import { getAuthorQueue, getEditorProgress, getReviewerQueue } from "@/lib/data/review-queues";
import { QueueTable } from "@/components/review/queue-table";

export const metadata: Metadata = { title: "Review queue" };

/** What waits for the signed-in person, by the roles they hold on some proof. */
export default async function QueuePage() {
  const user = await requireUser();
  const roles = new Set((await listProofsForUser(user.id)).map((p) => p.role));
  const [reviewer, author, progress] = await Promise.all([getReviewerQueue(user.id), getAuthorQueue(user.id), getEditorProgress(user.id)]);
  return (
    <main className="space-y-10">
      <h1 className="text-3xl font-semibold">Review queue</h1>
      {roles.size === 0 && <p className="text-stone-600">You are not a member of any proof yet; an invitation from an editor brings you here.</p>}
      {roles.has("reviewer") && (
        <>
          <section className="space-y-3">
            <h2 className="text-xl font-semibold">Steps waiting for your verdict</h2>
            <QueueTable kind="steps" rows={reviewer.steps} empty="No step is waiting for your verdict." testId="queue-verdicts" />
          </section>
          <section className="space-y-3">
            <h2 className="text-xl font-semibold">Your disputes the authors answered</h2>
            <QueueTable kind="myDisputes" rows={reviewer.answered} empty="No answered dispute is waiting for you." testId="queue-answered" />
          </section>
        </>
      )}
      {roles.has("author") && (
        <section className="space-y-3">
          <h2 className="text-xl font-semibold">Disputes on your proofs</h2>
          <QueueTable kind="disputes" rows={author} empty="No unresolved dispute on a proof you wrote." testId="queue-author" />
        </section>
      )}
      {roles.has("editor") && (
        <section className="space-y-3">
          <h2 className="text-xl font-semibold">Reviewers’ progress on the proofs you edit</h2>
          <QueueTable kind="progress" rows={progress} empty="No reviewer on the proofs you edit yet." testId="queue-progress" />
        </section>
      )}
    </main>
  );
}
