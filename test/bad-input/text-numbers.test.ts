/**
 * Bad input, class A: numbers stored as text (what a CSV import leaves: " 24 ", "1e3") in every
 * number column the takedown reads. The checks accept a text that reads as a plain number, so both
 * the add-in version and the hand-off version must compute with that number: the results are
 * checked against statics worked by hand (common practice), in both versions, with no problem
 * and no error cell. A text that does not read as a number ("1,200", "24 ft") is a problem naming
 * its cell.
 * Needs `npm run build` (the headless engine loads the built functions bundle).
 */
import { describe, expect, it } from "vitest";
import type { RawCellContent } from "hyperformula";
import { handMaxMoment, handReactions } from "../workbook/takedown-helpers";
import { badNumbers, buildBoth, buildOn, cellsOf, errorCells, jsonOf, text } from "./helpers";

const HEADERS = ["Mark", "Type", "Level", "Span (ft)", "Zone", "Trib (ft)", "Start support", "Start at (ft)", "End support", "End at (ft)", "KLL", "wD (plf)"];

/** B1 (24 ft, 7.5 ft trib of 50 psf dead and 80 psf live, 100 plf extra dead, a 2 kip point at 6 ft) on G1 at 10 ft and W1. */
function sheets(t: (s: string) => RawCellContent): Record<string, RawCellContent[][]> {
  return {
    Zones: [
      ["Zone", "D (psf)", "L (psf)", "Reducible"],
      ["OFF", t(" 50 "), t("8e1"), "no"],
    ],
    Members: [
      HEADERS,
      ["B1", "beam", "2", t("24"), "OFF", t(" 7.5 "), "G1", t("10"), "W1", null, t("2"), t("100")],
      ["G1", "girder", "2", t("30.0"), null, null, "W1", null, "W1", null, null, null],
      ["W1", "wall", null, null, null, null, null, null, null, null, null, null],
    ],
    Loads: [
      ["Mark", "Kind", "Zone or case", "Magnitude (plf or lb)", "Width (ft)", "From (ft)", "To (ft)"],
      ["B1", "point", "D", t("2000"), null, t(" 6"), null],
    ],
  };
}

/** The same numbers as numbers. */
const asNumber = (s: string): RawCellContent => Number(s);

describe("numbers stored as text", () => {
  it("are read as their numbers by both versions: same results as by hand, no problem, no error cell", async () => {
    // By hand (statics of simple spans): B1 carries w = (50 x 7.5 + 100)/1000 kip/ft and 2 kip at 6 ft.
    const wD = (50 * 7.5 + 100) / 1000;
    const b1 = handReactions(24, [{ p: 2, x: 6 }], [{ w: wD, a: 0, b: 24 }]);
    const b1L = handReactions(24, [], [{ w: (80 * 7.5) / 1000, a: 0, b: 24 }]);
    const g1 = handReactions(30, [{ p: b1.left, x: 10 }]);
    for (const t of [text, asNumber]) {
      const { addIn, handOff } = await buildBoth(sheets(t));
      for (const built of [addIn, handOff]) {
        expect(built.result.problems).toEqual([]);
        expect(errorCells(built)).toEqual([]);
        expect(badNumbers(jsonOf(built))).toEqual([]);
        const json = built.result.json!;
        expect(json.members.B1!.reactions.D![0]).toBeCloseTo(b1.left, 10);
        expect(json.members.B1!.reactions.D![1]).toBeCloseTo(b1.right, 10);
        expect(json.members.B1!.reactions.L![0]).toBeCloseTo(b1L.left, 10);
        expect(json.members.B1!.momentMax.D!).toBeCloseTo(handMaxMoment(24, [{ p: 2, x: 6 }], [{ w: wD, a: 0, b: 24 }]), 10);
        expect(json.members.G1!.reactions.D![0]).toBeCloseTo(g1.left, 10);
        expect(json.members.G1!.reactions.D![1]).toBeCloseTo(g1.right, 10);
        expect(json.balance.D!.applied).toBeCloseTo(b1.total, 10);
        expect(json.balance.D!.supports).toBeCloseTo(b1.total, 10);
      }
    }
  });

  it("in SI too, where a lone extra line load or a magnitude is referenced without a conversion", async () => {
    const si = {
      Zones: [
        ["Zone", "D (kPa)"],
        ["F", 2],
      ],
      Members: [
        ["Mark", "Type", "Span (m)", "Zone", "Trib (m)", "Start support", "End support", "wD (kN/m)"],
        ["J1", "joist", text("6"), null, null, "W", "W", text("1.5")],
        ["W", "wall"],
      ],
      Loads: [
        ["Mark", "Kind", "Zone or case", "Magnitude (kN/m or kN)", "Width (m)", "From (m)", "To (m)"],
        ["J1", "point", "D", text("9"), null, text("2"), null],
      ],
    };
    const hand = handReactions(6, [{ p: 9, x: 2 }], [{ w: 1.5, a: 0, b: 6 }]);
    const { addIn, handOff } = await buildBoth(si, { units: "SI" });
    for (const built of [addIn, handOff]) {
      expect(built.result.problems).toEqual([]);
      expect(errorCells(built)).toEqual([]);
      expect(built.result.json!.members.J1!.reactions.D![0]).toBeCloseTo(hand.left, 10);
      expect(built.result.json!.members.J1!.reactions.D![1]).toBeCloseTo(hand.right, 10);
    }
  });

  it("a text that does not read as a plain number is a problem naming its cell", async () => {
    const s = sheets(text);
    const members = s.Members!.map((r) => [...r]);
    members[1]![3] = text("1,200");
    members[2]![3] = text("30 ft");
    const { result } = await buildOn({ ...s, Members: members });
    expect(cellsOf(result.problems, "badValue")).toEqual(["Members!D2", "Members!D3"]);
    expect(result.problems[0]!.message).toContain('"1,200" is not a number');
  });
});
