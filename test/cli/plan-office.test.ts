/**
 * `loadpath takedown` on a plan-only workbook: sample (c), the steel office of sample (a) given as
 * a framing plan (sample-workbooks/make-plan-office.ts). The reference is outside the derivation:
 * the typed sample's own member tables (steel-office-us.xlsx, typed by hand in
 * make-buildings.ts), whose takedown every result of the plan's takedown must equal to 1e-9
 * (reactions, maxima, A_T, live load reduction, column loads, combinations, foundations, the
 * balance). Also: the generated plan sheets carry the marker and a note of their source, the
 * JSON carries `derived`, framing problems are listed with their cells and exit status 1, and
 * the input file is never written. Needs `npm run build`.
 */
import { readFileSync } from "node:fs";
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import ExcelJS from "exceljs";
import { beforeAll, describe, expect, it } from "vitest";
import { main, type CliIO } from "../../src/cli/main";
import { GENERATED_MARKER } from "../../src/workbook/port";
import type { TakedownJson } from "../../src/workbook/takedown-api";
import { compareJson, numericLeaves } from "../handoff/compare";
import { planOffice, writePlanWorkbook } from "../../sample-workbooks/make-plan-office";

const ROOT = resolve(__dirname, "../..");
const TYPED = join(ROOT, "sample-workbooks", "steel-office-us.xlsx");
const PLAN = join(ROOT, "sample-workbooks", "plan-office-us.xlsx");
const dir = mkdtempSync(join(tmpdir(), "loadpath-plan-"));

async function run(...args: string[]): Promise<{ status: number; out: string[]; err: string[] }> {
  const out: string[] = [];
  const err: string[] = [];
  const io: CliIO = { out: (l) => void out.push(l), err: (l) => void err.push(l) };
  const status = await main(["takedown", ...args], io);
  return { status, out, err };
}

const json = (path: string): TakedownJson & { derived?: Record<string, { supports: { support: string; at: number; supportAt: number | null }[]; span: number; tributary: { zone: string; from: number; to: number; width: number; endWidth: number }[]; tributaryArea: number }> } =>
  JSON.parse(readFileSync(path, "utf8"));

describe("loadpath takedown of the plan office (sample c)", () => {
  let typed: ReturnType<typeof json>;
  let plan: ReturnType<typeof json>;
  let status: number;
  let out: string[];

  beforeAll(async () => {
    const a = await run(TYPED, "--json", join(dir, "typed.json"));
    expect(a.status).toBe(0);
    const before = readFileSync(PLAN);
    const b = await run(PLAN, "-o", join(dir, "plan-out.xlsx"), "--json", join(dir, "plan.json"));
    expect(readFileSync(PLAN).equals(before)).toBe(true);
    status = b.status;
    out = [...b.out, ...b.err];
    typed = json(join(dir, "typed.json"));
    plan = json(join(dir, "plan.json"));
  });

  it("builds from the plan without problems (exit 0)", () => {
    expect(plan.problems).toEqual([]);
    expect(status, out.join("\n")).toBe(0);
  });

  it("the committed sample is what make-plan-office.ts writes (same tables)", async () => {
    const fresh = join(dir, "fresh.xlsx");
    await writePlanWorkbook(fresh, planOffice(), "x");
    const read = async (p: string): Promise<unknown[][]> => {
      const wb = new ExcelJS.Workbook();
      await wb.xlsx.readFile(p);
      return ["Framing", "Decks", "Grids", "Levels", "Loads"].map((s) => wb.getWorksheet(s)!.getSheetValues());
    };
    expect(await read(PLAN)).toEqual(await read(fresh));
  });

  it("every result equals the typed sample's takedown to 1e-9 (members, columns, foundations, balance)", () => {
    const want = { members: typed.members, columns: typed.columns, foundations: typed.foundations, balance: typed.balance, perLength: typed.perLength };
    const got = { members: plan.members, columns: plan.columns, foundations: plan.foundations, balance: plan.balance, perLength: plan.perLength };
    expect(numericLeaves(want)).toBeGreaterThan(1000);
    expect(compareJson(want, got, 1e-9, 1e-9)).toEqual([]);
    expect(Object.keys(plan.members).sort()).toEqual(Object.keys(typed.members).sort());
  });

  it("JSON derived: an interior beam q(a1+a2)/2 with a1 = a2 = 25/3 ft, the trimmed beam's supports, the header with no deck", () => {
    const d = plan.derived!;
    // Level 3, bay 2-3: beam at y = 16.67 ft on girders 2AB and 3AB at 16.67 ft along them; beams
    // 8.33 ft away on one side (y = 8.33) and line B on the other: width (a1 + a2)/2 = 8.33 ft over 30 ft
    const b = d["3-B06"]!;
    expect(b.supports.map((s) => [s.support, s.supportAt])).toEqual([["3-G2AB", expect.closeTo(50 / 3, 9)], ["3-G3AB", expect.closeTo(50 / 3, 9)]]);
    expect(b.tributaryArea).toBeCloseTo(30 * (25 / 3), 9);
    // the header at x = 20 ft runs parallel to the deck span: no deck; it bears on the two trimmers at 20 ft along them
    const h = d["3-H1"]!;
    expect(h.tributary).toEqual([]);
    expect(h.supports.map((s) => [s.support, s.supportAt])).toEqual([["3-B03", 20], ["3-B04", 20]]);
    // the trimmed beam frames into the header's side at 8.33 ft along it
    expect(d["3-T1"]!.supports.map((s) => [s.support, s.supportAt])).toEqual([["3-G1BC", expect.closeTo(25 / 3, 9)], ["3-H1", expect.closeTo(25 / 3, 9)]]);
  });

  it("writes the plan sheets as values with the marker and a note of their source", async () => {
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.readFile(join(dir, "plan-out.xlsx"));
    for (const name of ["Plan members", "Plan loads", "Plan bearings"]) {
      const ws = wb.getWorksheet(name)!;
      expect(String(ws.getCell("A1").value)).toMatch(new RegExp(`^${GENERATED_MARKER}`));
      expect(String(ws.getCell("A2").value)).toMatch(/Framing: Framing, Decks: Decks/);
      ws.eachRow((row) => row.eachCell((c) => expect(c.formula, `${name}!${c.address}`).toBeUndefined()));
    }
    expect(wb.getWorksheet("Plan members")!.getCell("A3").value).toBe("Mark");
  });
});

describe("framing problems in a takedown from a plan", () => {
  it("an end on nothing is listed with its cell and code; exit status 1", async () => {
    const path = join(dir, "bad-plan.xlsx");
    const tables = planOffice().map((t) => (t.name === "Framing" ? { ...t, rows: [...t.rows, ["X-1", "beam", "Roof", 5, 5, 6, 6, null, null]] } : t));
    await writePlanWorkbook(path, tables, "x");
    const r = await run(path, "--json", join(dir, "bad.json"));
    expect(r.status).toBe(1);
    const problems = json(join(dir, "bad.json")).problems;
    const row = planOffice().find((t) => t.name === "Framing")!.rows.length + 2;
    expect(problems).toContainEqual(expect.objectContaining({ code: "endOnNothing", sheet: "Framing", cell: `D${row}`, mark: "X-1" }));
    expect(r.err.join("\n")).toMatch(/X-1/);
  });
});

describe("plan options", () => {
  it("--framing builds from the plan even beside a Members table; without it the Members table is used", async () => {
    const path = join(dir, "both.xlsx");
    const typedMembers = (await import("../../sample-workbooks/make-buildings")).steelOffice().find((t) => t.name === "Members")!;
    await writePlanWorkbook(path, [...planOffice(), { ...typedMembers, rows: typedMembers.rows.slice(0, 3) }], "x");
    const withPlan = await run(path, "--framing", "Framing", "--json", join(dir, "both-plan.json"));
    expect(withPlan.status, withPlan.err.join("\n")).toBe(0);
    expect(json(join(dir, "both-plan.json")).derived).toBeDefined();
    const typedOnly = await run(path, "--json", join(dir, "both-typed.json"));
    expect(json(join(dir, "both-typed.json")).derived).toBeUndefined();
    expect(typedOnly.status).toBe(1); // three typed rows whose supports are missing
  });

  it("--save-mapping with a plan, and export with --framing, are refused with exit 2", async () => {
    const a = await run(PLAN, "-o", join(dir, "x.xlsx"), "--save-mapping");
    expect(a.status).toBe(2);
    expect(a.err.join("\n")).toMatch(/--save-mapping/);
    const out: string[] = [];
    const io: CliIO = { out: (l) => void out.push(l), err: (l) => void out.push(l) };
    expect(await main(["export", PLAN, "--framing", "Framing", "-o", join(dir, "y.xlsx")], io)).toBe(2);
    expect(out.join("\n")).toMatch(/--framing: export hands off the takedown sheets/);
  });
});

describe("hand-off version of a takedown from the plan", () => {
  it("--native: every result a live classic formula (the derived widths are uniform), equal to the add-in version to 1e-9", async () => {
    const a = await run(PLAN, "--json", join(dir, "addin.json"));
    const b = await run(PLAN, "--native", "--json", join(dir, "native.json"));
    expect(a.status).toBe(0);
    expect(b.status).toBe(0);
    expect(b.out.join("\n")).toMatch(/every load, reaction, shear, moment, column load and the balance is a live formula in classic spreadsheet functions \(no member's mechanics written as values\)/);
    const x = json(join(dir, "addin.json"));
    const y = json(join(dir, "native.json"));
    const pick = (j: ReturnType<typeof json>) => ({ members: j.members, columns: j.columns, foundations: j.foundations, balance: j.balance });
    expect(compareJson(pick(x), pick(y), 1e-9, 1e-9)).toEqual([]);
  });
});
