/**
 * `loadpath plan <in.xlsx> -o plan.html` (every level on one page) or `-o plan.svg --level X`
 * (one level): the framing plan drawings alone, for a quick check of the derived load path, or
 * for typed member tables the schematic key plan of levels and column stacks. Problems are
 * listed on stderr with their cells and on the page; the file is written whole or not at all.
 */
import { basename, extname, resolve } from "node:path";
import { renderKeyPlan } from "../../drawings/key-plan";
import { planLevels, renderFramingPlan } from "../../drawings/plan";
import { escapeXml } from "../../drawings/escape";
import { REVIEW_NOTICE } from "../../drawings/notice";
import { writeTextAtomically } from "../../workbook/files";
import { EXIT, outputsRefused, parseVerbArgs, readInputWorkbook, singleInput, usageOnThrow, type CliIO, type Command } from "../shared";
import { parsePlanMappings, planInputOf, PLAN_TABLES, type PlanInput, type PlanRun } from "../plan-input";

const USAGE = `Usage: loadpath plan <in.xlsx> [-o <plan.html> | -o <plan.svg> --level <name>]
                     [--select <mark>] [--units US|SI]
                     [--grids <name>] [--levels <name>] [--framing <name>] [--decks <name>]
                     [--zones <name>] [--members <name>] [--bearings <name>]
                     [--map <table>.<Column>=<your header> ...]

Draws the framing plan of every level from the Grids, Levels, Framing and Decks tables (the
derived plan: members by type, columns, grid lines, decks with their span direction, openings,
each member's tributary area shaded), or, for a workbook with typed member tables and no
Framing table, a schematic key plan of the levels and column stacks.

  -o, --output   plan.html (every level, one page) or plan.svg (one level, with --level);
                 without -o the plan is read, derived and checked, and nothing is written
  --level        the level to draw (required for .svg; in .html only that level)
  --select       a member or column whose tributary area and load path are highlighted
  --grids, --levels, --framing, --decks, --zones, --members, --bearings <name>
                 Excel table, sheet (its used range) or Sheet!A1:H20 of each table;
                 default: the table or sheet so named
  --map <table>.<Column>=<your header | Group/Header | column letter>
                 a column whose header differs (repeatable); table grids, levels,
                 framing, decks, zones, members or bearings
  --units US|SI  US (ft) or SI (m); default: the system the headers' units show, else US

Problems are listed on stderr as Sheet!A1: message and on the page. Exit status: 0 written
without problems, 1 problems found (the drawing of what could be read is still written),
2 usage or file errors (nothing written). Interface: docs/interface.md.
Results need review by a qualified engineer; local codes govern.`;

/** One drawing of the page: its heading and SVG. */
interface Drawn {
  readonly heading: string;
  readonly svg: string;
}

/**
 * The drawings of a plan input.
 * @param input - what was read
 * @param level - only this level (undefined: every level)
 * @param selected - the member highlighted
 */
export function drawingsOf(input: PlanInput, level: string | undefined, selected: string | undefined): Drawn[] {
  const opts = selected !== undefined ? { selected } : {};
  if (input.kind === "framing") {
    const levels = level !== undefined ? [level] : [...planLevels(input.model)].reverse();
    return levels.map((l) => ({ heading: `Level ${l}`, svg: renderFramingPlan(input.model, l, opts) }));
  }
  const keyInput = level !== undefined ? { levels: [level], members: input.input.members.filter((m) => m.level === level) } : input.input;
  return [{ heading: "Key plan (schematic)", svg: renderKeyPlan(keyInput, 720, selected) }];
}

/** Levels that can be drawn. */
export function levelsOf(input: PlanInput): string[] {
  return input.kind === "framing" ? planLevels(input.model) : [...input.input.levels];
}

/**
 * One self-contained HTML page (no scripts, nothing loaded) with every drawing and the problems.
 * @param title - the page title (the workbook's file name)
 * @param drawn - the drawings
 * @param problems - problems as `Sheet!A1: message`
 */
export function planPage(title: string, drawn: readonly Drawn[], problems: readonly string[]): string {
  const e = escapeXml;
  const list = problems.length > 0 ? `<section class="problems"><h2>Problems (${problems.length})</h2><ul>${problems.map((p) => `<li>${e(p)}</li>`).join("")}</ul></section>` : "";
  const sections = drawn.map((d) => `<section class="level"><h2>${e(d.heading)}</h2>${d.svg}</section>`).join("\n");
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'">
<title>${e(`Framing plans: ${title}`)}</title>
<style>body{font-family:Arial,Helvetica,sans-serif;margin:16px;color:#1f2328;max-width:1100px}h1{font-size:18px}h2{font-size:15px;margin:18px 0 6px}.problems li{color:#b42318;font-size:13px}.level{break-inside:avoid;page-break-inside:avoid}.note{color:#6b7280;font-size:12px}svg{max-width:100%;height:auto}@media print{.level+.level{break-before:page;page-break-before:always}}</style>
</head><body>
<h1>${e(`Framing plans: ${title}`)}</h1>
<p class="note">${e(REVIEW_NOTICE)} Hover over a member, column or shaded area for its details.</p>
${list}
${sections}
</body></html>
`;
}

const plan: Command = {
  summary: "draw the framing plan of each level (or a schematic key plan) as HTML or SVG",
  usage: USAGE,
  async run(args, io: CliIO) {
    const tableOpts = Object.fromEntries(PLAN_TABLES.map((t) => [t, { type: "string" as const }]));
    const parsed = parseVerbArgs("plan", USAGE, args, { output: { type: "string", short: "o" }, level: { type: "string" }, select: { type: "string" }, units: { type: "string" }, map: { type: "string", multiple: true }, ...tableOpts }, io);
    if (!parsed) return EXIT.usage;
    const input = singleInput("plan", USAGE, parsed.positionals, io);
    if (input === undefined) return EXIT.usage;
    const v = parsed.values as Record<string, string | boolean | (string | boolean)[] | undefined>;
    const output = typeof v.output === "string" ? v.output : undefined;
    const level = typeof v.level === "string" ? v.level.trim() : undefined;
    const selected = typeof v.select === "string" ? v.select.trim() : undefined;
    const ext = output !== undefined ? extname(output).toLowerCase() : undefined;
    if (ext !== undefined && ext !== ".html" && ext !== ".htm" && ext !== ".svg") {
      io.err(`loadpath plan: -o ${output}: write a .html file (every level) or a .svg file (one level, with --level).`);
      return EXIT.usage;
    }
    if (ext === ".svg" && level === undefined) {
      io.err("loadpath plan: an .svg file holds one level; give --level <name> (or write .html for every level).");
      return EXIT.usage;
    }
    const unitsText = typeof v.units === "string" ? v.units.trim().toUpperCase() : undefined;
    if (unitsText !== undefined && unitsText !== "US" && unitsText !== "SI") {
      io.err(`loadpath plan: --units is US or SI (got "${String(v.units)}").`);
      return EXIT.usage;
    }
    const maps = parsePlanMappings(Array.isArray(v.map) ? v.map.filter((m): m is string => typeof m === "string") : []);
    if ("error" in maps) {
      io.err(`loadpath plan: ${maps.error}`);
      return EXIT.usage;
    }
    if (outputsRefused("plan", [input], [output !== undefined ? { option: "-o", path: output } : undefined], io)) return EXIT.usage;
    const tables: PlanRun["tables"] = {};
    for (const t of PLAN_TABLES) if (typeof v[t] === "string") tables[t] = v[t];
    const run: PlanRun = { tables, mapping: maps.mapping, ...(unitsText !== undefined ? { units: unitsText as "US" | "SI" } : {}) };
    return usageOnThrow("plan", io, async () => {
      const workbook = await readInputWorkbook(input);
      const read = await planInputOf(workbook, run);
      for (const p of read.problems) io.err(p);
      const levels = levelsOf(read);
      if (level !== undefined && !levels.includes(level)) {
        io.err(`loadpath plan: --level "${level}" is not a level of the plan (levels: ${levels.join(", ") || "none"}).`);
        return EXIT.usage;
      }
      const marks = read.kind === "framing" ? read.model.derivation.members.map((m) => m.mark) : read.input.members.map((m) => m.mark);
      if (selected !== undefined && !marks.includes(selected)) {
        io.err(`loadpath plan: --select "${selected}" is not a member of the plan (a Mark of the ${read.kind === "framing" ? "Framing" : "Members"} table, spelled as there).`);
        return EXIT.usage;
      }
      const drawn = drawingsOf(read, level, selected);
      const status = read.problems.length > 0 ? EXIT.failed : EXIT.ok;
      const what = read.kind === "framing" ? `Framing plan of ${drawn.length} level(s) (${read.model.derivation.members.length} members and columns)` : `Schematic key plan of ${read.input.levels.length} level(s) (${read.input.members.length} members; typed tables, no Framing table)`;
      if (output === undefined) {
        io.out(`${what} drawn and checked; check only, nothing written (give -o <plan.html> or -o <plan.svg> --level <name>).`);
        return status;
      }
      const body = ext === ".svg" ? drawn[0]!.svg : planPage(basename(input), drawn, read.problems);
      await writeTextAtomically(resolve(output), body);
      io.out(`${what} written to ${output}.`);
      return status;
    });
  },
};

export default plan;
