/**
 * The takedown built over the headless engine, checked against hand statics written out in this
 * file (never against the engine's own output): a small framing whose every reaction and column
 * load is worked by hand, a beam beside an opening, a header parallel to the deck loaded only at
 * its third points, a column stack over three floors where the live load reduction limits
 * govern, the load balance, and recalculation after editing the user's tables.
 * Needs `npm run build` (the headless engine loads the built functions bundle).
 */
import { describe, expect, it } from "vitest";
import type { RawCellContent } from "hyperformula";
import { buildOn, handMaxMoment, handReactions, resultOf, type Built } from "./takedown-helpers";

const MEMBER_HEADERS = ["Mark", "Type", "Level", "Span (ft)", "Zone", "Trib (ft)", "Start support", "Start at (ft)", "End support", "End at (ft)", "wD (plf)"];

/** Relative closeness for values computed in floating point along different paths. */
function close(actual: unknown, expected: number, rel = 1e-12): void {
  expect(typeof actual).toBe("number");
  expect(Math.abs((actual as number) - expected)).toBeLessThanOrEqual(rel * Math.max(1, Math.abs(expected)));
}

/**
 * The small framing (invented): one floor bay 30 ft x 24 ft. Girders G1 (x = 0) and G2 (x = 30)
 * span 24 ft between columns; beams B1, B2, B3 span 30 ft between the girders at y = 5, 12 and
 * 18 ft; spandrel beams E1 (y = 0) and E2 (y = 24) span between the corner columns and carry
 * cladding (300 plf); four columns stand on four footings. Office zone: D 60 psf, L 50 psf,
 * reducible. Tributary widths are half the distances to the neighbours.
 */
const FRAMING: Record<string, RawCellContent[][]> = {
  Zones: [
    ["Zone", "D (psf)", "L (psf)", "Reducible"],
    ["OFF", 60, 50, "yes"],
  ],
  Members: [
    MEMBER_HEADERS,
    ["B1", "beam", "2", 30, "OFF", 6, "G1", 5, "G2", 5, null],
    ["B2", "beam", "2", 30, "OFF", 6.5, "G1", 12, "G2", 12, null],
    ["B3", "beam", "2", 30, "OFF", 6, "G1", 18, "G2", 18, null],
    ["E1", "beam", "2", 30, "OFF", 2.5, "C1", null, "C3", null, 300],
    ["E2", "beam", "2", 30, "OFF", 3, "C2", null, "C4", null, 300],
    ["G1", "girder", "2", 24, null, null, "C1", null, "C2", null, null],
    ["G2", "girder", "2", 24, null, null, "C3", null, "C4", null, null],
    ["C1", "column", "2", 12, null, null, "F1", null, null, null, null],
    ["C2", "column", "2", 12, null, null, "F2", null, null, null, null],
    ["C3", "column", "2", 12, null, null, "F3", null, null, null, null],
    ["C4", "column", "2", 12, null, null, "F4", null, null, null, null],
    ["F1", "foundation", null, null, null, null, null, null, null, null, null],
    ["F2", "foundation", null, null, null, null, null, null, null, null, null],
    ["F3", "foundation", null, null, null, null, null, null, null, null, null],
    ["F4", "foundation", null, null, null, null, null, null, null, null, null],
  ],
};

/** Hand takedown of the framing for zone loads dPsf, lPsf (kip, ft). */
function handFraming(dPsf: number, lPsf: number, b2At = 12) {
  // Beams: uniform w = q x trib / 1000 (psf x ft = plf, /1000 = kip/ft); each end carries wL/2.
  const beam = (trib: number, q: number, extraPlf = 0) => ((q * trib + extraPlf) / 1000) * 30 / 2;
  const bD = [beam(6, dPsf), beam(6.5, dPsf), beam(6, dPsf)];
  const bL = [beam(6, lPsf), beam(6.5, lPsf), beam(6, lPsf)];
  const bA = [(6 * 30) / 2, (6.5 * 30) / 2, (6 * 30) / 2]; // tributary area per end, ft^2
  const e1 = { D: beam(2.5, dPsf, 300), L: beam(2.5, lPsf), A: (2.5 * 30) / 2 };
  const e2 = { D: beam(3, dPsf, 300), L: beam(3, lPsf), A: (3 * 30) / 2 };
  // Girders: the beams' ends as point loads at 5, b2At and 18 ft on a 24 ft span.
  const at = [5, b2At, 18];
  const girder = (p: number[]) => handReactions(24, p.map((v, i) => ({ p: v, x: at[i]! })));
  const gD = girder(bD);
  const gL = girder(bL);
  const gA = girder(bA);
  // Columns: C1 = G1 left + E1 left; C2 = G1 right + E2 left; C3 = G2 left + E1 right; C4 = G2 right + E2 right.
  const columns = {
    C1: { D: gD.left + e1.D, L: gL.left + e1.L, A: gA.left + e1.A },
    C2: { D: gD.right + e2.D, L: gL.right + e2.L, A: gA.right + e2.A },
    C3: { D: gD.left + e1.D, L: gL.left + e1.L, A: gA.left + e1.A },
    C4: { D: gD.right + e2.D, L: gL.right + e2.L, A: gA.right + e2.A },
  };
  return { bD, bL, bA, e1, e2, gD, gL, gA, at, columns };
}

/** ASCE/SEI 7-22 Sec. 4.7.3, Eq. 4.7-1 (US), with the 0.50 / 0.40 limits (recalled from memory). */
function handLlr(kll: number, areaFt2: number, floors: number): number {
  if (kll * areaFt2 < 400) return 1;
  return Math.min(1, Math.max(floors >= 2 ? 0.4 : 0.5, 0.25 + 15 / Math.sqrt(kll * areaFt2)));
}

describe("takedown of a small framing (hand statics)", () => {
  let built: Built;
  const hand = handFraming(60, 50);

  it("builds without problems", async () => {
    built = await buildOn(FRAMING);
    expect(built.result.problems).toEqual([]);
    expect(built.result.ok).toBe(true);
    expect(built.result.summary!.membersByType).toEqual({ beam: 5, girder: 2, column: 4, foundation: 4 });
  });

  it("beams: reactions wL/2, shear wL/2, moment wL^2/8 (AISC Manual Table 3-23, case 1, recalled from memory)", () => {
    const m = built.result.json!.members;
    ["B1", "B2", "B3"].forEach((mark, i) => {
      close(m[mark]!.reactions.D![0], hand.bD[i]!);
      close(m[mark]!.reactions.D![1], hand.bD[i]!);
      close(m[mark]!.reactions.L![0], hand.bL[i]!);
      close(m[mark]!.reactions.L![1], hand.bL[i]!);
      close(m[mark]!.shearMax.D, hand.bD[i]!);
      // wL^2/8 = (wL/2)(L/4) with wL/2 the end reaction.
      close(m[mark]!.momentMax.D, (hand.bD[i]! * 30) / 4);
      close(m[mark]!.momentMax.L, (hand.bL[i]! * 30) / 4);
      close(m[mark]!.tributaryArea, 2 * hand.bA[i]!);
    });
    for (const [mark, e] of [["E1", hand.e1], ["E2", hand.e2]] as const) {
      for (const end of [0, 1]) {
        close(m[mark]!.reactions.D![end], e.D);
        close(m[mark]!.reactions.L![end], e.L);
      }
      close(m[mark]!.tributaryArea, 2 * e.A);
    }
  });

  it("girders: beam reactions arrive at their Start at positions; reactions by moments, moment at a load point", () => {
    const g = built.result.json!.members.G1!;
    close(g.reactions.D![0], hand.gD.left);
    close(g.reactions.D![1], hand.gD.right);
    close(g.reactions.L![0], hand.gL.left);
    close(g.reactions.L![1], hand.gL.right);
    close(g.shearMax.D, Math.max(hand.gD.left, hand.gD.right));
    close(g.momentMax.D, handMaxMoment(24, hand.bD.map((p, i) => ({ p, x: hand.at[i]! }))));
    close(g.tributaryArea, hand.gA.total);
    // K_LL = 2 for a beam (ASCE/SEI 7-22 Table 4.7-2, interior beams, recalled from memory).
    close(g.llrFactor, handLlr(2, hand.gA.total, 1));
    close(built.result.json!.members.G2!.reactions.D![0], hand.gD.left);
    close(built.result.json!.members.G2!.reactions.D![1], hand.gD.right);
  });

  it("columns: loads arriving, totals, A_T, live load reduction and the LRFD factored load", () => {
    const cols = built.result.json!.columns;
    for (const mark of ["C1", "C2", "C3", "C4"] as const) {
      const h = hand.columns[mark];
      const c = cols[mark]!;
      close(c.cumulative.D, h.D);
      close(c.cumulative.L, h.L);
      close(c.tributaryArea, h.A);
      expect(c.floors).toBe(1);
      // K_LL = 4 for a column (Table 4.7-2, interior columns, recalled from memory).
      const f = handLlr(4, h.A, 1);
      close(c.kllAt, 4 * h.A);
      close(c.llrFactor, f);
      close(c.reducedLive, f * h.L);
      // ASCE/SEI 7-22 Sec. 2.3.1 (recalled from memory): 1.4D or 1.2D + 1.6L govern with D and L only.
      close(resultOf(built.port, mark, "Factored LRFD (kip)"), Math.max(1.4 * h.D, 1.2 * h.D + 1.6 * f * h.L));
      close(c.combos["2.3.1 (1) 1.4D"]!, 1.4 * h.D);
    }
    // Every column stands on its own footing: the footing carries the column's totals.
    close(built.result.json!.foundations.F1!.D!, hand.columns.C1.D);
    close(built.result.json!.foundations.F4!.L!, hand.columns.C4.L);
  });

  it("the load balance: total applied load equals the footing reactions, per case, to 1e-9", () => {
    // Applied by hand: area load over the whole 30 x 24 bay plus the cladding on the two spandrels.
    const appliedD = (60 * 30 * 24) / 1000 + (2 * 300 * 30) / 1000;
    const appliedL = (50 * 30 * 24) / 1000;
    const b = built.result.json!.balance;
    close(b.D!.applied, appliedD, 1e-12);
    close(b.L!.applied, appliedL, 1e-12);
    expect(Math.abs(b.D!.applied - b.D!.supports)).toBeLessThanOrEqual(1e-9 * appliedD);
    expect(Math.abs(b.L!.applied - b.L!.supports)).toBeLessThanOrEqual(1e-9 * appliedL);
    expect(built.result.summary!.appliedByCase.D).toBe(b.D!.applied);
  });

  it("the sheet references the tables: zone loads from Zones cells with the /1000 visible, reactions from carried members' cells", () => {
    const f = built.port.formula.bind(built.port);
    const values = built.port.hf.getSheetValues(built.port.hf.getSheetId("Takedown")!);
    const b1 = values.findIndex((r) => r[0] === "B1");
    const rowText = (r: number) => built.port.hf.getSheetSerialized(built.port.hf.getSheetId("Takedown")!)[r]!.filter((c) => typeof c === "string" && c.startsWith("=")) as string[];
    expect(rowText(b1).some((c) => /Zones!\$B\$2\*\$H\d+\/1000/.test(c))).toBe(true);
    expect(rowText(b1).some((c) => c.includes("Members!$D$2"))).toBe(true);
    const g1 = values.findIndex((r) => r[0] === "G1");
    expect(rowText(g1).some((c) => /^=\$[A-Z]+\$\d+$/.test(c))).toBe(true);
    expect(rowText(g1).some((c) => c.startsWith("=LOADPATH.REACTION("))).toBe(true);
    expect(f("Takedown", "A1")).toBeUndefined();
    expect(String(values[0]![0])).toMatch(/^Generated by Loadpath/);
    expect(String(values[1]![0])).toMatch(/qualified engineer/);
  });

  it("editing a zone load recalculates every downstream cell (headless): +15 psf D adds 15 psf x area at each column", () => {
    built.port.setCell("Zones", "B2", 75);
    const after = handFraming(75, 50);
    for (const mark of ["C1", "C2"] as const) {
      close(resultOf(built.port, mark, "D total (kip)"), after.columns[mark].D);
      // The change alone, by hand: 15 psf over the area delivered to the column (its A_T here).
      close((resultOf(built.port, mark, "D total (kip)") as number) - hand.columns[mark].D, (15 * hand.columns[mark].A) / 1000, 1e-9);
    }
    close(resultOf(built.port, "F2", "D total (kip)"), after.columns.C2.D);
  });

  it("editing a support position recalculates the girder and the columns below it", () => {
    built.port.setCell("Members", "H3", 10); // B2 now bears on G1 at 10 ft (and on G2 still at 12)
    const moved = handFraming(75, 50, 10);
    const g1 = handReactions(24, moved.bD.map((p, i) => ({ p, x: moved.at[i]! })));
    close(resultOf(built.port, "G1", "D R1 (kip)"), g1.left);
    close(resultOf(built.port, "C1", "D total (kip)"), g1.left + moved.e1.D);
    // G2 keeps B2 at 12 ft.
    close(resultOf(built.port, "G2", "D R1 (kip)"), handFraming(75, 50).gD.left);
  });

  it("editing a span and a trib width recalculates the beam and what carries it", () => {
    built.port.setCell("Members", "F2", 7); // B1 trib 6 -> 7 ft
    const w = (75 * 7) / 1000;
    close(resultOf(built.port, "B1", "D R1 (kip)"), (w * 30) / 2);
    built.port.setCell("Members", "D5", 28); // E1 span 30 -> 28 ft
    const e1 = (((75 * 2.5 + 300) / 1000) * 28) / 2;
    close(resultOf(built.port, "E1", "D R2 (kip)"), e1);
  });
});

describe("partial loads beside an opening, and a member parallel to the deck", () => {
  /**
   * A stair opening 12 ft long (from 10 to 22 ft) beside beam BO (span 30 ft, walls at both
   * ends): deck on the far side, trib 4 ft, over the whole length; deck on the opening side, 5 ft
   * wide, only from 0 to 10 ft and from 22 to 30 ft (Loads table, kind area). Header H spans
   * 18 ft parallel to the deck: it carries no deck (no zone), only trimmed beams T1 and T2
   * framing into it at its third points (6 and 12 ft); each trimmer spans 14 ft to the wall W3,
   * trib 5 ft.
   */
  const sheets: Record<string, RawCellContent[][]> = {
    Zones: [
      ["Zone", "D (psf)", "L (psf)", "Reducible"],
      ["FL", 80, 40, "yes"],
    ],
    Members: [
      MEMBER_HEADERS,
      ["BO", "beam", "1", 30, "FL", 4, "W1", null, "W2", null, null],
      ["T1", "beam", "1", 14, "FL", 5, "H", 6, "W3", null, null],
      ["T2", "beam", "1", 14, "FL", 5, "H", 12, "W3", null, null],
      ["H", "beam", "1", 18, null, null, "W1", null, "W2", null, null],
      ["W1", "wall", "1", null, null, null, null, null, null, null, null],
      ["W2", "wall", "1", null, null, null, null, null, null, null, null],
      ["W3", "wall", "1", null, null, null, null, null, null, null, null],
    ],
    Loads: [
      ["Mark", "Kind", "Zone or case", "Magnitude", "Width (ft)", "From (ft)", "To (ft)"],
      ["BO", "area", "FL", null, 5, 0, 10],
      ["BO", "area", "FL", null, 5, 22, 30],
    ],
  };
  let built: Built;

  it("builds", async () => {
    built = await buildOn(sheets);
    expect(built.result.problems).toEqual([]);
  });

  it("the beam beside the opening carries the opening-side deck over its two intervals only", () => {
    const w = (q: number, width: number) => (q * width) / 1000;
    const patches = (q: number) => [
      { w: w(q, 4), a: 0, b: 30 },
      { w: w(q, 5), a: 0, b: 10 },
      { w: w(q, 5), a: 22, b: 30 },
    ];
    const d = handReactions(30, [], patches(80));
    const bo = built.result.json!.members.BO!;
    close(bo.reactions.D![0], d.left);
    close(bo.reactions.D![1], d.right);
    close(bo.reactions.L![1], handReactions(30, [], patches(40)).right);
    close(bo.shearMax.D, Math.max(d.left, d.right));
    close(bo.momentMax.D, handMaxMoment(30, [], patches(80)));
    // A_T: 4 ft x 30 ft plus 5 ft x (10 + 8) ft of deck.
    close(bo.tributaryArea, 4 * 30 + 5 * 18);
  });

  it("the header carries nothing but the trimmers' reactions at its third points: R = P, M = P L/3", () => {
    // Trimmer end reaction P = w L / 2 with w = 80 psf x 5 ft.
    const p = ((80 * 5) / 1000) * 14 / 2;
    const h = built.result.json!.members.H!;
    close(h.reactions.D![0], p);
    close(h.reactions.D![1], p);
    close(h.shearMax.D, p);
    // AISC Manual Table 3-23, case 9 (two equal loads symmetrically placed, recalled from memory): M = P a, a = L/3.
    close(h.momentMax.D, p * 6);
    // No deck on the header: its A_T is only what the trimmers hand over (5 ft x 14 ft / 2 each).
    close(h.tributaryArea, 2 * ((5 * 14) / 2));
  });

  it("walls close the path and the balance holds", () => {
    const b = built.result.json!.balance.D!;
    const applied = (80 * (4 * 30 + 5 * 18 + 2 * 5 * 14)) / 1000;
    close(b.applied, applied);
    expect(Math.abs(b.applied - b.supports)).toBeLessThanOrEqual(1e-9 * applied);
    expect(Object.keys(built.result.json!.foundations).sort()).toEqual(["W1", "W2", "W3"]);
  });
});

describe("a column stack over three floors: live load reduction limits", () => {
  /**
   * Each floor: two girders (span 40 ft, trib 25 ft) frame into the interior column from walls on
   * either side, so 2 x 500 ft^2 = 1,000 ft^2 arrives at the column per floor. With K_LL = 4:
   * one floor, A_T 1,000: 0.25 + 15/sqrt(4,000) = 0.487 < 0.50, so the 0.50 limit governs;
   * two floors, A_T 2,000: 0.25 + 15/sqrt(8,000) = 0.418 (the equation governs);
   * three floors, A_T 3,000: 0.25 + 15/sqrt(12,000) = 0.387 < 0.40, so the 0.40 limit governs
   * (ASCE/SEI 7-22 Sec. 4.7.3, recalled from memory).
   */
  const rows: RawCellContent[][] = [MEMBER_HEADERS];
  for (const lv of [3, 2, 1]) {
    rows.push([`GA-${lv}`, "girder", String(lv), 40, "OFF", 25, "WA", null, `C-${lv}`, null, null]);
    rows.push([`GB-${lv}`, "girder", String(lv), 40, "OFF", 25, `C-${lv}`, null, "WB", null, null]);
    rows.push([`C-${lv}`, "column", String(lv), 13, null, null, lv > 1 ? `C-${lv - 1}` : "FC", null, null, null, null]);
  }
  rows.push(["WA", "wall", null, null, null, null, null, null, null, null, null], ["WB", "wall", null, null, null, null, null, null, null, null, null], ["FC", "foundation", null, null, null, null, null, null, null, null, null]);
  const sheets = { Zones: [["Zone", "D (psf)", "L (psf)", "Reducible"], ["OFF", 80, 50, "yes"]], Members: rows };

  it("accumulates loads, areas and floors level by level from the top down", async () => {
    const { result } = await buildOn(sheets);
    expect(result.problems).toEqual([]);
    expect(result.summary!.levels).toEqual(["3", "2", "1"]);
    const perFloor = { D: 2 * (((80 * 25) / 1000) * 40) / 2, L: 2 * (((50 * 25) / 1000) * 40) / 2, A: 2 * ((25 * 40) / 2) };
    const expected = [
      { mark: "C-3", floors: 1, factor: 0.5 },
      { mark: "C-2", floors: 2, factor: 0.25 + 15 / Math.sqrt(4 * 2000) },
      { mark: "C-1", floors: 3, factor: 0.4 },
    ];
    expected.forEach((e, i) => {
      const c = result.json!.columns[e.mark]!;
      const n = i + 1;
      close(c.cumulative.D, n * perFloor.D);
      close(c.cumulative.L, n * perFloor.L);
      close(c.tributaryArea, n * perFloor.A);
      expect(c.floors).toBe(e.floors);
      close(c.llrFactor, e.factor);
      close(c.reducedLive, e.factor * n * perFloor.L);
    });
    // The 0.50 limit at the top, the 0.40 limit at the bottom: both are limits, not the equation.
    expect(0.25 + 15 / Math.sqrt(4 * 1000)).toBeLessThan(0.5);
    expect(0.25 + 15 / Math.sqrt(4 * 3000)).toBeLessThan(0.4);
    close(result.json!.foundations.FC!.D!, 3 * perFloor.D);
    // Governing LRFD load at the bottom: 1.2D + 1.6L (Sec. 2.3.1, recalled from memory).
    close(Math.max(...Object.values(result.json!.columns["C-1"]!.combos)), 1.2 * 3 * perFloor.D + 1.6 * 0.4 * 3 * perFloor.L);
  });
});

describe("a column on a transfer girder, and Loads-table line and point loads", () => {
  /**
   * Roof beam RB (span 20 ft, trib 10 ft of a 50 psf zone, plus a 400 plf partial dead load from
   * 5 to 15 ft) spans from column CT to wall W3. CT (level 2) carries a 2,000 lb point load of its
   * own and bears on transfer girder TG (level 1, span 30 ft between walls W1 and W2) at 10 ft.
   */
  const sheets: Record<string, RawCellContent[][]> = {
    Zones: [
      ["Zone", "D (psf)"],
      ["Z", 50],
    ],
    Members: [
      MEMBER_HEADERS,
      ["RB", "beam", "2", 20, "Z", 10, "CT", null, "W3", null, null],
      ["CT", "column", "2", 10, null, null, "TG", 10, null, null, null],
      ["TG", "girder", "1", 30, null, null, "W1", null, "W2", null, null],
      ["W1", "wall", "1", null, null, null, null, null, null, null, null],
      ["W2", "wall", "1", null, null, null, null, null, null, null, null],
      ["W3", "wall", "2", null, null, null, null, null, null, null, null],
    ],
    Loads: [
      ["Mark", "Kind", "Zone or case", "Magnitude (plf or lb)", "Width (ft)", "From (ft)", "To (ft)"],
      ["RB", "line", "D", 400, null, 5, 15],
      ["CT", "point", "D", 2000, null, null, null],
    ],
  };

  it("hands the column's total to the girder as a point load at its Start at", async () => {
    const { result } = await buildOn(sheets);
    expect(result.problems).toEqual([]);
    expect(result.summary!.levels).toEqual(["2", "1"]);
    // RB: 0.5 kip/ft over 20 ft and 0.4 kip/ft from 5 to 15 ft (lb/1000 = kip, plf/1000 = kip/ft).
    const rb = handReactions(20, [], [
      { w: 0.5, a: 0, b: 20 },
      { w: 0.4, a: 5, b: 15 },
    ]);
    close(result.json!.members.RB!.reactions.D![0], rb.left);
    const ct = rb.left + 2;
    close(result.json!.columns.CT!.cumulative.D, ct);
    const tg = handReactions(30, [{ p: ct, x: 10 }]);
    close(result.json!.members.TG!.reactions.D![0], tg.left);
    close(result.json!.members.TG!.reactions.D![1], tg.right);
    close(result.json!.members.TG!.momentMax.D, tg.left * 10);
    close(result.json!.foundations.W3!.D!, rb.right);
    const applied = 0.5 * 20 + 0.4 * 10 + 2;
    close(result.json!.balance.D!.applied, applied);
    close(result.json!.balance.D!.supports, applied, 1e-9);
  });
});
