/**
 * What the verbs share around their own work: parsing the arguments, the one input workbook, the
 * refusal to write over it, and anything thrown reported as `loadpath <verb>: message` with the
 * usage exit status.
 */
import { statSync } from "node:fs";
import { resolve } from "node:path";
import { parseArgs, type ParseArgsConfig } from "node:util";
import { EXIT, type CliIO } from "./main";

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

/**
 * Whether a file to write is the input itself (then the message is printed): the input is never
 * written over.
 * @param verb - the verb, for the message
 * @param input - the input's path
 * @param targets - paths to write (undefined: not written)
 * @param io - output streams
 */
export function writesOverInput(verb: string, input: string, targets: readonly (string | undefined)[], io: CliIO): boolean {
  const target = targets.find((t) => t !== undefined && sameFile(t, input));
  if (target === undefined) return false;
  io.err(`loadpath ${verb}: ${target} is the input file; name another file, the input is never written over.`);
  return true;
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
