/**
 * The building-wide tables of the report: the column schedule (each stack level by level from
 * the top, with cumulative loads, tributary area, floors, K_LL·A_T, live load reduction, reduced
 * live load and the governing combination), the foundation reactions, the load balance per case
 * and the problems found in the tables. Every number is the takedown's (its JSON results).
 */
import type { MemberLoads } from "../engine/takedown/member-loads";
import { RESULT_UNITS } from "../engine/takedown/units";
import type { TakedownRecord } from "./collect";
import { formatDifference } from "../drawings/format";
import { DECIMALS, el, numCell, type Html } from "./html";
import { governingOf } from "./member-section";

/**
 * Column stacks: every column whose base is not a column starts a stack, listed from its top
 * level down to it. Stacks in takedown order of their lowest column.
 * @param members - every member's loads
 * @returns the stacks, each from the top down
 */
export function columnStacks(members: ReadonlyMap<string, MemberLoads>): string[][] {
  const columns = [...members.values()].filter((m) => m.type === "column");
  const above = new Map<string, string[]>();
  for (const c of columns) {
    const base = c.supports[0]?.mark;
    if (base !== undefined && members.get(base)?.type === "column") above.set(base, [...(above.get(base) ?? []), c.mark]);
  }
  const stacks: string[][] = [];
  const seen = new Set<string>();
  for (const c of columns) {
    const base = c.supports[0]?.mark;
    if (base !== undefined && members.get(base)?.type === "column") continue;
    const stack: string[] = [];
    const walk = (mark: string): void => {
      if (seen.has(mark)) return;
      seen.add(mark);
      for (const up of above.get(mark) ?? []) walk(up);
      stack.push(mark);
    };
    walk(c.mark);
    stacks.push(stack);
  }
  const rest = columns.filter((c) => !seen.has(c.mark)).map((c) => c.mark);
  if (rest.length > 0) stacks.push(rest);
  return stacks;
}

/** The column schedule. */
export function columnSchedule(record: TakedownRecord): Html | null {
  const { json } = record;
  const stacks = columnStacks(record.members).map((s) => s.filter((mark) => json.columns[mark] !== undefined)).filter((s) => s.length > 0);
  if (stacks.length === 0) return null;
  const u = RESULT_UNITS[record.model.units];
  const cases = record.model.cases;
  const head = el(
    "tr",
    {},
    el("th", {}, "Column"),
    el("th", {}, "Level"),
    ...cases.map((c) => el("th", { class: "num" }, `${c} (${u.force})`)),
    el("th", { class: "num" }, `A_T (${u.area})`),
    el("th", { class: "num" }, "Floors"),
    el("th", { class: "num" }, `K_LL·A_T (${u.area})`),
    el("th", { class: "num" }, "L/Lo"),
    el("th", { class: "num" }, `L reduced (${u.force})`),
    el("th", {}, "Governing combination"),
    el("th", { class: "num" }, `Factored (${u.force})`),
  );
  const width = 9 + cases.length;
  const bodies = stacks.map((stack) => {
    const bottom = record.members.get(stack[stack.length - 1]!);
    const base = bottom?.supports[0]?.mark ?? "";
    const rows = stack.map((mark) => {
      const c = json.columns[mark]!;
      const g = governingOf(c);
      return el(
        "tr",
        { "data-role": "column", "data-mark": mark },
        el("td", { class: "mark" }, mark),
        el("td", {}, c.level),
        ...cases.map((k) => numCell(c.cumulative[k] ?? null, "force", { "data-case": k })),
        numCell(c.tributaryArea, "area", { "data-field": "tributaryArea" }),
        numCell(c.floors, "count", { "data-field": "floors" }),
        numCell(c.kllAt, "area", { "data-field": "kllAt" }),
        numCell(c.llrFactor, "factor", { "data-field": "llrFactor" }),
        numCell(c.reducedLive, "force", { "data-field": "reducedLive" }),
        el("td", { class: "combo" }, g?.label ?? ""),
        numCell(g?.value ?? null, "force", { "data-field": "governing" }),
      );
    });
    return el("tbody", { class: "stack" }, el("tr", { class: "stack-head" }, el("th", { colspan: width, scope: "rowgroup" }, `Stack on ${base}`)), ...rows);
  });
  return el("table", { class: "schedule", "data-role": "column-schedule" }, el("thead", {}, head), ...bodies);
}

/** Foundation and wall reactions per case, with what bears on each. */
export function foundationTable(record: TakedownRecord): Html | null {
  const entries = Object.entries(record.json.foundations);
  if (entries.length === 0) return null;
  const u = RESULT_UNITS[record.model.units];
  const cases = record.model.cases;
  const rows = entries.map(([mark, values]) => {
    const bearing = (record.members.get(mark)?.loads ?? []).map((l) => (l.origin.kind === "member" ? l.origin.mark : l.source)).join(", ");
    return el("tr", { "data-role": "foundation", "data-mark": mark }, el("td", { class: "mark" }, mark), el("td", {}, bearing), ...cases.map((c) => numCell(values[c] ?? null, "force", { "data-case": c })));
  });
  return el(
    "table",
    { class: "schedule", "data-role": "foundations" },
    el("thead", {}, el("tr", {}, el("th", {}, "Foundation or wall"), el("th", {}, "Carries"), ...cases.map((c) => el("th", { class: "num" }, `${c} (${u.force})`)))),
    el("tbody", {}, ...rows),
  );
}

/** The load balance: all applied load against all foundation and wall reactions, per case. */
export function balanceTable(record: TakedownRecord): Html {
  const u = RESULT_UNITS[record.model.units];
  const rows = Object.entries(record.json.balance).map(([c, b]) => {
    const diff = b.applied - b.supports;
    return el(
      "tr",
      { "data-role": "balance", "data-case": c },
      el("th", { scope: "row" }, c),
      numCell(b.applied, "force", { "data-field": "applied" }),
      numCell(b.supports, "force", { "data-field": "supports" }),
      el("td", { class: "num", "data-value": String(diff) }, formatDifference(diff, [b.applied, b.supports], DECIMALS.force)),
    );
  });
  return el(
    "table",
    { class: "schedule balance", "data-role": "balance" },
    el("thead", {}, el("tr", {}, el("th", {}, "Case"), el("th", { class: "num" }, `Applied (${u.force})`), el("th", { class: "num" }, `Foundations and walls (${u.force})`), el("th", { class: "num" }, "Difference"))),
    el("tbody", {}, ...rows),
  );
}

/** The problems the takedown found in the tables, each with its cell. */
export function problemList(record: TakedownRecord): Html | null {
  const problems = record.json.problems;
  if (problems.length === 0) return null;
  return el("ul", { class: "problems", "data-role": "problems" }, ...problems.map((p) => el("li", {}, `${p.sheet}!${p.cell}: ${p.message}`)));
}
