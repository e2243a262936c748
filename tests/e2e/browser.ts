/** Debian's Chromium driven by playwright-core: no browser download, headless, no calls out. */
import { afterAll, beforeAll } from "vitest";
import { chromium, type Browser, type Page } from "playwright-core";
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

/** Signs in through the real form as a demo person and waits for the proofs page. */
export async function signInAs(page: Page, baseUrl: string, key: string, password = DEMO_PASSWORD): Promise<void> {
  const person = demoPeople.find((p) => p.key === key)!;
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel("E-mail").fill(person.email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

/** Signs the demo author in, opens the demo proof from the proofs page and returns its id. */
export async function openDemoProofAsAuthor(page: Page, baseUrl: string): Promise<number> {
  await signInAs(page, baseUrl, "author");
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
