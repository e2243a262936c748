import { describe, expect, it } from "vitest";
import { makeGraph } from "../graph";
import { checkRayleighCertificate, checkVectorCertificate, recheckVectorCertificate } from "./vector";
import { path, star, affineD, disjointUnion } from "../input/constructors";

/** Extended E8 in the benchmark vertex order: path 0..7 plus (5, 8). */
const affineE8 = makeGraph(9, [...Array.from({ length: 7 }, (_, i) => ({ u: i, v: i + 1 })), { u: 5, v: 8 }]);
// The marks (null vector of 2I - A) in that order (Bourbaki, Lie Groups Ch. 4-6, Plate VII; Brouwer & Haemers §3.1.1).
const E8_MARKS = ["1", "2", "3", "4", "5", "6", "4", "2", "3"];

describe("Collatz–Wielandt vector certificates", () => {
  it("the marks of E~8 satisfy Ax = 2x, so ρ = 2", () => {
    const v = checkVectorCertificate(affineE8, E8_MARKS, "=", "2");
    expect(v.status).toBe("verified");
    expect(v.certificate?.conclusion).toBe("ρ(G) = 2");
  });
  it("D~_n marks: 1 on the four leaves, 2 elsewhere, give ρ = 2 (Brouwer & Haemers §3.1.1)", () => {
    const g = affineD(7);
    const x = Array.from({ length: g.n }, (_, v) => {
      const deg = g.edges.filter((e) => e.u === v || e.v === v).length;
      return deg === 1 ? "1" : "2";
    });
    expect(checkVectorCertificate(g, x, "=", "2").status).toBe("verified");
  });
  it("changing one entry of the E~8 marks is refuted and names the vertex", () => {
    const bad = [...E8_MARKS];
    bad[6] = "5";
    const v = checkVectorCertificate(affineE8, bad, "=", "2");
    expect(v.status).toBe("refuted");
    expect(v.reason).toMatch(/vertex 5/);
    expect(v.certificate?.failingVertex).toBe(5);
  });
  it("x_i = i(n+1-i) gives Ax = 2x - 2 < 2x on P_n, so ρ(P_n) < 2 (common practice: discrete concavity)", () => {
    const n = 50;
    const x = Array.from({ length: n }, (_, i) => String((i + 1) * (n - i)));
    const v = checkVectorCertificate(path(n), x, "<", "2");
    expect(v.status).toBe("verified");
    expect(v.certificate?.conclusion).toBe("ρ(G) < 2");
  });
  it("upper bounds need x non-zero on every component; lower bounds on one", () => {
    const g = disjointUnion(star(4), path(3));
    const x = ["2", "1", "1", "1", "1", "0", "0", "0"];
    const up = checkVectorCertificate(g, x, "<=", "2");
    expect(up.status).toBe("refuted");
    expect(up.reason).toMatch(/component/);
    const low = checkVectorCertificate(g, x, ">=", "2");
    expect(low.status).toBe("verified");
    expect(low.certificate?.conclusion).toBe("ρ(G) ≥ 2");
  });
  it("negative entries are refused with the vertex named", () => {
    const v = checkVectorCertificate(path(3), ["1", "-1", "1"], "<=", "2");
    expect(v.status).toBe("refuted");
    expect(v.reason).toMatch(/vertex 1.*negative/);
  });
  it("irrational bounds: K_{1,4} with x = (2,1,1,1,1) has Ax ≤ √5·x strictly, so ρ < √5 (ρ(K_{1,4}) = 2, Brouwer & Haemers §1.4.2)", () => {
    const v = checkVectorCertificate(star(4), ["2", "1", "1", "1", "1"], "<", "sqrt(5)");
    expect(v.status).toBe("verified");
    expect(v.certificate?.conclusion).toBe("ρ(G) < sqrt(5)");
    expect(checkVectorCertificate(star(4), ["2", "1", "1", "1", "1"], ">", "sqrt(3)").certificate?.conclusion).toBe("ρ(G) > sqrt(3)");
  });
  it("2cos bounds: P_4 with x = (2,3,3,2) gives ρ(P_4) < 2cos(pi/7) (ρ(P_4) = 2cos(pi/5), Brouwer & Haemers §1.4.4)", () => {
    expect(checkVectorCertificate(path(4), ["2", "3", "3", "2"], "<", "2cos(pi/7)").status).toBe("verified");
    expect(checkVectorCertificate(path(4), ["2", "3", "3", "2"], "<", "2cos(pi/5)").status).toBe("refuted");
  });
  it("Rayleigh quotient: K_{1,4} with x = (2,1,1,1,1) has xᵀAx/xᵀx = 16/8 = 2", () => {
    expect(checkRayleighCertificate(star(4), ["2", "1", "1", "1", "1"], "2").certificate?.conclusion).toBe("ρ(G) ≥ 2");
    expect(checkRayleighCertificate(star(4), ["2", "1", "1", "1", "1"], "sqrt(5)").status).toBe("refuted");
  });
  it("re-check demands the same conclusion", () => {
    expect(recheckVectorCertificate(affineE8, E8_MARKS, "=", "2", "ρ(G) = 2").status).toBe("verified");
    expect(recheckVectorCertificate(affineE8, E8_MARKS, "=", "2", "ρ(G) < 2").status).toBe("refuted");
  });
  it("malformed vectors throw typed errors", () => {
    expect(() => checkVectorCertificate(path(3), ["1", "1"], "<=", "2")).toThrow(/3 vertices/);
    expect(() => checkVectorCertificate(path(3), ["1", "x", "1"], "<=", "2")).toThrow(/vector entry 1/);
  });
});
