/**
 * Reactions of the statically determinate layouts (two pins; one fixed support) from
 * equilibrium alone: no matrix, no allocation beyond the result arrays.
 */
import * as packed from "./packed";
import type { PackedModel } from "./packed";

// Module-level aliases of imported bindings used in loops: when the sources are run as CommonJS
// (tsx, ts-node) every imported binding is read through an accessor, which costs more than the
// arithmetic around it. Reading each once at load keeps the loops to plain local constants.
const { KIND_LINE, KIND_MOMENT, KIND_POINT, LOAD_STRIDE, SUPPORT_STRIDE } = packed;

/** Total downward load (force). */
export function totalLoad(pm: PackedModel): number {
  const d = pm.loads;
  let w = 0;
  for (let o = 0; o < pm.loadCount * LOAD_STRIDE; o += LOAD_STRIDE) {
    const kind = d[o];
    if (kind === KIND_POINT) w += d[o + 3];
    else if (kind === KIND_LINE) w += ((d[o + 3] + d[o + 4]) * (d[o + 2] - d[o + 1])) / 2;
  }
  return w;
}

/**
 * Clockwise moment of all loads about position p (force x length): downward forces to the right
 * of p turn clockwise; applied couples are counter-clockwise positive, so they count negative.
 */
export function clockwiseMomentAbout(pm: PackedModel, p: number): number {
  const d = pm.loads;
  let m = 0;
  for (let o = 0; o < pm.loadCount * LOAD_STRIDE; o += LOAD_STRIDE) {
    const kind = d[o];
    if (kind === KIND_POINT) m += d[o + 3] * (d[o + 1] - p);
    else if (kind === KIND_MOMENT) m -= d[o + 3];
    else {
      const a = d[o + 1];
      const c = d[o + 2] - a;
      const w1 = d[o + 3];
      const w2 = d[o + 4];
      // resultant (w1 + w2) c / 2 acting at a + c (w1 + 2 w2) / (3 (w1 + w2)), without the division
      m += ((w1 + w2) * c * (a - p)) / 2 + (c * c * (w1 + 2 * w2)) / 6;
    }
  }
  return m;
}

/**
 * Two pins at different positions: each reaction from moments about the other pin.
 * @returns reactions in support order (upward +)
 */
export function twoPinReactions(pm: PackedModel, first: number, second: number): number[] {
  const xa = pm.supports[first * SUPPORT_STRIDE];
  const xb = pm.supports[second * SUPPORT_STRIDE];
  const d = xb - xa;
  const r = [0, 0];
  r[second] = clockwiseMomentAbout(pm, xa) / d + 0; // + 0 turns -0 into 0
  r[first] = -clockwiseMomentAbout(pm, xb) / d + 0;
  return r;
}

/**
 * One fixed support: vertical reaction = total load; the reaction couple (counter-clockwise +)
 * balances the loads' moment about the support.
 * @returns [vertical reaction, reaction couple]
 */
export function cantileverReactions(pm: PackedModel, fixed: number): [number, number] {
  const s = pm.supports[fixed * SUPPORT_STRIDE];
  return [totalLoad(pm) + 0, clockwiseMomentAbout(pm, s) + 0]; // + 0 turns -0 into 0
}
