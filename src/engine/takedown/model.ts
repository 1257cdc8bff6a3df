/**
 * The takedown model: the rows of the Zones, Members and Loads tables read into zones, members
 * and extra loads, each keeping the cells it came from (the written formulas reference them).
 * Every unusable cell becomes a problem naming its cell; a member with a problem on its own row
 * is left out of the takedown, the others still build.
 */
import { formatNumber, isErrorValue, numberOf, textOf, yesNoOf } from "./cells";
import { problemAt, tableCell, type BearingsColumn, type LoadsColumn, type MatchedTable, type MembersColumn, type ZonesColumn } from "./tables";
import { LOAD_CASES, type CellRef, type CellValue, type LoadCase, type Problem, type UnitSystem } from "./types";

/** Member types of docs/interface.md section 2. */
export type MemberType = "beam" | "girder" | "joist" | "column" | "wall" | "foundation";

/** Type words accepted in the Type column (lower case) -> member type; blank is a beam. */
export const TYPE_WORDS: Readonly<Record<string, MemberType>> = {
  beam: "beam",
  girder: "girder",
  joist: "joist",
  column: "column",
  post: "column",
  wall: "wall",
  foundation: "foundation",
  footing: "foundation",
};

/** A word of a fixed vocabulary, never one of the object's inherited names ("constructor", "__proto__"). */
function wordOf<T>(words: Readonly<Record<string, T>>, key: string): T | undefined {
  return Object.prototype.hasOwnProperty.call(words, key) ? words[key] : undefined;
}

/** True for members that bend between two supports (beam, girder, joist). */
export function isFlexural(type: MemberType): boolean {
  return type === "beam" || type === "girder" || type === "joist";
}

/** True for members that end the load path (wall, foundation). */
export function isTerminal(type: MemberType): boolean {
  return type === "wall" || type === "foundation";
}

/**
 * True for members that end the load path: foundations, and walls with no Start support. A wall
 * whose Start support names what it bears on (a wall below, a beam, girder or joist, a
 * foundation) hands its load down like a column.
 */
export function endsPath(m: Pick<Member, "type" | "start">): boolean {
  return m.type === "foundation" || (m.type === "wall" && m.start.mark === "");
}

/** A zone of the load schedule. */
export interface Zone {
  readonly name: string;
  readonly nameCell: CellRef;
  /** Cell of the area load of each case the zone has a value for (a blank cell: the case does not act here). */
  readonly loadCells: Readonly<Partial<Record<LoadCase, CellRef>>>;
  /** Live load of this zone may be reduced (ASCE/SEI 7-22 Sec. 4.7). */
  readonly reducible: boolean;
}

/** A number cell of a member row: its value at build time and where it is. */
export interface NumberInput {
  readonly value: number | null;
  readonly cell: CellRef;
}

/** One end's support as given: the supporting member's mark and the position along it. */
export interface SupportInput {
  readonly mark: string;
  /** Cell of the support mark (the Start support / End support cell). */
  readonly cell: CellRef | null;
  /** Position along the supporting member (Start at / End at), when that column exists. */
  readonly at: NumberInput | null;
}

/** One row of the Members table. */
export interface Member {
  /** Position in {@link TakedownModel.members}. */
  readonly index: number;
  readonly mark: string;
  readonly markCell: CellRef;
  readonly type: MemberType;
  readonly level: string;
  /** Span between the supports (beams) or height (columns, optional). */
  readonly span: NumberInput | null;
  readonly startOverhang: NumberInput | null;
  readonly endOverhang: NumberInput | null;
  /** The zone whose area loads the member carries over its trib width, if any. */
  readonly zone: Zone | null;
  readonly trib: NumberInput | null;
  readonly start: SupportInput;
  readonly end: SupportInput;
  readonly kll: NumberInput | null;
  /** Cells of the extra full-length line loads wD, wL, ... the member has a value for. */
  readonly extra: Readonly<Partial<Record<LoadCase, CellRef>>>;
  /** False when a problem on the member's own row leaves it out of the takedown. */
  readonly valid: boolean;
  /** False for the second and later rows of a repeated mark. */
  readonly firstOfMark: boolean;
  /** Deflection inputs (optional Members columns E, I, Live limit, Total limit); absent when none is filled. */
  readonly deflection?: DeflectionInput;
}

/** A span-ratio limit cell: 360 or the text L/360; `text` when the cell holds the L/ form (read in the formula). */
export interface LimitInput {
  readonly value: number;
  readonly cell: CellRef;
  readonly text: boolean;
}

/** A flexural member's deflection inputs: E (ksi or MPa), I (in⁴ or mm⁴, null = blank: required I is given), limits (null = default). */
export interface DeflectionInput {
  readonly E: NumberInput | null;
  readonly I: NumberInput | null;
  readonly liveLimit: LimitInput | null;
  readonly totalLimit: LimitInput | null;
}

/** Kinds of extra loads in the Loads table. */
export type ExtraLoadKind = "area" | "line" | "point";

/** One row of the Loads table. */
export interface ExtraLoad {
  /** 1-based sheet row, for descriptions. */
  readonly sheetRow: number;
  readonly sheet: string;
  readonly mark: string;
  readonly markCell: CellRef;
  readonly kind: ExtraLoadKind;
  /** Zone of an area load. */
  readonly zone: Zone | null;
  /** Case of a line or point load. */
  readonly loadCase: LoadCase | null;
  readonly magnitude: NumberInput | null;
  readonly width: NumberInput | null;
  readonly from: NumberInput | null;
  readonly to: NumberInput | null;
  /** Width at To of an area load (End width), when given: the width varies linearly from Width at From. */
  readonly endWidth: NumberInput | null;
  /** Magnitude at To of a line load (End magnitude), when given: it varies linearly from Magnitude at From. */
  readonly endMagnitude: NumberInput | null;
  readonly valid: boolean;
}

/** True when a Loads row varies linearly along its length (End width or End magnitude given). */
export function isTrapezoid(l: ExtraLoad): boolean {
  return (l.kind === "area" && l.endWidth !== null && l.endWidth.value !== null) || (l.kind === "line" && l.endMagnitude !== null && l.endMagnitude.value !== null);
}

/** One row of the Bearings table: an interior support of a continuous member. */
export interface Bearing {
  /** 1-based sheet row, for descriptions. */
  readonly sheetRow: number;
  /** Mark of the continuous member. */
  readonly mark: string;
  readonly markCell: CellRef;
  /** What holds the member there, and where along it (Support at). */
  readonly support: SupportInput;
  /** Position of the support along the member, from its start end, overhang included. */
  readonly at: NumberInput | null;
  readonly valid: boolean;
}

/** Everything the takedown is built from. */
export interface TakedownModel {
  readonly units: UnitSystem;
  /** Load cases carried, in LOAD_CASES order: those with a value in the Zones, a wX column or a Loads row. */
  readonly cases: readonly LoadCase[];
  /** Zones by lower-case name. */
  readonly zones: ReadonlyMap<string, Zone>;
  readonly members: readonly Member[];
  readonly loads: readonly ExtraLoad[];
  /** Rows of the Bearings table (empty without one). */
  readonly bearings: readonly Bearing[];
  /**
   * Input cells that hold a number stored as text (" 24.5 ", "1e3", common after a CSV import),
   * by {@link cellKey}: the checks read them as that number, so the written formulas convert them
   * (VALUE) rather than hand text to a function or a sum.
   */
  readonly textNumbers: ReadonlySet<string>;
}

/** Key of a cell in {@link TakedownModel.textNumbers}. */
export function cellKey(cell: CellRef): string {
  return `${cell.sheet}\u0000${cell.row}\u0000${cell.col}`;
}

/** The tables a model is read from (Loads optional). */
export interface ModelTables {
  readonly zones: MatchedTable<ZonesColumn>;
  readonly members: MatchedTable<MembersColumn>;
  readonly loads?: MatchedTable<LoadsColumn>;
  readonly bearings?: MatchedTable<BearingsColumn>;
}

/** Reads the cells of one table row by column key. */
class RowReader<K extends string> {
  constructor(
    readonly table: MatchedTable<K>,
    readonly rowIndex: number,
    readonly problems: Problem[],
    readonly textNumbers: Set<string>,
  ) {}

  has(key: K): boolean {
    return this.table.columns[key] !== undefined;
  }

  cell(key: K): CellRef | null {
    const col = this.table.columns[key];
    return col === undefined ? null : tableCell(this.table.data, this.rowIndex, col);
  }

  raw(key: K): CellValue {
    const col = this.table.columns[key];
    return col === undefined ? null : (this.table.data.values[this.rowIndex]![col] ?? null);
  }

  text(key: K): string {
    return textOf(this.raw(key));
  }

  /**
   * Report text cells of the row that hold a spreadsheet error value (#N/A, #REF!, ...): a mark,
   * level, type or support name that is an error is never used as a name.
   * @returns true when one was found
   */
  errorsIn(keys: readonly { key: K; what: string }[], mark?: string): boolean {
    let found = false;
    for (const { key, what } of keys) {
      const v = this.raw(key);
      if (isErrorValue(v)) {
        found = true;
        this.report(key, "badValue", `${mark ? `${mark}: ` : ""}${what} is the error value ${String(v).trim()}; give a ${what.toLowerCase()}.`, mark);
      } else if (this.isDate(key)) {
        found = true;
        this.report(key, "badValue", `${mark ? `${mark}: ` : ""}${what} is a date (the spreadsheet turned the text typed there into one); type the ${what.toLowerCase()} as text, e.g. with a leading apostrophe.`, mark);
      }
    }
    return found;
  }

  /** Whether the cell holds a date (known only where the reader says so). */
  isDate(key: K): boolean {
    const col = this.table.columns[key];
    return col !== undefined && this.table.data.dates?.[this.rowIndex]?.[col] === true;
  }

  report(key: K, code: Problem["code"], message: string, mark?: string): void {
    const col = this.table.columns[key] ?? 0;
    this.problems.push(problemAt(this.table.data, this.rowIndex, col, code, message, mark));
  }

  /** A number cell; text or an error is reported (bad = true), blank gives value null. */
  number(key: K, what: string, mark?: string): { input: NumberInput | null; bad: boolean } {
    const cell = this.cell(key);
    if (cell === null) return { input: null, bad: false };
    const n = numberOf(this.raw(key));
    if (n.kind === "bad") {
      this.report(key, "badValue", `${what} "${n.text}" is not a number.`, mark);
      return { input: { value: null, cell }, bad: true };
    }
    if (n.kind === "number" && typeof this.raw(key) === "string") this.textNumbers.add(cellKey(cell));
    return { input: { value: n.kind === "number" ? n.value : null, cell }, bad: false };
  }
}

function rowsOf<K extends string>(table: MatchedTable<K>, problems: Problem[], textNumbers: Set<string>): RowReader<K>[] {
  return table.rows.map((i) => new RowReader(table, i, problems, textNumbers));
}

/** Read the Zones table. */
function readZones(table: MatchedTable<ZonesColumn>, problems: Problem[], textNumbers: Set<string>): Map<string, Zone> {
  const zones = new Map<string, Zone>();
  const cases = LOAD_CASES.filter((c) => table.columns[c] !== undefined);
  if (cases.length === 0) problems.push(problemAt(table.data, 0, 0, "missingColumn", "The Zones table has none of the load case columns D, L, Lr, S, R."));
  for (const r of rowsOf(table, problems, textNumbers)) {
    if (r.errorsIn([{ key: "zone", what: "Zone name" }])) continue;
    const name = r.text("zone");
    if (name === "") {
      r.report("zone", "badValue", "This Zones row has loads but no zone name.");
      continue;
    }
    const key = name.toLowerCase();
    const first = zones.get(key);
    if (first) {
      r.report("zone", "duplicateMark", `Zone "${name}" is listed twice; the row at ${first.nameCell.row + 1} is used.`);
      continue;
    }
    const loadCells: Partial<Record<LoadCase, CellRef>> = {};
    for (const c of cases) {
      // A blank cell: the case does not act on this zone (0 keeps it in the takedown, live).
      const n = r.number(c, `Zone ${name}, ${c}`);
      if (n.input === null || n.input.value === null) continue;
      // Gravity area loads act downward: a negative one is a sign slip (an uplift is not a gravity case).
      if (n.input.value < 0) {
        r.report(c, "badValue", `Zone ${name}, ${c} ${formatNumber(n.input.value)} is negative; gravity area loads are entered positive downward (left out).`);
        continue;
      }
      loadCells[c] = n.input.cell;
    }
    const reducible = r.has("reducible") ? yesNoOf(r.raw("reducible")) : false;
    if (reducible === undefined) r.report("reducible", "badValue", `Zone ${name}: Reducible "${r.text("reducible")}" is not yes or no.`);
    zones.set(key, { name, nameCell: r.cell("zone")!, loadCells, reducible: reducible === true });
  }
  return zones;
}

const EXTRA_COLUMNS: Readonly<Record<LoadCase, MembersColumn>> = { D: "wD", L: "wL", Lr: "wLr", S: "wS", R: "wR" };

/** Read one member row; problems on it make it invalid. */
function readMember(r: RowReader<MembersColumn>, index: number, zones: ReadonlyMap<string, Zone>, firstOfMark: boolean): Member {
  const before = r.problems.length;
  const mark = r.text("mark");
  r.errorsIn(
    [
      { key: "type", what: "Type" },
      { key: "level", what: "Level" },
      { key: "zone", what: "Zone" },
      { key: "startSupport", what: "Start support" },
      { key: "endSupport", what: "End support" },
    ],
    mark,
  );
  const typeText = isErrorValue(r.raw("type")) ? "" : r.text("type").toLowerCase();
  const type = typeText === "" ? "beam" : wordOf(TYPE_WORDS, typeText);
  if (type === undefined) r.report("type", "unknownType", `${mark}: type "${r.text("type")}" is not beam, girder, joist, column, wall or foundation.`, mark);
  const memberType = type ?? "beam";
  const span = r.number("span", `${mark}: span`, mark);
  if (!span.bad && isFlexural(memberType) && (span.input === null || span.input.value === null || span.input.value <= 0)) {
    const got = span.input?.value === null || span.input === null ? "blank" : formatNumber(span.input.value);
    r.report("span", "badSpan", `${mark}: a ${memberType} needs a span greater than 0 (got ${got}).`, mark);
  } else if (!span.bad && span.input?.value !== null && span.input !== null && span.input.value < 0) {
    r.report("span", "badSpan", `${mark}: span ${formatNumber(span.input.value)} is negative.`, mark);
  }
  const nonNegative = (key: MembersColumn, what: string): NumberInput | null => {
    const n = r.number(key, `${mark}: ${what}`, mark);
    if (!n.bad && n.input?.value !== null && n.input !== null && n.input.value < 0) r.report(key, "badValue", `${mark}: ${what} ${formatNumber(n.input.value)} is negative.`, mark);
    return n.input;
  };
  const startOverhang = nonNegative("startOverhang", "start overhang");
  const endOverhang = nonNegative("endOverhang", "end overhang");
  const trib = nonNegative("trib", "trib");
  const kll = r.number("kll", `${mark}: KLL`, mark).input;
  if (kll?.value !== null && kll !== null && kll.value <= 0) r.report("kll", "badValue", `${mark}: KLL ${formatNumber(kll.value)} must be greater than 0.`, mark);
  const zoneName = isErrorValue(r.raw("zone")) ? "" : r.text("zone");
  const zone = zoneName === "" ? null : (zones.get(zoneName.toLowerCase()) ?? null);
  if (zoneName !== "" && zone === null) r.report("zone", "unknownZone", `${mark}: zone "${zoneName}" is not in the Zones table.`, mark);
  if (zone !== null && !isFlexural(memberType)) r.report("zone", "badValue", `${mark}: a ${memberType} takes no area load; give the zone to the beams it carries.`, mark);
  const extra: Partial<Record<LoadCase, CellRef>> = {};
  for (const c of LOAD_CASES) {
    const key = EXTRA_COLUMNS[c];
    const n = r.number(key, `${mark}: ${key}`, mark);
    if (n.input?.value !== null && n.input !== null) extra[c] = n.input.cell;
  }
  const support = (markKey: MembersColumn, atKey: MembersColumn, what: string): SupportInput => ({
    mark: r.text(markKey),
    cell: r.cell(markKey),
    at: r.number(atKey, `${mark}: ${what}`, mark).input,
  });
  const start = support("startSupport", "startAt", "Start at");
  const end = support("endSupport", "endAt", "End at");
  const deflection = readDeflection(r, mark, memberType);
  const valid = firstOfMark && r.problems.length === before;
  return {
    index,
    mark,
    markCell: r.cell("mark")!,
    type: memberType,
    level: r.text("level"),
    span: span.input,
    startOverhang,
    endOverhang,
    zone,
    trib,
    start,
    end,
    kll,
    extra,
    valid,
    firstOfMark,
    ...(deflection !== null ? { deflection } : {}),
  };
}

/** A limit cell: a positive number (360) or text L/360 (case and spaces aside). */
function readLimit(r: RowReader<MembersColumn>, key: "liveLimit" | "totalLimit", what: string, mark: string): LimitInput | null {
  const cell = r.cell(key);
  if (cell === null) return null;
  const raw = r.raw(key);
  if (isErrorValue(raw)) {
    r.report(key, "badValue", `${mark}: ${what} is the error value ${String(raw).trim()}; give a span ratio such as 360 or L/360.`, mark);
    return null;
  }
  const t = textOf(raw);
  if (t === "") return null;
  const m = /^L\s*\/\s*(\d+(?:\.\d*)?)$/i.exec(t);
  const n = m ? Number(m[1]) : numberOf(raw).kind === "number" ? (numberOf(raw) as { value: number }).value : Number.NaN;
  if (!(Number.isFinite(n) && n > 0)) {
    r.report(key, "badValue", `${mark}: ${what} "${t}" is not a span ratio; give a number greater than 0 such as 360, or L/360.`, mark);
    return null;
  }
  if (!m && typeof raw === "string") r.textNumbers.add(cellKey(cell));
  return { value: n, cell, text: m !== null };
}

/** The deflection inputs of a member row (null when none of the columns is filled). */
function readDeflection(r: RowReader<MembersColumn>, mark: string, type: MemberType): DeflectionInput | null {
  const positive = (key: "E" | "I", what: string): NumberInput | null => {
    const n = r.number(key, `${mark}: ${what}`, mark);
    if (n.bad || n.input === null || n.input.value === null) return null;
    if (n.input.value <= 0) {
      r.report(key, "badValue", `${mark}: ${what} ${formatNumber(n.input.value)} must be greater than 0.`, mark);
      return null;
    }
    return n.input;
  };
  const E = positive("E", "E");
  const I = positive("I", "I");
  const liveLimit = readLimit(r, "liveLimit", "Live limit", mark);
  const totalLimit = readLimit(r, "totalLimit", "Total limit", mark);
  if (E === null && I === null && liveLimit === null && totalLimit === null) return null;
  if (!isFlexural(type)) return null;
  return { E, I, liveLimit, totalLimit };
}

/** Read the Members table. */
function readMembers(table: MatchedTable<MembersColumn>, zones: ReadonlyMap<string, Zone>, problems: Problem[], textNumbers: Set<string>): Member[] {
  const members: Member[] = [];
  const firstRow = new Map<string, CellRef>();
  for (const r of rowsOf(table, problems, textNumbers)) {
    if (r.errorsIn([{ key: "mark", what: "Mark" }])) continue;
    const mark = r.text("mark");
    if (mark === "") {
      r.report("mark", "badValue", "This Members row has values but no mark.");
      continue;
    }
    const first = firstRow.get(mark);
    if (first) r.report("mark", "duplicateMark", `Mark ${mark} is used twice; the row at ${first.row + 1} is used and this one is left out.`, mark);
    else firstRow.set(mark, r.cell("mark")!);
    members.push(readMember(r, members.length, zones, first === undefined));
  }
  return members;
}

/** Case names as typed (lower case) -> case. */
const CASE_WORDS: Readonly<Record<string, LoadCase>> = { d: "D", l: "L", lr: "Lr", s: "S", r: "R" };

/** Read one Loads row; the member it names is checked later against the Members table. */
function readLoad(r: RowReader<LoadsColumn>, zones: ReadonlyMap<string, Zone>): ExtraLoad {
  const before = r.problems.length;
  const mark = r.text("mark");
  const sheetRow = r.table.data.top + r.rowIndex + 1;
  const label = `Loads row ${sheetRow}${mark ? ` (${mark})` : ""}`;
  if (mark === "") r.report("mark", "badValue", `${label}: no member mark.`);
  const kindText = r.text("kind").toLowerCase();
  const kind = (["area", "line", "point"] as const).find((k) => k === kindText);
  if (kind === undefined) r.report("kind", "badValue", `${label}: kind "${r.text("kind")}" is not area, line or point.`, mark);
  const what = r.text("zoneOrCase");
  let zone: Zone | null = null;
  let loadCase: LoadCase | null = null;
  if (kind === "area") {
    zone = zones.get(what.toLowerCase()) ?? null;
    if (zone === null) r.report("zoneOrCase", "unknownZone", `${label}: zone "${what}" is not in the Zones table.`, mark);
  } else if (kind !== undefined) {
    loadCase = wordOf(CASE_WORDS, what.toLowerCase()) ?? null;
    if (loadCase === null) r.report("zoneOrCase", "badValue", `${label}: "${what}" is not a load case (D, L, Lr, S or R).`, mark);
  }
  const magnitude = r.number("magnitude", `${label}: magnitude`, mark).input;
  if (kind !== undefined && kind !== "area" && (magnitude === null || magnitude.value === null)) {
    r.report("magnitude", "badValue", `${label}: a ${kind} load needs a magnitude.`, mark);
  }
  const width = r.number("width", `${label}: width`, mark).input;
  if (kind === "area" && (width === null || width.value === null || width.value < 0)) {
    r.report("width", "badValue", `${label}: an area load needs a width of 0 or more.`, mark);
  }
  const from = r.number("from", `${label}: From`, mark).input;
  const to = r.number("to", `${label}: To`, mark).input;
  const f = from?.value ?? null;
  const t = to?.value ?? null;
  if (kind !== undefined && kind !== "point" && (f === null) !== (t === null)) r.report(f === null ? "from" : "to", "badValue", `${label}: give both From and To, or neither for the full length.`, mark);
  if (kind !== undefined && kind !== "point" && f !== null && t !== null && !(t > f)) r.report("to", "badValue", `${label}: To ${formatNumber(t)} must be greater than From ${formatNumber(f)}.`, mark);
  const endWidth = r.number("endWidth", `${label}: End width`, mark).input;
  const endMagnitude = r.number("endMagnitude", `${label}: End magnitude`, mark).input;
  const ew = endWidth?.value ?? null;
  const em = endMagnitude?.value ?? null;
  if (ew !== null && kind !== "area") r.report("endWidth", "badValue", `${label}: End width applies to an area load only (this row's kind is ${kind ?? "not known"}); a line load takes End magnitude.`, mark);
  if (ew !== null && kind === "area" && ew < 0) r.report("endWidth", "badValue", `${label}: End width ${formatNumber(ew)} is negative; give a width of 0 or more.`, mark);
  if (em !== null && kind !== "line") r.report("endMagnitude", "badValue", `${label}: End magnitude applies to a line load only (this row's kind is ${kind ?? "not known"}); an area load takes End width.`, mark);
  return {
    sheetRow,
    sheet: r.table.data.sheet,
    mark,
    markCell: r.cell("mark")!,
    kind: kind ?? "point",
    zone,
    loadCase,
    magnitude,
    width,
    from,
    to,
    endWidth,
    endMagnitude,
    valid: r.problems.length === before,
  };
}

/** Read one Bearings row; the member and the support it names are checked later (validate.ts). */
function readBearing(r: RowReader<BearingsColumn>): Bearing {
  const before = r.problems.length;
  const mark = r.text("mark");
  const sheetRow = r.table.data.top + r.rowIndex + 1;
  const label = `Bearings row ${sheetRow}${mark ? ` (${mark})` : ""}`;
  r.errorsIn([{ key: "mark", what: "Mark" }, { key: "support", what: "Support" }], mark);
  if (mark === "") r.report("mark", "badValue", `${label}: no member mark.`);
  const supportMark = isErrorValue(r.raw("support")) ? "" : r.text("support");
  if (supportMark === "" && !isErrorValue(r.raw("support"))) r.report("support", "unknownSupport", `${label}: Support is blank; give the mark of what holds ${mark || "the member"} there.`, mark);
  const at = r.number("at", `${label}: At`, mark);
  if (!at.bad && (at.input === null || at.input.value === null)) r.report("at", "missingPosition", `${label}: At is blank; give the position of the support along ${mark || "the member"}.`, mark);
  const supportAt = r.number("supportAt", `${label}: Support at`, mark).input;
  return {
    sheetRow,
    mark,
    markCell: r.cell("mark")!,
    support: { mark: supportMark, cell: r.cell("support"), at: supportAt },
    at: at.input,
    valid: r.problems.length === before,
  };
}

/** Load cases carried: those with a value in a Zones case column, a wX column or a Loads row. */
function casesOf(zones: ReadonlyMap<string, Zone>, members: readonly Member[], loads: readonly ExtraLoad[]): LoadCase[] {
  const used = new Set<LoadCase>();
  for (const z of zones.values()) for (const c of Object.keys(z.loadCells) as LoadCase[]) used.add(c);
  for (const m of members) for (const c of Object.keys(m.extra) as LoadCase[]) used.add(c);
  for (const l of loads) if (l.valid && l.loadCase !== null) used.add(l.loadCase);
  return LOAD_CASES.filter((c) => used.has(c));
}

/**
 * Read the matched tables into the takedown model.
 * @param tables - Zones, Members and (optionally) Loads, headers already matched
 * @param units - the takedown's unit system
 * @returns the model and every problem found in the rows (cells named)
 */
export function readModel(tables: ModelTables, units: UnitSystem): { model: TakedownModel; problems: Problem[] } {
  const problems: Problem[] = [];
  const textNumbers = new Set<string>();
  const zones = readZones(tables.zones, problems, textNumbers);
  const members = readMembers(tables.members, zones, problems, textNumbers);
  const loads = tables.loads ? rowsOf(tables.loads, problems, textNumbers).map((r) => readLoad(r, zones)) : [];
  const bearings = tables.bearings ? rowsOf(tables.bearings, problems, textNumbers).map(readBearing) : [];
  return { model: { units, cases: casesOf(zones, members, loads), zones, members, loads, bearings, textNumbers }, problems };
}

/** Length of a member at build time: start overhang + span + end overhang (null when the span is unknown). */
export function memberLength(m: Member): number | null {
  const span = m.span?.value ?? null;
  if (span === null) return null;
  return (m.startOverhang?.value ?? 0) + span + (m.endOverhang?.value ?? 0);
}
