/**
 * The proof's members, with what the viewer may do to each: remove them (or leave), hand them the
 * ownership, share the whole proof with a case-limited referee. The permissions come from the page
 * (the access module); this only renders them.
 */
import type { ProofRole } from "@/lib/access/rules";
import { RoleTag } from "@/components/ui/role-tag";
import { ActionButton } from "./action-button";

export interface MemberRow {
  userId: number;
  name: string;
  email: string;
  role: ProofRole;
  owner: boolean;
  self: boolean;
  scope?: string;
  mayRemove: boolean;
  mayMakeOwner: boolean;
  mayShare: boolean;
}

export function MemberList({ proofId, members }: { proofId: number; members: MemberRow[] }) {
  return (
    <ul className="divide-y divide-stone-100 rounded border border-stone-200 bg-white" data-testid="members">
      {members.map((m) => (
        <li key={m.userId} className="flex flex-wrap items-center justify-between gap-2 px-3 py-2" data-testid="member" data-role={m.role}>
          <span>
            {m.name} <span className="break-all font-mono text-xs text-stone-600">{m.email}</span>
            {m.owner && <span className="ml-2 text-xs italic text-stone-600">owner</span>}
          </span>
          <span className="flex flex-wrap items-center gap-2 text-sm">
            {m.scope && <span className="text-stone-600">{m.scope}</span>}
            {m.mayShare && <ActionButton url={`/api/proofs/${proofId}/settings/scopes/${m.userId}`} method="DELETE" label="Share the whole proof" />}
            {m.mayMakeOwner && (
              <ActionButton
                url={`/api/proofs/${proofId}/owner`}
                method="PUT"
                body={{ userId: m.userId }}
                label="Make owner"
                confirmText={`Hand the ownership of this proof to ${m.name}? You keep your role.`}
              />
            )}
            {m.mayRemove && (
              <ActionButton
                url={`/api/proofs/${proofId}/members/${m.userId}`}
                method="DELETE"
                label={m.self ? "Leave the proof" : "Remove"}
                confirmText={
                  m.self ? "Leave this proof? What you wrote stays in the record." : `Remove ${m.name}? Their vouches, disputes and reports stay in the record.`
                }
              />
            )}
            <RoleTag role={m.role} />
          </span>
        </li>
      ))}
    </ul>
  );
}
