/**
 * The people of the permission matrix, on the seeded demo proof: anonymous; signed-in without any proof;
 * a member of another proof only; a site admin who is not on the proof; a reviewer invited to one case
 * (case-limited); the demo reviewer, co-author, owner and editor. The two people the seed lacks are added
 * straight into the browser tests' database (same password as the demo accounts). Also: a deleted case
 * with a sub-case and a step under it, and a draft export, so that every page has something to show.
 */
import * as mariadb from "mariadb";
import type { Browser, BrowserContext } from "playwright-core";
import { browserForFile, signedInContext } from "./browser";
import { demoPeople } from "@/seeders/demo-content";

export const ROLES = ["anonymous", "nonmember", "otherProof", "admin", "caseLimited", "reviewer", "coauthor", "owner", "editor"] as const;
export type Role = (typeof ROLES)[number];

/** Seed keys of the demo people, and the two added here. */
const SEED_KEY: Partial<Record<Role, string>> = {
  otherProof: "outsider",
  admin: "admin",
  reviewer: "reviewer",
  coauthor: "coauthor",
  owner: "author",
  editor: "editor",
};
export const ADDED = {
  nonmember: { name: "Hal Wrenfield", email: "hal.wrenfield@tarnhollow.example" },
  caseLimited: { name: "Gil Ravensworth", email: "gil.ravensworth@tarnhollow.example" },
};

export interface Fixture {
  proofId: number;
  /** The case-limited reviewer's case (with everything below it) and the titles of all other cases, live or deleted. */
  inScopeTitles: string[];
  outOfScopeTitles: string[];
  stepIn: number;
  stepOut: number;
  /** A step under a deleted parent case. */
  stepGone: number;
  exportId: number;
  contexts: Record<Role, BrowserContext>;
}

interface TreeCase {
  id: number;
  title: string;
  steps: Array<{ id: number }>;
  children: TreeCase[];
}
const flat = (nodes: TreeCase[]): TreeCase[] => nodes.flatMap((n) => [n, ...flat(n.children)]);

export async function db<T>(run: (c: mariadb.Connection) => Promise<T>): Promise<T> {
  const url = new URL(process.env.CAIRN_E2E_DATABASE_URL!);
  const c = await mariadb.createConnection({
    host: url.hostname,
    port: Number(url.port),
    user: decodeURIComponent(url.username),
    password: decodeURIComponent(url.password),
    database: url.pathname.slice(1),
  });
  try {
    return await run(c);
  } finally {
    await c.end();
  }
}

async function signedIn(browser: Browser, baseUrl: string, email: string | null): Promise<BrowserContext> {
  return email === null ? browser.newContext() : signedInContext(browser, baseUrl, email);
}

export async function buildFixture(browser: Browser, baseUrl: string): Promise<Fixture> {
  const owner = await signedIn(browser, baseUrl, demoPeople.find((p) => p.key === "author")!.email);
  const api = async (method: string, path: string, data?: unknown) => {
    const res = await owner.request.fetch(`${baseUrl}${path}`, { method, data, headers: { origin: baseUrl } });
    if (!res.ok()) throw new Error(`${method} ${path}: ${res.status()} ${await res.text()}`);
    return res.json();
  };
  const { proofs } = await api("GET", "/api/proofs");
  const proofId: number = proofs.find((p: { title: string }) => p.title.startsWith("Trees with spectral radius"))!.id;

  // A deleted case with a sub-case and a step: the step is gone for everyone, its titles are not the reviewer's.
  const { case: parent } = await api("POST", `/api/proofs/${proofId}/cases`, { title: "Withdrawn split Qv7", condition: "" });
  const { case: child } = await api("POST", `/api/proofs/${proofId}/cases`, { parentId: parent.id, title: "Withdrawn sub-case Qv7", condition: "" });
  const { step: gone } = await api("POST", `/api/proofs/${proofId}/cases/${child.id}/steps`, { body: "A step under a case that will be deleted." });
  await api("DELETE", `/api/proofs/${proofId}/cases/${parent.id}`, { confirm: true });
  const { export: made } = await api("POST", `/api/proofs/${proofId}/exports`, { kind: "draft" });

  const roots: TreeCase[] = (await api("GET", `/api/proofs/${proofId}/cases`)).cases;
  const scopeRoot = roots.find((r) => flat([r]).some((c) => c.steps.length > 0))!;
  const inScope = flat([scopeRoot]);
  const others = flat(roots.filter((r) => r.id !== scopeRoot.id));
  const stepOut = others.find((c) => c.steps.length > 0)!.steps[0].id;

  await db(async (c) => {
    for (const person of Object.values(ADDED))
      await c.query("INSERT IGNORE INTO users (email, name, password_hash, role) SELECT ?, ?, password_hash, 'member' FROM users WHERE email = ?", [
        person.email,
        person.name,
        demoPeople.find((p) => p.key === "outsider")!.email,
      ]);
    const [gil] = await c.query("SELECT id FROM users WHERE email = ?", [ADDED.caseLimited.email]);
    await c.query("INSERT IGNORE INTO proof_members (proof_id, user_id, role) VALUES (?, ?, 'reviewer')", [proofId, gil.id]);
    await c.query("INSERT IGNORE INTO reviewer_scopes (proof_id, user_id, case_id) VALUES (?, ?, ?)", [proofId, gil.id, scopeRoot.id]);
  });

  const contexts = {} as Record<Role, BrowserContext>;
  for (const role of ROLES) {
    if (role === "owner") contexts.owner = owner;
    else if (role === "anonymous") contexts.anonymous = await signedIn(browser, baseUrl, null);
    else if (role === "nonmember" || role === "caseLimited") contexts[role] = await signedIn(browser, baseUrl, ADDED[role].email);
    else contexts[role] = await signedIn(browser, baseUrl, demoPeople.find((p) => p.key === SEED_KEY[role])!.email);
  }
  // The member of another proof has one of her own.
  await contexts.otherProof.request.post(`${baseUrl}/api/proofs`, { data: { title: "Fen's own proof", statement: "x" }, headers: { origin: baseUrl } });

  return {
    proofId,
    inScopeTitles: inScope.map((c) => c.title),
    outOfScopeTitles: [...others.map((c) => c.title), "Withdrawn split Qv7", "Withdrawn sub-case Qv7"],
    stepIn: inScope.find((c) => c.steps.length > 0)!.steps[0].id,
    stepOut,
    stepGone: gone.id,
    exportId: made.id,
    contexts,
  };
}

/**
 * The fixture for a whole test file, built in the file's own browser before its first test. The object is filled
 * in then, so read it inside tests only.
 */
export function fixtureForFile(baseUrl: string): Fixture {
  const fx = {} as Fixture;
  browserForFile(async (browser) => {
    Object.assign(fx, await buildFixture(browser, baseUrl));
  }, 180_000);
  return fx;
}
