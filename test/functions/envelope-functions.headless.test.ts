/**
 * GOVERNING and DEFLECTION_CHECK in the headless recalculation: HyperFormula with the LOADPATH
 * functions registered from the built bundle (dist/functions.js + functions.json, loaded the way
 * Excel loads them), against hand statics and the closed forms of AISC Steel Construction Manual
 * Table 3-23 (case names recalled from memory). Load factors of ASCE/SEI 7-22 Sec. 2.3.1 and 2.4.1
 * recalled from memory: 1.2D + 1.6L, D + L. Bad arguments give #VALUE! naming the argument.
 * Needs `npm run build`.
 */
import { beforeAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import type { HyperFormula } from "hyperformula";
import { createHeadless } from "../../src/workbook/headless";

let hf: HyperFormula;

/**
 * Sheet "M": A1:A3 supports of two equal 6 m spans (0, 6, 12); C1:F1 a partial D load row;
 * H1:L2 a firm's combinations table (header row, one LRFD row 1.3D + 1.5L).
 */
beforeAll(async () => {
  ({ hf } = await createHeadless({
    sheets: {
      M: [
        [0, null, "line", 2, 0, 12, null, "Combination", "Method", "D", "L"],
        [6, null, null, null, null, null, null, "firm 1", "LRFD", 1.3, 1.5],
        [12],
      ],
    },
  }));
});

function evaluate(formula: string): unknown {
  const sheet = hf.getSheetId("M")!;
  hf.setCellContents({ sheet, row: 10, col: 0 }, [[formula]]);
  return hf.getCellValue({ sheet, row: 10, col: 0 });
}

function close(actual: unknown, expected: number, rel = 1e-9): void {
  expect(typeof actual, String(actual)).toBe("number");
  expect(Math.abs((actual as number) - expected)).toBeLessThanOrEqual(rel * Math.max(1, Math.abs(expected)));
}

function errorMessage(value: unknown): string {
  expect(value).toMatchObject({ value: "#VALUE!" });
  return (value as { message: string }).message;
}

describe("GOVERNING", () => {
  const wD = 2;
  const wL = 3;
  const l = 6;

  it("two equal spans: interior reaction max 1.25wl with live load on both spans (Table 3-23, continuous beam, two equal spans)", () => {
    close(evaluate(`=LOADPATH.GOVERNING(12,"reaction max 2",${wD},${wL},,,,A1:A3)`), 1.25 * (1.2 * wD + 1.6 * wL) * l);
    expect(evaluate(`=LOADPATH.GOVERNING(12,"reaction max 2",${wD},${wL},,,,A1:A3,,,"pattern")`)).toBe("L on all segments");
    expect(evaluate(`=LOADPATH.GOVERNING(12,"reaction max 2",${wD},${wL},,,,A1:A3,,,"combination")`)).toMatch(/1\.2D \+ 1\.6L/);
  });

  it("two equal spans: the end reaction is largest with the far span's live load off (7/16 wl, Table 3-23, load on one span)", () => {
    close(evaluate(`=LOADPATH.GOVERNING(12,"reaction max 1",${wD},${wL},,,,A1:A3)`), 1.2 * 0.375 * wD * l + 1.6 * (7 / 16) * wL * l);
    expect(evaluate(`=LOADPATH.GOVERNING(12,"reaction max 1",${wD},${wL},,,,A1:A3,,,"case")`)).toMatch(/; L on span 1$/);
  });

  it("the sagging maximum with one span loaded: 0.0957 wl^2 under live on one span (Table 3-23, recalled from memory) plus 0.0703 wl^2 of dead load everywhere", () => {
    // Exact: dead load on both spans gives M(x) = 3/8 w l x - w x^2/2 (max 9/128 w l^2); live on span 1
    // only, R_A = 7/16 w l, max (7/16)^2 w l^2 / 2 = 49/512 w l^2. Both maxima at different x, so the
    // combined maximum is found from V = 0 of the sum: R = (0.375 x 1.2 wD + 0.4375 x 1.6 wL) l, w = 1.2 wD + 1.6 wL.
    const r = (0.375 * 1.2 * wD + (7 / 16) * 1.6 * wL) * l;
    const w = 1.2 * wD + 1.6 * wL;
    close(evaluate(`=LOADPATH.GOVERNING(12,"moment max",${wD},${wL},,,,A1:A3)`), (r * r) / (2 * w));
    // Hogging over the middle support, live on both spans: -w l^2 / 8.
    close(evaluate(`=LOADPATH.GOVERNING(12,"moment min",${wD},${wL},,,,A1:A3)`), (-w * l * l) / 8);
  });

  it("ASD, a combinations range and the live load reduction factor", () => {
    // Simple 6 m span (default pins): M = w l^2 / 8.
    close(evaluate(`=LOADPATH.GOVERNING(6,"moment max",${wD},${wL},,,,,"ASD")`), ((wD + wL) * 36) / 8);
    close(evaluate(`=LOADPATH.GOVERNING(6,"moment max",${wD},${wL},,,,,H1:K2)`), ((1.3 * wD + 1.5 * wL) * 36) / 8);
    expect(evaluate(`=LOADPATH.GOVERNING(6,"moment max",${wD},${wL},,,,,H1:K2,,"combination")`)).toBe("firm 1");
    close(evaluate(`=LOADPATH.GOVERNING(6,"moment max",${wD},${wL},,,,,"LRFD",0.6)`), ((1.2 * wD + 1.6 * 0.6 * wL) * 36) / 8);
    // A loads range: D 2 kN/m as a kind row over 0..12 (C1:G1), no live load: 1.4D governs.
    close(evaluate(`=LOADPATH.GOVERNING(12,"shear max",C1:G1,0,,,,A1:A3)`), 1.4 * 0.625 * wD * l);
  });

  it("a changed live load recomputes (the cache holds every argument that defines the member)", () => {
    const sheet = hf.getSheetId("M")!;
    hf.setCellContents({ sheet, row: 5, col: 0 }, [[3]]);
    hf.setCellContents({ sheet, row: 5, col: 1 }, [["=LOADPATH.GOVERNING(6,\"reaction max 1\",2,A6)"]]);
    close(hf.getCellValue({ sheet, row: 5, col: 1 }), ((1.2 * 2 + 1.6 * 3) * 6) / 2);
    hf.setCellContents({ sheet, row: 5, col: 0 }, [[5]]);
    close(hf.getCellValue({ sheet, row: 5, col: 1 }), ((1.2 * 2 + 1.6 * 5) * 6) / 2);
  });

  it("property: over random two-span loads, reaction max >= the reaction with live everywhere and reaction min <= it", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.1, max: 10, noNaN: true }), fc.double({ min: 0.1, max: 10, noNaN: true }), (d, live) => {
        const all = 1.25 * (1.2 * d + 1.6 * live) * 6;
        const max = evaluate(`=LOADPATH.GOVERNING(12,"reaction max 2",${d},${live},,,,A1:A3)`) as number;
        const min = evaluate(`=LOADPATH.GOVERNING(12,"reaction min 2",${d},${live},,,,A1:A3)`) as number;
        return max >= all * (1 - 1e-9) && min <= all * (1 + 1e-9) && min > 0;
      }),
      { numRuns: 25 },
    );
  });

  it("bad arguments name the argument", () => {
    expect(errorMessage(evaluate(`=LOADPATH.GOVERNING(6,"moment maximum",2,3)`))).toMatch(/^quantity: "moment maximum" is not a quantity/);
    expect(errorMessage(evaluate(`=LOADPATH.GOVERNING(12,"reaction max 4",2,3,,,,A1:A3)`))).toMatch(/^quantity: support 4 is not one of the member's 3 supports/);
    expect(errorMessage(evaluate(`=LOADPATH.GOVERNING(6,"moment max",2,3,,,,,"LRDF")`))).toMatch(/^method: "LRDF" is not a method/);
    expect(errorMessage(evaluate(`=LOADPATH.GOVERNING(6,"moment max",2,3,,,,,,1.5)`))).toMatch(/^live_factor: /);
    expect(errorMessage(evaluate(`=LOADPATH.GOVERNING(6,"moment max",2,"heavy")`))).toMatch(/^L: /);
    expect(errorMessage(evaluate(`=LOADPATH.GOVERNING(5,"moment max",2,C1:G1)`))).toMatch(/^L, row 1: end 12 is outside the member/);
    expect(errorMessage(evaluate(`=LOADPATH.GOVERNING(6,"moment max",2,3,,,,,,,"everything")`))).toMatch(/^what: /);
    expect(errorMessage(evaluate(`=LOADPATH.GOVERNING(-6,"moment max",2,3)`))).toMatch(/^span: /);
  });
});

describe("DEFLECTION_CHECK", () => {
  const E = 11000; // MPa
  const I = 200e6; // mm^4

  it("simple span: live 5wL^4/384EI (Table 3-23 case 1) in mm, allowables L/360 and L/240, ratio and required I", () => {
    const span = 6;
    const wL = 3;
    const wD = 1;
    // kN/m and m with E in MPa (1e3 kN/m^2) and I in mm^4 (1e-12 m^4): deflection [mm] = 1e12 x 5 w L^4 / (384 E I)
    const live = (1e12 * 5 * wL * span ** 4) / (384 * E * I);
    const total = (1e12 * 5 * (wD + wL) * span ** 4) / (384 * E * I);
    close(evaluate(`=LOADPATH.DEFLECTION_CHECK(${span},${E},${I},"kN-m",${wD},${wL})`), live);
    close(evaluate(`=LOADPATH.DEFLECTION_CHECK(${span},${E},${I},"kN-m",${wD},${wL},,,,,,,"total")`), total);
    close(evaluate(`=LOADPATH.DEFLECTION_CHECK(${span},${E},${I},"kN-m",${wD},${wL},,,,,,,"live limit")`), 6000 / 360);
    close(evaluate(`=LOADPATH.DEFLECTION_CHECK(${span},${E},${I},"kN-m",${wD},${wL},,,,,500,,"live limit")`), 6000 / 500);
    const ratio = Math.max(live / (6000 / 360), total / (6000 / 240));
    close(evaluate(`=LOADPATH.DEFLECTION_CHECK(${span},${E},${I},"kN-m",${wD},${wL},,,,,,,"ratio")`), ratio);
    close(evaluate(`=LOADPATH.DEFLECTION_CHECK(${span},${E},,"kN-m",${wD},${wL},,,,,,,"required I")`), ratio * I);
  });

  it("a fixed-end cantilever's tip is held to twice its length (common practice): wL^4/8EI against 2L/360 (Table 3-23, cantilever, uniform load)", () => {
    const sheet = hf.getSheetId("M")!;
    hf.setCellContents({ sheet, row: 7, col: 0 }, [[0, "fixed"]]);
    const tip = (1e12 * 3 * 2 ** 4) / (8 * E * I);
    close(evaluate(`=LOADPATH.DEFLECTION_CHECK(2,${E},${I},"SI",0,3,,,,A8:B8)`), tip);
    close(evaluate(`=LOADPATH.DEFLECTION_CHECK(2,${E},${I},"SI",0,3,,,,A8:B8,,,"live limit")`), (2 * 2000) / 360);
  });

  it("bad arguments name the argument", () => {
    expect(errorMessage(evaluate(`=LOADPATH.DEFLECTION_CHECK(6,${E},,"kN-m",1,3)`))).toMatch(/^I: is blank; "live" needs the moment of inertia/);
    expect(errorMessage(evaluate(`=LOADPATH.DEFLECTION_CHECK(6,0,${I},"kN-m",1,3)`))).toMatch(/^E: /);
    expect(errorMessage(evaluate(`=LOADPATH.DEFLECTION_CHECK(6,${E},${I},"furlongs",1,3)`))).toMatch(/^units: /);
    expect(errorMessage(evaluate(`=LOADPATH.DEFLECTION_CHECK(6,${E},${I},"kN-m",1,3,,,,,-360)`))).toMatch(/^live_ratio: /);
    expect(errorMessage(evaluate(`=LOADPATH.DEFLECTION_CHECK(6,${E},${I},"kN-m",1,3,,,,,,,"sag")`))).toMatch(/^what: /);
  });
});
