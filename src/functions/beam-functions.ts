/**
 * Beam worksheet functions (namespace LOADPATH, docs/interface.md section 1): exact reactions, shears,
 * moments and deflections of one straight member with constant EI.
 *
 * The JSDoc of each `@customfunction` is the help Excel shows; functions.json is generated from
 * it at build time, and the build appends the `CustomFunctions.associate` calls to this file.
 * Bodies are mechanics only: arguments are declared once below and checked by the shared runner.
 *
 * Conventions: loads down +, reactions up +, bending moment sagging + (tension at the bottom),
 * deflection down +, applied couples counter-clockwise +.
 */
/* eslint-disable @typescript-eslint/no-explicit-any -- parameter types are what the metadata generator maps */
import { fail, ok, type Result } from "../engine/errors";
import { solveBeam } from "../engine/beam";
import { memberSegments } from "../engine/envelope";
import type { BeamSolution } from "../engine/beam/types";
import { arg, asHostMatrix, asHostNumber, defineArgs, formatNumber, runFunction, type Grid } from "./args";
import { beamModel, DEFLECTION_UNITS, UNITS_CHOICES, withRangeRow, type MemberInput } from "./beam-args";
import { diagramTable } from "./diagram";
import { MemberCache } from "./member-cache";
import { DEFAULT_STATIONS, MAX_LOAD_ROWS, MAX_STATIONS, MAX_SUPPORT_ROWS, padToSize, shapeOfValue, spillSize } from "./spill";

const SPAN = arg.number("span", { greaterThan: 0 });
const LOADS = arg.numberOrRange("loads", {
  maxRows: MAX_LOAD_ROWS,
  widths: [4, 5],
  columns: "kind | magnitude | start | end | end magnitude, or magnitude | start | end | end magnitude",
});
const SUPPORTS = arg.optionalRange("supports", { maxRows: MAX_SUPPORT_ROWS, widths: [1, 2], columns: "position | type" });
const X = arg.number("x");
const E = arg.number("E", { greaterThan: 0 });
const I = arg.number("I", { greaterThan: 0 });
const UNITS = arg.text("units", UNITS_CHOICES, "unknownUnits");
const WHAT = arg.optionalText("what", "reaction", { reaction: "reaction", reactions: "reaction", force: "reaction", moment: "moment", moments: "moment" });

const MEMBER_ARGS = defineArgs(SPAN, LOADS, SUPPORTS);
const REACTIONS_ARGS = defineArgs(SPAN, LOADS, SUPPORTS, WHAT);
const REACTION_ARGS = defineArgs(SPAN, LOADS, arg.number("index", { atLeast: 1, integer: true }), SUPPORTS);
const AT_ARGS = defineArgs(SPAN, LOADS, X, SUPPORTS);
const DEFLECTION_MAX_ARGS = defineArgs(SPAN, LOADS, E, I, UNITS, SUPPORTS);
const DEFLECTION_AT_ARGS = defineArgs(SPAN, LOADS, E, I, UNITS, X, SUPPORTS);
const REQUIRED_I_ARGS = defineArgs(SPAN, LOADS, E, arg.number("ratio", { greaterThan: 0 }), UNITS, SUPPORTS);
const DIAGRAM_ARGS = defineArgs(SPAN, LOADS, SUPPORTS, arg.optionalNumber("stations", DEFAULT_STATIONS, { atLeast: 1, atMost: MAX_STATIONS, integer: true }));

/** A solved member with the range rows its loads and supports came from. */
interface Solved {
  readonly solution: BeamSolution;
  readonly input: MemberInput;
}

/** Recently solved members (REACTION at each end, SHEAR_MAX and MOMENT_MAX of one member solve it once). */
const SOLVED = new MemberCache<Result<Solved>>();

/** Solve the member the arguments describe; engine errors are restated with the user's range rows. */
function solve(a: { readonly span: number; readonly loads: number | Grid; readonly supports: Grid | undefined }): Result<Solved> {
  return SOLVED.get(a, () => solveAnew(a));
}

function solveAnew(a: Parameters<typeof solve>[0]): Result<Solved> {
  const input = beamModel(a.span, a.loads, a.supports);
  if (!input.ok) return input;
  const solved = solveBeam(input.value.model);
  return solved.ok ? ok({ solution: solved.value, input: input.value }) : { ok: false, error: withRangeRow(solved.error, input.value) };
}

/** Apply `f` to a solved member. */
function withSolution<T>(a: Parameters<typeof solve>[0], f: (s: BeamSolution, input: MemberInput) => Result<T>): Result<T> {
  const s = solve(a);
  return s.ok ? f(s.value.solution, s.value.input) : s;
}

/**
 * One value per support placed in the cell of its supports row (a blank row gets ""); with the
 * default supports (none given) the two pins fill the first two cells.
 */
function alignToSupportRows(values: readonly number[], input: MemberInput, cols: number): Result<(number | string)[][]> {
  const cellOf = input.supportRows.length > 0 ? input.supportRows.map((r) => r - 1) : values.map((_, i) => i);
  if (cellOf.some((c) => c >= cols)) {
    return fail("badShape", `the range is blank, so pins at 0 and span apply, but its ${cols} row leaves room for ${cols} reaction; leave supports out or fill the support rows.`, "supports");
  }
  const row: (number | string)[] = Array.from({ length: cols }, () => "");
  values.forEach((v, i) => (row[cellOf[i]!] = v));
  return ok([row]);
}

/** A position argument checked to lie on the member. */
function onMember(x: number, spanLen: number, name: string): Result<number> {
  return x >= 0 && x <= spanLen ? ok(x) : fail("outOfMember", `${formatNumber(x)} is outside the member (0 to ${formatNumber(spanLen)}).`, name);
}

/** Side at which a value "at x" is read: just right of x, except at the right end (just left). */
function sideAt(x: number, spanLen: number): "left" | "right" {
  return x >= spanLen ? "left" : "right";
}

/**
 * Vertical reactions (upward +) at every support, in the order the supports are given, spilled
 * across one row; what = "moment" gives instead the bending moment in the member at each support
 * (sagging +, so a continuous or fixed support usually shows a negative value).
 * The row has one cell per row of the supports range, each reaction in the cell of its support's
 * row (a blank row gives a blank cell); 2 cells when supports is left out.
 * @customfunction REACTIONS
 * @param span Member length (ft, m or any length unit consistent with the loads).
 * @param loads A uniform line load over the whole length (e.g. kip/ft), or a range with one load per row: kind | magnitude | start | end | end magnitude (kind line, point or moment), or magnitude | start | end | end magnitude. Gravity loads down positive.
 * @param [supports] Range of support rows: position | type (pin, roller or fixed), or one column of pin positions. Default: pins at 0 and span.
 * @param [what] "reaction" (default) for vertical reactions, "moment" for the bending moment in the member at each support.
 * @returns One row: a value per support.
 */
export function reactions(span: any, loads: any[][], supports?: any[][], what?: any): any[][] {
  const raw = [span, loads, supports, what];
  const size = spillSize("REACTIONS", raw.map(shapeOfValue))!;
  return asHostMatrix(
    runFunction(REACTIONS_ARGS, raw, (a) =>
      withSolution(a, (s, input) => alignToSupportRows(a.what === "moment" ? s.supportMoments : s.reactions, input, size.cols)),
    ),
  );
}

/**
 * One vertical reaction (upward +): the reaction at the support numbered index, counting the
 * supports in the order given (blank support rows are not counted).
 * @customfunction REACTION
 * @param span Member length (ft, m or any length unit consistent with the loads).
 * @param loads A uniform line load over the whole length, or a range of loads (kind | magnitude | start | end | end magnitude, or magnitude | start | end | end magnitude).
 * @param index Which support: 1 for the first support given, 2 for the second, ...
 * @param [supports] Range of support rows: position | type (pin, roller or fixed), or one column of pin positions. Default: pins at 0 and span.
 * @returns The reaction, in the force unit of the loads.
 */
export function reaction(span: any, loads: any[][], index: any, supports?: any[][]): number {
  return asHostNumber(
    runFunction(REACTION_ARGS, [span, loads, index, supports], (a) =>
      withSolution(a, (s) =>
        a.index <= s.reactions.length ? ok(s.reactions[a.index - 1]!) : fail("invalid", `${a.index} is beyond the ${s.reactions.length} supports of the member.`, "index"),
      ),
    ),
  );
}

/**
 * Largest absolute shear in the member, as a magnitude (>= 0), wherever it occurs (usually just
 * beside a support or a point load).
 * @customfunction SHEAR_MAX
 * @param span Member length (ft, m or any length unit consistent with the loads).
 * @param loads A uniform line load over the whole length, or a range of loads (kind | magnitude | start | end | end magnitude, or magnitude | start | end | end magnitude).
 * @param [supports] Range of support rows: position | type (pin, roller or fixed), or one column of pin positions. Default: pins at 0 and span.
 * @returns The largest shear magnitude, in the force unit of the loads.
 */
export function shearMax(span: any, loads: any[][], supports?: any[][]): number {
  return asHostNumber(runFunction(MEMBER_ARGS, [span, loads, supports], (a) => withSolution(a, (s) => ok(Math.abs(s.maxShear().value)))));
}

/**
 * Largest sagging bending moment (tension at the bottom), >= 0; 0 when nothing sags. Found
 * exactly where the shear is zero or at a load or support, not by sampling.
 * @customfunction MOMENT_MAX
 * @param span Member length (ft, m or any length unit consistent with the loads).
 * @param loads A uniform line load over the whole length, or a range of loads (kind | magnitude | start | end | end magnitude, or magnitude | start | end | end magnitude).
 * @param [supports] Range of support rows: position | type (pin, roller or fixed), or one column of pin positions. Default: pins at 0 and span.
 * @returns The largest sagging moment (e.g. kip-ft with kip/ft and ft).
 */
export function momentMax(span: any, loads: any[][], supports?: any[][]): number {
  return asHostNumber(runFunction(MEMBER_ARGS, [span, loads, supports], (a) => withSolution(a, (s) => ok(s.maxSagging().value))));
}

/**
 * Most hogging bending moment (tension at the top), <= 0; 0 when nothing hogs. Over an interior
 * support of a continuous member, at a fixed end or at a cantilever's root.
 * @customfunction MOMENT_MIN
 * @param span Member length (ft, m or any length unit consistent with the loads).
 * @param loads A uniform line load over the whole length, or a range of loads (kind | magnitude | start | end | end magnitude, or magnitude | start | end | end magnitude).
 * @param [supports] Range of support rows: position | type (pin, roller or fixed), or one column of pin positions. Default: pins at 0 and span.
 * @returns The most negative moment (e.g. kip-ft with kip/ft and ft).
 */
export function momentMin(span: any, loads: any[][], supports?: any[][]): number {
  return asHostNumber(runFunction(MEMBER_ARGS, [span, loads, supports], (a) => withSolution(a, (s) => ok(s.maxHogging().value))));
}

/**
 * Shear at position x, just to the right of x (at the right end, just to the left). Shear is
 * V = dM/dx: just right of a simple left support it equals that support's reaction.
 * @customfunction SHEAR_AT
 * @param span Member length (ft, m or any length unit consistent with the loads).
 * @param loads A uniform line load over the whole length, or a range of loads (kind | magnitude | start | end | end magnitude, or magnitude | start | end | end magnitude).
 * @param x Position from the left end, 0 to span.
 * @param [supports] Range of support rows: position | type (pin, roller or fixed), or one column of pin positions. Default: pins at 0 and span.
 * @returns The shear at x, in the force unit of the loads.
 */
export function shearAt(span: any, loads: any[][], x: any, supports?: any[][]): number {
  return asHostNumber(
    runFunction(AT_ARGS, [span, loads, x, supports], (a) => {
      const at = onMember(a.x, a.span, "x");
      return at.ok ? withSolution(a, (s) => ok(s.shearAt(a.x, sideAt(a.x, a.span)))) : at;
    }),
  );
}

/**
 * Bending moment at position x (sagging +); at an applied couple, the value just to the right.
 * @customfunction MOMENT_AT
 * @param span Member length (ft, m or any length unit consistent with the loads).
 * @param loads A uniform line load over the whole length, or a range of loads (kind | magnitude | start | end | end magnitude, or magnitude | start | end | end magnitude).
 * @param x Position from the left end, 0 to span.
 * @param [supports] Range of support rows: position | type (pin, roller or fixed), or one column of pin positions. Default: pins at 0 and span.
 * @returns The moment at x (e.g. kip-ft with kip/ft and ft).
 */
export function momentAt(span: any, loads: any[][], x: any, supports?: any[][]): number {
  return asHostNumber(
    runFunction(AT_ARGS, [span, loads, x, supports], (a) => {
      const at = onMember(a.x, a.span, "x");
      return at.ok ? withSolution(a, (s) => ok(s.momentAt(a.x, sideAt(a.x, a.span)))) : at;
    }),
  );
}

/**
 * Largest downward deflection (>= 0; 0 when the member only rises), constant E and I. Units key:
 * "kip-ft" (span ft, loads kip/ft and kip, E ksi, I in^4, result in inches), "kN-m" (m, kN/m and
 * kN, E MPa, I mm^4, result in mm) or "consistent" (one consistent set, result in its length);
 * "US" and "SI" are accepted for kip-ft and kN-m.
 * @customfunction DEFLECTION_MAX
 * @param span Member length (ft for kip-ft, m for kN-m).
 * @param loads A uniform line load over the whole length, or a range of loads (kind | magnitude | start | end | end magnitude, or magnitude | start | end | end magnitude).
 * @param E Modulus of elasticity (ksi for kip-ft, MPa for kN-m), e.g. 29000 ksi for steel.
 * @param I Moment of inertia (in^4 for kip-ft, mm^4 for kN-m).
 * @param units "kip-ft" (or "US"), "kN-m" (or "SI") or "consistent".
 * @param [supports] Range of support rows: position | type (pin, roller or fixed), or one column of pin positions. Default: pins at 0 and span.
 * @returns The largest downward deflection (in for kip-ft, mm for kN-m).
 */
export function deflectionMax(span: any, loads: any[][], E: any, I: any, units: any, supports?: any[][]): number {
  return asHostNumber(
    runFunction(DEFLECTION_MAX_ARGS, [span, loads, E, I, units, supports], (a) =>
      withSolution(a, (s) => ok((DEFLECTION_UNITS[a.units as keyof typeof DEFLECTION_UNITS].factor * s.maxDeflectionEI().value) / (a.E * a.I))),
    ),
  );
}

/**
 * Deflection at position x (downward +), constant E and I. Units key as for DEFLECTION_MAX.
 * @customfunction DEFLECTION_AT
 * @param span Member length (ft for kip-ft, m for kN-m).
 * @param loads A uniform line load over the whole length, or a range of loads (kind | magnitude | start | end | end magnitude, or magnitude | start | end | end magnitude).
 * @param E Modulus of elasticity (ksi for kip-ft, MPa for kN-m).
 * @param I Moment of inertia (in^4 for kip-ft, mm^4 for kN-m).
 * @param units "kip-ft" (or "US"), "kN-m" (or "SI") or "consistent".
 * @param x Position from the left end, 0 to span.
 * @param [supports] Range of support rows: position | type (pin, roller or fixed), or one column of pin positions. Default: pins at 0 and span.
 * @returns The deflection at x (in for kip-ft, mm for kN-m).
 */
export function deflectionAt(span: any, loads: any[][], E: any, I: any, units: any, x: any, supports?: any[][]): number {
  return asHostNumber(
    runFunction(DEFLECTION_AT_ARGS, [span, loads, E, I, units, x, supports], (a) => {
      const at = onMember(a.x, a.span, "x");
      const k = DEFLECTION_UNITS[a.units as keyof typeof DEFLECTION_UNITS].factor;
      return at.ok ? withSolution(a, (s) => ok((k * s.deflectionEIAt(a.x)) / (a.E * a.I))) : at;
    }),
  );
}

/**
 * Least moment of inertia for which the deflection, up or down, of every part of the member is at
 * most its length/ratio (e.g. ratio 360 for L/360): a span between two supports is held to its own
 * length, an overhang to twice its length (a cantilever tip; common practice). Units key as for DEFLECTION_MAX; the result is in in^4 for
 * "kip-ft", mm^4 for "kN-m".
 * @customfunction REQUIRED_I
 * @param span Member length (ft for kip-ft, m for kN-m).
 * @param loads A uniform line load over the whole length, or a range of loads (kind | magnitude | start | end | end magnitude, or magnitude | start | end | end magnitude).
 * @param E Modulus of elasticity (ksi for kip-ft, MPa for kN-m).
 * @param ratio Deflection limit as span/ratio, e.g. 360 for L/360, 240 for L/240.
 * @param units "kip-ft" (or "US"), "kN-m" (or "SI") or "consistent".
 * @param [supports] Range of support rows: position | type (pin, roller or fixed), or one column of pin positions. Default: pins at 0 and span.
 * @returns The required moment of inertia (in^4 for kip-ft, mm^4 for kN-m).
 */
export function requiredI(span: any, loads: any[][], E: any, ratio: any, units: any, supports?: any[][]): number {
  return asHostNumber(
    runFunction(REQUIRED_I_ARGS, [span, loads, E, ratio, units, supports], (a) =>
      withSolution(a, (s, input) => {
        const u = DEFLECTION_UNITS[a.units as keyof typeof DEFLECTION_UNITS];
        const segments = memberSegments(a.span, input.model.supports);
        if (!segments.ok) return segments;
        // Each segment against its own limit: a span between supports over its length, an overhang
        // over twice its length (common practice). Extremes at the slope roots, supports, load ends.
        const points = s.criticalPoints();
        let required = 0;
        for (const seg of segments.value) {
          let worstEI = 0;
          for (const x of points) if (x >= seg.start && x <= seg.end) worstEI = Math.max(worstEI, Math.abs(s.deflectionEIAt(x)));
          const length = seg.kind === "overhang" ? 2 * (seg.end - seg.start) : seg.end - seg.start;
          // deflection = factor * EIdefl / (E I) <= allowed  <=>  I >= factor * EIdefl / (E * allowed)
          const allowed = (length * u.deflectionPerLength) / a.ratio;
          required = Math.max(required, (u.factor * worstEI) / (a.E * allowed));
        }
        return ok(required);
      }),
    ),
  );
}

/**
 * Shear and moment diagram as a table for a native chart: columns x | V | M at every support,
 * load and load end (two rows with the same x where the shear or moment jumps: left value, then
 * right), at every point of zero shear (the moment's extremes), and at evenly spaced stations
 * (every span/stations), sorted by x. Unused rows at the bottom are blank. The spill's height is
 * set by the sizes of the loads and supports ranges and by stations when typed as a number; a
 * stations value from another cell is sized for the default 20 in the headless evaluator.
 * @customfunction DIAGRAM
 * @param span Member length (ft, m or any length unit consistent with the loads).
 * @param loads A uniform line load over the whole length, or a range of loads (kind | magnitude | start | end | end magnitude, or magnitude | start | end | end magnitude).
 * @param [supports] Range of support rows: position | type (pin, roller or fixed), or one column of pin positions. Default: pins at 0 and span.
 * @param [stations] Number of equal intervals for the evenly spaced stations (default 20, at most 1000).
 * @returns Rows of x, V, M.
 */
export function diagram(span: any, loads: any[][], supports?: any[][], stations?: any): any[][] {
  const raw = [span, loads, supports, stations];
  const size = spillSize("DIAGRAM", raw.map(shapeOfValue))!;
  return asHostMatrix(
    runFunction(DIAGRAM_ARGS, raw, (a) =>
      withSolution(a, (s) => {
        const table = padToSize(diagramTable(s, a.stations), size);
        return table ? ok(table) : fail("invalid", "the diagram has more rows than its spill; please report this member.", "loads");
      }),
    ),
  );
}
