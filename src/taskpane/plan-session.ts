/**
 * The pane's part of a takedown from a framing plan, without React: find the plan tables (Framing,
 * Decks, Grids, Levels) by their headers, build the takedown from them (the derived tables on the
 * generated Plan sheets), count what was derived, and tell whether the plan changed since the
 * last derivation (a fingerprint of the plan tables kept in the workbook settings).
 */
import { DECKS_SPEC, FRAMING_SPEC, GRIDS_SPEC, LEVELS_SPEC, type Derivation } from "../engine/framing";
import { splitHeader, type TableSpec } from "../engine/takedown/tables";
import { buildPlanTakedown, type PlanTableNames } from "../workbook/plan-build";
import type { TableInfo, WorkbookPort } from "../workbook/port";
import type { TakedownBuildResult, UnitSystem } from "../workbook/takedown-api";

/** Workbook setting holding the fingerprint of the plan tables at the last derivation. */
export const PLAN_FINGERPRINT_KEY = "loadpath.planFingerprint";

/** True when a table's header cells carry every required column of a spec (by name, units ignored). */
function fits(spec: TableSpec<string>, headers: readonly string[]): boolean {
  const names = new Set(headers.map((h) => splitHeader(h).name));
  return Object.values(spec.columns).every((c) => !c.required || names.has(splitHeader(c.header).name));
}

/**
 * The plan tables of a workbook, found by their headers (first fitting table of each), or null
 * when it has no Framing table. Framing is looked for first (its columns are the most specific).
 * @param tables - the workbook's tables, as the pane lists them
 */
export function findPlanTables(tables: readonly TableInfo[]): PlanTableNames | null {
  const taken = new Set<string>();
  const pick = (spec: TableSpec<string>): string | undefined => {
    const t = tables.find((x) => !taken.has(x.name) && fits(spec, x.headers));
    if (t) taken.add(t.name);
    return t?.name;
  };
  const framing = pick(FRAMING_SPEC);
  if (framing === undefined) return null;
  const decks = pick(DECKS_SPEC);
  const levels = pick(LEVELS_SPEC);
  const grids = pick(GRIDS_SPEC);
  return { framing, ...(decks ? { decks } : {}), ...(grids ? { grids } : {}), ...(levels ? { levels } : {}) };
}

/** What the derivation found, as the pane shows it. */
export interface DerivedCounts {
  /** Derived rows by type ("beam" -> 12). */
  readonly byType: Readonly<Record<string, number>>;
  readonly bearings: number;
  /** Tributary pieces (Plan loads rows from the decks). */
  readonly pieces: number;
  /** Foundations the derivation added under columns with nothing below (F-<mark>). */
  readonly addedFoundations: number;
}

/** Count a derivation's rows. */
export function derivedCounts(d: Derivation): DerivedCounts {
  const byType: Record<string, number> = {};
  for (const m of d.members) byType[m.type] = (byType[m.type] ?? 0) + 1;
  const framingMarks = new Set(d.members.filter((m) => !(m.type === "foundation" && m.mark.startsWith("F-"))).map((m) => m.mark));
  return {
    byType,
    bearings: d.bearings.length,
    pieces: d.members.reduce((n, m) => n + m.tributary.length, 0),
    addedFoundations: d.members.length - framingMarks.size,
  };
}

/** A short fingerprint (FNV-1a, 32 bits, hex) of the plan tables' cells. */
export async function planFingerprint(port: WorkbookPort, names: PlanTableNames): Promise<string> {
  let h = 0x811c9dc5;
  for (const ref of [names.framing, names.decks, names.grids, names.levels]) {
    const text = ref === undefined ? "-" : JSON.stringify((await port.readTable(ref)).values);
    for (let i = 0; i < text.length; i++) {
      h ^= text.charCodeAt(i);
      h = Math.imul(h, 0x01000193) >>> 0;
    }
    h ^= 0x7c; // separator between tables
  }
  return h.toString(16).padStart(8, "0");
}

/**
 * True when the plan tables differ from what the last derivation read (false when none was made:
 * then there is nothing to be out of date).
 */
export async function planChanged(port: WorkbookPort, names: PlanTableNames): Promise<boolean> {
  const saved = await port.getSetting(PLAN_FINGERPRINT_KEY);
  return saved !== null && saved !== "" && saved !== (await planFingerprint(port, names));
}

/** A takedown built from the plan, with what was derived. */
export interface PlanRun {
  readonly result: TakedownBuildResult;
  readonly counts: DerivedCounts | null;
}

/**
 * Build the takedown from the plan (derived tables on the Plan sheets, then the takedown sheet),
 * and remember the plan's fingerprint.
 * @param port - the workbook
 * @param names - the plan tables, and the user's Loads table if any
 * @param options - the Zones table, units, generated sheet's name, hand-off version, replacing a user's sheet
 */
export async function runPlan(
  port: WorkbookPort,
  names: PlanTableNames,
  options: { readonly zones: string; readonly units: UnitSystem; readonly sheetName: string; readonly native?: boolean; readonly replaceForeign?: boolean },
): Promise<PlanRun> {
  const fingerprint = await planFingerprint(port, names);
  const planned = await buildPlanTakedown(port, names, {
    zones: options.zones,
    units: options.units,
    sheetName: options.sheetName,
    ...(options.native ? { native: true } : {}),
    ...(options.replaceForeign ? { replaceForeign: true } : {}),
  });
  if (planned.derivation !== null) await port.setSetting(PLAN_FINGERPRINT_KEY, fingerprint);
  return { result: planned.result, counts: planned.derivation ? derivedCounts(planned.derivation) : null };
}
