/**
 * What the reading bad-input tests share (not-a-workbook, formula-spellings, size): the command
 * run in-process (`main` with lines collected), a file's hash to show it is unchanged, and a
 * scratch folder.
 */
import { createHash } from "node:crypto";
import { mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { main } from "../../src/cli/main";

/** What a run printed and its exit status. */
export interface Ran {
  readonly status: number;
  readonly out: string;
  readonly err: string;
}

/**
 * Run `loadpath <args>` in this process.
 * @param args - the arguments after `loadpath`
 */
export async function runCli(...args: string[]): Promise<Ran> {
  const out: string[] = [];
  const err: string[] = [];
  const status = await main(args, { out: (l) => void out.push(l), err: (l) => void err.push(l) });
  return { status, out: out.join("\n"), err: err.join("\n") };
}

/** SHA-256 of a file's bytes. */
export function hashOf(path: string): string {
  return createHash("sha256").update(readFileSync(path)).digest("hex");
}

/** A fresh scratch folder. */
export function scratch(prefix: string): string {
  return mkdtempSync(join(tmpdir(), `loadpath-${prefix}-`));
}
