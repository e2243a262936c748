import { z } from "./zod";

/** The account page's password change: the current password proves it is the person, not a borrowed session. */
export const changePasswordSchema = z.object({
  currentPassword: z.string().min(1, "Enter your current password.").max(200),
  newPassword: z.string().min(10, "Use at least 10 characters.").max(200, "Use at most 200 characters."),
});

export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;
