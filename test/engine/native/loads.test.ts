/**
 * Native load formulas (live load reduction, combinations, sums) evaluated by HyperFormula,
 * Gnumeric and LibreOffice Calc against the load engine and against worked values of the
 * standard.
 */
import { join } from "node:path";
import ExcelJS from "exceljs";
import fc from "fast-check";
import { HyperFormula } from "hyperformula";
import { afterAll, describe, expect, it } from "vitest";
import { combinationValues, liveReductionFactor, type CombinationOptions, type LoadCase } from "../../../src/engine/loads";
import { combinationFormulas, governingFormula, liveReductionFactorFormula, sumFormula } from "../../../src/engine/native/loads";
import { cellRef } from "../../../src/engine/native/refs";
import type { NativeCell } from "../../../src/engine/native/simple-span";
import {
  hasGnumeric,
  hasLibreOffice,
  readComputed,
  recalcWithGnumeric,
  recalcWithLibreOffice,
  scratchDir,
  type ReadValue,
} from "../../handoff/programs";

const scratch = scratchDir("loadpath-native-loads-");
afterAll(() => scratch.remove());

const GRAVITY = ["D", "L", "Lr", "S", "R"] as const satisfies readonly LoadCase[];
const METHODS: readonly CombinationOptions[] = [
  { method: "LRFD", halfLive: false },
  { method: "LRFD", halfLive: true },
  { method: "ASD", halfLive: false },
];

interface LlrCase {
  readonly kllAt: number;
  readonly floors: number;
}

type Effects = Readonly<Record<(typeof GRAVITY)[number], number>>;

const llrCase: fc.Arbitrary<LlrCase> = fc.record({
  kllAt: fc.oneof(fc.double({ min: 0, max: 60_000, noNaN: true }), fc.constantFrom(0, 37.16, 399.999, 400, 400.001, 1600, 5625)),
  floors: fc.integer({ min: 1, max: 12 }),
});

const effects: fc.Arbitrary<Effects> = fc.record({
  D: fc.double({ min: -50, max: 500, noNaN: true }),
  L: fc.double({ min: -50, max: 500, noNaN: true }),
  Lr: fc.double({ min: 0, max: 100, noNaN: true }),
  S: fc.double({ min: 0, max: 200, noNaN: true }),
  R: fc.double({ min: 0, max: 50, noNaN: true }),
});

/** Sheet "Loads": LLR rows (A kllAt, B floors, C US factor, D SI factor), then combination rows. */
function layOut(llr: readonly LlrCase[], combos: readonly Effects[]): { rows: NativeCell[][]; combosTop: number } {
  const rows: NativeCell[][] = [];
  const ref = (r: number, c: number): string => cellRef("Loads", r, c);
  llr.forEach((k, r) => {
    rows.push([k.kllAt, k.floors, { formula: liveReductionFactorFormula(ref(r, 0), ref(r, 1), "US") }, { formula: liveReductionFactorFormula(ref(r, 0), ref(r, 1), "SI") }]);
  });
  const combosTop = rows.length;
  combos.forEach((e, i) => {
    const r = combosTop + i;
    const row: NativeCell[] = GRAVITY.map((c) => e[c]);
    const refs = Object.fromEntries(GRAVITY.map((c, j) => [c, ref(r, j)]));
    for (const options of METHODS) {
      const start = row.length;
      const list = combinationFormulas(refs, options);
      for (const f of list) row.push({ formula: f.formula });
      const cells = list.map((_, j) => ref(r, start + j));
      row.push({ formula: governingFormula(cells, "max") }, { formula: governingFormula(cells, "min") });
    }
    row.push({ formula: sumFormula(GRAVITY.map((_, j) => ref(r, j))) });
    rows.push(row);
  });
  return { rows, combosTop };
}

/** What the load engine gives for the same inputs, in the same cell order. */
function expectedRows(llr: readonly LlrCase[], combos: readonly Effects[]): number[][] {
  const out: number[][] = llr.map((k) => [k.kllAt, k.floors, liveReductionFactor(k.kllAt, k.floors, "US"), liveReductionFactor(k.kllAt, k.floors, "SI")]);
  for (const e of combos) {
    const row: number[] = GRAVITY.map((c) => e[c]);
    for (const options of METHODS) {
      const values = combinationValues({ ...e, W: 0, E: 0 }, options).map((v) => v.value);
      row.push(...values, Math.max(...values), Math.min(...values));
    }
    row.push(GRAVITY.reduce((s, c) => s + e[c], 0));
    out.push(row);
  }
  return out;
}

function compare(read: (r: number, c: number) => unknown, want: readonly (readonly number[])[]): string[] {
  const bad: string[] = [];
  want.forEach((row, r) =>
    row.forEach((w, c) => {
      const g = read(r, c);
      if (typeof g !== "number" || Math.abs(g - w) > 1e-9 * Math.max(1, Math.abs(w))) bad.push(`row ${r + 1} col ${c + 1}: sheet ${String(g)}, engine ${w}`);
    }),
  );
  return bad;
}

const llrSample = fc.sample(llrCase, { numRuns: 300, seed: 47 });
const comboSample = fc.sample(effects, { numRuns: 100, seed: 23 });

describe("native load formulas", () => {
  it("Eq. 4.7-1 worked values: K_LL A_T = 1600 ft^2 gives 0.625; large areas stop at 0.50 (one floor) and 0.40 (two or more); below 400 ft^2 no reduction (ASCE/SEI 7-22 Sec. 4.7.3, recalled from memory)", () => {
    const cases: LlrCase[] = [
      { kllAt: 1600, floors: 1 },
      { kllAt: 1e6, floors: 1 },
      { kllAt: 1e6, floors: 3 },
      { kllAt: 399, floors: 2 },
    ];
    const hf = HyperFormula.buildFromSheets({ Loads: toHf(layOut(cases, []).rows) }, { licenseKey: "gpl-v3", useArrayArithmetic: true, smartRounding: false });
    const v = (r: number): unknown => hf.getCellValue({ sheet: 0, row: r, col: 2 });
    expect(v(0)).toBeCloseTo(0.625, 14);
    expect(v(1)).toBe(0.5);
    expect(v(2)).toBe(0.4);
    expect(v(3)).toBe(1);
    hf.destroy();
  });

  it("LRFD 1.2D + 1.6L + 0.5Lr governs D = 10, L = 20, Lr = 5 at 46.5; ASD D + L at 30 (ASCE/SEI 7-22 Sec. 2.3.1 combination 2, Sec. 2.4.1 combination 2; recalled from memory)", () => {
    const { rows, combosTop } = layOut([], [{ D: 10, L: 20, Lr: 5, S: 0, R: 0 }]);
    const hf = HyperFormula.buildFromSheets({ Loads: toHf(rows) }, { licenseKey: "gpl-v3", useArrayArithmetic: true, smartRounding: false });
    const lrfd = combinationFormulas({}, METHODS[0]!).length;
    expect(hf.getCellValue({ sheet: 0, row: combosTop, col: 5 + lrfd })).toBeCloseTo(46.5, 12);
    const asdStart = 5 + 2 * (lrfd + 2);
    const asd = combinationFormulas({}, METHODS[2]!).length;
    expect(hf.getCellValue({ sheet: 0, row: combosTop, col: asdStart + asd })).toBeCloseTo(30, 12);
    hf.destroy();
  });

  it("HyperFormula equals the load engine on random inputs (LLR factor US and SI, every combination, governing max/min, sums)", () => {
    const { rows } = layOut(llrSample, comboSample);
    const hf = HyperFormula.buildFromSheets({ Loads: toHf(rows) }, { licenseKey: "gpl-v3", useArrayArithmetic: true, smartRounding: false });
    expect(compare((r, c) => hf.getCellValue({ sheet: 0, row: r, col: c }), expectedRows(llrSample, comboSample))).toEqual([]);
    hf.destroy();
  });

  const programs = [
    { name: "Gnumeric", present: hasGnumeric(), recalc: recalcWithGnumeric },
    { name: "LibreOffice Calc", present: hasLibreOffice(), recalc: recalcWithLibreOffice },
  ];
  for (const program of programs) {
    it.skipIf(!program.present)(`${program.name} equals the load engine on the same random inputs`, async () => {
      const { rows } = layOut(llrSample, comboSample);
      const input = join(scratch.dir, `${program.name.replace(/\W/g, "")}.xlsx`);
      const output = input.replace(".xlsx", ".out.xlsx");
      const wb = new ExcelJS.Workbook();
      const ws = wb.addWorksheet("Loads");
      rows.forEach((row, r) => row.forEach((v, c) => v !== null && (ws.getCell(r + 1, c + 1).value = typeof v === "object" ? { formula: v.formula } : v)));
      await wb.xlsx.writeFile(input);
      program.recalc(input, output);
      const values = (await readComputed(output)).get("Loads")!;
      const read = (r: number, c: number): ReadValue | undefined => values.get(ws.getCell(r + 1, c + 1).address);
      expect(compare(read, expectedRows(llrSample, comboSample))).toEqual([]);
    });
  }
});

function toHf(rows: readonly (readonly NativeCell[])[]): (string | number | null)[][] {
  return rows.map((row) => row.map((v) => (v !== null && typeof v === "object" ? `=${v.formula}` : v)));
}
