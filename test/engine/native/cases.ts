/**
 * Random simple-span members for the native-formula checks (fast-check arbitraries) and the
 * comparison with the exact solver. Test-only code.
 */
import fc from "fast-check";
import { solveBeam } from "../../../src/engine/beam";
import type { LineLoad, PointLoad } from "../../../src/engine/beam/types";
import { modelOf, type MemberCase } from "./member-sheet";

/** Round to a few decimals, like numbers typed into a sheet (keeps positions distinct and readable). */
function r3(x: number): number {
  return Math.round(x * 1000) / 1000;
}

const fraction = fc.double({ min: 0, max: 1, noNaN: true });

/** Arbitrary member: span 2..60, two pins (ends, or inside with overhangs), up to 4 line and 4 point loads. */
export const memberCase: fc.Arbitrary<MemberCase> = fc
  .record({
    span: fc.double({ min: 2, max: 60, noNaN: true }),
    overhang: fc.boolean(),
    pinA: fc.double({ min: 0, max: 0.3, noNaN: true }),
    pinB: fc.double({ min: 0.6, max: 1, noNaN: true }),
    lines: fc.array(
      fc.record({
        a: fraction,
        b: fraction,
        full: fc.boolean(),
        w1: fc.double({ min: -1, max: 5, noNaN: true }),
        w2: fc.double({ min: -1, max: 5, noNaN: true }),
        uniform: fc.boolean(),
      }),
      { maxLength: 4 },
    ),
    points: fc.array(fc.record({ x: fraction, p: fc.double({ min: -3, max: 25, noNaN: true }) }), { maxLength: 4 }),
    mixedBlock: fc.boolean(),
  })
  .map((g) => {
    const span = r3(g.span);
    const leftPin = g.overhang ? r3(g.pinA * span) : 0;
    const rightPin = g.overhang ? r3(g.pinB * span) : span;
    const lines: LineLoad[] = g.lines.map((l) => {
      let a = l.full ? 0 : r3(Math.min(l.a, l.b) * span);
      let b = l.full ? span : r3(Math.max(l.a, l.b) * span);
      if (b - a < 0.01) {
        a = 0;
        b = span;
      }
      const w1 = r3(l.w1);
      return { kind: "line", start: a, end: b, w1, w2: l.uniform ? w1 : r3(l.w2) };
    });
    const points: PointLoad[] = g.points.map((p) => ({ kind: "point", x: r3(p.x * span), p: r3(p.p) }));
    return { span, leftPin: Math.min(leftPin, rightPin - 0.5), rightPin, lines, points, mixedBlock: g.mixedBlock };
  });

/** The exact solver's results for a case, in the shape the sheet reports. */
export interface ExpectedResults {
  readonly left: number;
  readonly right: number;
  readonly momentMax: number;
  readonly momentMin: number;
  readonly shearMax: number;
  readonly total: number;
  /** Sum of the magnitudes of all load resultants (force), for the rounding-noise floor. */
  readonly absLoad: number;
  /** Length of the member. */
  readonly span: number;
}

/** Solve a case with the project's exact solver (src/engine/beam). */
export function solved(c: MemberCase): ExpectedResults {
  const r = solveBeam(modelOf(c));
  if (!r.ok) throw new Error(r.error.message);
  const s = r.value;
  const total = c.lines.reduce((t, l) => t + ((l.w1 + l.w2) * (l.end - l.start)) / 2, 0) + c.points.reduce((t, p) => t + p.p, 0);
  const absLoad = c.lines.reduce((t, l) => t + (Math.abs(l.w1) + Math.abs(l.w2)) * (l.end - l.start) / 2, 0) + c.points.reduce((t, p) => t + Math.abs(p.p), 0);
  return {
    absLoad,
    span: c.span,
    left: s.reactions[0]!,
    right: s.reactions[1]!,
    momentMax: s.maxSagging().value,
    momentMin: s.maxHogging().value,
    shearMax: s.maxShear().value,
    total,
  };
}

/**
 * |got - want| <= rel x scale + noise, where scale is the largest magnitude of that kind of result
 * on the member (a value that is nearly zero next to the member's other results of its kind is
 * compared at the member's scale, not its own) and noise is a rounding floor far below the
 * tolerance (1e-12 of the loads' magnitudes times the span for moments).
 */
export function closeAt(got: unknown, want: number, scale: number, noise: number, rel = 1e-9): boolean {
  return typeof got === "number" && Math.abs(got - want) <= rel * Math.max(Math.abs(want), scale) + noise;
}

/** The results compared. */
export const CHECKED = ["left", "right", "momentMax", "momentMin", "shearMax", "total"] as const;
type Checked = (typeof CHECKED)[number];

/** Compare one member's sheet results with the solver's; returns the mismatches as text. */
export function mismatches(got: Record<Checked, unknown>, want: ExpectedResults, rel = 1e-9): string[] {
  const forces = Math.max(Math.abs(want.left), Math.abs(want.right), Math.abs(want.shearMax));
  const moments = Math.max(Math.abs(want.momentMax), Math.abs(want.momentMin));
  const scaleOf: Record<Checked, number> = {
    left: forces,
    right: forces,
    shearMax: forces,
    total: forces,
    momentMax: moments,
    momentMin: moments,
  };
  const out: string[] = [];
  for (const k of CHECKED) {
    const noise = 1e-12 * want.absLoad * (k === "momentMax" || k === "momentMin" ? want.span : 1);
    if (!closeAt(got[k], want[k], scaleOf[k], noise, rel)) out.push(`${k}: sheet ${String(got[k])}, solver ${want[k]}`);
  }
  return out;
}
