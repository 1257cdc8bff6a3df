/**
 * The exact single-member solver: any supports (pins and fixed, anywhere), any line loads
 * (uniform, trapezoidal, triangular, full or partial), point loads and couples. Conventions and
 * units: see types.ts (docs/interface.md section 1); any consistent units.
 */
import * as errors from "../errors";
import type { Result } from "../errors";
import * as indeterminate from "./indeterminate";
import * as solution from "./solution";
import * as stability from "./stability";
import * as statics from "./statics";
import type { BeamModel, BeamSolution } from "./types";
import * as validate from "./validate";

export type { BeamLoad, BeamModel, BeamSolution, Extreme, LineLoad, MomentLoad, PointLoad, Support, SupportType } from "./types";
export { MAX_LOADS, MAX_SUPPORTS } from "./validate";

// Module-level aliases of imported bindings: when the sources are run as CommonJS (tsx, ts-node)
// every imported binding is read through an accessor, which costs more than solving a simple span.
const { fail, ok } = errors;
const { solveIndeterminate } = indeterminate;
const { PackedBeamSolution } = solution;
const { classifySupports } = stability;
const { cantileverReactions, twoPinReactions } = statics;
const { packModel } = validate;

/**
 * Solves one straight member with constant EI by the piecewise closed-form solution.
 *
 * Fails (never throws) with the codes of validate.ts for bad input, `unstable` when the supports
 * cannot hold the member (none, one pin, pins all at one point, or supports too close together
 * to tell apart) and `invalid` when two supports share a position.
 *
 * @param model - span (length > 0), supports (position 0..span, pin or fixed) and loads
 *   (positions 0..span; line loads in force/length down +, point loads in force down +,
 *   couples in force x length counter-clockwise +)
 * @returns the solution: reactions (force, up +), reaction couples, V, M, EI x slope and
 *   EI x deflection anywhere, and their exact extremes
 * @example
 * const r = solveBeam({ span: 20, supports: [{ x: 0, type: "pin" }, { x: 20, type: "pin" }],
 *   loads: [{ kind: "line", start: 0, end: 20, w1: 1.5, w2: 1.5 }] });
 * if (r.ok) r.value.maxSagging().value; // 75 = wL^2/8
 */
export function solveBeam(model: BeamModel): Result<BeamSolution> {
  const packed = packModel(model);
  if (!packed.ok) return packed;
  const pm = packed.value;
  const layoutResult = classifySupports(pm);
  if (!layoutResult.ok) return layoutResult;
  const layout = layoutResult.value;
  if (layout.kind === "twoPins") {
    return ok(new PackedBeamSolution(pm, layout, twoPinReactions(pm, layout.first, layout.second), [0, 0], null));
  }
  if (layout.kind === "cantilever") {
    const [r, c] = cantileverReactions(pm, layout.fixed);
    return ok(new PackedBeamSolution(pm, layout, [r], [c], null));
  }
  const solved = solveIndeterminate(pm);
  if (solved === null) {
    return fail(
      "unstable",
      "the supports are too close together to tell apart (the equations of the member are singular); merge supports that are almost at one position.",
      "supports",
    );
  }
  return ok(new PackedBeamSolution(pm, layout, solved.reactions, solved.couples, solved.piecewise));
}
