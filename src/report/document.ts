/**
 * The calculation report of a takedown as one self-contained HTML document: no script, no
 * external resource (a Content-Security-Policy forbids loading anything), inline CSS and inline
 * SVG only, laid out to print cleanly to PDF from a browser (margins, a page break before each
 * beam's section, drawings never wider than the page nor split across pages).
 */
import { isFlexural } from "../engine/takedown/model";
import { RESULT_UNITS } from "../engine/takedown/units";
import type { TakedownRecord } from "./collect";
import { levelCheckTable, loadSchedule, provisionsTable, reactionSummary } from "./building";
import { children, el, join, raw, type Child, type Html } from "./html";
import { contentsLine, memberSection, sectionId } from "./member-section";
import { balanceTable, columnSchedule, foundationTable, problemList } from "./schedule";
import { assumptions, CODE_EDITIONS, REPORT_CAUTION } from "./text";
import { keyPlanOfModel, renderKeyPlan } from "../drawings/key-plan";
import { planLevels, renderFramingPlan, type FramingPlanModel } from "../drawings/plan";

/** What a report is made of. */
export interface ReportInput {
  readonly record: TakedownRecord;
  /** Project name (from the workbook, else the file name). */
  readonly project: string;
  /** The workbook's file name, as shown. */
  readonly sourceFile: string;
  /** Date printed in the title block. */
  readonly date: string;
  /** Marks of the members given a section (printed in takedown order; unknown marks are ignored). */
  readonly members: readonly string[];
  /** What generated the report, e.g. "Loadpath 0.1.0". */
  readonly generator?: string;
  /** Job number or name, printed on the title page and in the running header. */
  readonly job?: string;
  /** Tables only: no per-member sheets (`--summary`). */
  readonly summary?: boolean;
  /** The framing plan the takedown was derived from, if any: its levels are drawn instead of the schematic key plan. */
  readonly framing?: FramingPlanModel;
}

/** The key plan part: each level's framing plan when the takedown comes from a plan, else the schematic key plan. */
function keyPlans(input: ReportInput): Html {
  const f = input.framing;
  if (f) return join([...planLevels(f)].reverse().map((l) => el("figure", { class: "plan", "data-role": "key-plan-level", "data-plan-level": l }, raw(renderFramingPlan(f, l)))));
  return el("figure", { class: "plan", "data-role": "key-plan-level" }, raw(renderKeyPlan(keyPlanOfModel(input.record.model, input.record.levels))));
}

/** The Content-Security-Policy of every report: nothing may be loaded. */
export const REPORT_CSP = "default-src 'none'; style-src 'unsafe-inline'; img-src data:";

/** Print and screen style (inline; the policy allows nothing else). */
export const REPORT_CSS = `
@page { margin: 16mm 14mm 16mm 14mm; }
* { box-sizing: border-box; }
html { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
body { font-family: Arial, "Liberation Sans", "Helvetica Neue", "DejaVu Sans", sans-serif; font-size: 9.5pt; line-height: 1.35; color: #1f2328; margin: 0 auto; max-width: 190mm; padding: 0 1mm; }
@media screen { body { padding: 12mm 10mm; } }
h1 { font-size: 16pt; margin: 0 0 2mm; }
h2 { font-size: 13pt; margin: 0 0 2mm; padding-bottom: 1mm; border-bottom: 1.5px solid #1f2328; }
h2 .kind { font-weight: normal; color: #6b7280; font-size: 10.5pt; }
h3 { font-size: 10.5pt; margin: 4mm 0 1.5mm; }
h2, h3 { break-after: avoid; page-break-after: avoid; }
p { margin: 1.5mm 0; }
ul { margin: 1.5mm 0; padding-left: 5mm; }
li { margin: 0.8mm 0; }
.caution { border: 1.5px solid #c2410c; background: #fff7f2; padding: 2mm 3mm; margin: 3mm 0; font-weight: bold; break-inside: avoid; }
table { border-collapse: collapse; width: 100%; margin: 1.5mm 0 2mm; break-inside: auto; font-size: 8.5pt; }
thead { display: table-header-group; }
tr { break-inside: avoid; }
th, td { border: 0.75px solid #c9ced6; padding: 0.8mm 1.4mm; text-align: left; vertical-align: top; }
thead th { background: #eef0f4; font-weight: bold; }
tbody th { font-weight: normal; background: #f7f8fa; }
.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
th.num { white-space: normal; }
table.schedule { font-size: 7.5pt; }
table.schedule th, table.schedule td { padding: 0.6mm 1mm; }
td.mark { white-space: nowrap; }
td.source { color: #4b5563; font-size: 7.5pt; }
td.unit { white-space: nowrap; }
.sub { color: #6b7280; }
.combo { font-weight: normal; white-space: normal; }
th.governing { background: #e5edff; }
.title-block { border: 1.5px solid #1f2328; margin: 0 0 3mm; }
.title-block th { width: 28mm; background: #f7f8fa; }
.title-block td.fill { height: 7mm; }
.title-block td.fill span { display: block; border-bottom: 0.75px solid #1f2328; height: 5mm; }
.contents { columns: 3; font-size: 8.5pt; }
.contents li { break-inside: avoid; }
section { margin: 0 0 4mm; }
section.member.flexural { break-before: page; }
section.first-axial { break-before: page; }
section.member.axial { break-inside: avoid; margin-top: 5mm; }
section.schedules { break-before: page; }
section.title-page { break-after: page; }
section.building { break-before: page; }
.running-head { display: none; }
table.provisions { font-size: 8pt; }
table.reactions td.mark { font-size: 7pt; }
tr[data-role="level-total"] td, tr[data-role="level-total"] th { border-top: 1.5px solid #1f2328; }
.toc { columns: 1; }
.figures { font-size: 0; orphans: 1; widows: 1; }
figure.drawing { display: inline-block; vertical-align: top; margin: 0 4mm 3mm 0; width: 84mm; max-width: 100%; break-inside: avoid; page-break-inside: avoid; font-size: 9.5pt; }
figure.drawing:nth-child(2n) { margin-right: 0; }
figure.plan { display: block; width: 100%; margin: 0 0 4mm; break-inside: avoid; page-break-inside: avoid; }
svg { display: block; max-width: 100%; height: auto; }
.note { color: #4b5563; font-size: 8.5pt; }
.problems li { color: #b91c1c; }
tbody.stack { break-inside: avoid; }
tr.stack-head th { background: #eef0f4; font-weight: bold; }
footer { margin-top: 5mm; }
`;

function titleBlock(input: ReportInput): Html {
  const u = RESULT_UNITS[input.record.model.units];
  const { options } = input.record;
  const tables = [`Zones: ${options.zones}`, `Members: ${options.members}`, ...(options.loads ? [`Loads: ${options.loads}`] : [])].join("; ");
  const row = (name: string, value: Html | string, cls?: string): Html => el("tr", {}, el("th", { scope: "row" }, name), el("td", cls ? { class: cls } : {}, value));
  const fill = (): Html => el("span", {}, "");
  return el(
    "table",
    { class: "title-block", "data-role": "title-block" },
    el(
      "tbody",
      {},
      row("Project", el("span", { "data-role": "project" }, input.project)),
      ...(input.job !== undefined ? [row("Job", el("span", { "data-role": "job" }, input.job))] : []),
      row("Engineer", fill(), "fill"),
      row("Checked by", fill(), "fill"),
      row("Date", el("span", { "data-role": "date" }, input.date)),
      row("Units", `${input.record.model.units}: lengths ${u.length}, line loads ${u.line}, forces ${u.force}, moments ${u.moment}, areas ${u.area}`),
      row("Code editions", el("ul", {}, ...CODE_EDITIONS.map((c) => el("li", {}, c)))),
      row("Workbook", `${input.sourceFile} (${tables})`),
      row("Generated by", `${input.generator ?? "Loadpath"}: load takedown of the workbook's member tables`),
    ),
  );
}

function caution(role: string): Html {
  return el("p", { class: "caution", "data-role": role }, REPORT_CAUTION);
}

/** The chosen members that are in the takedown, in takedown order. */
function chosen(input: ReportInput): string[] {
  const wanted = new Set(input.members);
  return [...input.record.members.keys()].filter((m) => wanted.has(m));
}

function contents(input: ReportInput, marks: readonly string[]): Html | null {
  if (marks.length === 0) return null;
  return el(
    "ol",
    { class: "contents", "data-role": "contents" },
    ...marks.map((mark, i) => el("li", {}, el("a", { href: `#${sectionId(i)}` }, mark), ` (${contentsLine(input.record.members.get(mark)!)})`)),
  );
}

function summary(input: ReportInput): string {
  const byType = new Map<string, number>();
  for (const m of input.record.members.values()) byType.set(m.type, (byType.get(m.type) ?? 0) + 1);
  const counts = [...byType].map(([t, n]) => `${n} ${t}${n === 1 ? "" : "s"}`).join(", ");
  const lv = input.record.levels;
  const levels = lv.length === 0 ? "" : lv.length === 1 ? ` on level ${lv[0]}` : ` on ${lv.length} levels (from the top: ${lv.join(", ")})`;
  return `The takedown carries ${counts}${levels}, in load cases ${input.record.model.cases.join(", ")}.`;
}

/**
 * Text as a CSS string literal: every character but letters, digits and spaces written as a CSS
 * escape (so a quote, a backslash or "</style>" in a project name cannot end the string or the
 * style element); control characters left out.
 */
export function cssString(text: string): string {
  let out = "";
  for (const ch of text) {
    const code = ch.codePointAt(0)!;
    if (code < 0x20 || (code >= 0x7f && code < 0xa0)) continue;
    out += /[A-Za-z0-9 ]/.test(ch) ? ch : `\\${code.toString(16)} `;
  }
  return `"${out}"`;
}

/** The running header and footer of every printed page (CSS paged media margin boxes, with page counters). */
export function pageCss(input: ReportInput): string {
  const head = input.job !== undefined && input.job !== "" ? `${input.project} · Job ${input.job}` : input.project;
  const box = "font-family: Arial, \"Liberation Sans\", \"DejaVu Sans\", sans-serif; font-size: 7.5pt; color: #4b5563;";
  return `@page {
  @top-left { content: ${cssString(head)}; ${box} }
  @top-right { content: ${cssString(`Load takedown calculation report · ${input.date}`)}; ${box} }
  @bottom-left { content: "Results need a qualified engineer\\2019 s review; local codes govern."; ${box} }
  @bottom-right { content: "Page " counter(page) " of " counter(pages); ${box} }
}`;
}

/** One numbered section of the building-wide part: id, heading and content. */
interface Part {
  readonly id: string;
  readonly title: string;
  readonly content: Html;
}

/**
 * The whole report.
 * @param input - the takedown, the title block's fields and the members to detail
 * @returns a complete HTML document (UTF-8), self-contained
 */
export function renderReport(input: ReportInput): string {
  const marks = input.summary === true ? [] : chosen(input);
  const { record } = input;
  const sections: Html[] = [];
  const firstAxial = marks.find((mark) => !isFlexural(record.members.get(mark)!.type));
  marks.forEach((mark, i) => {
    const s = memberSection(record, mark, i, mark === firstAxial);
    if (s !== null) sections.push(s);
  });
  const problems = problemList(record);
  const schedule = columnSchedule(record);
  const foundations = foundationTable(record);
  const reactions = reactionSummary(record);
  const levels = levelCheckTable(record);
  const parts: Part[] = [];
  const add = (id: string, title: string, ...content: Child[]): void => void parts.push({ id, title, content: join(content) });
  add("load-schedule", "Load schedule", el("p", { class: "note" }, `The Zones table as read: area loads per case (a dash: the case does not act on the zone) and whether the zone's live load may be reduced (ASCE/SEI 7-22 Sec. 4.7).`), loadSchedule(record));
  add("key-plan", "Key plan", el("p", { class: "note" }, input.framing ? "The framing plan of each level as derived: members by type, columns, decks with their span, each member's tributary area shaded." : "Schematic, not to scale: each level's members and what each bears on, the columns of a stack in one line."), keyPlans(input));
  add("provisions", "Code provisions used", provisionsTable(record));
  add("assumptions", "Assumptions and methods", el("ul", {}, ...assumptions(record.model.units).map((a) => el("li", {}, a))));
  if (reactions) add("reactions", "Beam end reactions", el("p", { class: "note" }, "Every beam, girder and joist: the vertical reaction at each end per load case, unfactored, live load not reduced (up +), and the member or column each end bears on: the loads its connections transfer."), reactions);
  if (levels) add("level-check", "Load check per level", el("p", { class: "note" }, "For each level and case: the load applied directly on the level's members (zone loads, line loads wX and Loads rows, not the reactions received from other members), the loaded area (each zone load's width × loaded length), their ratio against the zones' area loads, the same zone loads × area from the Zones table, and the difference: the line and point loads entered. The total of every level equals the load balance's applied load."), levels);
  if (schedule) add("columns", "Column schedule", el("p", { class: "note" }, "Each stack from the top level down: cumulative unfactored loads, live load reduction (ASCE/SEI 7-22 Sec. 4.7) and the governing gravity combination (Sec. 2.3.1, LRFD, with the reduced live load)."), schedule);
  if (foundations) add("foundations", "Foundation and wall reactions", el("p", { class: "note" }, "Unfactored, live load not reduced."), foundations);
  add("balance", "Load balance", el("p", { class: "note" }, "Applied load = foundation and wall reactions, per case."), balanceTable(record));
  if (problems) add("problems", "Problems found in the tables", el("p", {}, "Members with a problem are left out of the takedown; the others are computed."), problems);
  add(
    "members",
    "Member sheets",
    el("p", {}, summary(input)),
    input.summary === true ? el("p", { "data-role": "summary-note" }, "Summary report: the member sheets are left out (run without --summary for them).") : (contents(input, marks) ?? el("p", {}, "No member was chosen for a detailed section.")),
  );
  const toc = el("ol", { class: "toc", "data-role": "contents" }, ...parts.map((p) => el("li", {}, el("a", { href: `#${p.id}` }, p.title))));
  const body = join([
    el("section", { class: "title-page", "data-role": "title-page" }, el("h1", {}, "Load takedown: calculation report"), titleBlock(input), caution("caution-top"), el("h2", {}, "Contents"), toc),
    el("section", { class: "building" }, ...parts.map((p, k) => el("section", { id: p.id, "data-role": `part-${p.id}` }, el("h2", {}, `${k + 1}. ${p.title}`), p.content))),
    ...sections,
    el("footer", {}, caution("caution-bottom")),
  ]);
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="${REPORT_CSP}">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${children(`Calculation report: ${input.project}`)}</title>
<style>${REPORT_CSS}</style>
<style>${pageCss(input)}</style>
</head>
<body>
${body.html}
</body>
</html>
`;
}
