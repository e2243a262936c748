/** The case form's machine-readable condition in the browser: read in words as it is typed, problems with their JSON path, saved and shown on the case. */
import { describe, expect, inject, it } from "vitest";
import { browserForFile, signedInContext } from "./browser";
import { demoPeople } from "@/seeders/demo-content";

const baseUrl = inject("baseUrl");
const browser = browserForFile();

describe("the case form's condition box", () => {
  it("reads a condition with a looped pattern in words as it is typed, names the path of a mistake, and saves it on the sub-case", async () => {
    const context = await signedInContext(browser(), baseUrl, demoPeople.find((p) => p.key === "author")!.email);
    const page = await context.newPage();
    // A proof of its own (through the API), so the demo proof stays as other files expect it.
    const post = async (path: string, data: unknown) => (await page.request.post(`${baseUrl}${path}`, { data })).json();
    const { proof } = await post("/api/proofs", { title: "Graphs with a looped end", statement: "$\\rho(G) \\le 2$" });
    await post(`/api/proofs/${proof.id}/cases`, { title: "Connected graphs with loops", condition: "" });
    await page.goto(`${baseUrl}/proofs/${proof.id}`);

    const actions = page.getByTestId("case-actions-1");
    await actions.locator("summary").click();
    await actions.getByRole("button", { name: "Add a sub-case" }).click();
    const form = page.getByTestId("add-sub-case");
    await form.getByLabel("Sub-case title").fill("A loop at the end of an edge");
    const box = form.getByLabel("machine-readable condition");
    const reading = form.getByTestId("condition-reading");

    // The guide lists every predicate with an example, from the core's table.
    await form.getByTestId("condition-guide").locator("summary").click();
    for (const word of ["max-degree", "branch-vertices", "loops", "leg-lengths", "contains", "not"])
      await form
        .getByTestId("condition-guide")
        .locator("dt", { hasText: new RegExp(`^${word}$`) })
        .waitFor();

    // Unfinished JSON, then a wrong relation: the problem is shown at once with its JSON path.
    await box.fill('{ "predicate": "contains", "graph": { "format": "edges", "text": "0 1\\n1 1" }');
    await reading.getByTestId("condition-problem").filter({ hasText: "not valid JSON" }).waitFor();
    const looped = '{ "predicate": "contains", "graph": { "format": "edges", "text": "0 1\\n1 1" } }';
    await box.fill(`{ "and": [ ${looped}, { "predicate": "max-degree", "relation": "<<", "value": 3 } ] }`);
    await reading.getByTestId("condition-problem").filter({ hasText: "$.and[1].relation" }).waitFor();
    // Fixed: the condition in words, the looped pattern (an edge with a loop at one end) by its name, not its sparse6 text.
    await box.fill(`{ "and": [ ${looped}, { "predicate": "max-degree", "relation": "<=", "value": 3 } ] }`);
    await reading
      .filter({ hasText: /reads\s*G contains the tadpole T2 \(a path on 2 vertices with a loop at one end\) as a subgraph and Δ\(G\) ≤ 3/ })
      .waitFor();
    const words = (await reading.textContent())!.replace(/^.*reads\s*/, "").trim();

    await form.getByRole("button", { name: "Add sub-case" }).click();
    const saved = page.locator('[data-case-number="1.1"]');
    await saved.locator("h3", { hasText: "A loop at the end of an edge" }).waitFor();
    const shown = saved.getByTestId("case-predicate").first();
    await shown.waitFor();
    expect(await shown.textContent()).toContain(words);
    await context.close();
  });
});
