/**
 * The solution object handed to callers. Reactions are computed when solving; the piecewise
 * polynomials of a determinate member, every extreme, the critical points and the copy of the
 * model are computed on first request and cached.
 */
import * as determinate from "./determinate";
import * as evaluate from "./evaluate";
import * as extremes from "./extremes";
import * as packed from "./packed";
import type { PackedModel } from "./packed";
import type { Piecewise } from "./piecewise";
import type { SupportLayout } from "./stability";
import * as validate from "./validate";
import type { BeamLoad, BeamModel, BeamSolution, Extreme, Support } from "./types";

// Module-level aliases of imported bindings used in loops: when the sources are run as CommonJS
// (tsx, ts-node) every imported binding is read through an accessor, which costs more than the
// arithmetic around it. Reading each once at load keeps the loops to plain local constants.
const { momentIn, riseIn, segmentOf, segStart, shearIn, slopeIn } = evaluate;
const { criticalPositions, deflectionExtremes, momentExtremes, shearExtreme } = extremes;
const { KIND_LINE, KIND_POINT, LOAD_STRIDE, SUPPORT_STRIDE, TYPE_FIXED } = packed;
const { buildDeterminate } = determinate;
const { POSITION_TOLERANCE } = validate;

function unpack(pm: PackedModel): BeamModel {
  const loads: BeamLoad[] = [];
  const d = pm.loads;
  for (let o = 0; o < pm.loadCount * LOAD_STRIDE; o += LOAD_STRIDE) {
    const kind = d[o];
    const load: BeamLoad =
      kind === KIND_LINE
        ? { kind: "line", start: d[o + 1], end: d[o + 2], w1: d[o + 3], w2: d[o + 4] }
        : kind === KIND_POINT
          ? { kind: "point", x: d[o + 1], p: d[o + 3] }
          : { kind: "moment", x: d[o + 1], m: d[o + 3] };
    loads.push(Object.freeze(load));
  }
  const supports: Support[] = [];
  for (let i = 0; i < pm.supportCount; i++) {
    const type = pm.supports[i * SUPPORT_STRIDE + 1] === TYPE_FIXED ? "fixed" : "pin";
    supports.push(Object.freeze({ x: pm.supports[i * SUPPORT_STRIDE], type }));
  }
  return Object.freeze({ span: pm.span, supports: Object.freeze(supports), loads: Object.freeze(loads) });
}

/** {@link BeamSolution} over a packed model; construct through `solveBeam`. */
export class PackedBeamSolution implements BeamSolution {
  readonly reactions: readonly number[];
  readonly reactionMoments: readonly number[];
  private readonly pm: PackedModel;
  private readonly layout: SupportLayout;
  private pw: Piecewise | null;
  private modelCopy: BeamModel | null = null;
  private supportMomentCache: readonly number[] | null = null;
  private sagging: Extreme | null = null;
  private hogging: Extreme | null = null;
  private shear: Extreme | null = null;
  private deflectionDown: Extreme | null = null;
  private deflectionUp: Extreme | null = null;
  private critical: number[] | null = null;

  /**
   * @param pm - validated packed model (owned by the solution from now on)
   * @param layout - how the reactions were found
   * @param reactions - vertical reaction per support, upward +
   * @param couples - reaction couple per support, counter-clockwise +, 0 at pins
   * @param pw - the piecewise solution when already built, else null (built on first need)
   */
  constructor(pm: PackedModel, layout: SupportLayout, reactions: number[], couples: number[], pw: Piecewise | null) {
    this.pm = pm;
    this.layout = layout;
    this.reactions = reactions;
    this.reactionMoments = couples;
    this.pw = pw;
  }

  /** A frozen copy of the model as solved (positions within rounding of an end are at the end). */
  get model(): BeamModel {
    if (this.modelCopy === null) this.modelCopy = unpack(this.pm);
    return this.modelCopy;
  }

  /** Bending moment in the member at each support (the larger-magnitude side at a jump). */
  get supportMoments(): readonly number[] {
    if (this.supportMomentCache === null) {
      const out: number[] = [];
      for (let i = 0; i < this.pm.supportCount; i++) {
        const x = this.pm.supports[i * SUPPORT_STRIDE];
        const left = this.momentAt(x, "left");
        const right = this.momentAt(x, "right");
        out.push(Math.abs(left) > Math.abs(right) ? left : right);
      }
      this.supportMomentCache = Object.freeze(out);
    }
    return this.supportMomentCache;
  }

  private piecewise(): Piecewise {
    if (this.pw === null) this.pw = buildDeterminate(this.pm, this.layout, this.reactions, this.reactionMoments);
    return this.pw;
  }

  /** x clamped onto the member when within rounding of it, NaN when outside or not finite. */
  private onMember(x: number): number {
    const L = this.pm.span;
    const tol = POSITION_TOLERANCE * L;
    if (!(x >= -tol && x <= L + tol)) return NaN;
    return x < 0 ? 0 : x > L ? L : x;
  }

  /**
   * Shear at x (0..span); NaN outside the member.
   * @param x - position from the left end (length)
   * @param side - "right" (default) just right of x, "left" just left of x; at the ends the value inside the member
   */
  shearAt(x: number, side: "left" | "right" = "right"): number {
    const xc = this.onMember(x);
    if (Number.isNaN(xc)) return NaN;
    const pw = this.piecewise();
    const k = segmentOf(pw, xc, side !== "left");
    return shearIn(pw.buf, segStart(pw, k), xc - pw.buf[k]);
  }

  /**
   * Bending moment at x (sagging +); NaN outside the member.
   * @param x - position from the left end (length)
   * @param side - as for {@link shearAt}; differs only at a couple
   */
  momentAt(x: number, side: "left" | "right" = "right"): number {
    const xc = this.onMember(x);
    if (Number.isNaN(xc)) return NaN;
    const pw = this.piecewise();
    const k = segmentOf(pw, xc, side !== "left");
    return momentIn(pw.buf, segStart(pw, k), xc - pw.buf[k]);
  }

  /**
   * EI times the rotation at x (counter-clockwise +); NaN outside the member.
   * @param x - position from the left end (length)
   */
  slopeEIAt(x: number): number {
    const xc = this.onMember(x);
    if (Number.isNaN(xc)) return NaN;
    const pw = this.piecewise();
    const k = segmentOf(pw, xc, true);
    return slopeIn(pw.buf, segStart(pw, k), xc - pw.buf[k]);
  }

  /**
   * EI times the deflection at x (downward +); NaN outside the member.
   * @param x - position from the left end (length)
   */
  deflectionEIAt(x: number): number {
    const xc = this.onMember(x);
    if (Number.isNaN(xc)) return NaN;
    const pw = this.piecewise();
    const k = segmentOf(pw, xc, true);
    return -riseIn(pw.buf, segStart(pw, k), xc - pw.buf[k]);
  }

  private moments(): void {
    const e = momentExtremes(this.piecewise());
    this.sagging = e.sagging;
    this.hogging = e.hogging;
  }

  /** Largest sagging moment (>= 0) and its position; 0 at x = 0 when nothing sags. */
  maxSagging(): Extreme {
    if (this.sagging === null) this.moments();
    return this.sagging as Extreme;
  }

  /** Most hogging moment (<= 0) and its position; 0 at x = 0 when nothing hogs. */
  maxHogging(): Extreme {
    if (this.hogging === null) this.moments();
    return this.hogging as Extreme;
  }

  /** Shear of largest magnitude (signed) and its position (leftmost of equals). */
  maxShear(): Extreme {
    if (this.shear === null) this.shear = shearExtreme(this.piecewise());
    return this.shear;
  }

  private deflections(): void {
    const e = deflectionExtremes(this.piecewise());
    this.deflectionDown = e.down;
    this.deflectionUp = e.up;
  }

  /** Largest downward EI * deflection (>= 0) and its position. */
  maxDeflectionEI(): Extreme {
    if (this.deflectionDown === null) this.deflections();
    return this.deflectionDown as Extreme;
  }

  /** Largest upward EI * deflection as a value <= 0, and its position. */
  minDeflectionEI(): Extreme {
    if (this.deflectionUp === null) this.deflections();
    return this.deflectionUp as Extreme;
  }

  /** Sorted unique critical positions (a fresh array on every call). */
  criticalPoints(): number[] {
    if (this.critical === null) this.critical = criticalPositions(this.piecewise());
    return this.critical.slice();
  }
}
