/**
 * The headless evaluator with a deliberately faulty bundle (written here, not the real build):
 * an exception inside a function, a range returned where the metadata declares one value and an
 * oversized spill must each become a cell error with a message, never a crash of the evaluation.
 */
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { DetailedCellError } from "hyperformula";
import { createHeadless } from "../../src/workbook/headless";

function faultyDist(): string {
  const dir = mkdtempSync(join(tmpdir(), "loadpath-faulty-"));
  writeFileSync(
    join(dir, "functions.js"),
    [
      'CustomFunctions.associate("BOOM", function () { throw new Error("kaboom"); });',
      'CustomFunctions.associate("RANGE_AS_VALUE", function () { return [[1, 2]]; });',
      'CustomFunctions.associate("REACTIONS", function () { return [[1, 2, 3, 4, 5]]; });',
      'CustomFunctions.associate("ECHO", function (x) { return x === null ? "left out" : x; });',
    ].join("\n"),
  );
  const fn = (id: string, params: object[], result: object = { type: "number" }) => ({ id, name: id, description: `${id} test function.`, parameters: params, result });
  writeFileSync(
    join(dir, "functions.json"),
    JSON.stringify({
      functions: [
        fn("BOOM", []),
        fn("RANGE_AS_VALUE", []),
        // REACTIONS's spill rule gives 2 cells when supports is left out: 5 values do not fit.
        fn("REACTIONS", [{ name: "span", type: "any" }, { name: "loads", type: "any", dimensionality: "matrix" }, { name: "supports", type: "any", dimensionality: "matrix", optional: true }], { dimensionality: "matrix" }),
        fn("ECHO", [{ name: "x", type: "any", optional: true }], { type: "any" }),
      ],
    }),
  );
  return dir;
}

describe("faults inside functions become cell errors", () => {
  it("exception, range for a single value, oversized spill; other cells still compute", async () => {
    const { hf } = await createHeadless({
      distDir: faultyDist(),
      sheets: { S: [["=LOADPATH.BOOM()", "=LOADPATH.RANGE_AS_VALUE()", "=LOADPATH.REACTIONS(1,1)", null, null, null, "=LOADPATH.ECHO()", "=LOADPATH.ECHO(4)", "=1+1"]] },
    });
    const at = (a1: string) => hf.getCellValue(hf.simpleCellAddressFromString(a1, 0)!);
    expect(at("A1")).toBeInstanceOf(DetailedCellError);
    expect((at("A1") as DetailedCellError).message).toBe("LOADPATH.BOOM failed: kaboom");
    expect((at("B1") as DetailedCellError).message).toMatch(/returned a range but functions.json declares a single value/);
    expect((at("C1") as DetailedCellError).message).toMatch(/the result needs more than the 1 x 2 cells sized before evaluation/);
    expect([at("G1"), at("H1"), at("I1")]).toEqual(["left out", 4, 2]);
  });
});
