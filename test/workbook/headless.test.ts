/**
 * The headless evaluator: the built bundle's functions inside a real spreadsheet engine
 * (HyperFormula). Values are checked against AISC Steel Construction Manual Table 3-23 closed
 * forms (case numbers recalled from memory); errors must arrive as cell errors carrying the
 * functions' messages; spills must have the size spill.ts predicts. Needs `npm run build`.
 */
import { describe, expect, it } from "vitest";
import { DetailedCellError, type HyperFormula, type RawCellContent } from "hyperformula";
import { callsLoadpath, createHeadless, toEngineFormula, toFileFormula } from "../../src/workbook/headless";
import { diagramRowBound } from "../../src/functions/spill";

async function engine(rows: RawCellContent[][]): Promise<HyperFormula> {
  return (await createHeadless({ sheets: { S: rows } })).hf;
}

const at = (hf: HyperFormula, a1: string) => hf.getCellValue(hf.simpleCellAddressFromString(a1, 0)!);

function errorAt(hf: HyperFormula, a1: string): DetailedCellError {
  const v = at(hf, a1);
  expect(v).toBeInstanceOf(DetailedCellError);
  return v as DetailedCellError;
}

describe("LOADPATH functions in the engine", () => {
  it("both spellings: typed LOADPATH.NAME and the file's _xldudf_LOADPATH_NAME (AISC case 1: wL^2/8, wL/2)", async () => {
    const hf = await engine([[24, 1.5, "=LOADPATH.MOMENT_MAX(A1,B1)", "=_xldudf_LOADPATH_MOMENT_MAX(A1,B1)", "=loadpath.shear_max(A1,B1)"]]);
    expect(at(hf, "C1")).toBe((1.5 * 24 * 24) / 8);
    expect(at(hf, "D1")).toBe((1.5 * 24 * 24) / 8);
    expect(at(hf, "E1")).toBe((1.5 * 24) / 2);
  });

  it("ranges for loads and supports, a number for loads, an inline array for supports", async () => {
    const hf = await engine([
      [20, "=LOADPATH.REACTIONS(A1,A3:E4,G3:H5)", null, null, null, "=LOADPATH.MOMENT_MIN(A1,1.4,{0;10;20})"],
      [],
      ["line", 1.4, null, null, null, null, 0, "pin"],
      [null, null, null, null, null, null, 10, "pin"],
      [null, null, null, null, null, null, 20, "roller"],
    ]);
    // Two equal spans l = 10, uniform (continuous beam): 3wl/8, 10wl/8, 3wl/8; M over the middle support -wl^2/8
    const w = 1.4;
    const l = 10;
    expect(at(hf, "B1")).toBeCloseTo((3 * w * l) / 8, 12);
    expect(at(hf, "C1")).toBeCloseTo((10 * w * l) / 8, 12);
    expect(at(hf, "D1")).toBeCloseTo((3 * w * l) / 8, 12);
    expect(at(hf, "F1")).toBeCloseTo((-w * l * l) / 8, 12);
  });

  it("REACTIONS spills one cell per supports row (\"\" for blank rows), two when supports is left out", async () => {
    const hf = await engine([
      [10, "=LOADPATH.REACTIONS(A1,2)", null, null, null, null],
      [null, "=LOADPATH.REACTIONS(A1,2,A4:A6)"],
      [],
      [0],
      [null],
      [10],
    ]);
    expect([at(hf, "B1"), at(hf, "C1"), at(hf, "D1")]).toEqual([10, 10, null]);
    expect([at(hf, "B2"), at(hf, "C2"), at(hf, "D2"), at(hf, "E2")]).toEqual([10, "", 10, null]);
  });

  it("optional arguments left out or empty, and what = moment", async () => {
    const hf = await engine([[8, "=LOADPATH.REACTIONS(A1,0.75,B3:C3,\"moment\")", null, "=LOADPATH.MOMENT_MAX(A1,2,)"], [], [null, 0, "fixed"]]);
    expect(at(hf, "B1")).toBeCloseTo((-0.75 * 64) / 2, 12); // AISC case 19, cantilever: -wL^2/2
    expect(at(hf, "D1")).toBe((2 * 64) / 8);
  });

  it("DIAGRAM spills x | V | M to the predicted height; stations typed in the formula size it", async () => {
    const hf = await engine([
      [10, "=LOADPATH.DIAGRAM(A1,F1:J2,,5)", null, null, null, "point", 8, 4, null, null],
      [null, null, null, null, null, null, null, null, null, null],
    ]);
    const height = diagramRowBound(2, 2, 5);
    const values = hf.getRangeValues({ start: { sheet: 0, row: 0, col: 1 }, end: { sheet: 0, row: height, col: 3 } });
    const rows = values.filter((r) => typeof r[0] === "number");
    expect(rows.map((r) => r[0])).toEqual([0, 2, 4, 4, 6, 8, 10]);
    expect(values[height - 1]).toEqual(["", "", ""]); // last row of the spill: padding
    expect(values[height]).toEqual([null, null, null]); // below the spill: nothing
    expect(rows[2]![2]).toBeCloseTo((8 * 4 * 6) / 10, 12); // AISC case 8: Pab/L
  });

  it("DIAGRAM with stations from a cell: sized for 20, an error naming the fix when more are needed", async () => {
    const hf = await engine([[10, 60, "=LOADPATH.DIAGRAM(A1,2,,B1)", null, null, null, 8, "=LOADPATH.DIAGRAM(A1,2,,G1)"]]);
    expect(errorAt(hf, "C1").message).toMatch(/type numbers such as stations directly in the formula/);
    expect(at(hf, "H1")).toBe(0);
  });

  it("registered for the enUS language as well as enGB", async () => {
    const { hf } = await createHeadless({ sheets: { S: [["=LOADPATH.MOMENT_MAX(10,2)"]] }, config: { language: "enUS" } });
    expect(hf.getCellValue({ sheet: 0, row: 0, col: 0 })).toBe(25); // AISC case 1: wL^2/8
  });

  it("dependents follow a changed input", async () => {
    const hf = await engine([[20, 1, "=LOADPATH.MOMENT_MAX(A1,B1)", "=C1*2"]]);
    expect(at(hf, "D1")).toBe(100);
    hf.setCellContents(hf.simpleCellAddressFromString("A1", 0)!, 10);
    expect(at(hf, "C1")).toBe(12.5);
    expect(at(hf, "D1")).toBe(25);
  });
});

describe("errors are cell errors carrying the functions' messages", () => {
  it("bad arguments: #VALUE! with the message naming the argument and row", async () => {
    const hf = await engine([
      ["=LOADPATH.MOMENT_MAX(-5,1)", "=LOADPATH.MOMENT_MAX(20,A3:E4)", "=LOADPATH.DEFLECTION_MAX(20,1,29000,100,\"kip-in\")", "=LOADPATH.MOMENT_MAX(A1:B1,1)"],
      ["=LOADPATH.MOMENT_MAX(20,A5:D5)", "=LOADPATH.MOMENT_MAX(20,1,{5})"],
      ["line", 1, null, null, null],
      ["point", 3, 25, null, null],
      ["=1/0", 2, null, null],
    ]);
    expect(errorAt(hf, "A1").type).toBe("VALUE");
    expect(errorAt(hf, "A1").message).toBe("span: must be greater than 0 (got -5).");
    expect(errorAt(hf, "B1").message).toBe("loads, row 2: start 25 is outside the member (0 to 20).");
    expect(errorAt(hf, "C1").message).toMatch(/^units: "kip-in" is not recognised/);
    expect(errorAt(hf, "D1").message).toBe("span: expected a single value, got a range of 1 x 2 cells.");
    expect(errorAt(hf, "A2").message).toBe("loads, row 1: magnitude the cell holds the error #DIV/0!.");
    expect(errorAt(hf, "B2").message).toMatch(/^supports: /); // a single pin cannot hold the member
  });

  it("an unknown LOADPATH function is #NAME?; an error argument passes through", async () => {
    const hf = await engine([["=LOADPATH.MOMENT_MAXX(20,1)", "=LOADPATH.MOMENT_MAX(1/0,1)"]]);
    expect(errorAt(hf, "A1").type).toBe("NAME");
    expect(errorAt(hf, "B1").type).toBe("DIV_BY_ZERO");
  });

  it("a cycle is reported as such and the rest still computes", async () => {
    const hf = await engine([["=LOADPATH.MOMENT_MAX(B1,1)", "=A1+1", "=LOADPATH.MOMENT_MAX(10,1)"]]);
    expect(errorAt(hf, "A1").type).toBe("CYCLE");
    expect(at(hf, "C1")).toBe(12.5);
  });

  it("bare TRUE and FALSE work as in Excel", async () => {
    const hf = await engine([["=IF(TRUE,1,2)", "=AND(TRUE,FALSE)"]]);
    expect([at(hf, "A1"), at(hf, "B1")]).toEqual([1, false]);
  });
});

describe("formula spellings", () => {
  it("file -> engine: _xldudf_ names and _xlfn. prefixes, never inside strings", () => {
    expect(toEngineFormula('_xldudf_LOADPATH_MOMENT_MAX(A1,B1)+_xlfn.XLOOKUP(1,A:A,B:B)&"_xldudf_LOADPATH_X("')).toBe('LOADPATH.MOMENT_MAX(A1,B1)+XLOOKUP(1,A:A,B:B)&"_xldudf_LOADPATH_X("');
    expect(toEngineFormula("_xlfn._xlws.SORT(A1:A3)")).toBe("SORT(A1:A3)");
  });
  it("engine -> file: LOADPATH.NAME( as Excel stores add-in calls", () => {
    expect(toFileFormula('LOADPATH.REACTIONS(A1,B1:F3)&"LOADPATH.X("')).toBe('_xldudf_LOADPATH_REACTIONS(A1,B1:F3)&"LOADPATH.X("');
    expect(toFileFormula("_xlfn.XOR(TRUE,FALSE)")).toBe("_xlfn.XOR(TRUE,FALSE)");
  });
  it("recognises LOADPATH calls in either spelling", () => {
    expect([callsLoadpath("LOADPATH.KLL(1)"), callsLoadpath("1+_xldudf_LOADPATH_KLL(1)"), callsLoadpath("SUM(A1)")]).toEqual([true, true, false]);
  });
});
