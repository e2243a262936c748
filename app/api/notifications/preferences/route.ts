import { BODY_LIMITS, readBody, route } from "@/lib/http";
import { requireUser } from "@/lib/session";
import { getEmailPreferences, setEmailPreference } from "@/lib/data/notifications";
import { emailPreferenceSchema } from "@/lib/validations/review";

/** Which kinds of notification also come by e-mail. */
export const GET = route(async () => {
  const user = await requireUser();
  return Response.json({ email: await getEmailPreferences(user.id) });
});

/** Turns e-mail on or off for one kind. */
export const PUT = route(async (request: Request) => {
  const user = await requireUser();
  const { kind, email } = await readBody(request, emailPreferenceSchema, BODY_LIMITS.small);
  await setEmailPreference(user.id, kind, email);
  return Response.json({ email: await getEmailPreferences(user.id) });
});
