import { z } from "./zod";

export const invitationSchema = z
  .object({
    // 254 characters is the longest address mail can carry (RFC 5321), and the width of the stored column.
    email: z.string().trim().toLowerCase().max(254, "An e-mail address has at most 254 characters.").email("Enter an e-mail address such as name@example.org."),
    scope: z.enum(["proof", "cases"], { error: "Invite to the whole proof or to chosen cases." }),
    // Coerced: checkbox values arrive as strings from the form.
    caseIds: z.array(z.coerce.number().int().positive()).max(500).optional(),
    // The role the invitation grants; a referee unless said otherwise.
    role: z.enum(["author", "reviewer", "editor"], { error: "Invite as a co-author (author), a referee (reviewer) or an editor." }).default("reviewer"),
  })
  .refine((v) => v.scope === "proof" || (v.caseIds?.length ?? 0) > 0, { path: ["caseIds"], message: "Choose at least one case." })
  .refine((v) => v.role === "reviewer" || v.scope === "proof", {
    path: ["scope"],
    message: "Only referees are invited to chosen cases; co-authors and editors join the whole proof.",
  });
export type InvitationInput = z.infer<typeof invitationSchema>;

/** Accepting while signed out creates the account: a name and a password. */
export const newAccountSchema = z.object({
  name: z.string().trim().min(1, "Enter your name as colleagues know it.").max(120),
  password: z.string().min(10, "Use at least 10 characters.").max(200),
});

export const acceptInvitationSchema = z.object({
  name: z.string().max(120).optional(),
  password: z.string().max(200).optional(),
});
export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;
