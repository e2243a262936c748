import { describe, expect, it } from "vitest";
import { parseGraph } from "../input/parse";
import { cycle, path, star, starlike, complete, completeBipartite } from "../input/constructors";
import { ConditionError, parseCondition, validateCondition, type CaseCondition } from "./case-condition";
import { describeCondition } from "./condition-words";
import { evaluateCondition } from "./condition-eval";

const holds = (c: unknown, g: ReturnType<typeof path>) => evaluateCondition(validateCondition(c), g);

// Facts used below are elementary (degrees of paths, cycles, stars; K3 is not bipartite; C4 has no triangle).
describe("case conditions", () => {
  it("evaluates degree bounds, branch vertices and the plain predicates exactly", () => {
    expect(holds({ predicate: "max-degree", relation: "<=", value: 2 }, cycle(5))).toBe(true);
    expect(holds({ predicate: "max-degree", relation: "<=", value: 2 }, star(3))).toBe(false);
    expect(holds({ predicate: "min-degree", relation: "=", value: 1 }, path(4))).toBe(true);
    expect(holds({ predicate: "branch-vertices", relation: "=", value: 2 }, parseGraph("0 1\n0 2\n0 3\n3 4\n4 5\n4 6", "edges"))).toBe(true);
    expect(holds({ predicate: "vertices", relation: ">", value: 4 }, path(5))).toBe(true);
    expect(holds({ predicate: "edges", relation: "=", value: 6 }, complete(4))).toBe(true);
    expect(holds({ predicate: "tree" }, star(4))).toBe(true);
    expect(holds({ predicate: "tree" }, cycle(4))).toBe(false);
    expect(holds({ predicate: "has-cycle" }, cycle(4))).toBe(true);
    expect(holds({ predicate: "path" }, path(6))).toBe(true);
    expect(holds({ predicate: "path" }, star(3))).toBe(false);
    expect(holds({ predicate: "bipartite" }, cycle(6))).toBe(true);
    expect(holds({ predicate: "bipartite" }, complete(3))).toBe(false);
    expect(holds({ predicate: "connected" }, parseGraph("path(2) + path(2)"))).toBe(false);
  });

  it("reads leg lengths of star-like trees in any order", () => {
    expect(holds({ predicate: "leg-lengths", value: [5, 1, 2] }, starlike([1, 2, 5]))).toBe(true);
    expect(holds({ predicate: "leg-lengths", value: [1, 2, 4] }, starlike([1, 2, 5]))).toBe(false);
    expect(holds({ predicate: "leg-lengths", value: [1, 1, 1] }, completeBipartite(1, 3))).toBe(true);
    expect(holds({ predicate: "leg-lengths", value: [1, 1, 1] }, complete(4))).toBe(false);
  });

  it("tests containment of a subgraph (plain and induced) and combines with and / or / not", () => {
    const triangle = { predicate: "contains", graph: "Bw" };
    expect(holds(triangle, complete(4))).toBe(true);
    expect(holds(triangle, cycle(4))).toBe(false);
    // P3 is a subgraph of K3 but not an induced one.
    const p3 = { predicate: "contains", graph: { format: "edges", text: "0 1\n1 2" } };
    expect(holds(p3, complete(3))).toBe(true);
    expect(holds({ ...p3, induced: true }, complete(3))).toBe(false);
    const c: unknown = { and: [{ predicate: "has-cycle" }, { not: triangle }] };
    expect(holds(c, cycle(4))).toBe(true);
    expect(holds(c, complete(3))).toBe(false);
    expect(holds({ or: [{ predicate: "tree" }, triangle] }, cycle(5))).toBe(false);
    expect(describeCondition(validateCondition(c))).toBe("G contains a cycle and not (G contains Bw (graph6) as a subgraph)");
  });

  it("refuses malformed conditions, naming the JSON path", () => {
    const bad = (v: unknown, path: RegExp) => {
      try {
        validateCondition(v);
      } catch (e) {
        expect(e).toBeInstanceOf(ConditionError);
        expect((e as ConditionError).path).toMatch(path);
        return;
      }
      throw new Error("accepted");
    };
    bad({ and: [{ predicate: "tree" }, { predicate: "max-degree", relation: "<=", value: -1 }] }, /^\$\.and\[1\]\.value$/);
    bad({ or: [] }, /^\$\.or$/);
    bad({ not: { predicate: "planar" } }, /^\$\.not\.predicate$/);
    bad({ predicate: "tree", value: 3 }, /^\$\.value$/);
    bad({ predicate: "contains", graph: "not graph6 \u0001" }, /^\$\.graph$/);
    bad({ predicate: "contains", graph: { format: "edges", text: "0 0" } }, /^\$\.graph\.text$/);
    bad({ predicate: "leg-lengths", value: [1, 2] }, /^\$\.value$/);
    bad("tree", /^\$$/);
    expect(() => parseCondition("{ not json")).toThrow(/^\$: not valid JSON/);
    let deep: unknown = { predicate: "tree" };
    for (let i = 0; i < 20; i++) deep = { not: deep };
    bad(deep, /^\$(\.not)+$/);
  });

  it("normalises pattern graphs to graph6 so equal conditions compare equal", () => {
    const a: CaseCondition = validateCondition({ predicate: "contains", graph: { format: "edges", text: "0 1\n1 2\n0 2" } });
    expect(a).toEqual({ predicate: "contains", graph: { format: "graph6", text: "Bw" } });
  });
});
