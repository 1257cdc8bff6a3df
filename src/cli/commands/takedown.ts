/**
 * `loadpath takedown <in.xlsx> -o <out.xlsx> [--json result.json] [--units US|SI] ...`: the
 * takedown builder headless. Reads the workbook's Zones, Members and (optional) Loads tables,
 * builds the takedown through the HyperFormula adapter of the workbook port (the same build the
 * task pane runs in Excel), writes the workbook with the generated sheet (formulas with their
 * computed values cached) and the JSON of docs/interface.md. Problems print as
 * `Sheet!A1: message` and make the exit status 1. The input file is never written over; every
 * output is written whole or not at all.
 */
import { join, resolve } from "node:path";
import { sheetRef } from "../../workbook/a1";
import { DEFAULT_TAKEDOWN_SHEET } from "../../workbook/takedown-build";
import { writeTextAtomically } from "../../workbook/files";
import { writeXlsx } from "../../workbook/xlsx";
import type { Problem, TakedownBuildResult, TakedownJson, UnitSystem } from "../../workbook/takedown-api";
import { EXIT, outputsRefused, parseVerbArgs, singleInput, usageOnThrow, type CliIO, type Command } from "../shared";
import { fixedDecimals, formatDifference, formatQuantity, type Quantity } from "../../drawings/format";
import { runOfOptions, TABLE_OPTIONS_USAGE, tableOptions, takedownOfFile, unitsHint, type TakedownRun } from "../takedown-input";
import type { DemoPart } from "./demo";
import { SETTINGS_SHEET } from "../../workbook/saved-matching";

export { parseMappings, takedownOfFile, type TakedownFileResult, type TakedownRun } from "../takedown-input";

const USAGE = `Usage: loadpath takedown <in.xlsx> [-o <out.xlsx>] [--json <result.json>] [--native]
                         [--zones <name>] [--members <name>] [--loads <name>]
                         [--map <table>.<Column>=<your header> ...] [--header-row [<table>=]<row>]
                         [--units US|SI] [--sheet <name>] [--replace] [--save-mapping]

Builds the gravity load takedown of the workbook's member tables: every member in takedown order
with its loads, reactions, shear and moment, tributary area and live load reduction; every
column level by level with cumulative loads and the factored load; the foundation reactions and
a load balance. Everything is written as live formulas on a generated sheet (default
"${DEFAULT_TAKEDOWN_SHEET}") that references your tables, with the computed values cached.

  -o, --output   workbook to write (never the input file); without -o no workbook is
                 written (a check only)
  --json         also write the results as JSON (fields in docs/interface.md)
  --native       hand-off version: classic spreadsheet functions only, so the sheet recalculates
                 without the add-in (Excel, LibreOffice Calc, Gnumeric); see also loadpath export
${TABLE_OPTIONS_USAGE}
  --save-mapping write the matching used (tables, --map columns, header rows, units) on the
                 sheet "${SETTINGS_SHEET}" of the output workbook (needs -o), so later runs
                 and the pane read it without the options; a saved matching is always read,
                 and --map, --header-row, --units and the table options override it

Problems are listed on stderr as Sheet!A1: message. Exit status: 0 built without problems,
1 problems found (what could be built is still written), 2 usage or file errors (nothing
written). Every file is written whole or not at all. Interface: docs/interface.md.
Results need review by a qualified engineer; local codes govern.`;

/** One stderr line per problem: `Sheet!A1: message`. */
export function describeTakedownProblem(p: Problem): string {
  return `${sheetRef(p.sheet)}!${p.cell}: ${p.message}`;
}

/** A number for the plain-text tables: the shared formatter's decimals per quantity, a hyphen minus. */
function fmt(x: number | undefined, kind: Quantity): string {
  return x === undefined || !Number.isFinite(x) ? "-" : formatQuantity(x, kind, "-");
}

/**
 * Lines of the column stacks: each column level by level with its cumulative loads, reduced
 * live load and factored load.
 * @param json - the takedown's results
 */
export function columnLines(json: TakedownJson): string[] {
  const cases = Object.keys(json.balance);
  const force = json.units === "US" ? "kip" : "kN";
  const area = json.units === "US" ? "ft2" : "m2";
  const head = ["Column".padEnd(14), "Level".padEnd(7), ...cases.map((c) => `${c} ${force}`.padStart(10)), `A_T ${area}`.padStart(10), "Floors".padStart(6), "LLR".padStart(6), `L red. ${force}`.padStart(11), `LRFD ${force}`.padStart(10)];
  const lines = [head.join(" ")];
  for (const [mark, c] of Object.entries(json.columns)) {
    const governing = Math.max(...Object.values(c.combos));
    lines.push(
      [
        mark.padEnd(14),
        c.level.padEnd(7),
        ...cases.map((k) => fmt(c.cumulative[k], "force").padStart(10)),
        fmt(c.tributaryArea, "area").padStart(10),
        String(c.floors).padStart(6),
        fmt(c.llrFactor, "factor").padStart(6),
        fmt(c.reducedLive, "force").padStart(11),
        fmt(governing, "force").padStart(10),
      ].join(" "),
    );
  }
  return lines;
}

/** The load balance's totals and difference to 0.001 kip or kN: a check, shown finer than the tables. */
const BALANCE_DECIMALS = 3;

/**
 * Lines of the load balance: per case, the total applied load and the total of the foundation
 * and wall reactions, and their difference (round-off below 1e-9 of the load prints as 0.000).
 * @param json - the takedown's results
 */
export function balanceLines(json: TakedownJson): string[] {
  const force = json.units === "US" ? "kip" : "kN";
  const lines = [`${"Case".padEnd(5)} ${`Applied ${force}`.padStart(14)} ${`Supports ${force}`.padStart(15)} ${"Difference".padStart(12)}`];
  for (const [c, b] of Object.entries(json.balance)) {
    const difference = formatDifference(b.applied - b.supports, [b.applied, b.supports], BALANCE_DECIMALS, "-");
    lines.push(`${c.padEnd(5)} ${fixedDecimals(b.applied, BALANCE_DECIMALS, "-").padStart(14)} ${fixedDecimals(b.supports, BALANCE_DECIMALS, "-").padStart(15)} ${difference.padStart(12)}`);
  }
  return lines;
}

/** The JSON written even when nothing could be built (the problems are in it). */
function jsonOf(result: TakedownBuildResult, units: UnitSystem): TakedownJson {
  return result.json ?? { units, members: {}, columns: {}, foundations: {}, perLength: {}, balance: {}, problems: result.problems };
}

/**
 * Run a takedown on a file and write its outputs.
 * @param input - workbook to read
 * @param output - workbook to write (undefined: nothing written)
 * @param jsonPath - JSON to write (undefined: none)
 * @param run - build options
 * @param io - output streams
 * @returns the exit status
 */
export async function takedownFile(input: string, output: string | undefined, jsonPath: string | undefined, run: TakedownRun, io: CliIO): Promise<number> {
  const outputs = [output !== undefined ? { option: "-o", path: output } : undefined, jsonPath !== undefined ? { option: "--json", path: jsonPath } : undefined];
  if (outputsRefused("takedown", [input], outputs, io)) return EXIT.usage;
  if (run.saveMapping && output === undefined) {
    io.err(`loadpath takedown: --save-mapping writes the matching into the output workbook; give -o <out.xlsx>.`);
    return EXIT.usage;
  }
  const file = await takedownOfFile(input, run);
  const { result, workbook, port, options } = file;
  if (file.saved !== undefined) io.out(`Matching read from the sheet "${SETTINGS_SHEET}" (options given here override it).`);
  for (const p of result.problems) io.err(describeTakedownProblem(p));
  const hint = result.problems.length > 0 ? unitsHint(file) : undefined;
  if (hint !== undefined) io.err(`loadpath takedown: ${hint}`);
  if (result.ok && result.json) {
    const counts = Object.entries(result.summary?.membersByType ?? {}).map(([t, n]) => `${n} ${t}${n === 1 ? "" : "s"}`);
    io.out(`Takedown of ${counts.join(", ")} on ${result.summary?.levels.length ?? 0} level(s), sheet "${result.sheet}" (${options.units} units).`);
    io.out("");
    for (const line of columnLines(result.json)) io.out(line);
    io.out("");
    for (const line of balanceLines(result.json)) io.out(line);
    if (result.valueOnly !== undefined) {
      io.out("");
      const governing = result.governingValuesOnly ?? 0;
      const governingNote = governing > 0 ? `; the governing values over combinations and live load patterns and the deflection checks of ${governing} member(s) are values computed by the add-in (each cell has a note; nothing else reads them)` : "";
      if (result.valueOnly.length === 0) io.out(`Hand-off version: every load, reaction, shear, moment, column load and the balance is a live formula in classic spreadsheet functions (no member's mechanics written as values)${governingNote}.`);
      else {
        if (governingNote !== "") io.out(`Hand-off version${governingNote.replace(/^;/, ":")}.`);
        io.out(`Hand-off version: ${result.valueOnly.length} member(s) written as values (not live):`);
        for (const v of result.valueOnly) io.out(`  ${v.mark}: ${v.reason}`);
      }
    }
  } else {
    io.out("Nothing was built: the problems above stop the takedown.");
  }
  io.out("");
  if (output !== undefined && result.ok) {
    await writeXlsx(workbook, resolve(output), port);
    io.out(`Workbook written to ${output}.`);
    if (run.saveMapping) io.out(`Matching saved on its sheet "${SETTINGS_SHEET}".`);
  } else if (output !== undefined) io.out(`No workbook written to ${output}: nothing could be built.`);
  if (jsonPath !== undefined) {
    await writeTextAtomically(resolve(jsonPath), JSON.stringify(jsonOf(result, options.units), null, 2) + "\n");
    io.out(`Results written to ${jsonPath}.`);
  }
  if (output === undefined) io.out(`Check only: no workbook written (give -o <out.xlsx> to write one)${jsonPath === undefined ? "; nothing written." : "."}`);
  return result.problems.length > 0 || !result.ok ? EXIT.failed : EXIT.ok;
}

const takedown: Command = {
  summary: "build the load takedown of a workbook's member tables headless",
  usage: USAGE,
  async run(args, io) {
    const parsed = parseVerbArgs(
      "takedown",
      USAGE,
      args,
      {
        output: { type: "string", short: "o" },
        json: { type: "string" },
        ...tableOptions(),
        native: { type: "boolean" },
        "save-mapping": { type: "boolean" },
      },
      io,
    );
    if (!parsed) return EXIT.usage;
    const input = singleInput("takedown", USAGE, parsed.positionals, io);
    if (input === undefined) return EXIT.usage;
    const checked = runOfOptions(parsed.values);
    if ("error" in checked) {
      io.err(`loadpath takedown: ${checked.error}`);
      return EXIT.usage;
    }
    const v = parsed.values;
    const run: TakedownRun = { ...checked.run, native: v.native === true, ...(v["save-mapping"] === true ? { saveMapping: true } : {}) };
    return usageOnThrow("takedown", io, () => takedownFile(input, v.output, v.json, run, io));
  },
};

export default takedown;

/** The demo's takedown part: sample building (a), its column loads and load balance. */
export const takedownDemoPart: DemoPart = {
  title: "Load takedown of sample-workbooks/steel-office-us.xlsx (invented three-level steel office, US units)",
  async run(io, ctx) {
    const input = join(ctx.root, "sample-workbooks", "steel-office-us.xlsx");
    const { result } = await takedownOfFile(input, { units: "US" });
    for (const p of result.problems) io.err(describeTakedownProblem(p));
    if (!result.json) return EXIT.failed;
    const s = result.summary!;
    io.out(`${Object.entries(s.membersByType).map(([t, n]) => `${n} ${t}s`).join(", ")}; levels from the top: ${s.levels.join(", ")}.`);
    io.out("");
    io.out("Column loads, level by level (cumulative; live load reduced per ASCE/SEI 7-22 Sec. 4.7):");
    for (const line of columnLines(result.json)) io.out(line);
    io.out("");
    io.out("Load balance (applied load = foundation reactions):");
    for (const line of balanceLines(result.json)) io.out(line);
    return result.problems.length > 0 ? EXIT.failed : EXIT.ok;
  },
};
