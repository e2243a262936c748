/**
 * The invented scenario of the demo: the Tarn Hollow spectral graph theory group (fictional) refereeing
 * their own classification of trees whose spectral radius lies in (2, √(2+√5)].
 * All people and addresses are invented; `.example` is a reserved domain.
 */
import type { GlobalRole } from "@/models/user";
import type { ProofRole } from "@/lib/access/rules";

export const DEMO_PASSWORD = "cairn-demo-2026";

export interface DemoPerson {
  key: string;
  name: string;
  email: string;
  role: GlobalRole;
  proofRole?: ProofRole;
}

export const demoPeople: DemoPerson[] = [
  { key: "author", name: "Ada Quenby", email: "ada.quenby@tarnhollow.example", role: "member", proofRole: "author" },
  { key: "coauthor", name: "Bram Theroux", email: "bram.theroux@tarnhollow.example", role: "member", proofRole: "author" },
  { key: "reviewer", name: "Celia Marwood", email: "celia.marwood@tarnhollow.example", role: "member", proofRole: "reviewer" },
  { key: "editor", name: "Dov Ashgrove", email: "dov.ashgrove@tarnhollow.example", role: "member", proofRole: "editor" },
  { key: "admin", name: "Esme Pollard", email: "esme.pollard@tarnhollow.example", role: "admin" },
  { key: "outsider", name: "Fen Calloway", email: "fen.calloway@tarnhollow.example", role: "member" },
];

export interface DemoCase {
  title: string;
  condition: string;
  steps: string[];
  children?: DemoCase[];
}

export const demoProof = {
  title: "Trees with spectral radius in (2, √(2+√5)]",
  statement: String.raw`**Theorem.** Let $T$ be a finite tree with $2 < \rho(T) \le \sqrt{2+\sqrt5}$, where $\rho$ is the spectral radius of the adjacency matrix. Then $T$ is a star-like tree $T(a,b,c)$ with exactly one vertex of degree $3$, or a tree with exactly two vertices of degree $3$ obtained by joining two such forks by a path.

Recall that $\sqrt{2+\sqrt5} \approx 2.058$ is the limit of $\rho\big(T(2,2,k)\big)$ as $k \to \infty$, and that a connected graph has $\rho < 2$ exactly when it is one of $A_n, D_n, E_6, E_7, E_8$.`,
  cases: [
    {
      title: "A vertex of degree at least 4",
      condition: String.raw`$T$ has a vertex $v$ with $\deg v \ge 4$.`,
      steps: [
        String.raw`If $\deg v \ge 5$ then $T \supseteq K_{1,5}$, so $\rho(T) \ge \sqrt5 > \sqrt{2+\sqrt5}$ by monotonicity of $\rho$ under subgraphs (Perron–Frobenius).`,
        String.raw`If $\deg v = 4$ then $T \supseteq K_{1,4} = \tilde D_4$ with $\rho = 2$. Since $\rho(T) > 2$, $T \ne K_{1,4}$, so $T$ contains the tree $K_{1,4}$ with one leg extended, whose spectral radius already exceeds $\sqrt{2+\sqrt5}$:

$$
\rho\big(T(1,1,1,2)\big) = \sqrt{\tfrac{5+\sqrt{13}}{2}} \approx 2.074.
$$`,
      ],
    },
    {
      title: "Three or more branch vertices",
      condition: String.raw`All degrees are $\le 3$ and $T$ has at least three vertices of degree $3$.`,
      steps: [
        String.raw`Take three branch vertices $u, v, w$ on a common path or forming a fork; in either case $T$ contains a tree $\tilde D_n$ properly, together with a further pendant path, and $\rho(T) > \sqrt{2+\sqrt5}$ by the claim attached to this step.`,
      ],
    },
    {
      title: "Exactly one branch vertex",
      condition: String.raw`$T = T(a,b,c)$ with $1 \le a \le b \le c$.`,
      steps: [String.raw`Since $\rho(T) > 2$, $T$ is not a Dynkin diagram, so $\frac1{a+1} + \frac1{b+1} + \frac1{c+1} \le 1$.`],
      children: [
        {
          title: "Legs 1 and 2",
          condition: String.raw`$a = 1,\ b = 2$, so $c \ge 6$.`,
          steps: [
            String.raw`$T(1,2,c) \subseteq T(2,2,c)$ and $\rho\big(T(2,2,c)\big) < \sqrt{2+\sqrt5}$ for all $c$, so every $T(1,2,c)$ with $c \ge 6$ lies in the interval.`,
          ],
        },
        {
          title: "Legs 2 and 2",
          condition: String.raw`$a = b = 2$, so $c \ge 3$.`,
          steps: [
            String.raw`The sequence $\rho\big(T(2,2,c)\big)$ increases with $c$ and converges to $\sqrt{2+\sqrt5}$, so each member lies in $(2, \sqrt{2+\sqrt5})$.`,
          ],
        },
      ],
    },
  ] as DemoCase[],
};
