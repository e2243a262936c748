/** The proof's invitations, with whether each mail has gone out ("not sent yet" while it is retried). */
import type { InvitationView } from "@/lib/data/invitations";
import { ActionButton } from "./action-button";
import { ScrollTable } from "@/components/ui/table-scroll";

const mailText = (m: InvitationView["mail"]) =>
  m.status === "sent"
    ? "✓ mail sent"
    : m.status === "failed"
      ? `✗ mail failed after ${m.attempts} attempts`
      : `… not sent yet (${m.attempts} attempt${m.attempts === 1 ? "" : "s"}; retrying)`;

const STATE_TEXT: Record<InvitationView["state"], string> = { accepted: "✓ accepted", expired: "⌛ expired", waiting: "○ waiting", revoked: "⊘ revoked" };

export function InvitationList({ proofId, invitations }: { proofId: number; invitations: InvitationView[] }) {
  if (invitations.length === 0) return <p className="text-sm italic text-stone-500">No invitations yet.</p>;
  return (
    <ScrollTable
      label="Invitations"
      headers={["E-mail", "Scope", "Invitation", "Mail"]}
      testId="invitations"
      headerClassName="border-b border-stone-300 text-left"
      cellClassName="px-2 py-1"
    >
      {invitations.map((i) => (
        <tr key={i.id} className="border-b border-stone-100" data-testid="invitation" data-mail-status={i.mail.status}>
          <td className="px-2 py-1 font-mono">{i.email}</td>
          <td className="px-2 py-1">{i.scope}</td>
          <td className="px-2 py-1">
            {STATE_TEXT[i.state]} {i.state === "waiting" && <ActionButton url={`/api/proofs/${proofId}/invitations/${i.id}`} method="DELETE" label="Revoke" />}
          </td>
          <td className="px-2 py-1">
            <span title={i.mail.lastError ?? undefined}>{mailText(i.mail)}</span>{" "}
            {i.mail.status !== "sent" && i.mail.id !== null && i.state !== "revoked" && (
              <ActionButton url={`/api/proofs/${proofId}/invitations/${i.id}`} label="Try again now" />
            )}
          </td>
        </tr>
      ))}
    </ScrollTable>
  );
}
