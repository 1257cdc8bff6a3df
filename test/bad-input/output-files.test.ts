/**
 * Bad-input corpus, files (issue 10 class B): no output is lost or damaged. Every case checks
 * the message, the exit status, that the input is unchanged (digest before and after) and that
 * an earlier good output at the same path survives a refused or failed run; no temporary file is
 * left behind. The closed-pipe case runs bin/loadpath.js as a real child process (needs
 * `npm run build`); the others run the command in process.
 */
import { copyFileSync, linkSync, mkdirSync, mkdtempSync, readFileSync, symlinkSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import { writeAtomically, writeTextAtomically } from "../../src/workbook/files";
import { fromExcelJs, readXlsx, writeXlsx } from "../../src/workbook/xlsx";
import { child, cli, digest, listing, SAMPLE_US, zipOf } from "./cli-helpers";

const dir = mkdtempSync(join(tmpdir(), "loadpath-bad-files-"));

/** A folder with a copy of the US sample as input and an earlier good output of each kind. */
function scene(name: string): { folder: string; input: string; earlier: Record<string, string> } {
  const folder = join(dir, name);
  mkdirSync(folder);
  const input = join(folder, "in.xlsx");
  copyFileSync(SAMPLE_US, input);
  const earlier: Record<string, string> = {};
  for (const file of ["out.xlsx", "out.json", "out.html"]) {
    writeFileSync(join(folder, file), `earlier good ${file}\n`);
    earlier[file] = digest(join(folder, file));
  }
  return { folder, input, earlier };
}

function unchanged(s: ReturnType<typeof scene>, inputDigest: string): void {
  expect(digest(s.input)).toBe(inputDigest);
  for (const [file, d] of Object.entries(s.earlier)) expect(digest(join(s.folder, file)), file).toBe(d);
}

describe("outputs that name an input or each other are refused before any work (exit 2)", () => {
  it("-o X --json X would replace the workbook with the JSON: refused in takedown and export", async () => {
    const s = scene("same-output");
    const before = digest(s.input);
    const out = join(s.folder, "out.xlsx");
    for (const verb of ["takedown", "export"]) {
      const r = await cli(verb, s.input, "-o", out, "--json", out);
      expect(r.status, verb).toBe(2);
      expect(r.err.join("\n"), verb).toMatch(/-o and --json both name .*out\.xlsx; give each output its own file\./);
      expect(r.out, verb).toEqual([]);
    }
    // Another spelling of the same file, and a hard link to it, are the same file too.
    const linked = join(s.folder, "linked.xlsx");
    linkSync(out, linked);
    const r = await cli("takedown", s.input, "-o", join(s.folder, ".", "out.xlsx"), "--json", linked);
    expect(r.status).toBe(2);
    unchanged(s, before);
    expect(listing(s.folder)).toEqual(["in.xlsx", "linked.xlsx", "out.html", "out.json", "out.xlsx"]);
  });

  it("every verb refuses an output that is its input, also through a symbolic link", async () => {
    const s = scene("input-as-output");
    const before = digest(s.input);
    const soft = join(s.folder, "soft.xlsx");
    symlinkSync(s.input, soft);
    const cases: string[][] = [
      ["recalc", s.input, "-o", soft],
      ["takedown", s.input, "-o", soft],
      ["takedown", s.input, "--json", s.input],
      ["report", s.input, "-o", soft],
      ["export", s.input, "-o", join(s.folder, "new.xlsx"), "--json", soft],
    ];
    for (const args of cases) {
      const r = await cli(...args);
      expect(r.status, args.join(" ")).toBe(2);
      expect(r.err.join("\n"), args.join(" ")).toMatch(/is the input file; name another file, the input is never written over\./);
    }
    unchanged(s, before);
    expect(listing(s.folder)).toEqual(["in.xlsx", "out.html", "out.json", "out.xlsx", "soft.xlsx"]);
  });

  it("an output in a folder that does not exist, or that is a folder, is refused before the work", async () => {
    const s = scene("bad-folder");
    const before = digest(s.input);
    const missing = await cli("takedown", s.input, "-o", join(s.folder, "no-such-folder", "out.xlsx"));
    expect(missing.status).toBe(2);
    expect(missing.err.join("\n")).toMatch(/-o .*out\.xlsx: the folder .*no-such-folder does not exist\./);
    expect(missing.out).toEqual([]);
    const folder = await cli("report", s.input, "-o", s.folder);
    expect(folder.status).toBe(2);
    expect(folder.err.join("\n")).toMatch(/-o .* is a folder; name a file\./);
    unchanged(s, before);
  });
});

describe("a failed run leaves the earlier output as it was", () => {
  it("takedown whose tables cannot be built (a unit mismatch) writes nothing over the earlier workbook", async () => {
    const s = scene("failed-build");
    const input = join(s.folder, "in.xlsx");
    copyFileSync(join(SAMPLE_US, "..", "timber-house-si.xlsx"), input);
    const before = digest(input);
    const r = await cli("takedown", input, "-o", join(s.folder, "out.xlsx"), "--units", "US");
    expect(r.status).toBe(1);
    expect(r.out.join("\n")).toMatch(/No workbook written to .*out\.xlsx: nothing could be built\./);
    unchanged(s, before);
  });

  it("an input that cannot be read (text, a zip that is not a workbook) exits 2 in every verb, with or without -o, and writes nothing", async () => {
    const s = scene("unreadable");
    const text = join(s.folder, "notes.xlsx");
    writeFileSync(text, "not a workbook\n");
    // A zip that is not a workbook (a renamed archive of notes), and a workbook package without a worksheet.
    const zip = join(s.folder, "archive.xlsx");
    writeFileSync(zip, zipOf({ "notes.txt": "site visit 12 May\n", "photos/readme.md": "none\n" }));
    const empty = join(s.folder, "empty.xlsx");
    await new ExcelJS.Workbook().xlsx.writeFile(empty);
    for (const input of [text, zip, empty]) {
      const before = digest(input);
      for (const args of [["recalc", input], ["recalc", input, "-o", join(s.folder, "out.xlsx")], ["takedown", input, "-o", join(s.folder, "out.xlsx")], ["export", input], ["report", input, "-o", join(s.folder, "out.html")]]) {
        const r = await cli(...args);
        expect(r.status, args.join(" ")).toBe(2);
        expect(r.err.join("\n"), args.join(" ")).toMatch(/^loadpath \w+: .*(not a readable \.xlsx workbook|not an \.xlsx workbook|no Zones table)/);
      }
      expect(digest(input)).toBe(before);
    }
    unchanged(s, digest(s.input));
    expect(listing(s.folder)).toEqual(["archive.xlsx", "empty.xlsx", "in.xlsx", "notes.xlsx", "out.html", "out.json", "out.xlsx"]);
  });

  it("writeXlsx: a workbook that fails half-way through writing leaves the earlier file whole and no temporary file", async () => {
    const folder = join(dir, "half-written");
    mkdirSync(folder);
    const out = join(folder, "out.xlsx");
    const good = await readXlsx(SAMPLE_US);
    await writeXlsx(good, out);
    const earlier = digest(out);
    // A cell value ExcelJS cannot serialise: the zip is already being written when it fails.
    const bad = new ExcelJS.Workbook();
    const ws = bad.addWorksheet("Sheet1");
    for (let r = 1; r <= 2000; r++) ws.getCell(r, 1).value = `row ${r}`;
    ws.getCell(2001, 1).value = { formula: "A1", result: Symbol("unwritable") } as unknown as ExcelJS.CellValue;
    await expect(writeXlsx(fromExcelJs(bad), out)).rejects.toThrow();
    expect(digest(out)).toBe(earlier);
    expect(listing(folder)).toEqual(["out.xlsx"]);
    expect((await readXlsx(out)).sheets.map((s) => s.name)).toEqual(good.sheets.map((s) => s.name));
  });

  it("writeAtomically: content appears whole at the destination only after the writer finishes", async () => {
    const folder = join(dir, "atomic");
    mkdirSync(folder);
    const out = join(folder, "result.json");
    await writeTextAtomically(out, "first\n");
    await expect(
      writeAtomically(out, (temporary) => {
        writeFileSync(temporary, "partial");
        expect(readFileSync(out, "utf8")).toBe("first\n");
        throw new Error("disk full");
      }),
    ).rejects.toThrow("disk full");
    expect(readFileSync(out, "utf8")).toBe("first\n");
    expect(listing(folder)).toEqual(["result.json"]);
  });
});

describe("a reader that closes the pipe early (loadpath ... | head -1)", () => {
  it("takedown goes on quietly: no EPIPE stack trace, exit 0, the workbook written whole", async () => {
    const s = scene("epipe");
    const before = digest(s.input);
    const out = join(s.folder, "out.xlsx");
    const r = await child(["takedown", s.input, "-o", out, "--json", join(s.folder, "out.json")], true);
    expect(r.stdout).toMatch(/^Takedown of /);
    expect(r.stderr).toBe("");
    expect(r.signal).toBeNull();
    expect(r.code).toBe(0);
    expect(digest(s.input)).toBe(before);
    const wb = await readXlsx(out);
    expect(wb.sheets.map((x) => x.name)).toContain("Takedown");
    expect(JSON.parse(readFileSync(join(s.folder, "out.json"), "utf8")).units).toBe("US");
    expect(listing(s.folder)).toEqual(["in.xlsx", "out.html", "out.json", "out.xlsx"]);
  }, 60_000);
});
