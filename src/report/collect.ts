/**
 * Everything a calculation report needs from a built takedown, gathered through the workbook
 * port: the model and sheet plan (planned again from the same tables and options: planning is
 * pure, so this is the plan that was written), the checked load path, and the computed cells of
 * the generated sheet read back, from which every member's loads, supports and reactions come
 * (src/engine/takedown/member-loads.ts). The results read this way are compared with the build's
 * own JSON; a difference stops the report instead of printing numbers that disagree.
 */
import { createNativeWriter } from "../engine/native/takedown-writer";
import { checkPath, planTakedown, readResults, type SheetPlan, type TakedownModel } from "../engine/takedown";
import { loadsOfMembers, type MemberLoads } from "../engine/takedown/member-loads";
import { numberOf } from "../engine/takedown/cells";
import { isFlexural } from "../engine/takedown/model";
import { a1 } from "../engine/a1";
import { memberGoverningCached as memberGoverning } from "./factored";
import type { Problem } from "../workbook/takedown-api";
import { cellAddress, sheetRef } from "../workbook/a1";
import type { CellValue, RangeData, WorkbookPort } from "../workbook/port";
import type { CellRef, LoadCase } from "../engine/takedown/types";
import { DEFAULT_TAKEDOWN_SHEET, sheetTitle } from "../workbook/takedown-build";
import type { TakedownJson, TakedownOptions } from "../workbook/takedown-api";

/** A built takedown as the report reads it. */
export interface TakedownRecord {
  readonly options: TakedownOptions;
  readonly model: TakedownModel;
  readonly plan: SheetPlan;
  /** Levels from the top down. */
  readonly levels: readonly string[];
  /** The build's results (docs/interface.md section 4). */
  readonly json: TakedownJson;
  /** Every member's loads, supports and reactions, in takedown order. */
  readonly members: ReadonlyMap<string, MemberLoads>;
  /** The Zones table as read: each zone's area loads (psf or kPa) per case and its Reducible flag, in table order. */
  readonly zones: readonly ZoneLoads[];
}

/** One row of the Zones table as the report prints it (the load schedule). */
export interface ZoneLoads {
  readonly name: string;
  /** Area load of each case the zone has a value for (psf or kPa); a case absent here does not act on the zone. */
  readonly loads: Readonly<Partial<Record<LoadCase, number>>>;
  readonly reducible: boolean;
}

/** A zone's area loads read from the Zones table's cells (numbers stored as text read as numbers; anything else NaN). */
export function zoneLoadsOf(model: TakedownModel, table: RangeData): ZoneLoads[] {
  const at = (row: number, col: number): CellValue | undefined => table.values[row - table.top]?.[col - table.left];
  const valueOf = (v: CellValue | undefined): number => {
    const n = numberOf(v);
    return n.kind === "number" ? n.value : Number.NaN;
  };
  const zones = [...model.zones.values()].sort((a, b) => a.nameCell.row - b.nameCell.row);
  return zones.map((z) => {
    const loads: Partial<Record<LoadCase, number>> = {};
    for (const [c, cell] of Object.entries(z.loadCells) as [LoadCase, CellRef][]) loads[c] = valueOf(at(cell.row, cell.col));
    return { name: z.name, loads, reducible: z.reducible };
  });
}

/** Largest relative difference tolerated between the results read here and the build's JSON (both are the same cells). */
const SAME = 1e-12;

/** First difference between two JSON values (numbers within {@link SAME}), as a path; null when they agree. */
function difference(a: unknown, b: unknown, path: string): string | null {
  if (typeof a === "number" && typeof b === "number") {
    const same = a === b || (Number.isNaN(a) && Number.isNaN(b)) || Math.abs(a - b) <= SAME * Math.max(1, Math.abs(a), Math.abs(b));
    return same ? null : `${path}: ${a} and ${b}`;
  }
  if (typeof a !== "object" || typeof b !== "object" || a === null || b === null) return a === b ? null : `${path}: ${String(a)} and ${String(b)}`;
  const ka = Object.keys(a);
  const kb = Object.keys(b);
  if (ka.length !== kb.length || ka.some((k, i) => k !== kb[i])) return `${path}: keys ${ka.join(",")} and ${kb.join(",")}`;
  for (const k of ka) {
    const d = difference((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k], `${path}.${k}`);
    if (d !== null) return d;
  }
  return null;
}

/**
 * Gather the report's record of a takedown built on `port` with `options`.
 * @param port - the workbook the takedown was built in (its generated sheet computed)
 * @param options - the options it was built with
 * @param json - the build's results
 * @throws Error when a table cannot be read again or the sheet read back disagrees with `json`
 */
export async function collectTakedown(port: WorkbookPort, options: TakedownOptions, json: TakedownJson): Promise<TakedownRecord> {
  const sheet = options.sheetName ?? DEFAULT_TAKEDOWN_SHEET;
  const zones = await port.readTable(options.zones);
  const members = await port.readTable(options.members);
  const loads = options.loads ? await port.readTable(options.loads) : undefined;
  // The Bearings table too: without it a continuous member would be planned on its end supports only.
  const bearings = options.bearings ? await port.readTable(options.bearings) : undefined;
  const planned = planTakedown({
    zones,
    members,
    ...(loads ? { loads } : {}),
    ...(bearings ? { bearings } : {}),
    units: options.units,
    ...(options.mapping ? { mapping: options.mapping } : {}),
    ...(options.headerRows ? { headerRows: options.headerRows } : {}),
    sheet,
    title: sheetTitle(options),
    ...(options.native ? { writer: createNativeWriter({ sheet }) } : {}),
  });
  if (!planned.plan || !planned.model) throw new Error("the takedown's tables cannot be planned again for the report.");
  const { plan, model } = planned;
  const area = await port.readTable(`${sheetRef(sheet)}!A1:${cellAddress(Math.max(0, plan.cells.length - 1), plan.layout.width - 1)}`);
  const read = (row: number, col: number): CellValue | undefined => area.values[row - area.top]?.[col - area.left];
  const again = readResults(plan, model, read, json.problems);
  // a takedown from the framing plan also carries what was derived, which the sheet does not hold
  const { derived: _derived, ...built } = json;
  const diff = difference(again, built, "results");
  if (diff !== null) throw new Error(`the takedown sheet read back for the report disagrees with the build (${diff}).`);
  const path = checkPath(model);
  const memberLoads = loadsOfMembers({ model, plan, deliveries: path.deliveries, placedLoads: path.placedLoads, read });
  const gaps = reportGaps(plan, model, memberLoads, json.problems);
  return { options, model, plan, levels: planned.levels, json: gaps.length === 0 ? json : { ...json, problems: [...json.problems, ...gaps] }, members: memberLoads, zones: zoneLoadsOf(model, zones) };
}

/** First path in a value where a number is not finite (the report would print "?" there), or null. */
function firstNonFinite(value: unknown, path: string): string | null {
  if (typeof value === "number") return Number.isFinite(value) ? null : path;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const p = firstNonFinite(value[i], `${path}[${i}]`);
      if (p !== null) return p;
    }
    return null;
  }
  if (value !== null && typeof value === "object") {
    for (const k of Object.keys(value)) {
      const p = firstNonFinite((value as Record<string, unknown>)[k], `${path}.${k}`);
      if (p !== null) return p;
    }
  }
  return null;
}

/** Largest magnitude of the numbers in a value. */
function largest(value: unknown): number {
  if (typeof value === "number") return Math.abs(value);
  if (value !== null && typeof value === "object") return Math.max(0, ...Object.values(value as Record<string, unknown>).map(largest));
  return 0;
}

/**
 * Numbers the report prints that are not finite (it would show "?"): each member with one is a
 * listed problem at its row of the generated sheet, unless the build already listed the member's
 * results. The report never prints "?" silently.
 * @param plan - the plan written
 * @param model - the model
 * @param members - every member's loads, supports and reactions read back
 * @param listed - problems the build already listed
 */
export function reportGaps(plan: SheetPlan, model: TakedownModel, members: ReadonlyMap<string, MemberLoads>, listed: readonly Problem[]): Problem[] {
  const done = new Set(listed.filter((p) => p.code === "errorResult" && p.mark !== undefined).map((p) => p.mark!));
  const out: Problem[] = [];
  for (const place of plan.places) {
    const mark = model.members[place.member]!.mark;
    const m = members.get(mark);
    if (m === undefined || done.has(mark)) continue;
    const printed = {
      length: isFlexural(m.type) ? m.length : null,
      supports: m.supports.map((s) => s.x),
      loads: m.loads.map((l) => ({ magnitudes: l.magnitudes, width: l.width, start: l.start, end: l.end })),
      reactions: m.reactions,
      liveReduction: m.liveReduction,
    };
    let gap = firstNonFinite(printed, mark);
    if (gap === null && isFlexural(m.type)) {
      const g = memberGoverning(m);
      if (g !== null && !g.ok) {
        out.push({ code: "errorResult", message: `${mark}: the report cannot give its governing values: ${g.error.message}`, sheet: plan.sheet, cell: a1(place.row, 0), mark });
        continue;
      }
      // Factoring can only overflow numbers already near the largest double.
      if (g !== null && largest(printed) > 1e300) {
        const e = g.value.envelope;
        const values = { momentMax: e.momentMax.value, momentMin: e.momentMin.value, shearMax: e.shearMax.value, reactionMax: e.reactionMax.map((v) => v.value), reactionMin: e.reactionMin.map((v) => v.value) };
        gap = firstNonFinite(values, `${mark} governing values`);
      }
    }
    if (gap === null) continue;
    out.push({
      code: "errorResult",
      message: `${mark}: the report cannot print ${gap} (not a finite number; shown as "?"). Check the member's inputs and the generated sheet's row.`,
      sheet: plan.sheet,
      cell: a1(place.row, 0),
      mark,
    });
  }
  return out;
}
