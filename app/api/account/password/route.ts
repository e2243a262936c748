import { BODY_LIMITS, readBody, route } from "@/lib/http";
import { requireUser } from "@/lib/session";
import { changePassword } from "@/lib/data/users";
import { changePasswordSchema } from "@/lib/validations/account";

/**
 * Changes the signed-in person's password (the current one is required: 422 when it is wrong, 429 while
 * sign-in is locked for the address). Every session of the person ends, this one included: they sign
 * in again with the new password.
 */
export const POST = route(async (request: Request) => {
  const user = await requireUser();
  const input = await readBody(request, changePasswordSchema, BODY_LIMITS.small);
  await changePassword(user, input.currentPassword, input.newPassword);
  return Response.json({ ok: true, signedOut: true });
});
