/**
 * Reactions of any stable support layout by compatibility. Unknowns: the vertical reaction at
 * every support, the couple at every fixed support and the two integration constants EIθ(0),
 * EIy(0). Equations: vertical and moment equilibrium (V and M vanish just past the right end),
 * zero deflection at every support, zero rotation at every fixed support. Lengths are scaled by
 * the span so that every coefficient is of order one.
 */
import * as linearSolve from "./linear-solve";
import * as packed from "./packed";
import type { PackedModel } from "./packed";
import * as piecewise from "./piecewise";
import type { Piecewise } from "./piecewise";

// Module-level aliases of imported bindings used in loops: when the sources are run as CommonJS
// (tsx, ts-node) every imported binding is read through an accessor, which costs more than the
// arithmetic around it. Reading each once at load keeps the loops to plain local constants.
const { solveInPlace } = linearSolve;
const { SUPPORT_STRIDE, TYPE_FIXED } = packed;
const { breakpointIndex, buildSegments, loadJumps, march, marchEnd, reactionJumps, riseAtBreakpoint, slopeAtBreakpoint } = piecewise;

/** Pivot tolerance relative to the largest (order one) coefficient. */
const PIVOT_TOLERANCE = 1e-13;

let matrix = new Float64Array(64);
let rhs = new Float64Array(8);

/** Reactions, reaction couples and the finished piecewise solution. */
export interface IndeterminateSolution {
  readonly reactions: number[];
  readonly couples: number[];
  readonly piecewise: Piecewise;
}

function fixedList(pm: PackedModel): number[] {
  const list: number[] = [];
  for (let i = 0; i < pm.supportCount; i++) if (pm.supports[i * SUPPORT_STRIDE + 1] === TYPE_FIXED) list.push(i);
  return list;
}

/** Coefficients of the unknowns in the equations; the right-hand side is filled separately. */
function assemble(pm: PackedModel, fixed: number[], a: Float64Array, m: number): void {
  const n = pm.supportCount;
  const L = pm.span;
  const sup = pm.supports;
  const t0Col = n + fixed.length; // columns: reactions, couples (scaled by 1/L), EIθ(0)/L^2, EIy(0)/L^3
  const y0Col = t0Col + 1;
  for (let i = 0; i < n; i++) {
    a[i] = 1; // row 0: sum of reactions
    a[m + i] = 1 - sup[i * SUPPORT_STRIDE] / L; // row 1: moment just past the right end / L
  }
  for (let j = 0; j < fixed.length; j++) a[m + n + j] = -1;
  for (let k = 0; k < n; k++) {
    const row = (2 + k) * m; // EIy(s_k) / L^3 = 0
    const sk = sup[k * SUPPORT_STRIDE] / L;
    for (let i = 0; i < n; i++) {
      const u = sk - sup[i * SUPPORT_STRIDE] / L;
      if (u > 0) a[row + i] = (u * u * u) / 6;
    }
    for (let j = 0; j < fixed.length; j++) {
      const u = sk - sup[fixed[j] * SUPPORT_STRIDE] / L;
      if (u > 0) a[row + n + j] = (-u * u) / 2;
    }
    a[row + t0Col] = sk;
    a[row + y0Col] = 1;
  }
  for (let f = 0; f < fixed.length; f++) {
    const row = (2 + n + f) * m; // EIθ(s_f) / L^2 = 0
    const sk = sup[fixed[f] * SUPPORT_STRIDE] / L;
    for (let i = 0; i < n; i++) {
      const u = sk - sup[i * SUPPORT_STRIDE] / L;
      if (u > 0) a[row + i] = (u * u) / 2;
    }
    for (let j = 0; j < fixed.length; j++) {
      const u = sk - sup[fixed[j] * SUPPORT_STRIDE] / L;
      if (u > 0) a[row + n + j] = -u;
    }
    a[row + t0Col] = 1;
  }
}

/**
 * Solves a statically indeterminate member.
 * @param pm - validated model whose supports passed the stability classification
 * @returns the solution, or null when the equations are singular (supports too close to tell apart)
 */
export function solveIndeterminate(pm: PackedModel): IndeterminateSolution | null {
  const n = pm.supportCount;
  const L = pm.span;
  const fixed = fixedList(pm);
  const m = n + fixed.length + 2;
  const pw = buildSegments(pm);
  loadJumps(pw, pm);
  march(pw, 0, 0);
  if (matrix.length < m * m) {
    matrix = new Float64Array(m * m);
    rhs = new Float64Array(m);
  }
  const a = matrix;
  const b = rhs;
  for (let i = 0; i < m * m; i++) a[i] = 0;
  assemble(pm, fixed, a, m);
  b[0] = -marchEnd[0];
  b[1] = -marchEnd[1] / L;
  const L2 = L * L;
  const L3 = L2 * L;
  for (let k = 0; k < n; k++) {
    const bp = breakpointIndex(pw.buf, pw.n + 1, pm.supports[k * SUPPORT_STRIDE]);
    b[2 + k] = -riseAtBreakpoint(pw, bp) / L3;
  }
  for (let f = 0; f < fixed.length; f++) {
    const bp = breakpointIndex(pw.buf, pw.n + 1, pm.supports[fixed[f] * SUPPORT_STRIDE]);
    b[2 + n + f] = -slopeAtBreakpoint(pw, bp) / L2;
  }
  if (!solveInPlace(a, b, m, PIVOT_TOLERANCE)) return null;
  const reactions = new Array<number>(n);
  const couples = new Array<number>(n);
  for (let i = 0; i < n; i++) {
    reactions[i] = b[i] + 0; // + 0 turns -0 into 0
    couples[i] = 0;
  }
  for (let j = 0; j < fixed.length; j++) couples[fixed[j]] = b[n + j] * L + 0;
  reactionJumps(pw, pm, reactions, couples);
  march(pw, b[n + fixed.length] * L2, b[n + fixed.length + 1] * L3);
  return { reactions, couples, piecewise: pw };
}
