/**
 * Redirects signed-out visitors of workspace pages to the sign-in page. This is a convenience only:
 * every page, route handler and server action checks the session and the per-proof role itself.
 */
import { withAuth } from "next-auth/middleware";

export default withAuth({ pages: { signIn: "/sign-in" } });

export const config = {
  // Everything except the landing page, sign-in, invitation links (a new reviewer has no account yet), the API (handlers answer 401 themselves) and static files.
  matcher: ["/((?!$|sign-in|invitations/|api/|_next/|favicon|fonts/|.*\\.(?:svg|png|ico|woff2|css|js)$).+)"],
};
