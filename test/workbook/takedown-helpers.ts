/**
 * Helpers of the takedown tests: build a workbook in the headless engine, run the takedown, read
 * the generated sheet the way a user reads it (a member's row by its mark, a column by its
 * header), and hand statics of simple spans written out independently of the engine.
 */
import type { RawCellContent } from "hyperformula";
import { MemoryWorkbookPort, type MemoryTable } from "../../src/workbook/memory-port";
import { buildTakedown } from "../../src/workbook/takedown-build";
import type { TakedownBuildResult, TakedownOptions } from "../../src/workbook/takedown-api";

/** A built takedown and the workbook it lives in. */
export interface Built {
  readonly port: MemoryWorkbookPort;
  readonly result: TakedownBuildResult;
}

/**
 * Build a takedown over sheets of plain values.
 * @param sheets - Zones, Members and (optionally) Loads sheets, header row first
 * @param options - overrides of the takedown options (units default US)
 * @param tables - Excel tables over the sheets, if any
 */
export async function buildOn(sheets: Record<string, RawCellContent[][]>, options: Partial<TakedownOptions> = {}, tables: MemoryTable[] = []): Promise<Built> {
  const port = await MemoryWorkbookPort.create({ sheets, tables });
  const result = await buildTakedown(port, {
    zones: "Zones",
    members: "Members",
    ...(sheets.Loads ? { loads: "Loads" } : {}),
    units: "US",
    ...options,
  });
  return { port, result };
}

/** Row (0-based) of the generated sheet's column headers: the row whose first cell is "Mark". */
function headerRow(port: MemoryWorkbookPort, sheet: string): number {
  const values = port.hf.getSheetValues(port.hf.getSheetId(sheet)!);
  const row = values.findIndex((r) => r[0] === "Mark");
  if (row < 0) throw new Error("no header row");
  return row;
}

/**
 * The computed value of a member's result, found as a user would: the row whose Mark is `mark`
 * and the column whose header is `header` (e.g. "D total (kip)").
 */
export function resultOf(port: MemoryWorkbookPort, mark: string, header: string, sheet = "Takedown"): unknown {
  const id = port.hf.getSheetId(sheet)!;
  const values = port.hf.getSheetValues(id);
  const h = headerRow(port, sheet);
  const col = values[h]!.indexOf(header);
  if (col < 0) throw new Error(`no column "${header}"`);
  const row = values.findIndex((r, i) => i > h && r[0] === mark);
  if (row < 0) throw new Error(`no member ${mark}`);
  return values[row]![col];
}

/** A point load (kip) at x (ft) from the left end. */
export interface Point {
  readonly p: number;
  readonly x: number;
}

/** A uniform line load (kip/ft) from a to b (ft). */
export interface Patch {
  readonly w: number;
  readonly a: number;
  readonly b: number;
}

/**
 * Reactions of a member on pins at its two ends by statics: the right reaction from moments
 * about the left pin (sum of each load's resultant times its lever arm, over the span), the left
 * one from vertical equilibrium (common practice).
 */
export function handReactions(span: number, points: readonly Point[], patches: readonly Patch[] = []): { left: number; right: number; total: number } {
  const total = points.reduce((s, q) => s + q.p, 0) + patches.reduce((s, u) => s + u.w * (u.b - u.a), 0);
  const momentAboutLeft = points.reduce((s, q) => s + q.p * q.x, 0) + patches.reduce((s, u) => s + u.w * (u.b - u.a) * ((u.a + u.b) / 2), 0);
  const right = momentAboutLeft / span;
  return { left: total - right, right, total };
}

/**
 * Bending moment at x of a simply supported member, by the free body left of x: the left
 * reaction times x minus each load (or the part of a patch) left of x times its lever arm.
 */
export function handMomentAt(span: number, x: number, points: readonly Point[], patches: readonly Patch[] = []): number {
  const { left } = handReactions(span, points, patches);
  let m = left * x;
  for (const q of points) if (q.x < x) m -= q.p * (x - q.x);
  for (const u of patches) {
    const end = Math.min(u.b, x);
    if (end > u.a) m -= u.w * (end - u.a) * (x - (u.a + end) / 2);
  }
  return m;
}

/**
 * Largest sagging moment of a simply supported member with downward loads: at the section where
 * the shear changes sign. Shear falls from the left reaction; walk the loads in order of position
 * and find where it crosses zero (inside a patch: solve the linear shear for x; at a point load:
 * the load's position).
 */
export function handMaxMoment(span: number, points: readonly Point[], patches: readonly Patch[] = []): number {
  const { left } = handReactions(span, points, patches);
  const stops = [...new Set([0, span, ...points.map((q) => q.x), ...patches.flatMap((u) => [u.a, u.b])])].sort((a, b) => a - b);
  let v = left;
  for (let i = 0; i < stops.length; i++) {
    const x = stops[i]!;
    const before = v;
    v -= points.filter((q) => q.x === x).reduce((s, q) => s + q.p, 0);
    if (before > 0 && v <= 0) return handMomentAt(span, x, points, patches);
    const next = stops[i + 1];
    if (next === undefined) break;
    const w = patches.filter((u) => u.a <= x && u.b >= next).reduce((s, u) => s + u.w, 0);
    const after = v - w * (next - x);
    if (v > 0 && after <= 0 && w > 0) return handMomentAt(span, x + v / w, points, patches);
    v = after;
  }
  return 0;
}
