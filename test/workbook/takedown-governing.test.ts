/**
 * Governing values and deflection through the takedown (issue 11, items 2, 4 and 5): the generated
 * sheet's LOADPATH.GOVERNING and LOADPATH.DEFLECTION_CHECK formulas, evaluated by HyperFormula with
 * the built functions bundle, and the JSON read back from them, against hand statics written out
 * here and the closed forms of AISC Steel Construction Manual Table 3-23 (case names recalled from
 * memory). LRFD factors of ASCE/SEI 7-22 Sec. 2.3.1 (recalled from memory): 1.4D, 1.2D + 1.6L + 0.5Lr.
 * Needs `npm run build` (the headless engine loads the built functions bundle).
 */
import { describe, expect, it } from "vitest";
import type { RawCellContent } from "hyperformula";
import { buildOn, resultOf } from "./takedown-helpers";

function close(actual: unknown, expected: number, rel = 1e-9): void {
  expect(typeof actual).toBe("number");
  expect(Math.abs((actual as number) - expected)).toBeLessThanOrEqual(rel * Math.max(1, Math.abs(expected)));
}

const SI_MEMBERS = ["Mark", "Type", "Level", "Span (m)", "Zone", "Trib (m)", "Start support", "Start at (m)", "End support", "End at (m)", "wD (kN/m)", "End overhang (m)", "E (MPa)", "I (mm4)"];

/**
 * Joist J01 as in the SI sample (sample-workbooks/make-buildings.ts): 4.2 m back span between walls
 * W1 and W2, 1.2 m balcony beyond W2; joists at 0.6 m; FLOOR D 0.6, L 1.9 kPa on the back span,
 * BALCONY D 0.6, L 2.9 kPa on the overhang (Loads rows), wD 0.15 kN/m self weight over the whole
 * joist. Timber E 11,000 MPa; I as given (blank: required I only).
 */
function joistJ01(I: RawCellContent = null): Record<string, RawCellContent[][]> {
  return {
    Zones: [
      ["Zone", "D (kPa)", "L (kPa)", "Reducible"],
      ["FLOOR", 0.6, 1.9, "no"],
      ["BALCONY", 0.6, 2.9, "no"],
    ],
    Members: [
      SI_MEMBERS,
      ["J01", "joist", "1", 4.2, null, null, "W1", null, "W2", null, 0.15, 1.2, 11000, I],
      ["W1", "wall", "1", null, null, null, null, null, null, null, null, null, null, null],
      ["W2", "wall", "1", null, null, null, null, null, null, null, null, null, null, null],
    ],
    Loads: [
      ["Mark", "Kind", "Zone or case", "Magnitude", "Width (m)", "From (m)", "To (m)"],
      ["J01", "area", "FLOOR", null, 0.6, 0, 4.2],
      ["J01", "area", "BALCONY", null, 0.6, 4.2, 5.4],
    ],
  };
}

describe("joist J01 with a balcony (SI): pattern live load through the sheet and the JSON", () => {
  const l = 4.2;
  const a = 1.2;
  const wD = 0.15 + 0.6 * 0.6; // kN/m, back span and overhang alike
  const wLb = 1.9 * 0.6;
  const wLo = 2.9 * 0.6;

  it("M+ with the balcony's live load off: R1^2 / (2 w_b), 1.2D + 1.6L (hand statics of the overhanging beam)", async () => {
    const { result, port } = await buildOn(joistJ01(), { units: "SI", loads: "Loads" });
    expect(result.problems).toEqual([]);
    // Back span w_b = 1.2 wD + 1.6 wLb, overhang w_o = 1.2 wD (live off): moments about the far
    // support give R1 = w_b l/2 - w_o a^2/(2l); the sagging maximum is where V = R1 - w_b x = 0.
    const wb = 1.2 * wD + 1.6 * wLb;
    const wo = 1.2 * wD;
    const r1 = (wb * l) / 2 - (wo * a * a) / (2 * l);
    const mPlus = (r1 * r1) / (2 * wb);
    expect(mPlus).toBeCloseTo(5.153, 3); // the 5.16 kN·m against 4.22 with live load everywhere
    close(resultOf(port, "J01", "M+ max (kN·m)"), mPlus);
    expect(resultOf(port, "J01", "M+ max: combination; pattern")).toMatch(/1\.2D \+ 1\.6L.*; L on span 1$/);
    const g = result.json!.members.J01!.governing!.LRFD;
    close(g.momentMax.value, mPlus);
    expect(g.momentMax.pattern).toBe("L on span 1");
    expect(g.momentMax.combination).toMatch(/1\.2D \+ 1\.6L/);
  });

  it("M- at the balcony support, |V| and both reactions: overhang and back-span hand statics", async () => {
    const { result } = await buildOn(joistJ01(), { units: "SI", loads: "Loads" });
    const g = result.json!.members.J01!.governing!.LRFD;
    // Hogging at W2: the overhang alone, -(w_o a^2)/2 with w_o = 1.2 wD + 1.6 wLo (live on the balcony).
    const wo = 1.2 * wD + 1.6 * wLo;
    close(g.momentMin.value, -(wo * a * a) / 2);
    expect(g.momentMin.pattern).toBe("L on overhang right");
    // Largest reaction at W2: live everywhere (both parts push W2 down): moments about W1.
    const wb = 1.2 * wD + 1.6 * wLb;
    const r2 = (wb * l * (l / 2) + wo * a * (l + a / 2)) / l;
    close(g.reactionMax[1]!.value, r2);
    expect(g.reactionMax[1]!.pattern).toBe("L on all segments");
    // Largest at W1: back span loaded, balcony live off.
    const wo0 = 1.2 * wD;
    close(g.reactionMax[0]!.value, (wb * l) / 2 - (wo0 * a * a) / (2 * l));
    // Smallest at W1: the balcony's live load lifts the back span; every combination tried, the
    // least is 1.2D + 1.6L with L on the balcony only (0.9D alone gives more).
    const rMin = (1.2 * wD * (l + a) * ((l - (l + a) / 2) / l)) - (1.6 * wLo * a * (a / 2)) / l;
    close(g.reactionMin[0]!.value, rMin);
    expect(g.reactionMin[0]!.pattern).toBe("L on overhang right");
    expect(g.reactionMax.length).toBe(2);
    expect(g.reactionMin.length).toBe(2);
  });

  it("deflection with I blank: allowables of each segment and the required I; live and total need I", async () => {
    const { result, port } = await buildOn(joistJ01(), { units: "SI", loads: "Loads" });
    const d = result.json!.members.J01!.deflection!;
    expect(d.live).toBeNull();
    expect(d.ratio).toBeNull();
    expect(typeof d.requiredI).toBe("number");
    expect(d.requiredI!).toBeGreaterThan(0);
    expect(resultOf(port, "J01", "Live deflection (mm)")).toBeNull();
    // The governing live check: required I makes its ratio exactly 1; with that I the ratio is 1.
    const { result: r2 } = await buildOn(joistJ01(d.requiredI), { units: "SI", loads: "Loads" });
    close(r2.json!.members.J01!.deflection!.ratio, 1, 1e-9);
  });
});

const US_MEMBERS = ["Mark", "Type", "Level", "Span (ft)", "Zone", "Trib (ft)", "Start support", "Start at (ft)", "End support", "End at (ft)", "End overhang (ft)", "E (ksi)", "I (in4)", "Live limit", "Total limit"];

function usBuilding(rows: RawCellContent[][], zones: RawCellContent[][], bearings?: RawCellContent[][]): Record<string, RawCellContent[][]> {
  return {
    Zones: zones,
    Members: [
      US_MEMBERS,
      ...rows,
      ["W1", "wall", "1", null, null, null, null, null, null, null, null, null, null, null, null],
      ["W2", "wall", "1", null, null, null, null, null, null, null, null, null, null, null, null],
      ["W3", "wall", "1", null, null, null, null, null, null, null, null, null, null, null, null],
    ],
    ...(bearings ? { Bearings: [["Mark", "Support", "At (ft)", "Support at (ft)"], ...bearings] } : {}),
  };
}

describe("continuous and overhanging members (US)", () => {
  it("two equal spans: interior reaction max 1.25wL factored, end reaction max with the far span's live load off", async () => {
    // AISC Steel Construction Manual Table 3-23, continuous beam, two equal spans: uniform load on
    // both spans R_B = 1.25wl, R_A = 0.375wl; on one span only R_A = 7/16 wl (recalled from memory).
    const zones = [
      ["Zone", "D (psf)", "L (psf)", "Reducible"],
      ["FLR", 50, 40, "no"],
    ];
    const span = 20;
    const { result, port } = await buildOn(
      usBuilding([["J1", "joist", "1", 2 * span, "FLR", 2, "W1", null, "W3", null, null, null, null, null, null]], zones, [["J1", "W2", span, null]]),
      { bearings: "Bearings" },
    );
    expect(result.problems).toEqual([]);
    const wD = (50 * 2) / 1000;
    const wL = (40 * 2) / 1000;
    const g = result.json!.members.J1!.governing!.LRFD;
    expect(g.reactionMax.length).toBe(3);
    close(g.reactionMax[1]!.value, 1.25 * (1.2 * wD + 1.6 * wL) * span);
    expect(g.reactionMax[1]!.pattern).toBe("L on all segments");
    close(g.reactionMax[0]!.value, 1.2 * 0.375 * wD * span + 1.6 * (7 / 16) * wL * span);
    expect(g.reactionMax[0]!.pattern).toBe("L on span 1");
    // The sheet: the interior support's value sits in R1 max on the row below J1's first row.
    const values = port.hf.getSheetValues(port.hf.getSheetId("Takedown")!);
    const header = values.findIndex((r) => r[0] === "Mark");
    const col = values[header]!.indexOf("R1 max (kip)");
    const row = values.findIndex((r, i) => i > header && r[0] === "J1");
    close(values[row + 1]![col], 1.25 * (1.2 * wD + 1.6 * wL) * span);
  });

  it("uplift at the back support of an overhanging beam: reactionMin negative, live on the overhang only (hand statics)", async () => {
    const zones = [
      ["Zone", "D (psf)", "L (psf)", "Reducible"],
      ["DECK", 10, 100, "no"],
    ];
    const { result, port } = await buildOn(usBuilding([["B1", "beam", "1", 10, "DECK", 1, "W1", null, "W2", null, 6, null, null, null, null]], zones));
    expect(result.problems).toEqual([]);
    const wD = 10 / 1000;
    const wL = 100 / 1000;
    // Supports at 0 and 10 ft, member 16 ft. Moments about the right support: a uniform w over the
    // whole length gives R1 = w x 16 x (10 - 8)/10 = 3.2w; w on the overhang only R1 = -w x 6 x 3/10 = -1.8w.
    const rMin = 1.2 * wD * 3.2 + 1.6 * wL * -1.8;
    expect(rMin).toBeLessThan(0);
    const g = result.json!.members.B1!.governing!.LRFD;
    close(g.reactionMin[0]!.value, rMin);
    expect(g.reactionMin[0]!.pattern).toBe("L on overhang right");
    expect(g.reactionMin[0]!.combination).toMatch(/1\.2D \+ 1\.6L/);
    close(resultOf(port, "B1", "R1 min (kip)"), rMin);
  });

  it("simple span deflection 5wL^4/384EI (Table 3-23 case 1) with its L/360 and L/240 limits", async () => {
    const zones = [
      ["Zone", "D (psf)", "L (psf)", "Reducible"],
      ["FLR", 50, 40, "no"],
    ];
    const E = 29000;
    const I = 100;
    const span = 20;
    const { result, port } = await buildOn(usBuilding([["B2", "beam", "1", span, "FLR", 2, "W1", null, "W2", null, null, E, I, null, "L/240"]], zones));
    expect(result.problems).toEqual([]);
    const wD = 0.1;
    const wL = 0.08;
    // kip/ft, ft -> in: deflection [in] = 5 w L^4 / (384 E I) x 1728 (ft^3 -> in^3 with E in ksi, I in in^4).
    const liveIn = (5 * wL * span ** 4 * 1728) / (384 * E * I);
    const totalIn = (5 * (wD + wL) * span ** 4 * 1728) / (384 * E * I);
    close(resultOf(port, "B2", "Live deflection (in)"), liveIn);
    close(resultOf(port, "B2", "Total deflection (in)"), totalIn);
    close(resultOf(port, "B2", "Live allowable (in)"), (span * 12) / 360);
    close(resultOf(port, "B2", "Total allowable (in)"), (span * 12) / 240);
    const d = result.json!.members.B2!.deflection!;
    close(d.ratio, Math.max(liveIn / ((span * 12) / 360), totalIn / ((span * 12) / 240)));
    close(d.requiredI, I * d.ratio!);
  });

  it("overhang tip deflection against 2a/360 (Table 3-23, beam overhanging one support): down under L on the overhang, up under L on the back span", async () => {
    // AISC Steel Construction Manual Table 3-23, beam overhanging one support (recalled from memory):
    // uniform w on the overhang only, tip deflection w a^3 (4l + 3a) / (24EI) downward; uniform w
    // between the supports only, the tip rises by w l^3 a / (24EI). The live load pattern that
    // governs the overhang is the larger of the two.
    const zones = [
      ["Zone", "L (psf)", "Reducible"],
      ["DECK", 100, "no"],
    ];
    const E = 29000;
    const I = 50;
    const l = 10;
    const { result } = await buildOn(
      usBuilding(
        [
          ["B3", "beam", "1", l, "DECK", 1, "W1", null, "W2", null, 4, E, I, 360, 240],
          ["B7", "beam", "1", l, "DECK", 1, "W1", null, "W2", null, 6, E, I, "L/360", "L/240"],
        ],
        zones,
      ),
    );
    expect(result.problems).toEqual([]);
    const w = 0.1; // kip/ft
    const k = 1728 / (E * I); // kip-ft^3 -> in
    const down = (a: number): number => (w * a ** 3 * (4 * l + 3 * a) * k) / 24;
    const up = (a: number): number => (w * l ** 3 * a * k) / 24;
    // a = 4 ft: the lift governs (0.0199 in against 0.0165 in down).
    expect(up(4)).toBeGreaterThan(down(4));
    const d3 = result.json!.members.B3!.deflection!;
    close(d3.live, -up(4));
    close(d3.liveLimit, (2 * 4 * 12) / 360);
    close(d3.totalLimit, (2 * 4 * 12) / 240);
    close(d3.ratio, up(4) / ((2 * 4 * 12) / 240) > up(4) / ((2 * 4 * 12) / 360) ? up(4) / ((2 * 4 * 12) / 240) : up(4) / ((2 * 4 * 12) / 360));
    // a = 6 ft: the tip deflects down with the overhang alone loaded.
    expect(down(6)).toBeGreaterThan(up(6));
    const d7 = result.json!.members.B7!.deflection!;
    close(d7.live, down(6));
    close(d7.liveLimit, (2 * 6 * 12) / 360);
  });

  it("live load reduction: a member whose live load is all reducible takes its LLR factor; one with unreducible live load is not reduced", async () => {
    const zones = [
      ["Zone", "D (psf)", "L (psf)", "Reducible"],
      ["OFF", 50, 80, "yes"],
      ["STOR", 50, 80, "no"],
    ];
    const span = 40;
    const trib = 30;
    const { result } = await buildOn(
      usBuilding(
        [
          ["G1", "girder", "1", span, "OFF", trib, "W1", null, "W2", null, null, null, null, null, null],
          ["G2", "girder", "1", span, "STOR", trib, "W1", null, "W2", null, null, null, null, null, null],
        ],
        zones,
      ),
    );
    // G3 also carries a 100 plf live line load (not reducible): its LLR factor is computed but the
    // governing values take all its live load unreduced (conservative).
    const g3 = await buildOn(
      {
        ...usBuilding([["G3", "girder", "1", span, "OFF", trib, "W1", null, "W2", null, null, null, null, null, null]], zones),
        Loads: [
          ["Mark", "Kind", "Zone or case", "Magnitude", "Width (ft)", "From (ft)", "To (ft)"],
          ["G3", "line", "L", 100, null, null, null],
        ],
      },
      { loads: "Loads" },
    );
    expect(g3.result.problems).toEqual([]);
    expect(result.problems).toEqual([]);
    const wD = (50 * trib) / 1000;
    const wL = (80 * trib) / 1000;
    // ASCE/SEI 7-22 Eq. 4.7-1 (recalled from memory): L/Lo = 0.25 + 15/sqrt(K_LL A_T), K_LL = 2 (beams,
    // Table 4.7-2), A_T = span x trib = 1,200 ft^2; not below 0.50 for a member carrying one floor.
    const llr = Math.max(0.5, 0.25 + 15 / Math.sqrt(2 * span * trib));
    close(result.json!.members.G1!.llrFactor, llr);
    close(result.json!.members.G1!.governing!.LRFD.momentMax.value, ((1.2 * wD + 1.6 * llr * wL) * span * span) / 8);
    close(result.json!.members.G2!.llrFactor, 1);
    close(result.json!.members.G2!.governing!.LRFD.momentMax.value, ((1.2 * wD + 1.6 * wL) * span * span) / 8);
    close(g3.result.json!.members.G3!.llrFactor, llr);
    close(g3.result.json!.members.G3!.governing!.LRFD.momentMax.value, ((1.2 * wD + 1.6 * (wL + 0.1)) * span * span) / 8);
  });

  it("a bad E or limit is a problem at its cell and the member is left out", async () => {
    const zones = [
      ["Zone", "D (psf)", "L (psf)", "Reducible"],
      ["FLR", 50, 40, "no"],
    ];
    const { result } = await buildOn(
      usBuilding(
        [
          ["B4", "beam", "1", 20, "FLR", 2, "W1", null, "W2", null, null, "stiff", 100, null, null],
          ["B5", "beam", "1", 20, "FLR", 2, "W1", null, "W2", null, null, 29000, 100, "L/zero", null],
          ["B6", "beam", "1", 20, "FLR", 2, "W1", null, "W2", null, null, -5, 100, null, null],
        ],
        zones,
      ),
    );
    const byMark = (mark: string) => result.problems.find((p) => p.mark === mark);
    expect(byMark("B4")).toMatchObject({ code: "badValue", cell: "L2" });
    expect(byMark("B4")!.message).toMatch(/E "stiff" is not a number/);
    expect(byMark("B5")).toMatchObject({ code: "badValue", cell: "N3" });
    expect(byMark("B5")!.message).toMatch(/Live limit "L\/zero" is not a span ratio/);
    expect(byMark("B6")).toMatchObject({ code: "badValue", cell: "L4" });
    expect(result.json!.members.B4).toBeUndefined();
  });
});
