/**
 * The load-path graph's sort: every member after every member it carries (property-checked on
 * random acyclic graphs with fast-check), cycles returned as data with a path through each node,
 * and nothing downstream of a cycle lost.
 */
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { cyclicComponents, sortGraph, type Edge } from "../../../src/engine/takedown/graph";

const byIndex = (a: number, b: number) => a - b;

describe("sortGraph", () => {
  it("orders every node after all the nodes with an edge into it (random acyclic graphs)", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 40 }).chain((n) =>
          fc.tuple(
            fc.constant(n),
            fc.array(fc.tuple(fc.nat(n - 1), fc.nat(n - 1)), { maxLength: 120 }),
            fc.shuffledSubarray([...Array(n).keys()], { minLength: n, maxLength: n }),
          ),
        ),
        ([n, pairs, perm]) => {
          // Edges from lower to higher rank in a random permutation: acyclic by construction.
          const rank = new Map(perm.map((v, i) => [v, i]));
          const edges: Edge[] = pairs.filter(([a, b]) => rank.get(a)! < rank.get(b)!).map(([a, b], id) => ({ from: a, to: b, id }));
          const { order, cycles } = sortGraph(n, edges, () => true, byIndex);
          expect(cycles).toEqual([]);
          expect([...order].sort(byIndex)).toEqual([...Array(n).keys()]);
          const pos = new Map(order.map((v, i) => [v, i]));
          for (const e of edges) expect(pos.get(e.from)!).toBeLessThan(pos.get(e.to)!);
        },
      ),
      { numRuns: 200 },
    );
  });

  it("follows the preferred order wherever the edges leave a choice", () => {
    const edges: Edge[] = [{ from: 3, to: 0, id: 0 }];
    expect(sortGraph(4, edges, () => true, byIndex).order).toEqual([1, 2, 3, 0]);
    expect(sortGraph(4, edges, () => true, (a, b) => b - a).order).toEqual([3, 2, 1, 0]);
  });

  it("returns cycles as data with a path through each node, and still orders what sits below them", () => {
    // 0 -> 1 -> 2 -> 0 is a cycle; 2 -> 3 -> 4 hang below it; 5 is on its own; 6 carried by 5.
    const edges: Edge[] = [
      { from: 0, to: 1, id: 10 },
      { from: 1, to: 2, id: 11 },
      { from: 2, to: 0, id: 12 },
      { from: 2, to: 3, id: 13 },
      { from: 3, to: 4, id: 14 },
      { from: 6, to: 5, id: 15 },
    ];
    const { order, cycles } = sortGraph(7, edges, () => true, byIndex);
    expect(order).toEqual([3, 4, 6, 5]);
    expect(cycles.map((c) => c.node)).toEqual([0, 1, 2]);
    expect(cycles[0]!.cycle).toEqual({ nodes: [0, 1, 2], edges: [10, 11, 12] });
    expect(cycles[1]!.cycle.nodes).toEqual([1, 2, 0]);
    expect(cycles[2]!.cycle.edges).toEqual([12, 10, 11]);
  });

  it("leaves out inactive nodes and ignores self edges", () => {
    const edges: Edge[] = [
      { from: 0, to: 0, id: 0 },
      { from: 0, to: 1, id: 1 },
      { from: 1, to: 2, id: 2 },
    ];
    expect(sortGraph(3, edges, (n) => n !== 1, byIndex)).toEqual({ order: [0, 2], cycles: [] });
  });

  it("handles a chain of 200,000 members without deep recursion", () => {
    const n = 200_000;
    const edges: Edge[] = Array.from({ length: n - 1 }, (_, i) => ({ from: i, to: i + 1, id: i }));
    edges.push({ from: n - 1, to: 0, id: n });
    const out = Array.from({ length: n }, () => [] as Edge[]);
    for (const e of edges) out[e.from]!.push(e);
    expect(cyclicComponents(n, out)[0]!.length).toBe(n);
    const open = sortGraph(n, edges.slice(0, -1), () => true, byIndex);
    expect(open.order.length).toBe(n);
    expect(open.order[0]).toBe(0);
  });
});
