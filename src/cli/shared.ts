/**
 * What every verb shares, imported by the verbs and by the entry point (main.ts), never the other
 * way round: the exit statuses, the output streams (control characters removed, a closed pipe
 * ignored), parsing the arguments, the one input workbook, the checks of the files to write, and
 * anything thrown reported as `loadpath <verb>: message` with the usage exit status.
 */
import { existsSync, statSync } from "node:fs";
import { dirname, resolve } from "node:path";
import { parseArgs, type ParseArgsConfig } from "node:util";
import { readXlsx, type XlsxWorkbook } from "../workbook/xlsx";

/**
 * Exit statuses of every verb: 0 done without problems; 1 problems found (what could be built is
 * still written); 2 usage or file errors (nothing written).
 */
export const EXIT = { ok: 0, failed: 1, usage: 2 } as const;

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

/**
 * C0 controls except tab and line feed, DEL, C1 controls (ESC and CSI included), and the
 * bidirectional overrides and isolates that reorder what a terminal shows.
 */
const CONTROL = /[\u0000-\u0008\u000B-\u001F\u007F-\u009F\u202A-\u202E\u2066-\u2069]/g;

/**
 * A line as it may reach a terminal: control characters removed, so text read from cells (a mark
 * holding an escape sequence, say) can neither colour, move the cursor nor retitle the terminal.
 * @param line - text to print (line feeds and tabs kept)
 */
export function printable(line: string): string {
  return line.replace(CONTROL, "");
}

/**
 * Output streams that pass every line through {@link printable}.
 * @param io - the streams written to
 */
export function printableIO(io: CliIO): CliIO {
  return { out: (line) => io.out(printable(line)), err: (line) => io.err(printable(line)) };
}

let pipesGuarded = false;

/**
 * The process's own streams. A reader that goes away early (`loadpath takedown ... | head -1`)
 * closes the pipe: further lines to that stream are dropped quietly (no EPIPE stack trace) and
 * the verb finishes its work, so every file it writes is complete.
 */
export function processIO(): CliIO {
  if (!pipesGuarded) {
    pipesGuarded = true;
    for (const stream of [process.stdout, process.stderr]) {
      stream.on("error", (e: NodeJS.ErrnoException) => {
        if (e.code !== "EPIPE") throw e;
      });
    }
  }
  const write = (stream: NodeJS.WriteStream, line: string): void => {
    if (stream.destroyed || stream.writableEnded) return;
    stream.write(line + "\n");
  };
  return { out: (line) => write(process.stdout, line), err: (line) => write(process.stderr, line) };
}

/** Options of a verb, as `parseArgs` takes them. */
type VerbOptions = NonNullable<ParseArgsConfig["options"]>;

/** What `parseArgs` gives for a verb's options with positionals allowed. */
export type VerbArgs<O extends VerbOptions> = ReturnType<typeof parseArgs<{ args: string[]; options: O; allowPositionals: true }>>;

/**
 * The text of anything thrown.
 * @param e - the thrown value
 */
export function messageOf(e: unknown): string {
  return e instanceof Error ? e.message : String(e);
}

/**
 * Parse a verb's arguments (positionals allowed); when they do not parse, print
 * `loadpath <verb>: message` and the usage on stderr.
 * @param verb - the verb, for the message
 * @param usage - the verb's usage text
 * @param args - the arguments after the verb
 * @param options - the verb's options
 * @param io - output streams
 * @returns the parsed values and positionals, or undefined after printing the error
 */
export function parseVerbArgs<O extends VerbOptions>(verb: string, usage: string, args: readonly string[], options: O, io: CliIO): VerbArgs<O> | undefined {
  try {
    return parseArgs({ args: [...args], options, allowPositionals: true });
  } catch (e) {
    io.err(`loadpath ${verb}: ${messageOf(e)}\n\n${usage}`);
    return undefined;
  }
}

/**
 * The one input workbook of the positionals; when there is none or more than one, print why.
 * @param verb - the verb, for the message
 * @param usage - the verb's usage text (printed when no input is given)
 * @param positionals - the positional arguments
 * @param io - output streams
 * @returns the input's path, or undefined after printing the error
 */
export function singleInput(verb: string, usage: string, positionals: readonly string[], io: CliIO): string | undefined {
  const [input, ...extra] = positionals;
  if (input === undefined || extra.length > 0) {
    io.err(input === undefined ? `loadpath ${verb}: no input workbook given.\n\n${usage}` : `loadpath ${verb}: one input workbook at a time (got ${positionals.length}).`);
    return undefined;
  }
  return input;
}

/**
 * Whether two paths name the same file: the same resolved path, or (both existing) the same file
 * on disk, so a symbolic or hard link to the input, or another spelling of it on a
 * case-insensitive disk, is the input too.
 * @param a - a path
 * @param b - another path
 */
export function sameFile(a: string, b: string): boolean {
  if (resolve(a) === resolve(b)) return true;
  try {
    const sa = statSync(a);
    const sb = statSync(b);
    return sa.dev === sb.dev && sa.ino === sb.ino;
  } catch {
    return false;
  }
}

/** A file a verb is asked to write, with the option that named it (`-o`, `--json`). */
export interface OutputFile {
  readonly option: string;
  readonly path: string;
}

/**
 * Why the files to write cannot be written, checked before any work (then the message is
 * printed): an output that is an input (the input is never written over; links count, see
 * {@link sameFile}), two outputs naming one file (`-o x --json x` would replace the workbook with
 * the JSON), an output that is a folder, or one whose folder does not exist.
 * @param verb - the verb, for the message
 * @param inputs - paths read
 * @param outputs - files to write (undefined: that output not asked for)
 * @param io - output streams
 * @returns true when refused (message printed)
 */
export function outputsRefused(verb: string, inputs: readonly string[], outputs: readonly (OutputFile | undefined)[], io: CliIO): boolean {
  const given = outputs.filter((o): o is OutputFile => o !== undefined);
  const refuse = (message: string): true => {
    io.err(`loadpath ${verb}: ${message}`);
    return true;
  };
  for (const [i, o] of given.entries()) {
    if (inputs.some((input) => sameFile(o.path, input))) return refuse(`${o.path} is the input file; name another file, the input is never written over.`);
    const other = given.slice(0, i).find((p) => sameFile(p.path, o.path));
    if (other) return refuse(`${other.option} and ${o.option} both name ${o.path}; give each output its own file.`);
    const full = resolve(o.path);
    if (existsSync(full) && statSync(full).isDirectory()) return refuse(`${o.option} ${o.path} is a folder; name a file.`);
    if (!existsSync(dirname(full))) return refuse(`${o.option} ${o.path}: the folder ${dirname(o.path)} does not exist.`);
  }
  return false;
}

/**
 * Read the input workbook of a verb. A file that holds no worksheet (a zip of something else) is
 * not a workbook either.
 * @param path - the input's path
 * @throws Error with a plain message naming the file when it cannot be read as a workbook
 */
export async function readInputWorkbook(path: string): Promise<XlsxWorkbook> {
  const wb = await readXlsx(path);
  if (wb.sheets.length === 0) throw new Error(`${path}: holds no worksheet; not an .xlsx workbook.`);
  return wb;
}

/**
 * Run a verb's work; anything thrown (a file that cannot be read, say) is printed as
 * `loadpath <verb>: message` and gives the usage exit status.
 * @param verb - the verb, for the message
 * @param io - output streams
 * @param work - the work, returning the exit status
 */
export async function usageOnThrow(verb: string, io: CliIO, work: () => Promise<number>): Promise<number> {
  try {
    return await work();
  } catch (e) {
    io.err(`loadpath ${verb}: ${messageOf(e)}`);
    return EXIT.usage;
  }
}
