/**
 * Any member the engine accepts gives a well-formed drawing with one reaction label per support
 * and finite numbers everywhere; anything it refuses gives its message. Properties over random
 * members (fast-check), plus the empty and upward-load cases.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { renderMemberSheet } from "../../src/drawings/sheet";
import { type MemberDrawing, SI_UNITS, US_UNITS } from "../../src/drawings/types";
import { PALETTE } from "../../src/drawings/svg";
import { allElements, byRole, numAttr, parseSvg, type SvgElement } from "./svg-query";

const span = 12;
const pos = fc.double({ min: 0, max: span, noNaN: true });
const mag = fc.double({ min: -50, max: 50, noNaN: true });

const drawing = fc
  .record({
    a: fc.double({ min: 0, max: 5, noNaN: true }),
    b: fc.double({ min: 7, max: span, noNaN: true }),
    fixedLeft: fc.boolean(),
    lines: fc.array(fc.record({ s: pos, e: pos, w1: mag, w2: mag }), { maxLength: 4 }),
    points: fc.array(fc.record({ x: pos, p: mag, from: fc.string({ maxLength: 12 }) }), { maxLength: 8 }),
    moments: fc.array(fc.record({ x: pos, m: mag }), { maxLength: 2 }),
    ei: fc.option(fc.double({ min: 1e3, max: 1e7, noNaN: true }), { nil: undefined }),
    si: fc.boolean(),
  })
  .map(
    (r): MemberDrawing => ({
      mark: "B-1",
      span,
      units: r.si ? SI_UNITS : US_UNITS,
      caseLabel: "D",
      supports: [
        { x: r.fixedLeft ? 0 : r.a, type: r.fixedLeft ? "fixed" : "pin", label: "C-1" },
        { x: r.b, type: "pin", label: "C-2" },
      ],
      lines: r.lines.map((l) => ({ start: Math.min(l.s, l.e), end: Math.max(l.s, l.e), w1: l.w1, w2: l.w2 })),
      points: r.points,
      moments: r.moments,
      ...(r.ei === undefined ? {} : { ei: r.ei }),
    }),
  );

describe("robustness", () => {
  it("draws any stable member well-formed, one reaction label per support, finite numbers only (property)", () => {
    fc.assert(
      fc.property(drawing, (d) => {
        const root = parseSvg(renderMemberSheet(d));
        expect(byRole(root, "error")).toHaveLength(0);
        expect(byRole(root, "reaction")).toHaveLength(2);
        for (const e of allElements(root)) {
          for (const a of Array.from(e.attributes)) {
            if (a.name.startsWith("data-") && /^[-\d.eE+]+$|NaN|Infinity/.test(a.value)) expect(Number.isFinite(Number(a.value)), `${a.name}=${a.value}`).toBe(true);
            if (["x", "y", "x1", "x2", "y1", "y2", "cx", "cy", "height"].includes(a.name) || (a.name === "width" && e.tagName !== "svg")) expect(Number.isFinite(Number(a.value)), `${a.name}=${a.value}`).toBe(true);
          }
        }
        expect(byRole(root, "deflection").length).toBe(d.ei === undefined ? 0 : 1);
      }),
      { numRuns: 120 },
    );
  });

  it("draws an unloaded member with flat diagrams and no extreme labels", () => {
    const root = parseSvg(
      renderMemberSheet({
        mark: "B-0",
        span: 10,
        units: US_UNITS,
        caseLabel: "Lr",
        supports: [
          { x: 0, type: "pin" },
          { x: 10, type: "pin" },
        ],
        lines: [],
        points: [],
        moments: [],
        ei: 1e5,
      }),
    );
    expect(byRole(root, "extreme")).toHaveLength(0);
    expect(byRole(root, "zero-crossing")).toHaveLength(0);
    expect(byRole(root, "reaction").map((r) => numAttr(r, "data-value"))).toEqual([0, 0]);
  });

  it("draws an upward point load and a downward reaction with arrows pointing the right way", () => {
    // Uplift of 4 kip at the tip of a 2 ft overhang, pins at A = 0 and B = 8 ft. Statics:
    // moments about A: 8 R_B + 4 * 10 = 0 -> R_B = -5 kip (held down); forces: R_A + R_B + 4 = 0 -> R_A = +1 kip.
    const root = parseSvg(
      renderMemberSheet({
        mark: "B-2",
        span: 10,
        units: US_UNITS,
        caseLabel: "W",
        supports: [
          { x: 0, type: "pin" },
          { x: 8, type: "pin" },
        ],
        lines: [],
        points: [{ x: 10, p: -4, from: "uplift" }],
        moments: [],
      }),
    );
    const r = byRole(root, "reaction").map((e) => numAttr(e, "data-value"));
    expect(r[0]).toBeCloseTo(1, 12);
    expect(r[1]).toBeCloseTo(-5, 12);
    expect(byRole(root, "reaction").map((e) => e.textContent)).toEqual(["1 kip", "\u22125 kip"]);
    expect(byRole(root, "point-label")[0]?.textContent).toBe("uplift: \u22124 kip");
    // Arrowheads: the first point of each head polygon is its tip. Up at A (tip nearer the member), down at B.
    const tipY = (g: SvgElement, colour: string): number[] =>
      allElements(g)
        .filter((e) => e.tagName === "polygon" && e.getAttribute("fill") === colour)
        .map((e) => Number((e.getAttribute("points") ?? "").split(" ")[0]?.split(",")[1]));
    const [a, b] = byRole(root, "support");
    const [tailA, tailB] = [a, b].map((g) => Math.max(...allElements(g as SvgElement).filter((e) => e.tagName === "line" && e.getAttribute("stroke") === PALETTE.reaction).flatMap((e) => [numAttr(e, "y1"), numAttr(e, "y2")])));
    expect(tipY(a as SvgElement, PALETTE.reaction)[0]).toBeLessThan(tailA as number);
    expect(tipY(b as SvgElement, PALETTE.reaction)[0]).toBeGreaterThanOrEqual(tailB as number);
    const load = byRole(root, "point-load")[0] as SvgElement;
    const loadTip = tipY(load, PALETTE.load)[0] as number;
    const shaft = allElements(load).find((e) => e.tagName === "line") as SvgElement;
    expect(loadTip).toBeLessThan(Math.min(numAttr(shaft, "y1"), numAttr(shaft, "y2")));
  });
});
