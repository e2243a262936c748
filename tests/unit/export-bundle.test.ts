import { execFile } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { checkBundle, sealBundle, type Bundle } from "@/lib/core/certificates/bundle";
import { buildBundle } from "@/lib/export/bundle";
import { certificationOf } from "@/lib/export/snapshot";
import { settledSnapshot, verifiedClaim } from "./export-fixture";

const dir = mkdtempSync(join(tmpdir(), "cairn-bundle-test-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const fresh = (): Bundle => buildBundle(settledSnapshot(), { kind: "certified", exportedAt: "2026-12-01T10:00:00.000Z", exportedBy: "Ada Quenby" });
const copy = (b: Bundle) => JSON.parse(JSON.stringify(b)) as Record<string, any>;

/** Runs the offline checker command (`npm run check -- FILE`) on a bundle written to disk. */
function runChecker(json: unknown, name: string): Promise<{ code: number; out: string }> {
  const file = join(dir, name);
  writeFileSync(file, JSON.stringify(json, null, 2));
  return new Promise((resolve) => {
    execFile("npm", ["run", "--silent", "check", "--", file], { cwd: process.cwd(), timeout: 60_000 }, (error, stdout, stderr) =>
      resolve({ code: error ? Number(error.code ?? 1) : 0, out: stdout + stderr }),
    );
  });
}

describe("bundle", () => {
  it("holds every item with its SHA-256 and a manifest digest, and re-checks clean", () => {
    const b = fresh();
    expect(b.format).toBe("cairn-bundle/1");
    expect(b.items.map((i) => i.id)).toEqual(["proof", "case 1", "step 1(a)", "claim 1(a)#1", "case 1.1", "step 1.1(a)", "claim 1.1(a)#1"]);
    for (const i of b.items) expect(i.sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(b.manifestDigest).toMatch(/^[0-9a-f]{64}$/);
    const r = checkBundle(copy(b), "b.json");
    expect(r.exitCode).toBe(0);
    expect(r.lines.filter((l) => l.label.startsWith("claim")).every((l) => l.status === "verified" && l.certificate?.matches)).toBe(true);
  });

  it("is deterministic: the same snapshot and time give the same manifest digest", () => {
    expect(fresh().manifestDigest).toBe(fresh().manifestDigest);
  });

  it("a changed character in a step fails and names the step", () => {
    const b = copy(fresh());
    const step = b.items.find((i: { id: string }) => i.id === "step 1.1(a)");
    step.data.revision.body = step.data.revision.body.replace("2", "3");
    const r = checkBundle(b, "b.json");
    expect(r.exitCode).toBe(1);
    expect(r.lines.find((l) => l.label === "step 1.1(a)")?.text).toMatch(/CHANGED since export/);
    expect(r.lines.find((l) => l.label === "manifest")?.text).toContain("step 1.1(a)");
  });

  it("a changed certificate entry fails the claim's re-check and names the claim", () => {
    const b = copy(fresh());
    const claim = b.items.find((i: { id: string }) => i.id === "claim 1.1(a)#1");
    const before = JSON.stringify(claim.data.certificate);
    // Change one entry of the evidence: the first number found in it.
    claim.data.certificate = JSON.parse(before.replace(/(\d+)/, (d) => String(Number(d) + 1)));
    expect(JSON.stringify(claim.data.certificate)).not.toBe(before);
    const r = checkBundle(b, "b.json");
    expect(r.exitCode).not.toBe(0);
    const line = r.lines.find((l) => l.label === "claim 1.1(a)#1")!;
    expect(line.status).not.toBe("verified");
    expect(line.text).toMatch(/CHANGED since export/);
  });

  it("a dynkin-data claim re-checks in the bundle; a forged marks entry is rejected even when every digest is re-sealed", () => {
    // E8 in Bourbaki's numbering (Plate VII): highest root 2α1 + 3α2 + 4α3 + 6α4 + 5α5 + 4α6 + 3α7 + 2α8; |W(E8)| = 696729600
    // (Humphreys, Reflection Groups and Coxeter Groups, Table 2.4).
    const snapshot = settledSnapshot();
    const e8 = verifiedClaim({
      id: "E8-data",
      kind: "dynkin-data",
      graph: { format: "edges", text: "n = 8\n0 2\n2 3\n3 4\n4 5\n5 6\n6 7\n1 3" },
      marks: [2, 3, 4, 6, 5, 4, 3, 2],
      weylGroupOrder: "696729600",
    });
    expect(e8.status).toBe("verified");
    snapshot.cases[0].steps[0].claims = [e8];
    const b = buildBundle(snapshot, { kind: "draft", exportedAt: "2026-12-01T10:00:00.000Z", exportedBy: "Ada Quenby" });
    const clean = checkBundle(copy(b), "b.json");
    const line = clean.lines.find((l) => l.label === "claim 1(a)#1")!;
    expect(line.status).toBe("verified");
    expect(line.certificate?.matches).toBe(true);
    const items = b.items.map((i) => {
      if (i.id !== "claim 1(a)#1") return i;
      const data = JSON.parse(JSON.stringify(i.data)) as { certificate: string | { evidence: { marks: number[] } } };
      const cert = typeof data.certificate === "string" ? JSON.parse(data.certificate) : data.certificate;
      cert.evidence.marks = [2, 3, 4, 5, 6, 4, 3, 2];
      return { ...i, data: { ...data, certificate: typeof data.certificate === "string" ? JSON.stringify(cert) : cert } };
    });
    const resealed = sealBundle(
      b.export,
      items.map(({ id, type, data }) => ({ id, type, data })),
    );
    const forged = checkBundle(copy(resealed), "b.json");
    expect(forged.exitCode).toBe(1);
    expect(forged.lines.find((l) => l.label === "claim 1(a)#1")?.certificate?.text).toMatch(/does NOT match: .*marks/);
  });

  it("an exported B5 dynkin-data claim re-checks with the offline checker command; forged marks, re-sealed, are refused by name", async () => {
    // B5 in Bourbaki's numbering (Plate II): highest root α1 + 2α2 + 2α3 + 2α4 + 2α5, h = 10, exponents 1, 3, 5, 7, 9;
    // |W(B5)| = 2⁵·5! = 3840 (Humphreys, Reflection Groups and Coxeter Groups, Table 2.4).
    const b5 = verifiedClaim({
      id: "B5-data",
      kind: "dynkin-data",
      type: "B5",
      coxeterNumber: 10,
      exponents: [1, 3, 5, 7, 9],
      marks: [1, 2, 2, 2, 2],
      weylGroupOrder: "3840",
    });
    expect(b5.status, b5.reason ?? "").toBe("verified");
    const snapshot = settledSnapshot(undefined, [b5]);
    const b = buildBundle(snapshot, { kind: "draft", exportedAt: "2026-12-01T10:00:00.000Z", exportedBy: "Ada Quenby" });
    const items = b.items.map((i) => {
      if (i.id !== "claim 1(a)#1") return i;
      const data = JSON.parse(JSON.stringify(i.data)) as { certificate: string | { evidence: { marks: number[] } } };
      const cert = typeof data.certificate === "string" ? JSON.parse(data.certificate) : data.certificate;
      // C5's marks (Plate III): a certificate for the other numbering must not pass for B5.
      cert.evidence.marks = [2, 2, 2, 2, 1];
      return { ...i, data: { ...data, certificate: typeof data.certificate === "string" ? JSON.stringify(cert) : cert } };
    });
    const resealed = sealBundle(
      b.export,
      items.map(({ id, type, data }) => ({ id, type, data })),
    );
    const [clean, forged] = await Promise.all([runChecker(b, "b5-clean.json"), runChecker(resealed, "b5-forged.json")]);
    expect(clean.code, clean.out).toBe(0);
    expect(clean.out).toMatch(/✓ verified\s+claim 1\(a\)#1/);
    expect(forged.code).toBe(1);
    expect(forged.out).toMatch(/certificate\.marks is \[2,2,2,2,1\]; recomputed for B5 it is \[1,2,2,2,2\]/);
  });

  it("a changed verdict fails even when the tamperer re-seals every digest", () => {
    const b = fresh();
    const items = b.items.map((i) =>
      i.id === "claim 1(a)#1" ? { ...i, data: { ...(i.data as object), verdict: { ...(i.data as { verdict: object }).verdict, status: "refuted" } } } : i,
    );
    // Re-seal honestly with the tampered data: digests all match, only the re-verification can catch it.
    const resealed = sealBundle(
      b.export,
      items.map(({ id, type, data }) => ({ id, type, data })),
    );
    const r = checkBundle(copy(resealed), "b.json");
    expect(r.exitCode).toBe(1);
    expect(r.lines.find((l) => l.label === "claim 1(a)#1")?.text).toMatch(/records "refuted" but the re-check gives "verified"/);
  });

  it("carries the method that decided with its certificate kind, and rejects a method naming another kind, even re-sealed", () => {
    const b = fresh();
    const claim = b.items.find((i) => i.id === "claim 1(a)#1")!.data as { verdict: { method: string } };
    // E8 is a tree: breadth-first search leaves a spanning forest (each vertex's parent).
    expect(claim.verdict.method).toBe("breadth-first search; certificate: spanning forest (parent of each vertex)");
    const items = b.items.map((i) =>
      i.id === "claim 1(a)#1"
        ? { ...i, data: { ...(i.data as object), verdict: { ...claim.verdict, method: "breadth-first search; certificate: Rayleigh vector" } } }
        : i,
    );
    const r = checkBundle(
      copy(
        sealBundle(
          b.export,
          items.map(({ id, type, data }) => ({ id, type, data })),
        ),
      ),
      "b.json",
    );
    expect(r.exitCode).toBe(1);
    expect(r.lines.find((l) => l.label === "claim 1(a)#1")?.text).toMatch(
      /the recorded method names a certificate of kind "Rayleigh vector" but the certificate carried is of kind "spanning forest/,
    );
  });

  it("each vouch carries the digest of the revision it covers (text and claims), and the re-check recomputes it", () => {
    const r = checkBundle(copy(fresh()), "b.json");
    const line = r.lines.find((l) => l.label === "step 1(a)")!;
    expect(line.status).toBe("verified");
    expect(line.text).toMatch(/revision 2 \(text and 1 claim\(s\)\) digests to .*; 1 vouch\(es\) cover exactly it/);
  });

  /** Re-seals a bundle after `edit` changed a step's data, so that only the vouch check can catch it. */
  const resealedWith = (stepId: string, edit: (data: any) => void) => {
    const b = fresh();
    const items = b.items.map((i) => {
      if (i.id !== stepId) return { id: i.id, type: i.type, data: i.data };
      const data = JSON.parse(JSON.stringify(i.data));
      edit(data);
      return { id: i.id, type: i.type, data };
    });
    return copy(sealBundle(b.export, items));
  };

  it("a vouch whose digest does not match its revision is rejected, even when every item digest is re-sealed", () => {
    const r = checkBundle(
      resealedWith("step 1(a)", (d) => (d.reviews[0].digest = "0".repeat(64))),
      "b.json",
    );
    expect(r.exitCode).toBe(1);
    const line = r.lines.find((l) => l.label === "step 1(a)")!;
    expect(line.status).toBe("refuted");
    expect(line.text).toMatch(/the vouch by Celia Marwood records digest 0000000000000000…, but revision 2 \(text and claims\) digests to/);
  });

  it("a vouch given before a claim was attached does not cover it: the revision's claim set must be the step's claims", () => {
    // The revision (and the vouch's digest) as it was before the claim: no claims; the bundle still lists the claim.
    const r = checkBundle(
      resealedWith("step 1(a)", (d) => {
        d.revision.claims = [];
      }),
      "b.json",
    );
    expect(r.exitCode).toBe(1);
    const line = r.lines.find((l) => l.label === "step 1(a)")!;
    expect(line.text).toMatch(/does not match its text and claims/);
    expect(line.text).toMatch(/the bundle's 1 claim\(s\) of this step are not the 0 claim\(s\)/);
  });

  it("a vouch on an older revision that is not marked superseded is rejected", () => {
    const r = checkBundle(
      resealedWith("step 1(a)", (d) => (d.reviews[0].revision = 1)),
      "b.json",
    );
    expect(r.exitCode).toBe(1);
    expect(r.lines.find((l) => l.label === "step 1(a)")?.text).toMatch(/on revision 1 is counted, but it does not cover revision 2/);
  });

  it("a changed export header (draft turned certified) fails at the manifest", () => {
    const b = copy(buildBundle(settledSnapshot(), { kind: "draft", exportedAt: "2026-12-01T10:00:00.000Z", exportedBy: "Ada Quenby" }));
    b.export.kind = "certified";
    const r = checkBundle(b, "b.json");
    expect(r.exitCode).toBe(1);
    expect(r.lines.find((l) => l.label === "manifest")?.text).toMatch(/manifest digest does not match/);
  });

  it("a claim exported before it was checked (pending) fails the re-check and says so", () => {
    const s = settledSnapshot();
    s.cases[0].steps[0].claims[0] = { ...s.cases[0].steps[0].claims[0], status: "pending", certificate: null, statement: null, method: null, reason: null };
    const r = checkBundle(copy(buildBundle(s, { kind: "draft", exportedAt: "2026-12-01T10:00:00.000Z", exportedBy: "Ada Quenby" })), "b.json");
    expect(r.exitCode).toBe(1);
    expect(r.lines.find((l) => l.label === "claim 1(a)#1")?.text).toMatch(/had not been checked when it was exported \(pending\)/);
  });

  it("a document that is not a bundle is malformed (exit 2)", () => {
    expect(checkBundle({ format: "cairn-bundle/1" }, "x").exitCode).toBe(2);
  });
});

describe("certification", () => {
  it("a settled snapshot is ready to certify; an open dispute blocks it with the reason", () => {
    expect(certificationOf(settledSnapshot())).toEqual({ state: "ready to certify", blockers: [] });
    const s = settledSnapshot();
    s.cases[0].steps[0].reviews.push({
      reviewerId: 3,
      reviewerName: "Celia Marwood",
      verdict: "dispute",
      revisionNumber: 2,
      disputeState: "raised",
      digest: null,
      at: "2026-11-30T13:00:00.000Z",
    });
    const c = certificationOf(s);
    expect(c.state).toBe("in progress");
    expect(c.blockers).toContain("Step 1(a) has 1 open dispute.");
  });
});

describe("the offline checker command on a bundle", () => {
  it("exits 0 on an untouched bundle and prints a per-claim report and a final line", async () => {
    const { code, out } = await runChecker(fresh(), "clean.json");
    expect(code).toBe(0);
    expect(out).toMatch(/✓ verified\s+claim 1\(a\)#1/);
    expect(out).toMatch(/✓ verified\s+claim 1.1\(a\)#1/);
    expect(out).toMatch(/✓ verified\s+step 1\(a\)\s+revision 2 \(text and 1 claim\(s\)\)/);
    // Two claims, two steps whose vouch digests match their revisions, and the manifest.
    expect(out.trim().split("\n").at(-1)).toBe("5 checked: 5 verified, 0 refuted, 0 undecided");
  });

  it("exits non-zero and names the item for a changed step character, certificate entry or verdict", async () => {
    const step = copy(fresh());
    step.items[2].data.revision.body += ".";
    const cert = copy(fresh());
    cert.items[6].data.certificate = JSON.parse(JSON.stringify(cert.items[6].data.certificate).replace(/(\d+)/, (d) => String(Number(d) + 1)));
    const verdict = copy(fresh());
    verdict.items[3].data.verdict.status = "undecided";
    const results = await Promise.all([runChecker(step, "step.json"), runChecker(cert, "cert.json"), runChecker(verdict, "verdict.json")]);
    expect(results.map((r) => r.code)).toEqual([1, 1, 1]);
    expect(results[0].out).toMatch(/✗ refuted\s+step 1\(a\)\s+CHANGED since export/);
    expect(results[1].out).toMatch(/claim 1.1\(a\)#1\s+CHANGED since export/);
    expect(results[2].out).toMatch(/claim 1\(a\)#1\s+CHANGED since export.*records "undecided" but the re-check gives "verified"/);
  });
});
