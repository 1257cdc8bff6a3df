/**
 * Parts of the demo page checked without a browser: the selection stand-in reads a typed cell as
 * Excel names one ("Sheet!A1", "'My sheet'!$B$7"), and the page's engine settings are those of
 * the Node engine (src/workbook/headless.ts), so the page computes what the command computes.
 */
import { describe, expect, it } from "vitest";
import { HEADLESS_CONFIG as PAGE_CONFIG } from "../../src/taskpane-demo/headless-browser";
import { parseCellRef } from "../../src/taskpane-demo/selection-standin";
import { HEADLESS_CONFIG } from "../../src/workbook/headless";

describe("the demo page", () => {
  it("reads a typed cell reference", () => {
    expect(parseCellRef("Takedown!A40")).toEqual({ sheet: "Takedown", address: "A40" });
    expect(parseCellRef(" 'My sheet'!$b$7 ")).toEqual({ sheet: "My sheet", address: "B7" });
    expect(parseCellRef("'It''s'!C3")).toEqual({ sheet: "It's", address: "C3" });
    expect(parseCellRef("A40")).toBeNull();
    expect(parseCellRef("Takedown!A0")).toBeNull();
    expect(parseCellRef("Takedown!")).toBeNull();
  });

  it("runs HyperFormula with the settings of the Node engine (one shared definition)", () => {
    expect(PAGE_CONFIG).toBe(HEADLESS_CONFIG);
    expect(HEADLESS_CONFIG).toMatchObject({ smartRounding: false, useArrayArithmetic: true });
    expect(HEADLESS_CONFIG.chooseAddressMappingPolicy).toBeDefined();
  });
});
