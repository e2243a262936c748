import "server-only";
import { createHash } from "node:crypto";
import bcrypt from "bcryptjs";
import { Op } from "sequelize";
import { getSequelize } from "@/lib/db";
import { models } from "@/models";
import type { GlobalRole } from "@/models/user";
import { AppError, invalid } from "@/lib/errors";

export interface SessionUser {
  id: number;
  email: string;
  name: string;
  role: GlobalRole;
  /** Goes in the session token at sign-in; a token of an older version is no longer a session. */
  sessionVersion: number;
}

/** After this many consecutive failures for one e-mail address, sign-in is refused for LOCK_MINUTES. */
export const MAX_FAILURES = 5;
export const LOCK_MINUTES = 15;

// Compared against when the address is unknown, so that both failures cost one bcrypt comparison.
const DUMMY_HASH = "$2b$10$PGVqk1MeudNn82psbwQ/ouLkStF7/LYMGPeGE6LHbqhEBn1msGuYK";

const throttleKey = (email: string) => createHash("sha256").update(`sign-in:${email.trim().toLowerCase()}`).digest("hex");

const lockedMessage = (lockedUntil: Date) => {
  const minutes = Math.max(1, Math.ceil((lockedUntil.getTime() - Date.now()) / 60_000));
  return new AppError("rate_limited", `Too many failed sign-ins for this address. Try again in ${minutes} minute${minutes === 1 ? "" : "s"}.`);
};

/**
 * Counts an attempt against the address before its password is checked, under a row lock, so that
 * parallel attempts cannot all read the same count (a read, a bcrypt comparison and a write-back let
 * 25 parallel guesses through with 2 failures recorded). An attempt that finds MAX_FAILURES already
 * counted locks the address and is refused; an expired lock starts a fresh count.
 */
async function reserveAttempt(keyHash: string): Promise<void> {
  const { SignInThrottle } = models();
  await getSequelize().transaction(async (transaction) => {
    // An upsert takes the row's exclusive lock at once (INSERT IGNORE would take a shared one, and
    // two attempts upgrading it deadlock).
    await getSequelize().query(
      "INSERT INTO sign_in_throttles (key_hash, failures, locked_until, updated_at) VALUES (?, 0, NULL, NOW(3)) ON DUPLICATE KEY UPDATE updated_at = NOW(3)",
      {
        replacements: [keyHash],
        transaction,
      },
    );
    const row = await SignInThrottle.findByPk(keyHash, { transaction, lock: transaction.LOCK.UPDATE });
    if (!row) throw new Error("sign-in throttle row missing after insert");
    const now = new Date();
    if (row.lockedUntil && row.lockedUntil > now) throw lockedMessage(row.lockedUntil);
    const failures = row.lockedUntil ? 0 : row.failures; // a lock that has ended starts a fresh count
    if (failures >= MAX_FAILURES) {
      const lockedUntil = new Date(now.getTime() + LOCK_MINUTES * 60_000);
      await row.update({ failures: 0, lockedUntil }, { transaction });
      throw lockedMessage(lockedUntil);
    }
    await row.update({ failures: failures + 1, lockedUntil: null }, { transaction });
  });
}

/**
 * Checks an e-mail and password. Returns the user, or null for a wrong address or password alike
 * (the caller shows one neutral message). Throws `rate_limited` while the address is locked.
 */
export async function authenticate(email: string, password: string): Promise<SessionUser | null> {
  const { User, SignInThrottle } = models();
  const keyHash = throttleKey(email);
  await reserveAttempt(keyHash); // counted as a failure until the password proves right
  const user = await User.findOne({ where: { email: email.trim().toLowerCase() } });
  const ok = await bcrypt.compare(password, user?.passwordHash ?? DUMMY_HASH);
  if (user && user.passwordHash && ok) {
    await SignInThrottle.destroy({ where: { keyHash, lockedUntil: null } });
    return { id: user.id, email: user.email, name: user.name, role: user.role, sessionVersion: user.sessionVersion };
  }
  // The failure is already counted; the MAX_FAILURES-th one locks the address at once.
  await SignInThrottle.update(
    { lockedUntil: new Date(Date.now() + LOCK_MINUTES * 60_000), failures: 0 },
    { where: { keyHash, lockedUntil: null, failures: { [Op.gte]: MAX_FAILURES } } },
  );
  return null;
}

export async function getUser(id: number): Promise<SessionUser | null> {
  const { User } = models();
  const u = await User.findByPk(id);
  return u ? { id: u.id, email: u.email, name: u.name, role: u.role, sessionVersion: u.sessionVersion } : null;
}

/**
 * Whether a session token issued under `version` is still a session: the person exists and has not
 * signed out or changed their password since. Asked on every request that reads the session (lib/session.ts).
 */
export async function sessionIsCurrent(userId: number, version: number): Promise<boolean> {
  const u = await models().User.findByPk(userId, { attributes: ["sessionVersion"] });
  return u !== null && u.sessionVersion === version;
}

/**
 * Ends every session of the person (sign-out ends them on every device: one version per person).
 * With `version`, only if the sessions are still of that version, so a replayed old token changes nothing.
 */
export async function endSessions(userId: number, version?: number): Promise<void> {
  await models().User.increment("sessionVersion", { by: 1, where: { id: userId, ...(version === undefined ? {} : { sessionVersion: version }) } });
}

/**
 * Sets a new password once the current one is proved (counted against sign-in failures like a sign-in:
 * 429 while the address is locked), and ends every session of the person in the same statement.
 */
export async function changePassword(user: { id: number; email: string }, currentPassword: string, newPassword: string): Promise<void> {
  const proved = await authenticate(user.email, currentPassword);
  if (!proved || proved.id !== user.id)
    throw invalid("This is not your current password; nothing was changed.", [{ path: "currentPassword", message: "This is not your current password." }]);
  const hash = await bcrypt.hash(newPassword, 10);
  await getSequelize().query("UPDATE users SET password_hash = ?, session_version = session_version + 1, updated_at = NOW(3) WHERE id = ?", {
    replacements: [hash, user.id],
  });
}
