/**
 * Load combination sets as data: a set is a name, a method (LRFD, ASD or service) and rows, each
 * row a label, where it comes from, and one factor per load case D L Lr S R W E. The built-in
 * ASCE/SEI 7-22 sets and a firm's own Combinations table (parsed by {@link parseCombinationTable})
 * are the same type and go through the same evaluator ({@link evaluateCombinations}).
 *
 * Wind W and seismic E act in either direction: a row holding W (or E) is evaluated as given and
 * with W (or E) reversed, unless the set already lists the reversed row (the built-in sets list
 * both signs, in the standard's order, so nothing is added to them). A reversed row is labelled
 * with its row's label and "(-W)", "(-E)" or "(-W, -E)".
 *
 * Code values: the built-in LRFD and ASD sets are built in combinations.ts (builtInSet), recalled
 * from memory of ASCE/SEI 7-22 Sec. 2.3.1, 2.3.6, 2.4.1 and 2.4.5 (verify against the standard).
 * The service set is common practice, not a provision of the standard (see {@link SERVICE_ROWS}).
 */
import { fail, ok, type Result } from "../errors";
import { finite, normaliseKey } from "./checks";

/** The load cases of the basic combinations. */
export type LoadCase = "D" | "L" | "Lr" | "S" | "R" | "W" | "E";

/** The load cases in argument order of COMBINE and COMBOS (and the column order of a Combinations table). */
export const LOAD_CASES: readonly LoadCase[] = ["D", "L", "Lr", "S", "R", "W", "E"];

/** One load effect per case (missing cases are 0 for the caller to fill). */
export type LoadEffects = Readonly<Record<LoadCase, number>>;

/** Which end of the range of combined values governs. */
export type ExtremeKind = "max" | "min";

/** Strength design, allowable stress design, or service level (deflection, soil bearing). */
export type CombinationMethod = "LRFD" | "ASD" | "service";

/** The methods in the order sets are listed. */
export const COMBINATION_METHODS: readonly CombinationMethod[] = ["LRFD", "ASD", "service"];

/** One load combination: a label for the record and a factor per load case (missing = 0). */
export interface FactoredCombination {
  /** How a report names it, e.g. "2.3.1 (2) 1.2D + 1.6L + 0.5Lr", or a firm's own name. */
  readonly label: string;
  /** Load factor of each case (dimensionless); a missing case has factor 0. */
  readonly factors: Readonly<Partial<Record<LoadCase, number>>>;
}

/** One row of a combination set: a combination and where it comes from. */
export interface CombinationRow extends FactoredCombination {
  /** Provenance, e.g. "ASCE/SEI 7-22 Sec. 2.3.1, combination 2 (recalled from memory; verify)" or "Combinations table, row 4". */
  readonly source: string;
}

/** A named list of combinations of one method. */
export interface CombinationSet {
  /** e.g. "ASCE/SEI 7-22 LRFD" or "Combinations table, ASD". */
  readonly name: string;
  readonly method: CombinationMethod;
  readonly rows: readonly CombinationRow[];
}

/** A combination as evaluated (one sign of W and E) and its value. */
export interface EvaluatedCombination extends CombinationRow {
  readonly value: number;
}

/** The governing combination of a set and every combination's value, in the set's order. */
export interface CombinationResult {
  readonly governing: EvaluatedCombination;
  /** Every row with each sign of W and E, in the set's order (reversed rows right after their row). */
  readonly values: readonly EvaluatedCombination[];
}

/** Factor of a case in a combination (0 when missing). */
export function factorOf(combination: FactoredCombination, load: LoadCase): number {
  return combination.factors[load] ?? 0;
}

// ---------------------------------------------------------------------------------------------
// Built-in sets

const SERVICE_SOURCE =
  "service level as used for deflection and soil bearing checks: common practice, not a combination of ASCE/SEI 7-22; " +
  "factors as its Sec. 2.4.1 combinations 1-4 (recalled from memory; verify)";

/**
 * The built-in service set, common practice (not a list of the standard): the gravity
 * combinations of allowable stress design, ASCE/SEI 7-22 Sec. 2.4.1 combinations 1-4 as recalled
 * from memory, used at service level for deflection and soil bearing: D; D + L; D + (Lr or 0.7S
 * or R); D + 0.75L + 0.75(Lr or 0.7S or R). Snow enters as 0.7S because ASCE/SEI 7-22 gives S at
 * strength level (0.7S is its service-level value, as in Sec. 2.4.1, recalled from memory). No
 * wind or seismic rows: their service levels depend on a return period the firm chooses
 * (ASCE/SEI 7-22 Commentary Appendix C, recalled from memory); add them in a Combinations table.
 */
export const SERVICE_ROWS: readonly CombinationRow[] = Object.freeze(
  (
    [
      ["service (1) D", { D: 1 }],
      ["service (2) D + L", { D: 1, L: 1 }],
      ["service (3) D + Lr", { D: 1, Lr: 1 }],
      ["service (3) D + 0.7S", { D: 1, S: 0.7 }],
      ["service (3) D + R", { D: 1, R: 1 }],
      ["service (4) D + 0.75L + 0.75Lr", { D: 1, L: 0.75, Lr: 0.75 }],
      ["service (4) D + 0.75L + 0.75(0.7S)", { D: 1, L: 0.75, S: 0.75 * 0.7 }],
      ["service (4) D + 0.75L + 0.75R", { D: 1, L: 0.75, R: 0.75 }],
    ] as const
  ).map(([label, factors]): CombinationRow => ({ label, source: SERVICE_SOURCE, factors })),
);

/** A set frozen row by row (built-in sets and parsed tables are shared between calls). */
export function freezeSet(set: CombinationSet): CombinationSet {
  return Object.freeze({ ...set, rows: Object.freeze(set.rows.map((r) => Object.freeze({ ...r, factors: Object.freeze({ ...r.factors }) }))) });
}

/** The built-in service set (common practice, {@link SERVICE_ROWS}). */
export const SERVICE_SET: CombinationSet = freezeSet({ name: "service (common practice)", method: "service", rows: SERVICE_ROWS });

// ---------------------------------------------------------------------------------------------
// Evaluation

const W = 5; // index of W in LOAD_CASES
const E = 6; // index of E in LOAD_CASES

/** A set with every evaluated row's factors laid out in LOAD_CASES order, row-major. */
interface Compiled {
  readonly rows: readonly CombinationRow[];
  readonly factors: Float64Array;
}

const compiledSets = new WeakMap<CombinationSet, Compiled>();

function vectorOf(row: FactoredCombination): number[] {
  return LOAD_CASES.map((c) => factorOf(row, c));
}

function reversedRow(row: CombinationRow, vector: readonly number[], flipW: boolean, flipE: boolean): CombinationRow {
  const factors: Partial<Record<LoadCase, number>> = { ...row.factors };
  if (flipW) factors.W = -vector[W]!;
  if (flipE) factors.E = -vector[E]!;
  const what = [flipW ? "-W" : "", flipE ? "-E" : ""].filter((s) => s !== "").join(", ");
  return { label: `${row.label} (${what})`, source: `${row.source}; ${flipW && flipE ? "W and E" : flipW ? "W" : "E"} reversed`, factors };
}

/**
 * The rows a set is evaluated with: each row, then right after it its reversals in W and in E
 * (each, and both when the row holds both), leaving out any whose factors the set already lists.
 * @param set - the combination set
 */
export function expandedRows(set: CombinationSet): readonly CombinationRow[] {
  return compiledOf(set).rows;
}

function compiledOf(set: CombinationSet): Compiled {
  const cached = compiledSets.get(set);
  if (cached) return cached;
  const key = (v: readonly number[]): string => v.map((f) => (f === 0 ? 0 : f)).join(",");
  const listed = new Set(set.rows.map((r) => key(vectorOf(r))));
  const emitted = new Set<string>();
  const rows: CombinationRow[] = [];
  const vectors: number[][] = [];
  const push = (row: CombinationRow, v: number[]): void => {
    rows.push(row);
    vectors.push(v);
  };
  for (const row of set.rows) {
    const v = vectorOf(row);
    push(row, v);
    emitted.add(key(v));
    const flips: [boolean, boolean][] = [];
    if (v[W] !== 0) flips.push([true, false]);
    if (v[E] !== 0) flips.push([false, true]);
    if (v[W] !== 0 && v[E] !== 0) flips.push([true, true]);
    for (const [fw, fe] of flips) {
      const r = v.slice();
      if (fw) r[W] = -r[W]!;
      if (fe) r[E] = -r[E]!;
      const k = key(r);
      if (listed.has(k) || emitted.has(k)) continue;
      emitted.add(k);
      push(reversedRow(row, v, fw, fe), r);
    }
  }
  const factors = new Float64Array(rows.length * LOAD_CASES.length);
  vectors.forEach((v, i) => factors.set(v, i * LOAD_CASES.length));
  const compiled = { rows: Object.freeze(rows), factors };
  compiledSets.set(set, compiled);
  return compiled;
}

function effectVector(effects: LoadEffects): number[] {
  return [effects.D, effects.L, effects.Lr, effects.S, effects.R, effects.W, effects.E];
}

/** Sum of factor x effect over the 7 cases, always in LOAD_CASES order (so every path rounds alike). */
function dot(factors: ArrayLike<number>, offset: number, x: readonly number[]): number {
  let v = 0;
  for (let j = 0; j < 7; j++) v += factors[offset + j]! * x[j]!;
  return v;
}

/**
 * Every combination of a set with its value (W and E with both signs), no checks: the fast path
 * of the built-in functions, whose sets and effects are known to be good.
 */
export function combinationSetValues(set: CombinationSet, effects: LoadEffects): EvaluatedCombination[] {
  const { rows, factors } = compiledOf(set);
  const x = effectVector(effects);
  return rows.map((row, r) => ({ ...row, value: dot(factors, r * 7, x) }));
}

/** Index and value of the governing row of a compiled set; ties go to the first row. */
function governingIn(compiled: Compiled, x: readonly number[], extreme: ExtremeKind): { index: number; value: number } {
  const sign = extreme === "max" ? 1 : -1;
  let index = 0;
  let value = dot(compiled.factors, 0, x);
  for (let r = 1; r < compiled.rows.length; r++) {
    const v = dot(compiled.factors, r * 7, x);
    if (sign * v > sign * value) {
      index = r;
      value = v;
    }
  }
  return { index, value };
}

/**
 * Index (in {@link expandedRows}) and value of the governing combination of a set, no checks:
 * the fast path of the built-in functions (the set must have a row; see {@link evaluateCombinations}).
 */
export function governingIndex(set: CombinationSet, effects: LoadEffects, extreme: ExtremeKind): { index: number; value: number } {
  return governingIn(compiledOf(set), effectVector(effects), extreme);
}

/**
 * The evaluator of every combination set: the value of each combination (W and E with both
 * signs) and the governing one, the largest (`max`) or smallest (`min`: uplift, net tension);
 * ties go to the first in the set's order.
 * @param set - built-in ({@link builtInSet}) or a firm's ({@link parseCombinationTable})
 * @param effects - load effect of each case, one consistent unit, sign as computed
 * @param extreme - max or min
 * @returns the governing combination and the full list; an error for a set without rows, a
 *   non-finite factor (argument `combinations`, with the row) or effect (argument = the case)
 */
export function evaluateCombinations(set: CombinationSet, effects: LoadEffects, extreme: ExtremeKind): Result<CombinationResult> {
  if (set.rows.length === 0) return fail("missing", `the set "${set.name}" has no combination.`, "combinations");
  for (let i = 0; i < set.rows.length; i++) {
    for (const c of LOAD_CASES) {
      if (!Number.isFinite(factorOf(set.rows[i]!, c))) return fail("notANumber", `the factor of ${c} is not a finite number.`, "combinations", i + 1);
    }
  }
  for (const c of LOAD_CASES) {
    const f = finite(effects[c], c);
    if (!f.ok) return f;
  }
  const values = combinationSetValues(set, effects);
  const g = governingIn(compiledOf(set), effectVector(effects), extreme);
  return ok({ governing: values[g.index]!, values });
}

// ---------------------------------------------------------------------------------------------
// A firm's Combinations table

/** Most data rows of a Combinations table. */
export const COMBINATION_TABLE_MAX_ROWS = 200;

type Column = "Combination" | "Method" | "Source" | LoadCase;
const COLUMNS: readonly Column[] = ["Combination", "Method", ...LOAD_CASES, "Source"];

/** Header text without a trailing unit in parentheses, compared case-insensitively. */
function headerKey(text: string): string {
  return text.replace(/\([^()]*\)\s*$/, "").trim().toLowerCase();
}

/** A cell as a message shows it. */
function describeCell(cell: unknown): string {
  if (cell === null || cell === undefined || cell === "") return "blank";
  if (typeof cell === "string") return `"${cell.length > 40 ? cell.slice(0, 37) + "..." : cell}"`;
  if (typeof cell === "boolean") return cell ? "TRUE" : "FALSE";
  if (typeof cell === "number") return String(cell);
  if (typeof cell === "object" && "error" in cell) return `the error ${String((cell as { error: unknown }).error)}`;
  return "a value that is not a number or text";
}

function isBlank(cell: unknown): boolean {
  return cell === null || cell === undefined || (typeof cell === "string" && cell.trim() === "");
}

/** Text of a label, method or source cell ("" when blank). */
function textOf(cell: unknown): string | undefined {
  if (isBlank(cell)) return "";
  if (typeof cell === "string") return cell.trim();
  if (typeof cell === "number" && Number.isFinite(cell)) return String(cell);
  return undefined;
}

/** A factor: a number, text holding a number (" 1.2 "), blank = 0. */
function factorFrom(cell: unknown): number | undefined {
  if (isBlank(cell)) return 0;
  if (typeof cell === "number") return Number.isFinite(cell) ? cell : undefined;
  if (typeof cell === "string") {
    const t = cell.trim();
    if (!/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(t)) return undefined;
    const n = Number(t);
    return Number.isFinite(n) ? n : undefined;
  }
  return undefined;
}

/**
 * Reads a firm's Combinations table, `Combination | Method | D | L | Lr | S | R | W | E`, header
 * row first, into one set per method present (in the order LRFD, ASD, service).
 *
 * - Headers are matched case-insensitively, ignoring a trailing unit in parentheses; the case
 *   columns may come in any order and any may be left out (factor 0). An optional `Source`
 *   column gives each row's provenance (default "Combinations table, row N"). A blank header
 *   leaves its column unread; any other header is an error.
 * - A factor is a number or text holding one (" 1.2 "); blank is 0.
 * - Method is LRFD, ASD or service, case-insensitive; blank is an error.
 * - Rows that are entirely blank (or blank and 0, as some hosts pass blank cells) are skipped.
 * - Errors: a label used twice within one method (case-insensitive), a row with no factor, a row
 *   holding both W and E (wind and seismic are not combined; each reverses on its own row), a
 *   bad number, an unknown method, a missing Combination or Method column.
 * Messages name the argument, the 1-based row of the range (the header is row 1) and the column.
 * @param cells - the range's cell values, row-major (numbers, text, booleans, blanks as null)
 * @param argument - the argument name messages use (default "combinations")
 */
export function parseCombinationTable(cells: readonly (readonly unknown[])[], argument = "combinations"): Result<CombinationSet[]> {
  const header = cells[0];
  if (header === undefined || header.every(isBlank)) {
    return fail("missing", "the first row must hold the headers Combination | Method | D | L | Lr | S | R | W | E.", argument, 1);
  }
  const columnAt = new Map<number, Column>();
  const seen = new Set<Column>();
  for (let j = 0; j < header.length; j++) {
    const cell = header[j];
    if (isBlank(cell)) continue;
    const text = textOf(cell);
    const col = text === undefined ? undefined : COLUMNS.find((c) => c.toLowerCase() === headerKey(text));
    if (col === undefined) {
      return fail("unknownKey", `column ${j + 1}: header ${describeCell(cell)} is not one of ${COLUMNS.join(", ")}.`, argument, 1);
    }
    if (seen.has(col)) return fail("invalid", `column ${j + 1}: the header ${col} appears twice.`, argument, 1);
    seen.add(col);
    columnAt.set(j, col);
  }
  for (const needed of ["Combination", "Method"] as const) {
    if (!seen.has(needed)) return fail("missing", `no ${needed} column in the header row.`, argument, 1);
  }
  const dataRows = cells.length - 1;
  if (dataRows > COMBINATION_TABLE_MAX_ROWS) {
    return fail("tooManyRows", `${dataRows} combination rows; at most ${COMBINATION_TABLE_MAX_ROWS} are accepted.`, argument);
  }
  const rowsBy: Record<CombinationMethod, CombinationRow[]> = { LRFD: [], ASD: [], service: [] };
  const labelsBy: Record<CombinationMethod, Set<string>> = { LRFD: new Set(), ASD: new Set(), service: new Set() };
  for (let i = 1; i < cells.length; i++) {
    const row = cells[i]!;
    const rowNo = i + 1;
    if (row.every((c) => isBlank(c) || c === 0)) continue;
    let label = "";
    let method: CombinationMethod | undefined;
    let source = `Combinations table, row ${rowNo}`;
    const factors: Partial<Record<LoadCase, number>> = {};
    for (const [j, col] of columnAt) {
      const cell = row[j];
      if (col === "Combination" || col === "Method" || col === "Source") {
        const text = textOf(cell);
        if (text === undefined) return fail("invalid", `column ${col}: ${describeCell(cell)} is not text.`, argument, rowNo);
        if (col === "Combination") label = text;
        else if (col === "Source") source = text === "" ? source : text;
        else {
          if (text === "") return fail("missing", "column Method: is blank; give LRFD, ASD or service.", argument, rowNo);
          method = COMBINATION_METHODS.find((m) => m.toLowerCase() === normaliseKey(text));
          if (method === undefined) {
            return fail("unknownKey", `column Method: "${text}" is not a method; use one of ${COMBINATION_METHODS.join(", ")}.`, argument, rowNo);
          }
        }
        continue;
      }
      const f = factorFrom(cell);
      if (f === undefined) return fail("notANumber", `column ${col}: ${describeCell(cell)} is not a number.`, argument, rowNo);
      if (f !== 0) factors[col] = f;
    }
    if (label === "") return fail("missing", "column Combination: is blank; every combination needs a name.", argument, rowNo);
    if (method === undefined) return fail("missing", "column Method: is blank; give LRFD, ASD or service.", argument, rowNo);
    if (Object.keys(factors).length === 0) return fail("invalid", `combination "${label}" has no factor (every case column is blank or 0).`, argument, rowNo);
    if (factors.W !== undefined && factors.E !== undefined) {
      return fail("invalid", `combination "${label}": columns W and E both hold a factor; wind and seismic are not combined (give each its own row).`, argument, rowNo);
    }
    const key = label.toLowerCase();
    if (labelsBy[method].has(key)) return fail("invalid", `column Combination: "${label}" is used twice for ${method}.`, argument, rowNo);
    labelsBy[method].add(key);
    rowsBy[method].push({ label, source, factors });
  }
  const sets = COMBINATION_METHODS.filter((m) => rowsBy[m].length > 0).map((m) => freezeSet({ name: `Combinations table, ${m}`, method: m, rows: rowsBy[m] }));
  if (sets.length === 0) return fail("missing", "the table has a header row but no combination.", argument);
  return ok(sets);
}

/**
 * The set of one method from a parsed table, or an error saying the table has none.
 * @param sets - from {@link parseCombinationTable}
 * @param method - the method wanted
 * @param argument - the argument name messages use (default "combinations")
 */
export function setOfMethod(sets: readonly CombinationSet[], method: CombinationMethod, argument = "combinations"): Result<CombinationSet> {
  const found = sets.find((s) => s.method === method);
  if (found) return ok(found);
  const has = sets.map((s) => s.method).join(", ");
  return fail("missing", `the table has no ${method} combination (it has ${has}).`, argument);
}

/** Read a `method` argument: LRFD (default when blank), ASD or service, case-insensitive. */
export function parseCombinationMethod(text: string | null | undefined): Result<CombinationMethod> {
  if (text === null || text === undefined || text.trim() === "") return ok("LRFD");
  const key = normaliseKey(text);
  const found = COMBINATION_METHODS.find((m) => m.toLowerCase() === key);
  return found ? ok(found) : fail("unknownKey", `"${text}" is not a method; use one of ${COMBINATION_METHODS.join(", ")}.`, "method");
}
