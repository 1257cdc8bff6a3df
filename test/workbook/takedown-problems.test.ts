/**
 * Every problem of docs/interface.md section 4 (and the table problems of the takedown contract) is
 * found and reported with its sheet and cell, all at once, without a crash; members on a cycle
 * are reported with the cycle's path and everything else still builds.
 * Needs `npm run build` (the headless engine loads the built functions bundle).
 */
import { describe, expect, it } from "vitest";
import type { RawCellContent } from "hyperformula";
import type { Problem } from "../../src/workbook/takedown-api";
import { buildOn, resultOf } from "./takedown-helpers";

const HEADERS = ["Mark", "Type", "Level", "Span (ft)", "Zone", "Trib (ft)", "Start support", "Start at (ft)", "End support", "End at (ft)"];

/** Members rows (row 1 is the header, so B1 is on sheet row 2). */
const MEMBERS: RawCellContent[][] = [
  HEADERS,
  ["B1", "beam", "2", 20, "OFF", 5, "G1", 5, "G2", 5], // 2: fine
  ["B1", "beam", "2", 20, "OFF", 5, "G1", 10, "G2", 10], // 3: duplicate mark
  ["B2", "beam", "2", 0, "OFF", 5, "G1", 12, "G2", 12], // 4: span 0
  ["B3", "beam", "2", 20, "OFF", 5, "G9", 12, "G2", 12], // 5: unknown support G9
  ["B4", "beam", "2", 20, "OFF", 5, "B4", 12, "G2", 12], // 6: supports itself
  ["B5", "beam", "2", 20, "OFF", 5, "G1", 50, "G2", 14], // 7: 50 ft along a 30 ft girder
  ["B6", "beam", "2", 20, "OFF", 5, "G1", null, "G2", 16], // 8: no position on the girder
  ["B7", "truss", "2", 20, "OFF", 5, "G1", 18, "G2", 18], // 9: unknown type
  ["B8", "beam", "2", 20, "NOPE", 5, "G1", 20, "G2", 20], // 10: unknown zone
  ["B9", "beam", "2", 20, "OFF", "wide", "G1", 22, "G2", 22], // 11: trib not a number
  ["K1", "beam", "2", 10, "OFF", 5, "K2", 5, "W1", null], // 12: K1 on K2 ...
  ["K2", "beam", "2", 10, "OFF", 5, "K1", 5, "W1", null], // 13: ... and K2 on K1: a cycle
  ["G1", "girder", "2", 30, null, null, "C1", null, "C2", null], // 14
  ["G2", "girder", "2", 30, null, null, "C1", null, "C2", null], // 15
  ["C1", "column", "2", 12, null, null, "F1", null, null, null], // 16
  ["C2", "column", "2", 12, null, null, "F2", null, null, null], // 17
  ["C9", "column", "2", 12, null, null, null, null, null, null], // 18: no base
  ["F1", "foundation", null, null, null, null, null, null, null, null], // 19
  ["F2", "foundation", null, null, null, null, null, null, null, null], // 20
  ["W1", "wall", null, null, null, null, null, null, null, null], // 21
];

const ZONES: RawCellContent[][] = [
  ["Zone", "D (psf)", "L (psf)", "Reducible"],
  ["OFF", 50, 80, "yes"],
  ["STORE", "heavy", 125, "maybe"], // D not a number, Reducible not yes/no
];

const LOADS: RawCellContent[][] = [
  ["Mark", "Kind", "Zone or case", "Magnitude (plf or lb)", "Width (ft)", "From (ft)", "To (ft)"],
  ["B1", "point", "L", 2000, null, 10, null], // 2: fine
  ["B99", "point", "D", 1000, null, 5, null], // 3: no such member
  ["B1", "smear", "D", 1000, null, 5, null], // 4: unknown kind
  ["B1", "line", "Q", 100, null, 0, 5], // 5: unknown case
  ["B1", "area", "NOWHERE", null, 3, 0, 5], // 6: unknown zone
  ["B1", "line", "D", 100, null, 5, 40], // 7: beyond the 20 ft member
];

function at(problems: readonly Problem[], code: Problem["code"]): string[] {
  return problems.filter((p) => p.code === code).map((p) => `${p.sheet}!${p.cell}`);
}

describe("problems with the member tables, all at once", () => {
  it("reports each with its sheet and cell, and still builds the rest", async () => {
    const { port, result } = await buildOn({ Zones: ZONES, Members: MEMBERS, Loads: LOADS });
    const p = result.problems;
    expect(at(p, "duplicateMark")).toEqual(["Members!A3"]);
    expect(at(p, "badSpan")).toEqual(["Members!D4"]);
    expect(at(p, "unknownSupport")).toEqual(["Members!G5"]);
    expect(at(p, "selfSupport")).toEqual(["Members!G6"]);
    expect(at(p, "supportOutside")).toEqual(["Members!H7"]);
    expect(at(p, "missingPosition")).toEqual(["Members!H8"]);
    expect(at(p, "unknownType")).toEqual(["Members!B9"]);
    expect(at(p, "unknownZone")).toEqual(["Members!E10", "Loads!C6"]);
    expect(at(p, "columnWithoutBase")).toEqual(["Members!G18"]);
    expect(at(p, "badValue").sort()).toEqual(["Loads!A3", "Loads!B4", "Loads!C5", "Loads!G7", "Members!F11", "Zones!B3", "Zones!D3"].sort());
    // The cycle: each member on it, at the support cell that leads round the loop, with the path.
    const cycles = p.filter((q) => q.code === "cycle");
    expect(cycles.map((q) => `${q.sheet}!${q.cell}`)).toEqual(["Members!G12", "Members!G13"]);
    expect(cycles[0]!.message).toContain("K1 -> K2 -> K1");
    expect(cycles[1]!.message).toContain("K2 -> K1 -> K2");
    expect(cycles.map((q) => q.mark)).toEqual(["K1", "K2"]);
    // Messages name the member and the value.
    expect(p.find((q) => q.code === "unknownSupport")!.message).toContain('"G9"');
    expect(p.find((q) => q.code === "supportOutside")!.message).toMatch(/50 .*G1.*0 to 30/);
    // The rest is built: B1 on G1 and G2, columns, footings; left-out members are not on the sheet.
    expect(result.ok).toBe(true);
    // Members whose own row is wrong (B1 again, B2, B7, B8, B9) and the cycle (K1, K2) are left out;
    // a member with a bad support keeps its results and only that end's reaction goes nowhere.
    expect(Object.keys(result.json!.members).sort()).toEqual(["B1", "B3", "B4", "B5", "B6", "C1", "C2", "C9", "G1", "G2"]);
    // So the balance shows the lost reactions: applied exceeds what reaches the footings.
    expect(result.json!.balance.D!.applied).toBeGreaterThan(result.json!.balance.D!.supports + 1);
    expect(() => resultOf(port, "K1", "D R1 (kip)")).toThrow(/no member/);
    expect(result.json!.members.B5!.reactions.D![0]).toBeCloseTo((50 * 5 * 20) / 2000, 12);
  });

  it("a table-level problem stops the build before anything is written: units, missing columns, tables", async () => {
    const siHeaders = [["Mark", "Type", "Level", "Length (m)", "Zone", "Trib (m)", "Start support", "Start at (m)", "End support", "End at (m)"]];
    const { port, result } = await buildOn(
      { Zones: [["Zone", "D (psf)", "L (kPa)"], ["OFF", 2.5, 2.4]], Members: [...siHeaders, ["B1", "beam", "1", 5, "OFF", 2, "W", null, "W", null], ["W", "wall"]] },
      { units: "SI", loads: "Extra loads" },
    );
    expect(result.ok).toBe(false);
    expect(at(result.problems, "unitMismatch")).toEqual(["Zones!B1"]);
    expect(result.problems.find((q) => q.code === "unitMismatch")!.message).toMatch(/psf.*SI.*kPa/);
    expect(at(result.problems, "missingColumn")).toEqual(["Members!A1"]); // no "Span" (it is called Length)
    expect(result.problems.find((q) => q.code === "missingColumn")!.message).toContain('"Span"');
    expect(at(result.problems, "missingTable")).toEqual(["Extra loads!A1"]);
    expect(await port.sheetNames()).not.toContain("Takedown");
  });

  it("a column mapping reads headers that differ (and the mapping's own header units are checked)", async () => {
    const members = [["Mark", "Type", "Length (m)", "Zone", "Trib width (m)", "Start support", "End support"], ["J1", "joist", 4, "F", 0.4, "W", "W"], ["W", "wall"]];
    const { result } = await buildOn({ Zones: [["Zone", "D (kPa)"], ["F", 1.5]], Members: members }, { units: "SI", mapping: { members: { Span: "Length", Trib: "Trib width" } } });
    expect(result.problems).toEqual([]);
    // kPa x m = kN/m; each end of a simple span takes w L / 2.
    expect(result.json!.members.J1!.reactions.D![0]).toBeCloseTo((1.5 * 0.4 * 4) / 2, 12);
    const wrong = await buildOn({ Zones: [["Zone", "D (kPa)"], ["F", 1.5]], Members: members }, { units: "SI", mapping: { members: { Span: "Length", Trib: "Tributary" } } });
    expect(at(wrong.result.problems, "missingColumn")).toEqual(["Members!A1"]);
    expect(wrong.result.problems[0]!.message).toMatch(/"tributary" \(mapped to Trib\)/i);
  });

  it("never overwrites a sheet it did not make, unless told to; rebuilds its own in place", async () => {
    const sheets = { Zones: [["Zone", "D (psf)"], ["F", 50]], Members: [HEADERS, ["B1", "beam", "1", 10, "F", 2, "W", null, "W", null], ["W", "wall"]], Takedown: [["my notes"]] };
    const first = await buildOn(sheets);
    expect(first.result.ok).toBe(false);
    expect(at(first.result.problems, "foreignSheet")).toEqual(["Takedown!A1"]);
    expect(first.port.value("Takedown", "A1")).toBe("my notes");
    const replaced = await buildOn(sheets, { replaceForeign: true });
    expect(replaced.result.ok).toBe(true);
    expect(String(replaced.port.value("Takedown", "A1"))).toMatch(/^Generated by Loadpath/);
    // A second build over the same workbook recognises its own sheet and rebuilds it.
    const { buildTakedown } = await import("../../src/workbook/takedown-build");
    const again = await buildTakedown(replaced.port, { zones: "Zones", members: "Members", units: "US" });
    expect(again.ok).toBe(true);
    expect(resultOf(replaced.port, "B1", "D R1 (kip)")).toBeCloseTo((50 * 2 * 10) / 2000, 12);
  });
});
