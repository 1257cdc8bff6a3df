/**
 * The load-path graph and its order. Nodes are members; an edge runs from a carried member to the
 * member that holds it. The sort returns the takedown order (every member after all the members
 * it carries) and the cycles as data: members on a cycle are left out of the order, everything
 * else (including what they sit on) is still ordered.
 */

/** An edge from a carried node to its support; `id` lets callers find what the edge stands for. */
export interface Edge {
  readonly from: number;
  readonly to: number;
  readonly id: number;
}

/** One cycle: the nodes in path order (the first node is not repeated) and the edge ids taken. */
export interface Cycle {
  readonly nodes: readonly number[];
  readonly edges: readonly number[];
}

/** Result of {@link sortGraph}. */
export interface SortResult {
  /** Nodes in takedown order (carried before carrier), cyclic nodes left out. */
  readonly order: readonly number[];
  /** For every node on a cycle, one cycle through it (shortest found), in node order. */
  readonly cycles: readonly { readonly node: number; readonly cycle: Cycle }[];
}

/** Adjacency lists of the edges (only between active nodes). */
function adjacency(nodeCount: number, edges: readonly Edge[], active: (n: number) => boolean): Edge[][] {
  const out: Edge[][] = Array.from({ length: nodeCount }, () => []);
  for (const e of edges) if (e.from !== e.to && active(e.from) && active(e.to)) out[e.from]!.push(e);
  return out;
}

/** Strongly connected components of more than one node (Tarjan, iterative: deep chains never overflow the stack). */
export function cyclicComponents(nodeCount: number, out: readonly (readonly Edge[])[]): number[][] {
  const index = new Int32Array(nodeCount).fill(-1);
  const low = new Int32Array(nodeCount);
  const onStack = new Uint8Array(nodeCount);
  const stack: number[] = [];
  const components: number[][] = [];
  let next = 0;
  for (let root = 0; root < nodeCount; root++) {
    if (index[root] !== -1) continue;
    const work: [number, number][] = [[root, 0]];
    index[root] = low[root] = next++;
    stack.push(root);
    onStack[root] = 1;
    while (work.length > 0) {
      const top = work[work.length - 1]!;
      const [v, i] = top;
      const edgesOut = out[v]!;
      if (i < edgesOut.length) {
        top[1] = i + 1;
        const w = edgesOut[i]!.to;
        if (index[w] === -1) {
          index[w] = low[w] = next++;
          stack.push(w);
          onStack[w] = 1;
          work.push([w, 0]);
        } else if (onStack[w]) low[v] = Math.min(low[v]!, index[w]!);
        continue;
      }
      work.pop();
      if (work.length > 0) {
        const parent = work[work.length - 1]![0];
        low[parent] = Math.min(low[parent]!, low[v]!);
      }
      if (low[v] === index[v]) {
        const comp: number[] = [];
        let w: number;
        do {
          w = stack.pop()!;
          onStack[w] = 0;
          comp.push(w);
        } while (w !== v);
        if (comp.length > 1) components.push(comp);
      }
    }
  }
  return components;
}

/** Shortest cycle through `start` inside one component (breadth-first search back to start). */
function cycleThrough(start: number, inComponent: ReadonlySet<number>, out: readonly (readonly Edge[])[]): Cycle {
  const parent = new Map<number, Edge>();
  const queue = [start];
  for (let q = 0; q < queue.length; q++) {
    const v = queue[q]!;
    for (const e of out[v]!) {
      if (!inComponent.has(e.to)) continue;
      if (e.to === start) {
        const nodes = [v];
        const ids = [e.id];
        let u = v;
        while (u !== start) {
          const pe = parent.get(u)!;
          ids.push(pe.id);
          u = pe.from;
          nodes.push(u);
        }
        return { nodes: nodes.reverse(), edges: ids.reverse() };
      }
      if (!parent.has(e.to) && e.to !== start) {
        parent.set(e.to, e);
        queue.push(e.to);
      }
    }
  }
  return { nodes: [start], edges: [] }; // not reached for a node of a cyclic component
}

/** Largest component for which every member gets its own shortest cycle (bigger ones share one). */
const CYCLE_SEARCH_LIMIT = 200;

/** A binary min-heap of node numbers under a comparison. */
class Heap {
  private readonly items: number[] = [];
  constructor(private readonly before: (a: number, b: number) => number) {}
  get size(): number {
    return this.items.length;
  }
  push(x: number): void {
    const a = this.items;
    a.push(x);
    let i = a.length - 1;
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (this.before(a[i]!, a[p]!) >= 0) break;
      [a[i], a[p]] = [a[p]!, a[i]!];
      i = p;
    }
  }
  pop(): number {
    const a = this.items;
    const top = a[0]!;
    const last = a.pop()!;
    if (a.length > 0) {
      a[0] = last;
      let i = 0;
      for (;;) {
        const l = 2 * i + 1;
        const r = l + 1;
        let m = i;
        if (l < a.length && this.before(a[l]!, a[m]!) < 0) m = l;
        if (r < a.length && this.before(a[r]!, a[m]!) < 0) m = r;
        if (m === i) break;
        [a[i], a[m]] = [a[m]!, a[i]!];
        i = m;
      }
    }
    return top;
  }
}

/**
 * Order the load path.
 * @param nodeCount - number of nodes (members), numbered 0..nodeCount-1
 * @param edges - carried -> supporting member (self edges are ignored: report them separately)
 * @param active - whether a node takes part (members left out by problems do not)
 * @param before - preferred order among nodes that are free at the same time (negative = a first):
 *   the order always respects the edges; among the rest it follows this comparison
 * @returns the order and, for each node on a cycle, a cycle through it
 */
export function sortGraph(nodeCount: number, edges: readonly Edge[], active: (n: number) => boolean, before: (a: number, b: number) => number): SortResult {
  const out = adjacency(nodeCount, edges, active);
  const cyclic = new Uint8Array(nodeCount);
  const cycles: { node: number; cycle: Cycle }[] = [];
  for (const comp of cyclicComponents(nodeCount, out)) {
    const members = new Set(comp);
    const sorted = [...comp].sort((a, b) => a - b);
    const shared = cycleThrough(sorted[0]!, members, out);
    for (const n of sorted) {
      cyclic[n] = 1;
      cycles.push({ node: n, cycle: comp.length <= CYCLE_SEARCH_LIMIT || n === sorted[0] ? cycleThrough(n, members, out) : shared });
    }
  }
  const indegree = new Int32Array(nodeCount);
  for (let v = 0; v < nodeCount; v++) {
    if (cyclic[v]) continue;
    for (const e of out[v]!) if (!cyclic[e.to]) indegree[e.to]!++;
  }
  const heap = new Heap(before);
  for (let v = 0; v < nodeCount; v++) if (active(v) && !cyclic[v] && indegree[v] === 0) heap.push(v);
  const order: number[] = [];
  while (heap.size > 0) {
    const v = heap.pop();
    order.push(v);
    for (const e of out[v]!) {
      if (cyclic[e.to]) continue;
      if (--indegree[e.to]! === 0) heap.push(e.to);
    }
  }
  return { order, cycles };
}
