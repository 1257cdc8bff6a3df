/**
 * Snapping: points closer than the tolerance (directly or through a chain of such points) become
 * one node, placed at the cluster's lowest point (smallest x, then y), so the nodes do not depend
 * on the order of the rows. Grid hashing keeps it linear in the number of points.
 */
import type { Point } from "./types";

/**
 * Snap points into nodes.
 * @param points - plan points (ft or m)
 * @param tol - snapping tolerance (ft or m), > 0
 * @returns for each input point, its node
 */
export function snapPoints(points: readonly Point[], tol: number): Point[] {
  const parent = points.map((_, i) => i);
  const find = (i: number): number => {
    while (parent[i] !== i) {
      parent[i] = parent[parent[i]!]!;
      i = parent[i]!;
    }
    return i;
  };
  const cells = new Map<string, number[]>();
  const key = (cx: number, cy: number): string => `${cx},${cy}`;
  points.forEach((p, i) => {
    const cx = Math.floor(p.x / tol);
    const cy = Math.floor(p.y / tol);
    for (let dx = -1; dx <= 1; dx++)
      for (let dy = -1; dy <= 1; dy++)
        for (const j of cells.get(key(cx + dx, cy + dy)) ?? []) {
          const q = points[j]!;
          if (Math.hypot(p.x - q.x, p.y - q.y) <= tol) {
            const a = find(i), b = find(j);
            if (a !== b) parent[Math.max(a, b)] = Math.min(a, b);
          }
        }
    const k = key(cx, cy);
    const list = cells.get(k);
    if (list) list.push(i);
    else cells.set(k, [i]);
  });
  const rep = new Map<number, Point>();
  points.forEach((p, i) => {
    const r = find(i);
    const cur = rep.get(r);
    if (!cur || p.x < cur.x || (p.x === cur.x && p.y < cur.y)) rep.set(r, p);
  });
  return points.map((_, i) => rep.get(find(i))!);
}
