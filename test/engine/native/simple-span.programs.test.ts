/**
 * Native simple-span formulas recalculated by spreadsheet programs outside the project —
 * Gnumeric (`ssconvert --recalc`) and LibreOffice Calc headless — against the project's exact
 * solver. One file holds a batch of random members so that one run of each program checks them
 * all.
 */
import { join } from "node:path";
import ExcelJS from "exceljs";
import fc from "fast-check";
import { afterAll, describe, expect, it } from "vitest";
import type { NativeCell } from "../../../src/engine/native/simple-span";
import {
  hasGnumeric,
  hasLibreOffice,
  readComputed,
  recalcWithGnumeric,
  recalcWithLibreOffice,
  requireInCi,
  scratchDir,
  type ReadValue,
} from "../../handoff/programs";
import { CHECKED, memberCase, mismatches, solved } from "./cases";
import { layOutMembers, type MemberCase } from "./member-sheet";

const scratch = scratchDir("loadpath-native-");
afterAll(() => scratch.remove());

/** Write the cases to an .xlsx with ExcelJS (formulas without cached results). */
async function writeCases(path: string, cases: readonly MemberCase[]): Promise<ReturnType<typeof layOutMembers>> {
  const sheet = layOutMembers("Members", cases);
  const wb = new ExcelJS.Workbook();
  const ws = wb.addWorksheet("Members");
  sheet.rows.forEach((row: readonly NativeCell[], r) =>
    row.forEach((v, c) => {
      if (v === null) return;
      ws.getCell(r + 1, c + 1).value = typeof v === "object" ? { formula: v.formula } : v;
    }),
  );
  await wb.xlsx.writeFile(path);
  return sheet;
}

/** Every cell holding an error after recalculation, by address: a formula the program cannot evaluate. */
function errorCells(values: Map<string, ReadValue>): string[] {
  return [...values].filter(([, v]) => typeof v === "string" && /^#[A-Z/0!?]+[!?]?$/.test(v)).map(([a, v]) => `Members!${a} = ${v}`);
}

const programs = [
  { name: "Gnumeric", present: hasGnumeric(), recalc: recalcWithGnumeric },
  { name: "LibreOffice Calc", present: hasLibreOffice(), recalc: recalcWithLibreOffice },
];

for (const program of programs) {
  requireInCi(program.name, program.present);

  describe.skipIf(!program.present)(`native simple-span formulas in ${program.name}`, () => {
    const tag = program.name.replace(/\W/g, "");

    async function run(name: string, cases: readonly MemberCase[]): Promise<{ sheet: ReturnType<typeof layOutMembers>; values: Map<string, ReadValue> }> {
      const input = join(scratch.dir, `${tag}-${name}.xlsx`);
      const output = join(scratch.dir, `${tag}-${name}.out.xlsx`);
      const sheet = await writeCases(input, cases);
      program.recalc(input, output);
      const values = (await readComputed(output)).get("Members")!;
      return { sheet, values };
    }

    it("closed forms: uniform load wL^2/8 (AISC Steel Construction Manual, Table 3-23, case 1) and load increasing to one end R = W/3, 2W/3, Mmax = 2WL/(9 sqrt 3) (case 2); recalled from memory", async () => {
      const L = 30;
      const { sheet, values } = await run("closed", [
        { span: 24, leftPin: 0, rightPin: 24, lines: [{ kind: "line", start: 0, end: 24, w1: 1.5, w2: 1.5 }], points: [] },
        { span: L, leftPin: 0, rightPin: L, lines: [{ kind: "line", start: 0, end: L, w1: 0, w2: 2 }], points: [] },
      ]);
      expect(errorCells(values)).toEqual([]);
      const [uniform, triangle] = sheet.members;
      expect(values.get(uniform!.momentMax)).toBeCloseTo((1.5 * 24 * 24) / 8, 10);
      expect(values.get(uniform!.left)).toBeCloseTo((1.5 * 24) / 2, 11);
      const W = (2 * L) / 2;
      expect(values.get(triangle!.left)).toBeCloseTo(W / 3, 11);
      expect(values.get(triangle!.right)).toBeCloseTo((2 * W) / 3, 11);
      expect(values.get(triangle!.momentMax) as number).toBeCloseTo((2 * W * L) / (9 * Math.sqrt(3)), 10);
    });

    it("equals the exact solver to 1e-9 on 200 random members in one batch", async () => {
      const cases = fc.sample(memberCase, { numRuns: 200, seed: 7_2024 });
      const { sheet, values } = await run("random", cases);
      expect(errorCells(values)).toEqual([]);
      const bad: string[] = [];
      cases.forEach((c, i) => {
        const cells = sheet.members[i]!;
        const got = Object.fromEntries(CHECKED.map((k) => [k, values.get(cells[k])]));
        const m = mismatches(got as never, solved(c));
        if (m.length) bad.push(`case ${i} ${JSON.stringify(c)}: ${m.join("; ")}`);
      });
      expect(bad).toEqual([]);
    });
  });
}
