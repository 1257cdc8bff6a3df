/**
 * One member's section of the report. A beam, girder or joist: its supports, the table of the
 * loads it carries (where each comes from), the table of results per case with the source of each
 * formula, the governing values (M+, M-, |V| and each reaction's largest and smallest value, each
 * with its own combination and live load pattern), its live load reduction, the member sheets
 * (free-body, shear and moment diagrams) of each case and of the case that governs M+, and its
 * load path. A column: what arrives at its level, its cumulative loads, live load
 * reduction and governing combination, and its load path. A wall or foundation: what bears on it.
 */
import { solveBeam } from "../engine/beam/index";
import type { AppliedLoad, MemberLoads } from "../engine/takedown/member-loads";
import { isFlexural } from "../engine/takedown/model";
import type { ColumnResult, MemberResult } from "../engine/takedown/results";
import type { LoadCase } from "../engine/takedown/types";
import { RESULT_UNITS } from "../engine/takedown/units";
import { renderLoadPath } from "../drawings/load-path";
import { renderMemberSheet } from "../drawings/sheet";
import type { TakedownRecord } from "./collect";
import { caseMagnitudes, governingDrawing, loadPathTree, memberDrawing, supportLabel } from "./drawings";
import type { CombinationTerm } from "../engine/loads/combinations";
import { governingCaption, governingOf as governingValueOf, governingPieces, labelOnMember, quantitiesOf, type GoverningQuantity, type MemberGoverning } from "../engine/takedown/member-envelope";
import { beamLoadsOf, gravityCombinations, memberGoverningCached, shortLabel } from "./factored";
import { DECIMALS, el, fixed, join, length, numCell, raw, type Child, type Html } from "./html";
import { SOURCES } from "./text";

/** Id of a member's section (never derived from the mark, which is the user's text). */
export function sectionId(index: number): string {
  return `member-${index + 1}`;
}

/** The cases of the takedown that put some load on this member. */
function casesOn(record: TakedownRecord, m: MemberLoads): LoadCase[] {
  return record.model.cases.filter((c) => m.loads.some((l) => (l.magnitudes[c] ?? 0) !== 0));
}

function heading(m: MemberLoads): Html {
  const level = m.level !== "" ? (/^level\b/i.test(m.level) ? m.level : `level ${m.level}`) : "";
  return el("h2", {}, el("span", { class: "mark", "data-role": "mark" }, m.mark), " ", el("span", { class: "kind" }, m.type), level !== "" ? ` · ${level}` : "");
}

/** How a load is described in the Source column. */
function describe(l: AppliedLoad): string {
  const o = l.origin;
  if (o.kind === "member") {
    if (o.end === "base") return `Load of ${o.mark} (${o.type}) at its base`;
    if (o.end === "interior") return `Reaction of ${o.mark} (${o.type}, continuous) at an interior support`;
    return `Reaction of ${o.mark} (${o.type}) at its ${o.end}`;
  }
  if (o.kind === "loadsRow") return l.source;
  if (o.kind === "selfWeight") return "Self weight: wD × height";
  const parts = [...(o.zone !== null ? [`Zone ${o.zone} × trib`] : []), ...o.extras.map((c) => `w${c} of the Members table`)];
  return parts.join(" + ");
}

function caseHeaders(cases: readonly LoadCase[]): Html[] {
  return cases.map((c) => el("th", { class: "num" }, c));
}

/** The table of loads on a member, one row per load, one column per case. */
function loadsTable(record: TakedownRecord, m: MemberLoads, cases: readonly LoadCase[]): Html {
  const u = RESULT_UNITS[record.model.units];
  const flexural = isFlexural(m.type);
  const head = el(
    "tr",
    {},
    el("th", {}, "#"),
    el("th", {}, "Load"),
    el("th", {}, "Source"),
    flexural ? el("th", { class: "num" }, `Trib or width (${u.length})`) : null,
    flexural ? el("th", { class: "num" }, `Start (${u.length})`) : null,
    flexural ? el("th", { class: "num" }, `End (${u.length})`) : null,
    ...caseHeaders(cases),
    el("th", {}, "Unit"),
  );
  const rows = m.loads.map((l, i) =>
    el(
      "tr",
      { "data-role": "load", "data-kind": l.kind },
      el("td", {}, String(i + 1)),
      el("td", {}, l.kind === "reaction" ? "point (reaction)" : l.kind),
      el("td", { class: "source" }, describe(l)),
      flexural ? numCell(l.width, "length") : null,
      flexural ? numCell(l.start, "length") : null,
      flexural ? numCell(l.end, "length") : null,
      ...cases.map((c) => numCell(l.magnitudes[c] ?? null, l.kind === "line" ? "line" : "force", { "data-case": c })),
      el("td", { class: "unit" }, l.kind === "line" ? u.line : u.force),
    ),
  );
  const none = m.loads.length === 0 ? [el("tr", {}, el("td", { colspan: 4 + cases.length + (flexural ? 3 : 0) }, "No load on this member."))] : [];
  return el("table", { class: "loads", "data-role": "loads" }, el("thead", {}, head), el("tbody", {}, ...rows, ...none));
}

/** Per-case hogging moments of a member with an overhang (exact analysis of the same loads). */
function hoggingOf(m: MemberLoads, c: LoadCase): number | null {
  const xs = m.supports.map((s) => s.x);
  if (m.length === null || xs.some((x) => x === null)) return null;
  const solved = solveBeam({ span: m.length, supports: xs.map((x) => ({ x: x!, type: "pin" })), loads: beamLoadsOf(m, caseMagnitudes(m, c)) });
  return solved.ok ? solved.value.maxHogging().value : null;
}

function hasOverhang(m: MemberLoads): boolean {
  const [a, b] = m.supports;
  return m.length !== null && a !== undefined && b !== undefined && (a.x !== 0 || b.x !== m.length);
}

/** One row of the results table. */
function resultRow(quantity: Child, role: string, perCase: readonly (number | null)[], kind: "force" | "moment", unit: string, source: string, cases: readonly LoadCase[]): Html {
  return el(
    "tr",
    { "data-role": role },
    el("th", { scope: "row" }, quantity),
    ...perCase.map((v, k) => numCell(v, kind, { "data-case": cases[k] })),
    el("td", { class: "unit" }, unit),
    el("td", { class: "source" }, source),
  );
}

/** The results table of a flexural member: reactions, V max, M max per case (unfactored, live load not reduced). */
function resultsTable(record: TakedownRecord, m: MemberLoads, r: MemberResult, cases: readonly LoadCase[]): Html {
  const u = RESULT_UNITS[record.model.units];
  const head = el(
    "tr",
    {},
    el("th", {}, "Result"),
    ...caseHeaders(cases),
    el("th", {}, "Unit"),
    el("th", {}, "Source"),
  );
  const rows: Html[] = m.supports.map((s, k) =>
    resultRow(
      join([`R${k + 1} at ${length(s.x ?? Number.NaN)} ${u.length}`, el("span", { class: "sub" }, ` on ${supportLabel(s, u.length)}`)]),
      `reaction-${k + 1}`,
      cases.map((c) => r.reactions[c]?.[k] ?? null),
      "force",
      u.force,
      SOURCES.reaction,
      cases,
    ),
  );
  rows.push(resultRow("V max", "shear-max", cases.map((c) => r.shearMax[c] ?? null), "force", u.force, SOURCES.shear, cases));
  rows.push(resultRow("M max (sagging)", "moment-max", cases.map((c) => r.momentMax[c] ?? null), "moment", u.moment, SOURCES.moment, cases));
  if (hasOverhang(m)) rows.push(resultRow("M min (hogging)", "moment-min", cases.map((c) => hoggingOf(m, c)), "moment", u.moment, SOURCES.hogging, cases));
  return el("table", { class: "results", "data-role": "results" }, el("thead", {}, head), el("tbody", {}, ...rows));
}

/** One row of a quantity table: its name, value cell, unit and source. */
function quantityRow(name: string, role: string, cell: Html, unit: string, source: string): Html {
  return el("tr", { "data-role": role }, el("th", { scope: "row" }, name), cell, el("td", { class: "unit" }, unit), el("td", { class: "source" }, source));
}

/** A table of quantities: name (headed `title`) | Value | Unit | Source, one row each. */
function quantityTable(title: string, role: string, rows: readonly (Html | null)[]): Html {
  return el(
    "table",
    { class: "reduction", "data-role": role },
    el("thead", {}, el("tr", {}, el("th", {}, title), el("th", { class: "num" }, "Value"), el("th", {}, "Unit"), el("th", {}, "Source"))),
    el("tbody", {}, ...rows),
  );
}

/** Tributary area and live load reduction of a beam. */
function reductionTable(record: TakedownRecord, m: MemberLoads, r: MemberResult): Html | null {
  if (m.liveReduction === null) return null;
  if (r.tributaryArea === 0) return el("p", { class: "note", "data-role": "reduction" }, "No reducible live load on this member (A_T = 0): live load reduction does not apply.");
  const u = RESULT_UNITS[record.model.units];
  const kll = m.liveReduction.kll;
  return quantityTable("Live load reduction", "reduction", [
    quantityRow("A_T", "area", numCell(r.tributaryArea, "area"), u.area, SOURCES.areaT),
    quantityRow("K_LL", "kll", numCell(kll, "count"), "", SOURCES.kll),
    quantityRow("K_LL·A_T", "kll-at", numCell(kll * r.tributaryArea, "area"), u.area, SOURCES.llr),
    quantityRow("L/Lo", "llr", numCell(r.llrFactor, "factor"), "", SOURCES.llr),
  ]);
}

function figure(svg: string, role: string): Html {
  return el("figure", { class: "drawing", "data-role": role }, raw(svg));
}

/** Role of a quantity's row in the governing table: "governing-moment-max", "governing-reaction-2-min". */
export function governingRole(q: GoverningQuantity): string {
  switch (q.kind) {
    case "momentMax":
      return "governing-moment-max";
    case "momentMin":
      return "governing-moment-min";
    case "shearMax":
      return "governing-shear-max";
    case "reactionMax":
      return `governing-reaction-${q.support + 1}-max`;
    case "reactionMin":
      return `governing-reaction-${q.support + 1}-min`;
  }
}

/** Name of a quantity in the governing table. */
function governingName(q: GoverningQuantity, m: MemberLoads, lengthUnit: string): Child {
  switch (q.kind) {
    case "momentMax":
      return "M+ (largest sagging)";
    case "momentMin":
      return "M\u2212 (most hogging)";
    case "shearMax":
      return "|V| max";
    case "reactionMax":
    case "reactionMin": {
      const s = m.supports[q.support];
      const where = s ? el("span", { class: "sub" }, ` at ${length(s.x ?? Number.NaN)} ${lengthUnit} on ${supportLabel(s, lengthUnit)}`) : null;
      return join([`R${q.support + 1} ${q.kind === "reactionMax" ? "max" : "min"}`, where]);
    }
  }
}

/**
 * The governing values of a beam: each factored quantity with its own combination (terms of cases
 * that load the member only) and live load pattern (ASCE/SEI 7-22 Sec. 4.3.3), where it occurs.
 * A reaction min below 0 is uplift (the support must hold the member down); an M- of 0 means the
 * member never hogs.
 */
function governingTable(record: TakedownRecord, m: MemberLoads, g: MemberGoverning): Html {
  const u = RESULT_UNITS[record.model.units];
  const upliftBelow = -1e-9 * Math.max(0, ...g.envelope.reactionMax.map((r) => Math.abs(r.value)));
  // The note column (uplift) only where some support lifts.
  const anyUplift = g.envelope.reactionMin.some((r) => r.value < upliftBelow);
  const rows = quantitiesOf(m.supports.length).map((q) => {
    const v = governingValueOf(g.envelope, q)!;
    const moment = q.kind === "momentMax" || q.kind === "momentMin";
    // Round-off (within 1e-9 of the member's largest value of the kind) is neither hogging nor uplift.
    const none = q.kind === "momentMin" && Math.abs(v.value) <= 1e-9 * Math.abs(g.envelope.momentMax.value);
    const uplift = q.kind === "reactionMin" && v.value < upliftBelow;
    return el(
      "tr",
      { "data-role": governingRole(q), ...(uplift ? { "data-uplift": "yes" } : {}) },
      el("th", { scope: "row" }, governingName(q, m, u.length)),
      numCell(v.value, moment ? "moment" : "force", { "data-case": "governing" }),
      el("td", { class: "unit" }, moment ? u.moment : u.force),
      q.kind === "reactionMax" || q.kind === "reactionMin" || none ? el("td", {}, "") : numCell(v.x, "length", { "data-field": "x" }),
      el("td", { class: "combo" }, none ? "never hogs" : labelOnMember(v.combination, g.present)),
      el("td", { class: "pattern" }, none ? "" : v.pattern === "no pattern" ? "no live load" : v.pattern),
      anyUplift ? el("td", { class: "note" }, uplift ? "uplift: hold down" : "") : null,
    );
  });
  const caption = g.envelope.proven
    ? null
    : el("p", { class: "note" }, "Patterns: too many spans to check every on/off pattern; the alternating-span rule was used with a load of mixed direction, so these values are not proven to govern.");
  return join([
    el(
      "table",
      { class: "results governing", "data-role": "governing" },
      el("thead", {}, el("tr", {}, el("th", {}, "Quantity"), el("th", { class: "num" }, "Value"), el("th", {}, "Unit"), el("th", { class: "num" }, `At (${u.length})`), el("th", {}, "Combination"), el("th", {}, "Live load pattern"), anyUplift ? el("th", {}, "Note") : null)),
      el("tbody", {}, ...rows),
    ),
    caption,
  ]);
}

/** A flexural member's section. */
function flexuralSection(record: TakedownRecord, m: MemberLoads, index: number): Html {
  const r = record.json.members[m.mark];
  const u = RESULT_UNITS[record.model.units];
  const cases = casesOn(record, m);
  // Cases that put no load on the member are left out of its tables (their results are all 0).
  const shown = cases.length > 0 ? cases : record.model.cases.slice(0, 1);
  const governed = memberGoverningCached(m);
  const g = governed !== null && governed.ok ? governed.value : null;
  const supports = m.supports.map((s) => `${s.end} at ${length(s.x ?? Number.NaN)} ${u.length} on ${supportLabel(s, u.length)}`).join("; ");
  const facts = el("p", { class: "facts" }, `Length ${m.length === null ? "?" : length(m.length)} ${u.length}; pinned supports: ${supports}.`);
  const figures = [
    ...cases.map((c) => figure(renderMemberSheet(memberDrawing(m, record.model.units, c, caseMagnitudes(m, c))), `sheet-${c}`)),
  ];
  if (g !== null && cases.length > 0) {
    const q: GoverningQuantity = { kind: "momentMax" };
    figures.push(figure(renderMemberSheet(governingDrawing(m, record.model.units, governingCaption(g, q), governingPieces(m, g, governingValueOf(g.envelope, q)!))), "sheet-governing"));
  }
  const tree = loadPathTree(record.members, m.mark, "D", record.model.units);
  if (tree) figures.push(figure(renderLoadPath(tree), "load-path"));
  const liveNote =
    g !== null && m.liveReduction !== null && g.present.includes("L") && m.liveReduction.llrFactor < 1
      ? el("p", { class: "note" }, `In the factored combinations the reducible live load is multiplied by L/Lo = ${fixed(m.liveReduction.llrFactor, DECIMALS.factor)} (${SOURCES.llr}).`)
      : null;
  const governingPart =
    g !== null
      ? governingTable(record, m, g)
      : governed !== null && !governed.ok
        ? el("p", { class: "note", "data-role": "governing-error" }, `Governing values not computed: ${governed.error.message}`)
        : null;
  return el(
    "section",
    { class: "member flexural", id: sectionId(index), "data-mark": m.mark },
    heading(m),
    facts,
    el("h3", {}, "Loads on the member"),
    loadsTable(record, m, shown),
    el("h3", {}, "Results"),
    r ? resultsTable(record, m, r, shown) : el("p", {}, "No results for this member."),
    g !== null || governingPart !== null ? el("h3", {}, "Governing values (factored)") : null,
    governingPart,
    liveNote,
    r ? reductionTable(record, m, r) : null,
    el("h3", { class: "figures-title" }, "Free-body, shear and moment diagrams per case (unfactored) and of the case that governs M+ (factored); load path (case D)"),
    el("div", { class: "figures" }, ...figures),
  );
}

/** A column's results table (from the takedown's column results). */
function columnTable(record: TakedownRecord, c: ColumnResult): Html {
  const u = RESULT_UNITS[record.model.units];
  const governing = governingOf(c);
  return quantityTable("Result", "column-results", [
    quantityRow("A_T", "area", numCell(c.tributaryArea, "area"), u.area, SOURCES.areaT),
    quantityRow("Floors supported", "floors", numCell(c.floors, "count"), "", "Levels of the stack where floor live load arrives"),
    quantityRow("K_LL·A_T", "kll-at", numCell(c.kllAt, "area"), u.area, SOURCES.llr),
    quantityRow("L/Lo", "llr", numCell(c.llrFactor, "factor"), "", SOURCES.llr),
    quantityRow("L reduced", "reduced-live", numCell(c.reducedLive, "force"), u.force, SOURCES.reducedLive),
    governing ? quantityRow(`Governing: ${governing.label}`, "governing", numCell(governing.value, "force"), u.force, SOURCES.governing) : null,
  ]);
}

/**
 * The governing (largest) combination of a column's combination record; ties go to the first.
 * Its label keeps only the terms of cases that load the column ("2.3.1 (2) 1.2D + 1.6L").
 * @param c - a column's results
 * @returns its label and value, or null when it has none
 */
export function governingOf(c: ColumnResult): { label: string; value: number } | null {
  let best: { label: string; value: number } | null = null;
  for (const [label, value] of Object.entries(c.combos)) if (best === null || value > best.value) best = { label, value };
  if (best === null) return null;
  const combination = gravityCombinations().find((k) => k.label === best!.label);
  if (combination === undefined) return best;
  const effect = (t: CombinationTerm): number => (t.load === "L" ? c.reducedLive : (c.cumulative[t.load] ?? 0));
  return { label: shortLabel(combination, combination.terms.filter((t) => effect(t) !== 0)), value: best.value };
}

/** A column's, wall's or foundation's section. */
function axialSection(record: TakedownRecord, m: MemberLoads, index: number, startsPage: boolean): Html {
  const u = RESULT_UNITS[record.model.units];
  const column = record.json.columns[m.mark];
  const base = m.supports[0];
  const facts =
    m.type === "column"
      ? `Height ${m.length === null ? "not given" : `${length(m.length)} ${u.length}`}; bears on ${base ? base.mark : "nothing"}.`
      : `End of the load path: what bears on this ${m.type} is listed below.`;
  const tree = loadPathTree(record.members, m.mark, "D", record.model.units);
  const totals = el(
    "table",
    { class: "results", "data-role": "totals" },
    el("thead", {}, el("tr", {}, el("th", {}, "Total"), ...caseHeaders(record.model.cases), el("th", {}, "Unit"))),
    el("tbody", {}, el("tr", { "data-role": "total" }, el("th", { scope: "row" }, m.type === "column" ? "Cumulative at the base" : "Reaction"), ...record.model.cases.map((c) => numCell(m.reactions[c]?.[0] ?? null, "force", { "data-case": c })), el("td", { class: "unit" }, u.force))),
  );
  return el(
    "section",
    { class: `member axial ${m.type}${startsPage ? " first-axial" : ""}`, id: sectionId(index), "data-mark": m.mark },
    heading(m),
    el("p", { class: "facts" }, facts),
    el("h3", {}, m.type === "column" ? "Loads arriving at this level" : "Loads bearing on it"),
    loadsTable(record, m, record.model.cases),
    totals,
    column ? el("h3", {}, "Live load reduction and factored load") : null,
    column ? columnTable(record, column) : null,
    tree ? el("div", { class: "figures" }, figure(renderLoadPath(tree), "load-path")) : null,
  );
}

/**
 * The section of one member.
 * @param record - the takedown as the report reads it
 * @param mark - the member
 * @param index - its position among the report's sections (for its id)
 * @param startsPage - a column, wall or foundation section that starts on a new page (beams always do)
 * @returns the section's markup, or null when the member is not in the takedown
 */
export function memberSection(record: TakedownRecord, mark: string, index: number, startsPage = false): Html | null {
  const m = record.members.get(mark);
  if (m === undefined) return null;
  return isFlexural(m.type) ? flexuralSection(record, m, index) : axialSection(record, m, index, startsPage);
}

/** Short description of a member for the contents: "beam, level 2". */
export function contentsLine(m: MemberLoads): string {
  return `${m.type}${m.level !== "" ? `, level ${m.level}` : ""}`;
}
