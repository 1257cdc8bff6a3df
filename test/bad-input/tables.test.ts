/**
 * Bad-input corpus of the takedown tables (issue classes A and E): each malformed table is built
 * in the headless engine, in the add-in version and the hand-off version, and must give a listed
 * problem naming its cell (never a silent error sheet, a JSON of nulls or a lost column), while
 * leaving the user's tables unchanged. Expected values are worked by hand (statics of simple spans,
 * common practice) or are the problem's cell, read off the table as written here.
 * Needs `npm run build` (the headless engine loads the built functions bundle).
 */
import { describe, expect, it } from "vitest";
import type { RawCellContent } from "hyperformula";
import { MAX_MEMBER_LOAD_ROWS } from "../../src/engine/takedown";
import { MAX_LOAD_ROWS } from "../../src/functions/spill";
import type { Built } from "../workbook/takedown-helpers";
import { badNumbers, buildBoth, buildOn, cellsOf, errorCells, jsonOf } from "./helpers";

const HEADERS = ["Mark", "Type", "Level", "Span (ft)", "Zone", "Trib (ft)", "Start support", "Start at (ft)", "End support", "End at (ft)", "End overhang (ft)"];
const ZONES: RawCellContent[][] = [
  ["Zone", "D (psf)", "L (psf)", "Reducible"],
  ["OFF", 50, 80, "yes"],
];

/** One beam B1 on walls (row 2), a girder G1 on walls (row 3), the wall W1 (row 4). */
function members(b1: Partial<Record<number, RawCellContent>> = {}): RawCellContent[][] {
  const row: RawCellContent[] = ["B1", "beam", "2", 20, "OFF", 5, "W1", null, "W1", null, null];
  for (const [k, v] of Object.entries(b1)) row[Number(k)] = v ?? null;
  return [HEADERS, row, ["G1", "girder", "2", 30, null, null, "W1", null, "W1", null, null], ["W1", "wall", null, null, null, null, null, null, null, null, null]];
}

/** The user's tables as the engine holds them after a build (they must not change). */
function tablesOf(built: Built): unknown {
  const hf = built.port.hf;
  return ["Zones", "Members", "Loads"].filter((s) => hf.getSheetId(s) !== undefined).map((s) => hf.getSheetSerialized(hf.getSheetId(s)!));
}

/** Either listed problems, or finite results with no error cell: never silent and wrong. */
function neverSilentAndWrong(built: Built): void {
  const silent = built.result.problems.length === 0;
  if (silent) {
    expect(errorCells(built)).toEqual([]);
    expect(badNumbers(jsonOf(built))).toEqual([]);
  }
  // And every error cell or bad number that is there is covered by a listed problem.
  if (errorCells(built).length > 0 || badNumbers(jsonOf(built)).length > 0) expect(built.result.problems.length).toBeGreaterThan(0);
}

describe("class A: results that would be silently wrong", () => {
  it("a span and loads so large that the results overflow: a problem naming the generated cell and the member's row", async () => {
    const sheets = { Zones: [["Zone", "D (psf)"], ["OFF", 1e200]], Members: members({ 3: 1e150, 5: 1e150, 4: "OFF" }) };
    const { addIn, handOff } = await buildBoth(sheets);
    for (const built of [addIn, handOff]) {
      const p = built.result.problems.filter((q) => q.code === "errorResult");
      expect(p.length).toBeGreaterThan(0);
      expect(p[0]!.sheet).toBe("Takedown");
      expect(p[0]!.mark).toBe("B1");
      expect(p[0]!.message).toContain("Members!A2");
      // The cell named holds the error.
      expect(errorCells(built).map((c) => c.split(" ")[0])).toContain(`Takedown!${p[0]!.cell}`);
      neverSilentAndWrong(built);
    }
  });

  it("a member carrying more load rows than the worksheet functions accept is a problem at its mark, with no #VALUE! on the sheet", async () => {
    expect(MAX_MEMBER_LOAD_ROWS).toBe(MAX_LOAD_ROWS);
    const loads: RawCellContent[][] = [["Mark", "Kind", "Zone or case", "Magnitude (plf or lb)", "Width (ft)", "From (ft)", "To (ft)"]];
    for (let i = 0; i < MAX_LOAD_ROWS; i++) loads.push(["G1", "point", "D", 100, null, 1 + (i % 28), null]);
    const sheets = { Zones: ZONES, Members: members(), Loads: loads };
    // G1 has 1000 Loads rows, no zone and carries nothing: 1000 rows, accepted.
    const { result } = await buildOn(sheets);
    expect(result.problems).toEqual([]);
    expect(result.json!.members.G1!.reactions.D![0]! + result.json!.members.G1!.reactions.D![1]!).toBeCloseTo((MAX_LOAD_ROWS * 100) / 1000, 9);
    const over = await buildBoth({ ...sheets, Loads: [...loads, ["G1", "point", "D", 100, null, 5, null]] });
    for (const built of [over.addIn, over.handOff]) {
      expect(cellsOf(built.result.problems)).toEqual(["Members!A3"]);
      expect(built.result.problems[0]!.code).toBe("tooManyLoads");
      expect(built.result.problems[0]!.message).toMatch(/G1: carries 1001 loads.*at most 1000/);
      expect(errorCells(built)).toEqual([]);
      expect(Object.keys(built.result.json!.members)).not.toContain("G1");
    }
  });

  it("negative tributary area from a large overhang: A_T is taken as 0 (no reduction), never an error, in both versions", async () => {
    // B2: 10 ft between supports on G1 (start, at 15 ft) and W1, with a 12 ft end overhang, 5 ft trib
    // of reducible office. A load of 1 per unit area (its reactions are tributary areas): total
    // 5 x 22 = 110 ft² with its centroid 11 ft from the start, so the end takes 110 x 11 / 10 = 121
    // and the start -11 ft²: G1 only takes uplift, its A_T would be -11.
    const m: RawCellContent[][] = [
      HEADERS,
      ["B2", "beam", "2", 10, "OFF", 5, "G1", 15, "W1", null, 12],
      ["G1", "girder", "2", 30, null, null, "W1", null, "W1", null, null],
      ["W1", "wall", null, null, null, null, null, null, null, null, null],
    ];
    const { addIn, handOff } = await buildBoth({ Zones: ZONES, Members: m });
    for (const built of [addIn, handOff]) {
      expect(built.result.problems).toEqual([]);
      expect(errorCells(built)).toEqual([]);
      const json = built.result.json!;
      expect(json.members.B2!.reactions.L![0]).toBeCloseTo((-11 * 80) / 1000, 10);
      expect(json.members.B2!.tributaryArea).toBeCloseTo(110, 10);
      expect(json.members.G1!.tributaryArea).toBe(0);
      expect(json.members.G1!.llrFactor).toBe(1);
    }
  });
});

describe("class E: validation gaps", () => {
  it("an error value as a mark, level, type or support is a problem naming its cell", async () => {
    const m = members();
    m.push(["=NA()", "beam", "2", 20, "OFF", 5, "W1", null, "W1", null, null]); // row 5: mark #N/A
    m.push(["B3", "beam", "=1/0", 20, "OFF", 5, "W1", null, "W1", null, null]); // row 6: level #DIV/0!
    m.push(["B4", "beam", "2", 20, "OFF", 5, "=NA()", null, "W1", null, null]); // row 7: start support #N/A
    const { addIn, handOff } = await buildBoth({ Zones: ZONES, Members: m });
    for (const built of [addIn, handOff]) {
      expect(cellsOf(built.result.problems)).toEqual(["Members!A5", "Members!C6", "Members!G7"]);
      expect(built.result.problems.map((p) => p.message)).toEqual([
        "Mark is the error value #N/A; give a mark.",
        "B3: Level is the error value #DIV/0!; give a level.",
        "B4: Start support is the error value #N/A; give a start support.",
      ]);
      expect(Object.keys(built.result.json!.members).sort()).toEqual(["B1", "G1"]);
    }
  });

  it("both ends of a member on the same point is a problem at the second end", async () => {
    const m = members();
    m.push(["B5", "beam", "2", 20, "OFF", 5, "G1", 10, "G1", 10, null]); // row 5: both ends at 10 ft on G1
    m.push(["C1", "column", "2", 12, null, null, "W1", null, null, null, null]); // row 6
    m.push(["B6", "beam", "2", 20, "OFF", 5, "C1", null, "C1", null, null]); // row 7: both ends on column C1
    m.push(["B7", "beam", "2", 8, "OFF", 5, "W1", null, "W1", null, null]); // row 8: a lintel on one wall: fine
    m.push(["B8", "beam", "2", 8, "OFF", 5, "G1", 10, "G1", 18, null]); // row 9: two points of G1: fine
    const { result } = await buildOn({ Zones: ZONES, Members: m });
    expect(cellsOf(result.problems)).toEqual(["Members!J5", "Members!I7"]);
    expect(result.problems[0]!.message).toBe("B5: Start support and End support are both G1 at 10: a member's two ends cannot bear on the same point (left out of the takedown's load path).");
  });

  it("a negative zone load is a problem naming its cell (gravity loads are entered positive down)", async () => {
    const { result } = await buildOn({ Zones: [["Zone", "D (psf)", "L (psf)"], ["OFF", -50, 80]], Members: members() });
    expect(cellsOf(result.problems)).toEqual(["Zones!B2"]);
    expect(result.problems[0]!.message).toContain("-50 is negative");
  });

  it("a Members table without members is a problem that stops the build, nothing is written", async () => {
    for (const body of [[], [[null, "", "  "]]] as RawCellContent[][][]) {
      const { port, result } = await buildOn({ Zones: ZONES, Members: [HEADERS, ...body] });
      expect(result.ok).toBe(false);
      expect(result.problems.map((p) => [p.code, `${p.sheet}!${p.cell}`])).toEqual([["emptyTable", "Members!A1"]]);
      expect(result.problems[0]!.message).toContain("has no members");
      expect(await port.sheetNames()).not.toContain("Takedown");
    }
  });

  it("a header cell merged across two columns (the second reads blank) is a problem naming both cells", async () => {
    // "Start support" merged over G1:H1 leaves H1 blank: the Start at column would be lost.
    const headers = [...HEADERS];
    headers[7] = null as unknown as string;
    const m = members({ 6: "G1", 7: 12 });
    m[0] = headers;
    const built = await buildOn({ Zones: ZONES, Members: m });
    const p = built.result.problems.find((q) => q.cell === "H1")!;
    expect(p.sheet).toBe("Members");
    expect(p.message).toContain('merged with G1 "Start support"');
    expect(p.message).toContain("H2");
    neverSilentAndWrong(built);
  });

  it("marks that collide with JavaScript object internals work and are kept in the JSON", async () => {
    const marks = ["__proto__", "constructor", "toString", "hasOwnProperty"];
    const m: RawCellContent[][] = [HEADERS, ...marks.map((k) => [k, "beam", "2", 20, "OFF", 5, "valueOf", null, "valueOf", null, null]), ["valueOf", "wall"]];
    const loads = [
      ["Mark", "Kind", "Zone or case", "Magnitude (plf or lb)", "Width (ft)", "From (ft)", "To (ft)"],
      ["toString", "point", "constructor", 1000, null, 5, null], // "constructor" is not a load case
    ];
    const { addIn, handOff } = await buildBoth({ Zones: ZONES, Members: m, Loads: loads });
    for (const built of [addIn, handOff]) {
      expect(cellsOf(built.result.problems)).toEqual(["Loads!C2"]);
      const written = JSON.parse(JSON.stringify(built.result.json)) as { members: Record<string, { reactions: { D: number[] } }>; foundations: Record<string, { D: number }> };
      expect(Object.keys(written.members).sort()).toEqual([...marks].sort());
      for (const k of marks) expect(written.members[k]!.reactions.D[0]).toBeCloseTo((50 * 5 * 20) / 2000, 12);
      expect(written.foundations["valueOf"]!.D).toBeCloseTo((4 * 50 * 5 * 20) / 1000, 12);
      // A mark that is not in the takedown is not found through the object's inherited names.
      expect(built.result.json!.columns.toString).toBeUndefined();
      expect(built.result.built!.rowsByMember.__proto__).toBeDefined();
    }
  });

  it("the user's tables are unchanged by any of these builds", async () => {
    const sheets = { Zones: [["Zone", "D (psf)"], ["OFF", -5]], Members: members({ 0: "=NA()" }) };
    const before = await buildOn(sheets, { sheetName: "Other" });
    const { port } = before;
    const hf = port.hf;
    const snapshot = tablesOf(before);
    const { buildTakedown } = await import("../../src/workbook/takedown-build");
    await buildTakedown(port, { zones: "Zones", members: "Members", units: "US", native: true });
    expect(tablesOf({ port, result: before.result })).toEqual(snapshot);
    expect(hf.getSheetNames()).toContain("Other");
  });
});

describe("the generated sheet is never written over a table being read", () => {
  it("refuses a sheet name that holds the Members (or Zones) table, even when replacing is allowed", async () => {
    for (const [sheetName, role] of [
      ["Members", "Members"],
      ["zones", "Zones"],
    ] as const) {
      const built = await buildOn({ Zones: ZONES, Members: members() }, { sheetName, replaceForeign: true });
      expect(built.result.ok).toBe(false);
      expect(built.result.problems.map((p) => p.code)).toEqual(["foreignSheet"]);
      expect(built.result.problems[0]!.message).toContain(`holds the ${role} table`);
      expect(built.port.value("Members", "A2")).toBe("B1");
      expect(built.port.value("Zones", "B2")).toBe(50);
    }
    // The hand-off version's helper sheet is checked too.
    const loadsHeader = ["Mark", "Kind", "Zone or case", "Magnitude (plf or lb)", "Width (ft)", "From (ft)", "To (ft)"];
    const helper = await buildOn({ Zones: ZONES, Members: members(), "Takedown extremes": [loadsHeader] }, { native: true, replaceForeign: true, loads: "Takedown extremes" });
    expect(helper.result.problems.map((p) => p.code)).toContain("foreignSheet");
    expect(helper.result.problems[0]!.message).toContain("holds the Loads table");
    expect(helper.port.value("Takedown extremes", "A1")).toBe("Mark");
  });
});
