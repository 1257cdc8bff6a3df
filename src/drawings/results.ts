/**
 * What the shear, moment and deflection panels show, taken from the engine's solution: curves
 * through its critical points, the exact extremes it reports, zero crossings refined on its
 * exact functions.
 */
import type { BeamSolution, Extreme } from "../engine/beam/types";
import { type CurvePoint, sampleCurve, type SidedFunction, zeroCrossings } from "./curves";
import { distinctPositions } from "./frame";
import type { PanelExtreme, PanelSpec } from "./panels";
import type { MemberDrawing } from "./types";

function criticalOf(solution: BeamSolution, span: number): number[] {
  return distinctPositions([0, span, ...solution.criticalPoints()].filter((x) => x >= 0 && x <= span), 1e-12 * span);
}

function largest(curve: readonly CurvePoint[], extremes: readonly Extreme[]): number {
  return Math.max(0, ...curve.map((p) => Math.abs(p.v)), ...extremes.map((e) => Math.abs(e.value)));
}

/** Extremes worth a label: not zero (to a relative 1e-9 of the largest value). */
function significant(extremes: readonly (PanelExtreme | null)[], scale: number): PanelExtreme[] {
  return extremes.filter((e): e is PanelExtreme => e !== null && Math.abs(e.value) > 1e-9 * scale);
}

/**
 * The shear diagram: V = dM/dx, positive drawn up; the largest-magnitude shear labelled.
 * @param drawing - the member
 * @param solution - its solution
 */
export function shearPanel(drawing: MemberDrawing, solution: BeamSolution): PanelSpec {
  const f: SidedFunction = (x, side) => solution.shearAt(x, side);
  const curve = sampleCurve(criticalOf(solution, drawing.span), drawing.span, f);
  const vMax = solution.maxShear();
  const scale = largest(curve, [vMax]);
  return {
    role: "shear",
    title: "Shear V",
    note: "+ drawn up",
    unit: drawing.units.force,
    lengthUnit: drawing.units.length,
    curve,
    positiveUp: true,
    closed: true,
    extremes: significant([{ value: vMax.value, x: vMax.x, kind: "max-shear" }], scale),
    crossings: scale > 0 ? zeroCrossings(curve, f, 1e-9 * scale, drawing.span) : [],
    guides: drawing.supports.map((s) => s.x),
    plotHeight: 56,
  };
}

/**
 * The bending moment diagram: sagging positive, drawn up; largest sagging and most hogging
 * labelled; inflection points (sign changes) marked.
 * @param drawing - the member
 * @param solution - its solution
 */
export function momentPanel(drawing: MemberDrawing, solution: BeamSolution): PanelSpec {
  const f: SidedFunction = (x, side) => solution.momentAt(x, side);
  const curve = sampleCurve(criticalOf(solution, drawing.span), drawing.span, f);
  const sag = solution.maxSagging();
  const hog = solution.maxHogging();
  const scale = largest(curve, [sag, hog]);
  return {
    role: "moment",
    title: "Moment M",
    note: "sagging + drawn up",
    unit: drawing.units.moment,
    lengthUnit: drawing.units.length,
    curve,
    positiveUp: true,
    closed: true,
    extremes: significant(
      [
        { value: sag.value, x: sag.x, kind: "max-sagging" },
        { value: hog.value, x: hog.x, kind: "max-hogging" },
      ],
      scale,
    ),
    crossings: scale > 0 ? zeroCrossings(curve, f, 1e-9 * scale, drawing.span) : [],
    guides: drawing.supports.map((s) => s.x),
    plotHeight: 64,
  };
}

/**
 * The deflected shape, downward positive and drawn down, in units.deflection; null when EI is
 * not given (or not positive).
 * @param drawing - the member (drawing.ei in force·length²)
 * @param solution - its solution
 */
export function deflectionPanel(drawing: MemberDrawing, solution: BeamSolution): PanelSpec | null {
  const ei = drawing.ei;
  if (ei === undefined || !(ei > 0) || !Number.isFinite(ei)) return null;
  const k = drawing.units.deflectionPerLength / ei;
  const f: SidedFunction = (x) => solution.deflectionEIAt(x) * k;
  const curve = sampleCurve(criticalOf(solution, drawing.span), drawing.span, f);
  const down = solution.maxDeflectionEI();
  const up = solution.minDeflectionEI();
  const scale = largest(curve, [
    { value: down.value * k, x: down.x },
    { value: up.value * k, x: up.x },
  ]);
  return {
    role: "deflection",
    title: "Deflection",
    note: "down + drawn down",
    unit: drawing.units.deflection,
    lengthUnit: drawing.units.length,
    curve,
    positiveUp: false,
    closed: false,
    extremes: significant(
      [
        { value: down.value * k, x: down.x, kind: "max-down" },
        { value: up.value * k, x: up.x, kind: "max-up" },
      ],
      scale,
    ),
    crossings: [],
    guides: drawing.supports.map((s) => s.x),
    plotHeight: 44,
  };
}
