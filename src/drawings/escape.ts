/**
 * Text from the workbook (marks, zone names, case labels) is drawn as text, never as markup.
 * This module is the only place that turns arbitrary text into SVG/XML character data.
 */

/** Characters XML 1.0 forbids anywhere (C0 controls but tab/newline/return, lone surrogates, U+FFFE/F). */
const FORBIDDEN = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g;

const ENTITY: Readonly<Record<string, string>> = {
  "&": "&amp;",
  "<": "&lt;",
  ">": "&gt;",
  '"': "&quot;",
  "'": "&#39;",
  // Next line and line separator: some XML parsers (XML 1.1 rules) turn them into a line feed
  // when they stand as themselves; as character references they come through unchanged.
  "\u0085": "&#133;",
  "\u2028": "&#8232;",
};

/**
 * Escape text for use as XML character data or a quoted attribute value. Characters that XML
 * cannot carry at all are dropped, so the result is always well-formed.
 * @param text - any text, e.g. a member mark read from a cell
 * @returns the text with `& < > " '` (and U+0085, U+2028) replaced by entity or character references
 * @example escapeXml('<img src=x>') === '&lt;img src=x&gt;'
 */
export function escapeXml(text: string): string {
  return text.replace(FORBIDDEN, "").replace(/[&<>"'\u0085\u2028]/g, (c) => ENTITY[c] ?? c);
}

/**
 * Shorten text to at most `maxChars` characters (an ellipsis marks the cut), so a long cell
 * value cannot push a drawing out of its frame. Surrogate pairs are kept whole.
 * @param text - text to shorten
 * @param maxChars - largest number of characters kept, ellipsis included (>= 2)
 */
export function truncate(text: string, maxChars: number): string {
  const chars = Array.from(text.replace(/\s+/g, " ").trim());
  if (chars.length <= maxChars) return chars.join("");
  return chars.slice(0, Math.max(1, maxChars - 1)).join("") + "\u2026";
}
