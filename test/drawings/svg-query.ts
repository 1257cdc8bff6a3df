/**
 * Reading the drawings back in tests: a strict XML parse (any well-formedness error fails)
 * and small queries by the data-role attributes the drawings carry.
 */
import { DOMParser } from "@xmldom/xmldom";

/** A parsed element with the few DOM methods the tests use. */
export interface SvgElement {
  readonly tagName: string;
  readonly textContent: string | null;
  readonly attributes: ArrayLike<{ name: string; value: string }>;
  getAttribute(name: string): string | null;
  getElementsByTagName(name: string): ArrayLike<SvgElement>;
  readonly parentNode: SvgElement | null;
}

/** Parse SVG markup; throws on any XML error or warning. */
export function parseSvg(markup: string): SvgElement {
  const problems: string[] = [];
  const parser = new DOMParser({
    errorHandler: { warning: (m: string) => problems.push(m), error: (m: string) => problems.push(m), fatalError: (m: string) => problems.push(m) },
  });
  const doc = parser.parseFromString(markup, "image/svg+xml");
  if (problems.length > 0) throw new Error(`SVG is not well-formed: ${problems.join("; ")}`);
  return doc.documentElement as unknown as SvgElement;
}

/** Every element under root (root included). */
export function allElements(root: SvgElement): SvgElement[] {
  return [root, ...Array.from(root.getElementsByTagName("*"))];
}

/** Elements whose data-role is `role`. */
export function byRole(root: SvgElement, role: string): SvgElement[] {
  return allElements(root).filter((e) => e.getAttribute("data-role") === role);
}

/** A numeric attribute; throws when missing or not a number. */
export function numAttr(e: SvgElement, name: string): number {
  const v = e.getAttribute(name);
  const n = v === null ? Number.NaN : Number(v);
  if (!Number.isFinite(n)) throw new Error(`attribute ${name} is ${String(v)}`);
  return n;
}

/** The text of every <text> element, in document order. */
export function texts(root: SvgElement): string[] {
  return Array.from(root.getElementsByTagName("text")).map((t) => t.textContent ?? "");
}
