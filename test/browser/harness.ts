/**
 * Browser harness for the pane's tests and benchmark: a static file server for dist/ on the
 * loopback address and Debian's Chromium (/usr/bin/chromium) driven by playwright-core. No browser
 * is downloaded and the page reaches nothing but this server.
 */
import { createServer, type Server } from "node:http";
import { existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { extname, join, normalize, resolve } from "node:path";
import { chromium, type BrowserContext } from "playwright-core";

/** The system Chromium (Debian package `chromium`). */
export const CHROMIUM = "/usr/bin/chromium";

/** Built files served to the browser. */
export const DIST = resolve(__dirname, "..", "..", "dist");

const TYPES: Readonly<Record<string, string>> = {
  ".html": "text/html; charset=utf-8",
  ".js": "text/javascript; charset=utf-8",
  ".json": "application/json",
  ".map": "application/json",
  ".png": "image/png",
  ".svg": "image/svg+xml",
  ".xml": "application/xml",
  ".xlsx": "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet",
};

/** A static server for `root` on 127.0.0.1 and a random port. */
export async function serve(root: string = DIST): Promise<{ url: string; close: () => Promise<void> }> {
  const server: Server = createServer((req, res) => {
    const path = decodeURIComponent(new URL(req.url ?? "/", "http://x").pathname);
    const file = normalize(join(root, path));
    if (!file.startsWith(root) || !existsSync(file)) {
      res.writeHead(404).end("not found");
      return;
    }
    res.writeHead(200, { "content-type": TYPES[extname(file)] ?? "application/octet-stream", "cache-control": "no-store" });
    res.end(readFileSync(file));
  });
  await new Promise<void>((ok) => server.listen(0, "127.0.0.1", ok));
  const address = server.address();
  const port = typeof address === "object" && address ? address.port : 0;
  return { url: `http://127.0.0.1:${port}/`, close: () => new Promise<void>((ok) => server.close(() => ok())) };
}

/** Chromium with a fresh profile; `close` ends it and removes the profile. */
export async function launch(width = 320, height = 900): Promise<{ context: BrowserContext; close: () => Promise<void> }> {
  const profile = mkdtempSync(join(tmpdir(), "loadpath-chromium-"));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    viewport: { width, height },
    args: ["--headless", "--no-sandbox", "--disable-gpu", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"],
  });
  return {
    context,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** Why the browser tests cannot run here, or null when they can. */
export function missingPrerequisite(): string | null {
  if (!existsSync(CHROMIUM)) return `${CHROMIUM} is missing (apt-get install chromium).`;
  if (!existsSync(join(DIST, "pane-demo.html"))) return `${join(DIST, "pane-demo.html")} is missing: run "npm run build" first.`;
  return null;
}
