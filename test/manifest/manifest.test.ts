/**
 * Structural check of manifest.xml, run offline (the online validator of office-addin-manifest
 * cannot be reached from CI; `npm run validate` remains for users). Element orders below follow
 * the Office add-in manifest XML schema (TaskPaneAppVersionOverrides 1.0 / OfficeApp 1.1),
 * recalled from memory of the published schema; the checks only need the relative order.
 */
import { readFileSync, existsSync } from "node:fs";
import { join } from "node:path";
import { DOMParser } from "@xmldom/xmldom";
import { describe, expect, it } from "vitest";

const ROOT = join(__dirname, "..", "..");
const xml = readFileSync(join(ROOT, "manifest.xml"), "utf8");
const doc = new DOMParser().parseFromString(xml, "text/xml");

type El = Element;
function children(el: El): El[] {
  const out: El[] = [];
  for (let n = el.firstChild; n; n = n.nextSibling) if (n.nodeType === 1) out.push(n as El);
  return out;
}
/** Descendants named `local` ("*" for every element). */
function all(el: El | Document, local: string): El[] {
  const out: El[] = [];
  const walk = (e: El): void => {
    for (const c of children(e)) {
      if (local === "*" || c.localName === local) out.push(c);
      walk(c);
    }
  };
  walk("documentElement" in el ? el.documentElement! : el);
  return out;
}
function one(el: El | Document, local: string): El {
  const found = all(el, local);
  expect(found.length, `exactly one <${local}>`).toBe(1);
  return found[0]!;
}
/** The child names of `el` appear in the order of `schemaOrder` (names not listed are errors). */
function expectSchemaOrder(el: El, schemaOrder: string[]): void {
  const names = children(el).map((c) => c.localName!);
  for (const n of names) expect(schemaOrder, `<${n}> is allowed under <${el.localName}>`).toContain(n);
  const idx = names.map((n) => schemaOrder.indexOf(n));
  for (let i = 1; i < idx.length; i++) expect(idx[i]! >= idx[i - 1]!, `<${names[i]}> after <${names[i - 1]}> under <${el.localName}>`).toBe(true);
}

describe("manifest.xml", () => {
  it("is well-formed XML with an OfficeApp task pane root", () => {
    expect(doc.documentElement!.localName).toBe("OfficeApp");
    expect(doc.documentElement!.getAttribute("xsi:type")).toBe("TaskPaneApp");
    expect(all(doc, "parsererror")).toHaveLength(0);
  });

  it("keeps the top-level elements in schema order", () => {
    expectSchemaOrder(doc.documentElement!, [
      "Id", "AlternateId", "Version", "ProviderName", "DefaultLocale", "DisplayName", "Description", "IconUrl",
      "HighResolutionIconUrl", "SupportUrl", "AppDomains", "Hosts", "Requirements", "DefaultSettings", "Permissions",
      "AllowSnapshot", "VersionOverrides", "ExtendedOverrides",
    ]);
    for (const required of ["Id", "Version", "ProviderName", "DefaultLocale", "DisplayName", "Description", "DefaultSettings", "Permissions"]) {
      expect(children(doc.documentElement!).some((c) => c.localName === required), required).toBe(true);
    }
  });

  it("has a GUID id, a four-part version and asks only for ReadWriteDocument", () => {
    expect(one(doc, "Id").textContent).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/);
    expect(children(doc.documentElement!).find((c) => c.localName === "Version")!.textContent).toMatch(/^\d+\.\d+\.\d+\.\d+$/);
    expect(one(doc, "Permissions").textContent).toBe("ReadWriteDocument");
  });

  it("declares a shared runtime used by the pane, the functions and the function file", () => {
    const sets = all(doc, "Set").map((s) => `${s.getAttribute("Name")}@${s.getAttribute("MinVersion")}`);
    expect(sets).toContain("SharedRuntime@1.1");
    const runtime = one(doc, "Runtime");
    expect(runtime.getAttribute("lifetime")).toBe("long");
    const rid = runtime.getAttribute("resid");
    const page = one(one(doc, "Page"), "SourceLocation").getAttribute("resid");
    const functionFile = one(doc, "FunctionFile").getAttribute("resid");
    const paneAction = all(doc, "Action").find((a) => a.getAttribute("xsi:type") === "ShowTaskpane")!;
    expect(paneAction, "a ribbon button opens the pane").toBeTruthy();
    const paneSource = one(paneAction, "SourceLocation").getAttribute("resid");
    expect([page, functionFile, paneSource]).toEqual([rid, rid, rid]);
  });

  it("keeps the host and form-factor elements in schema order", () => {
    const host = all(doc, "Host").find((h) => h.getAttribute("xsi:type") === "Workbook")!;
    expectSchemaOrder(host, ["Runtimes", "AllFormFactors", "DesktopFormFactor"]);
    expectSchemaOrder(one(doc, "DesktopFormFactor"), ["GetStarted", "FunctionFile", "ExtensionPoint"]);
    const cf = all(doc, "ExtensionPoint").find((e) => e.getAttribute("xsi:type") === "CustomFunctions")!;
    expectSchemaOrder(cf, ["Script", "Page", "Metadata", "Namespace"]);
    expectSchemaOrder(one(doc, "Resources"), ["Images", "Urls", "ShortStrings", "LongStrings"]);
    const vo = children(doc.documentElement!).find((c) => c.localName === "VersionOverrides")!;
    expectSchemaOrder(vo, ["Description", "Requirements", "Hosts", "Resources", "EquivalentAddins", "VersionOverrides"]);
  });

  it("uses the LOADPATH namespace", () => {
    const ns = one(doc, "Namespace").getAttribute("resid")!;
    const str = all(doc, "String").find((s) => s.getAttribute("id") === ns)!;
    expect(str.getAttribute("DefaultValue")).toBe("LOADPATH");
  });

  it("has unique ids and every resid defined in the right resource list", () => {
    expect(all(doc, "*").length).toBeGreaterThan(40);
    const withId: string[] = [];
    const walk = (e: El): void => {
      for (const c of children(e)) {
        const id = c.getAttribute("id");
        if (id) withId.push(id);
        walk(c);
      }
    };
    walk(doc.documentElement!);
    expect(new Set(withId).size, `duplicate ids in ${withId.join(", ")}`).toBe(withId.length);

    const defined = (list: string) => new Set(all(one(doc, list), "*").map((e) => e.getAttribute("id")));
    const images = defined("Images"), urls = defined("Urls"), shorts = defined("ShortStrings"), longs = defined("LongStrings");
    const refs: [El, string][] = [];
    const walk2 = (e: El): void => {
      for (const c of children(e)) {
        const r = c.getAttribute("resid");
        if (r) refs.push([c, r]);
        walk2(c);
      }
    };
    walk2(doc.documentElement!);
    expect(refs.length).toBeGreaterThan(10);
    for (const [el, r] of refs) {
      const kind = el.localName;
      const pool = kind === "Image" ? images : kind === "Description" && el.parentNode && (el.parentNode as El).localName !== "Supertip" ? longs
        : kind === "Description" ? longs : kind === "Label" || kind === "Title" || kind === "Namespace" ? shorts
        : urls;
      expect(pool.has(r), `resid ${r} of <${kind}> is defined`).toBe(true);
    }
  });

  it("points every URL at a file the build serves", () => {
    const urlValues = [
      ...all(doc, "*").map((e) => e.getAttribute("DefaultValue")).filter((v): v is string => !!v && v.startsWith("https://")),
      ...["SourceLocation", "IconUrl", "HighResolutionIconUrl", "SupportUrl"].flatMap((n) => all(doc, n).map((e) => e.getAttribute("DefaultValue")).filter((v): v is string => !!v)),
    ];
    expect(urlValues.length).toBeGreaterThan(8);
    const dist = join(ROOT, "dist");
    for (const url of new Set(urlValues)) {
      const u = new URL(url);
      expect(u.origin, url).toBe("https://localhost:3000");
      expect(existsSync(join(dist, u.pathname)), `${url} is built into dist${u.pathname} (run npm run build)`).toBe(true);
    }
  });

  it("ships PNG icons of the declared sizes", () => {
    for (const img of all(one(doc, "Images"), "Image")) {
      const size = Number(/(\d+)x\d+/.exec(img.getAttribute("id")!)![1]);
      const file = join(ROOT, "assets", new URL(img.getAttribute("DefaultValue")!).pathname.split("/").pop()!);
      const png = readFileSync(file);
      expect(png.subarray(1, 4).toString("ascii")).toBe("PNG");
      expect(png.readUInt32BE(16)).toBe(size);
      expect(png.readUInt32BE(20)).toBe(size);
    }
  });
});
