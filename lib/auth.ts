/**
 * next-auth options: e-mail and password (bcrypt), JWT sessions carrying the user id, global role and
 * session version. The version is checked against the database on every request (lib/session.ts), so
 * sign-out (below) and a password change end a session before its 8 h are up.
 */
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { authenticate, endSessions } from "@/lib/data/users";
import { signInSchema } from "@/lib/validations/sign-in";
import { AppError } from "@/lib/errors";

/** The one message for an unknown address or a wrong password: it must not say which. */
export const NEUTRAL_SIGN_IN_ERROR = "The e-mail address or password is not right.";

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
    jwt({ token, user }) {
      if (user) {
        token.role = user.role;
        token.sv = user.sessionVersion;
      }
      return token;
    },
    session({ session, token }) {
      session.user.id = token.sub!;
      session.user.role = token.role ?? "member";
      session.user.sessionVersion = token.sv;
      return session;
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
