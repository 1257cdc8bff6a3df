/**
 * A mark or level that the spreadsheet turned into a date ("3-1" typed into a General cell becomes
 * 1 March, stored as the serial number 45352 with a date format) is a problem naming its cell,
 * never a member called "45352". Date formats are recognised by their format codes (the codes of
 * Excel's built-in date and number formats, ECMA-376 Part 1, 18.8.30 numFmt; recalled from memory).
 */
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import ExcelJS from "exceljs";
import { afterEach, describe, expect, it, vi } from "vitest";
import { OfficeWorkbookPort } from "../../src/workbook/office";
import { isDateFormat } from "../../src/workbook/number-format";
import { buildTakedown } from "../../src/workbook/takedown-build";
import { FakeExcel } from "../workbook/office-fake";
import { cli, digest } from "./cli-helpers";

describe("isDateFormat", () => {
  it("recognises the built-in date and time formats", () => {
    for (const f of ["m/d/yyyy", "d-mmm-yy", "d-mmm", "mmm-yy", "h:mm AM/PM", "h:mm:ss", "m/d/yyyy h:mm", "mm:ss", "[h]:mm:ss", "mmss.0", "yyyy-mm-dd", "[$-409]mmmm d, yyyy", "dddd", "[Blue]d/m/yy"]) {
      expect(isDateFormat(f), f).toBe(true);
    }
  });
  it("does not take number, text or accounting formats for dates", () => {
    for (const f of ["General", "0", "0.00", "#,##0", "#,##0.00", "0%", "0.00E+00", "# ?/?", "@", '#,##0.00_);[Red](#,##0.00)', '"Day "0', '0.0" kips"', "\\d0", '_("$"* #,##0_)', "", "general;[Red]-General"]) {
      expect(isDateFormat(f), f).toBe(false);
    }
  });
});

const ZONES = [
  ["Zone", "D (psf)", "L (psf)", "Reducible"],
  ["Office", 65, 50, "yes"],
];
const MEMBERS = [
  ["Mark", "Type", "Level", "Span (ft)", "Zone", "Trib (ft)", "Start support", "Start at", "End support", "End at"],
  [45352, "beam", "L2", 30, "Office", 10, "W1", "", "W2", ""],
  ["B2", "beam", 45353, 30, "Office", 10, "W1", "", "W2", ""],
  ["B3", "beam", "L2", 30, "Office", 10, "W1", "", "W2", ""],
  ["W1", "wall", "L2", 30, "", "", "", "", "", ""],
  ["W2", "wall", "L2", 30, "", "", "", "", "", ""],
];

afterEach(() => {
  vi.unstubAllGlobals();
});

describe("a date used as a mark or a level (Excel host)", () => {
  it("is a problem naming its cell; the other members still build", async () => {
    const fake = new FakeExcel({}, [
      { name: "Zones", sheet: "Zones", rows: ZONES },
      { name: "Members", sheet: "Members", rows: MEMBERS },
    ]);
    fake.formats.set("Members", new Map([["1,0", "m/d/yyyy"], ["2,2", "d-mmm"], ["3,3", "0.00"]]));
    vi.stubGlobal("Excel", fake.excel());
    const result = await buildTakedown(new OfficeWorkbookPort(), { zones: "Zones", members: "Members", units: "US" });
    const dated = result.problems.filter((p) => /is a date/.test(p.message));
    expect(dated.map((p) => `${p.sheet}!${p.cell}`).sort()).toEqual(["Members!A2", "Members!C3"]);
    expect(dated.find((p) => p.cell === "A2")!.message).toMatch(/Mark is a date/);
    expect(dated.find((p) => p.cell === "C3")!.message).toMatch(/^B2: Level is a date/);
    // B3 (its span formatted "0.00": a number, not a date) is still in the takedown (the fake host
    // does not evaluate formulas, so its values are not checked here).
    expect(result.json?.members["B3"]).toBeDefined();
    expect(result.json?.members["45352"]).toBeUndefined();
  });
});

describe("a date used as a mark or a level (.xlsx file, command line)", () => {
  it("is a problem naming its cell, exit 1, and the input is unchanged", async () => {
    const dir = mkdtempSync(join(tmpdir(), "loadpath-dates-"));
    const input = join(dir, "in.xlsx");
    const wb = new ExcelJS.Workbook();
    const zones = wb.addWorksheet("Zones");
    ZONES.forEach((r, i) => r.forEach((v, j) => (zones.getCell(i + 1, j + 1).value = v)));
    const members = wb.addWorksheet("Members");
    MEMBERS.forEach((r, i) =>
      r.forEach((v, j) => {
        if (v !== "") members.getCell(i + 1, j + 1).value = v;
      }),
    );
    // "3-1" typed into a General cell: Excel stores 1 March with a date format.
    members.getCell("A2").value = new Date(Date.UTC(2024, 2, 1));
    members.getCell("A2").numFmt = "d-mmm";
    await wb.xlsx.writeFile(input);
    const before = digest(input);
    const run = await cli("takedown", input, "--units", "US");
    expect(run.status).toBe(1);
    expect(run.err.some((l) => /^Members!A2: Mark is a date/.test(l))).toBe(true);
    expect(digest(input)).toBe(before);
  });
});
