/**
 * Classic-function formulas for a member on two pins (simple span, with overhangs when the pins
 * are not at the ends): reactions, and the exact largest moment and shear, as formula text that
 * Excel, LibreOffice Calc and Gnumeric all evaluate (arithmetic, comparisons, SUMPRODUCT, SMALL,
 * INDEX, IF, MIN, MAX, ABS, SQRT). Conventions of docs/interface.md section 1: x from the left end,
 * gravity loads positive downward, reactions positive upward, sagging moment positive,
 * V = dM/dx.
 *
 * Loads are read from ranges of the sheet, so editing a load, a position or the span in any of
 * those programs recalculates every result. Line loads vary linearly from a start intensity to
 * an end intensity between two positions; point loads act at one position. A row that is blank
 * throughout contributes nothing, so blocks may keep spare rows. Ranges of one block have the
 * same number of rows; an optional mask (a boolean array expression such as
 * `(Loads!$A$2:$A$9="line")`) selects the rows of a mixed block that hold that kind.
 *
 * The extremes are exact, not sampled: between consecutive breakpoints (ends, pins, load ends,
 * point loads) the shear is a polynomial of degree <= 2, whose coefficients a helper block works
 * out row by row from the sorted breakpoints; the moment at the roots of the shear (stable
 * quadratic formula) and at the breakpoints, and the shear at the breakpoints (both sides) and
 * where the load intensity changes sign, are the candidates.
 */
import { cellRef, cellsOfColumnRange, columnRangeRef, num, type BlockOrigin } from "./refs";

/** A block of linearly varying line loads (force/length, down +), one load per row. */
export interface LineLoadColumns {
  /** Range of intensities at the start positions, e.g. `Loads!$C$2:$C$9`. */
  readonly startIntensity: string;
  /** Range of intensities at the end positions (equal to the start intensity for a uniform load). */
  readonly endIntensity: string;
  /** Range of start positions (length from the left end). */
  readonly start: string;
  /** Range of end positions (length from the left end), >= start; give this or `length`. */
  readonly end?: string;
  /** Range of loaded lengths (end = start + length), instead of `end`. */
  readonly length?: string;
  /** Rows in each range. */
  readonly rows: number;
  /** Boolean array expression selecting the line-load rows of a mixed block (all rows when absent). */
  readonly mask?: string;
}

/** A block of point loads (force, down +), one load per row. */
export interface PointLoadColumns {
  /** Range of forces. */
  readonly force: string;
  /** Range of positions (length from the left end). */
  readonly at: string;
  /** Rows in each range. */
  readonly rows: number;
  /** Boolean array expression selecting the point-load rows of a mixed block (all rows when absent). */
  readonly mask?: string;
}

/** One member on two pins, as references to the cells that define it. */
export interface SimpleSpanRefs {
  /** Cell (or literal) holding the length of the member. */
  readonly span: string;
  /** Position of the left pin (default "0"). */
  readonly leftPin?: string;
  /** Position of the right pin (default: the span). */
  readonly rightPin?: string;
  readonly lines: readonly LineLoadColumns[];
  readonly points: readonly PointLoadColumns[];
}

/** Formula texts (no leading "=") of the two reactions, upward +. */
export interface ReactionFormulas {
  readonly left: string;
  readonly right: string;
}

/**
 * Relative difference below which two candidate extremes count as equal (the first in x order
 * is kept) and below which a largest sagging moment counts as zero; the same rule as the exact
 * solver's (src/engine/beam/extremes.ts), so both versions report the same value.
 */
export const NATIVE_NOISE = 1e-12;

function leftPinOf(m: SimpleSpanRefs): string {
  return m.leftPin ?? "0";
}

function rightPinOf(m: SimpleSpanRefs): string {
  return m.rightPin ?? m.span;
}

function masked(mask: string | undefined, body: string): string {
  return mask === undefined ? body : `${mask}*${body}`;
}

function sumOf(terms: readonly string[]): string {
  return terms.length === 0 ? "0" : terms.join("+");
}

/** Slope of each line load, (w2 - w1) / (end - start), with a zero-length row kept finite. */
function slope(l: LineLoadColumns): string {
  const width = loadedLength(l);
  return `(${l.endIntensity}-${l.startIntensity})/(${width}+(${width}=0))`;
}

/** The end positions of a line-load block as an array expression. */
function endOf(l: LineLoadColumns): string {
  if (l.end !== undefined) return l.end;
  return `(${l.start}+${l.length ?? "0"})`;
}

/** The loaded lengths of a line-load block as an array expression. */
function loadedLength(l: LineLoadColumns): string {
  return l.length ?? `(${l.end ?? l.start}-${l.start})`;
}

/** Moment of all loads about a position p, each force times (its position - p), down + . */
function momentAbout(m: SimpleSpanRefs, p: string, sense: 1 | -1): string {
  const terms: string[] = [];
  for (const l of m.lines) {
    const [w1, w2, a, b] = [l.startIntensity, l.endIntensity, l.start, endOf(l)];
    // integral of w(t) (t - p) dt over [a, b] for w linear from w1 to w2: (b-a)(w1(2a+b-3p) + w2(a+2b-3p))/6
    const body =
      sense === 1
        ? `${loadedLength(l)}*(${w1}*(2*${a}+${b}-3*${p})+${w2}*(${a}+2*${b}-3*${p}))`
        : `${loadedLength(l)}*(${w1}*(3*${p}-2*${a}-${b})+${w2}*(3*${p}-${a}-2*${b}))`;
    terms.push(`SUMPRODUCT(${masked(l.mask, body)})/6`);
  }
  for (const q of m.points) {
    const body = sense === 1 ? `${q.force}*(${q.at}-${p})` : `${q.force}*(${p}-${q.at})`;
    terms.push(`SUMPRODUCT(${masked(q.mask, body)})`);
  }
  return sumOf(terms);
}

/**
 * Reactions of the two pins by moments about the other pin (statics; exact).
 * @param member - span, pin positions and load ranges (lengths and forces in consistent units)
 * @returns formula texts of the left and right vertical reactions (force, up +)
 */
export function reactionFormulas(member: SimpleSpanRefs): ReactionFormulas {
  const xa = leftPinOf(member);
  const xb = rightPinOf(member);
  const gap = `(${xb}-${xa})`;
  return {
    left: `(${momentAbout(member, xb, -1)})/${gap}`,
    right: `(${momentAbout(member, xa, 1)})/${gap}`,
  };
}

/**
 * Formula text of the total load on the member (force, down +): the sum of the line-load
 * resultants and the point loads, for the load balance.
 */
export function totalLoadFormula(member: SimpleSpanLoads): string {
  const terms: string[] = [];
  for (const l of member.lines) {
    terms.push(`SUMPRODUCT(${masked(l.mask, `(${l.startIntensity}+${l.endIntensity})*${loadedLength(l)}`)})/2`);
  }
  // a plain range goes to SUM: one program gives #VALUE! for SUMPRODUCT over a single blank cell
  for (const q of member.points) terms.push(q.mask === undefined ? `SUM(${q.force})` : `SUMPRODUCT(${q.mask}*${q.force})`);
  return sumOf(terms);
}

/** The loads of a member, without its geometry. */
export type SimpleSpanLoads = Pick<SimpleSpanRefs, "lines" | "points">;

/** Column order of the helper block (0-based offsets from its left edge). */
export const EXTREMES_COLUMNS = [
  "breakpoint",
  "x",
  "h",
  "mid",
  "V0",
  "V1",
  "V2",
  "M(x)",
  "q",
  "u1",
  "u2",
  "M high",
  "M low",
  "V interior",
  "V end",
  "V segment",
  "V governing",
] as const;

type ColumnName = (typeof EXTREMES_COLUMNS)[number];

const COL: Readonly<Record<ColumnName, number>> = Object.fromEntries(EXTREMES_COLUMNS.map((name, i) => [name, i])) as Record<
  ColumnName,
  number
>;

/** A cell of a generated block: a value or a formula (text without the leading "="). */
export type NativeCell = number | string | null | { readonly formula: string };

/** The helper block that yields the exact extremes, and the formulas that read it. */
export interface ExtremesBlock {
  /** Header row, then one row per breakpoint; place its top-left cell at the origin given. */
  readonly cells: readonly (readonly NativeCell[])[];
  /** Largest sagging moment (>= 0; 0 when there is none), force x length. */
  readonly momentMax: string;
  /** Most hogging moment (<= 0; 0 when there is none), force x length. */
  readonly momentMin: string;
  /** Shear of largest magnitude, signed (the first in x order on a tie), force. */
  readonly shearMax: string;
  /** Largest shear magnitude (>= 0), force. */
  readonly shearMaxAbs: string;
  /** Number of breakpoints (rows below the header). */
  readonly breakpoints: number;
}

/** Every breakpoint of the member, as formula texts: ends, pins, load ends, point positions. */
function breakpointFormulas(m: SimpleSpanRefs): string[] {
  const out = ["0", m.span];
  if (m.leftPin !== undefined && m.leftPin !== "0") out.push(m.leftPin);
  if (m.rightPin !== undefined && m.rightPin !== m.span) out.push(m.rightPin);
  const rowsOf = (range: string, rows: number): string[] => cellsOfColumnRange(range, rows).map((cell) => `0+${cell}`);
  for (const l of m.lines) {
    out.push(...rowsOf(l.start, l.rows));
    if (l.end !== undefined) out.push(...rowsOf(l.end, l.rows));
    else {
      const lengths = cellsOfColumnRange(l.length ?? "0", l.rows);
      out.push(...cellsOfColumnRange(l.start, l.rows).map((a, i) => `0+${a}+${lengths[i]}`));
    }
  }
  for (const q of m.points) out.push(...rowsOf(q.at, q.rows));
  return out;
}

/** Line loads fully left of the segment and active across it, and point loads left of it. */
function shearAtLeftEnd(m: SimpleSpanRefs, r: ReactionFormulas, x: string, mid: string): string {
  const xa = leftPinOf(m);
  const xb = rightPinOf(m);
  const parts = [`${r.left}*(${xa}<${mid})+${r.right}*(${xb}<${mid})`];
  for (const q of m.points) parts.push(`-SUMPRODUCT(${masked(q.mask, `(${q.at}<${mid})*${q.force}`)})`);
  for (const l of m.lines) {
    const [w1, w2, a, b] = [l.startIntensity, l.endIntensity, l.start, endOf(l)];
    parts.push(`-SUMPRODUCT(${masked(l.mask, `(${b}<=${mid})*(${w1}+${w2})*${loadedLength(l)}`)})/2`);
    parts.push(`-SUMPRODUCT(${masked(l.mask, `(${a}<${mid})*(${b}>${mid})*(${w1}*(${x}-${a})+${slope(l)}*(${x}-${a})^2/2)`)})`);
  }
  return parts.join("");
}

/** -(total intensity at the segment's left end): V1 of V(x + u) = V0 + V1 u + V2 u^2. */
function shearSlope(m: SimpleSpanRefs, x: string, mid: string): string {
  const terms = m.lines.map(
    (l) => `SUMPRODUCT(${masked(l.mask, `(${l.start}<${mid})*(${endOf(l)}>${mid})*(${l.startIntensity}+${slope(l)}*(${x}-${l.start}))`)})`,
  );
  return `-(${sumOf(terms)})`;
}

/** -(sum of slopes of the active line loads) / 2: V2 of the segment's shear polynomial. */
function shearCurvature(m: SimpleSpanRefs, mid: string): string {
  const terms = m.lines.map((l) => `SUMPRODUCT(${masked(l.mask, `(${l.start}<${mid})*(${endOf(l)}>${mid})*${slope(l)}`)})`);
  return `-(${sumOf(terms)})/2`;
}

/** M(x + u) = M(x) + V0 u + V1 u^2/2 + V2 u^3/3. */
function momentAtOffset(c: (name: ColumnName) => string, u: string): string {
  return `${c("M(x)")}+${c("V0")}*${u}+${c("V1")}*${u}^2/2+${c("V2")}*${u}^3/3`;
}

/** The solver's rule: keep the current shear unless the candidate's magnitude is larger beyond the noise. */
function keepLarger(current: string, candidate: string): string {
  return `IF(ABS(${candidate})-ABS(${current})>${num(NATIVE_NOISE)}*ABS(${candidate}),${candidate},${current})`;
}

/**
 * The helper block for the exact largest moments and shear of a member on two pins, and the
 * formulas that read the results from it.
 *
 * Layout: a header row (EXTREMES_COLUMNS), then one row per breakpoint. Column "breakpoint"
 * lists the breakpoints as found, "x" sorts them (SMALL), and each row but the last describes
 * the segment from its x to the next: V(x + u) = V0 + V1 u + V2 u^2 and M(x) carried from the
 * left end by exact integration. "u1"/"u2" are the roots of V on the segment (clamped to it),
 * "M high"/"M low" the extreme moments among M(x), M(x + u1), M(x + u2); the shear candidates are
 * V at the segment's two ends and where dV/dx = 0 inside it, scanned left to right.
 *
 * @param member - span, pin positions and load ranges
 * @param reactions - references to the cells holding the reaction formulas of
 *   {@link reactionFormulas} (left, right)
 * @param origin - where the block's top-left (header) cell will be written
 */
export function extremesBlock(member: SimpleSpanRefs, reactions: ReactionFormulas, origin: BlockOrigin): ExtremesBlock {
  const bps = breakpointFormulas(member);
  const n = bps.length;
  const top = origin.row + 1;
  const ref = (i: number, name: ColumnName): string => cellRef(origin.sheet, top + i, origin.col + COL[name]);
  const range = (name: ColumnName, rows: number): string => columnRangeRef(origin.sheet, top, origin.col + COL[name], rows);
  const bpRange = range("breakpoint", n);
  const rows: NativeCell[][] = [EXTREMES_COLUMNS.map((h) => h)];
  for (let i = 0; i < n; i++) {
    const c = (name: ColumnName): string => ref(i, name);
    const row: NativeCell[] = new Array<NativeCell>(EXTREMES_COLUMNS.length).fill(null);
    const put = (name: ColumnName, formula: string): void => {
      row[COL[name]] = { formula };
    };
    put("breakpoint", bps[i]!);
    put("x", `SMALL(${bpRange},${i + 1})`);
    const carried = i === 0 ? "0" : momentAtOffset((name) => ref(i - 1, name), ref(i - 1, "h"));
    put("M(x)", carried);
    if (i === n - 1) {
      put("M high", c("M(x)"));
      put("M low", c("M(x)"));
      rows.push(row);
      break;
    }
    put("h", `${ref(i + 1, "x")}-${c("x")}`);
    put("mid", `${c("x")}+${c("h")}/2`);
    put("V0", shearAtLeftEnd(member, reactions, c("x"), c("mid")));
    put("V1", shearSlope(member, c("x"), c("mid")));
    put("V2", shearCurvature(member, c("mid")));
    const [v0, v1, v2, h] = [c("V0"), c("V1"), c("V2"), c("h")];
    const disc = `${v1}^2-4*${v2}*${v0}`;
    put("q", `IF(${disc}<0,0,-(${v1}+IF(${v1}<0,-1,1)*SQRT(${disc}))/2)`);
    put("u1", `MIN(${h},MAX(0,IF(${v2}=0,0,${c("q")}/${v2})))`);
    put("u2", `MIN(${h},MAX(0,IF(${c("q")}=0,0,${v0}/${c("q")})))`);
    const m1 = momentAtOffset(c, c("u1"));
    const m2 = momentAtOffset(c, c("u2"));
    put("M high", `MAX(${c("M(x)")},${m1},${m2})`);
    put("M low", `MIN(${c("M(x)")},${m1},${m2})`);
    const ustar = `IF(${v2}=0,0,MIN(${h},MAX(0,-${v1}/(2*${v2}))))`;
    put("V interior", `${v0}+${v1}*${ustar}+${v2}*${ustar}^2`);
    put("V end", `${v0}+${v1}*${h}+${v2}*${h}^2`);
    put("V segment", keepLarger(keepLarger(v0, c("V interior")), c("V end")));
    put("V governing", keepLarger(i === 0 ? "0" : ref(i - 1, "V governing"), c("V segment")));
    rows.push(row);
  }
  const hi = `MAX(${range("M high", n)})`;
  const lo = `MIN(${range("M low", n)})`;
  const scale = `MAX(ABS(${hi}),ABS(${lo}))`;
  return {
    cells: rows,
    momentMax: `IF(${hi}>${num(NATIVE_NOISE)}*${scale},${hi},0)`,
    momentMin: `IF(${lo}<-${num(NATIVE_NOISE)}*${scale},${lo},0)`,
    shearMax: n > 1 ? ref(n - 2, "V governing") : "0",
    shearMaxAbs: n > 1 ? `ABS(${ref(n - 2, "V governing")})` : "0",
    breakpoints: n,
  };
}
