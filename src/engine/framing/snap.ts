/**
 * Snapping: points closer than the tolerance (directly or through a chain of such points) become
 * one node, placed at the cluster's lowest point (smallest x, then y), so the nodes do not depend
 * on the order of the rows. Identical points are merged first; the distinct ones are bucketed in
 * a grid of cells one tolerance wide, so the work grows linearly with the number of points.
 */
import type { Point } from "./types";

/**
 * Snap points into nodes.
 * @param points - plan points (ft or m)
 * @param tol - snapping tolerance (ft or m), > 0
 * @returns for each input point, its node
 */
export function snapPoints(points: readonly Point[], tol: number): Point[] {
  // distinct points
  const byX = new Map<number, Map<number, number>>();
  const distinct: Point[] = [];
  const which = new Int32Array(points.length);
  points.forEach((p, i) => {
    let col = byX.get(p.x);
    if (!col) byX.set(p.x, (col = new Map()));
    let k = col.get(p.y);
    if (k === undefined) {
      k = distinct.length;
      distinct.push(p);
      col.set(p.y, k);
    }
    which[i] = k;
  });
  const parent = new Int32Array(distinct.length).map((_, i) => i);
  const find = (i: number): number => {
    while (parent[i] !== i) {
      parent[i] = parent[parent[i]!]!;
      i = parent[i]!;
    }
    return i;
  };
  const cells = new Map<number, Map<number, number[]>>();
  distinct.forEach((p, i) => {
    const cx = Math.floor(p.x / tol);
    const cy = Math.floor(p.y / tol);
    for (let dx = -1; dx <= 1; dx++) {
      const col = cells.get(cx + dx);
      if (!col) continue;
      for (let dy = -1; dy <= 1; dy++)
        for (const j of col.get(cy + dy) ?? []) {
          const q = distinct[j]!;
          if (Math.hypot(p.x - q.x, p.y - q.y) <= tol) {
            const a = find(i), b = find(j);
            if (a !== b) parent[Math.max(a, b)] = Math.min(a, b);
          }
        }
    }
    let col = cells.get(cx);
    if (!col) cells.set(cx, (col = new Map()));
    const list = col.get(cy);
    if (list) list.push(i);
    else col.set(cy, [i]);
  });
  const rep: Point[] = [];
  distinct.forEach((p, i) => {
    const r = find(i);
    const cur = rep[r];
    if (!cur || p.x < cur.x || (p.x === cur.x && p.y < cur.y)) rep[r] = p;
  });
  return points.map((_, i) => rep[find(which[i]!)]!);
}
