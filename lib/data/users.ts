import "server-only";
import { createHash } from "node:crypto";
import bcrypt from "bcryptjs";
import { Op } from "sequelize";
import { getSequelize } from "@/lib/db";
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
      "INSERT INTO sign_in_throttles (key_hash, failures, locked_until, updated_at) VALUES (?, 0, NULL, NOW(3)) ON DUPLICATE KEY UPDATE updated_at = NOW(3)", {
      replacements: [keyHash],
      transaction,
    });
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
    return { id: user.id, email: user.email, name: user.name, role: user.role };
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
  return u ? { id: u.id, email: u.email, name: u.name, role: u.role } : null;
}
