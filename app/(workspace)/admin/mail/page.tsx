import type { Metadata } from "next";
import { forbidden } from "next/navigation";
import { requireUser } from "@/lib/session";
import { mailStorePath, readCapturedMail } from "@/lib/mail/store";
import { LinkedText } from "@/components/ui/linked-text";

export const metadata: Metadata = { title: "Captured mail" };
export const dynamic = "force-dynamic";

/** Site admins only: every message the local mail fake captured, so the flow can be followed without a mail provider. */
export default async function CapturedMailPage() {
  const user = await requireUser();
  if (user.role !== "admin") forbidden(); // HTTP 403: the mail view is for site admins
  const messages = readCapturedMail();
  return (
    <main className="space-y-4">
      <h1 className="text-3xl font-semibold">Captured mail</h1>
      <p className="text-sm text-stone-600">
        Messages received by the local mail fake, newest first (store: <span className="font-mono">{mailStorePath()}</span>). With a real SMTP provider
        configured, this list stays empty.
      </p>
      {messages.length === 0 && <p className="italic text-stone-500">No message captured yet.</p>}
      <ol className="space-y-3" data-testid="captured-mail">
        {messages.map((m) => (
          <li key={m.id} className="rounded border border-stone-200 bg-white p-3" data-testid="captured-message">
            <p className="font-mono text-xs text-stone-500">
              {new Date(m.receivedAt).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "medium" })} · to {m.to.join(", ")}
            </p>
            <p className="font-semibold">{m.subject}</p>
            <pre className="mt-2 whitespace-pre-wrap font-mono text-sm">
              <LinkedText text={m.text} />
            </pre>
          </li>
        ))}
      </ol>
    </main>
  );
}
