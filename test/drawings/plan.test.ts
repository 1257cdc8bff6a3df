/**
 * The framing plan drawing read back: its geometry equals the derived model (member end points,
 * column points), every member's shaded tributary regions add up (by a shoelace area computed
 * here, independently of the engine) to the derived tributary area and to hand statics, the
 * regions tile the deck less the opening, neighbours get different tints, the selection
 * highlights the member and its load path, and marks and zone names with markup are escaped.
 */
import { describe, expect, it } from "vitest";
import { renderFramingPlan, planLevels, loadPathOf, TRIBUTARY_TINTS } from "../../src/drawings/plan";
import { renderKeyPlan } from "../../src/drawings/key-plan";
import { PALETTE } from "../../src/drawings/svg";
import { byRole, numAttr, parseSvg, type SvgElement } from "./svg-query";
import { fixtureModel, HOSTILE_MARK, HOSTILE_ZONE } from "./plan-fixture";

type Pt = [number, number];

/** Shoelace area of a polygon (absolute value), written here independently of the engine. */
function shoelace(pts: readonly Pt[]): number {
  let s = 0;
  for (let i = 0; i < pts.length; i++) {
    const [x1, y1] = pts[i]!;
    const [x2, y2] = pts[(i + 1) % pts.length]!;
    s += x1 * y2 - x2 * y1;
  }
  return Math.abs(s) / 2;
}

const pairs = (text: string, sep: RegExp): Pt[] => text.trim().split(/\s+/).map((p) => p.split(sep).map(Number) as Pt);

/** Drawing units -> plan coordinates, from the transform the root carries. */
function inverse(root: SvgElement): (x: number, y: number) => Pt {
  const s = numAttr(root, "data-scale");
  const xmin = numAttr(root, "data-xmin");
  const ymax = numAttr(root, "data-ymax");
  const left = numAttr(root, "data-left");
  const top = numAttr(root, "data-top");
  return (x, y) => [xmin + (x - left) / s, ymax - (y - top) / s];
}

const model = fixtureModel();
const level2 = parseSvg(renderFramingPlan(model, "2"));
const regionsOf = (root: SvgElement, mark: string): SvgElement[] => byRole(root, "plan-tributary").filter((e) => e.getAttribute("data-plan-mark") === mark);

describe("framing plan drawing: geometry equals the derived model", () => {
  it("the fixture derives without problems, on two levels", () => {
    expect(model.derivation.problems).toEqual([]);
    expect(planLevels(model)).toEqual(["2", "Roof"]);
  });

  it("every member and column is drawn at its derived points (data and drawn coordinates)", () => {
    const inv = inverse(level2);
    const s = numAttr(level2, "data-scale");
    const drawnMembers = byRole(level2, "plan-member");
    const derived = model.derivation.members.filter((m) => m.level === "2" && m.type !== "column" && m.type !== "foundation");
    expect(drawnMembers.map((e) => e.getAttribute("data-plan-mark")).sort()).toEqual(derived.map((m) => m.mark).sort());
    for (const m of derived) {
      const g = drawnMembers.find((e) => e.getAttribute("data-plan-mark") === m.mark)!;
      expect([numAttr(g, "data-x1"), numAttr(g, "data-y1"), numAttr(g, "data-x2"), numAttr(g, "data-y2")]).toEqual([m.x1, m.y1, m.x2, m.y2]);
      const l = g.getElementsByTagName("line")[0]!;
      const [ax, ay] = inv(numAttr(l, "x1"), numAttr(l, "y1"));
      const [bx, by] = inv(numAttr(l, "x2"), numAttr(l, "y2"));
      // drawn coordinates are rounded to 0.01 drawing units
      for (const [got, want] of [[ax, m.x1], [ay, m.y1], [bx, m.x2], [by, m.y2]] as const) expect(Math.abs(got - want)).toBeLessThanOrEqual(0.006 / s);
    }
    // B2 is at x = A + 10 (hand reading of the Framing row), from grid 1 to grid 2
    const b2 = drawnMembers.find((e) => e.getAttribute("data-plan-mark") === HOSTILE_MARK)!;
    expect([numAttr(b2, "data-x1"), numAttr(b2, "data-y1"), numAttr(b2, "data-x2"), numAttr(b2, "data-y2")]).toEqual([10, 0, 10, 24]);
    const cols = byRole(level2, "plan-column");
    expect(cols).toHaveLength(6);
    const c3 = cols.find((e) => e.getAttribute("data-plan-mark") === "C3")!;
    expect([numAttr(c3, "data-x1"), numAttr(c3, "data-y1")]).toEqual([54, 0]);
    const rect = c3.getElementsByTagName("rect")[0]!;
    const [cx, cy] = inv(numAttr(rect, "x") + numAttr(rect, "width") / 2, numAttr(rect, "y") + numAttr(rect, "height") / 2);
    expect(Math.abs(cx - 54) + Math.abs(cy - 0)).toBeLessThan(0.02 / s);
  });

  it("grid lines are drawn at their positions with their names", () => {
    const inv = inverse(level2);
    const grids = byRole(level2, "plan-grid");
    expect(grids.map((g) => g.getAttribute("data-grid")).sort()).toEqual(["1", "2", "A", "B", "C"]);
    const b = grids.find((g) => g.getAttribute("data-grid") === "B")!;
    const l = b.getElementsByTagName("line")[0]!;
    expect(inv(numAttr(l, "x1"), 0)[0]).toBeCloseTo(30, 2);
    expect(byRole(b, "plan-grid-name")[0]!.textContent).toBe("B");
  });

  it("each member's shaded regions add up to its derived tributary area (shoelace here)", () => {
    const inv = inverse(level2);
    const s = numAttr(level2, "data-scale");
    for (const m of model.derivation.members.filter((x) => x.level === "2" && x.type !== "column" && x.type !== "foundation")) {
      const regions = regionsOf(level2, m.mark);
      const exact = regions.reduce((sum, r) => sum + shoelace(pairs(r.getAttribute("data-plan")!, /,/)), 0);
      expect(exact, m.mark).toBeCloseTo(m.tributaryArea, 9);
      // the integral of the derived width along the member
      const integral = m.tributary.reduce((sum, p) => sum + ((p.to - p.from) * (p.width + p.endWidth)) / 2, 0);
      expect(exact, m.mark).toBeCloseTo(integral, 9);
      // the drawn polygons (0.01-unit rounding): within the perimeter x rounding of the exact area
      const drawn = regions.reduce((sum, r) => sum + shoelace(pairs(r.getAttribute("points")!, /,/).map(([x, y]) => inv(x, y))), 0);
      const perimeter = 2 * 54 + 2 * 24;
      expect(Math.abs(drawn - exact), m.mark).toBeLessThanOrEqual((perimeter * 0.01) / s + 1e-9);
    }
  });

  it("tributary areas equal hand statics: strip rule with the opening, and 45-degree triangles of the two-way panel", () => {
    const area = (mark: string) => regionsOf(level2, mark).reduce((sum, r) => sum + shoelace(pairs(r.getAttribute("data-plan")!, /,/)), 0);
    // B2 at x = 10 between B1 (x = 0) and B3 (x = 20): width (10 + 10)/2 = 10 ft over 24 ft, less
    // the opening's part on its side of mid-distance x = 15: (15 - 12) x (14 - 8) = 18 ft²
    expect(area(HOSTILE_MARK)).toBeCloseTo(10 * 24 - 18, 9);
    expect(area("B3")).toBeCloseTo(10 * 24 - 18, 9);
    expect(area("B1")).toBeCloseTo(5 * 24, 9);
    // B4 at x = 30: half of the 10 ft span to B3 over 24 ft, plus the two-way triangle on its side
    // of the 24 x 24 panel, q·Lx²/4 per unit load = 24²/4 = 144 ft² (two-way slab, 45-degree lines)
    expect(area("B4")).toBeCloseTo(5 * 24 + 144, 9);
    for (const g of ["G2", "G4", "B5"]) expect(area(g)).toBeCloseTo(144, 9);
    // girders of bay 1 are parallel to its span: no region
    expect(regionsOf(level2, "G1")).toHaveLength(0);
  });

  it("the regions tile the decks less the opening (no gap, no double count)", () => {
    const all = byRole(level2, "plan-tributary").reduce((sum, r) => sum + shoelace(pairs(r.getAttribute("data-plan")!, /,/)), 0);
    expect(all).toBeCloseTo(30 * 24 - 6 * 6 + 24 * 24, 9);
  });

  it("neighbouring members are tinted differently", () => {
    const fill = (mark: string) => regionsOf(level2, mark)[0]!.getAttribute("fill");
    const chain = ["B1", HOSTILE_MARK, "B3", "B4"];
    for (let i = 0; i + 1 < chain.length; i++) expect(fill(chain[i]!), chain[i]).not.toBe(fill(chain[i + 1]!));
    for (const r of byRole(level2, "plan-tributary")) expect(TRIBUTARY_TINTS as readonly string[]).toContain(r.getAttribute("fill"));
  });

  it("decks carry their span arrows (two for the two-way panel), openings and slab edges", () => {
    const decks = byRole(level2, "plan-deck");
    expect(decks.map((d) => d.getAttribute("data-area")).sort()).toEqual(["D1", "D2"]);
    expect(byRole(decks.find((d) => d.getAttribute("data-area") === "D1")!, "plan-span-arrow")).toHaveLength(1);
    expect(byRole(decks.find((d) => d.getAttribute("data-area") === "D2")!, "plan-span-arrow")).toHaveLength(2);
    expect(byRole(level2, "plan-opening").map((o) => o.getAttribute("data-area"))).toEqual(["O1"]);
    expect(byRole(level2, "plan-slab-edge")).toHaveLength(2);
  });

  it("every member and column carries its mark: a label where it fits, a title always", () => {
    for (const role of ["member", "column"]) {
      for (const g of byRole(level2, role)) {
        const mark = g.getAttribute("data-plan-mark")!;
        expect(g.getElementsByTagName("title")[0]!.textContent!.includes(mark), mark).toBe(true);
      }
    }
    const labelled = byRole(level2, "plan-member-label").map((t) => t.getAttribute("data-plan-mark"));
    expect(labelled).toContain("G1");
    expect(labelled).toContain("B4");
  });
});

describe("framing plan drawing: selection and load path", () => {
  it("the selected member's region and its path to the foundations are highlighted", () => {
    const roof = parseSvg(renderFramingPlan(model, "Roof", { selected: "B2R" }));
    const path = loadPathOf(model.derivation, "B2R");
    // B2R bears on G1R and G3R (hand reading of the plan), those on the roof columns, those on the
    // level 2 columns below, those on the foundations added under them.
    expect(path.slice(0, 2)).toEqual(["G1R", "G3R"]);
    expect(path).toEqual(expect.arrayContaining(["C1R", "C2R", "C4R", "C5R", "C1", "C2", "C4", "C5", "F-C1"]));
    for (const r of regionsOf(roof, "B2R")) expect(r.getAttribute("fill")).toBe(PALETTE.loadFill);
    const g1 = byRole(roof, "plan-member").find((e) => e.getAttribute("data-plan-mark") === "G1R")!;
    expect(g1.getElementsByTagName("line")[0]!.getAttribute("stroke")).toBe(PALETTE.reaction);
    expect(byRole(roof, "plan-selection")[0]!.getElementsByTagName("text")[0]!.textContent).toMatch(/^Selected B2R: tributary area 240\.0 ft²; load path B2R → G1R → G3R/);
  });
});

describe("framing plan drawing: text from cells is escaped", () => {
  it("a mark with <script>, quotes and ampersands and a zone with markup are drawn as text", () => {
    const raw = renderFramingPlan(model, "2", { selected: HOSTILE_MARK });
    expect(raw).not.toContain("<script");
    expect(raw).not.toContain("<b>");
    expect(raw).toContain("&lt;script&gt;");
    const root = parseSvg(raw);
    expect(byRole(root, "plan-member").some((e) => e.getAttribute("data-plan-mark") === HOSTILE_MARK)).toBe(true);
    expect(byRole(root, "plan-tributary").some((e) => e.getAttribute("data-zone") === HOSTILE_ZONE)).toBe(true);
    const allText = Array.from(root.getElementsByTagName("*")).map((e) => e.textContent ?? "").join(" ");
    expect(allText).toContain(HOSTILE_ZONE);
  });

  it("the key plan escapes marks too and says it is schematic", () => {
    const raw = renderKeyPlan({ levels: ["2"], members: [{ mark: HOSTILE_MARK, type: "beam", level: "2", supports: ["G&1"] }, { mark: "G&1", type: "girder", level: "2", supports: ["C1"] }, { mark: "C1", type: "column", level: "2", supports: ["F1"] }] });
    expect(raw).not.toContain("<script");
    const root = parseSvg(raw);
    expect(byRole(root, "key-member").map((e) => e.getAttribute("data-plan-mark")).sort()).toEqual(["C1", "F1", "G&1", HOSTILE_MARK].sort());
    expect(byRole(root, "key-bears-on").map((e) => `${e.getAttribute("data-from")}>${e.getAttribute("data-to")}`).sort()).toEqual(["C1>F1", `G&1>C1`, `${HOSTILE_MARK}>G&1`].sort());
    expect(raw).toMatch(/Key plan \(schematic\)/);
  });

  it("the key plan highlights a selected member and its path to the foundation", () => {
    const input = { levels: ["2"], members: [{ mark: "B1", type: "beam" as const, level: "2", supports: ["G1"] }, { mark: "B2", type: "beam" as const, level: "2", supports: ["G2"] }, { mark: "G1", type: "girder" as const, level: "2", supports: ["C1"] }, { mark: "G2", type: "girder" as const, level: "2", supports: ["C2"] }, { mark: "C1", type: "column" as const, level: "2", supports: ["F1"] }, { mark: "C2", type: "column" as const, level: "2", supports: ["F2"] }] };
    const root = parseSvg(renderKeyPlan(input, 720, "B1"));
    const lit = Object.fromEntries(byRole(root, "key-member").map((e) => [e.getAttribute("data-plan-mark"), e.getAttribute("data-highlight") || "none"]));
    // B1 -> G1 -> C1 -> F1 (what each bears on, by hand); B2's path stays plain
    expect(lit).toEqual({ B1: "selected", G1: "path", C1: "path", F1: "path", B2: "none", G2: "none", C2: "none", F2: "none" });
  });
});
