/**
 * The computed cells of the generated takedown sheet, read through the workbook port only where
 * a drawing needs them: a member's block of rows (and the first row of each member that hands
 * it a load), kept once read. Every member's loads come from these cells through the takedown
 * engine's memberLoads (src/engine/takedown/member-loads.ts); nothing is derived a second time.
 */
import { checkPath, type CellReader, type Delivery } from "../engine/takedown";
import { memberLoads, type MemberLoads, type MemberLoadsSource } from "../engine/takedown/member-loads";
import type { PlacedLoad } from "../engine/takedown/validate";
import { cellAddress, sheetRef } from "../workbook/a1";
import type { CellValue, RangeData, WorkbookPort } from "../workbook/port";
import type { BuiltTakedown } from "../workbook/takedown-api";

/** Rows read in one request at most (keeps each Office request small). */
export const READ_ROWS_MAX = 2000;
/** Gaps of at most this many rows between needed rows are read through rather than split. */
const MERGE_GAP = 40;
/** Wider gaps tried, in turn, while the reads would take more than {@link MAX_READS} requests. */
const WIDER_GAPS = [200, 1000, READ_ROWS_MAX];
/** Requests one drawing should take at most (each is a round trip to the host). */
export const MAX_READS = 8;

/** Merge row numbers into [first, last] runs (gaps up to `gap` joined, runs up to `max` rows). */
export function rowRuns(rows: readonly number[], gap = MERGE_GAP, max = READ_ROWS_MAX): [number, number][] {
  const sorted = [...new Set(rows)].sort((a, b) => a - b);
  const out: [number, number][] = [];
  for (const r of sorted) {
    const last = out[out.length - 1];
    if (last && r - last[1] <= gap + 1 && r - last[0] < max) last[1] = r;
    else out.push([r, r]);
  }
  return out;
}

/**
 * The row runs to read: needed rows merged across gaps of {@link MERGE_GAP} rows, or across wider
 * gaps when that would still take more than {@link MAX_READS} requests (fewer round trips for a
 * few more rows read).
 */
export function readPlan(rows: readonly number[]): [number, number][] {
  let runs = rowRuns(rows);
  for (const gap of WIDER_GAPS) {
    if (runs.length <= MAX_READS) break;
    runs = rowRuns(rows, gap);
  }
  return runs;
}

/** A built takedown's computed sheet, read lazily through the port. */
export class TakedownCells {
  private readonly blocks: RangeData[] = [];
  private readonly readRows = new Set<number>();
  private readonly deliveries: readonly Delivery[];
  private readonly placedLoads: readonly PlacedLoad[];
  private readonly indexOf = new Map<string, number>();

  /**
   * @param port - the workbook holding the generated sheet
   * @param built - the model and plan the sheet was written from
   */
  constructor(
    private readonly port: WorkbookPort,
    readonly built: BuiltTakedown,
  ) {
    const path = checkPath(built.model);
    this.deliveries = path.deliveries;
    this.placedLoads = path.placedLoads;
    for (const m of built.model.members) if (m.firstOfMark) this.indexOf.set(m.mark, m.index);
  }

  /** Deliveries of the checked load path (who hands its reactions to whom). */
  get path(): readonly Delivery[] {
    return this.deliveries;
  }

  /** Computed value of a cell read so far (undefined when its row was not read). */
  readonly read: CellReader = (row, col) => {
    for (const b of this.blocks) {
      const r = row - b.top;
      const c = col - b.left;
      if (r >= 0 && r < b.values.length && c >= 0) return (b.values[r]![c] ?? null) as CellValue;
    }
    return undefined;
  };

  /** Rows a member's loads are read from: its block, and the results row of each member that loads it. */
  rowsOf(mark: string): number[] {
    const rows = this.built.rowsByMember[mark];
    const index = this.indexOf.get(mark);
    if (!rows || index === undefined) return [];
    const out = Array.from({ length: rows.rows }, (_, i) => rows.row + i);
    for (const d of this.deliveries) {
      if (d.to !== index) continue;
      const from = this.built.rowsByMember[this.built.model.members[d.from]!.mark];
      if (from) out.push(from.row);
    }
    return out;
  }

  /** Read the rows these members' loads need (those not read yet), a few requests at most. */
  async ensure(marks: readonly string[]): Promise<void> {
    const missing = marks.flatMap((m) => this.rowsOf(m)).filter((r) => !this.readRows.has(r));
    if (missing.length === 0) return;
    const lastCol = this.built.plan.layout.width - 1;
    for (const [first, last] of readPlan(missing)) {
      const data = await this.port.readTable(`${sheetRef(this.built.plan.sheet)}!${cellAddress(first, 0)}:${cellAddress(last, lastCol)}`);
      this.blocks.push(data);
      for (let r = first; r <= last; r++) this.readRows.add(r);
    }
  }

  /** What memberLoads reads from. */
  source(): MemberLoadsSource {
    return { model: this.built.model, plan: this.built.plan, deliveries: this.deliveries, placedLoads: this.placedLoads, read: this.read };
  }

  /** A member's loads, supports and reactions from the rows read (call {@link ensure} first); null when not in the takedown or not read. */
  loadsOf(mark: string): MemberLoads | null {
    const rows = this.built.rowsByMember[mark];
    if (!rows || !this.readRows.has(rows.row)) return null;
    return memberLoads(this.source(), mark);
  }
}
