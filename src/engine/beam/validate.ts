/**
 * Input checks of the single-member solver. Every failure names its argument and, for the
 * `loads` and `supports` lists, the 1-based row (index + 1), as docs/interface.md section 1 states.
 */
import * as errors from "../errors";
import type { Result } from "../errors";
import * as packed from "./packed";
import type { PackedModel } from "./packed";
import type { BeamModel } from "./types";

// Module-level aliases of imported bindings used in loops: when the sources are run as CommonJS
// (tsx, ts-node) every imported binding is read through an accessor, which costs more than the
// arithmetic around it. Reading each once at load keeps the loops to plain local constants.
const { fail, ok } = errors;
const { doubles, KIND_LINE, KIND_MOMENT, KIND_POINT, LOAD_STRIDE, SUPPORT_STRIDE, TYPE_FIXED, TYPE_PIN } = packed;

/** Most loads one member may carry. */
export const MAX_LOADS = 1000;
/** Most supports one member may have. */
export const MAX_SUPPORTS = 100;
/**
 * Positions within this fraction of the span outside 0..span are taken as the end itself
 * (a computed position a rounding error past the end is still at the end).
 */
export const POSITION_TOLERANCE = 1e-12;

type Failure = Result<never>;

function isFiniteNumber(v: unknown): v is number {
  return typeof v === "number" && Number.isFinite(v);
}

function describe(v: unknown): string {
  return typeof v === "string" ? `"${v}"` : String(v);
}

function checkSpan(span: unknown): Failure | null {
  if (!isFiniteNumber(span)) return fail("notANumber", `must be a finite number; got ${describe(span)}.`, "span");
  if (span <= 0) return fail("notPositive", `must be greater than 0; got ${span}.`, "span");
  return null;
}

/** Null when `v` is a finite number within the member (with tolerance), else the failure. */
function checkPosition(v: unknown, name: string, span: number, argument: string, row: number): Failure | null {
  if (!isFiniteNumber(v)) return fail("notANumber", `${name} must be a finite number; got ${describe(v)}.`, argument, row);
  const tol = POSITION_TOLERANCE * span;
  if (v < -tol || v > span + tol) return fail("outOfMember", `${name} ${v} is outside the member (0 to ${span}).`, argument, row);
  return null;
}

function clamp(v: number, span: number): number {
  return v < 0 ? 0 : v > span ? span : v;
}

function checkMagnitude(v: unknown, name: string, row: number): Failure | null {
  return isFiniteNumber(v) ? null : fail("notANumber", `${name} must be a finite number; got ${describe(v)}.`, "loads", row);
}

/** Validates one load and writes it at `o` in `out`; returns the failure or null. */
function packLoad(load: unknown, row: number, span: number, out: number[], o: number): Failure | null {
  if (typeof load !== "object" || load === null) return fail("unknownKind", `expected a load (line, point or moment); got ${describe(load)}.`, "loads", row);
  const l = load as Record<string, unknown>;
  const kind = l.kind;
  if (kind === "line") {
    const e =
      checkPosition(l.start, "start", span, "loads", row) ??
      checkPosition(l.end, "end", span, "loads", row) ??
      checkMagnitude(l.w1, "magnitude", row) ??
      checkMagnitude(l.w2, "end magnitude", row);
    if (e) return e;
    const a = clamp(l.start as number, span);
    const b = clamp(l.end as number, span);
    if (b < a) return fail("invalid", `end ${b} is before start ${a}.`, "loads", row);
    out[o] = KIND_LINE;
    out[o + 1] = a;
    out[o + 2] = b;
    out[o + 3] = l.w1 as number;
    out[o + 4] = l.w2 as number;
    return null;
  }
  if (kind === "point" || kind === "moment") {
    const e = checkPosition(l.x, "position", span, "loads", row) ?? checkMagnitude(kind === "point" ? l.p : l.m, "magnitude", row);
    if (e) return e;
    const x = clamp(l.x as number, span);
    out[o] = kind === "point" ? KIND_POINT : KIND_MOMENT;
    out[o + 1] = x;
    out[o + 2] = x;
    out[o + 3] = (kind === "point" ? l.p : l.m) as number;
    out[o + 4] = 0;
    return null;
  }
  return fail("unknownKind", `kind ${describe(kind)} is not one of line, point, moment.`, "loads", row);
}

function packSupport(support: unknown, row: number, span: number, out: number[], o: number): Failure | null {
  if (typeof support !== "object" || support === null) return fail("unknownSupportType", `expected a support (position and type); got ${describe(support)}.`, "supports", row);
  const s = support as Record<string, unknown>;
  const e = checkPosition(s.x, "position", span, "supports", row);
  if (e) return e;
  const type = s.type;
  if (type !== "pin" && type !== "fixed") return fail("unknownSupportType", `type ${describe(type)} is not one of pin, fixed.`, "supports", row);
  out[o] = clamp(s.x as number, span);
  out[o + 1] = type === "fixed" ? TYPE_FIXED : TYPE_PIN;
  return null;
}

/**
 * Checks a model and copies it into the solver's flat form. Fails with `notANumber`,
 * `notPositive`, `outOfMember`, `invalid` (end before start), `unknownKind`,
 * `unknownSupportType`, `badShape` (loads or supports not a list) or `tooManyRows`
 * (more than {@link MAX_LOADS} loads or {@link MAX_SUPPORTS} supports).
 * @param model - span (length > 0), supports and loads in consistent units
 * @returns the packed copy, or the first failure found
 */
export function packModel(model: BeamModel): Result<PackedModel> {
  if (typeof model !== "object" || model === null) return fail("missing", "no member was given.");
  const spanError = checkSpan(model.span);
  if (spanError) return spanError;
  const span = model.span;
  const loads = model.loads;
  const supports = model.supports;
  if (!Array.isArray(loads)) return fail("badShape", "must be a list of loads.", "loads");
  if (!Array.isArray(supports)) return fail("badShape", "must be a list of supports.", "supports");
  if (loads.length > MAX_LOADS) return fail("tooManyRows", `${loads.length} loads given; at most ${MAX_LOADS} are allowed.`, "loads");
  if (supports.length > MAX_SUPPORTS) return fail("tooManyRows", `${supports.length} supports given; at most ${MAX_SUPPORTS} are allowed.`, "supports");
  const packedLoads = doubles(loads.length * LOAD_STRIDE);
  for (let i = 0; i < loads.length; i++) {
    const e = packLoad(loads[i], i + 1, span, packedLoads, i * LOAD_STRIDE);
    if (e) return e;
  }
  const packedSupports = doubles(supports.length * SUPPORT_STRIDE);
  for (let i = 0; i < supports.length; i++) {
    const e = packSupport(supports[i], i + 1, span, packedSupports, i * SUPPORT_STRIDE);
    if (e) return e;
  }
  return ok({ span, loadCount: loads.length, supportCount: supports.length, loads: packedLoads, supports: packedSupports });
}
