/**
 * The hand-off writer of the takedown sheet: the same interface as the add-in writer
 * (src/engine/takedown/formulas.ts), spelled with classic spreadsheet functions only, so the
 * generated takedown recalculates in Excel without the add-in, in LibreOffice Calc and in
 * Gnumeric.
 *
 * Reactions are statics over the member's load rows (SUMPRODUCT). The largest shear and moment
 * need the exact extremes, which take a helper block per member with a column group per load case
 * (uniform-span.ts: a takedown's line loads are uniform, full or partial, and its point loads are
 * reactions and Loads-table points); those blocks go on a helper sheet beside the takedown sheet,
 * and the takedown's shear and moment cells reference them. A member carrying one uniform load
 * over its whole length between end pins needs no block: wL/2 and wL^2/8.
 */
import { kllOf, type LoadCase as EngineLoadCase } from "../loads";
import type { ChannelRefs, FormulaWriter, MemberRefs } from "../takedown/formulas";
import type { UnitSystem } from "../takedown/types";
import { combinationFormulas, liveReductionFactorFormula } from "./loads";
import { cellsOfColumnRange, num, quoteSheet, type BlockOrigin } from "./refs";
import type { NativeCell } from "./simple-span";
import {
  uniformBlockHeight,
  uniformCaseRefs,
  uniformExtremesBlock,
  uniformReactionFormulas,
  type UniformCaseMagnitudes,
  type UniformCaseRefs,
  type UniformSpanGeometry,
} from "./uniform-span";

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
  /** Number of helper column groups written (members x load cases whose extremes need one). */
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
  "Helper cells of the hand-off takedown: for each member (mark in column A) and load case, the exact largest shear and moment. " +
  "x = sorted breakpoints (ends, supports, load ends, point loads), h = segment length; per load case, V0 = shear just right of x, " +
  "w = load intensity on the segment, so V(x + u) = V0 - w u; M(x) carried from the left end by exact integration; " +
  "the segment's largest moment is M(x) or the peak at u = V0 / w when it lies on the segment. " +
  "The takedown sheet reads M max and |V| max from the result row of each load case. Do not edit: rebuilt with the takedown.";

/** Prefix a reference on the takedown sheet with the sheet's name (unless it already has one). */
function qualify(sheet: string, ref: string): string {
  return ref.includes("!") ? ref : `${quoteSheet(sheet)}!${ref}`;
}

/** The member's geometry and load positions in the generator's terms (references qualified with `at`). */
function geometryOf(member: MemberRefs, loads: ChannelRefs, at: (ref: string) => string): UniformSpanGeometry {
  const rows = rowCount(loads.magnitude);
  const pins = member.supports === null ? [] : cellsOfColumnRange(member.supports, 2).map(at);
  return {
    span: at(member.span),
    ...(pins.length === 2 ? { leftPin: pins[0]!, rightPin: pins[1]! } : {}),
    lines: [{ start: at(loads.from), length: at(loads.loaded), rows, mask: `(${at(loads.kind)}="line")` }],
    points: [{ at: at(loads.from), rows, mask: `(${at(loads.kind)}<>"line")` }],
  };
}

/** One case's magnitudes (the channel's magnitude column serves line and point rows alike). */
function magnitudesOf(loads: ChannelRefs, at: (ref: string) => string): UniformCaseMagnitudes {
  return { lines: [at(loads.magnitude)], points: [at(loads.magnitude)] };
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
  /** Member blocks in order of first use: origin, geometry, and the load cases asked for. */
  const members = new Map<string, { origin: BlockOrigin; geometry: UniformSpanGeometry; markRow: string | undefined; cases: { key: string; loads: ChannelRefs }[] }>();
  let nextRow = FIRST_BLOCK_ROW;
  const onSheet = (ref: string): string => ref;
  const onHelper = (ref: string): string => qualify(sheet, ref);

  /** The helper block group of a member and load case (rows reserved on first use of the member). */
  const groupOf = (member: MemberRefs, loads: ChannelRefs): UniformCaseRefs => {
    const key = `${member.span}|${member.supports ?? ""}|${loads.kind}`;
    let block = members.get(key);
    if (!block) {
      const geometry = geometryOf(member, loads, onHelper);
      block = { origin: { sheet: helper, row: nextRow, col: 0 }, geometry, markRow: /([0-9]+)$/.exec(member.span)?.[1], cases: [] };
      members.set(key, block);
      nextRow += uniformBlockHeight(geometry) + 2;
    }
    let index = block.cases.findIndex((c) => c.key === loads.magnitude);
    if (index < 0) {
      block.cases.push({ key: loads.magnitude, loads });
      index = block.cases.length - 1;
    }
    return uniformCaseRefs({ ...block.origin, row: block.origin.row + 1 }, index);
  };

  /** Every block's cells, from the members and cases asked for. */
  const cells = (): NativeCell[][] => {
    const rows: NativeCell[][] = [];
    const put = (r: number, c: number, v: NativeCell): void => {
      while (rows.length <= r) rows.push([]);
      const row = rows[r]!;
      while (row.length <= c) row.push(null);
      row[c] = v;
    };
    for (const b of members.values()) {
      const head = b.origin.row;
      put(head, 0, b.markRow === undefined ? qualify(sheet, b.geometry.span) : { formula: `${quoteSheet(sheet)}!$A$${b.markRow}` });
      put(head, 1, `length ${b.geometry.span}; loads in rows of ${b.cases[0] ? qualify(sheet, b.cases[0].loads.magnitude) : ""}`);
      const cases = b.cases.map((c) => ({ ...magnitudesOf(c.loads, onHelper), label: `loads ${qualify(sheet, c.loads.magnitude)}` }));
      const block = uniformExtremesBlock(b.geometry, cases, { ...b.origin, row: head + 1 });
      block.forEach((row, i) => row.forEach((v, j) => v !== null && put(head + 1 + i, j, v)));
    }
    return rows;
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
      const r = uniformReactionFormulas(geometryOf(member, loads, onSheet), magnitudesOf(loads, onSheet));
      return index === 1 ? r.left : r.right;
    },
    shearMax(member, loads) {
      const u = uniformCase(member, loads);
      return u ? `ABS(${u.w}*${u.span}/2)` : groupOf(member, loads).shearMax;
    },
    momentMax(member, loads) {
      const u = uniformCase(member, loads);
      return u ? `MAX(0,${u.w}*${u.span}^2/8)` : groupOf(member, loads).momentMax;
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
      const out = cells();
      while (out.length < 2) out.push([]);
      out[0] = [title];
      out[1] = [HELPER_EXPLANATION];
      return out;
    },
    blockCount: () => [...members.values()].reduce((n, b) => n + b.cases.length, 0),
  };
}
