/**
 * Spreadsheet number formats: whether a format shows a number as a date or time. Excel keeps a
 * date as a serial day number with a date format; a mark such as "3-1" typed into a General cell
 * becomes such a date, and only the format tells it apart from the number 45352.
 */

/**
 * Whether a number format code shows dates or times: a d, m, y, h or s code outside quoted text,
 * escaped characters and bracketed sections ([Red], [$-409]; elapsed-time codes such as [h] count),
 * in any of its sections. "General", "0.00", "#,##0" and "@" are not dates.
 * @param format - the format code as the host reports it, e.g. "m/d/yyyy" or "0.00"
 */
export function isDateFormat(format: string | null | undefined): boolean {
  if (typeof format !== "string" || format === "") return false;
  let i = 0;
  while (i < format.length) {
    const ch = format[i]!;
    if (ch === '"') {
      const close = format.indexOf('"', i + 1);
      i = close < 0 ? format.length : close + 1;
    } else if (ch === "\\" || ch === "_" || ch === "*") {
      i += 2;
    } else if (ch === "[") {
      const close = format.indexOf("]", i + 1);
      const inner = close < 0 ? "" : format.slice(i + 1, close);
      if (/^(h+|m+|s+)$/i.test(inner)) return true;
      i = close < 0 ? format.length : close + 1;
    } else if (/[dmyhs]/i.test(ch)) {
      // "General" is the one word format without quotes that holds such letters.
      if (/^general/i.test(format.slice(i))) i += "general".length;
      else return true;
    } else {
      i += 1;
    }
  }
  return false;
}
