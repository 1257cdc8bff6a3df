/**
 * The generated sheets written straight into the .xlsx package (src/workbook/xlsx-stream.ts):
 * the user's parts (sheets, tables, styles, shared strings, names) come through byte for byte;
 * the generated sheet reads back (ExcelJS, the CLI's own reader) with the formulas and the values
 * HyperFormula computed, to the last bit; a hand-off version recalculated by Gnumeric and by
 * LibreOffice gives the values cached; a workbook whose own formula computes a new value goes the
 * ExcelJS way and gets that value cached. Needs `npm run build` (the headless engine loads dist/).
 */
import { readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import ExcelJS from "exceljs";
import JSZip from "jszip";
import { afterAll, describe, expect, it } from "vitest";
import { takedownOfFile } from "../../src/cli/takedown-input";
import { toFileFormula } from "../../src/workbook/headless";
import { cellAddress } from "../../src/workbook/a1";
import { readXlsx, writeXlsx } from "../../src/workbook/xlsx";
import { readZip } from "../../src/workbook/xlsx-stream";
import { hasGnumeric, hasLibreOffice, readComputed, recalcWithGnumeric, recalcWithLibreOffice, requireInCi, scratchDir, type ReadValue } from "../handoff/programs";

const SAMPLE = join(__dirname, "..", "..", "sample-workbooks", "steel-office-us.xlsx");
const scratch = scratchDir("loadpath-stream-");
afterAll(() => scratch.remove());

/** Parts the writer edits (the package's lists); every other part of the input must come through byte for byte. */
const EDITED = new Set(["[Content_Types].xml", "xl/workbook.xml", "xl/_rels/workbook.xml.rels"]);

/**
 * The sample building with what a user adds: a Notes sheet holding an Excel table, a styled cell,
 * a formula with its value cached, and a workbook name. An XML comment is put into the user's
 * sheet, styles and shared strings parts, which no spreadsheet model keeps: a writer that
 * rewrites those parts cannot give them back byte for byte.
 * @param stale - cache a wrong value for the Notes formula (the file's value is then not what it computes)
 */
async function userWorkbook(path: string, stale = false): Promise<void> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.readFile(SAMPLE);
  const ws = wb.addWorksheet("Notes");
  ws.addTable({ name: "Checks", ref: "A1", headerRow: true, columns: [{ name: "Item" }, { name: "Value" }], rows: [["Roof dead load", 20], ["Note", "checked"]] });
  ws.getCell("D1").value = "Twice the roof D";
  ws.getCell("D1").font = { bold: true, color: { argb: "FF0000FF" } };
  ws.getCell("D2").value = { formula: "B2*2", result: stale ? 0 : 40 } as ExcelJS.CellValue;
  wb.definedNames.add("Notes!$B$2", "RoofDead");
  const zip = await JSZip.loadAsync(await wb.xlsx.writeBuffer());
  for (const part of ["xl/worksheets/sheet1.xml", "xl/styles.xml", "xl/sharedStrings.xml"]) {
    const text = await zip.file(part)!.async("string");
    zip.file(part, text.replace(/^(<\?xml[^>]*\?>)/, "$1<!-- kept as the user's program wrote it -->"));
  }
  writeFileSync(path, await zip.generateAsync({ type: "nodebuffer", compression: "DEFLATE" }));
}

/** Every part of a package, uncompressed, read with an unzip library outside the project. */
async function parts(path: string): Promise<Map<string, Buffer>> {
  const zip = await JSZip.loadAsync(readFileSync(path));
  const out = new Map<string, Buffer>();
  for (const name of Object.keys(zip.files)) if (!zip.files[name]!.dir) out.set(name, await zip.file(name)!.async("nodebuffer"));
  return out;
}

/** What of the input package differs in the output: a part missing or changed (the edited lists aside). */
async function userPartsChanged(input: string, output: string): Promise<string[]> {
  const before = await parts(input);
  const after = await parts(output);
  const changed: string[] = [];
  for (const [name, bytes] of before) {
    if (EDITED.has(name)) continue;
    const now = after.get(name);
    if (!now) changed.push(`${name} missing`);
    else if (!now.equals(bytes)) changed.push(`${name} changed`);
  }
  // In the workbook part: every sheet entry and every name of the user, as written.
  const wbBefore = before.get("xl/workbook.xml")!.toString("utf8");
  const wbAfter = after.get("xl/workbook.xml")!.toString("utf8");
  for (const m of wbBefore.matchAll(/<sheet\b[^>]*\/>|<definedName\b[^>]*>[^<]*<\/definedName>/g)) if (!wbAfter.includes(m[0])) changed.push(`xl/workbook.xml lost ${m[0]}`);
  const rels = after.get("xl/_rels/workbook.xml.rels")!.toString("utf8");
  for (const m of before.get("xl/_rels/workbook.xml.rels")!.toString("utf8").matchAll(/<Relationship\b[^>]*\/>/g)) if (!rels.includes(m[0])) changed.push(`workbook relationships lost ${m[0]}`);
  return changed;
}

/** A value as the engine computed it, in the form the file reader gives (errors as their text). */
function engineValue(v: unknown): unknown {
  if (v !== null && typeof v === "object" && "value" in (v as object)) return { error: (v as { value: string }).value };
  return v === null || v === "" ? undefined : v;
}

describe("generated sheets written straight into the package", () => {
  it("keeps the user's sheets, tables, styles, strings and names byte for byte and adds the takedown sheet last", async () => {
    const input = join(scratch.dir, "user.xlsx");
    const output = join(scratch.dir, "user-takedown.xlsx");
    await userWorkbook(input);
    const { workbook, port, result } = await takedownOfFile(input, { units: "US" });
    expect(result.ok).toBe(true);
    const how = await writeXlsx(workbook, output, port);
    expect(how).toEqual({ streamed: true });
    expect(await userPartsChanged(input, output)).toEqual([]);
    const read = await readXlsx(output);
    expect(read.sheets.map((s) => s.name)).toEqual(["Zones", "Members", "Loads", "About", "Notes", "Takedown"]);
    expect(read.tables.map((t) => [t.name, t.sheet, t.ref])).toContainEqual(["Checks", "Notes", "A1:B3"]);
    expect(read.tables.map((t) => t.name)).toEqual(workbook.tables.map((t) => t.name));
    expect(read.names.find((n) => n.name === "RoofDead")?.refersTo).toMatch(/Notes!\$B\$2$/);
  });

  it("reads back (ExcelJS) with every formula and every value HyperFormula computed, to the last bit", async () => {
    const input = join(scratch.dir, "sample-read.xlsx");
    const output = join(scratch.dir, "sample-read-out.xlsx");
    writeFileSync(input, readFileSync(SAMPLE));
    const { workbook, port } = await takedownOfFile(input, { units: "US" });
    expect((await writeXlsx(workbook, output, port)).streamed).toBe(true);
    const read = await readXlsx(output);
    const hf = port.hf;
    const id = hf.getSheetId("Takedown")!;
    const content = hf.getSheetSerialized(id);
    const values = hf.getSheetValues(id);
    const formulas = new Map(read.formulas.filter((f) => f.sheet === "Takedown").map((f) => [cellAddress(f.row, f.col), f]));
    const plain = read.sheets.find((s) => s.name === "Takedown")!.rows;
    let checked = 0;
    let loadpathCalls = 0;
    content.forEach((row, r) =>
      row.forEach((c, col) => {
        if (c === null || c === undefined || c === "") return;
        const at = cellAddress(r, col);
        if (typeof c === "string" && c.startsWith("=")) {
          const f = formulas.get(at);
          expect(f?.formula, at).toBe(toFileFormula(c.slice(1)));
          const want = engineValue(values[r]![col]);
          // ExcelJS's reader drops a cached 0 (the XML holds <v>0</v>; the Gnumeric check below reads it).
          expect(want === 0 ? (f?.cached ?? 0) : f?.cached, at).toEqual(want);
          if (f!.formula.includes("_xldudf_LOADPATH_")) loadpathCalls++;
        } else {
          const want = typeof c === "string" ? `'${c.replace(/^'/, "")}` : c;
          expect(plain[r]?.[col], at).toEqual(want);
        }
        checked++;
      }),
    );
    expect(checked).toBeGreaterThan(500);
    expect(loadpathCalls).toBeGreaterThan(50);
    expect(formulas.size).toBe(content.flat().filter((c) => typeof c === "string" && c.startsWith("=")).length);
  });

  it("replaces its own sheet in place on a second run, the user's parts still byte for byte", async () => {
    const input = join(scratch.dir, "user2.xlsx");
    const first = join(scratch.dir, "user2-first.xlsx");
    const second = join(scratch.dir, "user2-second.xlsx");
    await userWorkbook(input);
    const a = await takedownOfFile(input, { units: "US" });
    await writeXlsx(a.workbook, first, a.port);
    const b = await takedownOfFile(first, { units: "US" });
    expect(await writeXlsx(b.workbook, second, b.port)).toEqual({ streamed: true });
    expect(await userPartsChanged(input, second)).toEqual([]);
    const [p1, p2] = [await parts(first), await parts(second)];
    expect([...p2.keys()].sort()).toEqual([...p1.keys()].sort());
    const sheetPart = [...p1.keys()].find((k) => k.startsWith("xl/worksheets/") && p1.get(k)!.toString("utf8").includes("Generated by Loadpath"))!;
    // The same cells: the takedown of the same tables is the same sheet.
    expect(p2.get(sheetPart)!.equals(p1.get(sheetPart)!)).toBe(true);
    expect((await readXlsx(second)).sheets.map((s) => s.name)).toEqual(["Zones", "Members", "Loads", "About", "Notes", "Takedown"]);
  });

  it("writes through the ExcelJS model when the user's own formula computes a value the file does not hold, and caches it", async () => {
    const input = join(scratch.dir, "stale.xlsx");
    const output = join(scratch.dir, "stale-out.xlsx");
    await userWorkbook(input, true);
    const { workbook, port } = await takedownOfFile(input, { units: "US" });
    const how = await writeXlsx(workbook, output, port);
    expect(how.streamed).toBe(false);
    expect(how.reason).toMatch(/^Notes!D2 /);
    const read = await readXlsx(output);
    // Hand check: 2 x the 20 in B2.
    expect(read.formulas.find((f) => f.sheet === "Notes" && f.row === 1 && f.col === 3)?.cached).toBe(40);
    expect(read.sheets.map((s) => s.name)).toContain("Takedown");
  });

  it("writes a generated sheet as the engine holds it after a later edit, not as first filled", async () => {
    const input = join(scratch.dir, "edited.xlsx");
    const output = join(scratch.dir, "edited-out.xlsx");
    writeFileSync(input, readFileSync(SAMPLE));
    const { workbook, port } = await takedownOfFile(input, { units: "US" });
    port.setCell("Takedown", "A2", "edited after the build");
    port.setCell("Takedown", "Z1", "=1+2");
    expect((await writeXlsx(workbook, output, port)).streamed).toBe(true);
    const read = await readXlsx(output);
    expect(read.sheets.find((s) => s.name === "Takedown")!.rows[1]![0]).toBe("'edited after the build");
    expect(read.formulas.find((f) => f.sheet === "Takedown" && f.row === 0 && f.col === 25)).toMatchObject({ formula: "1+2", cached: 3 });
  });

  it("reads a zip's directory and declines what it does not copy", () => {
    const zip = readZip(readFileSync(SAMPLE));
    expect(Array.isArray(zip) && zip.map((e) => e.name)).toContain("xl/workbook.xml");
    expect(readZip(Buffer.from("not a zip at all, just some text"))).toBe("no zip directory");
  });
});

/** Numbers of the generated sheets whose recalculated value differs from the cached one by more than 1e-9 relative. */
function differences(cached: Map<string, Map<string, ReadValue>>, recalculated: Map<string, Map<string, ReadValue>>, sheets: readonly string[]): { compared: number; differing: string[] } {
  let compared = 0;
  const differing: string[] = [];
  for (const sheet of sheets) {
    for (const [at, want] of cached.get(sheet)!) {
      if (typeof want !== "number") continue;
      const got = recalculated.get(sheet)?.get(at);
      compared++;
      if (typeof got !== "number" || Math.abs(got - want) > 1e-9 * Math.max(1, Math.abs(want))) differing.push(`${sheet}!${at}: ${want} -> ${String(got)}`);
    }
  }
  return { compared, differing };
}

describe("a hand-off takedown written straight into the package, recalculated by other programs", () => {
  const gnumeric = hasGnumeric();
  const libre = hasLibreOffice();
  requireInCi("ssconvert (Gnumeric)", gnumeric);
  requireInCi("soffice (LibreOffice)", libre);

  async function handOff(name: string): Promise<{ output: string; sheets: string[] }> {
    const input = join(scratch.dir, `${name}.xlsx`);
    const output = join(scratch.dir, `${name}-handoff.xlsx`);
    await userWorkbook(input);
    const { workbook, port, result } = await takedownOfFile(input, { units: "US", native: true });
    expect(result.ok).toBe(true);
    expect(await writeXlsx(workbook, output, port)).toEqual({ streamed: true });
    return { output, sheets: port.generatedSheets() };
  }

  it.skipIf(!gnumeric)("Gnumeric (ssconvert --recalc) computes the values cached", async () => {
    const { output, sheets } = await handOff("gnumeric");
    const recalculated = join(scratch.dir, "gnumeric-recalc.xlsx");
    recalcWithGnumeric(output, recalculated);
    const { compared, differing } = differences(await readComputed(output), await readComputed(recalculated), sheets);
    expect(differing).toEqual([]);
    expect(compared).toBeGreaterThan(500);
  }, 120_000);

  it.skipIf(!libre)("LibreOffice (recalculating on load) computes the values cached", async () => {
    const { output, sheets } = await handOff("libre");
    const recalculated = join(scratch.dir, "libre-recalc.xlsx");
    recalcWithLibreOffice(output, recalculated);
    const { compared, differing } = differences(await readComputed(output), await readComputed(recalculated), sheets);
    expect(differing).toEqual([]);
    expect(compared).toBeGreaterThan(500);
  }, 300_000);
});
