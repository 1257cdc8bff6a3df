/**
 * The hand-off writer of the takedown sheet: the same interface as the add-in writer
 * (src/engine/takedown/formulas.ts), spelled with classic spreadsheet functions only, so the
 * generated takedown recalculates in Excel without the add-in, in LibreOffice Calc and in
 * Gnumeric.
 *
 * Reactions are statics over the member's load rows (SUMPRODUCT). The largest shear and moment
 * need the exact extremes, which take a helper block per member and load case (see
 * simple-span.ts); those blocks go on a helper sheet beside the takedown sheet, and the takedown's
 * shear and moment cells reference them. A member carrying one uniform load over its whole length
 * between end pins needs no block: wL/2 and wL^2/8.
 */
import { kllOf, type LoadCase as EngineLoadCase } from "../loads";
import type { ChannelRefs, FormulaWriter, MemberRefs } from "../takedown/formulas";
import type { UnitSystem } from "../takedown/types";
import { combinationFormulas, liveReductionFactorFormula } from "./loads";
import { cellRef, cellsOfColumnRange, num, quoteSheet } from "./refs";
import { extremesBlock, reactionFormulas, type NativeCell, type SimpleSpanRefs } from "./simple-span";

/** Options of a hand-off writer. */
export interface NativeWriterOptions {
  /** Name of the takedown sheet: the references the plan hands over are on it. */
  readonly sheet: string;
  /** Name of the helper sheet for the exact extremes (default: the takedown sheet's name + " extremes"). */
  readonly helperSheet?: string;
}

/** A hand-off writer: a {@link FormulaWriter} that also fills a helper sheet. */
export interface NativeFormulaWriter extends FormulaWriter {
  /** Name of the helper sheet its shear and moment formulas reference. */
  readonly helperSheet: string;
  /**
   * The helper sheet's rows from A1, complete once the plan has called the writer for every
   * member; `title` goes in A1 (the generated-sheet marker and a title).
   */
  helperCells(title: string): NativeCell[][];
  /** Number of helper blocks written (members x load cases whose extremes need one). */
  blockCount(): number;
}

/** Longest sheet name spreadsheet programs accept. */
const SHEET_NAME_MAX = 31;

/** The default helper sheet name for a takedown sheet. */
export function helperSheetName(sheet: string): string {
  const suffix = " extremes";
  return sheet.slice(0, SHEET_NAME_MAX - suffix.length) + suffix;
}

/** First helper block row (0-based) below the title and the explanation. */
const FIRST_BLOCK_ROW = 4;

/** Explanation written under the helper sheet's title. */
export const HELPER_EXPLANATION =
  "Helper cells of the hand-off takedown: for each member and load case, the exact largest shear and moment. " +
  "x = sorted breakpoints (ends, supports, load ends, point loads); on each segment V(x + u) = V0 + V1 u + V2 u^2; " +
  "M(x) carried from the left end by exact integration; u1, u2 = roots of V on the segment (clamped to it). " +
  "The takedown sheet reads M max and |V| max from the first row of each block (member mark in column A). Do not edit: rebuilt with the takedown.";

/** Prefix a reference on the takedown sheet with the sheet's name (unless it already has one). */
function qualify(sheet: string, ref: string): string {
  return ref.includes("!") ? ref : `${quoteSheet(sheet)}!${ref}`;
}

/** The member's loads and geometry in the generator's terms (references qualified with `at`). */
function spanRefs(member: MemberRefs, loads: ChannelRefs, at: (ref: string) => string): SimpleSpanRefs {
  const rows = rowCount(loads.magnitude);
  const pins = member.supports === null ? [] : cellsOfColumnRange(member.supports, 2).map(at);
  return {
    span: at(member.span),
    ...(pins.length === 2 ? { leftPin: pins[0]!, rightPin: pins[1]! } : {}),
    lines: [
      {
        startIntensity: at(loads.magnitude),
        endIntensity: at(loads.magnitude),
        start: at(loads.from),
        length: at(loads.loaded),
        rows,
        mask: `(${at(loads.kind)}="line")`,
      },
    ],
    points: [{ force: at(loads.magnitude), at: at(loads.from), rows, mask: `(${at(loads.kind)}<>"line")` }],
  };
}

/** Rows of a one-column range reference like `L14:L17` (1 for a single cell). */
function rowCount(range: string): number {
  const m = /\$?([0-9]+):\$?[A-Za-z]{1,3}\$?([0-9]+)$/.exec(range);
  return m ? Number(m[2]) - Number(m[1]) + 1 : 1;
}

/** True when the plan passed a single magnitude cell: one uniform load over the whole length. */
function isUniform(loads: ChannelRefs): boolean {
  return !loads.loads.includes(":");
}

/** First cell of a range reference (`M14:M17` -> `$M$14`). */
function firstCell(range: string): string {
  return cellsOfColumnRange(range, 1)[0]!;
}

/**
 * A new hand-off writer for one takedown build (it collects the helper blocks of that build).
 * @param options - takedown sheet name and, optionally, the helper sheet name
 */
export function createNativeWriter(options: NativeWriterOptions): NativeFormulaWriter {
  const sheet = options.sheet;
  const helper = options.helperSheet ?? helperSheetName(sheet);
  const rows: NativeCell[][] = [];
  const blocks = new Map<string, { momentMax: string; shearMax: string }>();
  let nextRow = FIRST_BLOCK_ROW;
  const onSheet = (ref: string): string => ref;
  const onHelper = (ref: string): string => qualify(sheet, ref);

  const put = (r: number, c: number, v: NativeCell): void => {
    while (rows.length <= r) rows.push([]);
    const row = rows[r]!;
    while (row.length <= c) row.push(null);
    row[c] = v;
  };

  /** The helper block of a member and load case, written on first use. */
  const blockOf = (member: MemberRefs, loads: ChannelRefs): { momentMax: string; shearMax: string } => {
    const key = `${member.span}|${member.supports ?? ""}|${loads.magnitude}`;
    const known = blocks.get(key);
    if (known) return known;
    const refs = spanRefs(member, loads, onHelper);
    const head = nextRow;
    const r = reactionFormulas(refs);
    const at = (col: number): string => cellRef(helper, head, col);
    const block = extremesBlock(refs, { left: at(2), right: at(4) }, { sheet: helper, row: head + 1, col: 0 });
    const markRow = /([0-9]+)$/.exec(member.span)?.[1];
    put(head, 0, markRow === undefined ? qualify(sheet, member.span) : { formula: `${quoteSheet(sheet)}!$A$${markRow}` });
    put(head, 9, `loads in ${qualify(sheet, loads.magnitude)}, length in ${qualify(sheet, member.span)}`);
    put(head, 1, "R1");
    put(head, 2, { formula: r.left });
    put(head, 3, "R2");
    put(head, 4, { formula: r.right });
    put(head, 5, "M max");
    put(head, 6, { formula: block.momentMax });
    put(head, 7, "|V| max");
    put(head, 8, { formula: block.shearMaxAbs });
    block.cells.forEach((row, i) => row.forEach((v, j) => v !== null && put(head + 1 + i, j, v)));
    nextRow = head + 1 + block.cells.length + 1;
    const out = { momentMax: at(6), shearMax: at(8) };
    blocks.set(key, out);
    return out;
  };

  /** wL/2, wL^2/8 for one uniform load over the whole length between end pins. */
  const uniformCase = (member: MemberRefs, loads: ChannelRefs): { w: string; span: string } | null =>
    isUniform(loads) && member.supports === null ? { w: firstCell(loads.magnitude), span: member.span } : null;

  return {
    name: "classic spreadsheet functions (hand-off version, no add-in needed)",
    writesLoadRanges: true,
    helperSheet: helper,
    reaction(member, loads, index) {
      const u = uniformCase(member, loads);
      if (u) return `${u.w}*${u.span}/2`;
      const r = reactionFormulas(spanRefs(member, loads, onSheet));
      return index === 1 ? r.left : r.right;
    },
    shearMax(member, loads) {
      const u = uniformCase(member, loads);
      return u ? `ABS(${u.w}*${u.span}/2)` : blockOf(member, loads).shearMax;
    },
    momentMax(member, loads) {
      const u = uniformCase(member, loads);
      return u ? `MAX(0,${u.w}*${u.span}^2/8)` : blockOf(member, loads).momentMax;
    },
    kllDefault(element) {
      const k = kllOf(element);
      return k.ok ? num(k.value) : "NA()";
    },
    llrFactor(kll, areaT, floors, units: UnitSystem) {
      return liveReductionFactorFormula(`(${kll}*${areaT})`, `(${floors})`, units);
    },
    combine(dead, live, roofLive, snow, rain) {
      const effects: Partial<Record<EngineLoadCase, string>> = { D: dead, L: live, Lr: roofLive, S: snow, R: rain };
      const unique = [...new Set(combinationFormulas(effects, { method: "LRFD", halfLive: false }).map((c) => c.formula))];
      return `MAX(${unique.join(",")})`;
    },
    helperCells(title) {
      const out = rows.map((r) => [...r]);
      while (out.length < 2) out.push([]);
      out[0] = [title];
      out[1] = [HELPER_EXPLANATION];
      return out;
    },
    blockCount: () => blocks.size,
  };
}
