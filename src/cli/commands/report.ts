/**
 * `loadpath report <in.xlsx> -o report.html [--only B-12,G-3 | --all] [--units US|SI] ...`:
 * the printable calculation report of the takedown. Builds the takedown headless (the same build
 * as `loadpath takedown`), reads every member's loads and results back from the computed sheet,
 * and writes one self-contained HTML file (no scripts, nothing loaded) that prints cleanly to PDF
 * from a browser. The input file is never written; the report is written whole or not at all.
 */
import { basename, extname, join, resolve } from "node:path";
import type ExcelJS from "exceljs";
import { isFlexural } from "../../engine/takedown/model";
import { collectTakedown, renderReport, type TakedownRecord } from "../../report";
import { writeTextAtomically } from "../../workbook/files";
import type { XlsxWorkbook } from "../../workbook/xlsx";
import { EXIT, outputsRefused, parseVerbArgs, singleInput, usageOnThrow, type CliIO, type Command } from "../shared";
import { runOfOptions, TABLE_OPTIONS_USAGE, tableOptions, tableOrSheet, takedownOfFile, unitsHint, type TakedownRun } from "../takedown-input";
import { planInputOf } from "../plan-input";
import type { DemoPart } from "./demo";
import { describeTakedownProblem } from "./takedown";

const USAGE = `Usage: loadpath report <in.xlsx> [-o <report.html>] [--only <mark,mark,...> | --all]
                       [--zones <name>] [--members <name>] [--loads <name>]
                       [--map <table>.<Column>=<your header> ...] [--header-row [<table>=]<row>]
                       [--units US|SI] [--sheet <name>] [--replace] [--project <name>] [--date <text>]
                       [--job <text>] [--summary]

Writes a printable calculation report of the workbook's load takedown: a title page (project,
job, engineer, date, units, code editions) with the contents, the load schedule (zones, loads
per case, reducible), a schematic key plan of the levels, the code provisions used with
their sources, the assumptions, every beam's end reactions per case, a load check per level,
the column schedule, the foundation and wall reactions and the load balance, then a sheet for each chosen member (its loads and where
each comes from, reactions, shear and moment per case and for the governing factored
combination, live load reduction, free-body, shear and moment diagrams and its load path).
Printed pages carry a running header (project, job, date) and "Page x of y". One HTML file with
no scripts and nothing to load; print it to PDF from a browser.

  -o, --output     HTML file to write (never the input file); without -o the takedown and the
                   report are built and checked, and nothing is written
  --only           marks of the members to detail, separated by commas (repeatable)
  --all            every beam, girder, joist and column (the default)
  --summary        the tables only, without the member sheets
${TABLE_OPTIONS_USAGE}
  --project        project name (default: the workbook's title, its defined name Project,
                   else the file name)
  --date           date printed in the title block (default: today)
  --job            job number or name, printed on the title page and in every page's header

Problems are listed on stderr as Sheet!A1: message and in the report. Exit status: 0 written
without problems, 1 problems found (the report of what could be built is still written),
2 usage or file errors (nothing written). Interface: docs/interface.md.
Results need review by a qualified engineer; local codes govern.`;

/** Text of a cell as the user sees it (rich text and formulas' results included). */
function cellText(cell: ExcelJS.Cell): string {
  const v = cell.formula ? cell.result : cell.value;
  if (v === null || v === undefined) return "";
  if (typeof v === "object" && "richText" in v) return v.richText.map((r) => r.text).join("");
  return typeof v === "object" ? "" : String(v);
}

/**
 * The project's name: the workbook's title property, else the cell its defined name "Project"
 * points at, else the file name without its extension.
 * @param workbook - the workbook read
 * @param input - its path
 */
export function projectName(workbook: XlsxWorkbook, input: string): string {
  const title = workbook.excel.title?.trim();
  if (title) return title;
  for (const name of ["Project", "ProjectName", "Project_Name"]) {
    const ranges = workbook.excel.definedNames.getRanges(name)?.ranges ?? [];
    const m = /^'?((?:[^']|'')+?)'?!\$?([A-Z]{1,3})\$?(\d+)$/.exec(ranges[0] ?? "");
    const text = m ? cellText(workbook.excel.getWorksheet(m[1]!.replace(/''/g, "'"))?.getCell(`${m[2]}${m[3]}`) ?? ({} as ExcelJS.Cell)).trim() : "";
    if (text !== "") return text;
  }
  return basename(input, extname(input));
}

/** Today as YYYY-MM-DD (local time). */
function today(): string {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, "0")}-${String(d.getDate()).padStart(2, "0")}`;
}

/** Marks of `--only` (comma-separated, repeatable), trimmed, without blanks. */
export function parseMarks(values: readonly string[]): string[] {
  return values.flatMap((v) => v.split(",")).map((m) => m.trim()).filter((m) => m !== "");
}

/** The default choice (`--all`): every beam, girder, joist and column, in takedown order. */
export function allMembers(record: TakedownRecord): string[] {
  return [...record.members.values()].filter((m) => isFlexural(m.type) || m.type === "column").map((m) => m.mark);
}

/** What a report run needs besides the takedown's table options. */
export interface ReportRun {
  /** Marks to detail; undefined = every beam, girder, joist and column. */
  readonly members?: readonly string[];
  readonly project?: string;
  readonly date?: string;
  readonly job?: string;
  /** Tables only, no member sheets. */
  readonly summary?: boolean;
}

/** Outcome of {@link reportOfFile}. */
export interface ReportFileResult {
  readonly status: number;
  /** The HTML, when the takedown could be built. */
  readonly html?: string;
  readonly record?: TakedownRecord;
}

/**
 * Build the takedown of a file and its report in memory (nothing written).
 * @param input - workbook to read
 * @param run - the takedown's table options
 * @param report - members, project name and date
 * @param io - where problems and messages go
 */
export async function reportOfFile(input: string, run: TakedownRun, report: ReportRun, io: CliIO): Promise<ReportFileResult> {
  const file = await takedownOfFile(input, run);
  const { result, workbook, port, options } = file;
  for (const p of result.problems) io.err(describeTakedownProblem(p));
  const hint = result.problems.length > 0 ? unitsHint(file) : undefined;
  if (hint !== undefined) io.err(`loadpath report: ${hint}`);
  if (!result.ok || !result.json) {
    io.out("Nothing was built: the problems above stop the takedown, so there is no report.");
    return { status: EXIT.failed };
  }
  const record = await collectTakedown(port, options, result.json);
  // Numbers the report could not print are problems too (collectTakedown lists them after the build's).
  for (const p of record.json.problems.slice(result.problems.length)) io.err(describeTakedownProblem(p));
  const members = report.members ?? allMembers(record);
  const unknown = members.filter((m) => !record.members.has(m));
  if (unknown.length > 0) {
    io.err(`loadpath report: not in the takedown: ${unknown.join(", ")} (a mark of the Members table, spelled as there, not left out by a problem).`);
    return { status: EXIT.usage };
  }
  // a workbook that also holds a framing plan gets its levels drawn as the report's key plan
  const framingName = tableOrSheet(workbook, "Framing");
  const plan = framingName !== undefined && framingName.toLowerCase() !== options.members.toLowerCase() ? await planInputOf(workbook, { tables: {}, mapping: {}, units: options.units }, port) : undefined;
  const drawPlan = plan?.kind === "framing" && plan.problems.length === 0 && plan.model.derivation.members.length > 0;
  if (plan?.kind === "framing" && !drawPlan) io.err(`loadpath report: the ${framingName} table does not derive cleanly (loadpath plan lists why); the report shows the schematic key plan instead.`);
  const html = renderReport({
    ...(drawPlan ? { framing: plan.model } : {}),
    record,
    project: report.project ?? projectName(workbook, input),
    sourceFile: basename(input),
    date: report.date ?? today(),
    members,
    generator: "Loadpath",
    ...(report.job !== undefined ? { job: report.job } : {}),
    ...(report.summary === true ? { summary: true } : {}),
  });
  return { status: record.json.problems.length > 0 ? EXIT.failed : EXIT.ok, html, record };
}

const report: Command = {
  summary: "write a printable calculation report (HTML) of a workbook's takedown",
  usage: USAGE,
  async run(args, io) {
    const parsed = parseVerbArgs(
      "report",
      USAGE,
      args,
      {
        output: { type: "string", short: "o" },
        only: { type: "string", multiple: true },
        all: { type: "boolean" },
        ...tableOptions(),
        project: { type: "string" },
        date: { type: "string" },
        job: { type: "string" },
        summary: { type: "boolean" },
      },
      io,
    );
    if (!parsed) return EXIT.usage;
    const input = singleInput("report", USAGE, parsed.positionals, io);
    if (input === undefined) return EXIT.usage;
    const v = parsed.values;
    const output = typeof v.output === "string" ? v.output : undefined;
    if (outputsRefused("report", [input], [output !== undefined ? { option: "-o", path: output } : undefined], io)) return EXIT.usage;
    const onlyValues = Array.isArray(v.only) ? v.only.filter((m): m is string => typeof m === "string") : [];
    if (onlyValues.length > 0 && v.all === true) {
      io.err("loadpath report: give --only or --all, not both.");
      return EXIT.usage;
    }
    if (v.summary === true && (onlyValues.length > 0 || v.all === true)) {
      io.err("loadpath report: --summary leaves out the member sheets; give it without --only or --all.");
      return EXIT.usage;
    }
    const marks = parseMarks(onlyValues);
    if (onlyValues.length > 0 && marks.length === 0) {
      io.err("loadpath report: --only lists no mark.");
      return EXIT.usage;
    }
    const checked = runOfOptions(v);
    if ("error" in checked) {
      io.err(`loadpath report: ${checked.error}`);
      return EXIT.usage;
    }
    return usageOnThrow("report", io, async () => {
      const r = await reportOfFile(input, checked.run, {
          ...(marks.length > 0 ? { members: marks } : {}),
          ...(typeof v.project === "string" ? { project: v.project } : {}),
          ...(typeof v.date === "string" ? { date: v.date } : {}),
          ...(typeof v.job === "string" ? { job: v.job } : {}),
          ...(v.summary === true ? { summary: true } : {}),
        }, io);
      if (r.html === undefined) return r.status;
      const what = v.summary === true ? "Summary calculation report (tables only, no member sheets)" : `Calculation report of ${marks.length > 0 ? marks.length : allMembers(r.record!).length} member(s)`;
      if (output === undefined) {
        io.out(`${what} built and checked; check only, nothing written (give -o <report.html> to write it).`);
        return r.status;
      }
      await writeTextAtomically(resolve(output), r.html);
      io.out(`${what} written to ${output} (open it in a browser; print to PDF from there).`);
      return r.status;
    });
  },
};

export default report;

/** The demo's report part: the calculation report of sample building (a), written to the demo's output folder. */
export const reportDemoPart: DemoPart = {
  title: "Calculation report of sample-workbooks/steel-office-us.xlsx (HTML, prints to PDF from a browser)",
  async run(io, ctx) {
    const input = join(ctx.root, "sample-workbooks", "steel-office-us.xlsx");
    const r = await reportOfFile(input, { units: "US" }, {}, io);
    if (r.html === undefined) return r.status === EXIT.ok ? EXIT.failed : r.status;
    const output = join(ctx.outDir, "steel-office-us-report.html");
    await writeTextAtomically(output, r.html);
    const members = allMembers(r.record!);
    io.out(`${members.length} members detailed (every beam, girder and column), after the load schedule, code provisions, beam end reactions, load check per level, column schedule, foundation reactions and load balance; printed pages carry a running header and "Page x of y".`);
    io.out(`Report: ${output}`);
    return r.status;
  },
};
