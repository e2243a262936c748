import type { DefaultSession } from "next-auth";
import type { GlobalRole } from "@/models/user";

declare module "next-auth" {
  interface User {
    id: string;
    role: GlobalRole;
  }
  interface Session {
    user: { id: string; role: GlobalRole } & DefaultSession["user"];
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    role?: GlobalRole;
  }
}
