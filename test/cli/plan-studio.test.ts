/**
 * `loadpath takedown` on sample (d), the invented studio given only as a framing plan
 * (sample-workbooks/make-plan-studio.ts): a deck direction change, an opening, a slab overhang, a
 * skewed joist, a two-way panel and a roof column standing on a level-2 beam. Every expected value
 * is worked by hand here from the plan's dimensions (SI: m, kPa, kN), outside the derivation.
 * Needs `npm run build`.
 */
import { mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import ExcelJS from "exceljs";
import { beforeAll, describe, expect, it } from "vitest";
import { main, type CliIO } from "../../src/cli/main";
import { writePlanWorkbook } from "../../sample-workbooks/make-plan-office";
import { planStudio } from "../../sample-workbooks/make-plan-studio";

const ROOT = resolve(__dirname, "../..");
const STUDIO = join(ROOT, "sample-workbooks", "plan-studio-si.xlsx");
const dir = mkdtempSync(join(tmpdir(), "loadpath-studio-"));

interface Derived {
  supports: { support: string; at: number; supportAt: number | null }[];
  span: number;
  tributary: { zone: string; from: number; to: number; width: number; endWidth: number }[];
  tributaryArea: number;
}
interface Json {
  units: string;
  problems: unknown[];
  members: Record<string, { reactions: Record<string, number[]> }>;
  columns: Record<string, { cumulative: Record<string, number> }>;
  balance: Record<string, { applied: number; supports: number }>;
  derived: Record<string, Derived>;
}

describe("loadpath takedown of the plan studio (sample d)", () => {
  let j: Json;
  let status: number;
  let err: string[];

  beforeAll(async () => {
    const out: string[] = [];
    err = [];
    const io: CliIO = { out: (l) => void out.push(l), err: (l) => void err.push(l) };
    status = await main(["takedown", STUDIO, "--json", join(dir, "studio.json")], io);
    j = JSON.parse(readFileSync(join(dir, "studio.json"), "utf8")) as Json;
  });

  it("builds from the plan alone, SI read from the headers, without problems", () => {
    expect(err).toEqual([]);
    expect(status).toBe(0);
    expect(j.units).toBe("SI");
    expect(j.problems).toEqual([]);
  });

  it("the committed sample is what make-plan-studio.ts writes", async () => {
    const fresh = join(dir, "fresh.xlsx");
    await writePlanWorkbook(fresh, planStudio(), "x");
    const read = async (p: string): Promise<unknown[][]> => {
      const wb = new ExcelJS.Workbook();
      await wb.xlsx.readFile(p);
      return ["Zones", "Grids", "Levels", "Framing", "Decks"].map((s) => wb.getWorksheet(s)!.getSheetValues());
    };
    expect(await read(STUDIO)).toEqual(await read(fresh));
  });

  it("load balance by hand: deck areas x zone loads, the opening removed", () => {
    // FLOOR: west bay 8 x 12 - opening 2 x 2 = 92, south-east 8 x 6 = 48, two-way 8 x 6 = 48: 188 m²
    // BALCONY: 1.5 x 12 = 18 m²; ROOF: 8 x 12 = 96 m² (no self weights in this sample)
    const D = 188 * 3.0 + 18 * 3.5 + 96 * 1.2;
    const L = 188 * 2.4 + 18 * 4.8;
    expect(j.balance.D!.applied).toBeCloseTo(D, 6);
    expect(j.balance.D!.supports).toBeCloseTo(D, 6);
    expect(j.balance.L!.supports).toBeCloseTo(L, 6);
    expect(j.balance.Lr!.supports).toBeCloseTo(96 * 1.0, 6);
    expect(j.balance.S!.supports).toBeCloseTo(96 * 1.5, 6);
  });

  it("slab overhang q(a/2 + c) and the opening: the girders on line 1", () => {
    // a = 8 m to the girders on line 2, c = 1.5 m of balcony: width 4 + 1.5 over 6 m
    expect(j.derived.G1AB!.tributaryArea).toBeCloseTo((8 / 2 + 1.5) * 6, 9);
    // the opening (x 2-4, y 8-10) takes 2 m of the 4 m floor width over 2 m of G1BC
    expect(j.derived.G1BC!.tributaryArea).toBeCloseTo((8 / 2 + 1.5) * 6 - 2 * 2, 9);
    // the beams on the y grids of the west bay run parallel to its span: no deck
    expect(j.derived.BA1?.tributary ?? []).toEqual([]);
  });

  it("two-way panel 8 x 6 m: triangles Lx²/4 on the short sides, trapezoids Lx·Ly/2 - Lx²/4 on the long sides", () => {
    expect(j.derived.G3BC!.tributaryArea).toBeCloseTo(6 ** 2 / 4, 9);
    expect(j.derived.BC2!.tributaryArea).toBeCloseTo((6 * 8) / 2 - 6 ** 2 / 4, 9);
    // its triangle peaks at mid-length: width 3 m at 3 m along the 6 m girder
    expect(j.derived.G3BC!.tributary.map((p) => [p.from, p.to, p.width, p.endWidth])).toEqual([
      [0, 3, 0, 3],
      [3, 6, 3, 0],
    ]);
  });

  it("direction change and the skewed joist: the south-east bay's 48 m² shared among its members, widths varying beside J2", () => {
    const d = j.derived;
    // BB2 also carries the two-way panel's trapezoid (15 m²)
    const shares = d.BA2!.tributaryArea + d.J1!.tributaryArea + d.J2!.tributaryArea + (d.BB2!.tributaryArea - 15);
    expect(shares).toBeCloseTo(8 * 6, 9);
    // J1 at y = 2: 1 m toward BA2, toward J2 half the gap, 1 m at x = 8 falling to 0.75 m at x = 16
    expect(d.J1!.tributary).toEqual([expect.objectContaining({ from: 0, to: 8, width: 2, endWidth: expect.closeTo(1.75, 12) })]);
    expect(d.J2!.span).toBeCloseTo(Math.hypot(8, 0.5), 12);
  });

  it("the roof column on beam BB1: the continuous roof beam's interior reaction 1.25wL, half to each end of BB1", () => {
    // RBB: 1.2 kPa x 6 m = 7.2 kN/m over two spans of 4 m; interior reaction of two equal spans
    // under a uniform load 1.25 w l (AISC Steel Construction Manual Table 3-23, case 29; recalled from memory)
    const w = 1.2 * 6;
    expect(j.derived["C4B-R"]!.supports).toEqual([{ support: "BB1", at: 0, supportAt: 4 }]);
    expect(j.derived.RBB!.supports.map((s) => s.support)).toEqual(["RG1", "C4B-R", "RG2"]);
    expect(j.columns["C4B-R"]!.cumulative.D).toBeCloseTo(1.25 * w * 4, 9);
    expect(j.members.RBB!.reactions.D![0]).toBeCloseTo(0.375 * w * 4, 9);
    // BB1 carries only the column, at mid-span: half to each end (statics)
    expect(j.members.BB1!.reactions.D).toEqual([expect.closeTo((1.25 * w * 4) / 2, 9), expect.closeTo((1.25 * w * 4) / 2, 9)]);
  });

  it("columns of level 2 stand on foundations added for them", () => {
    expect(j.derived["C1A-2"]!.supports).toEqual([{ support: "F-C1A-2", at: 0, supportAt: null }]);
  });
});

describe("loadpath report of the plan studio", () => {
  it("reports members of a takedown from the plan (a skewed-deck joist, the continuous roof beam) with exit 0", async () => {
    const out: string[] = [];
    const io: CliIO = { out: (l) => void out.push(l), err: (l) => void out.push(l) };
    const html = join(dir, "studio.html");
    expect(await main(["report", STUDIO, "-o", html, "--only", "J1,RBB"], io), out.join("\n")).toBe(0);
    const text = readFileSync(html, "utf8");
    expect(text).toContain("J1");
    expect(text).toContain("RBB");
  });
});
