/**
 * Text from cells is drawn as text: markup in a mark never becomes an element or an attribute,
 * and no drawing contains scripts, event handlers or references to anything outside itself.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { escapeXml, truncate } from "../../src/drawings/escape";
import { renderLoadPath } from "../../src/drawings/load-path";
import { renderMemberSheet } from "../../src/drawings/sheet";
import { GIRDER_PATH, HOSTILE_DRAWING, HOSTILE_MARK, REVIEW_SHEETS } from "./fixtures";
import { allElements, byRole, parseSvg, type SvgElement, texts } from "./svg-query";

/** The only elements a drawing may contain. */
const ALLOWED = new Set(["svg", "title", "rect", "g", "line", "polygon", "polyline", "path", "text", "circle"]);

/** XML 1.0 cannot carry these; escapeXml drops them. */
const XML_FORBIDDEN = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g;

function assertInert(markup: string): SvgElement {
  const root = parseSvg(markup);
  for (const e of allElements(root)) {
    expect(ALLOWED.has(e.tagName), `element <${e.tagName}>`).toBe(true);
    for (const a of Array.from(e.attributes)) {
      expect(a.name.toLowerCase().startsWith("on"), `attribute ${a.name}`).toBe(false);
      expect(a.name.toLowerCase()).not.toContain("href");
      expect(a.value).not.toMatch(/url\(|javascript:/i);
    }
  }
  expect(markup).not.toMatch(/<(script|foreignObject|image|use|a|style|iframe|img|b)\b/i);
  expect(markup).not.toMatch(/<!ENTITY|<!DOCTYPE|<\?xml-stylesheet/i);
  return root;
}

describe("escapeXml", () => {
  it("replaces the five XML specials", () => {
    expect(escapeXml(`<a href="x">Tom & 'Jerry'</a>`)).toBe("&lt;a href=&quot;x&quot;&gt;Tom &amp; &#39;Jerry&#39;&lt;/a&gt;");
  });

  it("round-trips any text through a strict XML parser, as text and as an attribute (property)", () => {
    fc.assert(
      fc.property(fc.string({ unit: "binary", maxLength: 60 }), (s) => {
        const root = parseSvg(`<svg xmlns="http://www.w3.org/2000/svg"><text data-v="${escapeXml(s)}">${escapeXml(s)}</text></svg>`);
        const t = root.getElementsByTagName("text")[0] as SvgElement;
        const expected = s.replace(XML_FORBIDDEN, "");
        // XML parsers normalise line ends (CR LF and CR to LF) in text; attributes turn them into spaces.
        expect(t.textContent).toBe(expected.replace(/\r\n?/g, "\n"));
        expect(t.getAttribute("data-v")).toBe(expected.replace(/\r\n|[\r\n\t]/g, " "));
      }),
      { numRuns: 300 },
    );
  });
});

describe("truncate", () => {
  it("keeps short text, cuts long text with an ellipsis and never splits a surrogate pair", () => {
    expect(truncate("B-12", 8)).toBe("B-12");
    expect(truncate("Corridor east wing", 8)).toBe("Corrido\u2026");
    expect(truncate("\u{1F3D7}\u{1F3D7}\u{1F3D7}", 2)).toBe("\u{1F3D7}\u2026");
  });
});

describe("hostile marks in drawings", () => {
  it("member sheet: draws the markup of a mark as text and contains nothing active", () => {
    const svg = renderMemberSheet(HOSTILE_DRAWING);
    const root = assertInert(svg);
    expect(texts(root)).toContain(HOSTILE_MARK);
    expect(byRole(root, "support-label")[0]?.textContent).toBe(truncate(HOSTILE_MARK, 24));
    expect(byRole(root, "point-label").map((e) => e.textContent)).toEqual(["<b>B-7</b>: 8 kip", "B-9 & 'friends': 5 kip"]);
    expect(texts(root).join(" ")).toContain('Case D" onload="alert(1)');
    expect(svg).toContain("&lt;img src=x onerror=alert(1)&gt;");
    // The bell character (U+0007) of the second support label is dropped, the rest kept.
    expect(svg).not.toContain("\u0007");
  });

  it("load path: the same for marks, types and notes", () => {
    const hostile = {
      ...GIRDER_PATH,
      mark: HOSTILE_MARK,
      memberType: "<svg onload=alert(1)>",
      upstream: [{ mark: HOSTILE_MARK, memberType: "beam", value: 3, note: "<script>x</script>", children: [] }],
    };
    const root = assertInert(renderLoadPath(hostile));
    expect(root.getElementsByTagName("title")[0]?.textContent).toBe(`Load path of ${HOSTILE_MARK}`);
    const marks = byRole(root, "path-mark").map((e) => e.textContent ?? "");
    expect(marks.length).toBeGreaterThanOrEqual(2);
    for (const m of marks.slice(0, 2)) expect(m.startsWith("<img src=x")).toBe(true);
    expect(texts(root).join(" ")).toContain("<script>x</script>");
  });

  it("every review drawing is inert and well-formed", () => {
    for (const d of Object.values(REVIEW_SHEETS)) assertInert(renderMemberSheet(d));
    assertInert(renderLoadPath(GIRDER_PATH));
  });
});
