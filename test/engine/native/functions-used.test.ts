/**
 * The native generators call only classic functions that Excel, LibreOffice Calc and Gnumeric all
 * evaluate (the hand-off list of the notice sheet); no LET, LAMBDA, dynamic arrays or add-in calls.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { combinationFormulas, governingFormula, liveReductionFactorFormula, sumFormula } from "../../../src/engine/native/loads";
import { HANDOFF_FUNCTIONS } from "../../../src/engine/native/notice";
import type { NativeCell } from "../../../src/engine/native/simple-span";
import { functionsCalled } from "../../handoff/package-check";
import { memberCase } from "./cases";
import { layOutMembers } from "./member-sheet";
import { layOutUniform, uniformMember } from "./uniform-sheet";

function formulasOf(rows: readonly (readonly NativeCell[])[]): string[] {
  return rows.flatMap((r) => r.flatMap((v) => (v !== null && typeof v === "object" ? [v.formula] : [])));
}

const allowed = new Set<string>(HANDOFF_FUNCTIONS);

describe("functions called by the native formulas", () => {
  it("the function scanner finds calls and ignores text and sheet names (self-check)", () => {
    expect(functionsCalled(`IF('My (x) sheet'!A1="SUM(",LET(x,1,x),_xlfn.LAMBDA(1))`)).toEqual(["IF", "LET", "_XLFN.LAMBDA"]);
  });

  it("simple spans (random members, both load layouts) use only the hand-off list", () => {
    const sheet = layOutMembers("M", fc.sample(memberCase, { numRuns: 50, seed: 3 }));
    const used = new Set(formulasOf(sheet.rows).flatMap(functionsCalled));
    expect([...used].filter((f) => !allowed.has(f))).toEqual([]);
    expect(used.has("SUMPRODUCT") && used.has("SMALL") && used.has("SQRT")).toBe(true);
  });

  it("uniform-load blocks (the takedown's helper blocks) use only the hand-off list", () => {
    const sheet = layOutUniform("U", fc.sample(uniformMember, { numRuns: 30, seed: 4 }));
    const used = new Set(formulasOf(sheet.rows).flatMap(functionsCalled));
    expect([...used].filter((f) => !allowed.has(f))).toEqual([]);
    expect(used.has("SUMPRODUCT") && used.has("SMALL")).toBe(true);
  });

  it("load formulas use only the hand-off list", () => {
    const texts = [
      liveReductionFactorFormula("A1", "B1", "US"),
      liveReductionFactorFormula("A1", "B1", "SI"),
      ...combinationFormulas({ D: "A1", L: "B1", Lr: "C1", S: "D1", R: "E1" }, { method: "LRFD", halfLive: false }).map((c) => c.formula),
      ...combinationFormulas({ D: "A1", L: "B1" }, { method: "ASD", halfLive: false }).map((c) => c.formula),
      governingFormula(["A1", "B1"], "max"),
      governingFormula(["A1", "B1"], "min"),
      sumFormula(Array.from({ length: 600 }, (_, i) => `A${i + 1}`)),
    ];
    const used = new Set(texts.flatMap(functionsCalled));
    expect([...used].filter((f) => !allowed.has(f))).toEqual([]);
  });

  it("sums of more than 255 references are split, so no call exceeds the argument limit of the programs", () => {
    const text = sumFormula(Array.from({ length: 600 }, (_, i) => `A${i + 1}`));
    const depthArgs = text.split("SUM(").slice(1).map((part) => part.slice(0, part.indexOf(")")).split(",").length);
    expect(Math.max(...depthArgs)).toBeLessThanOrEqual(255);
  });
});
