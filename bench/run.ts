/**
 * `npm run bench`: runs every bench/*.bench.ts in turn. Each exports `run(): Promise<void>` and
 * prints its own figures (operations per second, milliseconds, megabytes) with the target beside
 * them. Benchmarks measure; they never fail the test suite.
 */
import { readdirSync } from "node:fs";
import { join } from "node:path";
import { pathToFileURL } from "node:url";

async function main(): Promise<void> {
  const only = process.argv[2];
  const files = readdirSync(__dirname)
    .filter((f) => f.endsWith(".bench.ts"))
    .filter((f) => !only || f.includes(only))
    .sort();
  console.log(`Loadpath benchmarks on ${process.platform} ${process.arch}, Node ${process.version}`);
  for (const f of files) {
    console.log(`\n== ${f}`);
    const mod = (await import(pathToFileURL(join(__dirname, f)).href)) as { run?: () => Promise<void> };
    if (typeof mod.run === "function") await mod.run();
    else console.log("   (no run() exported)");
  }
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
