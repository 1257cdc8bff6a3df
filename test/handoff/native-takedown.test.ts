/**
 * The hand-off takedown (classic functions only) against the add-in takedown (LOADPATH functions)
 * on both sample buildings of the repository and on an invented building with every kind of load,
 * both built through the same orchestrator in the headless engine: every number of the results
 * JSON and every number of the generated sheet agree to 1e-9, and no hand-off formula calls the
 * add-in.
 */
import { readdirSync } from "node:fs";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { HANDOFF_FUNCTIONS } from "../../src/engine/native/notice";
import { helperSheetName } from "../../src/engine/native/takedown-writer";
import { takedownsOf } from "../../src/cli/commands/export";
import { MemoryWorkbookPort } from "../../src/workbook/memory-port";
import { buildTakedown } from "../../src/workbook/takedown-build";
import { engineSheets, readXlsx } from "../../src/workbook/xlsx";
import { buildOn, type Built } from "../workbook/takedown-helpers";
import { handoffBuilding } from "./building";
import { compareJson, numericLeaves } from "./compare";
import { functionsCalled } from "./package-check";


/** Every formula of a sheet of the port, by A1 address. */
function formulasOf(b: Built, sheet: string): Map<string, string> {
  const hf = b.port.hf;
  const id = hf.getSheetId(sheet)!;
  const out = new Map<string, string>();
  hf.getSheetSerialized(id).forEach((row, r) =>
    row.forEach((c, col) => {
      if (typeof c === "string" && c.startsWith("=")) out.set(hf.simpleCellAddressToString({ sheet: id, row: r, col }, id)!, c.slice(1));
    }),
  );
  return out;
}

const SAMPLES_DIR = join(__dirname, "..", "..", "sample-workbooks");

/** Build a sample workbook's takedown in the headless engine, add-in or hand-off version. */
async function buildSample(path: string, native: boolean): Promise<Built> {
  const wb = await readXlsx(path);
  const spec = takedownsOf(wb)[0]!;
  const port = await MemoryWorkbookPort.create({ sheets: engineSheets(wb), tables: wb.tables.map(({ name, sheet, ref }) => ({ name, sheet, ref })) });
  const result = await buildTakedown(port, { ...spec.options, sheetName: spec.sheet, native });
  return { port, result };
}

const sources = [
  ...["steel-office-us.xlsx", "timber-house-si.xlsx"].map((f) => ({
    variant: `sample ${f}`,
    closedForm: undefined as boolean | undefined,
    build: (native: boolean) => buildSample(join(SAMPLES_DIR, f), native),
  })),
  { variant: "invented building with overhang columns (every member through the helper blocks)", closedForm: false, build: (native: boolean) => buildOn(handoffBuilding(true), native ? { native } : {}) },
  { variant: "invented building without overhang columns (uniformly loaded members in closed form)", closedForm: true, build: (native: boolean) => buildOn(handoffBuilding(false), native ? { native } : {}) },
];

it("the sample workbooks compared here are the repository's sample buildings", () => {
  expect(readdirSync(SAMPLES_DIR)).toEqual(expect.arrayContaining(["steel-office-us.xlsx", "timber-house-si.xlsx"]));
});

describe.each(sources)("hand-off takedown equals the add-in takedown: $variant", ({ build, closedForm }) => {
  let addIn: Built;
  let native: Built;

  beforeAll(async () => {
    addIn = await build(false);
    native = await build(true);
  });

  it("both builds succeed without problems; the hand-off one lists value-only members only for their governing values", () => {
    expect(addIn.result.problems).toEqual([]);
    expect(native.result.problems).toEqual([]);
    expect(native.result.ok && addIn.result.ok).toBe(true);
    // Governing values over the live load patterns have no classic-function form: written as values, listed.
    for (const v of native.result.valueOnly ?? []) expect(v.reason).toMatch(/governing values over the load combinations and live load patterns/);
    expect(native.port.generatedSheets()).toEqual(["Takedown", helperSheetName("Takedown")]);
  });

  it("every number of the results JSON agrees to 1e-9 (reactions, shear and moment maxima, A_T, LLR, columns, foundations, balance)", () => {
    const want = addIn.result.json!;
    const got = native.result.json!;
    expect(numericLeaves(want)).toBeGreaterThan(200);
    expect(compareJson(want, got)).toEqual([]);
  });

  it("every number of the generated sheet agrees to 1e-9, cell by cell", () => {
    const a = addIn.port.hf.getSheetValues(addIn.port.hf.getSheetId("Takedown")!);
    const n = native.port.hf.getSheetValues(native.port.hf.getSheetId("Takedown")!);
    const bad: string[] = [];
    let count = 0;
    a.forEach((row, r) =>
      row.forEach((v, c) => {
        if (typeof v !== "number") return;
        count++;
        const w = n[r]?.[c];
        if (typeof w !== "number" || Math.abs(v - w) > 1e-9 * Math.max(1, Math.abs(v))) bad.push(`row ${r + 1} col ${c + 1}: add-in ${v}, hand-off ${String(w)}`);
      }),
    );
    expect(count).toBeGreaterThan(300);
    expect(bad).toEqual([]);
  });

  it("members with partial and point loads use helper blocks; uniformly loaded simple spans the closed form", () => {
    const blocks = formulasOf(native, helperSheetName("Takedown"));
    expect(blocks.size).toBeGreaterThan(100);
    const closed = [...formulasOf(native, "Takedown").values()].filter((f) => /^MAX\(0,.*\^2\/8\)$/.test(f));
    if (closedForm !== undefined) expect(closed.length > 0).toBe(closedForm);
    const maxima = Object.values(native.result.json!.members).flatMap((m) => Object.values(m.momentMax));
    expect(maxima.filter((v) => v > 0).length).toBeGreaterThan(5);
  });

  it("no hand-off formula calls the add-in or anything outside the classic list", () => {
    const allowed = new Set<string>(HANDOFF_FUNCTIONS);
    const used = new Set<string>();
    for (const sheet of native.port.generatedSheets()) for (const f of formulasOf(native, sheet).values()) functionsCalled(f).forEach((x) => used.add(x));
    expect([...used].filter((f) => !allowed.has(f))).toEqual([]);
    const addInUsed = new Set([...formulasOf(addIn, "Takedown").values()].flatMap(functionsCalled));
    expect([...addInUsed].some((f) => f.startsWith("LOADPATH."))).toBe(true);
  });
});
