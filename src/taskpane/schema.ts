/**
 * The input tables as the pane presents them: the four roles, their expected columns with the
 * units shown beside each, and which of the workbook's tables plays which role. The expected
 * columns and the header matching are the takedown engine's (src/engine/takedown/tables.ts);
 * this module only adds the words shown in the pane.
 */
import { BEARINGS_SPEC, LOADS_SPEC, matchTable, MEMBERS_SPEC, ZONES_SPEC, type TableSpec } from "../engine/takedown/tables";
import { UNIT_NAMES } from "../engine/takedown/units";
import type { TableInfo } from "../workbook/port";
import type { ColumnMapping, UnitSystem } from "../workbook/takedown-api";

/** The input tables of docs/interface.md section 2 (Loads and Bearings optional). */
export type TableRole = "zones" | "members" | "loads" | "bearings";

/** Roles in the order the pane lists them. */
export const ROLES: readonly TableRole[] = ["zones", "members", "loads", "bearings"];

/** Roles the takedown can do without. */
export const OPTIONAL_ROLES: ReadonlySet<TableRole> = new Set(["loads", "bearings"]);

/** One expected column as the pane shows it. */
export interface ColumnView {
  readonly header: string;
  readonly required: boolean;
  /** Units per system, or null for text and plain numbers. */
  readonly units: Readonly<Record<UnitSystem, string>> | null;
  /** A few plain words on what goes in it. */
  readonly hint: string;
}

const SPECS: Readonly<Record<TableRole, TableSpec<string>>> = { zones: ZONES_SPEC, members: MEMBERS_SPEC, loads: LOADS_SPEC, bearings: BEARINGS_SPEC };

/** Plain words for each default header (display only). */
const HINTS: Readonly<Record<string, string>> = {
  Zone: "name of the load zone",
  D: "dead load",
  L: "floor live load",
  Lr: "roof live load",
  S: "snow load",
  R: "rain load",
  Reducible: "yes/no: live load may be reduced",
  Mark: "member mark",
  Type: "beam, girder, joist, column, wall or foundation",
  Level: "floor or roof level",
  Span: "length between supports",
  Trib: "tributary width",
  "Start support": "mark of what holds the start",
  "Start at": "position along that support",
  "End support": "mark of what holds the end",
  "End at": "position along that support",
  KLL: "live load element factor",
  wD: "extra dead line load",
  wL: "extra live line load",
  wLr: "extra roof live line load",
  wS: "extra snow line load",
  wR: "extra rain line load",
  "Start overhang": "length beyond the start support",
  "End overhang": "length beyond the end support",
  Kind: "area, line or point",
  "Zone or case": "zone (area load) or load case",
  Magnitude: "line load or point load",
  Width: "width loaded (area loads)",
  From: "start along the member",
  To: "end along the member",
  Support: "mark of what holds the member there (interior support)",
  At: "position of the support along the member",
  "Support at": "position along that support (beam, girder or joist)",
};

function viewsOf(spec: TableSpec<string>): ColumnView[] {
  return Object.values(spec.columns).map((c) => ({
    header: c.header,
    required: c.required,
    units: c.quantity === "none" ? null : UNIT_NAMES[c.quantity],
    hint: HINTS[c.header] ?? "",
  }));
}

/** Expected columns per role, in the engine's order. */
export const ROLE_COLUMNS: Readonly<Record<TableRole, readonly ColumnView[]>> = {
  zones: viewsOf(ZONES_SPEC),
  members: viewsOf(MEMBERS_SPEC),
  loads: viewsOf(LOADS_SPEC),
  bearings: viewsOf(BEARINGS_SPEC),
};

/** Plain-words title of each role. */
export const ROLE_TITLES: Readonly<Record<TableRole, string>> = {
  zones: "Load zones",
  members: "Members",
  loads: "Extra loads",
  bearings: "Bearings (continuous members)",
};

/** The engine's match of a header row (units are not judged here: the build reports them). */
function matchHeaders(role: TableRole, headers: readonly string[], mapping: ColumnMapping): Readonly<Partial<Record<string, number>>> {
  const data = { sheet: "", top: 0, left: 0, values: [headers] };
  return matchTable(SPECS[role], data, "US", mapping[role]).table.columns;
}

/**
 * For each expected column of a role, the user's header that carries it (the default name or
 * the user's mapping, as the engine matches them), or null.
 */
export function matchColumns(role: TableRole, headers: readonly string[], mapping: ColumnMapping): Record<string, string | null> {
  const found = matchHeaders(role, headers, mapping);
  const out: Record<string, string | null> = {};
  for (const [key, c] of Object.entries(SPECS[role].columns)) {
    const index = found[key];
    out[c.header] = index === undefined ? null : headers[index] ?? null;
  }
  return out;
}

/** Required columns of a role that the table lacks under the current mapping. */
export function missingColumns(role: TableRole, headers: readonly string[], mapping: ColumnMapping): string[] {
  const found = matchColumns(role, headers, mapping);
  return ROLE_COLUMNS[role].filter((c) => c.required && found[c.header] === null).map((c) => c.header);
}

/** True when a zones table has at least one load case column. */
function hasLoadCase(headers: readonly string[], mapping: ColumnMapping): boolean {
  const found = matchColumns("zones", headers, mapping);
  return ["D", "L", "Lr", "S", "R"].some((c) => found[c] !== null);
}

/** The first table whose headers carry every required column of each role. */
export function detectRoles(tables: readonly TableInfo[], mapping: ColumnMapping): Partial<Record<TableRole, string>> {
  const out: Partial<Record<TableRole, string>> = {};
  const taken = new Set<string>();
  // Members first: its required columns are the most specific, so no other table is taken for it.
  for (const role of ["members", "loads", "bearings", "zones"] as const) {
    const hit = tables.find(
      (t) => !taken.has(t.name) && missingColumns(role, t.headers, mapping).length === 0 && (role !== "zones" || hasLoadCase(t.headers, mapping)),
    );
    if (hit) {
      out[role] = hit.name;
      taken.add(hit.name);
    }
  }
  return out;
}
