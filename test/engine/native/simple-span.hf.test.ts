/**
 * Native simple-span formulas evaluated by a real spreadsheet engine (HyperFormula) against the
 * project's exact solver and against published closed forms.
 */
import fc from "fast-check";
import { HyperFormula } from "hyperformula";
import { describe, expect, it } from "vitest";
import type { NativeCell } from "../../../src/engine/native/simple-span";
import { memberCase, mismatches, solved } from "./cases";
import { layOutMembers, type MemberCase } from "./member-sheet";

function toHf(rows: readonly (readonly NativeCell[])[]): (string | number | null)[][] {
  return rows.map((row) => row.map((v) => (v !== null && typeof v === "object" ? `=${v.formula}` : v)));
}

/** Evaluate cases in HyperFormula; returns each member's results by name. */
function evaluate(cases: readonly MemberCase[]): Record<string, unknown>[] {
  const sheet = layOutMembers("Members", cases);
  const hf = HyperFormula.buildFromSheets({ Members: toHf(sheet.rows) }, { licenseKey: "gpl-v3", useArrayArithmetic: true, smartRounding: false });
  try {
    const id = hf.getSheetId("Members")!;
    const read = (a1: string): unknown => {
      const addr = hf.simpleCellAddressFromString(a1, id)!;
      const v = hf.getCellValue(addr);
      return typeof v === "object" && v !== null ? String((v as { value: unknown }).value) : v;
    };
    return sheet.members.map((m) => ({
      left: read(m.left),
      right: read(m.right),
      momentMax: read(m.momentMax),
      momentMin: read(m.momentMin),
      shearMax: read(m.shearMax),
      total: read(m.total),
    }));
  } finally {
    hf.destroy();
  }
}

describe("native simple-span formulas in HyperFormula", () => {
  it("simple beam, uniform load: R = wL/2, Mmax = wL^2/8, Vmax = wL/2 (AISC Steel Construction Manual, Table 3-23, case 1; recalled from memory)", () => {
    const [got] = evaluate([{ span: 24, leftPin: 0, rightPin: 24, lines: [{ kind: "line", start: 0, end: 24, w1: 1.5, w2: 1.5 }], points: [] }]);
    expect(got!.left).toBeCloseTo((1.5 * 24) / 2, 10);
    expect(got!.right).toBeCloseTo((1.5 * 24) / 2, 10);
    expect(got!.momentMax).toBeCloseTo((1.5 * 24 * 24) / 8, 9);
    expect(got!.shearMax).toBeCloseTo((1.5 * 24) / 2, 10);
  });

  it("load increasing uniformly to one end: R1 = W/3, R2 = 2W/3, Mmax = 2WL/(9 sqrt 3) (AISC Steel Construction Manual, Table 3-23, case 2; recalled from memory)", () => {
    const L = 30;
    const w = 2;
    const W = (w * L) / 2;
    const [got] = evaluate([{ span: L, leftPin: 0, rightPin: L, lines: [{ kind: "line", start: 0, end: L, w1: 0, w2: w }], points: [] }]);
    expect(got!.left).toBeCloseTo(W / 3, 10);
    expect(got!.right).toBeCloseTo((2 * W) / 3, 10);
    expect(got!.momentMax as number).toBeCloseTo((2 * W * L) / (9 * Math.sqrt(3)), 9);
    // largest shear is at the heavy end, signed: V just left of the right pin = -2W/3
    expect(got!.shearMax as number).toBeCloseTo((-2 * W) / 3, 10);
  });

  it("concentrated load at any point: R1 = Pb/L, R2 = Pa/L, Mmax = Pab/L (AISC Steel Construction Manual, Table 3-23, case 8; recalled from memory)", () => {
    const [L, P, a] = [20, 12, 7];
    const b = L - a;
    const [got] = evaluate([{ span: L, leftPin: 0, rightPin: L, lines: [], points: [{ kind: "point", x: a, p: P }] }]);
    expect(got!.left).toBeCloseTo((P * b) / L, 10);
    expect(got!.right).toBeCloseTo((P * a) / L, 10);
    expect(got!.momentMax).toBeCloseTo((P * a * b) / L, 9);
    expect(got!.shearMax).toBeCloseTo((P * b) / L, 10);
  });

  it("beam overhanging one support, uniform load on the overhang only: hogging moment wa^2/2 over the support (AISC Steel Construction Manual, Table 3-23, case 25; recalled from memory)", () => {
    const [l, a, w] = [18, 5, 0.8];
    const [got] = evaluate([{ span: l + a, leftPin: 0, rightPin: l, lines: [{ kind: "line", start: l, end: l + a, w1: w, w2: w }], points: [] }]);
    expect(got!.momentMin).toBeCloseTo((-w * a * a) / 2, 9);
    expect(got!.momentMax).toBe(0);
    expect(got!.left).toBeCloseTo((-w * a * a) / (2 * l), 10);
    expect(got!.right).toBeCloseTo((w * a * (2 * l + a)) / (2 * l), 10);
  });

  it("equals the exact solver to 1e-9 on random members (partial, trapezoidal, point loads; pins at the ends or with overhangs)", () => {
    const cases = fc.sample(memberCase, { numRuns: 200, seed: 20240607 });
    const got = evaluate(cases);
    const bad: string[] = [];
    cases.forEach((c, i) => {
      const m = mismatches(got[i] as never, solved(c));
      if (m.length) bad.push(`case ${i} ${JSON.stringify(c)}: ${m.join("; ")}`);
    });
    expect(bad).toEqual([]);
  });

  it("property: any random member, one at a time, equals the exact solver to 1e-9", () => {
    fc.assert(
      fc.property(memberCase, (c) => {
        const [got] = evaluate([c]);
        expect(mismatches(got as never, solved(c))).toEqual([]);
      }),
      { numRuns: 60 },
    );
  });
});
