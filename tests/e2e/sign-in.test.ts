import { describe, expect, inject, it } from "vitest";
import { browserForFile, signInAs } from "./browser";
import { demoProof } from "@/seeders/demo-content";

const baseUrl = inject("baseUrl");
const browser = browserForFile();

describe("sign-in in the browser", () => {
  it("sends a signed-out visitor of /proofs to the sign-in page", async () => {
    const page = await browser().newPage();
    await page.goto(`${baseUrl}/proofs`);
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    await page.close();
  });

  it("shows the neutral message for a wrong password and stays signed out", async () => {
    const page = await browser().newPage();
    await signInAs(page, baseUrl, "coauthor", "not-the-password");
    const failure = page.getByTestId("sign-in-failure");
    await failure.waitFor();
    expect(await failure.textContent()).toBe("The e-mail address or password is not right.");
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    await page.close();
  });

  it("signs a demo author in through the form and lists their proofs with their role", async () => {
    const context = await browser().newContext();
    const page = await context.newPage();
    await signInAs(page, baseUrl, "author");
    await page.waitForURL(`${baseUrl}/proofs`);
    const list = page.getByTestId("proof-list");
    await list.waitFor();
    expect(await list.textContent()).toContain(demoProof.title);
    expect(await list.locator("[data-role]").first().getAttribute("data-role")).toBe("author");
    expect(await page.getByTestId("current-user").textContent()).toContain("Ada Quenby");

    // The proof opens with its numbered cases and rendered math.
    await page.getByRole("link", { name: demoProof.title }).click();
    await page.getByText("Case 3.2", { exact: true }).waitFor();
    expect(await page.locator(".katex").count()).toBeGreaterThan(5);
    await context.close();
  });
});
