import type { Metadata } from "next";
import { requireUser } from "@/lib/session";
import { getAuthorQueue, getEditorProgress, getReviewerQueue } from "@/lib/data/review-queues";
import { QueueTable } from "@/components/review/queue-table";

export const metadata: Metadata = { title: "Review queue" };

export default async function QueuePage() {
  const user = await requireUser();
  const [reviewer, author, progress] = await Promise.all([getReviewerQueue(user.id), getAuthorQueue(user.id), getEditorProgress(user.id)]);
  return (
    <main className="space-y-10">
      <h1 className="text-3xl font-semibold">Review queue</h1>
      <section className="space-y-3">
        <h2 className="text-xl font-semibold">Steps waiting for your verdict</h2>
        <QueueTable kind="steps" rows={reviewer.steps} empty="No step is waiting for your verdict." testId="queue-verdicts" />
      </section>
      <section className="space-y-3">
        <h2 className="text-xl font-semibold">Your disputes the authors answered</h2>
        <QueueTable kind="disputes" rows={reviewer.answered} empty="No answered dispute is waiting for you." testId="queue-answered" />
      </section>
      <section className="space-y-3">
        <h2 className="text-xl font-semibold">Disputes on your proofs</h2>
        <QueueTable kind="disputes" rows={author} empty="No unresolved dispute on a proof you wrote." testId="queue-author" />
      </section>
      {progress.length > 0 && (
        <section className="space-y-3">
          <h2 className="text-xl font-semibold">Reviewers’ progress on the proofs you edit</h2>
          <QueueTable kind="progress" rows={progress} empty="" testId="queue-progress" />
        </section>
      )}
    </main>
  );
}
