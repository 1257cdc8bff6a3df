/**
 * The `loadpath` command: a verb dispatcher. Each verb is a module in ./commands that
 * default-exports a {@link Command}; adding a verb is one line in {@link VERBS}.
 *
 * Exit status: 0 success, 1 the work ran but found errors (e.g. a LOADPATH call returned an
 * error), 2 usage or file errors.
 */

/** Where a command writes: stdout for results, stderr for problems and diagnostics. */
export interface CliIO {
  out(line: string): void;
  err(line: string): void;
}

/** One verb of the command. */
export interface Command {
  /** One line for `loadpath --help`. */
  readonly summary: string;
  /** Full usage text for `loadpath <verb> --help`. */
  readonly usage: string;
  /**
   * Run the verb.
   * @param args - the arguments after the verb.
   * @param io - output streams.
   * @returns the exit status.
   */
  run(args: readonly string[], io: CliIO): Promise<number>;
}

/** Exit statuses shared by every verb. */
export const EXIT = { ok: 0, failed: 1, usage: 2 } as const;

/** Verb -> its module (webpackMode eager keeps every verb inside dist/cli.js). */
export const VERBS: Readonly<Record<string, () => Promise<{ default: Command }>>> = {
  recalc: () => import(/* webpackMode: "eager" */ "./commands/recalc"),
  demo: () => import(/* webpackMode: "eager" */ "./commands/demo"),
  takedown: () => import(/* webpackMode: "eager" */ "./commands/takedown"),
  export: () => import(/* webpackMode: "eager" */ "./commands/export"),
  report: () => import(/* webpackMode: "eager" */ "./commands/report"),
};

/** The process's own streams. */
export const processIO: CliIO = {
  out: (line) => void process.stdout.write(line + "\n"),
  err: (line) => void process.stderr.write(line + "\n"),
};

async function help(io: CliIO): Promise<void> {
  io.out("Usage: loadpath <verb> [arguments]   (loadpath <verb> --help for a verb's arguments)");
  io.out("");
  io.out("Verbs:");
  const names = Object.keys(VERBS).sort();
  const width = Math.max(...names.map((n) => n.length));
  for (const name of names) io.out(`  ${name.padEnd(width)}  ${(await VERBS[name]!()).default.summary}`);
  io.out("");
  io.out("Results are for review by a qualified engineer; local codes govern.");
}

/**
 * Run the command line.
 * @param argv - arguments after `loadpath` (process.argv.slice(2)).
 * @param io - output streams (default: the process's stdout and stderr).
 * @returns the exit status.
 */
export async function main(argv: readonly string[], io: CliIO = processIO): Promise<number> {
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
