/**
 * Comments on the statement and on a case's condition, and "since your last visit", in the browser
 * (issue 15). Setup through the API and the database only (a new author, so that no demo person's mail
 * changes; the demo editor made the proof's editor): the editor comments on the statement and on case
 * 1's condition from the overview; the author's overview lists both at the top with links to the
 * threads and marks case 1 as changed; the author replies, marks the list seen, and it stays cleared;
 * the editor's overview then lists the author's reply.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchBrowser, signInAs } from "./browser";
import { proofOfNewAuthor, signInPerson } from "./new-author";

const baseUrl = inject("baseUrl");
const stamp = Date.now();
const AUTHOR = { name: "Perrin Ashdown", email: `perrin.ashdown.${stamp}@tarnhollow.example`, password: "perrin-writes-2026" };
let browser: Browser;
let proofId = 0;

const signInAuthor = (page: Page) => signInPerson(page, baseUrl, AUTHOR);

beforeAll(async () => {
  browser = await launchBrowser();
  ({ proofId } = await proofOfNewAuthor(browser, baseUrl, AUTHOR, {
    title: `Cycles are regular ${stamp}`,
    statement: "Every cycle $C_n$ is $2$-regular.",
    caseTitle: "Short cycles",
    condition: "$n \\le 5$",
  }));
}, 120_000);

afterAll(async () => {
  await browser?.close();
});

/** Posts a comment in a thread of the overview and waits until it shows (found by `marker`, a plain part of it). */
const post = async (page: Page, anchor: string, body: string, marker: string) => {
  const thread = page.locator(`#${anchor}`);
  if ((await thread.getAttribute("open")) === null) await thread.locator("summary").click();
  await thread.getByTestId("place-comment-form").getByRole("textbox").fill(body);
  await thread.getByTestId("place-comment-form").getByRole("button", { name: "Post" }).click();
  await thread.getByTestId("comment").filter({ hasText: marker }).first().waitFor();
};

describe("comments on the statement and conditions, and since your last visit", () => {
  it("the editor comments; the author sees it listed and marked, replies, marks it seen; the editor sees the reply", async () => {
    const overview = `${baseUrl}/proofs/${proofId}`;
    const editor = await (await browser.newContext()).newPage();
    await signInAs(editor, baseUrl, "editor");
    await editor.waitForURL(`${baseUrl}/proofs`);
    await editor.goto(overview);
    await post(editor, "statement-comments", "Is $C_3$ meant to be included?", "meant to be included?");
    await post(editor, "case-1-comments", "Why stop at five?", "Why stop at five?");
    expect(await editor.locator("#statement-comments .katex").count()).toBeGreaterThan(0);

    const author = await (await browser.newContext()).newPage();
    await signInAuthor(author);
    await author.goto(overview);
    const since = author.getByTestId("since-last-visit");
    await since.waitFor();
    const changes = since.getByTestId("change");
    expect(await changes.count()).toBe(2);
    expect(await changes.allTextContents()).toEqual([
      expect.stringContaining("Dov Ashgrove commented on the condition of case 1, “Short cycles”."),
      expect.stringContaining("Dov Ashgrove commented on the statement."),
    ]);
    expect(await changes.getByRole("link").evaluateAll((links) => links.map((a) => a.getAttribute("href")))).toEqual([
      `/proofs/${proofId}#case-1-comments`,
      `/proofs/${proofId}#statement-comments`,
    ]);
    await author.locator('[data-testid="case"][data-case-number="1"]').getByTestId("changed-mark").first().waitFor();
    // The link leads to the thread, which is open and shows the comment.
    await changes.getByRole("link").last().click();
    await author.waitForURL(`${overview}#statement-comments`);
    await author.locator("#statement-comments").getByText("meant to be included?").waitFor();
    await post(author, "statement-comments", "Yes: $n \\ge 3$ throughout.", "throughout.");

    await since.getByRole("button", { name: "Mark as seen" }).click();
    await since.waitFor({ state: "detached" });
    await author.reload();
    await author.locator("#statement-comments").waitFor();
    expect(await author.getByTestId("since-last-visit").count()).toBe(0);
    expect(await author.getByTestId("changed-mark").count()).toBe(0);

    await editor.reload();
    const editorSince = editor.getByTestId("since-last-visit");
    await editorSince.waitFor();
    expect(await editorSince.getByTestId("change").allTextContents()).toEqual([expect.stringContaining("Perrin Ashdown commented on the statement.")]);
  }, 240_000);
});
