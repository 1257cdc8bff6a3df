/**
 * Bad input, class C: memory and size. Tables are read by their real extent: one stray value far
 * from the Members table (XFD1048576) must not make it a 1,048,576 x 16,384 grid; the takedown
 * gives the same result as without it (the reference is the same workbook without the stray
 * value). A table larger than the cell limit stops before anything is allocated, with a message
 * naming the limit and how to raise it (LOADPATH_MAX_CELLS). An array formula whose declared area
 * is the whole sheet is recalculated without walking that area. A takedown too large for the
 * process's heap stops before building, with a message, instead of dying of heap exhaustion.
 * Inputs are never changed. The takedown-size case runs dist/cli.js: `npm run build` first.
 */
import { spawnSync } from "node:child_process";
import { writeFileSync } from "node:fs";
import { join, resolve } from "node:path";
import ExcelJS from "exceljs";
import { afterEach, describe, expect, it } from "vitest";
import { frameOfSize, makeFrame } from "../workbook/takedown-fixtures";
import { hashOf, runCli, scratch } from "./reading-helpers";

const dir = scratch("size");
const ROOT = resolve(__dirname, "../..");

/** A small invented frame (two levels, one bay) as Zones and Members sheets, plus `extra` cells. */
async function frameWorkbook(path: string, extra: Record<string, Record<string, ExcelJS.CellValue>> = {}): Promise<void> {
  const frame = makeFrame({ levels: 2, bays: 1, beamsPerBay: 1 });
  const wb = new ExcelJS.Workbook();
  for (const [name, rows] of Object.entries(frame.sheets)) {
    const ws = wb.addWorksheet(name);
    for (const row of rows) ws.addRow(row);
    for (const [address, value] of Object.entries(extra[name] ?? {})) ws.getCell(address).value = value;
  }
  await wb.xlsx.writeFile(path);
}

afterEach(() => {
  delete process.env.LOADPATH_MAX_CELLS;
});

describe("tables are read by their real extent", () => {
  it("one stray value in XFD1048576 of the Members sheet changes nothing", async () => {
    const clean = join(dir, "clean.xlsx");
    const stray = join(dir, "stray.xlsx");
    await frameWorkbook(clean);
    await frameWorkbook(stray, { Members: { XFD1048576: "x" } });
    const before = hashOf(stray);
    const reference = await runCli("takedown", clean, "--json", join(dir, "clean.json"));
    const ran = await runCli("takedown", stray, "--json", join(dir, "stray.json"));
    expect(reference.status).toBe(0);
    expect(ran.status).toBe(0);
    expect(ran.err).toBe(reference.err);
    expect(ran.out.replaceAll("stray", "clean")).toBe(reference.out);
    expect(hashOf(stray)).toBe(before);
  });

  it("a note to the right of the table, beyond its header row, is not read as a column", async () => {
    const path = join(dir, "note.xlsx");
    await frameWorkbook(path, { Members: { T5: "checked by RB", Z40: 12 } });
    const ran = await runCli("takedown", path);
    expect(ran.status).toBe(0);
  });

  it("a stray value below the table in one of its columns makes it too large: a message naming the limit and LOADPATH_MAX_CELLS", async () => {
    const path = join(dir, "stray-below.xlsx");
    await frameWorkbook(path, { Members: { D1048576: 1 } });
    const before = hashOf(path);
    const ran = await runCli("takedown", path);
    expect(ran.status).not.toBe(0);
    expect(ran.err).toMatch(/Members!A1:L1048576 is 1,048,576 rows x 12 columns, more than the 10,000,000 cells a table may have; .*LOADPATH_MAX_CELLS/);
    expect(hashOf(path)).toBe(before);
  });

  it("the limit is read from LOADPATH_MAX_CELLS", async () => {
    const path = join(dir, "limit.xlsx");
    await frameWorkbook(path);
    process.env.LOADPATH_MAX_CELLS = "40";
    const small = await runCli("takedown", path);
    expect(small.status).not.toBe(0);
    expect(small.err).toMatch(/more than the 40 cells a table may have; .*LOADPATH_MAX_CELLS=80/);
    process.env.LOADPATH_MAX_CELLS = "100000";
    expect((await runCli("takedown", path)).status).toBe(0);
  });
});

describe("a takedown larger than the heap allows", () => {
  it("stops before building, with the member count, the memory needed and how to give it; no heap abort", async () => {
    const path = join(dir, "frame-1000.xlsx");
    const frame = makeFrame(frameOfSize(1000));
    const wb = new ExcelJS.Workbook();
    for (const [name, rows] of Object.entries(frame.sheets)) {
      const ws = wb.addWorksheet(name);
      for (const row of rows) ws.addRow(row);
    }
    await wb.xlsx.writeFile(path);
    const before = hashOf(path);
    // A 64 MB heap stands for a machine too small: bench/memory.bench.ts measured about 90 MB of
    // heap in use for this frame, so without the check the process dies of heap exhaustion.
    const r = spawnSync(process.execPath, ["--max-old-space-size=64", join(ROOT, "bin", "loadpath.js"), "takedown", path], { encoding: "utf8" });
    expect(r.stderr).not.toMatch(/FATAL ERROR|heap out of memory|Native stack/);
    expect(r.stderr).toMatch(new RegExp(`${frame.memberCount.toLocaleString("en-US")} members: a takedown this large needs about [\\d.]+ GB of memory, more than the [\\d.]+ GB this process may use; .*NODE_OPTIONS=--max-old-space-size=\\d+`));
    expect(r.status).toBe(2);
    expect(hashOf(path)).toBe(before);
  });
});

describe("recalc with an array formula declared over the whole sheet", () => {
  it("computes the formula without walking A1:XFD1048576 and keeps the input", async () => {
    const path = join(dir, "array.xlsx");
    const wb = new ExcelJS.Workbook();
    const ws = wb.addWorksheet("S");
    const input = wb.addWorksheet("In");
    input.getCell("B1").value = 21;
    ws.getCell("A1").value = { formula: "In!B1*2", result: 0, shareType: "array", ref: "A1:XFD1048576" } as unknown as ExcelJS.CellValue;
    input.getCell("C3").value = { formula: "S!A1+1", result: 0 } as ExcelJS.CellValue;
    await wb.xlsx.writeFile(path);
    const before = hashOf(path);
    const out = join(dir, "array-out.xlsx");
    const ran = await runCli("recalc", path, "-o", out);
    expect(ran.err).toBe("");
    expect(ran.status).toBe(0);
    const back = new ExcelJS.Workbook();
    await back.xlsx.readFile(out);
    const s = back.getWorksheet("S")!;
    expect((s.getCell("A1").value as { result?: unknown }).result).toBe(42);
    expect((back.getWorksheet("In")!.getCell("C3").value as { result?: unknown }).result).toBe(43);
    expect(hashOf(path)).toBe(before);
  });
});

writeFileSync(join(dir, "README"), "scratch folder of test/bad-input/size.test.ts\n");
