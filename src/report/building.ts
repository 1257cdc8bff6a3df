/**
 * The building-wide tables a checker reads before any member sheet: the load schedule (the Zones
 * table as read), the code provisions used with their sources, the summary of every beam's end
 * reactions per case (the table a connection designer needs) and the per-level load check
 * (the load applied on each level against its loaded area and its zones' loads). Numbers are the
 * takedown's (its JSON results and the computed sheet's load rows) or the tables' own cells.
 */
import { LLR_COEFFICIENT, LLR_FLOOR_MULTI_LEVEL, LLR_FLOOR_ONE_LEVEL, LLR_THRESHOLD_AREA } from "../engine/loads/live-reduction";
import type { AppliedLoad, MemberLoads } from "../engine/takedown/member-loads";
import { isFlexural } from "../engine/takedown/model";
import type { LoadCase } from "../engine/takedown/types";
import { RESULT_UNITS } from "../engine/takedown/units";
import { formatDifference } from "../drawings/format";
import type { TakedownRecord } from "./collect";
import { ENUMERATION_LIMIT } from "../engine/envelope";
import { gravityCombinations, memberGoverningCached } from "./factored";
import { DECIMALS, el, fixed, numCell, type Html } from "./html";

/**
 * Area load unit of the tables (psf or kPa), the factor from result force per area (kip/ft²,
 * kN/m²) to it, and its decimals: 0.1 psf and 0.01 kPa (about 0.2 psf), as zone loads are
 * entered (common practice).
 */
export const AREA_LOAD = { US: { unit: "psf", perResult: 1000, decimals: 1 }, SI: { unit: "kPa", perResult: 1, decimals: 2 } } as const;

/** The load schedule: every zone of the Zones table with its area loads per case and whether its live load may be reduced. */
export function loadSchedule(record: TakedownRecord): Html {
  const cases = record.model.cases;
  const { unit, decimals } = AREA_LOAD[record.model.units];
  const rows = record.zones.map((z) =>
    el(
      "tr",
      { "data-role": "zone" },
      el("td", { class: "mark", "data-role": "zone-name" }, z.name),
      ...cases.map((c) => {
        const v = z.loads[c];
        // A blank cell: the case does not act on the zone (docs/interface.md section 2).
        return v === undefined ? el("td", { class: "num", "data-case": c }, "—") : el("td", { class: "num", "data-case": c, "data-value": String(v) }, fixed(v, decimals));
      }),
      el("td", { "data-role": "reducible" }, z.reducible ? "yes" : "no"),
    ),
  );
  return el(
    "table",
    { class: "schedule", "data-role": "load-schedule" },
    el("thead", {}, el("tr", {}, el("th", {}, "Zone"), ...cases.map((c) => el("th", { class: "num" }, `${c} (${unit})`)), el("th", {}, "Live load reducible"))),
    el("tbody", {}, ...rows),
  );
}

/** One provision used: what, where from, and whether its values were recalled from memory. */
interface Provision {
  readonly what: string;
  readonly values: string;
  readonly source: string;
}

/**
 * The code provisions the takedown applies, each with its source. The standard could not be
 * consulted while the engine was written: every value taken from it is marked "recalled from
 * memory" (src/engine/loads/combinations.ts, live-reduction.ts, kll.ts say the same).
 */
export function provisions(record: TakedownRecord): Provision[] {
  const units = record.model.units;
  const u = RESULT_UNITS[units];
  const combos = gravityCombinations().map((c) => c.label);
  return [
    {
      what: "Strength design load combinations (gravity only)",
      values: combos.join("; "),
      source: "ASCE/SEI 7-22 Sec. 2.3.1 (LRFD), without the 0.5L exception; factors recalled from memory, verify against the standard",
    },
    {
      what: "Partial (pattern) loading of live load, governing values of beams",
      values: `L and Lr switched on and off span by span (each span between supports and each overhang) in every combination; D, S and R on the whole member. Every on/off pattern is solved when a member has at most ${ENUMERATION_LIMIT} loaded span-and-case pieces, else the patterns of alternating spans around each span. Least reactions also under 2.3.1 (5) as 0.9D (no wind load)`,
      source: "ASCE/SEI 7-22 Sec. 4.3.3 (recalled from memory, verify against the standard); 0.9D: Sec. 2.3.1 combination 5 with W = 0",
    },
    {
      what: "Reduction of uniformly distributed live load",
      values: `L = Lo (0.25 + ${LLR_COEFFICIENT[units]} / √(K_LL·A_T)); none where K_LL·A_T < ${LLR_THRESHOLD_AREA[units]} ${u.area}; L ≥ ${fixed(LLR_FLOOR_ONE_LEVEL, 2)} Lo for members supporting one floor, ≥ ${fixed(LLR_FLOOR_MULTI_LEVEL, 2)} Lo for two or more`,
      source: "ASCE/SEI 7-22 Sec. 4.7.2, 4.7.3, Eq. 4.7-1; coefficients and limits recalled from memory, verify against the standard",
    },
    {
      what: "Live load element factor K_LL",
      values: "interior column 4, interior beam 2 (defaults); other elements as entered in the KLL column",
      source: "ASCE/SEI 7-22 Table 4.7-2; values recalled from memory, verify against the standard",
    },
    {
      what: "Live loads not reduced",
      values: "zones marked not reducible, wL line loads, live loads of the Loads table, roof live load",
      source: "Loadpath's choice (conservative), not a provision of the standard",
    },
    {
      what: "Member analysis",
      values: "reactions, shear and moment of each member and case from the exact piecewise solution of a two-support member (Euler–Bernoulli); largest moments at the exact roots of V",
      source: "statics and beam theory (any mechanics of materials text); no code provision",
    },
  ];
}

/** The provisions as a table. */
export function provisionsTable(record: TakedownRecord): Html {
  return el(
    "table",
    { class: "provisions", "data-role": "provisions" },
    el("thead", {}, el("tr", {}, el("th", {}, "Provision"), el("th", {}, "Values used"), el("th", {}, "Source"))),
    el("tbody", {}, ...provisions(record).map((p) => el("tr", {}, el("td", {}, p.what), el("td", {}, p.values), el("td", { class: "source" }, p.source)))),
  );
}

/**
 * Every beam, girder and joist with its two end reactions per case (unfactored, live load not
 * reduced: docs/interface.md section 4, `members.MARK.reactions`), what each end bears on, and the
 * largest and smallest factored reaction of each end (each with its own combination and live load
 * pattern, shown in the member's section; a negative least reaction is uplift).
 */
export function reactionSummary(record: TakedownRecord): Html | null {
  const cases = record.model.cases;
  const u = RESULT_UNITS[record.model.units];
  const beams = [...record.members.values()].filter((m) => isFlexural(m.type) && record.json.members[m.mark] !== undefined);
  if (beams.length === 0) return null;
  const rows = beams.map((m) => {
    const r = record.json.members[m.mark]!.reactions;
    const g = memberGoverningCached(m);
    const env = g !== null && g.ok ? g.value.envelope : null;
    const end = (which: "start" | "end"): Html[] => {
      // Start is the first support along the member, end the last (a continuous member's interior supports are in its own section).
      const k = which === "start" ? 0 : Math.max(0, m.supports.length - 1);
      return [
        el("td", { class: "mark", "data-role": `${which}-support` }, m.supports[k]?.mark ?? ""),
        ...cases.map((c) => numCell(r[c]?.[k] ?? null, "force", { "data-case": c, "data-end": which })),
        numCell(env?.reactionMax[k]?.value ?? null, "force", { "data-case": "max", "data-end": which }),
        numCell(env?.reactionMin[k]?.value ?? null, "force", { "data-case": "min", "data-end": which }),
      ];
    };
    return el("tr", { "data-role": "reactions", "data-member": m.mark }, el("td", { class: "mark" }, m.mark), el("td", {}, m.level), ...end("start"), ...end("end"));
  });
  const caseHeads = (): Html[] => [...cases.map((c) => el("th", { class: "num" }, c)), el("th", { class: "num" }, "Max"), el("th", { class: "num" }, "Min")];
  return el(
    "table",
    { class: "schedule reactions", "data-role": "reaction-summary" },
    el(
      "thead",
      {},
      el("tr", {}, el("th", { rowspan: 2 }, "Member"), el("th", { rowspan: 2 }, "Level"), el("th", { colspan: cases.length + 3 }, `Start (${u.force})`), el("th", { colspan: cases.length + 3 }, `End (${u.force})`)),
      el("tr", {}, el("th", {}, "Bears on"), ...caseHeads(), el("th", {}, "Bears on"), ...caseHeads()),
    ),
    el("tbody", {}, ...rows),
  );
}

/** One level's load check for one case. */
export interface LevelCheck {
  readonly level: string;
  readonly loadCase: LoadCase;
  /** Loaded area: Σ width × loaded length of the zone loads on the level's members (ft² or m²). */
  readonly area: number;
  /** Load applied on the level's members, from the computed sheet (kip or kN): zone loads, wX, Loads rows; not the reactions received. */
  readonly applied: number;
  /** Σ zone area load × its loaded area, from the Zones table (kip or kN). */
  readonly fromZones: number;
  /** Lowest and highest area load of the case among the level's zones (psf or kPa); null when no zone of the level has the case. */
  readonly zoneRange: readonly [number, number] | null;
}

/** Total of a load row of one case (kip or kN): a line load times its loaded length, a point load as is. */
function rowTotal(load: AppliedLoad, c: LoadCase, length: number | null): number {
  const m = load.magnitudes[c];
  if (m === undefined) return 0;
  if (load.kind === "point") return m;
  const span = load.start !== null && load.end !== null ? load.end - load.start : (length ?? Number.NaN);
  return m * span;
}

/** Loaded length of a line load row. */
function rowLength(load: AppliedLoad, length: number | null): number {
  return load.start !== null && load.end !== null ? load.end - load.start : (length ?? Number.NaN);
}

/**
 * The per-level load check: for each level and case, the load applied directly on the level's
 * members (everything but the reactions and column loads received), the loaded area (the zone
 * widths times their loaded lengths), the average pressure applied / area, and the same loads
 * from the Zones table (zone load × area): the difference is the line and point loads entered.
 */
export function levelChecks(record: TakedownRecord): LevelCheck[] {
  const perResult = AREA_LOAD[record.model.units].perResult;
  const zoneByName = new Map(record.zones.map((z) => [z.name.toLowerCase(), z]));
  const out: LevelCheck[] = [];
  const levels = [...record.levels];
  for (const m of record.members.values()) if (m.level !== "" && !levels.includes(m.level)) levels.push(m.level);
  // Members without a level (foundations, walls as entered) count when a load is applied on them directly, so the levels add up to the balance.
  if ([...record.members.values()].some((m) => m.level === "" && m.loads.some((l) => l.origin.kind !== "member"))) levels.push("");
  for (const level of levels) {
    const members: MemberLoads[] = [...record.members.values()].filter((m) => m.level === level);
    for (const c of record.model.cases) {
      let area = 0;
      let applied = 0;
      let fromZones = 0;
      let lo = Infinity;
      let hi = -Infinity;
      for (const m of members) {
        for (const load of m.loads) {
          if (load.origin.kind === "member") continue;
          applied += rowTotal(load, c, m.length);
          const zoneName = load.origin.kind === "zone" || load.origin.kind === "loadsRow" ? load.origin.zone : null;
          const zone = zoneName === null ? undefined : zoneByName.get(zoneName.toLowerCase());
          if (zone === undefined || load.kind !== "line" || load.width === null) continue;
          const a = load.width * rowLength(load, m.length);
          // Each zone row counted once for the area (the first case), its load in every case it has.
          if (c === record.model.cases[0]) area += a;
          const q = zone.loads[c];
          if (q === undefined) continue;
          fromZones += (q * a) / perResult;
          lo = Math.min(lo, q);
          hi = Math.max(hi, q);
        }
      }
      out.push({ level, loadCase: c, area, applied, fromZones, zoneRange: lo <= hi ? [lo, hi] : null });
    }
  }
  // The area is the same in every case: carry the first case's to the others.
  const areaOf = new Map(out.filter((r) => r.loadCase === record.model.cases[0]).map((r) => [r.level, r.area]));
  return out.map((r) => ({ ...r, area: areaOf.get(r.level) ?? r.area }));
}

/** The per-level load check as a table, with the total of every level against the load balance. */
export function levelCheckTable(record: TakedownRecord): Html | null {
  const checks = levelChecks(record);
  if (checks.length === 0) return null;
  const u = RESULT_UNITS[record.model.units];
  const { unit, perResult, decimals } = AREA_LOAD[record.model.units];
  const rows = checks.map((r) => {
    const pressure = r.area > 0 ? (r.applied * perResult) / r.area : null;
    const range = r.zoneRange === null ? "—" : r.zoneRange[0] === r.zoneRange[1] ? fixed(r.zoneRange[0], decimals) : `${fixed(r.zoneRange[0], decimals)} to ${fixed(r.zoneRange[1], decimals)}`;
    const other = r.applied - r.fromZones;
    return el(
      "tr",
      { "data-role": "level-check", "data-level": r.level, "data-case": r.loadCase },
      el("td", {}, r.level === "" ? "(no level)" : r.level),
      el("th", { scope: "row" }, r.loadCase),
      numCell(r.area, "area", { "data-field": "area" }),
      numCell(r.applied, "force", { "data-field": "applied" }),
      pressure === null ? el("td", { class: "num", "data-field": "pressure" }, "—") : el("td", { class: "num", "data-field": "pressure", "data-value": String(pressure) }, fixed(pressure, decimals)),
      el("td", { class: "num", "data-field": "zone-loads" }, range),
      numCell(r.fromZones, "force", { "data-field": "from-zones" }),
      el("td", { class: "num", "data-field": "other", "data-value": String(other) }, formatDifference(other, [r.applied, r.fromZones], DECIMALS.force)),
    );
  });
  const totals = record.model.cases.map((c) => {
    const sum = checks.filter((r) => r.loadCase === c).reduce((s, r) => s + r.applied, 0);
    const balance = record.json.balance[c]?.applied ?? null;
    return el(
      "tr",
      { "data-role": "level-total", "data-case": c },
      el("td", {}, "All levels"),
      el("th", { scope: "row" }, c),
      el("td", {}, ""),
      numCell(sum, "force", { "data-field": "applied" }),
      el("td", { colspan: 3, class: "note" }, "load balance, applied:"),
      numCell(balance, "force", { "data-field": "balance" }),
    );
  });
  return el(
    "table",
    { class: "schedule level-check", "data-role": "level-check" },
    el(
      "thead",
      {},
      el(
        "tr",
        {},
        el("th", {}, "Level"),
        el("th", {}, "Case"),
        el("th", { class: "num" }, `Loaded area (${u.area})`),
        el("th", { class: "num" }, `Applied (${u.force})`),
        el("th", { class: "num" }, `Applied / area (${unit})`),
        el("th", { class: "num" }, `Zone loads (${unit})`),
        el("th", { class: "num" }, `Zone load × area (${u.force})`),
        el("th", { class: "num" }, `Line and point loads (${u.force})`),
      ),
    ),
    el("tbody", {}, ...rows, ...totals),
  );
}
