import "server-only";
import { createHash } from "node:crypto";
import bcrypt from "bcryptjs";
import { models } from "@/models";
import type { GlobalRole } from "@/models/user";
import { AppError } from "@/lib/errors";

export interface SessionUser {
  id: number;
  email: string;
  name: string;
  role: GlobalRole;
}

/** After this many consecutive failures for one e-mail address, sign-in is refused for LOCK_MINUTES. */
export const MAX_FAILURES = 5;
export const LOCK_MINUTES = 15;

// Compared against when the address is unknown, so that both failures cost one bcrypt comparison.
const DUMMY_HASH = "$2b$10$PGVqk1MeudNn82psbwQ/ouLkStF7/LYMGPeGE6LHbqhEBn1msGuYK";

const throttleKey = (email: string) => createHash("sha256").update(`sign-in:${email.trim().toLowerCase()}`).digest("hex");

/**
 * Checks an e-mail and password. Returns the user, or null for a wrong address or password alike
 * (the caller shows one neutral message). Throws `rate_limited` while the address is locked.
 */
export async function authenticate(email: string, password: string): Promise<SessionUser | null> {
  const { User, SignInThrottle } = models();
  const keyHash = throttleKey(email);
  const throttle = await SignInThrottle.findByPk(keyHash);
  if (throttle?.lockedUntil && throttle.lockedUntil > new Date()) {
    const minutes = Math.ceil((throttle.lockedUntil.getTime() - Date.now()) / 60_000);
    throw new AppError("rate_limited", `Too many failed sign-ins for this address. Try again in ${minutes} minute${minutes === 1 ? "" : "s"}.`);
  }
  const user = await User.findOne({ where: { email: email.trim().toLowerCase() } });
  const ok = await bcrypt.compare(password, user?.passwordHash ?? DUMMY_HASH);
  if (user && user.passwordHash && ok) {
    if (throttle) await throttle.destroy();
    return { id: user.id, email: user.email, name: user.name, role: user.role };
  }
  const failures = (throttle?.failures ?? 0) + 1;
  const lockedUntil = failures >= MAX_FAILURES ? new Date(Date.now() + LOCK_MINUTES * 60_000) : null;
  await SignInThrottle.upsert({ keyHash, failures: lockedUntil ? 0 : failures, lockedUntil });
  return null;
}

export async function getUser(id: number): Promise<SessionUser | null> {
  const { User } = models();
  const u = await User.findByPk(id);
  return u ? { id: u.id, email: u.email, name: u.name, role: u.role } : null;
}
