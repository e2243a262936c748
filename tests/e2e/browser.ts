/** Debian's Chromium driven by playwright-core: no browser download, headless, no calls out. */
import { afterAll, beforeAll } from "vitest";
import { chromium, type Browser, type BrowserContext, type Locator, type Page } from "playwright-core";
import { DEMO_PASSWORD, demoPeople, demoProof } from "@/seeders/demo-content";

export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    args: [
      "--no-sandbox",
      "--disable-gpu",
      "--disable-dev-shm-usage",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
      "--no-first-run",
      "--disable-quic",
    ],
  });
}

/**
 * One browser for the whole test file: launched (then `setup` run with it) before the first test, closed after the last.
 * Returns a getter, since the browser exists only once the file's tests start.
 */
export function browserForFile(setup?: (browser: Browser) => Promise<void>, timeout?: number): () => Browser {
  let browser: Browser | undefined;
  beforeAll(async () => {
    browser = await launchBrowser();
    await setup?.(browser);
  }, timeout);
  afterAll(async () => {
    await browser?.close();
  });
  return () => {
    if (!browser) throw new Error("the browser is launched before the file's first test");
    return browser;
  };
}

/** Fills in and sends the real sign-in form (it does not wait for where the form leads). */
export async function signInWithEmail(page: Page, baseUrl: string, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

/** Signs in through the real form as a demo person (it does not wait for where the form leads). */
export async function signInAs(page: Page, baseUrl: string, key: string, password = DEMO_PASSWORD): Promise<void> {
  await signInWithEmail(page, baseUrl, demoPeople.find((p) => p.key === key)!.email, password);
}

/** A new browser context signed in through the form with this e-mail address (waited for until the proofs page). */
export async function signedInContext(browser: Browser, baseUrl: string, email: string, password = DEMO_PASSWORD): Promise<BrowserContext> {
  const context = await browser.newContext();
  const page = await context.newPage();
  await signInWithEmail(page, baseUrl, email, password);
  await page.waitForURL(`${baseUrl}/proofs`);
  await page.close();
  return context;
}

/** Signs the demo author in, opens the demo proof from the proofs page and returns its id. */
export async function openDemoProofAsAuthor(page: Page, baseUrl: string): Promise<number> {
  return openDemoProofAs(page, baseUrl, "author");
}

/** Signs a demo person in, opens the demo proof from the proofs page and returns its id. */
export async function openDemoProofAs(page: Page, baseUrl: string, key: string): Promise<number> {
  await signInAs(page, baseUrl, key);
  await page.waitForURL(`${baseUrl}/proofs`);
  await page.getByRole("link", { name: demoProof.title }).click();
  await page.waitForURL(/\/proofs\/\d+$/);
  return Number(new URL(page.url()).pathname.split("/")[2]);
}

/** Signs the demo author in and opens the first step of the demo proof. */
export async function openDemoStepAsAuthor(page: Page, baseUrl: string): Promise<void> {
  await openDemoProofAsAuthor(page, baseUrl);
  const stepHref = await page.locator('a[href*="/steps/"]').first().getAttribute("href");
  await page.goto(`${baseUrl}${stepHref}`);
}

/** Opens the step editor on the step page, saves `text` as a new revision and waits for "Saved as revision N.". */
export async function saveNewRevision(page: Page, text: string, revision: number): Promise<void> {
  await page.getByTestId("step-edit").locator("summary").click();
  const box = page.getByLabel("step text (Markdown with $…$ math)");
  await box.waitFor();
  await box.fill(text);
  await page.getByRole("button", { name: "Save as new revision" }).click();
  await page.getByText(`Saved as revision ${revision}.`).waitFor();
}

/**
 * Starts a batch from the step page's batch form: every graph of the uploaded list `file` (of `count` graphs) against
 * "ρ `op` `bound`". Returns the batch's card: the newest over this list (other tests add batches to the same step).
 */
export async function startBatch(page: Page, file: string, count: number, op: string, bound: string): Promise<Locator> {
  const form = page.getByTestId("batch-form");
  await form.getByLabel("graph list").selectOption({ label: `${file} (${count} graphs)` });
  await form.getByLabel("relation").selectOption(op);
  await form.getByLabel("bound").fill(bound);
  await form.getByRole("button", { name: "Check every graph" }).click();
  return page.getByTestId("batch-card").filter({ hasText: file }).first();
}
