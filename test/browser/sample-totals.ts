/**
 * Totals of the sample building computed straight from its input tables, independently of the
 * takedown engine: every load applied to the structure, per case. Area load x tributary width x
 * loaded length for members, extra line loads x length, and the rows of the loads table
 * (common practice: a uniform load's resultant is its intensity times the loaded length; an area
 * load over a width w is a line load of intensity x w).
 */
import { columnOf, sampleTable, type SampleCell, type SampleJson, type SampleTable } from "../../src/taskpane-demo/sample-data";

export type { SampleJson };

const REQUIRED: Readonly<Record<"zones" | "members" | "loads", readonly string[]>> = {
  zones: ["Zone"],
  members: ["Mark", "Span", "Start support"],
  loads: ["Mark", "Kind", "Zone or case"],
};

/** The sample table carrying a role's required headers (undefined for an absent optional one). */
export function findTable(sample: SampleJson, role: "zones" | "members" | "loads", optional: true): SampleTable | undefined;
export function findTable(sample: SampleJson, role: "zones" | "members" | "loads"): SampleTable;
export function findTable(sample: SampleJson, role: "zones" | "members" | "loads", optional = false): SampleTable | undefined {
  const found = sample.tables
    .map((t) => sampleTable(sample, t.name))
    .find((t) => REQUIRED[role].every((h) => columnOf(t, h) >= 0) && (role !== "zones" || columnOf(t, "D") >= 0 || columnOf(t, "L") >= 0));
  if (!found && !optional) throw new Error(`The sample has no ${role} table.`);
  return found;
}

/** Body rows of a table as records keyed by bare header name ("Span (ft)" -> "Span"). */
export function records(t: SampleTable): Record<string, SampleCell>[] {
  const names = t.headers.map((h) => h.replace(/\s*\([^)]*\)\s*$/, "").trim());
  return t.body.filter((r) => r.some((c) => c !== null && c !== "")).map((r) => Object.fromEntries(names.map((n, i) => [n, r[i] ?? null])));
}

/** The members' rows. */
export function memberRows(sample: SampleJson): Record<string, SampleCell>[] {
  return records(findTable(sample, "members"));
}

const CASES = ["D", "L", "Lr", "S", "R"] as const;

function num(v: SampleCell | undefined): number {
  return typeof v === "number" ? v : typeof v === "string" && v.trim() !== "" && Number.isFinite(Number(v)) ? Number(v) : 0;
}

/** Is the sample in SI? (a length header in metres) */
function isSI(sample: SampleJson): boolean {
  return findTable(sample, "members").headers.some((h) => /\(\s*m\s*\)\s*$/i.test(h));
}

/**
 * Applied load per case in kip (US: psf x ft x ft = lb, / 1000) or kN (SI: kPa x m x m = kN),
 * for the cases present in the zones table.
 */
export function appliedTotals(sample: SampleJson): Record<string, number> {
  const scale = isSI(sample) ? 1 : 1 / 1000;
  const zoneTable = findTable(sample, "zones");
  const zones = new Map(records(zoneTable).map((z) => [String(z.Zone), z]));
  const cases = CASES.filter((c) => columnOf(zoneTable, c) >= 0);
  const totals: Record<string, number> = Object.fromEntries(cases.map((c) => [c, 0]));
  for (const m of memberRows(sample)) {
    const length = num(m.Span) + num(m["Start overhang"]) + num(m["End overhang"]);
    const zone = zones.get(String(m.Zone ?? ""));
    for (const c of cases) totals[c]! += ((zone ? num(zone[c]) * num(m.Trib) : 0) + num(m[`w${c}`])) * length * scale;
  }
  const loadsTable = findTable(sample, "loads", true);
  for (const l of loadsTable ? records(loadsTable) : []) {
    const kind = String(l.Kind ?? "").toLowerCase();
    const what = String(l["Zone or case"] ?? "");
    const from = num(l.From);
    const to = num(l.To);
    if (kind === "area") {
      const zone = zones.get(what);
      for (const c of cases) totals[c]! += num(zone?.[c]) * num(l.Width) * (to - from) * scale;
    } else if (kind === "line" && what in totals) totals[what]! += num(l.Magnitude) * (to - from) * scale;
    else if (kind === "point" && what in totals) totals[what]! += num(l.Magnitude) * scale;
  }
  return totals;
}
