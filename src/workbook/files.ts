/**
 * Writing an output file so that a failure never costs the user a file: the content goes to a
 * temporary file in the same folder, which is renamed over the destination only once complete
 * (a rename within one folder replaces the destination in one step). A run that fails, or a
 * process that dies while writing, leaves the earlier file as it was.
 */
import { randomBytes } from "node:crypto";
import { renameSync, rmSync, writeFileSync } from "node:fs";
import { basename, dirname, join, resolve } from "node:path";

/**
 * The temporary file beside a destination: hidden, named after it, unique to this call.
 * @param destination - the file that will be written
 */
export function temporaryBeside(destination: string): string {
  const full = resolve(destination);
  return join(dirname(full), `.${basename(full)}.${process.pid}.${randomBytes(4).toString("hex")}.tmp`);
}

/**
 * Write a file by way of a temporary file in the same folder, renamed into place when complete.
 * @param destination - the file to write (replaced only when `write` succeeds)
 * @param write - writes the complete content to the path it is given
 * @throws whatever `write` or the rename throws; the temporary file is removed and the
 *   destination is untouched
 */
export async function writeAtomically(destination: string, write: (temporary: string) => Promise<void> | void): Promise<void> {
  const temporary = temporaryBeside(destination);
  try {
    await write(temporary);
    renameSync(temporary, resolve(destination));
  } catch (e) {
    rmSync(temporary, { force: true });
    throw e;
  }
}

/**
 * Write text (JSON, HTML) to a file by way of a temporary file (see {@link writeAtomically}).
 * @param destination - the file to write
 * @param text - its complete content
 */
export async function writeTextAtomically(destination: string, text: string): Promise<void> {
  await writeAtomically(destination, (temporary) => writeFileSync(temporary, text));
}
