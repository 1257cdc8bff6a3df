/**
 * The takedown order (pure engine, no workbook): levels from the roof down, within a level joists,
 * beams, girders, then columns; walls and foundations last; every member after what it carries.
 */
import { describe, expect, it } from "vitest";
import { levelHeightHint, planTakedown } from "../../../src/engine/takedown";
import type { CellValue } from "../../../src/engine/takedown/types";

const HEAD = ["Mark", "Type", "Level", "Span", "Zone", "Trib", "Start support", "Start at", "End support", "End at"];

function plan(members: CellValue[][]) {
  const out = planTakedown({
    zones: { sheet: "Zones", top: 0, left: 0, values: [["Zone", "D"], ["Z", 50]] },
    members: { sheet: "Members", top: 0, left: 0, values: [HEAD, ...members] },
    units: "US",
    sheet: "Takedown",
    title: "t",
  });
  const marks = out.plan!.places.map((p) => out.model!.members[p.member]!.mark);
  return { ...out, marks };
}

describe("levelHeightHint", () => {
  it("reads the usual level names (common practice)", () => {
    expect(levelHeightHint("Roof")).toBe(Number.POSITIVE_INFINITY);
    expect(levelHeightHint("Level 3")).toBe(3);
    expect(levelHeightHint("L12")).toBe(12);
    expect(levelHeightHint("B2")).toBe(-2);
    expect(levelHeightHint("Ground")).toBe(0);
    expect(Number.isNaN(levelHeightHint("Mezzanine"))).toBe(true);
  });
});

describe("takedown order", () => {
  it("roof first, then each floor: beams, girders, columns; walls and footings last; listed in any order", () => {
    const { marks, levels, problems } = plan([
      ["F1", "foundation"],
      ["C1-2", "column", "2", 12, null, null, "F1"],
      ["G-2", "girder", "2", 20, null, null, "C1-2", null, "W", null],
      ["B-2", "beam", "2", 20, "Z", 5, "G-2", 10, "W", null],
      ["C1-R", "column", "Roof", 12, null, null, "C1-2"],
      ["G-R", "girder", "Roof", 20, null, null, "C1-R", null, "W", null],
      ["J-R", "joist", "Roof", 20, "Z", 5, "G-R", 5, "W", null],
      ["B-R", "beam", "Roof", 20, "Z", 5, "G-R", 10, "W", null],
      ["W", "wall", "2"],
    ]);
    expect(problems).toEqual([]);
    expect(levels).toEqual(["Roof", "2"]);
    expect(marks).toEqual(["J-R", "B-R", "G-R", "C1-R", "B-2", "G-2", "C1-2", "W", "F1"]);
  });

  it("the column stacks decide the levels when the names say nothing", () => {
    const { levels } = plan([
      ["C-low", "column", "Podium", 12, null, null, "F"],
      ["C-mid", "column", "Mezzanine", 12, null, null, "C-low"],
      ["C-top", "column", "Attic", 12, null, null, "C-mid"],
      ["F", "foundation"],
    ]);
    expect(levels).toEqual(["Attic", "Mezzanine", "Podium"]);
  });

  it("a beam carried by another beam comes after it whatever their types (a trimmer on a header)", () => {
    const { marks } = plan([
      ["HDR", "beam", "1", 12, null, null, "W", null, "W", null],
      ["TRIM", "girder", "1", 10, "Z", 4, "HDR", 6, "W", null],
      ["W", "wall"],
    ]);
    expect(marks).toEqual(["TRIM", "HDR", "W"]);
  });
});
