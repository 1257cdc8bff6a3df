/**
 * Header matching of the member tables (docs/interface.md section 2): case-insensitive, a trailing
 * "(unit)" ignored, a column mapping for differently named headers, and units checked against the
 * unit system of the takedown.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { LOADS_SPEC, matchTable, MEMBERS_SPEC, splitHeader, ZONES_SPEC } from "../../../src/engine/takedown/tables";
import { unitFits } from "../../../src/engine/takedown/units";
import type { CellValue, TableData } from "../../../src/engine/takedown/types";

function table(rows: CellValue[][], sheet = "S", top = 0, left = 0): TableData {
  return { sheet, top, left, values: rows };
}

describe("splitHeader", () => {
  it("separates the name (lower case, single spaces) from a trailing unit", () => {
    expect(splitHeader("Span (ft)")).toEqual({ name: "span", unit: "ft" });
    expect(splitHeader("  Start   support ")).toEqual({ name: "start support", unit: null });
    expect(splitHeader("D (kN/m²)")).toEqual({ name: "d", unit: "kN/m²" });
    expect(splitHeader(null)).toEqual({ name: "", unit: null });
    expect(splitHeader(12)).toEqual({ name: "12", unit: null });
  });
});

describe("matchTable", () => {
  it("finds every column whatever the case, the order and the units", () => {
    const { table: t, problems } = matchTable(MEMBERS_SPEC, table([["END SUPPORT", "mark", "span (FT)", "Start Support", "trib (feet)", "Type"], ["B1", null, 5, null, null, null], [], [null, null, null]]), "US");
    expect(problems).toEqual([]);
    expect(t.columns).toEqual({ endSupport: 0, mark: 1, span: 2, startSupport: 3, trib: 4, type: 5 });
    expect(t.rows).toEqual([1]); // blank rows are skipped
  });

  it("names every missing required column, at the table's first cell", () => {
    const { problems } = matchTable(MEMBERS_SPEC, table([["Mark", "Type"]], "Input", 4, 2), "US");
    expect(problems.map((p) => [p.code, `${p.sheet}!${p.cell}`])).toEqual([
      ["missingColumn", "Input!C5"],
      ["missingColumn", "Input!C5"],
    ]);
    expect(problems.map((p) => p.message).join(" ")).toMatch(/"Span".*"Start support"/);
  });

  it("reads differently named columns through the mapping", () => {
    const m = matchTable(MEMBERS_SPEC, table([["ID", "L (ft)", "Trib width (ft)", "Bears on"]]), "US", { Mark: "ID", span: "L", Trib: "Trib width", "Start support": "Bears on" });
    expect(m.problems).toEqual([]);
    expect(m.table.columns).toMatchObject({ mark: 0, span: 1, trib: 2, startSupport: 3 });
    const bad = matchTable(MEMBERS_SPEC, table([["Mark", "Span", "Start support"]]), "US", { Trib: "Width", Colour: "Paint" });
    expect(bad.problems.map((p) => p.code)).toEqual(["badValue", "missingColumn"]);
    expect(bad.problems[0]!.message).toContain('"Colour"');
  });

  it("reports a header whose unit contradicts the unit system", () => {
    const si = matchTable(ZONES_SPEC, table([["Zone", "D (psf)", "L (kPa)", "S (kN/m2)"]]), "SI");
    expect(si.problems.map((p) => [p.code, p.cell])).toEqual([["unitMismatch", "B1"]]);
    expect(si.problems[0]!.message).toMatch(/psf.*SI.*kPa/);
    const us = matchTable(MEMBERS_SPEC, table([["Mark", "Span (m)", "Start support", "Start at (in)", "wD (klf)", "wL (plf)"]]), "US");
    expect(us.problems.map((p) => p.cell)).toEqual(["B1", "D1", "E1"]);
  });

  it("the Loads magnitude takes line and point units of the system together", () => {
    expect(matchTable(LOADS_SPEC, table([["Mark", "Kind", "Zone or case", "Magnitude (plf or lb)"]]), "US").problems).toEqual([]);
    expect(matchTable(LOADS_SPEC, table([["Mark", "Kind", "Zone or case", "Magnitude (kN/m, kN)"]]), "SI").problems).toEqual([]);
    expect(matchTable(LOADS_SPEC, table([["Mark", "Kind", "Zone or case", "Magnitude (kip)"]]), "US").problems.map((p) => p.code)).toEqual(["unitMismatch"]);
  });

  it("a repeated column is a problem naming both cells; neither is taken", () => {
    const { table: t, problems } = matchTable(ZONES_SPEC, table([["Zone", "D", "d (psf)"]]), "US");
    expect(t.columns.D).toBeUndefined();
    expect(problems.map((p) => [p.code, p.cell])).toEqual([["ambiguousColumn", "B1"]]);
    expect(problems[0]!.message).toMatch(/B1 "D" and C1 "d \(psf\)".*--map zones\.D=B or --map zones\.D=C/);
  });
});

describe("unitFits", () => {
  it("accepts the spellings of each unit and nothing of the other system", () => {
    expect(unitFits("areaLoad", "US", "lb/ft²")).toBe(true);
    expect(unitFits("areaLoad", "SI", "kN/m^2")).toBe(true);
    expect(unitFits("areaLoad", "SI", "psf")).toBe(false);
    expect(unitFits("length", "US", "Ft")).toBe(true);
    expect(unitFits("length", "SI", "mm")).toBe(false);
    expect(unitFits("none", "SI", "anything")).toBe(true);
  });
});

describe("headers whose parentheses are not units, references, ambiguity", () => {
  // A firm's members header row: two "Supported by (...)" whose parentheses are words, and two
  // "Location (ft)" told apart only by the group row above them (Start over G:H, End over I:J).
  const GROUPS: CellValue[] = [null, null, null, null, null, null, "Start", null, "End", null];
  const HEADERS: CellValue[] = ["Beam Mark", "Member", "Floor", "Length (ft)", "Area type", "Trib. Width (ft)", "Supported by (start)", "Location (ft)", "Supported by (end)", "Location (ft)"];
  const BODY: CellValue[] = ["B1", "beam", "2", 24, "F", 10, "G1", 8, "G2", 18];
  const MAP = { Mark: "Beam Mark", Type: "Member", Level: "Floor", Span: "Length", Zone: "Area type", Trib: "Trib. Width", "Start support": "Supported by (start)", "Start at": "Start/Location", "End support": "Supported by (end)", "End at": "J" };

  it("a parenthesis that is no unit stays part of the header", () => {
    expect(splitHeader("Supported by (end)")).toEqual({ name: "supported by (end)", unit: null });
    expect(splitHeader("Location (ft)")).toEqual({ name: "location", unit: "ft" });
    expect(splitHeader("Load (kip)")).toEqual({ name: "load", unit: "kip" }); // known, though neither system reads it
  });

  it("names each column once by header, Group/Header and column letter", () => {
    const m = matchTable(MEMBERS_SPEC, table([GROUPS, HEADERS, BODY]), "US", MAP);
    expect(m.problems).toEqual([]);
    expect(m.table.columns).toEqual({ mark: 0, type: 1, level: 2, span: 3, zone: 4, trib: 5, startSupport: 6, startAt: 7, endSupport: 8, endAt: 9 });
    expect(m.table.headerRow).toBe(1);
    expect(m.table.rows).toEqual([2]);
  });

  it("a column letter is the sheet's, not the table's: a table starting in column C", () => {
    const m = matchTable(MEMBERS_SPEC, table([GROUPS, HEADERS, BODY], "S", 3, 2), "US", { ...MAP, "End at": "L" });
    expect(m.problems).toEqual([]);
    expect(m.table.columns.endAt).toBe(9);
    const outside = matchTable(MEMBERS_SPEC, table([GROUPS, HEADERS, BODY], "S", 3, 2), "US", { ...MAP, "End at": "B" });
    expect(outside.problems.map((p) => [p.code, p.cell])).toEqual([["missingColumn", "C5"]]);
    expect(outside.problems[0]!.message).toMatch(/"B".*columns run C to L/);
  });

  it("two columns that fit one reference are a problem naming both cells; neither is taken", () => {
    const m = matchTable(MEMBERS_SPEC, table([GROUPS, HEADERS, BODY]), "US", { ...MAP, "Start at": "Location", "End at": "Location (ft)" });
    expect(m.table.columns.startAt).toBeUndefined();
    expect(m.table.columns.endAt).toBeUndefined();
    expect(m.problems.map((p) => [p.code, p.cell])).toEqual([
      ["ambiguousColumn", "H2"],
      ["ambiguousColumn", "H2"],
    ]);
    expect(m.problems[0]!.message).toMatch(/Start at could be H2 "Location \(ft\)" and J2 "Location \(ft\)"; none is taken.*--map members\.Start at=H or --map members\.Start at=J/);
  });

  it("without its parenthesis a word header is not found; the old unit reading would have merged start and end", () => {
    const m = matchTable(MEMBERS_SPEC, table([GROUPS, HEADERS, BODY]), "US", { ...MAP, "Start support": "Supported by" });
    expect(m.problems.map((p) => p.code)).toEqual(["missingColumn"]);
  });

  it("one column given for two needed columns is a problem, and a letter against another column's header is one too", () => {
    const twice = matchTable(MEMBERS_SPEC, table([GROUPS, HEADERS, BODY]), "US", { ...MAP, "Start at": "J" });
    expect(twice.problems.map((p) => [p.code, p.cell])).toEqual([["ambiguousColumn", "J2"]]);
    expect(twice.problems[0]!.message).toMatch(/taken for both Start at and End at/);
    // "D" names column D of the sheet and also the header "D" in column B.
    const zones = matchTable(ZONES_SPEC, table([["Zone", "D", "L", "X"]]), "US", { D: "D" });
    expect(zones.problems.map((p) => [p.code, p.message.match(/[A-Z]\d "[^"]*"/g)])).toEqual([["ambiguousColumn", ['D1 "X"', 'B1 "D"']]]);
    // "column D" is the sheet's column only; the header "D" is then reached by its letter, B.
    expect(matchTable(ZONES_SPEC, table([["Zone", "D", "L", "X"]]), "US", { D: "column D" }).table.columns).toMatchObject({ D: 3 });
    const byB = matchTable(ZONES_SPEC, table([["Zone", "D", "L", "X"]]), "US", { D: "b" });
    expect([byB.problems, byB.table.columns.D]).toEqual([[], 1]);
  });
});

describe("table position: title block, group row, units row", () => {
  const title: CellValue[][] = [["Gravity takedown, Example building"], ["Project 2026-014", null, "Sheet 3 of 12"], []];
  const header: CellValue[] = ["Mark", "Span", "Start support", "Trib", "Zone"];
  const units: CellValue[] = [null, "(ft)", null, "[ft]", null];
  const body: CellValue[][] = [["B1", 20, "W", 8, "F"], ["B2", 16, "W", 8, "F"]];

  it("finds the header row below a title block and skips the units row", () => {
    const m = matchTable(MEMBERS_SPEC, table([...title, header, units, ...body], "M", 0, 0), "US");
    expect(m.problems).toEqual([]);
    expect(m.table.headerRow).toBe(3);
    expect(m.table.rows).toEqual([5, 6]);
    expect(m.table.columns).toMatchObject({ mark: 0, span: 1, startSupport: 2, trib: 3, zone: 4 });
  });

  it("a units row of the other system is a unit mismatch at the units cell", () => {
    const m = matchTable(MEMBERS_SPEC, table([...title, header, [null, "m", null, "(m)", null], ...body]), "US");
    expect(m.problems.map((p) => [p.code, p.cell])).toEqual([
      ["unitMismatch", "B5"],
      ["unitMismatch", "D5"],
    ]);
  });

  it("a row under the headers with anything but units is data", () => {
    const m = matchTable(MEMBERS_SPEC, table([header, ["B0", "(ft)", null, null, null], ...body]), "US");
    expect(m.table.rows).toEqual([1, 2, 3]);
  });

  it("a given header row (1-based sheet row) is used as it is; one outside the table is a problem", () => {
    const data = table([...title, header, units, ...body], "M", 10, 0);
    expect(matchTable(MEMBERS_SPEC, data, "US", undefined, 14).table.headerRow).toBe(3);
    const wrong = matchTable(MEMBERS_SPEC, data, "US", undefined, 12);
    // Row 12 is the "Project" line: Mark, Span and Start support are missing there, at A12.
    expect(wrong.problems.filter((p) => p.code === "missingColumn").map((p) => p.cell)).toEqual(["A12", "A12", "A12"]);
    expect(matchTable(MEMBERS_SPEC, data, "US", undefined, 30).problems.map((p) => [p.code, p.cell])).toEqual([["missingColumn", "A11"]]);
  });

  it("property: any title block of text above the table moves the header row, not the columns or the rows read (fast-check)", () => {
    const word = fc.stringMatching(/^[A-Za-z0-9 .,:-]{0,12}$/).map((s) => `Note ${s}`);
    const cell = fc.oneof(fc.constant(null), word, fc.integer());
    fc.assert(
      fc.property(fc.array(fc.array(cell, { maxLength: 6 }), { maxLength: 15 }), (block) => {
        const plain = matchTable(MEMBERS_SPEC, table([header, units, ...body]), "US");
        const m = matchTable(MEMBERS_SPEC, table([...block, header, units, ...body]), "US");
        expect(m.problems).toEqual([]);
        expect(m.table.headerRow).toBe(block.length);
        expect(m.table.columns).toEqual(plain.table.columns);
        expect(m.table.rows.map((i) => i - block.length)).toEqual(plain.table.rows);
      }),
      { numRuns: 200 },
    );
  });
});
