/**
 * The route wrapper's guards (issue 10, defects 3 and 11): a state-changing request from another
 * site is refused with 403; a JSON body must say `application/json` (415); a body over the route's
 * limit is refused with 413 naming the limit, while it is being read (not after buffering it all).
 */
import { beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { actAs, jsonRequest, params, closeAfterAll } from "./helpers";
import { draftCaseStep, dropProofs } from "./workspace-fixture";
import { models } from "@/models";
import { BODY_LIMITS } from "@/lib/http";
import * as casesRoute from "@/app/api/proofs/[proofId]/cases/route";
import * as stepsRoute from "@/app/api/proofs/[proofId]/cases/[caseId]/steps/route";
import * as claimsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/claims/route";
import * as caseRoute from "@/app/api/proofs/[proofId]/cases/[caseId]/route";
import * as proofRoute from "@/app/api/proofs/[proofId]/route";

let proofId: string;
let caseId: number;

closeAfterAll(() => dropProofs([proofId]));
beforeAll(async () => {
  ({ proofId, caseId } = await draftCaseStep("Request guard test", "Trees"));
});

const stepCount = () => models().Step.count({ where: { caseId } });
const createStep = (init: RequestInit) =>
  stepsRoute.POST(new Request("http://localhost/api/x", { method: "POST", ...init }), params({ proofId, caseId: String(caseId) }));
const body = JSON.stringify({ body: "A step sent from somewhere else." });

describe("cross-site requests", () => {
  it("refuses a foreign Origin with text/plain (the probe's 201) and with application/json: 403, nothing written", async () => {
    await actAs("author");
    const before = await stepCount();
    for (const type of ["text/plain", "application/json"]) {
      const res = await createStep({ headers: { origin: "https://elsewhere.example", "content-type": type }, body });
      expect(res.status).toBe(403);
      const err = (await res.json()).error;
      expect(err.code).toBe("forbidden");
      expect(err.message).toMatch(/another site/);
    }
    expect(await stepCount()).toBe(before);
  });

  it("refuses Sec-Fetch-Site: cross-site and same-site, and Origin: null, on POST, PATCH and DELETE", async () => {
    await actAs("author");
    const headers: Record<string, string>[] = [{ "sec-fetch-site": "cross-site" }, { "sec-fetch-site": "same-site" }, { origin: "null" }];
    for (const h of headers) {
      expect((await createStep({ headers: { ...h, "content-type": "application/json" }, body })).status).toBe(403);
      const patch = await proofRoute.PATCH(
        new Request("http://localhost/x", { method: "PATCH", headers: { ...h, "content-type": "application/json" }, body: '{"title":"Taken"}' }),
        params({ proofId }),
      );
      expect(patch.status).toBe(403);
      const del = await caseRoute.DELETE(new Request("http://localhost/x", { method: "DELETE", headers: h }), params({ proofId, caseId: String(caseId) }));
      expect(del.status).toBe(403);
    }
    expect((await models().Case.findByPk(caseId))!.deletedAt).toBeNull();
  });

  it("accepts its own origin (Origin and Sec-Fetch-Site: same-origin), and reads from anywhere", async () => {
    await actAs("author");
    const own = await createStep({ headers: { origin: "http://localhost", "sec-fetch-site": "same-origin", "content-type": "application/json" }, body });
    expect(own.status).toBe(201);
    const read = await casesRoute.GET(
      new Request("http://localhost/x", { headers: { origin: "https://elsewhere.example", "sec-fetch-site": "cross-site" } }),
      params({ proofId }),
    );
    expect(read.status).toBe(200);
  });
});

describe("content type", () => {
  it("answers 415 for a JSON body sent as text/plain, form data or with no type; nothing written", async () => {
    await actAs("author");
    const before = await stepCount();
    for (const headers of [{ "content-type": "text/plain" }, { "content-type": "application/x-www-form-urlencoded" }, {} as Record<string, string>]) {
      const res = await createStep({ headers, body });
      expect(res.status).toBe(415);
      expect((await res.json()).error.message).toMatch(/application\/json/);
    }
    expect(await stepCount()).toBe(before);
    expect((await createStep({ headers: { "content-type": "application/json; charset=utf-8" }, body })).status).toBe(201);
  });
});

describe("body size", () => {
  it("answers 413 naming the limit when the declared length is over it", async () => {
    await actAs("author");
    const res = await proofRoute.PATCH(
      new Request("http://localhost/x", {
        method: "PATCH",
        headers: { "content-type": "application/json", "content-length": String(BODY_LIMITS.text + 1) },
        body: '{"title":"x"}',
      }),
      params({ proofId }),
    );
    expect(res.status).toBe(413);
    const err = (await res.json()).error;
    expect(err.code).toBe("too_large");
    expect(err.message).toContain("2 MiB");
  });

  it("stops reading an undeclared stream at the limit: a claims request that would be 64 MiB is cut after about 16 MiB", async () => {
    await actAs("author");
    const stepId = String((await models().Step.findOne({ where: { caseId } }))!.id);
    const chunk = new Uint8Array(1024 * 1024).fill(0x61); // "aaaa…"
    let sent = 0;
    const stream = new ReadableStream<Uint8Array>({
      start(c) {
        c.enqueue(new TextEncoder().encode('{"claims":[{"format":"cairn-claim/1","kind":"spectral-radius-bound","graph":{"format":"graph6","text":"'));
      },
      pull(c) {
        if (sent >= 64) return c.close();
        sent++;
        c.enqueue(chunk);
      },
    });
    const res = await claimsRoute.POST(
      new Request("http://localhost/x", { method: "POST", headers: { "content-type": "application/json" }, body: stream, duplex: "half" } as RequestInit),
      params({ proofId, stepId }),
    );
    expect(res.status).toBe(413);
    expect((await res.json()).error.message).toContain("16 MiB");
    expect(sent).toBeLessThanOrEqual(18); // the reader gave up near the limit, not after 64 MiB
    expect(await models().Claim.count({ where: { stepId } })).toBe(0);
  });

  it("keeps small routes small: a case with a 100 KiB title is 413 (limit 64 KiB), not a 422 after reading it", async () => {
    await actAs("author");
    const res = await casesRoute.POST(jsonRequest("/x", "POST", { title: "t".repeat(100 * 1024), condition: "" }), params({ proofId }));
    expect(res.status).toBe(413);
    expect((await res.json()).error.message).toContain("64 KiB");
  });
});
