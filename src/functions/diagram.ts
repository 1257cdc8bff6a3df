/**
 * The x | V | M table of DIAGRAM: every position where the diagrams change (ends, supports, load
 * positions and load ends) with the values on both sides where they jump, the points of zero
 * shear (where the moment has its extremes), and evenly spaced stations, sorted by x.
 * The row count stays within {@link diagramRowBound} (spill.ts) for the member's argument sizes.
 */
import type { BeamSolution } from "../engine/beam/types";

/** Positions closer than this fraction of the span are one position. */
const SAME_POSITION = 1e-9;
/** Shear within this fraction of the largest shear is zero; jumps smaller than it are no jump. */
const ZERO_SHEAR = 1e-9;
const NO_JUMP = 1e-12;

/** Ends, supports, point loads, couples and line load ends, sorted and unique. */
export function basePositions(solution: BeamSolution): number[] {
  const { span, supports, loads } = solution.model;
  const xs = [0, span, ...supports.map((s) => s.x)];
  for (const l of loads) {
    if (l.kind === "line") xs.push(l.start, l.end);
    else xs.push(l.x);
  }
  return uniqueSorted(xs, SAME_POSITION * span);
}

function uniqueSorted(xs: readonly number[], tolerance: number): number[] {
  const sorted = [...xs].sort((a, b) => a - b);
  const out: number[] = [];
  for (const x of sorted) if (out.length === 0 || x - out[out.length - 1]! > tolerance) out.push(x);
  return out;
}

/** Largest |V| on either side of the base positions (the shear's extremes lie there or at w = 0). */
function shearScale(solution: BeamSolution, base: readonly number[]): number {
  const m = Math.max(Math.abs(solution.maxShear().value), ...base.flatMap((x) => [Math.abs(solution.shearAt(x, "left")), Math.abs(solution.shearAt(x, "right"))]));
  return m > 0 ? m : Number.MIN_VALUE;
}

/**
 * Zero-shear points inside each interval between base positions, from the solver's exact
 * critical points; at most two per interval (shear is at most quadratic there).
 */
export function zeroShearPositions(solution: BeamSolution, base: readonly number[]): number[] {
  const span = solution.model.span;
  const vTol = ZERO_SHEAR * shearScale(solution, base);
  const xTol = SAME_POSITION * span;
  const perInterval = new Map<number, { x: number; v: number }[]>();
  for (const x of solution.criticalPoints()) {
    const k = base.findIndex((b, i) => i + 1 < base.length && x > b + xTol && x < base[i + 1]! - xTol);
    if (k < 0) continue;
    const v = Math.abs(solution.shearAt(x));
    if (v > vTol) continue;
    const list = perInterval.get(k) ?? [];
    list.push({ x, v });
    perInterval.set(k, list);
  }
  const out: number[] = [];
  for (const list of perInterval.values()) out.push(...list.sort((a, b) => a.v - b.v).slice(0, 2).map((p) => p.x));
  return out.sort((a, b) => a - b);
}

type Tagged = { readonly x: number; readonly base: boolean };

/** Rows for one position: two (left, right) where V or M jumps at a base position, else one. */
function rowsAt(solution: BeamSolution, p: Tagged, vTol: number, mTol: number): number[][] {
  const span = solution.model.span;
  if (p.x <= 0) return [[0, solution.shearAt(0, "right"), solution.momentAt(0, "right")]];
  if (p.x >= span) return [[span, solution.shearAt(span, "left"), solution.momentAt(span, "left")]];
  const right = [p.x, solution.shearAt(p.x, "right"), solution.momentAt(p.x, "right")];
  if (!p.base) return [right];
  const left = [p.x, solution.shearAt(p.x, "left"), solution.momentAt(p.x, "left")];
  const jumps = Math.abs(left[1]! - right[1]!) > vTol || Math.abs(left[2]! - right[2]!) > mTol;
  return jumps ? [left, right] : [right];
}

/**
 * The DIAGRAM table.
 * @param solution - the solved member.
 * @param stations - number of equal intervals for the evenly spaced stations (>= 1).
 * @returns rows [x, V, M] sorted by x; at a jump two rows with the same x, left value first.
 */
export function diagramTable(solution: BeamSolution, stations: number): number[][] {
  const span = solution.model.span;
  const base = basePositions(solution);
  const xTol = SAME_POSITION * span;
  const tagged: Tagged[] = [
    ...base.map((x) => ({ x, base: true })),
    ...zeroShearPositions(solution, base).map((x) => ({ x, base: false })),
    ...Array.from({ length: stations + 1 }, (_, i) => ({ x: i === stations ? span : (i * span) / stations, base: false })),
  ].sort((a, b) => a.x - b.x || Number(b.base) - Number(a.base));
  const merged: Tagged[] = [];
  for (const p of tagged) {
    const last = merged[merged.length - 1];
    if (last === undefined || p.x - last.x > xTol) merged.push(p);
    else if (p.base && !last.base) merged[merged.length - 1] = p; // a base position wins over a station beside it
  }
  const vScale = shearScale(solution, base);
  const mScale = Math.max(solution.maxSagging().value, -solution.maxHogging().value, Number.MIN_VALUE);
  return merged.flatMap((p) => rowsAt(solution, p, NO_JUMP * vScale, NO_JUMP * mScale));
}
