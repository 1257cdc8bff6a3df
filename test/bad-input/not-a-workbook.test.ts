/**
 * Bad input, class B (reading): files that are not .xlsx workbooks. Each verb that reads one says
 * plainly what the file is ("not an .xlsx workbook", "encrypted workbook"), exits 2 (file error)
 * whether or not -o is given, never shows an internal message, and leaves the file unchanged.
 *
 * Formats (recalled from memory): an .xlsx file is a zip (local file header "PK\x03\x04") whose
 * workbook part is xl/workbook.xml (ECMA-376 Part 2, Open Packaging Conventions); a Word file's
 * main part is word/document.xml. A password-protected Office file is not a zip at all but an OLE
 * compound file (signature D0 CF 11 E0 A1 B1 1A E1, [MS-CFB]) holding the streams EncryptionInfo
 * and EncryptedPackage ([MS-OFFCRYPTO]); an old .xls workbook is a compound file without them.
 */
import { writeFileSync } from "node:fs";
import { join } from "node:path";
import JSZip from "jszip";
import { describe, expect, it } from "vitest";
import { readXlsx } from "../../src/workbook/xlsx";
import { hashOf, runCli, scratch } from "./reading-helpers";

const dir = scratch("not-a-workbook");

async function zipOf(parts: Record<string, string>): Promise<Buffer> {
  const zip = new JSZip();
  for (const [name, text] of Object.entries(parts)) zip.file(name, text);
  return zip.generateAsync({ type: "nodebuffer", compression: "DEFLATE" });
}

/** A compound file: its 512-byte header, then a directory sector naming the given streams (UTF-16LE, 128-byte entries). */
function compoundFile(streams: readonly string[]): Buffer {
  const header = Buffer.alloc(512);
  Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1]).copy(header, 0);
  const entries = ["Root Entry", ...streams].map((name) => {
    const e = Buffer.alloc(128);
    e.write(name, 0, "utf16le");
    e.writeUInt16LE((name.length + 1) * 2, 64);
    return e;
  });
  return Buffer.concat([header, ...entries, Buffer.alloc(512 - ((entries.length * 128) % 512))]);
}

const DOCX = { "[Content_Types].xml": '<?xml version="1.0"?><Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types"/>', "word/document.xml": "<w:document/>" };

const CASES: readonly { name: string; file: string; bytes: () => Promise<Buffer> | Buffer; message: RegExp }[] = [
  { name: "a Word document (a zip with word/document.xml)", file: "letter.xlsx", bytes: () => zipOf(DOCX), message: /letter\.xlsx: not an \.xlsx workbook \(a Word document\)\./ },
  { name: "a zip of random files", file: "random.xlsx", bytes: () => zipOf({ "a.txt": "hello", "b/c.bin": "\u0001\u0002" }), message: /random\.xlsx: not an \.xlsx workbook \(a zip file without a workbook in it\)\./ },
  { name: "an empty file", file: "empty.xlsx", bytes: () => Buffer.alloc(0), message: /empty\.xlsx: not an \.xlsx workbook \(the file is empty\)\./ },
  { name: "a CSV file named .xlsx", file: "table.xlsx", bytes: () => Buffer.from("Mark,Type\nB1,beam\n"), message: /table\.xlsx: not an \.xlsx workbook \(not a zip file\)\./ },
  { name: "a password-protected workbook", file: "locked.xlsx", bytes: () => compoundFile(["EncryptionInfo", "EncryptedPackage"]), message: /locked\.xlsx: encrypted workbook \(.*remove the password.*\)\./ },
  { name: "an old binary .xls workbook", file: "old.xls", bytes: () => compoundFile(["Workbook"]), message: /old\.xls: not an \.xlsx workbook \(an older binary file.*save it as \.xlsx\)\./ },
];

describe("files that are not .xlsx workbooks", () => {
  for (const c of CASES) {
    it(`${c.name}: a plain message, exit 2 in every verb, the file unchanged`, async () => {
      const path = join(dir, c.file);
      writeFileSync(path, await c.bytes());
      const before = hashOf(path);
      await expect(readXlsx(path)).rejects.toThrow(c.message);
      for (const args of [["recalc", path], ["recalc", path, "-o", join(dir, "out.xlsx")], ["takedown", path], ["export", path, "-o", join(dir, "handoff.xlsx")], ["report", path, "-o", join(dir, "report.html")]]) {
        const ran = await runCli(...args);
        expect(ran.status, args.join(" ")).toBe(2);
        expect(ran.err).toMatch(c.message);
        expect(ran.err).not.toMatch(/date1904|reading '|TypeError|at .*\.js:\d+/);
      }
      expect(hashOf(path)).toBe(before);
    });
  }

  it("a real workbook still reads", async () => {
    const ExcelJS = (await import("exceljs")).default;
    const wb = new ExcelJS.Workbook();
    wb.addWorksheet("S").getCell("A1").value = 3;
    const path = join(dir, "fine.xlsx");
    await wb.xlsx.writeFile(path);
    const read = await readXlsx(path);
    expect(read.sheets[0]!.rows[0]![0]).toBe(3);
  });
});
