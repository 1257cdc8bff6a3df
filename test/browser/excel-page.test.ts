/**
 * The page Excel loads (dist/taskpane.html) in Chromium outside Excel, with office.js answered
 * from the local @microsoft/office-js package (no network): it starts without script errors and
 * says it is not connected. Also what the Excel bundle must not carry: HyperFormula, eval.
 */
import { existsSync, readFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { gzipSync } from "node:zlib";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DIST, CHROMIUM, launch, serve } from "./harness";

const OFFICE_DIR = resolve(__dirname, "..", "..", "node_modules", "@microsoft", "office-js", "dist");
const OFFICE_JS = join(OFFICE_DIR, "office.js");
const ready = existsSync(join(DIST, "taskpane.html")) && existsSync(join(DIST, "taskpane.js")) && existsSync(CHROMIUM) && existsSync(OFFICE_JS);
if (!ready && process.env.CI) throw new Error("dist/taskpane.html, Chromium or the office-js package is missing.");

let server: Awaited<ReturnType<typeof serve>>;
let browser: Awaited<ReturnType<typeof launch>>;

beforeAll(async () => {
  if (!ready) return;
  server = await serve();
  browser = await launch(320, 700);
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

describe.skipIf(!ready)("the Excel page outside Excel", () => {
  it("keeps HyperFormula and eval out of the bundle Excel loads, and office.js from the CDN in the shipped page", () => {
    const bundle = readFileSync(join(DIST, "taskpane.js"), "utf8");
    expect(bundle).not.toMatch(/hyperformula|gpl-v3/i);
    // Size of what Excel downloads (the pane with its diagrams): well under 500 kB gzipped.
    const gzipped = gzipSync(readFileSync(join(DIST, "taskpane.js"))).length;
    console.log(`dist/taskpane.js: ${bundle.length} bytes, ${gzipped} bytes gzipped`);
    expect(gzipped).toBeLessThan(500_000);
    const html = readFileSync(join(DIST, "taskpane.html"), "utf8");
    expect(html).toContain("https://appsforoffice.microsoft.com/lib/1/hosted/office.js");
    expect(html).toMatch(/Content-Security-Policy/);
    expect(html).not.toMatch(/unsafe-eval/);
  });

  it("loads with office.js from the local package and says it is not connected to Excel", async () => {
    const page = await browser.context.newPage();
    const errors: string[] = [];
    const outside: string[] = [];
    page.on("pageerror", (e) => errors.push(String(e)));
    await page.route("**/*", async (route) => {
      const url = route.request().url();
      const hosted = /^https:\/\/appsforoffice\.microsoft\.com\/lib\/1\/hosted\/([\w./-]+\.js)(\?.*)?$/i.exec(url);
      const local = hosted ? join(OFFICE_DIR, hosted[1]!.toLowerCase()) : null;
      if (local && local.startsWith(OFFICE_DIR) && existsSync(local)) {
        await route.fulfill({ status: 200, contentType: "text/javascript", body: readFileSync(local, "utf8") });
      } else if (url.startsWith(server.url)) {
        await route.continue();
      } else {
        outside.push(url); // anything else outside this server is answered empty, never fetched
        await route.fulfill({ status: 404, body: "" });
      }
    });
    await page.goto(`${server.url}taskpane.html`);
    await page.waitForSelector("#root [role=alert]", { timeout: 30_000 });
    expect(await page.textContent("#root")).toMatch(/Not connected to Excel/);
    expect(errors).toEqual([]);
    console.log(`office.js asked for ${outside.length} other outside address(es), all answered locally with 404`);
    await page.close();
  });
});
