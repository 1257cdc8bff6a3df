/**
 * Lays out many simple-span members on one sheet, each with its load ranges, its reaction
 * formulas and its extremes block, so that one spreadsheet evaluation checks them all (one
 * Gnumeric run per batch keeps the test fast). Test-only code.
 */
import type { BeamModel, LineLoad, PointLoad } from "../../../src/engine/beam/types";
import { cellRef, columnRangeRef } from "../../../src/engine/native/refs";
import { extremesBlock, reactionFormulas, totalLoadFormula, type NativeCell, type SimpleSpanRefs } from "../../../src/engine/native/simple-span";

/** One member to lay out: two pins (positions), line loads and point loads. */
export interface MemberCase {
  readonly span: number;
  readonly leftPin: number;
  readonly rightPin: number;
  readonly lines: readonly LineLoad[];
  readonly points: readonly PointLoad[];
  /** Lay the loads out as one 5-column block `kind | magnitude | start | end | end magnitude`. */
  readonly mixedBlock?: boolean;
}

/** Addresses (on the sheet, A1 without sheet) of one member's results. */
export interface MemberCells {
  readonly left: string;
  readonly right: string;
  readonly momentMax: string;
  readonly momentMin: string;
  readonly shearMax: string;
  readonly total: string;
  /** Input cells, to edit in a test: span and pins. */
  readonly spanCell: string;
}

/** A sheet as rows of cells, and where each member's results are. */
export interface MemberSheet {
  readonly rows: NativeCell[][];
  readonly members: readonly MemberCells[];
}

/** The beam model of a case, for the exact solver. */
export function modelOf(c: MemberCase): BeamModel {
  return {
    span: c.span,
    supports: [
      { x: c.leftPin, type: "pin" },
      { x: c.rightPin, type: "pin" },
    ],
    loads: [...c.lines, ...c.points],
  };
}

const BLOCK_COL = 16;

function put(rows: NativeCell[][], r: number, c: number, v: NativeCell): void {
  while (rows.length <= r) rows.push([]);
  const row = rows[r]!;
  while (row.length <= c) row.push(null);
  row[c] = v;
}

function bare(ref: string): string {
  return ref.slice(ref.indexOf("!") + 1).replace(/\$/g, "");
}

/**
 * Write every case on sheet `sheet`. Per case: row r0 holds span and pins (B, D, F) and the
 * results (H..M); the load ranges start at row r0 + 2 with one spare blank row; the extremes
 * block starts at column Q of row r0.
 */
export function layOutMembers(sheet: string, cases: readonly MemberCase[]): MemberSheet {
  const rows: NativeCell[][] = [];
  const members: MemberCells[] = [];
  let r0 = 0;
  for (const c of cases) {
    put(rows, r0, 0, "span");
    put(rows, r0, 1, c.span);
    put(rows, r0, 2, "left pin");
    put(rows, r0, 3, c.leftPin);
    put(rows, r0, 4, "right pin");
    put(rows, r0, 5, c.rightPin);
    const first = r0 + 2;
    let refs: SimpleSpanRefs;
    let loadRows: number;
    const at = (col: number, rowsN: number): string => columnRangeRef(sheet, first, col, rowsN);
    const span = cellRef(sheet, r0, 1);
    const pins = { leftPin: cellRef(sheet, r0, 3), rightPin: cellRef(sheet, r0, 5) };
    if (c.mixedBlock) {
      loadRows = c.lines.length + c.points.length + 1;
      // like the takedown's blocks: a blank start is 0, line loads give their loaded length
      ["kind", "magnitude", "start", "end", "end magnitude", "length"].forEach((h, j) => put(rows, r0 + 1, j, h));
      let r = first;
      for (const l of c.lines) {
        [l.kind, l.w1, l.start === 0 ? null : l.start, l.end, l.w2, l.end - l.start].forEach((v, j) => put(rows, r, j, v));
        r++;
      }
      for (const p of c.points) {
        [p.kind, p.p, p.x === 0 ? null : p.x].forEach((v, j) => put(rows, r, j, v));
        r++;
      }
      const kind = at(0, loadRows);
      refs = {
        span,
        ...pins,
        lines: [{ startIntensity: at(1, loadRows), endIntensity: at(4, loadRows), start: at(2, loadRows), length: at(5, loadRows), rows: loadRows, mask: `(${kind}="line")` }],
        points: [{ force: at(1, loadRows), at: at(2, loadRows), rows: loadRows, mask: `(${kind}<>"line")` }],
      };
    } else {
      loadRows = Math.max(c.lines.length, c.points.length) + 1;
      ["w1", "w2", "start", "end", "", "P", "at"].forEach((h, j) => h && put(rows, r0 + 1, j, h));
      c.lines.forEach((l, i) => [l.w1, l.w2, l.start, l.end].forEach((v, j) => put(rows, first + i, j, v)));
      c.points.forEach((p, i) => [p.p, p.x].forEach((v, j) => put(rows, first + i, 5 + j, v)));
      refs = {
        span,
        ...pins,
        lines: [{ startIntensity: at(0, loadRows), endIntensity: at(1, loadRows), start: at(2, loadRows), end: at(3, loadRows), rows: loadRows }],
        points: [{ force: at(5, loadRows), at: at(6, loadRows), rows: loadRows }],
      };
    }
    const rf = reactionFormulas(refs);
    const resultCol = 7;
    const reactions = { left: cellRef(sheet, r0, resultCol), right: cellRef(sheet, r0, resultCol + 1) };
    const block = extremesBlock(refs, reactions, { sheet, row: r0, col: BLOCK_COL });
    const results = [rf.left, rf.right, block.momentMax, block.momentMin, block.shearMax, totalLoadFormula(refs)];
    results.forEach((f, j) => put(rows, r0, resultCol + j, { formula: f }));
    block.cells.forEach((row, i) => row.forEach((v, j) => v !== null && put(rows, r0 + i, BLOCK_COL + j, v)));
    const addr = (j: number): string => bare(cellRef(sheet, r0, resultCol + j));
    members.push({
      left: addr(0),
      right: addr(1),
      momentMax: addr(2),
      momentMin: addr(3),
      shearMax: addr(4),
      total: addr(5),
      spanCell: bare(span),
    });
    r0 += Math.max(loadRows + 2, block.cells.length) + 1;
  }
  return { rows, members };
}
