/**
 * The orchestrator talks to the workbook only through the port: it writes only the generated
 * sheet, in blocks of bounded size, reports progress in order (awaiting the callback, so a host
 * can breathe), and waits for a host that shows #BUSY! while add-in functions calculate.
 * Needs `npm run build`.
 */
import { describe, expect, it } from "vitest";
import type { CellInput, RangeData, WorkbookPort } from "../../src/workbook/port";
import { MemoryWorkbookPort } from "../../src/workbook/memory-port";
import { buildTakedown, WRITE_BLOCK_ROWS } from "../../src/workbook/takedown-build";
import { frameOfSize, makeFrame } from "./takedown-fixtures";

/** A port that records the writes and answers the first read of the generated sheet with #BUSY!. */
class RecordingPort implements WorkbookPort {
  readonly writes: { sheet: string; top: number; rows: number }[] = [];
  busyReads = 0;
  constructor(private readonly inner: MemoryWorkbookPort) {}
  listTables = () => this.inner.listTables();
  sheetNames = () => this.inner.sheetNames();
  sheetMarker = (s: string) => this.inner.sheetMarker(s);
  prepareSheet = (s: string, m: string, r?: boolean) => this.inner.prepareSheet(s, m, r);
  setNames = (n: Readonly<Record<string, string>>) => this.inner.setNames(n);
  select = (s: string, a: string) => this.inner.select(s, a);
  getSetting = (k: string) => this.inner.getSetting(k);
  setSetting = (k: string, v: string) => this.inner.setSetting(k, v);
  flush = () => this.inner.flush();
  async writeBlock(sheet: string, top: number, left: number, cells: readonly (readonly CellInput[])[]): Promise<void> {
    this.writes.push({ sheet, top, rows: cells.length });
    return this.inner.writeBlock(sheet, top, left, cells);
  }
  async readTable(ref: string): Promise<RangeData> {
    const data = await this.inner.readTable(ref);
    if (!ref.startsWith("Takedown!") || this.busyReads >= 2) return data;
    this.busyReads++;
    return { ...data, values: data.values.map((r) => r.map((v) => (typeof v === "number" ? "#BUSY!" : v))) };
  }
}

describe("the takedown over a workbook port", () => {
  it("writes only its own sheet, in bounded blocks, with progress in order, and waits out #BUSY!", async () => {
    const frame = makeFrame(frameOfSize(1000));
    const memory = await MemoryWorkbookPort.create({ sheets: frame.sheets });
    const userMembers = memory.hf.getSheetSerialized(memory.hf.getSheetId("Members")!);
    const port = new RecordingPort(memory);
    const steps: number[] = [];
    let pending = 0;
    const result = await buildTakedown(port, { zones: "Zones", members: "Members", units: "US" }, async (fraction) => {
      steps.push(fraction);
      pending++;
      await new Promise((r) => setTimeout(r, 0));
      pending--;
    });
    expect(result.problems).toEqual([]);
    expect(pending).toBe(0);
    expect(steps[0]).toBe(0);
    expect(steps[steps.length - 1]).toBe(1);
    for (let i = 1; i < steps.length; i++) expect(steps[i]!).toBeGreaterThanOrEqual(steps[i - 1]!);
    expect(new Set(port.writes.map((w) => w.sheet))).toEqual(new Set(["Takedown"]));
    expect(port.writes.length).toBeGreaterThan(1);
    for (const w of port.writes) expect(w.rows).toBeLessThanOrEqual(WRITE_BLOCK_ROWS);
    // The user's table is as it was.
    expect(memory.hf.getSheetSerialized(memory.hf.getSheetId("Members")!)).toEqual(userMembers);
    // The results were read again once the host stopped showing #BUSY!.
    expect(port.busyReads).toBe(2);
    const b = result.json!.balance.D!;
    expect(typeof b.applied).toBe("number");
    expect(Math.abs(b.applied - b.supports)).toBeLessThanOrEqual(1e-9 * b.applied);
  });
});
