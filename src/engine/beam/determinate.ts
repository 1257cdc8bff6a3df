/**
 * The piecewise solution of a statically determinate member, built on first need: the reactions
 * are known from statics, so one march from x = 0 with zero initial slope and deflection gives
 * the shape up to a rigid-body motion, which the support conditions then fix.
 */
import * as packed from "./packed";
import type { PackedModel } from "./packed";
import * as piecewise from "./piecewise";
import type { Piecewise } from "./piecewise";
import type { SupportLayout } from "./stability";

// Module-level aliases of imported bindings used in loops: when the sources are run as CommonJS
// (tsx, ts-node) every imported binding is read through an accessor, which costs more than the
// arithmetic around it. Reading each once at load keeps the loops to plain local constants.
const { SUPPORT_STRIDE } = packed;
const { addRigidMotion, breakpointIndex, buildSegments, loadJumps, march, reactionJumps, riseAtBreakpoint, slopeAtBreakpoint } = piecewise;

/**
 * Builds the piecewise solution for known reactions.
 * @param layout - "twoPins" (deflection 0 at both) or "cantilever" (deflection and slope 0)
 * @param reactions - vertical reaction per support
 * @param couples - reaction couple per support
 */
export function buildDeterminate(pm: PackedModel, layout: SupportLayout, reactions: ArrayLike<number>, couples: ArrayLike<number>): Piecewise {
  const pw = buildSegments(pm);
  loadJumps(pw, pm);
  reactionJumps(pw, pm, reactions, couples);
  march(pw, 0, 0);
  const count = pw.n + 1;
  if (layout.kind === "twoPins") {
    const xa = pm.supports[layout.first * SUPPORT_STRIDE];
    const xb = pm.supports[layout.second * SUPPORT_STRIDE];
    const ya = riseAtBreakpoint(pw, breakpointIndex(pw.buf, count, xa));
    const yb = riseAtBreakpoint(pw, breakpointIndex(pw.buf, count, xb));
    addRigidMotion(pw, -(yb - ya) / (xb - xa), -ya, xa);
  } else if (layout.kind === "cantilever") {
    const s = pm.supports[layout.fixed * SUPPORT_STRIDE];
    const k = breakpointIndex(pw.buf, count, s);
    addRigidMotion(pw, -slopeAtBreakpoint(pw, k), -riseAtBreakpoint(pw, k), s);
  }
  return pw;
}
