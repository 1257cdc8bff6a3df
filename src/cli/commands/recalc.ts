/**
 * `loadpath recalc <in.xlsx> -o <out.xlsx>`: evaluate every formula of a workbook headless (the
 * LOADPATH functions from the built bundle, everything else by HyperFormula), write it with the
 * computed values cached, and report each formula error on stderr as `Sheet!A1: message`.
 */
import { resolve } from "node:path";
import { cacheResults, evaluateWorkbook, problemAddress, writeXlsx, type CellProblem, type RecalcSummary } from "../../workbook/xlsx";
import { EXIT, outputsRefused, parseVerbArgs, readInputWorkbook, singleInput, usageOnThrow, type CliIO, type Command } from "../shared";

const USAGE = `Usage: loadpath recalc <in.xlsx> [-o <out.xlsx>]

Recalculates every formula of the workbook (LOADPATH functions included) and writes it to
<out.xlsx> with the computed values cached, so it reads correctly without the add-in. Without -o
nothing is written (a check only). The input is never written over; the output is written whole
or not at all.

Errors are listed on stderr as Sheet!A1: message (unknown functions, circular references,
formula errors). A formula that cannot be evaluated here (a structured table reference, a
function this engine lacks) keeps its formula and the value Excel cached, and is listed.
Exit status: 0 when every LOADPATH call succeeded, 1 when any returned an error or a formula
could not be evaluated (the workbook is still written), 2 for usage or file errors (a file that
cannot be read: nothing written). Interface: docs/interface.md.`;

/** One stderr line for a problem cell. */
export function describeProblem(p: CellProblem): string {
  const what =
    p.kind === "unknownFunction" ? `${p.code} unknown function: ${p.message}` : p.kind === "cycle" ? `cycle: ${p.message}` : p.kind === "notEvaluated" ? p.message : `${p.code} ${p.message}`;
  return `${problemAddress(p)}: ${what}${p.from ? ` (from ${p.from})` : ""}`;
}

/** The closing summary line. */
export function summaryLine(s: RecalcSummary, output: string | undefined): string {
  const errors = s.problems.length;
  const head = `${s.formulaCount} formula${s.formulaCount === 1 ? "" : "s"} recalculated (${s.loadpathCount} with LOADPATH calls), ${errors} with errors`;
  return output ? `${head}; written to ${output}.` : `${head}; check only, nothing written (no -o).`;
}

/** Exit status of a recalculation: 1 when any LOADPATH call ended in an error or any formula could not be evaluated. */
export function exitStatus(s: RecalcSummary): number {
  return s.problems.some((p) => p.loadpath || p.kind === "notEvaluated") ? EXIT.failed : EXIT.ok;
}

/**
 * Recalculate a file and optionally write it.
 * @param input - the workbook to read.
 * @param output - where to write (undefined: check only).
 * @param io - output streams.
 * @returns the exit status.
 */
export async function recalcFile(input: string, output: string | undefined, io: CliIO): Promise<number> {
  const wb = await readInputWorkbook(input);
  const headless = await evaluateWorkbook(wb);
  const summary = cacheResults(wb, headless);
  for (const p of summary.problems) io.err(describeProblem(p));
  if (output) await writeXlsx(wb, resolve(output));
  io.out(summaryLine(summary, output));
  return exitStatus(summary);
}

const recalc: Command = {
  summary: "recalculate a workbook headless and write it with cached values",
  usage: USAGE,
  async run(args, io) {
    const parsed = parseVerbArgs("recalc", USAGE, args, { output: { type: "string", short: "o" } }, io);
    if (!parsed) return EXIT.usage;
    const input = singleInput("recalc", USAGE, parsed.positionals, io);
    if (input === undefined) return EXIT.usage;
    const output = parsed.values.output;
    if (outputsRefused("recalc", [input], [output !== undefined ? { option: "-o", path: output } : undefined], io)) return EXIT.usage;
    return usageOnThrow("recalc", io, () => recalcFile(input, output, io));
  },
};

export default recalc;
