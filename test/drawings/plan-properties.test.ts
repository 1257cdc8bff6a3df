/**
 * Properties of the plan drawing over random bays (fast-check): any bay of girders on columns
 * with beams across (one maybe skewed), a deck spanning at any angle, maybe an opening, the whole
 * plan rotated by any angle and a random member selected, draws as well-formed SVG with no
 * non-finite number, every derived member once, and each member's shaded regions (shoelace here)
 * adding up to its derived tributary area.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { derive, readPlan } from "../../src/engine/framing";
import type { CellValue, TableData } from "../../src/engine/takedown/types";
import { renderFramingPlan } from "../../src/drawings/plan";
import { byRole, parseSvg } from "./svg-query";

const shoelace = (pts: readonly [number, number][]): number => Math.abs(pts.reduce((s, [x1, y1], i) => s + x1 * pts[(i + 1) % pts.length]![1] - pts[(i + 1) % pts.length]![0] * y1, 0)) / 2;
const table = (sheet: string, values: CellValue[][]): TableData => ({ sheet, top: 0, left: 0, values });

const bay = fc.record({
  w: fc.integer({ min: 12, max: 40 }),
  h: fc.integer({ min: 10, max: 30 }),
  cuts: fc.uniqueArray(fc.integer({ min: 1, max: 19 }), { minLength: 1, maxLength: 5 }),
  skew: fc.integer({ min: -3, max: 3 }),
  span: fc.integer({ min: 0, max: 179 }),
  opening: fc.boolean(),
  turn: fc.integer({ min: 0, max: 359 }),
  pick: fc.nat(),
});

describe("plan drawing properties", () => {
  it("random bays draw well-formed, finite, every member once, regions adding up to the tributary areas", () => {
    fc.assert(
      fc.property(bay, ({ w, h, cuts, skew, span, opening, turn, pick }) => {
        const c = Math.cos((turn * Math.PI) / 180), s = Math.sin((turn * Math.PI) / 180);
        const t = (x: number, y: number): [number, number] => [x * c - y * s, x * s + y * c];
        const xs = [...new Set(cuts.map((k) => (k * w) / 20))].sort((a, b) => a - b);
        const f: CellValue[][] = [["Mark", "Type", "Level", "X1", "Y1", "X2", "Y2"]];
        const put = (mark: string, type: string, a: [number, number], b?: [number, number]) => f.push(b ? [mark, type, "1", ...t(...a), ...t(...b)] : [mark, type, "1", ...t(...a)]);
        put("C1", "column", [0, 0]);
        put("C2", "column", [w, 0]);
        put("C3", "column", [0, h]);
        put("C4", "column", [w, h]);
        put("G1", "girder", [0, 0], [w, 0]);
        put("G2", "girder", [0, h], [w, h]);
        put("G3", "girder", [0, 0], [0, h]);
        put("G4", "girder", [w, 0], [w, h]);
        xs.forEach((x, i) => put(`B${i + 1}`, "beam", [x, 0], [i === 0 ? Math.min((xs[1] ?? w) - 0.5, Math.max(0.5, x + skew)) : x, h]));
        const corners = (pts: [number, number][]) => pts.map((p) => t(...p).join(",")).join("; ");
        const d: CellValue[][] = [["Area", "Level", "Kind", "Zone", "Span", "X1", "Y1", "X2", "Y2", "Corners"], ["D1", "1", "one-way", "Office", span + turn, null, null, null, null, corners([[0, 0], [w, 0], [w, h], [0, h]])]];
        if (opening) d.push(["O1", "1", "opening", null, null, null, null, null, null, corners([[w / 4, h / 4], [w / 2, h / 4], [w / 2, h / 2], [w / 4, h / 2]])]);
        const r = readPlan({ framing: table("Framing", f), decks: table("Decks", d), levels: table("Levels", [["Level", "Elevation"], ["1", 12]]) });
        const derivation = derive(r.plan);
        const marks = derivation.members.filter((m) => m.type !== "foundation").map((m) => m.mark);
        const selected = marks[pick % marks.length]!;
        const svg = renderFramingPlan({ plan: r.plan, grids: r.grids, derivation, units: "US" }, "1", { selected });
        expect(svg).not.toMatch(/NaN|Infinity/);
        const root = parseSvg(svg);
        const drawn = [...byRole(root, "plan-member"), ...byRole(root, "plan-column")].map((e) => e.getAttribute("data-plan-mark")).sort();
        expect(drawn).toEqual([...marks].sort());
        for (const m of derivation.members) {
          const area = byRole(root, "plan-tributary")
            .filter((e) => e.getAttribute("data-plan-mark") === m.mark)
            .reduce((sum, e) => sum + shoelace(e.getAttribute("data-plan")!.split(" ").map((p) => p.split(",").map(Number) as [number, number])), 0);
          expect(Math.abs(area - m.tributaryArea), m.mark).toBeLessThanOrEqual(1e-9 * Math.max(1, w * h));
        }
      }),
      { numRuns: 60 },
    );
  });
});
