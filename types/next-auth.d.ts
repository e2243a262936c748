import type { DefaultSession } from "next-auth";
import type { GlobalRole } from "@/models/user";

declare module "next-auth" {
  interface User {
    id: string;
    role: GlobalRole;
    sessionVersion: number;
  }
  interface Session {
    user: { id: string; role: GlobalRole; sessionVersion?: number } & DefaultSession["user"];
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    role?: GlobalRole;
    /** users.session_version at sign-in. */
    sv?: number;
  }
}
