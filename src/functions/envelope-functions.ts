/**
 * Governing-value worksheet functions (namespace LOADPATH, docs/interface.md section 1): one
 * member with its unfactored loads by case, over a combination set and the live load patterns of
 * ASCE/SEI 7-22 Sec. 4.3.3 (GOVERNING), and its deflection against span ratios segment by segment
 * (DEFLECTION_CHECK). The mechanics are the envelope engine's (src/engine/envelope); this file reads
 * the arguments and picks the quantity asked for.
 *
 * A takedown sheet asks for a dozen quantities of each member (M+, M-, |V|, each reaction, with the
 * combination and pattern of each): the member's envelope is computed once per distinct arguments
 * and kept in a {@link MemberCache}, whichever quantity a cell asks for.
 *
 * Conventions: loads down +, reactions up +, bending moment sagging +, deflection down +.
 */
/* eslint-disable @typescript-eslint/no-explicit-any -- parameter types are what the metadata generator maps */
import type { BeamLoad, Support } from "../engine/beam/types";
import {
  builtInCombinations,
  combinationsOfSet,
  deflectionCheck,
  envelope,
  type DeflectionCheck,
  type DeflectionResult,
  type Envelope,
  type FactoredCombination,
  type Governing,
} from "../engine/envelope";
import { fail, ok, type EngineError, type Result } from "../engine/errors";
import { COMBINATION_TABLE_MAX_ROWS, parseCombinationMethod, parseCombinationTable } from "../engine/loads";
import { SERVICE_SET } from "../engine/loads/combination-sets";
import type { LoadCase } from "../engine/loads/combinations";
import { arg, asHostNumber, defineArgs, formatNumber, runFunction, type Grid } from "./args";
import { DEFLECTION_UNITS, parseLoads, parseSupports, UNITS_CHOICES } from "./beam-args";
import { MemberCache } from "./member-cache";
import { MAX_LOAD_ROWS, MAX_SUPPORT_ROWS } from "./spill";

const LOAD_SHAPE = {
  maxRows: MAX_LOAD_ROWS,
  widths: [4, 5],
  columns: "kind | magnitude | start | end | end magnitude, or magnitude | start | end | end magnitude",
} as const;

/** The cases a member function takes, in argument order. */
const CASES = ["D", "L", "Lr", "S", "R"] as const satisfies readonly LoadCase[];

const SPAN = arg.number("span", { greaterThan: 0 });
const D = arg.optionalNumberOrRange("D", LOAD_SHAPE);
const L = arg.optionalNumberOrRange("L", LOAD_SHAPE);
const LR = arg.optionalNumberOrRange("Lr", LOAD_SHAPE);
const S = arg.optionalNumberOrRange("S", LOAD_SHAPE);
const R = arg.optionalNumberOrRange("R", LOAD_SHAPE);
const SUPPORTS = arg.optionalRange("supports", { maxRows: MAX_SUPPORT_ROWS, widths: [1, 2], columns: "position | type" });

const GOVERNING_WHAT = { value: "value", combination: "combination", pattern: "pattern", case: "case" } as const;
const GOVERNING_ARGS = defineArgs(
  SPAN,
  arg.text("quantity"),
  D,
  L,
  LR,
  S,
  R,
  SUPPORTS,
  // a method key (one cell) or a combinations range, header row first
  arg.optionalRange("method", { maxRows: COMBINATION_TABLE_MAX_ROWS + 1 }),
  arg.optionalNumber("live_factor", 1, { atLeast: 0, atMost: 1 }),
  arg.optionalText("what", "value", GOVERNING_WHAT),
);

const CHECK_WHAT = { live: "live", total: "total", "live limit": "live limit", "total limit": "total limit", ratio: "ratio", "required I": "required I" } as const;
const DEFLECTION_CHECK_ARGS = defineArgs(
  SPAN,
  arg.number("E", { greaterThan: 0 }),
  arg.optionalNumber("I", undefined, { greaterThan: 0 }),
  arg.text("units", UNITS_CHOICES, "unknownUnits"),
  D,
  L,
  LR,
  S,
  R,
  SUPPORTS,
  arg.optionalNumber("live_ratio", 360, { greaterThan: 0 }),
  arg.optionalNumber("total_ratio", 240, { greaterThan: 0 }),
  arg.optionalText("what", "live", CHECK_WHAT),
);

/** The loads of the five cases as coerced (a number, 0 = none, or a range). */
interface CaseArgs {
  readonly span: number;
  readonly D: number | Grid;
  readonly L: number | Grid;
  readonly Lr: number | Grid;
  readonly S: number | Grid;
  readonly R: number | Grid;
  readonly supports: Grid | undefined;
}

/** An error about the `loads` of one case restated with the case's argument name ("L, row 2: ..."). */
function asCase(error: EngineError, name: string): Result<never> {
  if (error.argument !== "loads") return { ok: false, error };
  const detail = error.message.replace(/^loads(, row \d+)?: /, "");
  return fail(error.code, detail, name, error.row);
}

/** The member's supports and loads by case; a case given as 0 or left blank carries nothing. */
function memberOf(a: CaseArgs): Result<{ span: number; supports: Support[]; loads: Partial<Record<LoadCase, BeamLoad[]>> }> {
  const supports = parseSupports(a.supports, a.span);
  if (!supports.ok) return supports;
  const loads: Partial<Record<LoadCase, BeamLoad[]>> = {};
  for (const c of CASES) {
    const v = a[c];
    if (v === 0) continue;
    const parsed = parseLoads(v, a.span);
    if (!parsed.ok) return asCase(parsed.error, c);
    if (parsed.value.items.length > 0) loads[c] = [...parsed.value.items];
  }
  return ok({ span: a.span, supports: [...supports.value.items], loads });
}

/** An engine error of the envelope ("L loads, row 2: ...") named by the user's argument. */
function engineError(error: EngineError): Result<never> {
  const m = /^(D|L|Lr|S|R) loads$/.exec(error.argument ?? "");
  if (m) return fail(error.code, error.message.replace(/^(D|L|Lr|S|R) loads(, row \d+)?: /, ""), m[1]!, error.row);
  return { ok: false, error };
}

/**
 * The combinations of the `method` argument: a key (LRFD, ASD, service) in one cell, or a
 * combinations range (header row Combination | Method | D | L | Lr | S | R | W | E): its LRFD rows
 * when it has some, else the rows of its only method.
 */
function combinationsOf(method: Grid | undefined): Result<FactoredCombination[]> {
  if (method === undefined || (method.length === 1 && method[0]!.length === 1)) {
    const cell = method?.[0]?.[0] ?? null;
    if (cell !== null && typeof cell !== "string") return fail("unknownKey", `${typeof cell === "number" ? formatNumber(cell) : String(cell)} is not a method; use LRFD, ASD, service or a combinations range.`, "method");
    const key = parseCombinationMethod(cell);
    if (!key.ok) return key;
    return ok(key.value === "service" ? combinationsOfSet(SERVICE_SET) : builtInCombinations({ method: key.value, halfLive: false }));
  }
  const sets = parseCombinationTable(method, "method");
  if (!sets.ok) return sets;
  const pick = sets.value.find((s) => s.method === "LRFD") ?? (sets.value.length === 1 ? sets.value[0] : undefined);
  if (pick === undefined) return fail("invalid", `the combinations range holds ${sets.value.map((s) => s.method).join(", ")} rows and no LRFD rows; give the rows of one method.`, "method");
  return ok(combinationsOfSet(pick));
}

/**
 * Members kept: a sheet asks for 14 governing cells per member, and a spreadsheet engine may
 * evaluate them column by column, so the cache holds a whole floor's members, not a few hundred.
 */
const ENVELOPE_CACHE_SIZE = 8192;

/** Envelopes computed, by every argument that defines them. */
const ENVELOPES = new MemberCache<Result<Envelope>>(ENVELOPE_CACHE_SIZE);

type GoverningArgs = CaseArgs & { readonly method: Grid | undefined; readonly live_factor: number };

function envelopeOf(a: GoverningArgs): Result<Envelope> {
  return ENVELOPES.get({ span: a.span, loads: a.D, supports: a.supports, extra: [a.L, a.Lr, a.S, a.R, a.method, a.live_factor] }, () => {
    const member = memberOf(a);
    if (!member.ok) return member;
    const combinations = combinationsOf(a.method);
    if (!combinations.ok) return combinations;
    const loads = { ...member.value.loads };
    // The live load reduction factor multiplies L (ASCE/SEI 7-22 Sec. 4.7: the reduced live load).
    if (loads.L !== undefined && a.live_factor !== 1) loads.L = loads.L.map((l) => scale(l, a.live_factor));
    const r = envelope({ span: member.value.span, supports: member.value.supports, loads }, combinations.value);
    return r.ok ? r : engineError(r.error);
  });
}

function scale(l: BeamLoad, k: number): BeamLoad {
  if (l.kind === "line") return { ...l, w1: l.w1 * k, w2: l.w2 * k };
  if (l.kind === "point") return { ...l, p: l.p * k };
  return { ...l, m: l.m * k };
}

/** The governing value a quantity names: "moment max", "moment min", "shear max", "reaction max N", "reaction min N". */
function quantityOf(text: string, env: Envelope): Result<Governing> {
  const t = text.trim().toLowerCase().replace(/\s+/g, " ");
  if (t === "moment max") return ok(env.momentMax);
  if (t === "moment min") return ok(env.momentMin);
  if (t === "shear max") return ok(env.shearMax);
  const m = /^reaction (max|min) (\d+)$/.exec(t);
  if (m) {
    const list = m[1] === "max" ? env.reactionMax : env.reactionMin;
    const n = Number(m[2]);
    if (n >= 1 && n <= list.length) return ok(list[n - 1]!);
    return fail("invalid", `support ${n} is not one of the member's ${list.length} supports (1 to ${list.length}, in the order given).`, "quantity");
  }
  return fail("unknownKey", `"${text}" is not a quantity; use "moment max", "moment min", "shear max", "reaction max N" or "reaction min N" (N = support number).`, "quantity");
}

/**
 * The governing factored value of one quantity of a member over the load combinations and the
 * live load patterns: L and Lr applied span by span and on each overhang (every on/off pattern,
 * ASCE/SEI 7-22 Sec. 4.3.3 partial loading), D, S and R everywhere. Quantities: "moment max"
 * (largest sagging, >= 0), "moment min" (most hogging, <= 0), "shear max" (largest |V|),
 * "reaction max N" and "reaction min N" (support N in the order given, up +; a negative minimum is
 * uplift). what "combination" names the governing combination, "pattern" the live load pattern
 * (e.g. "L on span 1"), "case" both. Combination factors recalled from memory: verify.
 * Example: two equal 6 m spans, D 2 and L 3 kN/m: =LOADPATH.GOVERNING(12, "reaction max 2", 2, 3, , , , {0;6;12})
 * gives 1.25 x (1.2 x 2 + 1.6 x 3) x 6 = 54 kN.
 * @customfunction GOVERNING
 * @param span Member length, overhangs included (ft, m or any length unit consistent with the loads).
 * @param quantity "moment max", "moment min", "shear max", "reaction max N" or "reaction min N".
 * @param D Dead loads, unfactored: a uniform line load over the whole length, or a range of loads (kind | magnitude | start | end | end magnitude, or magnitude | start | end | end magnitude). Blank or 0 = none.
 * @param [L] Live loads, unfactored, same form. Patterned span by span. Blank or 0 = none.
 * @param [Lr] Roof live loads, same form. Patterned span by span. Blank or 0 = none.
 * @param [S] Snow loads, same form, applied everywhere. Blank or 0 = none.
 * @param [R] Rain loads, same form, applied everywhere. Blank or 0 = none.
 * @param [supports] Range of support rows: position | type (pin, roller or fixed), or one column of pin positions. Default: pins at 0 and span.
 * @param [method] "LRFD" (default, ASCE/SEI 7-22 Sec. 2.3.1), "ASD" (Sec. 2.4.1), "service", or a combinations range with the header row Combination | Method | D | L | Lr | S | R | W | E (its LRFD rows, else the rows of its one method).
 * @param [live_factor] Live load reduction factor L/Lo multiplying L, 0 to 1. Default 1 (no reduction).
 * @param [what] "value" (default), "combination" (its label), "pattern" (where the live load is on) or "case" (combination; pattern).
 * @returns The governing value (force or force x length of the loads), or its combination or pattern as text.
 */
export function governing(span: any, quantity: any, D: any[][], L?: any[][], Lr?: any[][], S?: any[][], R?: any[][], supports?: any[][], method?: any[][], live_factor?: any, what?: any): any {
  return runFunction(GOVERNING_ARGS, [span, quantity, D, L, Lr, S, R, supports, method, live_factor, what], (a): Result<number | string> => {
    const env = envelopeOf(a);
    if (!env.ok) return env;
    const g = quantityOf(a.quantity, env.value);
    if (!g.ok) return g;
    if (a.what === "combination") return ok(g.value.combination);
    if (a.what === "pattern") return ok(g.value.pattern);
    if (a.what === "case") return ok(`${g.value.combination}; ${g.value.pattern}`);
    return ok(g.value.value);
  });
}

/** Deflection checks computed (EI-free: deflections times EI), by every argument that defines them. */
const CHECKS = new MemberCache<Result<DeflectionCheck>>(ENVELOPE_CACHE_SIZE);

type CheckArgs = CaseArgs & { readonly live_ratio: number; readonly total_ratio: number };

function checkOf(a: CheckArgs): Result<DeflectionCheck> {
  return CHECKS.get({ span: a.span, loads: a.D, supports: a.supports, extra: [a.L, a.Lr, a.S, a.R, a.live_ratio, a.total_ratio] }, () => {
    const member = memberOf(a);
    if (!member.ok) return member;
    const r = deflectionCheck(member.value, { limits: { live: a.live_ratio, total: a.total_ratio } });
    if (!r.ok) return r.error.argument === "live limit" ? fail(r.error.code, r.error.message.replace(/^live limit: /, ""), "live_ratio") : engineError(r.error);
    return r;
  });
}

/** The allowable of a check (length of the member), or that of the first span when nothing deflects. */
function allowableOf(check: DeflectionCheck, which: "live" | "total", ratio: number): number {
  const r: DeflectionResult | null = check[which];
  if (r !== null) return r.allowable;
  const seg = check.segments.find((s) => s.segment.kind === "span") ?? check.segments[0]!;
  const length = seg.segment.end - seg.segment.start;
  return (seg.segment.kind === "overhang" ? 2 * length : length) / ratio;
}

/**
 * Deflection of a member against span ratios, segment by segment: each span between supports is
 * held to its own length / ratio and each overhang to twice its length / ratio (common practice),
 * live load (L, Lr, 0.7S, R and their 0.75 combinations, ASCE/SEI 7-22 Sec. 2.4.1 less D, recalled
 * from memory) and total load (the same with D) under every live load pattern. The segment with the
 * largest deflection / allowable governs. Defaults L/360 live and L/240 total (common practice).
 * Units key as for DEFLECTION_MAX. Example: 6 m simple span, L = 3 kN/m, E = 11000 MPa,
 * I = 200e6 mm^4: =LOADPATH.DEFLECTION_CHECK(6, 11000, 200e6, "kN-m", 0, 3) gives 23.0 mm.
 * @customfunction DEFLECTION_CHECK
 * @param span Member length, overhangs included (ft for kip-ft, m for kN-m).
 * @param E Modulus of elasticity (ksi for kip-ft, MPa for kN-m).
 * @param I Moment of inertia (in^4 for kip-ft, mm^4 for kN-m); may be blank when what is "live limit", "total limit" or "required I".
 * @param units "kip-ft" (or "US"), "kN-m" (or "SI") or "consistent".
 * @param D Dead loads, unfactored: a uniform line load or a range of loads. Blank or 0 = none.
 * @param [L] Live loads, same form. Blank or 0 = none.
 * @param [Lr] Roof live loads, same form. Blank or 0 = none.
 * @param [S] Snow loads, same form. Blank or 0 = none.
 * @param [R] Rain loads, same form. Blank or 0 = none.
 * @param [supports] Range of support rows: position | type (pin, roller or fixed), or one column of pin positions. Default: pins at 0 and span.
 * @param [live_ratio] Live load limit as span/ratio. Default 360.
 * @param [total_ratio] Total load limit as span/ratio. Default 240.
 * @param [what] "live" (default: governing live load deflection, down +), "total", "live limit", "total limit" (allowable deflection of the governing segment), "ratio" (largest deflection / allowable, <= 1 passes) or "required I" (least I meeting both limits).
 * @returns Deflection or allowable (in for kip-ft, mm for kN-m), a ratio, or I (in^4 or mm^4).
 */
export function deflectionCheckFn(span: any, E: any, I: any, units: any, D: any[][], L?: any[][], Lr?: any[][], S?: any[][], R?: any[][], supports?: any[][], live_ratio?: any, total_ratio?: any, what?: any): number {
  return asHostNumber(
    runFunction(DEFLECTION_CHECK_ARGS, [span, E, I, units, D, L, Lr, S, R, supports, live_ratio, total_ratio, what], (a): Result<number> => {
      const check = checkOf(a);
      if (!check.ok) return check;
      const u = DEFLECTION_UNITS[a.units as keyof typeof DEFLECTION_UNITS];
      const c = check.value;
      // deflection [in or mm] = factor x (EI x deflection) / (E x I); allowable [in or mm] = length/ratio x deflectionPerLength
      if (a.what === "live limit") return ok(allowableOf(c, "live", a.live_ratio) * u.deflectionPerLength);
      if (a.what === "total limit") return ok(allowableOf(c, "total", a.total_ratio) * u.deflectionPerLength);
      if (a.what === "required I") return ok((u.factor * c.requiredEI) / (a.E * u.deflectionPerLength));
      if (a.I === undefined) return fail("missing", `is blank; "${a.what}" needs the moment of inertia (only "live limit", "total limit" and "required I" do without).`, "I");
      if (a.what === "ratio") return ok((u.factor * c.requiredEI) / (a.E * u.deflectionPerLength) / a.I);
      const r = a.what === "live" ? c.live : c.total;
      return ok(r === null ? 0 : (u.factor * r.deflectionEI) / (a.E * a.I));
    }),
  );
}
