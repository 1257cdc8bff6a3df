/**
 * The last check of a build: the computed generated sheet and the results read from it hold no
 * error value and no non-finite number unlisted. Every member whose result row shows an error
 * (an overflow, a text the formulas could not use, a function's own refusal) becomes a problem
 * naming the generated sheet's cell and the member's row in the Members table; so does an error
 * in the load balance, and any number of the JSON that is not finite. A takedown is never both
 * silent and wrong.
 */
import { a1, quoteSheet } from "./a1";
import { isErrorValue } from "./cells";
import { isFlexural, isTerminal, type TakedownModel } from "./model";
import type { SheetPlan } from "./plan";
import type { CellReader, TakedownResults } from "./results";
import type { CellRef, CellValue, Problem } from "./types";

/** True for a computed cell that should hold a number and does not: an error, a non-finite number. */
function isBad(v: CellValue | undefined): boolean {
  return isErrorValue(v) || (typeof v === "number" && !Number.isFinite(v));
}

function where(cell: CellRef): string {
  return `${quoteSheet(cell.sheet)}!${a1(cell.row, cell.col)}`;
}

/** The result columns of a member's first row, by member type. */
function resultColumns(plan: SheetPlan, type: ReturnType<typeof typeOf>, live: readonly number[]): number[] {
  const { layout } = plan;
  const cols: number[] = [];
  const hasAt = layout.channels.some((c) => c.key === "AT");
  if (type === "flexural") {
    for (const i of live) cols.push(layout.r1[i]!, layout.r2[i]!);
    for (const i of live) {
      const c = layout.cases.indexOf(layout.channels[i]!);
      if (c >= 0) cols.push(layout.vMax[c]!, layout.mMax[c]!);
    }
    if (hasAt) cols.push(layout.areaT, layout.kll, layout.llr);
    for (const c of Object.values(layout.governing)) cols.push(c, c + 1);
  } else {
    for (const i of live) cols.push(layout.total[i]!);
    // A wall: its accumulated A_T, live load reduction and factored load (a blank KLL writes text there by design).
    if (type === "wall" && hasAt) cols.push(layout.areaT, layout.floors, layout.llr, layout.reducedLive, layout.factored);
    if (type === "column") {
      for (const i of live) cols.push(layout.arriving[i]!);
      if (hasAt) cols.push(layout.areaT, layout.floors, layout.kll, layout.kllAt, layout.llr, layout.reducedLive);
      cols.push(layout.factored);
    }
  }
  return cols;
}

function typeOf(model: TakedownModel, member: number): "flexural" | "column" | "wall" | "terminal" {
  const t = model.members[member]!.type;
  return isFlexural(t) ? "flexural" : t === "wall" ? "wall" : isTerminal(t) ? "terminal" : "column";
}

/**
 * Problems for every error value on the computed result rows of the generated sheet and in its
 * load balance: one per member (its first bad cell, how many there are, and the member's row in
 * the Members table), one per balance cell.
 * @param plan - the plan written
 * @param model - the model it was planned from
 * @param read - the computed cells read back
 */
export function scanResults(plan: SheetPlan, model: TakedownModel, read: CellReader): Problem[] {
  const problems: Problem[] = [];
  const header = (col: number): string => {
    const h = plan.cells[plan.headerRow]?.[col];
    return typeof h === "string" ? h : `column ${a1(0, col).replace(/\d+$/, "")}`;
  };
  for (const place of plan.places) {
    const m = model.members[place.member]!;
    // The first row's results, then a continuous member's interior reactions (R1, on the rows below).
    const cells: [number, number][] = resultColumns(plan, typeOf(model, place.member), place.live).map((c) => [place.row, c]);
    for (let k = 1; k <= (place.interiors ?? 0); k++) {
      for (const i of place.live) cells.push([place.row + k, plan.layout.r1[i]!]);
      const g = plan.layout.governing;
      for (const c of [g.reactionMaxFirst, g.reactionMinFirst]) cells.push([place.row + k, c], [place.row + k, c + 1]);
    }
    const d = plan.layout.deflection;
    const input = m.deflection;
    if (d !== null && input !== undefined && input.E !== null && typeOf(model, place.member) === "flexural") {
      const written = input.I !== null ? [d.live, d.total, d.ratio, d.liveLimit, d.totalLimit, d.requiredI] : [d.liveLimit, d.totalLimit, d.requiredI];
      for (const c of written) cells.push([place.row, c]);
    }
    const badCells = cells.filter(([r, c]) => isBad(read(r, c)));
    if (badCells.length === 0) continue;
    const bad = badCells.map(([, c]) => c);
    const [firstRow, first] = badCells[0]!;
    const v = read(firstRow, first);
    const shown = String(v);
    const more = bad.length > 1 ? ` (and ${bad.length - 1} more of its results)` : "";
    problems.push({
      code: "errorResult",
      message: `${m.mark}: ${header(first)} is ${shown} on the generated sheet${more}; the results of ${m.mark} and of what it rests on are not usable. Check the inputs of its row (${where(m.markCell)}) and its loads.`,
      sheet: plan.sheet,
      cell: a1(firstRow, first),
      mark: m.mark,
    });
  }
  plan.layout.cases.forEach((c, k) => {
    for (const [row, what] of [
      [plan.balance.appliedRow, "applied"],
      [plan.balance.supportsRow, "foundations and walls"],
    ] as const) {
      const col = plan.balance.caseCols[k]!;
      const v = read(row, col);
      if (isBad(v)) problems.push({ code: "errorResult", message: `Load balance, ${c.label} ${what}, is ${String(v)} on the generated sheet: some load of case ${c.label} cannot be computed.`, sheet: plan.sheet, cell: a1(row, col) });
    }
  });
  return problems;
}

/** Paths of the numbers of a results JSON that are not finite (NaN, infinite), the problems list aside. */
function nonFinite(value: unknown, path: string, out: string[]): void {
  if (typeof value === "number") {
    if (!Number.isFinite(value)) out.push(path);
  } else if (Array.isArray(value)) value.forEach((v, i) => nonFinite(v, `${path}[${i}]`, out));
  else if (value !== null && typeof value === "object") for (const k of Object.keys(value)) nonFinite((value as Record<string, unknown>)[k], `${path}.${k}`, out);
}

/**
 * Problems for the numbers of the JSON that are not finite (a JSON file would show them as null),
 * for the members whose result rows {@link scanResults} did not already list.
 * @param results - the JSON read from the sheet
 * @param plan - the plan written
 * @param model - the model
 * @param listed - problems already listed (a member listed there is not listed again)
 */
export function scanJson(results: TakedownResults, plan: SheetPlan, model: TakedownModel, listed: readonly Problem[]): Problem[] {
  const problems: Problem[] = [];
  const done = new Set(listed.filter((p) => p.code === "errorResult" && p.mark !== undefined).map((p) => p.mark!));
  for (const place of plan.places) {
    const m = model.members[place.member]!;
    if (done.has(m.mark)) continue;
    const paths: string[] = [];
    const own = (o: Readonly<Record<string, unknown>>, name: string): void => {
      if (Object.prototype.hasOwnProperty.call(o, m.mark)) nonFinite(o[m.mark], `${name}[${JSON.stringify(m.mark)}]`, paths);
    };
    own(results.members, "members");
    own(results.columns, "columns");
    own(results.foundations, "foundations");
    if (paths.length === 0) continue;
    done.add(m.mark);
    problems.push({
      code: "errorResult",
      message: `${m.mark}: ${paths[0]} is not a finite number${paths.length > 1 ? ` (and ${paths.length - 1} more)` : ""}: its loads are too large to combine. Check the inputs of its row (${where(m.markCell)}).`,
      sheet: plan.sheet,
      cell: a1(place.row, 0),
      mark: m.mark,
    });
  }
  for (const [key, b] of Object.entries(results.balance)) {
    const paths: string[] = [];
    nonFinite(b, `balance.${key}`, paths);
    const balanceListed = listed.some((p) => p.code === "errorResult" && p.mark === undefined && p.message.startsWith(`Load balance, ${key} `));
    if (paths.length > 0 && !balanceListed) problems.push({ code: "errorResult", message: `Load balance of case ${key} is not a finite number.`, sheet: plan.sheet, cell: a1(plan.balance.appliedRow, 0) });
  }
  return problems;
}
