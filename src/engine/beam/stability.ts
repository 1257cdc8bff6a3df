/**
 * Whether a set of supports can hold a member, and which solution path applies. A member needs
 * either a fixed support or pins at two different positions; two supports at one position
 * cannot share their reaction in a determined way and are reported rather than guessed at.
 */
import { fail, type Result } from "../errors";
import * as packed from "./packed";
import type { PackedModel } from "./packed";

// Module-level aliases of imported bindings used in loops: when the sources are run as CommonJS
// (tsx, ts-node) every imported binding is read through an accessor, which costs more than the
// arithmetic around it. Reading each once at load keeps the loops to plain local constants.
const { SUPPORT_STRIDE, TYPE_FIXED } = packed;

/** How the reactions are found. */
export type SupportLayout =
  | { readonly kind: "twoPins"; readonly first: number; readonly second: number }
  | { readonly kind: "cantilever"; readonly fixed: number }
  | { readonly kind: "indeterminate" };

const INDETERMINATE: SupportLayout = Object.freeze({ kind: "indeterminate" });
const TWO_PINS: SupportLayout = Object.freeze({ kind: "twoPins", first: 0, second: 1 });
const CANTILEVER: SupportLayout = Object.freeze({ kind: "cantilever", fixed: 0 });

function positionOf(pm: PackedModel, i: number): number {
  return pm.supports[i * SUPPORT_STRIDE];
}

function isFixed(pm: PackedModel, i: number): boolean {
  return pm.supports[i * SUPPORT_STRIDE + 1] === TYPE_FIXED;
}

/** Indices of the supports sorted by position (stable), for the coincidence check. */
function sortedIndices(pm: PackedModel): Int32Array {
  const n = pm.supportCount;
  const order = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    let j = i;
    const x = positionOf(pm, i);
    while (j > 0 && positionOf(pm, order[j - 1]) > x) {
      order[j] = order[j - 1];
      j--;
    }
    order[j] = i;
  }
  return order;
}

function coincidence(pm: PackedModel): Result<never> | null {
  const order = sortedIndices(pm);
  for (let k = 1; k < order.length; k++) {
    const a = order[k - 1];
    const b = order[k];
    if (positionOf(pm, a) === positionOf(pm, b)) {
      const first = Math.min(a, b) + 1;
      const second = Math.max(a, b) + 1;
      return fail(
        "invalid",
        `rows ${first} and ${second} are both at x = ${positionOf(pm, a)}; two supports at one point cannot share the reaction in a determined way. Merge them into one support (fixed if either is fixed).`,
        "supports",
        second,
      );
    }
  }
  return null;
}

/**
 * Classifies the supports. Fails with `unstable` when they cannot hold the member (none, a
 * single pin, or pins all at one point) and with `invalid` when two supports share a position.
 * @param pm - the validated model
 * @returns the solution path to take
 */
export function classifySupports(pm: PackedModel): Result<SupportLayout> {
  const n = pm.supportCount;
  if (n === 0) return fail("unstable", "the member is unstable (nothing holds it); add supports, for example pins at both ends.", "supports");
  let fixedCount = 0;
  let allAtOnePoint = true;
  const x0 = positionOf(pm, 0);
  for (let i = 0; i < n; i++) {
    if (isFixed(pm, i)) fixedCount++;
    if (positionOf(pm, i) !== x0) allAtOnePoint = false;
  }
  if (fixedCount === 0 && allAtOnePoint) {
    const detail =
      n === 1
        ? "the member is unstable (a single pin cannot hold it); add a support or make one fixed."
        : `the member is unstable (all ${n} pins are at x = ${x0}, so it can turn about that point); add a support elsewhere or make one fixed.`;
    return fail("unstable", detail, "supports");
  }
  if (n === 1) return { ok: true, value: CANTILEVER };
  const clash = n === 2 && positionOf(pm, 0) !== positionOf(pm, 1) ? null : coincidence(pm);
  if (clash) return clash;
  if (n === 2 && fixedCount === 0) return { ok: true, value: TWO_PINS };
  return { ok: true, value: INDETERMINATE };
}
