/**
 * The blind sweep of the pages (the API, mail, notifications, timeline and export are swept in
 * tests/integration/blind-sweep.test.ts): the demo proof is switched to blind review, and every page an
 * author can open — the proof, its members, rounds, timeline, export and print view, each step, the
 * queues, notifications — is fetched as the owner and as the co-author. The HTML (with the data the
 * page streams to the browser) must hold neither the referee's name nor her address nor her user id in
 * an id field; it must show her as "Referee 1".
 */
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Browser, BrowserContext } from "playwright-core";
import { launchBrowser, signInAs } from "./browser";
import { db } from "./access-fixture";
import { demoPeople } from "@/seeders/demo-content";

const baseUrl = inject("baseUrl");
const referee = demoPeople.find((p) => p.key === "reviewer")!;
let browser: Browser;
let proofId = 0;
let refereeId = 0;
let exportId = 0;
let wasBlind = 0;
let stepIds: number[] = [];
const contexts: Record<"author" | "coauthor", BrowserContext | null> = { author: null, coauthor: null };

interface TreeCase {
  steps: Array<{ id: number }>;
  children: TreeCase[];
}
const flat = (nodes: TreeCase[]): TreeCase[] => nodes.flatMap((n) => [n, ...flat(n.children)]);

beforeAll(async () => {
  browser = await launchBrowser();
  for (const key of ["author", "coauthor"] as const) {
    const context = await browser.newContext();
    await signInAs(await context.newPage(), baseUrl, key);
    contexts[key] = context;
  }
  const api = async (method: string, path: string, data?: unknown) => {
    const res = await contexts.author!.request.fetch(`${baseUrl}${path}`, { method, data, headers: { origin: baseUrl } });
    if (!res.ok()) throw new Error(`${method} ${path}: ${res.status()} ${await res.text()}`);
    return res.json();
  };
  const { proofs } = await api("GET", "/api/proofs");
  proofId = proofs.find((p: { title: string }) => p.title.startsWith("Trees with spectral radius"))!.id;
  await db(async (c) => {
    const [row] = await c.query("SELECT blind_review AS b FROM proofs WHERE id = ?", [proofId]);
    wasBlind = Number(row.b);
    await c.query("UPDATE proofs SET blind_review = 1 WHERE id = ?", [proofId]);
    const [u] = await c.query("SELECT id FROM users WHERE email = ?", [referee.email]);
    refereeId = Number(u.id);
  });
  exportId = (await api("POST", `/api/proofs/${proofId}/exports`, { kind: "draft" })).export.id;
  stepIds = flat((await api("GET", `/api/proofs/${proofId}/cases`)).cases).flatMap((c) => c.steps.map((s) => s.id));
}, 120_000);

afterAll(async () => {
  if (proofId) await db((c) => c.query("UPDATE proofs SET blind_review = ? WHERE id = ?", [wasBlind, proofId]));
  await browser?.close();
});

/** The pages an author opens, with the proof's ids filled in. */
const pages = () => [
  "/proofs",
  "/queue",
  "/notifications",
  "/verdicts",
  `/proofs/${proofId}`,
  `/proofs/${proofId}/members`,
  `/proofs/${proofId}/rounds`,
  `/proofs/${proofId}/timeline`,
  `/proofs/${proofId}/export`,
  `/proofs/${proofId}/print/${exportId}`,
  `/proofs/${proofId}/desk`,
  ...stepIds.flatMap((s) => [`/proofs/${proofId}/steps/${s}`, `/queue/${proofId}/${s}`]),
];

describe("blind review on every page an author opens", () => {
  it("shows the owner and the co-author 'Referee 1', never the referee's name, address or user id", async () => {
    expect(stepIds.length).toBeGreaterThan(3);
    // An id field with the referee's id, in the HTML or in the data streamed with it (quotes may be escaped there).
    const idField = new RegExp(`(reviewerId|refereeId|authorId|userId|actorId|subjectId|memberId)\\\\?"\\s*:\\s*${refereeId}\\b`);
    const leaks: string[] = [];
    let shown = 0;
    for (const who of ["author", "coauthor"] as const) {
      for (const path of pages()) {
        const res = await contexts[who]!.request.get(`${baseUrl}${path}`, { maxRedirects: 0 });
        const html = await res.text();
        if (res.status() >= 500) leaks.push(`${who} ${path}: HTTP ${res.status()}`);
        if (res.status() === 200) shown++;
        for (const secret of [referee.name, referee.email]) if (html.includes(secret)) leaks.push(`${who} ${path} shows ${secret}`);
        if (idField.test(html)) leaks.push(`${who} ${path} holds the referee's user id: ${idField.exec(html)![0]}`);
        if (html.includes(`/members/${refereeId}`) || html.includes(`/scopes/${refereeId}`)) leaks.push(`${who} ${path} links to the referee's user id`);
      }
    }
    expect(leaks).toEqual([]);
    expect(shown).toBeGreaterThan(pages().length); // most pages answered 200 for both (the desk is the editor's)
    const step = await (await contexts.author!.request.get(`${baseUrl}/proofs/${proofId}/rounds`)).text();
    expect(step).toContain("Referee 1");
  }, 300_000);
});
