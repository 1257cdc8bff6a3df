/**
 * Supports, crossings, column stacks and every problem type with the cell it names (hand-built
 * plans; the expected answers are read off the sketch of each plan).
 */
import { describe, expect, it } from "vitest";
import { readPlan } from "../../../src/engine/framing";
import { plan, table } from "./helpers";

const levels = [["1", 12], ["2", 24]];

describe("supports, bearings and column stacks", () => {
  it("joist crossing a girder bears on it (a Bearings row at both positions); equal ranks crossing is a problem", () => {
    const d = plan(
      [
        ["C1", "column", "1", 0, 0],
        ["C2", "column", "1", 20, 0],
        ["G1", "girder", "1", 0, 0, 20, 0],
        ["J1", "joist", "1", 5, -4, 5, 6],
        ["B1", "beam", "1", 12, -3, 12, 3],
        ["B2", "beam", "1", 10, 1, 14, 1],
      ],
      [],
      [],
      levels,
    );
    expect(d.bearings).toEqual([{ mark: "J1", support: "G1", at: 4, supportAt: 5 }, { mark: "B1", support: "G1", at: 3, supportAt: 12 }].sort((a, b) => (a.mark < b.mark ? -1 : 1)));
    const eq = d.problems.find((p) => p.code === "equalRankCrossing")!;
    expect(eq.mark).toBe("B2");
    expect(eq.cell).toBe("A7"); // B2's Mark cell (header in row 1)
  });

  it("column stack: column below, else transfer onto a member of the level below, else a foundation", () => {
    const d = plan(
      [
        ["C1a", "column", "1", 0, 0],
        ["C2a", "column", "1", 20, 0],
        ["G1", "girder", "1", 0, 0, 20, 0],
        ["C1b", "column", "2", 0, 0],
        ["C3b", "column", "2", 7.5, 0],
        ["F9", "foundation", "", 20, 0],
      ],
      [],
      [],
      levels,
    );
    const m = (k: string) => d.members.find((x) => x.mark === k)!;
    expect(m("C1b").startSupport).toBe("C1a");
    expect(m("C1b").span).toBe(12);
    expect(m("C3b").startSupport).toBe("G1");
    expect(m("C3b").startAt).toBeCloseTo(7.5, 12);
    expect(m("C2a").startSupport).toBe("F9");
    expect(m("C1a").startSupport).toBe("F-C1a");
    expect(m("F-C1a").type).toBe("foundation");
    // an added foundation never takes a mark of the Framing table
    const taken = plan([["C1", "column", "1", 0, 0], ["F-C1", "beam", "1", 0, 0, 5, 0]], [], [], levels);
    expect(taken.members.find((x) => x.mark === "C1")!.startSupport).toBe("F-C1-2");
  });

  it("a beam passing over a column is continuous over it (a bearing on the column); walls stand on the level below or a foundation", () => {
    const d = plan(
      [
        ["C1", "column", "1", 0, 0],
        ["C2", "column", "1", 10, 0],
        ["C3", "column", "1", 25, 0],
        ["B1", "beam", "1", 0, 0, 25, 0],
        ["W1", "wall", "1", 0, 8, 25, 8],
        ["W2", "wall", "2", 0, 8, 25, 8],
        ["W3", "wall", "2", 4, 0, 9, 0],
      ],
      [],
      [],
      levels,
    );
    expect(d.problems).toEqual([]);
    expect(d.bearings).toEqual([{ mark: "B1", support: "C2", at: 10, supportAt: null }]);
    const m = (k: string) => d.members.find((x) => x.mark === k)!;
    expect([m("W1").startSupport, m("W1").endSupport]).toEqual(["F-W1", "F-W1"]);
    expect([m("W2").startSupport, m("W2").startAt, m("W2").endSupport, m("W2").endAt]).toEqual(["W1", 0, "W1", 25]);
    expect([m("W3").startSupport, m("W3").startAt, m("W3").endSupport, m("W3").endAt]).toEqual(["B1", 4, "B1", 9]);
  });

  it("grid names with offsets and polygons of grid intersections", () => {
    const d = plan(
      [
        ["C1", "column", "1", "A", "1"],
        ["C2", "column", "1", "B", "1"],
        ["C3", "column", "1", "A", "2"],
        ["C4", "column", "1", "B", "2"],
        ["G1", "girder", "1", "A", "1", "B", "1"],
        ["G2", "girder", "1", "A", "2", "B", "2"],
        ["B1", "beam", "1", "A", "1", "A", "2"],
        ["B2", "beam", "1", "A+7.5", "1", "A+7.5", "2"],
        ["B3", "beam", "1", "B-7.5", "1", "B-7.5", "2"],
        ["B4", "beam", "1", "B", "1", "B", "2"],
      ],
      [["D1", "1", "one-way", "Office", "x", null, null, null, null, "A/1; B/1; B/2; A/2"]],
      [["A", 0, null], ["B", 30, null], ["1", null, 0], ["2", null, 20]],
    );
    expect(d.problems).toEqual([]);
    expect(d.members.find((x) => x.mark === "B3")!.x1).toBe(22.5);
    // B2 at 7.5 between B1 at 0 and B3 at 22.5: width (7.5 + 15)/2 over 20 ft
    expect(d.members.find((x) => x.mark === "B2")!.tributaryArea).toBeCloseTo(((7.5 + 15) / 2) * 20, 10);
  });
});

describe("problems name their cells", () => {
  it("end on nothing, zero length, duplicate columns, collinear overlap", () => {
    const d = plan([
      ["C1", "column", "1", 0, 0],
      ["C1x", "column", "1", 0, 0.001],
      ["B1", "beam", "1", 0, 0, 10, 0],
      ["B2", "beam", "1", 5, 0, 15, 0],
      ["B3", "beam", "1", 3, 3, 3.002, 3],
    ]);
    const codes = d.problems.map((p) => [p.code, p.cell]);
    expect(codes).toContainEqual(["duplicateColumn", "A3"]);
    expect(codes).toContainEqual(["collinearOverlap", "A5"]);
    expect(codes).toContainEqual(["zeroLength", "F6"]);
    expect(codes).toContainEqual(["endOnNothing", "F4"]); // B1's end (10, 0): X2 cell
  });

  it("blank and repeated marks, unknown types and levels", () => {
    const d = plan([
      ["C1", "column", "1", 0, 0],
      ["C1", "column", "1", 5, 0],
      [null, "beam", "1", 0, 0, 5, 0],
      ["B1", "truss", "1", 0, 0, 5, 0],
      ["B2", "beam", "9", 0, 0, 5, 0],
    ]);
    expect(d.problems.map((p) => [p.code, p.cell])).toEqual([
      ["badValue", "A3"],
      ["badValue", "A4"],
      ["badValue", "B5"],
      ["unknownLevel", "C6"],
    ]);
  });

  it("unknown grid names and unreadable coordinates", () => {
    const d = plan(
      [
        ["B1", "beam", "1", "Q", 0, 10, 0],
        ["B2", "beam", "1", 0, "1", 10, 0],
        ["B3", "beam", "1", 0, "#VALUE!", 10, 0],
      ],
      [],
      [["A", 0, null], ["1", null, 0]],
    );
    expect(d.problems.filter((p) => p.code !== "endOnNothing").map((p) => [p.code, p.cell])).toEqual([["unknownGrid", "D2"], ["badCoordinate", "E4"]]);
  });

  it("a grid named in the wrong axis is an unknown grid", () => {
    const d = plan([["B1", "beam", "1", 0, "A", 10, 0]], [], [["A", 0, null], ["1", null, 0]]);
    expect(d.problems.filter((p) => p.code !== "endOnNothing").map((p) => [p.code, p.cell, /Y grid|X grid/.test(p.message)])).toEqual([["unknownGrid", "E2", true]]);
  });

  it("overlapping decks, unsupported deck strips, self-intersecting polygons, a two-way panel without members", () => {
    const d = plan(
      [
        ["C1", "column", "1", 0, 0],
        ["C2", "column", "1", 0, 10],
        ["B1", "beam", "1", 0, 0, 0, 10],
      ],
      [
        ["D1", "1", "one-way", "Office", "x", 0, 0, 10, 10],
        ["D2", "1", "one-way", "Office", "x", 0, 0, 10, 10],
        ["D3", "1", "one-way", "Office", "y", null, null, null, null, "20,0; 30,0; 30,10; 20,10"],
        ["D4", "1", "one-way", "Office", "x", null, null, null, null, "40,0; 50,10; 50,0; 40,10"],
        ["D5", "1", "two-way", "Office", null, 60, 0, 70, 10],
        ["D6", "1", "two-way", "Office", null, 80, 0, 90, 10],
        ["O6", "1", "opening", null, null, 84, 4, 86, 6],
      ],
    );
    const codes = d.problems.map((p) => [p.code, p.cell]);
    expect(codes).toContainEqual(["overlappingDecks", "F3"]);
    expect(codes).toContainEqual(["unsupportedDeck", "J4"]);
    expect(codes).toContainEqual(["selfIntersecting", "J5"]);
    expect(codes).toContainEqual(["badTwoWay", "F6"]);
    expect(codes).toContainEqual(["badTwoWay", "F7"]);
  });
});

describe("plan table headers", () => {
  it("columns named differently are read through the user's mapping; a missing required column is a problem at the header row", () => {
    const framing = table("Plan", [
      ["Piece", "Kind", "Floor", "From x", "From y", "To x", "To y"],
      ["B1", "beam", "1", 0, 0, 10, 0],
    ]);
    const unmapped = readPlan({ framing });
    expect(unmapped.problems.filter((p) => p.code === "missingColumn").map((p) => p.cell)).toEqual(["A1", "A1", "A1", "A1"]);
    const mapped = readPlan({ framing }, "US", { framing: { mapping: { Mark: "Piece", Type: "Kind", Level: "Floor", X1: "From x", Y1: "From y", X2: "To x", Y2: "To y" } } });
    expect(mapped.problems).toEqual([]);
    expect(mapped.plan.members.map((m) => [m.mark, m.type, m.p1, m.p2])).toEqual([["B1", "beam", { x: 0, y: 0 }, { x: 10, y: 0 }]]);
  });
});
