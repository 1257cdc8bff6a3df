/**
 * Small builders of the report's HTML. Element and attribute names only ever come from this
 * code; every attribute value and every piece of text goes through {@link escapeXml}, so text
 * read from a cell (a mark, a zone name, a project name) is shown as text, never as markup.
 * Numbers in tables carry their full value in `data-value`, so a reader (or a test) can check
 * the printed figure against the computed one.
 */
import { escapeXml } from "../drawings/escape";
import { DECIMALS, fixedDecimals, MINUS as DRAWN_MINUS, type Quantity } from "../drawings/format";

/** Attribute values; `undefined` or `false` leaves the attribute out. */
export type Attrs = Readonly<Record<string, string | number | boolean | undefined>>;

/** Markup made by these builders (never raw text). */
export interface Html {
  readonly html: string;
}

/** Text or markup as a child: text is escaped, markup is kept. */
export type Child = string | Html | null | undefined | false;

/** The minus sign of printed numbers (U+2212). */
export const MINUS = DRAWN_MINUS;

function attrText(attrs: Attrs): string {
  let out = "";
  for (const [k, v] of Object.entries(attrs)) {
    if (v === undefined || v === false) continue;
    out += v === true ? ` ${k}` : ` ${k}="${escapeXml(String(v))}"`;
  }
  return out;
}

/**
 * Markup as a tree of pieces, joined once when its text is first asked for: a report of a
 * thousand members nests elements ten deep, and joining at every level would copy the whole
 * report that many times.
 */
class Markup implements Html {
  private text: string | undefined;
  constructor(private readonly parts: readonly (string | Html)[]) {}
  /** Append the pieces, in order, to `out`. */
  write(out: string[]): void {
    if (this.text !== undefined) {
      out.push(this.text);
      return;
    }
    for (const p of this.parts) {
      if (typeof p === "string") out.push(p);
      else if (p instanceof Markup) p.write(out);
      else out.push(p.html);
    }
  }
  get html(): string {
    if (this.text === undefined) {
      const out: string[] = [];
      this.write(out);
      this.text = out.join("");
    }
    return this.text;
  }
}

/** The pieces of children: text escaped, markup kept, nothing for null, undefined or false. */
function pieces(kids: readonly Child[]): (string | Html)[] {
  const out: (string | Html)[] = [];
  for (const k of kids) {
    if (k === null || k === undefined || k === false) continue;
    out.push(typeof k === "string" ? escapeXml(k) : k);
  }
  return out;
}

/**
 * Markup kept as it is: for SVG strings from the diagram renderers (which escape their own
 * text) and for markup built here.
 * @param html - trusted markup
 */
export function raw(html: string): Html {
  return new Markup([html]);
}

/** Children as markup text: text escaped. */
export function children(...kids: readonly Child[]): string {
  return new Markup(pieces(kids)).html;
}

/**
 * One element.
 * @param name - element name, a constant of this code
 * @param attrs - attributes, values escaped here
 * @param kids - children: text (escaped) or markup
 */
export function el(name: string, attrs: Attrs, ...kids: readonly Child[]): Html {
  return new Markup([`<${name}${attrText(attrs)}>`, ...pieces(kids), `</${name}>`]);
}

/** Several pieces of markup as one. */
export function join(parts: readonly Child[]): Html {
  return new Markup(pieces(parts));
}

/**
 * A number with a fixed count of decimals and a true minus sign; "0" never shows as "−0.00".
 * @param value - the number
 * @param decimals - decimals shown
 */
export function fixed(value: number, decimals: number): string {
  return fixedDecimals(value, decimals);
}

/** How many decimals each kind of number is printed with: the shared formatter's (src/drawings/format.ts). */
export { DECIMALS };

/** A kind of number in {@link DECIMALS}. */
export type NumberKind = Quantity;

/**
 * A table cell holding a number: printed with the kind's decimals, full value in `data-value`.
 * @param value - the number (null or undefined: an empty cell)
 * @param kind - what it is (sets the decimals)
 * @param attrs - further attributes (data-* for readers)
 */
export function numCell(value: number | null | undefined, kind: NumberKind, attrs: Attrs = {}): Html {
  if (value === null || value === undefined) return el("td", { class: "num", ...attrs }, "");
  return el("td", { class: "num", "data-value": String(value), ...attrs }, fixed(value, DECIMALS[kind]));
}

/**
 * A position or length as printed in prose: at most two decimals, trailing zeros dropped.
 * @param value - the length
 */
export function length(value: number): string {
  const s = fixed(value, DECIMALS.length);
  return s.includes(".") ? s.replace(/0+$/, "").replace(/\.$/, "") : s;
}
