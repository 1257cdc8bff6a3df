/**
 * The package inspection used by the hand-off tests finds what it is meant to find: a clean file
 * passes, and a file broken in each way a program complains about is reported.
 */
import { readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import ExcelJS from "exceljs";
import JSZip from "jszip";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { inspectXlsx } from "./package-check";
import { scratchDir } from "./programs";

const scratch = scratchDir("loadpath-pkg-");
afterAll(() => scratch.remove());
const clean = join(scratch.dir, "clean.xlsx");

beforeAll(async () => {
  const wb = new ExcelJS.Workbook();
  const ws = wb.addWorksheet("My sheet");
  ws.getCell("A1").value = 3;
  ws.getCell("B1").value = { formula: "SUM(A1,2)" } as ExcelJS.CellFormulaValue;
  wb.definedNames.add("'My sheet'!$A$1", "span");
  await wb.xlsx.writeFile(clean);
});

/** A copy of the clean file with one part edited. */
async function broken(name: string, part: string, edit: (xml: string) => string, extra?: Record<string, string>): Promise<string> {
  const zip = await JSZip.loadAsync(readFileSync(clean));
  zip.file(part, edit(await zip.file(part)!.async("string")));
  for (const [p, text] of Object.entries(extra ?? {})) zip.file(p, text);
  const out = join(scratch.dir, name);
  writeFileSync(out, await zip.generateAsync({ type: "nodebuffer" }));
  return out;
}

describe("package inspection", () => {
  it("a clean ExcelJS file has no problems, its sheet, name and formula are listed", async () => {
    const r = await inspectXlsx(clean);
    expect(r.problems).toEqual([]);
    expect(r.sheets).toEqual([{ name: "My sheet", state: "visible" }]);
    expect(r.definedNames).toEqual([{ name: "span", ref: "'My sheet'!$A$1" }]);
    expect(r.formulas).toEqual([{ sheet: "My sheet", address: "B1", formula: "SUM(A1,2)" }]);
  });

  it("reports a defined name on a missing sheet and a #REF! name", async () => {
    const path = await broken("names.xlsx", "xl/workbook.xml", (x) =>
      x.replace("</definedNames>", `<definedName name="gone">'Old sheet'!$B$2</definedName><definedName name="bad">#REF!</definedName></definedNames>`),
    );
    const problems = (await inspectXlsx(path)).problems.join("\n");
    expect(problems).toMatch(/gone refers to a missing sheet "Old sheet"/);
    expect(problems).toMatch(/bad: #REF!/);
  });

  it("reports a link to an external workbook and a relationship to a missing part", async () => {
    const path = await broken("links.xlsx", "xl/_rels/workbook.xml.rels", (x) =>
      x.replace(
        "</Relationships>",
        `<Relationship Id="rIdX" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/externalLink" Target="externalLinks/externalLink1.xml"/></Relationships>`,
      ),
    );
    const problems = (await inspectXlsx(path)).problems.join("\n");
    expect(problems).toMatch(/link to an external workbook/);
    expect(problems).toMatch(/missing part xl\/externalLinks\/externalLink1.xml/);
  });

  it("reports malformed XML and a part without a content type", async () => {
    const path = await broken("xml.xlsx", "xl/worksheets/sheet1.xml", (x) => x.replace("</sheetData>", "<row></sheetData>"), { "xl/stray.bin": "x" });
    const problems = (await inspectXlsx(path)).problems.join("\n");
    expect(problems).toMatch(/malformed XML/);
    expect(problems).toMatch(/xl\/stray.bin: no content type/);
  });
});
