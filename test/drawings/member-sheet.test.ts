/**
 * The numbers on a member sheet come from the exact beam engine: the labelled reactions,
 * extremes, zero crossings and deflections are compared here with values worked out by hand
 * statics (or an independent numerical integration), never with the engine itself. The SVG's
 * structure is checked, not its pixels: labels present, positions to scale.
 */
import { describe, expect, it } from "vitest";
import { renderMemberSheet } from "../../src/drawings/sheet";
import type { MemberDrawing } from "../../src/drawings/types";
import { flexuralRigidityKipFt2, US_UNITS } from "../../src/drawings/types";
import { CANTILEVER, OVERHANG_BEAM, OVERHANG_BEAM_EI } from "./fixtures";
import { allElements, byRole, numAttr, parseSvg, type SvgElement, texts } from "./svg-query";

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.max(1, Math.abs(b));

function sheet(d: MemberDrawing): SvgElement {
  return parseSvg(renderMemberSheet(d));
}

function extreme(root: SvgElement, kind: string): SvgElement {
  const found = byRole(root, "extreme").filter((e) => e.getAttribute("data-kind") === kind);
  expect(found, `one ${kind} label`).toHaveLength(1);
  return found[0] as SvgElement;
}

/** Drawing x of the member's ends, read from the drawn member line. */
function memberEnds(root: SvgElement): [number, number] {
  const m = byRole(root, "member")[0] as SvgElement;
  return [numAttr(m, "x1"), numAttr(m, "x2")];
}

function polylinePoints(e: SvgElement): [number, number][] {
  return (e.getAttribute("points") ?? "")
    .trim()
    .split(/\s+/)
    .map((p) => p.split(",").map(Number) as [number, number]);
}

// Hand statics of OVERHANG_BEAM (pins at A = 0 and B = 24 ft; 30 ft long):
//   sum of moments about A: 24 R_B = 1.2*12*10 + 8*10 + 5*30 = 374  ->  R_B = 15.58333 kip
//   sum of forces:          R_A = 1.2*12 + 8 + 5 - R_B = 11.81667 kip
//   V just left of 10 = R_A - 1.2*6 = 4.61667; just right = -3.38333 (sign change at the point load)
//   M(10) = 10 R_A - 1.2*6*3 = 96.5667 kip-ft (largest sagging); M(24) = -5*6 = -30 kip-ft (hogging)
//   16 < x < 24: M(x) = R_A x - 14.4 (x - 10) - 8 (x - 10) = 224 - 10.58333 x  ->  M = 0 at x = 21.1654
const R_B = 374 / 24;
const R_A = 27.4 - R_B;
const M_10 = 10 * R_A - 21.6;
const X_INFLECTION = 224 / (22.4 - R_A);

describe("member sheet numbers against hand statics (partial load, overhang, two received point loads)", () => {
  const root = sheet(OVERHANG_BEAM);

  it("labels each reaction with the hand-statics value and its unit", () => {
    const r = byRole(root, "reaction");
    expect(r).toHaveLength(2);
    expect(rel(numAttr(r[0] as SvgElement, "data-value"), R_A)).toBeLessThan(1e-9);
    expect(rel(numAttr(r[1] as SvgElement, "data-value"), R_B)).toBeLessThan(1e-9);
    expect(r.map((e) => e.textContent)).toEqual(["11.8 kip", "15.6 kip"]);
  });

  it("labels the supports with the marks of what holds the member up", () => {
    expect(byRole(root, "support-label").map((e) => e.textContent)).toEqual(["C-4", "G-2 @ 12.5 ft"]);
  });

  it("labels the received point loads with their source marks and the line load with its magnitude", () => {
    expect(byRole(root, "point-label").map((e) => e.textContent)).toEqual(["B-7: 8 kip", "B-9: 5 kip"]);
    expect(byRole(root, "line-label").map((e) => e.textContent)).toEqual(["Office: 1.2 kip/ft"]);
  });

  it("labels the largest sagging and hogging moments at the hand-statics positions", () => {
    const sag = extreme(root, "max-sagging");
    expect(rel(numAttr(sag, "data-value"), M_10)).toBeLessThan(1e-9);
    expect(numAttr(sag, "data-x")).toBeCloseTo(10, 9);
    expect(sag.textContent).toBe("96.6 kip-ft");
    const hog = extreme(root, "max-hogging");
    expect(rel(numAttr(hog, "data-value"), -30)).toBeLessThan(1e-9);
    expect(numAttr(hog, "data-x")).toBeCloseTo(24, 9);
    expect(hog.textContent).toBe("\u221230 kip-ft");
    const at = byRole(root, "extreme-at").map((e) => e.textContent);
    expect(at).toContain("at 10 ft");
    expect(at).toContain("at 24 ft");
  });

  it("labels the largest shear: R_A, anywhere on the unloaded stretch 0..4 ft", () => {
    const v = extreme(root, "max-shear");
    expect(rel(numAttr(v, "data-value"), R_A)).toBeLessThan(1e-9);
    expect(numAttr(v, "data-x")).toBeGreaterThanOrEqual(0);
    expect(numAttr(v, "data-x")).toBeLessThanOrEqual(4);
    expect(v.textContent).toBe("11.8 kip");
  });

  it("marks the zero crossings: shear at the point load and the support, moment at the inflection point", () => {
    const inPanel = (role: string): number[] => {
      const panel = byRole(root, role)[0] as SvgElement;
      return byRole(panel, "zero-crossing").map((e) => numAttr(e, "data-x"));
    };
    const shear = inPanel("shear");
    expect(shear).toHaveLength(2);
    expect(shear[0]).toBeCloseTo(10, 9);
    expect(shear[1]).toBeCloseTo(24, 9);
    const moment = inPanel("moment");
    expect(moment).toHaveLength(1);
    expect(rel(moment[0] as number, X_INFLECTION)).toBeLessThan(1e-9);
    expect(texts(byRole(root, "moment")[0] as SvgElement)).toContain("21.17");
  });

  it("draws supports, point loads, the line load and the dimension ticks to scale along the member", () => {
    const [x0, x1] = memberEnds(root);
    const toScale = (x: number): number => x0 + (x / 30) * (x1 - x0);
    for (const s of byRole(root, "support")) expect(numAttr(s, "data-draw-x")).toBeCloseTo(toScale(numAttr(s, "data-x")), 6);
    expect(byRole(root, "support").map((s) => numAttr(s, "data-x"))).toEqual([0, 24]);
    const p = byRole(root, "point-load");
    expect(p.map((e) => numAttr(e, "data-x"))).toEqual([10, 30]);
    for (const e of p) expect(numAttr(e, "data-draw-x")).toBeCloseTo(toScale(numAttr(e, "data-x")), 6);
    const shaft = allElements(p[0] as SvgElement).find((e) => e.tagName === "line") as SvgElement;
    expect(numAttr(shaft, "x1")).toBeCloseTo(toScale(10), 2);
    const band = allElements(byRole(root, "line-load")[0] as SvgElement).find((e) => e.tagName === "polygon") as SvgElement;
    const bandXs = polylinePoints(band).map(([x]) => x);
    expect(Math.min(...bandXs)).toBeCloseTo(toScale(4), 2);
    expect(Math.max(...bandXs)).toBeCloseTo(toScale(16), 2);
    const ticks = byRole(root, "station");
    expect(ticks.map((t) => numAttr(t, "data-x"))).toEqual([0, 4, 10, 16, 24, 30]);
    for (const t of ticks) expect(numAttr(t, "x1")).toBeCloseTo(toScale(numAttr(t, "data-x")), 2);
    expect(byRole(root, "station-label").map((e) => e.textContent)).toEqual(["0", "4", "10", "16", "24", "30 ft"]);
  });

  it("draws the moment curve with its peak over 10 ft and its hogging trough over the support", () => {
    const [x0, x1] = memberEnds(root);
    const toScale = (x: number): number => x0 + (x / 30) * (x1 - x0);
    const curve = byRole(byRole(root, "moment")[0] as SvgElement, "curve")[0] as SvgElement;
    const pts = polylinePoints(curve);
    const top = pts.reduce((a, b) => (b[1] < a[1] ? b : a));
    const bottom = pts.reduce((a, b) => (b[1] > a[1] ? b : a));
    expect(top[0]).toBeCloseTo(toScale(10), 1);
    expect(bottom[0]).toBeCloseTo(toScale(24), 1);
    // Sagging drawn up: the peak is above the axis, the trough below it.
    const axisY = numAttr(byRole(byRole(root, "moment")[0] as SvgElement, "axis")[0] as SvgElement, "y1");
    expect(top[1]).toBeLessThan(axisY);
    expect(bottom[1]).toBeGreaterThan(axisY);
  });

  it("is a self-contained SVG that scales to the pane: viewBox 320 wide, width 100%, no height", () => {
    expect(root.tagName).toBe("svg");
    expect(root.getAttribute("viewBox")).toMatch(/^0 0 320 \d+(\.\d+)?$/);
    expect(root.getAttribute("width")).toBe("100%");
    expect(Array.from(root.attributes).map((a) => a.name)).not.toContain("height");
    expect(byRole(root, "deflection")).toHaveLength(0);
    expect(byRole(root, "notice")).toHaveLength(1);
  });
});

/**
 * Deflection of OVERHANG_BEAM by an independent route: EI v'' = -M (v down +) integrated
 * numerically (trapezoid rule, 60 000 steps) from the hand-statics moment, with v = 0 at both pins.
 */
function handDeflectionKipFt3(): { x: number[]; v: number[] } {
  const n = 60000;
  const h = 30 / n;
  const mac = (x: number, a: number): number => Math.max(0, x - a);
  const m = (x: number): number => R_A * x - (1.2 * mac(x, 4) ** 2) / 2 + (1.2 * mac(x, 16) ** 2) / 2 - 8 * mac(x, 10) + R_B * mac(x, 24);
  const xs = Array.from({ length: n + 1 }, (_, i) => i * h);
  const slope = [0];
  for (let i = 1; i <= n; i++) slope.push((slope[i - 1] as number) - ((m(xs[i - 1] as number) + m(xs[i] as number)) / 2) * h);
  const v0 = [0];
  for (let i = 1; i <= n; i++) v0.push((v0[i - 1] as number) + (((slope[i - 1] as number) + (slope[i] as number)) / 2) * h);
  const iB = Math.round(24 / h);
  const c = -(v0[iB] as number) / 24; // add c*x so that v(24) = 0; v(0) = 0 already
  return { x: xs, v: v0.map((v, i) => v + c * (xs[i] as number)) };
}

describe("deflected shape", () => {
  it("labels the largest downward and upward deflections of the overhang beam as a numerical integration gives them", () => {
    const root = sheet(OVERHANG_BEAM_EI);
    const ei = OVERHANG_BEAM_EI.ei as number;
    const { x, v } = handDeflectionKipFt3();
    let iDown = 0;
    v.forEach((vi, i) => {
      if (vi > (v[iDown] as number)) iDown = i;
    });
    const down = extreme(root, "max-down");
    expect(rel(numAttr(down, "data-value"), ((v[iDown] as number) / ei) * 12)).toBeLessThan(1e-6);
    expect(Math.abs(numAttr(down, "data-x") - (x[iDown] as number))).toBeLessThan(2e-3);
    const up = extreme(root, "max-up");
    expect(numAttr(up, "data-x")).toBeCloseTo(30, 9);
    expect(rel(numAttr(up, "data-value"), ((v[v.length - 1] as number) / ei) * 12)).toBeLessThan(1e-6);
    expect(numAttr(up, "data-value")).toBeLessThan(0);
    expect(texts(root).some((t) => t.startsWith("EI ") || t.includes(" EI "))).toBe(true);
  });

  it("simple beam under uniform load: 5wL^4/384EI at midspan and wL^2/8 (AISC Steel Construction Manual, Table 3-23, case 1; recalled from memory)", () => {
    const w = 1.5;
    const L = 20;
    const ei = flexuralRigidityKipFt2(29000, 510);
    const root = sheet({
      mark: "B-1",
      span: L,
      units: US_UNITS,
      caseLabel: "D",
      supports: [
        { x: 0, type: "pin" },
        { x: L, type: "pin" },
      ],
      lines: [{ start: 0, end: L, w1: w, w2: w }],
      points: [],
      moments: [],
      ei,
    });
    const down = extreme(root, "max-down");
    expect(rel(numAttr(down, "data-value"), ((5 * w * L ** 4) / (384 * ei)) * 12)).toBeLessThan(1e-9);
    expect(numAttr(down, "data-x")).toBeCloseTo(L / 2, 6);
    expect(rel(numAttr(extreme(root, "max-sagging"), "data-value"), (w * L * L) / 8)).toBeLessThan(1e-9);
    expect(extreme(root, "max-sagging").textContent).toBe("75 kip-ft");
    expect(byRole(root, "extreme").filter((e) => e.getAttribute("data-kind") === "max-hogging")).toHaveLength(0);
    expect(byRole(root, "extreme").filter((e) => e.getAttribute("data-kind") === "max-up")).toHaveLength(0);
  });

  it("cantilever: reaction, fixed-end couple and tip deflection PL^3/3EI + wL^4/8EI (cantilever closed forms, recalled from memory)", () => {
    const root = sheet(CANTILEVER);
    // Statics: R = 0.5*8 + 6 = 10 kip; the loads turn clockwise about the wall by 6*8 + 4*4 = 64 kip-ft,
    // so the wall's couple is 64 kip-ft counter-clockwise (+).
    const r = byRole(root, "reaction");
    expect(rel(numAttr(r[0] as SvgElement, "data-value"), 10)).toBeLessThan(1e-9);
    const c = byRole(root, "reaction-moment");
    expect(c).toHaveLength(1);
    expect(rel(numAttr(c[0] as SvgElement, "data-value"), 64)).toBeLessThan(1e-9);
    expect(c[0]?.textContent).toBe("64 kip-ft ccw");
    expect(rel(numAttr(extreme(root, "max-hogging"), "data-value"), -64)).toBeLessThan(1e-9);
    expect(numAttr(extreme(root, "max-hogging"), "data-x")).toBeCloseTo(0, 9);
    const ei = CANTILEVER.ei as number;
    const tip = ((6 * 8 ** 3) / (3 * ei) + (0.5 * 8 ** 4) / (8 * ei)) * 12;
    const down = extreme(root, "max-down");
    expect(rel(numAttr(down, "data-value"), tip)).toBeLessThan(1e-9);
    expect(numAttr(down, "data-x")).toBeCloseTo(8, 9);
    // Fixed support: a wall with hatching, not a triangle.
    const support = byRole(root, "support")[0] as SvgElement;
    expect(support.getAttribute("data-type")).toBe("fixed");
    expect(allElements(support).filter((e) => e.tagName === "line").length).toBeGreaterThanOrEqual(6);
    expect(allElements(support).filter((e) => e.tagName === "polygon" && e.getAttribute("fill") === "#ffffff")).toHaveLength(0);
  });
});

describe("bad input", () => {
  it("draws the engine's message instead of throwing when the member cannot stand", () => {
    const svg = renderMemberSheet({ ...OVERHANG_BEAM, supports: [{ x: 0, type: "pin", label: "C-4" }] });
    const root = parseSvg(svg);
    const msg = byRole(root, "error")
      .map((e) => e.textContent)
      .join(" ");
    expect(msg).toMatch(/^Cannot draw this member: supports/);
    expect(byRole(root, "free-body")).toHaveLength(0);
  });

  it("does not change its input", () => {
    const frozen = structuredClone(OVERHANG_BEAM_EI);
    const deepFreeze = (o: unknown): void => {
      if (o !== null && typeof o === "object") {
        Object.freeze(o);
        for (const v of Object.values(o)) deepFreeze(v);
      }
    };
    deepFreeze(frozen);
    expect(() => renderMemberSheet(frozen)).not.toThrow();
    expect(frozen).toEqual(OVERHANG_BEAM_EI);
  });
});
