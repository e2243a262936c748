/**
 * Demo seed: machine-checked claims on the demo proof's steps, verified here with the exact core (the
 * same function the worker pool runs), so the demo opens with verdicts, certificates and pictures.
 * Idempotent: skipped when the demo steps already carry claims.
 */
import type { Sequelize } from "sequelize";
import { models } from "@/models";
import answer from "@/lib/verification/worker-entry";
import { claimDigest } from "@/lib/core/claims/claims";
import { validateClaim } from "@/lib/core/claims/claim-schema";
import { claimSetText, digestOfRevision, type RevisionClaim } from "@/lib/review/revisions";
import { demoPeople, demoProof } from "./demo-content";

const named = (text: string) => ({ format: "named", text });
const claim = (o: object) => ({ format: "cairn-claim/1", ...o });
const GOLDEN = "sqrt(2+sqrt(5))";

/** Claims per demo step: [case path (positions from the top), step position, claims]. */
const DEMO_CLAIMS: Array<[number[], number, object[]]> = [
  [
    [1],
    1,
    [
      // K_{1,5} ⊆ G ⇒ ρ(G) ≥ ρ(K_{1,5}) = √5 > √(2+√5).
      claim({ kind: "subgraph", pattern: named("star(5)"), host: named("starlike(1,1,1,1,3)"), induced: false }),
      claim({ kind: "spectral-radius-bound", graph: named("star(5)"), op: ">=", bound: "sqrt(5)" }),
      claim({ kind: "spectral-radius-bound", graph: named("star(5)"), op: ">", bound: GOLDEN }),
    ],
  ],
  [
    [1],
    2,
    [
      claim({ kind: "identification", graph: named("star(4)"), family: "D~4" }),
      claim({ kind: "spectral-radius-bound", graph: named("starlike(1,1,1,2)"), op: ">", bound: GOLDEN }),
    ],
  ],
  [
    [2],
    1,
    [
      // The smallest tree with three branch vertices in a row: a path of 5 with a leaf at each inner vertex.
      claim({ kind: "structure", graph: { format: "edges", text: "0 1\n1 2\n2 3\n3 4\n1 5\n2 6\n3 7" }, predicate: "branch-vertices", parameter: 3 }),
      claim({ kind: "spectral-radius-bound", graph: { format: "edges", text: "0 1\n1 2\n2 3\n3 4\n1 5\n2 6\n3 7" }, op: ">", bound: GOLDEN }),
    ],
  ],
  [
    [3],
    1,
    [
      // Ẽ8 = T(1,2,5): its null vector of 2I − A certifies ρ = 2 (the marks of the affine E8 diagram).
      claim({ kind: "vector-certificate", graph: named("E~(8)"), vector: ["1", "2", "3", "4", "5", "6", "4", "2", "3"], relation: "=", bound: "2" }),
      claim({ kind: "structure", graph: named("E~(8)"), predicate: "leg-lengths", parameter: [1, 2, 5] }),
      // Smith's list up to 9 vertices, by exhaustive enumeration: the connected graphs with ρ < 2 are A_n, D_n, E6–E8.
      claim({
        kind: "enumeration",
        maxVertices: 9,
        op: "<",
        bound: "2",
        graphs: [...[1, 2, 3, 4, 5, 6, 7, 8, 9].map((n) => `A(${n})`), ...[4, 5, 6, 7, 8, 9].map((n) => `D(${n})`), "E(6)", "E(7)", "E(8)"].map(named),
      }),
    ],
  ],
  [[3, 1], 1, [claim({ kind: "spectral-radius-bound", graph: named("starlike(1,2,6)"), op: "<", bound: GOLDEN })]],
  [
    [3, 2],
    1,
    [
      claim({ kind: "spectral-radius-bound", graph: named("starlike(2,2,12)"), op: "<", bound: GOLDEN }),
      // E8's eigenvalues are 2cos(πm/30) for its exponents m (Coxeter number 30).
      claim({ kind: "eigenvalues", graph: named("E(8)"), h: 30, multiset: [1, 7, 11, 13, 17, 19, 23, 29] }),
    ],
  ],
];

export async function up({ context: sequelize }: { context: Sequelize }) {
  const { User, Proof, Case, Step, StepRevision, Claim } = models();
  const author = await User.findOne({ where: { email: demoPeople.find((p) => p.key === "author")!.email } });
  const proof = author && (await Proof.findOne({ where: { title: demoProof.title, createdBy: author.id } }));
  if (!author || !proof) return;
  const cases = await Case.findAll({ where: { proofId: proof.id } });
  const caseAt = (path: number[]) => {
    let parentId: number | null = null;
    let found: (typeof cases)[number] | undefined;
    for (const position of path) {
      found = cases.find((c) => c.parentId === parentId && c.position === position);
      if (!found) return undefined;
      parentId = found.id;
    }
    return found;
  };
  const steps = await Step.findAll({ where: { caseId: cases.map((c) => c.id) } });
  if ((await Claim.count({ where: { stepId: steps.map((s) => s.id) } })) > 0) return;
  await sequelize.transaction(async (transaction) => {
    for (const [path, position, claims] of DEMO_CLAIMS) {
      const c = caseAt(path);
      const step = c && steps.find((s) => s.caseId === c.id && s.position === position);
      if (!step) continue;
      const attached: RevisionClaim[] = [];
      for (const [i, raw] of claims.entries()) {
        const valid = validateClaim(raw);
        const result = answer({ mode: "verify", claim: valid, stepLimit: 200_000_000, picture: true });
        if (!result.ok || !result.outcome) throw new Error(`demo claim ${JSON.stringify(raw)} could not be read`);
        const o = result.outcome;
        const row = await Claim.create(
          {
            stepId: step.id,
            position: i + 1,
            kind: valid.kind,
            input: JSON.stringify(valid),
            digest: claimDigest(valid),
            status: o.status,
            statement: o.statement.slice(0, 500),
            method: o.method.slice(0, 200),
            reason: o.reason,
            certificate: o.certificate,
            checkerVersion: o.checkerVersion,
            checkedBy: author.id,
            checkedAt: new Date(),
            createdBy: author.id,
            picture: o.picture ? JSON.stringify(o.picture) : null,
          },
          { transaction },
        );
        attached.push({ id: row.id, position: row.position, kind: row.kind, statement: row.statement, digest: row.digest ?? "", status: row.status });
      }
      // The demo's claims were there from the step's first revision: it covers them (nobody has vouched yet).
      const first = await StepRevision.findOne({ where: { stepId: step.id }, order: [["number", "DESC"]], transaction });
      if (first) await first.update({ claimSet: claimSetText(attached), digest: digestOfRevision(first.number, first.body, attached) }, { transaction });
    }
  });
}

export async function down({ context: sequelize }: { context: Sequelize }) {
  const { User, Proof, Case, Step, StepRevision, Claim } = models();
  const author = await User.findOne({ where: { email: demoPeople.find((p) => p.key === "author")!.email } });
  const proof = author && (await Proof.findOne({ where: { title: demoProof.title, createdBy: author.id } }));
  if (!proof) return;
  const cases = await Case.findAll({ where: { proofId: proof.id } });
  const steps = await Step.findAll({ where: { caseId: cases.map((c) => c.id) } });
  await sequelize.transaction(async (transaction) => {
    await Claim.destroy({ where: { stepId: steps.map((s) => s.id) }, transaction });
  });
}
