/**
 * Classic-function formulas for a member on two pins carrying uniform line loads (full or
 * partial) and point loads in several load cases that share their positions — the loads of a
 * takedown member: one row per load, the position columns shared, one magnitude column per load
 * case. Compared with the general generator (simple-span.ts, linearly varying loads), the shear is
 * linear between breakpoints, so each case needs five helper columns instead of thirteen, and the
 * sorted breakpoints are shared by every case of the member.
 *
 * Per segment [x, x + h] of a case: V(x + u) = V0 - w u, M(x + u) = M(x) + V0 u - w u^2 / 2. The
 * largest moment on the segment is M(x) or the peak at u = V0 / w when that lies inside; the
 * largest shear magnitude is at an end. Conventions as in simple-span.ts.
 */
import { cellRef, cellsOfColumnRange, columnRangeRef, num, type BlockOrigin } from "./refs";
import { NATIVE_NOISE, type NativeCell } from "./simple-span";

/** Positions of the line-load rows of a member, shared by every load case. */
export interface UniformLinePositions {
  /** Range of start positions (blank = 0). */
  readonly start: string;
  /** Range of end positions; give this or `length`. */
  readonly end?: string;
  /** Range of loaded lengths (end = start + length). */
  readonly length?: string;
  readonly rows: number;
  /** Boolean array expression selecting the line-load rows of a mixed block. */
  readonly mask?: string;
}

/** Positions of the point-load rows of a member, shared by every load case. */
export interface UniformPointPositions {
  /** Range of positions (blank = 0). */
  readonly at: string;
  readonly rows: number;
  /** Boolean array expression selecting the point-load rows of a mixed block. */
  readonly mask?: string;
}

/** A member's geometry and load positions. */
export interface UniformSpanGeometry {
  /** Cell (or literal) holding the member's length. */
  readonly span: string;
  /** Position of the left pin (default "0"). */
  readonly leftPin?: string;
  /** Position of the right pin (default: the span). */
  readonly rightPin?: string;
  readonly lines: readonly UniformLinePositions[];
  readonly points: readonly UniformPointPositions[];
}

/** One load case's magnitudes, in the order of the geometry's line and point blocks. */
export interface UniformCaseMagnitudes {
  /** Range of uniform intensities per line block (force/length, down +). */
  readonly lines: readonly string[];
  /** Range of forces per point block (force, down +). */
  readonly points: readonly string[];
}

/** Where one case's results sit in a block. */
export interface UniformCaseRefs {
  readonly left: string;
  readonly right: string;
  /** Largest sagging moment (>= 0). */
  readonly momentMax: string;
  /** Largest shear magnitude (>= 0). */
  readonly shearMax: string;
}

/** Shared columns of a block: breakpoint, sorted x, segment length. */
const SHARED = 3;
/** Columns per load case: V0, w, M(x), M segment, |V| segment. */
const PER_CASE = 5;
/** Header rows above the segment rows: results, then column names. */
const HEAD_ROWS = 2;

function masked(mask: string | undefined, body: string): string {
  return mask === undefined ? body : `${mask}*${body}`;
}

function endOf(l: UniformLinePositions): string {
  return l.end ?? `(${l.start}+${l.length ?? "0"})`;
}

function lengthOf(l: UniformLinePositions): string {
  return l.length ?? `(${l.end ?? l.start}-${l.start})`;
}

function sumOf(terms: readonly string[]): string {
  return terms.length === 0 ? "0" : terms.join("+");
}

/** Every breakpoint as formula text: ends, pins, load ends, point positions (duplicates of line starts left out). */
export function uniformBreakpoints(g: UniformSpanGeometry): string[] {
  const out = ["0", g.span];
  if (g.leftPin !== undefined && g.leftPin !== "0") out.push(g.leftPin);
  if (g.rightPin !== undefined && g.rightPin !== g.span) out.push(g.rightPin);
  for (const l of g.lines) {
    const starts = cellsOfColumnRange(l.start, l.rows);
    out.push(...starts.map((a) => `0+${a}`));
    if (l.end !== undefined) out.push(...cellsOfColumnRange(l.end, l.rows).map((b) => `0+${b}`));
    else {
      const lengths = cellsOfColumnRange(l.length ?? "0", l.rows);
      out.push(...starts.map((a, i) => `0+${a}+${lengths[i]}`));
    }
  }
  const lineStarts = new Set(g.lines.map((l) => `${l.start}|${l.rows}`));
  for (const p of g.points) if (!lineStarts.has(`${p.at}|${p.rows}`)) out.push(...cellsOfColumnRange(p.at, p.rows).map((a) => `0+${a}`));
  return out;
}

/** Rows of the block (both header rows included) for a geometry. */
export function uniformBlockHeight(g: UniformSpanGeometry): number {
  return HEAD_ROWS + uniformBreakpoints(g).length;
}

/**
 * Reactions of the two pins for one case, by moments about the other pin (statics; exact).
 * @returns formula texts of the left and right reactions (force, up +)
 */
export function uniformReactionFormulas(g: UniformSpanGeometry, c: UniformCaseMagnitudes): { left: string; right: string } {
  const xa = g.leftPin ?? "0";
  const xb = g.rightPin ?? g.span;
  const about = (p: string, sense: 1 | -1): string => {
    const terms: string[] = [];
    g.lines.forEach((l, i) => {
      const arm = sense === 1 ? `(${l.start}+${endOf(l)}-2*${p})` : `(2*${p}-${l.start}-${endOf(l)})`;
      terms.push(`SUMPRODUCT(${masked(l.mask, `${c.lines[i]}*${lengthOf(l)}*${arm}`)})/2`);
    });
    g.points.forEach((q, i) => {
      const arm = sense === 1 ? `(${q.at}-${p})` : `(${p}-${q.at})`;
      terms.push(`SUMPRODUCT(${masked(q.mask, `${c.points[i]}*${arm}`)})`);
    });
    return sumOf(terms);
  };
  const gap = `(${xb}-${xa})`;
  return { left: `(${about(xb, -1)})/${gap}`, right: `(${about(xa, 1)})/${gap}` };
}

/**
 * Where case group `index` of a block at `origin` keeps its results (known before the block's
 * cells are generated, so a writer can hand out references as cases are asked for).
 */
export function uniformCaseRefs(origin: BlockOrigin, index: number): UniformCaseRefs {
  const col = origin.col + SHARED + PER_CASE * index;
  const at = (k: number): string => cellRef(origin.sheet, origin.row, col + k);
  return { left: at(0), right: at(1), momentMax: at(2), shearMax: at(3) };
}

/**
 * The helper block of one member for the load cases given (group i = cases[i]).
 *
 * Layout from the origin: row 0 holds, per case group, R1, R2, M max, |V| max and the case's label;
 * row 1 names the columns; then one row per breakpoint: the breakpoint, the sorted x, the segment
 * length h, and per case V0 (shear just right of x), w (load intensity on the segment), M(x)
 * (carried from the left end by exact integration), the segment's largest moment and its largest
 * shear magnitude.
 * @param g - geometry and positions shared by the cases
 * @param cases - magnitudes of each case, with a label for the header
 * @param origin - top-left cell of the block
 */
export function uniformExtremesBlock(g: UniformSpanGeometry, cases: readonly (UniformCaseMagnitudes & { readonly label: string })[], origin: BlockOrigin): NativeCell[][] {
  const bps = uniformBreakpoints(g);
  const n = bps.length;
  const top = origin.row + HEAD_ROWS;
  const ref = (i: number, col: number): string => cellRef(origin.sheet, top + i, origin.col + col);
  const range = (col: number, rows: number): string => columnRangeRef(origin.sheet, top, origin.col + col, rows);
  const rows: NativeCell[][] = Array.from({ length: HEAD_ROWS + n }, () => new Array<NativeCell>(SHARED + PER_CASE * cases.length).fill(null));
  const put = (r: number, c: number, v: NativeCell): void => {
    rows[r]![c] = v;
  };
  put(1, 0, "breakpoint");
  put(1, 1, "x");
  put(1, 2, "h");
  const bpRange = range(0, n);
  for (let i = 0; i < n; i++) {
    put(HEAD_ROWS + i, 0, { formula: bps[i]! });
    put(HEAD_ROWS + i, 1, { formula: `SMALL(${bpRange},${i + 1})` });
    if (i < n - 1) put(HEAD_ROWS + i, 2, { formula: `${ref(i + 1, 1)}-${ref(i, 1)}` });
  }
  const xa = g.leftPin ?? "0";
  const xb = g.rightPin ?? g.span;
  cases.forEach((c, k) => {
    const base = SHARED + PER_CASE * k;
    const [cV0, cW, cM, cMseg, cVseg] = [base, base + 1, base + 2, base + 3, base + 4];
    const results = uniformCaseRefs(origin, k);
    const r = uniformReactionFormulas(g, c);
    put(0, base, { formula: r.left });
    put(0, base + 1, { formula: r.right });
    const hi = `MAX(${range(cMseg, n)})`;
    const lo = `MIN(${range(cM, n)})`;
    put(0, base + 2, { formula: `IF(${hi}>${num(NATIVE_NOISE)}*MAX(ABS(${hi}),ABS(${lo})),${hi},0)` });
    put(0, base + 3, { formula: n > 1 ? `MAX(${range(cVseg, n - 1)})` : "0" });
    put(0, base + 4, c.label);
    ["V0", "w", "M(x)", "M segment", "|V| segment"].forEach((h, j) => put(1, base + j, j === 0 ? `${h} ${c.label}` : h));
    for (let i = 0; i < n; i++) {
      const row = HEAD_ROWS + i;
      const m = i === 0 ? "0" : `${ref(i - 1, cM)}+${ref(i - 1, cV0)}*${ref(i - 1, 2)}-${ref(i - 1, cW)}*${ref(i - 1, 2)}^2/2`;
      put(row, cM, { formula: m });
      if (i === n - 1) {
        put(row, cMseg, { formula: ref(i, cM) });
        break;
      }
      const x = ref(i, 1);
      const h = ref(i, 2);
      const mid = `(${x}+${h}/2)`;
      // load left of x: points before mid, line loads ended before mid, the part of active line loads up to x
      const left: { body: string; rows: number }[] = [];
      const w: string[] = [];
      g.points.forEach((q, j) => left.push({ body: masked(q.mask, `(${q.at}<${mid})*${c.points[j]}`), rows: q.rows }));
      g.lines.forEach((l, j) => {
        const mag = c.lines[j]!;
        const body = `${mag}*((${endOf(l)}<=${mid})*${lengthOf(l)}+(${l.start}<${mid})*(${endOf(l)}>${mid})*(${x}-${l.start}))`;
        left.push({ body: l.mask === undefined ? body : `${l.mask}*${body}`, rows: l.rows });
        w.push(`SUMPRODUCT(${masked(l.mask, `(${l.start}<${mid})*(${endOf(l)}>${mid})*${mag}`)})`);
      });
      // one SUMPRODUCT when every block has the same rows (a takedown member's mixed block), else one per block
      const sameRows = left.every((t) => t.rows === left[0]?.rows);
      const loadLeft = left.length === 0 ? "" : sameRows ? `-SUMPRODUCT(${left.map((t) => t.body).join("+")})` : left.map((t) => `-SUMPRODUCT(${t.body})`).join("");
      put(row, cV0, { formula: `${results.left}*(${xa}<${mid})+${results.right}*(${xb}<${mid})${loadLeft}` });
      put(row, cW, { formula: sumOf(w) });
      const [V0, W, M] = [ref(i, cV0), ref(i, cW), ref(i, cM)];
      const u = `MIN(${h},MAX(0,IF(${W}=0,0,${V0}/${W})))`;
      put(row, cMseg, { formula: `MAX(${M},${M}+${V0}*${u}-${W}*${u}^2/2)` });
      put(row, cVseg, { formula: `MAX(ABS(${V0}),ABS(${V0}-${W}*${h}))` });
    }
  });
  return rows;
}
