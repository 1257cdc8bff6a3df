/**
 * Public types of the single-member solver. Conventions (docs/interface.md section 1):
 * x runs from the left end (0) to the right end (span). Gravity loads are positive
 * downward. Reactions are positive upward. Bending moment is positive sagging. Shear V = dM/dx
 * (so V just right of a simple left support equals its reaction). Applied moments and reaction
 * couples are counter-clockwise positive. Deflection is positive downward; slope is the
 * rotation of the member, counter-clockwise positive.
 */

export type SupportType = "pin" | "fixed";

/** A support at position x: pin = vertical restraint only, fixed = vertical + rotation. */
export interface Support {
  readonly x: number;
  readonly type: SupportType;
}

/** A line load varying linearly from w1 at `start` to w2 at `end` (force/length, down +). */
export interface LineLoad {
  readonly kind: "line";
  readonly start: number;
  readonly end: number;
  readonly w1: number;
  readonly w2: number;
}

/** A concentrated force p (down +) at x. */
export interface PointLoad {
  readonly kind: "point";
  readonly x: number;
  readonly p: number;
}

/** An applied couple m (counter-clockwise +) at x. */
export interface MomentLoad {
  readonly kind: "moment";
  readonly x: number;
  readonly m: number;
}

/** Any load on the member. */
export type BeamLoad = LineLoad | PointLoad | MomentLoad;

/** One straight member with constant EI: its length, supports and loads (any consistent units). */
export interface BeamModel {
  /** Length of the member, > 0. */
  readonly span: number;
  readonly supports: readonly Support[];
  readonly loads: readonly BeamLoad[];
}

/** An extreme value and where it occurs. */
export interface Extreme {
  readonly value: number;
  readonly x: number;
}

/**
 * The exact piecewise solution of one member. Deflection-type results are returned
 * multiplied by EI (EI * deflection, EI * slope): with constant EI the reactions do not depend
 * on EI, and the functions layer divides by EI with the unit conversion it needs.
 */
export interface BeamSolution {
  readonly model: BeamModel;
  /** Vertical reaction at each support, in the order given, upward +. */
  readonly reactions: readonly number[];
  /** Reaction couple at each support, counter-clockwise +; 0 at pins. */
  readonly reactionMoments: readonly number[];
  /** Bending moment in the member at each support position (sagging +). */
  readonly supportMoments: readonly number[];
  /**
   * Shear at x; side "right" (default) is just right of x, "left" just left of x. At x = 0 and
   * x = span both sides give the value inside the member. NaN for x outside 0..span (positions
   * within 1e-12 x span of an end count as the end) or not finite; the same holds for the other
   * *At methods.
   */
  shearAt(x: number, side?: "left" | "right"): number;
  /** Bending moment at x (sagging +); side as for shear (differs only at an applied moment). */
  momentAt(x: number, side?: "left" | "right"): number;
  /** EI times the rotation at x (counter-clockwise +). */
  slopeEIAt(x: number): number;
  /** EI times the deflection at x (downward +). */
  deflectionEIAt(x: number): number;
  /** Largest sagging moment (value >= 0; 0 at x of the first point when there is none). */
  maxSagging(): Extreme;
  /** Most hogging moment (value <= 0; 0 when there is none). */
  maxHogging(): Extreme;
  /** Shear of largest magnitude, signed value. */
  maxShear(): Extreme;
  /** Largest downward EI*deflection (value >= 0) and its position. */
  maxDeflectionEI(): Extreme;
  /** Largest upward EI*deflection, as a value <= 0, and its position. */
  minDeflectionEI(): Extreme;
  /**
   * Positions where something changes: ends, supports, load ends, point loads, and the
   * interior points where V = 0, q = 0 (largest |V| inside a segment) or slope = 0. Sorted,
   * unique; a fresh array on every call.
   */
  criticalPoints(): number[];
}
