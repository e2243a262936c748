/**
 * A proof of an author made for one browser test, so that no demo person's mail or proofs change: the
 * author is a new user with a password (a database row: setup only), signs in through the real form and
 * makes the proof, its case and optionally a step through the API; the demo editor is made its editor.
 */
import bcrypt from "bcryptjs";
import type { Browser, Page } from "playwright-core";
import { db } from "./access-fixture";

export interface Person {
  name: string;
  email: string;
  password: string;
}

/** Signs this person in through the form and waits for the proofs page. */
export async function signInPerson(page: Page, baseUrl: string, who: Person): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel("E-mail").fill(who.email);
  await page.getByLabel("Password").fill(who.password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(`${baseUrl}/proofs`);
}

export async function proofOfNewAuthor(
  browser: Browser,
  baseUrl: string,
  author: Person,
  proof: { title: string; statement: string; caseTitle: string; condition: string; step?: string },
): Promise<{ proofId: number; caseId: number; stepId: number | null }> {
  const hash = await bcrypt.hash(author.password, 4);
  await db((c) =>
    c.query("INSERT INTO users (email, name, password_hash, role, created_at, updated_at) VALUES (?, ?, ?, 'member', NOW(3), NOW(3))", [
      author.email,
      author.name,
      hash,
    ]),
  );
  const context = await browser.newContext();
  await signInPerson(await context.newPage(), baseUrl, author);
  const api = async (method: string, path: string, data?: unknown) => {
    const res = await context.request.fetch(`${baseUrl}${path}`, { method, data, headers: { origin: baseUrl } });
    if (!res.ok()) throw new Error(`${method} ${path}: ${res.status()} ${await res.text()}`);
    return res.json();
  };
  const proofId: number = (await api("POST", "/api/proofs", { title: proof.title, statement: proof.statement })).proof.id;
  const caseId: number = (await api("POST", `/api/proofs/${proofId}/cases`, { title: proof.caseTitle, condition: proof.condition, parentId: null })).case.id;
  const stepId: number | null = proof.step ? (await api("POST", `/api/proofs/${proofId}/cases/${caseId}/steps`, { body: proof.step })).step.id : null;
  await db(async (c) => {
    const [editor] = await c.query("SELECT id FROM users WHERE email = 'dov.ashgrove@tarnhollow.example'");
    await c.query("INSERT INTO proof_members (proof_id, user_id, role, created_at) VALUES (?, ?, 'editor', NOW(3))", [proofId, editor.id]);
  });
  await context.close();
  return { proofId, caseId, stepId };
}
