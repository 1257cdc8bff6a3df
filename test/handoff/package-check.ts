/**
 * Structural checks of an .xlsx package, read part by part with JSZip: what makes a spreadsheet
 * program show a repair prompt or a security bar (a relationship to a missing part, a part
 * without a content type, malformed XML, links to external workbooks, defined names pointing at
 * sheets that do not exist), and the formulas of each sheet with the functions they call.
 *
 * Test-only code.
 */
import { readFileSync } from "node:fs";
import { DOMParser } from "@xmldom/xmldom";
import JSZip from "jszip";

/** One formula cell found in a sheet part. */
export interface PackageFormula {
  readonly sheet: string;
  readonly address: string;
  readonly formula: string;
}

/** What the package holds and what is wrong with it. */
export interface PackageReport {
  /** Sheet names in workbook order, with their visibility. */
  readonly sheets: readonly { readonly name: string; readonly state: string }[];
  readonly definedNames: readonly { readonly name: string; readonly ref: string }[];
  readonly formulas: readonly PackageFormula[];
  /** Everything that would make a program complain, as sentences. */
  readonly problems: readonly string[];
  readonly parts: readonly string[];
}

const NS_REL = "http://schemas.openxmlformats.org/officeDocument/2006/relationships";

function parseXml(text: string, part: string, problems: string[]): Document {
  const errors: string[] = [];
  const doc = new DOMParser({
    errorHandler: {
      // the parser recovers from mismatched tags with a warning; a program would not
      warning: (msg: string) => void errors.push(msg),
      error: (msg: string) => void errors.push(msg),
      fatalError: (msg: string) => void errors.push(msg),
    },
  }).parseFromString(text, "text/xml") as unknown as Document;
  for (const e of errors) problems.push(`${part}: malformed XML (${e})`);
  return doc;
}

function elements(doc: Document, local: string): Element[] {
  return Array.from(doc.getElementsByTagNameNS("*", local) as unknown as ArrayLike<Element>);
}

/** Directory of a part ("xl/worksheets/sheet1.xml" -> "xl/worksheets"). */
function dirOf(part: string): string {
  const i = part.lastIndexOf("/");
  return i < 0 ? "" : part.slice(0, i);
}

/** Resolve a relationship target against the folder of the part that owns the .rels file. */
function resolveTarget(relsPart: string, target: string): string {
  if (target.startsWith("/")) return target.slice(1);
  const owner = relsPart === "_rels/.rels" ? "" : relsPart.replace(/_rels\/([^/]+)\.rels$/, "$1");
  const parts = (dirOf(owner) === "" ? [] : dirOf(owner).split("/")).concat(target.split("/"));
  const out: string[] = [];
  for (const p of parts) {
    if (p === "..") out.pop();
    else if (p !== "." && p !== "") out.push(p);
  }
  return out.join("/");
}

/** Sheet names a defined name's reference text mentions ('My sheet'!$A$1, Sheet!A1:B2). */
export function sheetsReferenced(ref: string): string[] {
  const out: string[] = [];
  const re = /'((?:[^']|'')+)'!|([A-Za-z_][A-Za-z0-9_. ]*)!/g;
  for (let m = re.exec(ref); m !== null; m = re.exec(ref)) out.push(m[1] !== undefined ? m[1].replace(/''/g, "'") : m[2]!);
  return out;
}

/**
 * Read and check an .xlsx file.
 * @param path - the file
 */
export async function inspectXlsx(path: string): Promise<PackageReport> {
  const zip = await JSZip.loadAsync(readFileSync(path));
  const parts = Object.keys(zip.files).filter((p) => !zip.files[p]!.dir);
  const problems: string[] = [];
  const text = async (p: string): Promise<string> => zip.file(p)!.async("string");

  // content types: every part has one
  const types = parseXml(await text("[Content_Types].xml"), "[Content_Types].xml", problems);
  const defaults = new Set(elements(types, "Default").map((e) => (e.getAttribute("Extension") ?? "").toLowerCase()));
  const overrides = new Set(elements(types, "Override").map((e) => (e.getAttribute("PartName") ?? "").replace(/^\//, "")));
  for (const p of parts) {
    if (p === "[Content_Types].xml") continue;
    const ext = p.slice(p.lastIndexOf(".") + 1).toLowerCase();
    if (!overrides.has(p) && !defaults.has(ext)) problems.push(`${p}: no content type`);
  }
  for (const o of overrides) if (!parts.includes(o)) problems.push(`[Content_Types].xml names ${o}, which is not in the package`);

  // relationships: every internal target exists; no external workbook links
  for (const rels of parts.filter((p) => p.endsWith(".rels"))) {
    const doc = parseXml(await text(rels), rels, problems);
    for (const r of elements(doc, "Relationship")) {
      const target = r.getAttribute("Target") ?? "";
      const type = r.getAttribute("Type") ?? "";
      if (/externalLink/i.test(type)) problems.push(`${rels}: link to an external workbook (${target})`);
      if (r.getAttribute("TargetMode") === "External") {
        problems.push(`${rels}: external target ${target}`);
        continue;
      }
      const resolved = resolveTarget(rels, target);
      if (!parts.includes(resolved)) problems.push(`${rels}: relationship to a missing part ${resolved}`);
    }
  }
  for (const p of parts) if (/externalLink/i.test(p)) problems.push(`${p}: external link part`);

  // workbook: sheets, names
  const wbDoc = parseXml(await text("xl/workbook.xml"), "xl/workbook.xml", problems);
  const wbRels = parseXml(await text("xl/_rels/workbook.xml.rels"), "xl/_rels/workbook.xml.rels", problems);
  const relTarget = new Map(elements(wbRels, "Relationship").map((r) => [r.getAttribute("Id") ?? "", resolveTarget("xl/_rels/workbook.xml.rels", r.getAttribute("Target") ?? "")]));
  if (elements(wbDoc, "externalReference").length > 0) problems.push("xl/workbook.xml: external references");
  const sheets = elements(wbDoc, "sheet").map((s) => ({
    name: s.getAttribute("name") ?? "",
    state: s.getAttribute("state") ?? "visible",
    part: relTarget.get(s.getAttributeNS(NS_REL, "id") ?? s.getAttribute("r:id") ?? "") ?? "",
  }));
  const names = new Set(sheets.map((s) => s.name));
  const definedNames = elements(wbDoc, "definedName").map((d) => ({ name: d.getAttribute("name") ?? "", ref: d.textContent ?? "" }));
  for (const d of definedNames) {
    if (/#REF!/.test(d.ref)) problems.push(`defined name ${d.name}: #REF! (${d.ref})`);
    for (const s of sheetsReferenced(d.ref)) if (!names.has(s)) problems.push(`defined name ${d.name} refers to a missing sheet "${s}" (${d.ref})`);
  }

  // formulas of every sheet; dynamic-array metadata
  const formulas: PackageFormula[] = [];
  for (const s of sheets) {
    if (!parts.includes(s.part)) {
      problems.push(`sheet "${s.name}": part ${s.part} is missing`);
      continue;
    }
    const doc = parseXml(await text(s.part), s.part, problems);
    for (const c of elements(doc, "c")) {
      if (c.hasAttribute("cm")) problems.push(`${s.name}!${c.getAttribute("r")}: dynamic-array cell metadata`);
      const f = elements(c as unknown as Document, "f")[0];
      if (f && (f.textContent ?? "") !== "") formulas.push({ sheet: s.name, address: c.getAttribute("r") ?? "", formula: f.textContent ?? "" });
    }
  }
  return { sheets: sheets.map(({ name, state }) => ({ name, state })), definedNames, formulas, problems, parts };
}

/** Function names a formula calls (upper case, prefixes such as _xlfn. kept). */
export function functionsCalled(formula: string): string[] {
  const noStrings = formula.replace(/"(?:[^"]|"")*"/g, '""').replace(/'(?:[^']|'')+'!/g, "S!");
  const out: string[] = [];
  const re = /([A-Za-z_][A-Za-z0-9_.]*)\(/g;
  for (let m = re.exec(noStrings); m !== null; m = re.exec(noStrings)) out.push(m[1]!.toUpperCase());
  return out;
}
