/**
 * Header matching of the member tables (docs/interface.md section 2): case-insensitive, a trailing
 * "(unit)" ignored, a column mapping for differently named headers, and units checked against the
 * unit system of the takedown.
 */
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
    expect(problems[0]!.message).toMatch(/B1 "D" and C1 "d \(psf\)".*--map zones\.D=<column letter>/);
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
