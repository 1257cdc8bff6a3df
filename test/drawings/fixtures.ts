/**
 * Invented members drawn by the diagram tests and rendered for review in Chromium. Marks and
 * numbers are made up; none describes a real building.
 */
import type { LoadPathBranch, LoadPathTree } from "../../src/drawings/load-path-types";
import { flexuralRigidityKipFt2, flexuralRigidityKnM2, type MemberDrawing, SI_UNITS, US_UNITS } from "../../src/drawings/types";

/** A mark that would run a script if it were ever written as markup. */
export const HOSTILE_MARK = "<img src=x onerror=alert(1)>";

/**
 * Beam with a partial line load, an overhang and two received point loads: pins at 0 and 24 ft,
 * 30 ft long, 1.2 kip/ft from 4 to 16 ft, 8 kip from B-7 at 10 ft, 5 kip from B-9 at the tip.
 */
export const OVERHANG_BEAM: MemberDrawing = {
  mark: "B-12",
  memberType: "beam",
  level: "3",
  span: 30,
  units: US_UNITS,
  caseLabel: "D",
  supports: [
    { x: 0, type: "pin", label: "C-4" },
    { x: 24, type: "pin", label: "G-2 @ 12.5 ft" },
  ],
  lines: [{ start: 4, end: 16, w1: 1.2, w2: 1.2, label: "Office" }],
  points: [
    { x: 10, p: 8, from: "B-7" },
    { x: 30, p: 5, from: "B-9" },
  ],
  moments: [],
};

/** The same beam with its stiffness, for the deflected shape (W-shape-like I = 800 in⁴, E = 29000 ksi). */
export const OVERHANG_BEAM_EI: MemberDrawing = { ...OVERHANG_BEAM, ei: flexuralRigidityKipFt2(29000, 800) };

/** Cantilever from a wall: fixed at 0, 8 ft, 0.5 kip/ft full length and 6 kip from B-3 at the tip. */
export const CANTILEVER: MemberDrawing = {
  mark: "B-20",
  memberType: "beam",
  span: 8,
  units: US_UNITS,
  caseLabel: "1.2D + 1.6L",
  supports: [{ x: 0, type: "fixed", label: "W-1" }],
  lines: [{ start: 0, end: 8, w1: 0.5, w2: 0.5 }],
  points: [{ x: 8, p: 6, from: "B-3" }],
  moments: [],
  ei: flexuralRigidityKipFt2(29000, 350),
};

/** Two-span SI girder: fixed at a wall, two pins, trapezoidal load, coincident point loads, a couple. */
export const SI_GIRDER: MemberDrawing = {
  mark: "G-21",
  memberType: "girder",
  level: "Roof",
  span: 9,
  units: SI_UNITS,
  caseLabel: "1.2D + 1.6L",
  supports: [
    { x: 0, type: "fixed", label: "Core wall W-1" },
    { x: 6.5, type: "pin", label: "C-12" },
    { x: 9, type: "pin", label: "G-2 @ 4.2 m" },
  ],
  lines: [
    { start: 0, end: 6.5, w1: 5, w2: 12, label: "Plant room" },
    { start: 0, end: 9, w1: 3, w2: 3 },
  ],
  points: [
    { x: 2.0, p: 18, from: "B-31" },
    { x: 2.4, p: 22, from: "B-32" },
    { x: 2.4, p: 7, from: "B-33" },
    { x: 7.8, p: 15, from: "B-40" },
  ],
  moments: [{ x: 4, m: 10, from: "bracket" }],
  ei: flexuralRigidityKnM2(200000, 2.5e8),
};

/** A girder receiving a beam every 2.5 ft: crowded labels. */
export const CROWDED_GIRDER: MemberDrawing = {
  mark: "G-7",
  memberType: "girder",
  span: 25,
  units: US_UNITS,
  caseLabel: "L",
  supports: [
    { x: 0, type: "pin", label: "C-1" },
    { x: 25, type: "pin", label: "C-2" },
  ],
  lines: [{ start: 0, end: 25, w1: 0.08, w2: 0.08, label: "self" }],
  points: Array.from({ length: 9 }, (_, i) => ({ x: 2.5 * (i + 1), p: 6 + (i % 3), from: `B-${101 + i}` })),
  moments: [],
};

/** Marks from hostile or careless cells: markup, a long name, control characters. */
export const HOSTILE_DRAWING: MemberDrawing = {
  ...OVERHANG_BEAM,
  mark: HOSTILE_MARK,
  memberType: "<script>alert(1)</script>",
  caseLabel: 'D" onload="alert(1)',
  supports: [
    { x: 0, type: "pin", label: HOSTILE_MARK },
    { x: 24, type: "pin", label: "a very long support description that never ends \u0007 & more" },
  ],
  points: [
    { x: 10, p: 8, from: "<b>B-7</b>" },
    { x: 30, p: 5, from: "B-9 & 'friends'" },
  ],
};

const zone = (mark: string, w: number): LoadPathBranch => ({ mark, memberType: "zone", value: w, unit: "kip/ft", note: "trib 8 ft", children: [] });

/** Load path of a girder: two beams with their zones above, two column stacks below. */
export const GIRDER_PATH: LoadPathTree = {
  mark: "G-2",
  memberType: "girder",
  level: "3",
  caseLabel: "D",
  units: { force: "kip", length: "ft" },
  upstream: [
    { mark: "B-7", memberType: "beam", value: 12.4, at: 10, children: [zone("Office", 0.52)] },
    { mark: "B-8", memberType: "beam", value: 12.4, at: 20, children: [zone("Office", 0.52), zone("Corridor", 0.8)] },
  ],
  downstream: [
    {
      mark: "C-4",
      memberType: "column",
      value: 15.3,
      note: "start",
      children: [{ mark: "C-4 L2", memberType: "column", value: 48.1, children: [{ mark: "F-4", memberType: "foundation", value: 96.2, children: [] }] }],
    },
    { mark: "C-5", memberType: "column", value: 15.3, note: "end", children: [{ mark: "F-5", memberType: "foundation", value: 80, children: [] }] },
  ],
};

/** Every member sheet rendered for review, by file name. */
export const REVIEW_SHEETS: Readonly<Record<string, MemberDrawing>> = {
  "overhang-beam": OVERHANG_BEAM_EI,
  cantilever: CANTILEVER,
  "si-girder": SI_GIRDER,
  "crowded-girder": CROWDED_GIRDER,
  "hostile-marks": HOSTILE_DRAWING,
};
