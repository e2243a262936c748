/**
 * next-auth options: e-mail and password (bcrypt), JWT sessions carrying the user id, global role and
 * session version. The version is checked against the database on every request (lib/session.ts), so
 * sign-out (below) and a password change end a session before its 8 h are up.
 */
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { authenticate, endSessions, sessionIsCurrent } from "@/lib/data/users";
import { signInSchema } from "@/lib/validations/sign-in";
import { AppError } from "@/lib/errors";

/** The one message for an unknown address or a wrong password: it must not say which. */
export const NEUTRAL_SIGN_IN_ERROR = "The e-mail address or password is not right.";

/** Thrown by the jwt callback for a token of an ended session: next-auth then answers an empty session and clears the cookie. */
const SESSION_ENDED = "cairn: this session has ended (signed out or password changed)";

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: 8 * 60 * 60 },
  pages: { signIn: "/sign-in" },
  providers: [
    CredentialsProvider({
      name: "E-mail and password",
      credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
      async authorize(credentials) {
        const parsed = signInSchema.safeParse(credentials ?? {});
        if (!parsed.success) throw new Error(NEUTRAL_SIGN_IN_ERROR);
        try {
          const user = await authenticate(parsed.data.email, parsed.data.password);
          if (!user) throw new Error(NEUTRAL_SIGN_IN_ERROR);
          return { id: String(user.id), email: user.email, name: user.name, role: user.role, sessionVersion: user.sessionVersion };
        } catch (e) {
          if (e instanceof AppError) throw new Error(e.message);
          throw e;
        }
      },
    }),
  ],
  callbacks: {
    /**
     * On sign-in, the token takes the person's session version. On every later read (GET /api/auth/session, the
     * browser's useSession, getServerSession) a token whose version is no longer the person's is refused, so a
     * cookie kept after sign-out reads as signed out there too, not only in lib/session.ts. A database that does not
     * answer keeps the token (lib/session.ts then answers 503): an outage must not sign anyone out.
     */
    async jwt({ token, user }) {
      if (user) {
        token.role = user.role;
        token.sv = user.sessionVersion;
        return token;
      }
      const id = Number(token.sub);
      if (typeof token.sv !== "number" || !Number.isInteger(id) || id <= 0) throw new Error(SESSION_ENDED);
      let current: boolean;
      try {
        current = await sessionIsCurrent(id, token.sv);
      } catch {
        return token;
      }
      if (!current) throw new Error(SESSION_ENDED);
      return token;
    },
    session({ session, token }) {
      session.user.id = token.sub!;
      session.user.role = token.role ?? "member";
      session.user.sessionVersion = token.sv;
      return session;
    },
  },
  logger: {
    // An ended session is an expected answer (an empty session), not an error worth a stack trace in the log.
    error(code, metadata) {
      const message = metadata instanceof Error ? metadata.message : (metadata as { error?: Error } | undefined)?.error?.message;
      if (message === SESSION_ENDED) return;
      console.error(`[next-auth][error][${code}]`, metadata);
    },
  },
  events: {
    // The cookie is cleared by next-auth; the version bump makes a copy of it worthless too.
    async signOut({ token }) {
      const id = Number(token?.sub);
      if (Number.isInteger(id) && id > 0 && typeof token.sv === "number") await endSessions(id, token.sv);
    },
  },
};
