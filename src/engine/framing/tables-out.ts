/**
 * A derivation written as the takedown's own tables: the rows of the generated sheets `Plan
 * members` (the Members headers plus the snapped plan coordinates X1 Y1 X2 Y2), `Plan loads`
 * (the Loads headers: one `area` row per tributary piece, with End width where the width varies)
 * and `Plan bearings` (a member continuous over what it crosses). Values only: the takedown is
 * then built from these tables exactly as from typed ones. Also the JSON `derived` record of each
 * member (docs/interface.md).
 */
import type { CellValue, UnitSystem } from "../takedown/types";
import { PASSED_THROUGH } from "./specs";
import type { Derivation, DerivedMember } from "./types";

/** Names of the generated plan sheets. */
export const PLAN_SHEETS = { members: "Plan members", loads: "Plan loads", bearings: "Plan bearings" } as const;

/**
 * The user's Loads rows in the order of the `Plan loads` columns (Mark, Kind, Zone or case,
 * Magnitude, Width, From, To, End width, End magnitude, Derived from), so that loads the plan
 * cannot give (a stair's point loads, a drift) join the derived ones.
 * @param data - the Loads table as read
 * @param columns - where each of its columns is (indices into its rows), from the header matching
 * @param rows - indices of its body rows
 */
export function userLoadRows(data: { readonly sheet: string; readonly top: number; readonly values: readonly (readonly CellValue[])[] }, columns: Readonly<Partial<Record<string, number>>>, rows: readonly number[]): CellValue[][] {
  const keys = ["mark", "kind", "zoneOrCase", "magnitude", "width", "from", "to", "endWidth", "endMagnitude"];
  return rows.map((r) => [...keys.map((k) => (columns[k] === undefined ? null : (data.values[r]![columns[k]!] ?? null))), `${data.sheet} row ${data.top + r + 1}`]);
}

/** The rows of the three generated tables, header row first. */
export interface PlanTableRows {
  readonly members: CellValue[][];
  readonly loads: CellValue[][];
  /** Header row only when nothing bears on a crossing member. */
  readonly bearings: CellValue[][];
}

/** Unit words of the headers. */
const UNITS: Readonly<Record<UnitSystem, { length: string; line: string }>> = {
  US: { length: "ft", line: "plf" },
  SI: { length: "m", line: "kN/m" },
};

/**
 * A length written to the generated table: round-off below 1e-12 of the plan's size cleaned so
 * that a snapped 12.000000000000002 reads 12 (the takedown's results differ by far less than 1e-9).
 */
function clean(x: number): number {
  const r = Math.round(x * 1e9) / 1e9;
  return Math.abs(r - x) < 1e-11 * Math.max(1, Math.abs(x)) ? r : x;
}

/** True when the width varies along a piece (beyond round-off): only then is End width written. */
function varies(width: number, endWidth: number): boolean {
  return Math.abs(width - endWidth) > 1e-9 * Math.max(1, Math.abs(width), Math.abs(endWidth));
}

function memberRow(m: DerivedMember): CellValue[] {
  const spanning = m.type !== "column" && m.type !== "foundation";
  const n = (x: number | null): CellValue => (x === null ? null : clean(x));
  const extra = PASSED_THROUGH.map((k) => m.extra[k] ?? null);
  const [kll, ...loads] = extra;
  return [
    m.mark,
    m.type,
    m.level === "" ? null : m.level,
    m.type === "foundation" ? null : n(m.span),
    null,
    null,
    m.startSupport,
    // a column standing on a beam of the level below (a transfer) gives its position along it
    m.type === "foundation" ? null : n(m.startAt),
    spanning ? m.endSupport : null,
    spanning ? n(m.endAt) : null,
    kll ?? null,
    ...loads,
    clean(m.x1),
    clean(m.y1),
    spanning ? clean(m.x2) : null,
    spanning ? clean(m.y2) : null,
  ];
}

/**
 * The generated tables of a derivation.
 * @param d - the derivation
 * @param units - unit system of the plan (header units)
 */
export function planTableRows(d: Derivation, units: UnitSystem, extraLoads: readonly CellValue[][] = []): PlanTableRows {
  const u = UNITS[units];
  const lineCols = PASSED_THROUGH.slice(1).map((k) => `${k} (${u.line})`);
  const members: CellValue[][] = [
    [
      "Mark",
      "Type",
      "Level",
      `Span (${u.length})`,
      "Zone",
      `Trib (${u.length})`,
      "Start support",
      `Start at (${u.length})`,
      "End support",
      `End at (${u.length})`,
      "KLL",
      ...lineCols,
      `X1 (${u.length})`,
      `Y1 (${u.length})`,
      `X2 (${u.length})`,
      `Y2 (${u.length})`,
    ],
    ...d.members.map(memberRow),
  ];
  const loads: CellValue[][] = [["Mark", "Kind", "Zone or case", "Magnitude", `Width (${u.length})`, `From (${u.length})`, `To (${u.length})`, `End width (${u.length})`, "End magnitude", "Derived from"]];
  for (const m of d.members) {
    for (const p of m.tributary) {
      loads.push([m.mark, "area", p.zone, null, clean(p.width), clean(p.from), clean(p.to), varies(p.width, p.endWidth) ? clean(p.endWidth) : null, null, `deck ${p.area}`]);
    }
  }
  loads.push(...extraLoads);
  const bearings: CellValue[][] = [["Mark", "Support", `At (${u.length})`, `Support at (${u.length})`], ...d.bearings.map((b) => [b.mark, b.support, clean(b.at), b.supportAt === null ? null : clean(b.supportAt)])];
  return { members, loads, bearings };
}

/** One member's `derived` record of the takedown JSON. */
export interface DerivedJson {
  readonly supports: readonly { readonly support: string; readonly at: number; readonly supportAt: number | null }[];
  readonly span: number | null;
  readonly tributary: readonly { readonly zone: string; readonly from: number; readonly to: number; readonly width: number; readonly endWidth: number }[];
  readonly tributaryArea: number;
}

/**
 * The JSON `derived` records: per member, what holds it up (each end and, for a continuous
 * member, each bearing, in order along it: `at` along this member, `supportAt` along the support),
 * its span, its tributary pieces and their total area.
 * @param d - the derivation
 */
export function derivedJson(d: Derivation): Record<string, DerivedJson> {
  const out: Record<string, DerivedJson> = Object.create(null) as Record<string, DerivedJson>;
  for (const m of d.members) {
    const spanning = m.type !== "column" && m.type !== "foundation";
    const supports: DerivedJson["supports"][number][] = [];
    if (m.startSupport !== null) supports.push({ support: m.startSupport, at: 0, supportAt: m.startAt });
    if (spanning) {
      for (const b of d.bearings.filter((x) => x.mark === m.mark).sort((a, b2) => a.at - b2.at)) supports.push({ support: b.support, at: b.at, supportAt: b.supportAt });
      if (m.endSupport !== null) supports.push({ support: m.endSupport, at: m.span ?? 0, supportAt: m.endAt });
    }
    out[m.mark] = {
      supports,
      span: m.span,
      tributary: m.tributary.map((p) => ({ zone: p.zone, from: p.from, to: p.to, width: p.width, endWidth: p.endWidth })),
      tributaryArea: m.tributaryArea,
    };
  }
  return out;
}
