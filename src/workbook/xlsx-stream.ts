/**
 * Writing generated sheets straight into an .xlsx package, without a spreadsheet model of the
 * whole workbook. The input file's zip entries are copied as they are, compressed bytes and all,
 * so the user's own sheets, tables, styles, shared strings and names come through byte for byte;
 * only the package's lists are edited (the workbook part gains or keeps a `<sheet>` entry per
 * generated sheet and the names defined through the port, the workbook's relationships and
 * `[Content_Types].xml` gain the new parts, and the calculation chain, a cache Excel rebuilds, is
 * dropped). Each generated sheet's XML is written directly, row by row, and deflated in pieces of
 * about 1 MB, so the whole sheet is never held as one text.
 *
 * Cells: formulas in the file spelling with their computed values cached in full double
 * precision (`<f>` + `<v>`, `t="str"`/`"b"`/`"e"` for text, logical and error results); spilled
 * results as array formulas (`<f t="array" ref="...">`) with the values in the other cells; text as
 * inline strings (the shared string table is the user's and stays as it was); no styles.
 *
 * Anything this writer does not recognise (zip64, encryption, a workbook part with prefixed
 * elements, a sheet to replace that has parts of its own) is reported as a reason, and the caller
 * writes through the spreadsheet model instead. Nothing here throws on a user's file except for
 * errors of the file system.
 */
import { closeSync, openSync, writeSync } from "node:fs";
import { constants, crc32, deflateRawSync, inflateRawSync } from "node:zlib";
import { columnLetter } from "./a1";

/** One entry of a zip file as read: its header fields and its compressed bytes. */
interface ZipEntry {
  readonly name: string;
  readonly flags: number;
  readonly method: number;
  readonly time: number;
  readonly date: number;
  readonly crc: number;
  readonly size: number;
  /** The stored (compressed) bytes. */
  readonly data: Buffer;
}

/** An entry to write: header fields and its stored bytes in pieces. */
interface OutEntry extends Omit<ZipEntry, "data"> {
  readonly chunks: readonly Buffer[];
}

const LOCAL = 0x04034b50;
const CENTRAL = 0x02014b50;
const END = 0x06054b50;
const MAX32 = 0xffffffff;

/**
 * The entries of a zip file, or why they cannot be copied by this writer.
 * @param bytes - the whole file
 */
export function readZip(bytes: Buffer): ZipEntry[] | string {
  let end = -1;
  for (let i = bytes.length - 22; i >= Math.max(0, bytes.length - 22 - 0xffff); i--) {
    if (bytes.readUInt32LE(i) === END) {
      end = i;
      break;
    }
  }
  if (end < 0) return "no zip directory";
  const count = bytes.readUInt16LE(end + 10);
  const offset = bytes.readUInt32LE(end + 16);
  if (count === 0xffff || offset === MAX32) return "a zip64 file";
  const entries: ZipEntry[] = [];
  let p = offset;
  for (let i = 0; i < count; i++) {
    if (p + 46 > bytes.length || bytes.readUInt32LE(p) !== CENTRAL) return "a damaged zip directory";
    const flags = bytes.readUInt16LE(p + 8);
    const method = bytes.readUInt16LE(p + 10);
    const compressed = bytes.readUInt32LE(p + 20);
    const size = bytes.readUInt32LE(p + 24);
    const nameLength = bytes.readUInt16LE(p + 28);
    const extraLength = bytes.readUInt16LE(p + 30);
    const commentLength = bytes.readUInt16LE(p + 32);
    const local = bytes.readUInt32LE(p + 42);
    const name = bytes.toString(flags & 0x800 ? "utf8" : "latin1", p + 46, p + 46 + nameLength);
    if (flags & 1) return "an encrypted zip entry";
    if (compressed === MAX32 || size === MAX32 || local === MAX32) return "a zip64 entry";
    if (method !== 0 && method !== 8) return `zip compression method ${method}`;
    if (local + 30 > bytes.length || bytes.readUInt32LE(local) !== LOCAL) return "a damaged zip entry";
    const start = local + 30 + bytes.readUInt16LE(local + 26) + bytes.readUInt16LE(local + 28);
    if (start + compressed > bytes.length) return "a damaged zip entry";
    entries.push({ name, flags, method, time: bytes.readUInt16LE(p + 12), date: bytes.readUInt16LE(p + 14), crc: bytes.readUInt32LE(p + 16), size, data: bytes.subarray(start, start + compressed) });
    p += 46 + nameLength + extraLength + commentLength;
  }
  return entries;
}

/** The uncompressed bytes of an entry. */
export function entryBytes(e: ZipEntry): Buffer {
  return e.method === 0 ? e.data : inflateRawSync(e.data);
}

/** Date and time now in the zip's (MS-DOS) form. */
function dosNow(): { time: number; date: number } {
  const d = new Date();
  return {
    time: (d.getHours() << 11) | (d.getMinutes() << 5) | Math.floor(d.getSeconds() / 2),
    date: (Math.max(0, d.getFullYear() - 1980) << 9) | ((d.getMonth() + 1) << 5) | d.getDate(),
  };
}

/** A new entry deflated from pieces of text (each piece compressed on its own, flushed, then one final empty block). */
class DeflatedText {
  private readonly chunks: Buffer[] = [];
  private pending: string[] = [];
  private pendingLength = 0;
  private crc = 0;
  private size = 0;

  add(text: string): void {
    this.pending.push(text);
    this.pendingLength += text.length;
    if (this.pendingLength >= 1 << 20) this.flush();
  }

  private flush(): void {
    if (this.pendingLength === 0) return;
    const b = Buffer.from(this.pending.join(""), "utf8");
    this.pending = [];
    this.pendingLength = 0;
    this.crc = crc32(b, this.crc);
    this.size += b.length;
    this.chunks.push(deflateRawSync(b, { finishFlush: constants.Z_SYNC_FLUSH }));
  }

  entry(name: string): OutEntry {
    this.flush();
    this.chunks.push(deflateRawSync(Buffer.alloc(0)));
    const { time, date } = dosNow();
    return { name, flags: 0x800, method: 8, time, date, crc: this.crc >>> 0, size: this.size, chunks: this.chunks };
  }
}

/** A new entry holding one text. */
function textEntry(name: string, text: string): OutEntry {
  const d = new DeflatedText();
  d.add(text);
  return d.entry(name);
}

/** An entry copied as it is stored. */
function copied(e: ZipEntry): OutEntry {
  return { name: e.name, flags: e.flags & 0x800, method: e.method, time: e.time, date: e.date, crc: e.crc, size: e.size, chunks: [e.data] };
}

/** Write entries as a zip file (no data descriptors, no extra fields). */
function writeZip(path: string, entries: readonly OutEntry[]): void {
  const fd = openSync(path, "w");
  try {
    let offset = 0;
    const central: Buffer[] = [];
    const put = (b: Buffer): void => {
      let done = 0;
      while (done < b.length) done += writeSync(fd, b, done, b.length - done);
      offset += b.length;
    };
    for (const e of entries) {
      const name = Buffer.from(e.name, e.flags & 0x800 ? "utf8" : "latin1");
      const compressed = e.chunks.reduce((n, c) => n + c.length, 0);
      if (offset > MAX32 || compressed > MAX32 || e.size > MAX32) throw new Error("the workbook is larger than 4 GB, more than this writer handles");
      const head = Buffer.alloc(30);
      head.writeUInt32LE(LOCAL, 0);
      head.writeUInt16LE(20, 4);
      head.writeUInt16LE(e.flags, 6);
      head.writeUInt16LE(e.method, 8);
      head.writeUInt16LE(e.time, 10);
      head.writeUInt16LE(e.date, 12);
      head.writeUInt32LE(e.crc, 14);
      head.writeUInt32LE(compressed, 18);
      head.writeUInt32LE(e.size, 22);
      head.writeUInt16LE(name.length, 26);
      head.writeUInt16LE(0, 28);
      const dir = Buffer.alloc(46);
      dir.writeUInt32LE(CENTRAL, 0);
      dir.writeUInt16LE(20, 4);
      dir.writeUInt16LE(20, 6);
      head.copy(dir, 8, 6, 28);
      dir.writeUInt32LE(offset, 42);
      central.push(dir, name);
      put(head);
      put(name);
      for (const c of e.chunks) put(c);
    }
    const start = offset;
    for (const b of central) put(b);
    if (entries.length > 0xfffe || offset > MAX32) throw new Error("the workbook has more parts than this writer handles");
    const end = Buffer.alloc(22);
    end.writeUInt32LE(END, 0);
    end.writeUInt16LE(entries.length, 8);
    end.writeUInt16LE(entries.length, 10);
    end.writeUInt32LE(offset - start, 12);
    end.writeUInt32LE(start, 16);
    put(end);
  } finally {
    closeSync(fd);
  }
}

/** Text for XML content or a quoted attribute; control characters as Excel writes them (`_x0001_`). */
export function xmlText(text: string): string {
  return text.replace(/[&<>"\u0000-\u0008\u000b\u000c\u000e-\u001f\ufffe\uffff]/g, (c) => {
    switch (c) {
      case "&":
        return "&amp;";
      case "<":
        return "&lt;";
      case ">":
        return "&gt;";
      case '"':
        return "&quot;";
      default:
        return `_x${c.charCodeAt(0).toString(16).toUpperCase().padStart(4, "0")}_`;
    }
  });
}

/** An attribute's value from an element's text, unescaped, or undefined. */
function attribute(element: string, name: string): string | undefined {
  const m = new RegExp(`\\s${name.replace(/[.:]/g, "\\$&")}\\s*=\\s*("([^"]*)"|'([^']*)')`).exec(element);
  if (!m) return undefined;
  return (m[2] ?? m[3]!).replace(/&(lt|gt|quot|apos|amp|#x([0-9a-fA-F]+)|#(\d+));/g, (_e, what: string, hex?: string, dec?: string) =>
    hex ? String.fromCodePoint(parseInt(hex, 16)) : dec ? String.fromCodePoint(Number(dec)) : ({ lt: "<", gt: ">", quot: '"', apos: "'", amp: "&" } as Record<string, string>)[what]!,
  );
}

/** A computed value as a file caches it. */
export type CachedValue = number | string | boolean | { readonly error: string } | undefined;

/** One cell of a generated sheet to write. Rows and columns 0-based. */
export interface GeneratedCell {
  /** Formula text in the file spelling, without "="; undefined for a plain value. */
  readonly formula?: string;
  /** For an array formula, its area ("F2:H2"). */
  readonly arrayRef?: string;
  /** The value (plain cell) or the cached result (formula cell). */
  readonly value: CachedValue;
}

/** A generated sheet: its name and its cells row by row (a row: 0-based index and its cells by column). */
export interface GeneratedSheet {
  readonly name: string;
  /** Rows in increasing order; each row's cells in increasing column order. */
  rows(): Iterable<{ readonly row: number; readonly cells: Iterable<{ readonly col: number; readonly cell: GeneratedCell }> }>;
}

/** `<v>` text of a number: the shortest text that reads back as the same double. */
function numberText(x: number): string {
  return String(x);
}

/** The XML of one cell. */
function cellXml(ref: string, cell: GeneratedCell): string {
  const v = cell.value;
  let type = "";
  let value = "";
  if (typeof v === "number") {
    if (Number.isFinite(v)) value = `<v>${numberText(v)}</v>`;
    else {
      type = ' t="e"';
      value = "<v>#NUM!</v>";
    }
  } else if (typeof v === "boolean") {
    type = ' t="b"';
    value = `<v>${v ? 1 : 0}</v>`;
  } else if (typeof v === "object" && v !== null) {
    type = ' t="e"';
    value = `<v>${xmlText(v.error)}</v>`;
  } else if (typeof v === "string") {
    const space = /^\s|\s$|\n/.test(v) ? ' xml:space="preserve"' : "";
    if (cell.formula === undefined) return `<c r="${ref}" t="inlineStr"><is><t${space}>${xmlText(v)}</t></is></c>`;
    type = ' t="str"';
    value = `<v${space}>${xmlText(v)}</v>`;
  }
  if (cell.formula === undefined) return value === "" ? "" : `<c r="${ref}"${type}>${value}</c>`;
  const f = cell.arrayRef ? `<f t="array" ref="${cell.arrayRef}">${xmlText(cell.formula)}</f>` : `<f>${xmlText(cell.formula)}</f>`;
  return `<c r="${ref}"${type}>${f}${value}</c>`;
}

/** A sheet's XML written into a deflated entry, row by row. */
function sheetEntry(path: string, sheet: GeneratedSheet): OutEntry {
  const out = new DeflatedText();
  out.add(
    '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships"><sheetData>',
  );
  for (const { row, cells } of sheet.rows()) {
    const r = String(row + 1);
    let text = "";
    for (const { col, cell } of cells) text += cellXml(columnLetter(col) + r, cell);
    if (text !== "") out.add(`<row r="${r}">${text}</row>`);
  }
  out.add("</sheetData></worksheet>");
  return out.entry(path);
}

const REL_NS = "http://schemas.openxmlformats.org/officeDocument/2006/relationships";
const OFFICE_DOCUMENT = `${REL_NS}/officeDocument`;
const WORKSHEET_REL = `${REL_NS}/worksheet`;
const CALC_CHAIN_REL = `${REL_NS}/calcChain`;
const WORKSHEET_TYPE = "application/vnd.openxmlformats-officedocument.spreadsheetml.worksheet+xml";

/** A part's path in the package (no leading "/") from a relationship target and the folder it is relative to. */
function resolvePart(folder: string, target: string): string {
  const parts = (target.startsWith("/") ? target.slice(1) : folder === "" ? target : `${folder}/${target}`).split("/");
  const out: string[] = [];
  for (const p of parts) {
    if (p === "..") out.pop();
    else if (p !== "." && p !== "") out.push(p);
  }
  return out.join("/");
}

/** The relationships part of a part ("xl/workbook.xml" -> "xl/_rels/workbook.xml.rels"). */
function relsOf(part: string): string {
  const slash = part.lastIndexOf("/");
  return `${part.slice(0, slash + 1)}_rels/${part.slice(slash + 1)}.rels`;
}

interface Relationship {
  readonly element: string;
  readonly id: string;
  readonly type: string;
  readonly target: string;
  readonly external: boolean;
}

function relationships(xml: string): Relationship[] {
  return [...xml.matchAll(/<Relationship\b[^>]*?(?:\/>|>\s*<\/Relationship>)/g)].map((m) => ({
    element: m[0],
    id: attribute(m[0], "Id") ?? "",
    type: attribute(m[0], "Type") ?? "",
    target: attribute(m[0], "Target") ?? "",
    external: attribute(m[0], "TargetMode") === "External",
  }));
}

/** Elements of CT_Workbook that come after `<definedNames>` (a new `<definedNames>` goes before the first present). */
const AFTER_DEFINED_NAMES = ["calcPr", "oleSize", "customWorkbookViews", "pivotCaches", "smartTagPr", "smartTagTypes", "webPublishing", "fileRecoveryPr", "webPublishObjects", "extLst"];

/**
 * Write a workbook file: the input package with the generated sheets put in (a sheet of the same
 * name replaced in place, a new one added after the others) and the names given defined.
 * @param input - the bytes of the .xlsx file the workbook was read from
 * @param sheets - the generated sheets
 * @param names - workbook names to define (name -> reference without "="); a workbook name of the same name is replaced
 * @param path - the file to write (the caller's temporary file)
 * @returns undefined when written, else why this writer cannot write it (nothing was written)
 */
export function writeWithGeneratedSheets(input: Buffer, sheets: readonly GeneratedSheet[], names: ReadonlyMap<string, string>, path: string): string | undefined {
  const entries = readZip(input);
  if (typeof entries === "string") return entries;
  const byName = new Map(entries.map((e) => [e.name, e]));
  const text = (name: string): string | undefined => {
    const e = byName.get(name);
    return e ? entryBytes(e).toString("utf8") : undefined;
  };
  const rootRels = text("_rels/.rels");
  const workbookPart = rootRels === undefined ? undefined : relationships(rootRels).find((r) => r.type === OFFICE_DOCUMENT && !r.external);
  if (!workbookPart) return "no workbook part";
  const wbPath = resolvePart("", workbookPart.target);
  const wbFolder = wbPath.includes("/") ? wbPath.slice(0, wbPath.lastIndexOf("/")) : "";
  const wbRelsPath = relsOf(wbPath);
  let workbook = text(wbPath);
  let wbRels = text(wbRelsPath);
  let types = text("[Content_Types].xml");
  if (workbook === undefined || wbRels === undefined || types === undefined) return "a workbook part is missing";
  const prefix = new RegExp(`xmlns:([A-Za-z_][\\w.-]*)\\s*=\\s*"${REL_NS.replace(/[./]/g, "\\$&")}"`).exec(workbook)?.[1];
  if (prefix === undefined || !/<sheets>/.test(workbook) || !/<\/sheets>/.test(workbook)) return "a workbook part this writer does not read";
  const rels = relationships(wbRels);
  const sheetElements = [...workbook.matchAll(/<sheet\b[^>]*?(?:\/>|>\s*<\/sheet>)/g)].map((m) => ({ element: m[0], name: attribute(m[0], "name") ?? "", id: attribute(m[0], `${prefix}:id`) ?? "", sheetId: Number(attribute(m[0], "sheetId") ?? 0) }));
  const replaced = new Map<string, OutEntry>();
  const added: OutEntry[] = [];
  let nextSheetId = Math.max(0, ...sheetElements.map((s) => s.sheetId)) + 1;
  let nextRel = 1;
  const usedRel = new Set(rels.map((r) => r.id));
  const freeRel = (): string => {
    while (usedRel.has(`rId${nextRel}`)) nextRel++;
    usedRel.add(`rId${nextRel}`);
    return `rId${nextRel}`;
  };
  let nextPart = 1;
  const freePart = (): string => {
    while (byName.has(`${wbFolder === "" ? "" : wbFolder + "/"}worksheets/sheet${nextPart}.xml`) || added.some((a) => a.name.endsWith(`worksheets/sheet${nextPart}.xml`))) nextPart++;
    return `worksheets/sheet${nextPart}.xml`;
  };
  let newSheets = "";
  let newRels = "";
  let newTypes = "";
  for (const sheet of sheets) {
    const old = sheetElements.find((s) => s.name.toLowerCase() === sheet.name.toLowerCase());
    if (old) {
      const rel = rels.find((r) => r.id === old.id);
      if (!rel || rel.type !== WORKSHEET_REL || rel.external) return `sheet "${sheet.name}" is not a plain worksheet`;
      const part = resolvePart(wbFolder, rel.target);
      if (!byName.has(part)) return `the part of sheet "${sheet.name}" is missing`;
      // Its own parts (drawings, comments, tables) would be left behind: the model writer removes them.
      if (byName.has(relsOf(part))) return `sheet "${sheet.name}" has parts of its own`;
      replaced.set(part, sheetEntry(part, sheet));
    } else {
      const target = freePart();
      const part = resolvePart(wbFolder, target);
      const id = freeRel();
      added.push(sheetEntry(part, sheet));
      newSheets += `<sheet name="${xmlText(sheet.name)}" sheetId="${nextSheetId++}" ${prefix}:id="${id}"/>`;
      newRels += `<Relationship Id="${id}" Type="${WORKSHEET_REL}" Target="${xmlText(target)}"/>`;
      newTypes += `<Override PartName="/${xmlText(part)}" ContentType="${WORKSHEET_TYPE}"/>`;
    }
  }
  workbook = workbook.replace("</sheets>", `${newSheets}</sheets>`);
  workbook = defineNames(workbook, names);
  // The calculation chain lists formula cells of every sheet; Excel rebuilds it when it is missing.
  const removed = new Set<string>();
  for (const r of rels.filter((x) => x.type === CALC_CHAIN_REL && !x.external)) {
    const part = resolvePart(wbFolder, r.target);
    removed.add(part);
    wbRels = wbRels.replace(r.element, "");
    types = types.replace(new RegExp(`<Override\\b[^>]*PartName\\s*=\\s*"/${part.replace(/[.*+?^${}()|[\]\\/]/g, "\\$&")}"[^>]*?(?:/>|>\\s*</Override>)`), "");
  }
  wbRels = wbRels.replace("</Relationships>", `${newRels}</Relationships>`);
  types = types.replace("</Types>", `${newTypes}</Types>`);
  const edited = new Map<string, OutEntry>([
    [wbPath, textEntry(wbPath, workbook)],
    [wbRelsPath, textEntry(wbRelsPath, wbRels)],
    ["[Content_Types].xml", textEntry("[Content_Types].xml", types)],
    ...replaced,
  ]);
  const out: OutEntry[] = [];
  for (const e of entries) {
    if (removed.has(e.name)) continue;
    out.push(edited.get(e.name) ?? copied(e));
  }
  writeZip(path, out.concat(added));
  return undefined;
}

/** The workbook part with the names defined (replacing a workbook-wide name of the same name, any case). */
function defineNames(workbook: string, names: ReadonlyMap<string, string>): string {
  if (names.size === 0) return workbook;
  let xml = workbook;
  let fresh = "";
  for (const [name, ref] of names) {
    const element = `<definedName name="${xmlText(name)}">${xmlText(ref.replace(/^=/, ""))}</definedName>`;
    const existing = [...xml.matchAll(/<definedName\b[^>]*>[^<]*<\/definedName>/g)].find((m) => (attribute(m[0], "name") ?? "").toLowerCase() === name.toLowerCase() && attribute(m[0], "localSheetId") === undefined);
    if (existing) xml = xml.replace(existing[0], element);
    else fresh += element;
  }
  if (fresh === "") return xml;
  if (/<\/definedNames>/.test(xml)) return xml.replace("</definedNames>", `${fresh}</definedNames>`);
  if (/<definedNames\s*\/>/.test(xml)) return xml.replace(/<definedNames\s*\/>/, `<definedNames>${fresh}</definedNames>`);
  const before = AFTER_DEFINED_NAMES.map((tag) => new RegExp(`<${tag}[\\s/>]`).exec(xml)?.index).filter((i): i is number => i !== undefined);
  const at = before.length > 0 ? Math.min(...before) : xml.lastIndexOf("</workbook>");
  return `${xml.slice(0, at)}<definedNames>${fresh}</definedNames>${xml.slice(at)}`;
}
