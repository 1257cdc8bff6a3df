/**
 * The input tables as the pane presents them: the three roles, their expected columns with the
 * units shown beside each, and which of the workbook's tables plays which role.
 * Header matching itself belongs to the takedown engine (src/engine/takedown/tables.ts).
 */
import type { TableInfo } from "../workbook/port";
import type { ColumnMapping, UnitSystem } from "../workbook/takedown-api";

/** The three input tables of design.md section 4. */
export type TableRole = "zones" | "members" | "loads";

export const ROLES: readonly TableRole[] = ["zones", "members", "loads"];

/** One expected column: its default header, whether a build needs it, and its units. */
export interface ColumnSpec {
  readonly header: string;
  readonly required: boolean;
  /** Units per system, or null for text and plain numbers. */
  readonly units: Readonly<Record<UnitSystem, string>> | null;
  /** A few plain words on what goes in it. */
  readonly hint: string;
}

const LENGTH = { US: "ft", SI: "m" } as const;
const AREA_LOAD = { US: "psf", SI: "kPa" } as const;
const LINE_LOAD = { US: "plf", SI: "kN/m" } as const;

function col(header: string, required: boolean, units: ColumnSpec["units"], hint: string): ColumnSpec {
  return { header, required, units, hint };
}

/** Expected columns per role, in design.md section 4 order. */
export const ROLE_COLUMNS: Readonly<Record<TableRole, readonly ColumnSpec[]>> = {
  zones: [
    col("Zone", true, null, "name of the load zone"),
    col("D", false, AREA_LOAD, "dead load"),
    col("L", false, AREA_LOAD, "floor live load"),
    col("Lr", false, AREA_LOAD, "roof live load"),
    col("S", false, AREA_LOAD, "snow load"),
    col("R", false, AREA_LOAD, "rain load"),
    col("Reducible", false, null, "yes/no: live load may be reduced"),
  ],
  members: [
    col("Mark", true, null, "member mark"),
    col("Type", false, null, "beam, girder, joist, column, wall or foundation"),
    col("Level", false, null, "floor or roof level"),
    col("Span", true, LENGTH, "length between supports"),
    col("Zone", false, null, "load zone over the member"),
    col("Trib", false, LENGTH, "tributary width"),
    col("Start support", true, null, "mark of what holds the start"),
    col("Start at", false, LENGTH, "position along that support"),
    col("End support", false, null, "mark of what holds the end"),
    col("End at", false, LENGTH, "position along that support"),
    col("KLL", false, null, "live load element factor"),
    col("wD", false, LINE_LOAD, "extra dead line load"),
    col("wL", false, LINE_LOAD, "extra live line load"),
    col("wLr", false, LINE_LOAD, "extra roof live line load"),
    col("wS", false, LINE_LOAD, "extra snow line load"),
  ],
  loads: [
    col("Mark", true, null, "member loaded"),
    col("Kind", true, null, "area, line or point"),
    col("Zone or case", true, null, "zone (area) or load case"),
    col("Magnitude", false, null, "line load (plf or kN/m) or point load (lb or kN)"),
    col("Width", false, LENGTH, "width loaded (area loads)"),
    col("From", false, LENGTH, "start along the member"),
    col("To", false, LENGTH, "end along the member"),
  ],
};

/** Plain-words title of each role. */
export const ROLE_TITLES: Readonly<Record<TableRole, string>> = {
  zones: "Load zones",
  members: "Members",
  loads: "Extra loads",
};

/** A header cell reduced for comparison: case-insensitive, a trailing "(unit)" dropped. */
function bare(header: string): string {
  return header.replace(/\s*\([^)]*\)\s*$/, "").trim().toLowerCase();
}

/**
 * For each expected column of a role, the user's header that carries it (mapped by the user,
 * else the same name), or null.
 */
export function matchColumns(role: TableRole, headers: readonly string[], mapping: ColumnMapping): Record<string, string | null> {
  const chosen = mapping[role] ?? {};
  const out: Record<string, string | null> = {};
  for (const spec of ROLE_COLUMNS[role]) {
    const mapped = chosen[spec.header];
    const byName = headers.find((h) => bare(h) === bare(spec.header));
    out[spec.header] = mapped && headers.includes(mapped) ? mapped : byName ?? null;
  }
  return out;
}

/** Required columns of a role that the table lacks under the current mapping. */
export function missingColumns(role: TableRole, headers: readonly string[], mapping: ColumnMapping): string[] {
  const found = matchColumns(role, headers, mapping);
  return ROLE_COLUMNS[role].filter((c) => c.required && found[c.header] === null).map((c) => c.header);
}

/** The first table whose headers carry every required column of each role. */
export function detectRoles(tables: readonly TableInfo[], mapping: ColumnMapping): Partial<Record<TableRole, string>> {
  const out: Partial<Record<TableRole, string>> = {};
  const taken = new Set<string>();
  // Members first: its required columns are the most specific, so a zones table is not mistaken for it.
  for (const role of ["members", "loads", "zones"] as const) {
    const hit = tables.find((t) => !taken.has(t.name) && missingColumns(role, t.headers, mapping).length === 0 && (role !== "zones" || hasLoadColumn(t.headers)));
    if (hit) {
      out[role] = hit.name;
      taken.add(hit.name);
    }
  }
  return out;
}

function hasLoadColumn(headers: readonly string[]): boolean {
  return headers.some((h) => ["d", "l", "lr", "s", "r"].includes(bare(h)));
}
