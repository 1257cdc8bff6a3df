/**
 * The `loadpath` command: a verb dispatcher. Each verb is a module in ./commands that
 * default-exports a {@link Command}; adding a verb is one line in {@link VERBS}. What the verbs
 * share (exit statuses, output streams, option checks) lives in ./shared, which the verbs import.
 *
 * Exit status: 0 success, 1 the work ran but found problems (what could be built is written),
 * 2 usage or file errors. The interface is documented in docs/interface.md.
 */
import { EXIT, printableIO, processIO, type CliIO, type Command } from "./shared";

export { EXIT, processIO, type CliIO, type Command } from "./shared";

/** Verb -> its module (webpackMode eager keeps every verb inside dist/cli.js). */
export const VERBS: Readonly<Record<string, () => Promise<{ default: Command }>>> = {
  recalc: () => import(/* webpackMode: "eager" */ "./commands/recalc"),
  demo: () => import(/* webpackMode: "eager" */ "./commands/demo"),
  takedown: () => import(/* webpackMode: "eager" */ "./commands/takedown"),
  export: () => import(/* webpackMode: "eager" */ "./commands/export"),
  report: () => import(/* webpackMode: "eager" */ "./commands/report"),
  plan: () => import(/* webpackMode: "eager" */ "./commands/plan"),
};

async function help(io: CliIO): Promise<void> {
  io.out("Usage: loadpath <verb> [arguments]   (loadpath <verb> --help for a verb's arguments)");
  io.out("");
  io.out("Verbs:");
  const names = Object.keys(VERBS).sort();
  const width = Math.max(...names.map((n) => n.length));
  for (const name of names) io.out(`  ${name.padEnd(width)}  ${(await VERBS[name]!()).default.summary}`);
  io.out("");
  io.out("Table options (takedown, report, export): --zones --members --loads name a table;");
  io.out("--map renames a column; --units US|SI (default: from the header units, else US);");
  io.out("--sheet names the generated sheet; --replace replaces a same-named sheet of yours.");
  io.out("plan also takes --grids --levels --framing --decks (a framing plan) and draws the");
  io.out("plan of each level, or a schematic key plan of typed tables.");
  io.out("Without -o a verb checks only and writes nothing. Exit status: 0 done, 1 problems found");
  io.out("(what could be built is still written), 2 usage or file errors (nothing written).");
  io.out("Everything is described in docs/interface.md.");
  io.out("");
  io.out("Results are for review by a qualified engineer; local codes govern.");
}

/**
 * Run the command line. Every line printed goes through the control-character filter
 * ({@link printableIO}), whatever the streams.
 * @param argv - arguments after `loadpath` (process.argv.slice(2)).
 * @param streams - output streams (default: the process's stdout and stderr).
 * @returns the exit status.
 */
export async function main(argv: readonly string[], streams: CliIO = processIO()): Promise<number> {
  const io = printableIO(streams);
  const [verb, ...rest] = argv;
  if (verb === undefined || verb === "--help" || verb === "-h" || verb === "help") {
    await help(io);
    return verb === undefined ? EXIT.usage : EXIT.ok;
  }
  const load = Object.prototype.hasOwnProperty.call(VERBS, verb) ? VERBS[verb] : undefined;
  if (!load) {
    io.err(`loadpath: unknown verb "${verb}". Verbs: ${Object.keys(VERBS).sort().join(", ")}.`);
    return EXIT.usage;
  }
  const command = (await load()).default;
  if (rest.includes("--help") || rest.includes("-h")) {
    io.out(command.usage);
    return EXIT.ok;
  }
  try {
    return await command.run(rest, io);
  } catch (e) {
    io.err(`loadpath ${verb}: ${e instanceof Error ? e.message : String(e)}`);
    return EXIT.usage;
  }
}
