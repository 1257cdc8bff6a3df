/**
 * The uniform-load generator (the takedown's helper blocks: uniform full or partial line loads and
 * point loads, three load cases sharing positions) against the exact solver, evaluated by
 * HyperFormula, Gnumeric and LibreOffice Calc, and against closed forms.
 */
import { join } from "node:path";
import ExcelJS from "exceljs";
import fc from "fast-check";
import { HyperFormula } from "hyperformula";
import { afterAll, describe, expect, it } from "vitest";
import type { NativeCell } from "../../../src/engine/native/simple-span";
import { hasGnumeric, hasLibreOffice, readComputed, recalcWithGnumeric, recalcWithLibreOffice, scratchDir } from "../../handoff/programs";
import { layOutUniform, uniformMember, uniformMismatches, type UniformMember } from "./uniform-sheet";

const scratch = scratchDir("loadpath-uniform-");
afterAll(() => scratch.remove());

function hfRead(members: readonly UniformMember[]): { read: (a1: string) => unknown; cells: ReturnType<typeof layOutUniform>["cells"]; destroy: () => void } {
  const sheet = layOutUniform("U", members);
  const content = sheet.rows.map((r) => r.map((v: NativeCell) => (v !== null && typeof v === "object" ? `=${v.formula}` : v)));
  const hf = HyperFormula.buildFromSheets({ U: content }, { licenseKey: "gpl-v3", useArrayArithmetic: true, smartRounding: false });
  const read = (a1: string): unknown => {
    const v = hf.getCellValue(hf.simpleCellAddressFromString(a1, 0)!);
    return typeof v === "object" && v !== null ? String((v as { value: unknown }).value) : v;
  };
  return { read, cells: sheet.cells, destroy: () => hf.destroy() };
}

describe("uniform-load helper blocks", () => {
  it("closed forms: a partial uniform load wc over a (AISC Steel Construction Manual, Table 3-23, case 4, recalled from memory) and two equal loads at third points PL/3 (case 9, recalled from memory)", () => {
    // case 4: uniform w over length c starting at a on span l; by statics R1 = w c (l - a - c/2) / l
    const [l, a, c, w] = [24, 6, 10, 1.5];
    const R1 = (w * c * (l - a - c / 2)) / l;
    const x = a + R1 / w; // where V = 0
    const Mmax = R1 * x - (w * (x - a) ** 2) / 2;
    const P = 12;
    const members: UniformMember[] = [
      { span: l, leftPin: 0, rightPin: l, rows: [{ kind: "line", from: a, length: c, magnitudes: [w, null, null] }] },
      { span: 30, leftPin: 0, rightPin: 30, rows: [{ kind: "point", from: 10, length: 0, magnitudes: [P, null, null] }, { kind: "point", from: 20, length: 0, magnitudes: [P, null, null] }] },
    ];
    const { read, cells, destroy } = hfRead(members);
    expect(read(cells[0]!.cases[0]!.left)).toBeCloseTo(R1, 11);
    expect(read(cells[0]!.cases[0]!.momentMax)).toBeCloseTo(Mmax, 10);
    expect(read(cells[1]!.cases[0]!.momentMax)).toBeCloseTo((P * 30) / 3, 10);
    expect(read(cells[1]!.cases[0]!.shearMax)).toBeCloseTo(P, 11);
    expect(read(cells[1]!.cases[1]!.momentMax)).toBe(0);
    destroy();
  });

  it("HyperFormula equals the exact solver to 1e-9 on 150 random members x 3 cases", () => {
    const members = fc.sample(uniformMember, { numRuns: 150, seed: 11 });
    const { read, cells, destroy } = hfRead(members);
    const bad = members.flatMap((m, i) => uniformMismatches(m, read, cells[i]!).map((t) => `member ${i} ${JSON.stringify(m)}: ${t}`));
    destroy();
    expect(bad).toEqual([]);
  });

  for (const program of [
    { name: "Gnumeric", present: hasGnumeric(), recalc: recalcWithGnumeric },
    { name: "LibreOffice Calc", present: hasLibreOffice(), recalc: recalcWithLibreOffice },
  ]) {
    it.skipIf(!program.present)(`${program.name} equals the exact solver to 1e-9 on 150 random members x 3 cases`, async () => {
      const members = fc.sample(uniformMember, { numRuns: 150, seed: 12 });
      const sheet = layOutUniform("U", members);
      const wb = new ExcelJS.Workbook();
      const ws = wb.addWorksheet("U");
      sheet.rows.forEach((row, r) => row.forEach((v, c) => v !== null && (ws.getCell(r + 1, c + 1).value = typeof v === "object" ? { formula: v.formula } : v)));
      const input = join(scratch.dir, `${program.name.replace(/\W/g, "")}.xlsx`);
      const output = input.replace(".xlsx", ".out.xlsx");
      await wb.xlsx.writeFile(input);
      program.recalc(input, output);
      const values = (await readComputed(output)).get("U")!;
      const errors = [...values].filter(([, v]) => typeof v === "string" && /^#[A-Z/0!?]+[!?]?$/.test(v)).map(([a, v]) => `U!${a} = ${v}`);
      expect(errors).toEqual([]);
      const bad = members.flatMap((m, i) => uniformMismatches(m, (a1) => values.get(a1), sheet.cells[i]!).map((t) => `member ${i}: ${t}`));
      expect(bad).toEqual([]);
    });
  }
});
