/**
 * Random takedown-like members for the uniform-load generator: one mixed block per member
 * (`kind | from | loaded length | magnitude of case 1 | case 2 | case 3`, blank from = 0, a spare
 * blank row), uniform line loads (full or partial) and point loads whose positions every case
 * shares, laid out many to a sheet; and what the exact solver gives for each case. Test-only code.
 */
import fc from "fast-check";
import { solveBeam } from "../../../src/engine/beam";
import type { BeamLoad } from "../../../src/engine/beam/types";
import { cellRef, columnRangeRef } from "../../../src/engine/native/refs";
import type { NativeCell } from "../../../src/engine/native/simple-span";
import { uniformCaseRefs, uniformExtremesBlock, type UniformSpanGeometry } from "../../../src/engine/native/uniform-span";

/** One load row: a line (from, length) or a point (at = from), with a magnitude per case (null = blank). */
export interface UniformRow {
  readonly kind: "line" | "point";
  readonly from: number;
  readonly length: number;
  readonly magnitudes: readonly (number | null)[];
}

/** A member with its load rows, three cases. */
export interface UniformMember {
  readonly span: number;
  readonly leftPin: number;
  readonly rightPin: number;
  readonly rows: readonly UniformRow[];
}

export const CASES = 3;

function r3(x: number): number {
  return Math.round(x * 1000) / 1000;
}

const magnitude = fc.oneof(fc.constant(null), fc.double({ min: -2, max: 30, noNaN: true }).map(r3));

/** Arbitrary member: span 2..50, end pins or pins inside (overhangs), up to 6 load rows. */
export const uniformMember: fc.Arbitrary<UniformMember> = fc
  .record({
    span: fc.double({ min: 2, max: 50, noNaN: true }),
    overhang: fc.boolean(),
    a: fc.double({ min: 0, max: 0.3, noNaN: true }),
    b: fc.double({ min: 0.6, max: 1, noNaN: true }),
    rows: fc.array(
      fc.record({
        point: fc.boolean(),
        full: fc.boolean(),
        p: fc.double({ min: 0, max: 1, noNaN: true }),
        q: fc.double({ min: 0, max: 1, noNaN: true }),
        magnitudes: fc.array(magnitude, { minLength: CASES, maxLength: CASES }),
      }),
      { minLength: 1, maxLength: 6 },
    ),
  })
  .map((g) => {
    const span = r3(g.span);
    const rightPin = g.overhang ? r3(g.b * span) : span;
    const leftPin = g.overhang ? Math.min(r3(g.a * span), rightPin - 0.5) : 0;
    const rows: UniformRow[] = g.rows.map((r) => {
      if (r.point) return { kind: "point", from: r3(r.p * span), length: 0, magnitudes: r.magnitudes };
      if (r.full) return { kind: "line", from: 0, length: span, magnitudes: r.magnitudes };
      const a = r3(Math.min(r.p, r.q) * span);
      const b = Math.max(r3(Math.max(r.p, r.q) * span), a + 0.01);
      return { kind: "line", from: a, length: r3(Math.min(b, span) - a), magnitudes: r.magnitudes };
    });
    return { span, leftPin, rightPin, rows };
  });

/** Result cells of one member, per case (A1 on the sheet). */
export interface UniformCells {
  readonly cases: readonly { readonly left: string; readonly right: string; readonly momentMax: string; readonly shearMax: string }[];
}

function put(rows: NativeCell[][], r: number, c: number, v: NativeCell): void {
  while (rows.length <= r) rows.push([]);
  const row = rows[r]!;
  while (row.length <= c) row.push(null);
  row[c] = v;
}

const bare = (ref: string): string => ref.slice(ref.indexOf("!") + 1).replace(/\$/g, "");

/** Lay the members out on a sheet: inputs in A..F, the helper block from column I. */
export function layOutUniform(sheet: string, members: readonly UniformMember[]): { rows: NativeCell[][]; cells: UniformCells[] } {
  const rows: NativeCell[][] = [];
  const cells: UniformCells[] = [];
  let r0 = 0;
  for (const m of members) {
    [`span`, m.span, "left pin", m.leftPin, "right pin", m.rightPin].forEach((v, j) => put(rows, r0, j, v));
    ["kind", "from", "loaded", "case 1", "case 2", "case 3"].forEach((v, j) => put(rows, r0 + 1, j, v));
    const first = r0 + 2;
    const n = m.rows.length + 1;
    m.rows.forEach((row, i) => {
      put(rows, first + i, 0, row.kind);
      if (row.from !== 0) put(rows, first + i, 1, row.from);
      if (row.kind === "line") put(rows, first + i, 2, row.length);
      row.magnitudes.forEach((v, k) => v !== null && put(rows, first + i, 3 + k, v));
    });
    const range = (col: number): string => columnRangeRef(sheet, first, col, n);
    const kind = range(0);
    const geometry: UniformSpanGeometry = {
      span: cellRef(sheet, r0, 1),
      leftPin: cellRef(sheet, r0, 3),
      rightPin: cellRef(sheet, r0, 5),
      lines: [{ start: range(1), length: range(2), rows: n, mask: `(${kind}="line")` }],
      points: [{ at: range(1), rows: n, mask: `(${kind}<>"line")` }],
    };
    const origin = { sheet, row: r0, col: 8 };
    const cases = Array.from({ length: CASES }, (_, k) => ({ lines: [range(3 + k)], points: [range(3 + k)], label: `case ${k + 1}` }));
    const block = uniformExtremesBlock(geometry, cases, origin);
    block.forEach((row, i) => row.forEach((v, j) => v !== null && put(rows, r0 + i, 8 + j, v)));
    cells.push({
      cases: cases.map((_, k) => {
        const refs = uniformCaseRefs(origin, k);
        return { left: bare(refs.left), right: bare(refs.right), momentMax: bare(refs.momentMax), shearMax: bare(refs.shearMax) };
      }),
    });
    r0 += Math.max(n + 2, block.length) + 1;
  }
  return { rows, cells };
}

/** The exact solver's results for case k of a member (the same four quantities). */
export function solvedCase(m: UniformMember, k: number): { left: number; right: number; momentMax: number; shearMax: number; absLoad: number } {
  const loads: BeamLoad[] = m.rows.map((r) => {
    const v = r.magnitudes[k] ?? 0;
    return r.kind === "point" ? { kind: "point", x: r.from, p: v } : { kind: "line", start: r.from, end: r.from + r.length, w1: v, w2: v };
  });
  const s = solveBeam({ span: m.span, supports: [{ x: m.leftPin, type: "pin" }, { x: m.rightPin, type: "pin" }], loads });
  if (!s.ok) throw new Error(s.error.message);
  const absLoad = m.rows.reduce((t, r) => t + Math.abs(r.magnitudes[k] ?? 0) * (r.kind === "line" ? r.length : 1), 0);
  return { left: s.value.reactions[0]!, right: s.value.reactions[1]!, momentMax: s.value.maxSagging().value, shearMax: Math.abs(s.value.maxShear().value), absLoad };
}

/** Mismatches of one member (all cases) beyond 1e-9 of the member's scale of that kind (plus a 1e-12 rounding floor). */
export function uniformMismatches(m: UniformMember, read: (a1: string) => unknown, cells: UniformCells): string[] {
  const bad: string[] = [];
  for (let k = 0; k < CASES; k++) {
    const want = solvedCase(m, k);
    const c = cells.cases[k]!;
    const forces = Math.max(Math.abs(want.left), Math.abs(want.right), want.shearMax);
    const checks: [string, string, number, number][] = [
      ["left", c.left, want.left, forces],
      ["right", c.right, want.right, forces],
      ["shearMax", c.shearMax, want.shearMax, forces],
      ["momentMax", c.momentMax, want.momentMax, Math.abs(want.momentMax)],
    ];
    for (const [name, a1, w, scale] of checks) {
      const got = read(a1);
      const floor = 1e-12 * want.absLoad * (name === "momentMax" ? m.span : 1);
      if (typeof got !== "number" || Math.abs(got - w) > 1e-9 * Math.max(Math.abs(w), scale) + floor) bad.push(`case ${k + 1} ${name} (${a1}): sheet ${String(got)}, solver ${w}`);
    }
  }
  return bad;
}
