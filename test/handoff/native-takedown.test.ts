/**
 * The hand-off takedown (classic functions only) against the add-in takedown (LOADPATH functions)
 * on an invented building with every kind of load, both built through the same orchestrator in
 * the headless engine: every number of the results JSON and every number of the generated sheet
 * agree to 1e-9, and no hand-off formula calls the add-in.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { HANDOFF_FUNCTIONS } from "../../src/engine/native/notice";
import { helperSheetName } from "../../src/engine/native/takedown-writer";
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

describe.each([
  { variant: "with overhang columns (every member through the helper blocks)", overhangs: true },
  { variant: "without overhang columns (uniformly loaded members in closed form)", overhangs: false },
])("hand-off takedown equals the add-in takedown, $variant", ({ overhangs }) => {
  let addIn: Built;
  let native: Built;

  beforeAll(async () => {
    addIn = await buildOn(handoffBuilding(overhangs));
    native = await buildOn(handoffBuilding(overhangs), { native: true });
  });

  it("both builds succeed without problems; the hand-off one lists no value-only member", () => {
    expect(addIn.result.problems).toEqual([]);
    expect(native.result.problems).toEqual([]);
    expect(native.result.ok && addIn.result.ok).toBe(true);
    expect(native.result.valueOnly).toEqual([]);
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

  it("the members with partial and point loads really use helper blocks, and their maxima are positive", () => {
    const blocks = formulasOf(native, helperSheetName("Takedown"));
    expect(blocks.size).toBeGreaterThan(100);
    const closedForm = [...formulasOf(native, "Takedown").values()].filter((f) => /^MAX\(0,.*\^2\/8\)$/.test(f));
    expect(closedForm.length > 0).toBe(!overhangs);
    const m = native.result.json!.members;
    expect(m["B2-1"]!.momentMax.D).toBeGreaterThan(0);
    expect(m["B2-4"]!.momentMax.D).toBeGreaterThan(0);
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
