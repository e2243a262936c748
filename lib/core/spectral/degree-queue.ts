/**
 * Minimum-degree pivot choice for the sparse eliminations (sparse-inertia.ts, interval-elimination.ts):
 * a lazy bucket queue by current degree. A vertex is pushed again whenever its degree changes; stale
 * entries (a vertex gone, or listed under an old degree) are skipped when the minimum is looked up.
 */
export class DegreeQueue {
  private readonly buckets: number[][] = [];
  private minDeg = 0;

  constructor(
    private readonly degree: (v: number) => number,
    private readonly alive: Uint8Array,
  ) {
    for (let v = 0; v < alive.length; v++) this.push(v);
  }

  push(v: number): void {
    const d = this.degree(v);
    (this.buckets[d] ??= []).push(v);
    if (d < this.minDeg) this.minDeg = d;
  }

  /** A remaining vertex of least current degree, left in the queue. */
  peek(): number {
    for (;;) {
      while (this.minDeg < this.buckets.length && (this.buckets[this.minDeg]?.length ?? 0) === 0) this.minDeg++;
      const list = this.buckets[this.minDeg];
      const v = list[list.length - 1];
      if (this.alive[v] && this.degree(v) === this.minDeg) return v;
      list.pop();
    }
  }

  /** The same vertex as peek(), taken out of the queue. */
  pop(): number {
    const v = this.peek();
    this.buckets[this.minDeg].pop();
    return v;
  }
}
