/**
 * The interface is documented inside the repository (issue 10 class H): docs/interface.md
 * exists, every verb's help points to it and every option a verb's help names is described
 * there, and no text of the project points to an interface document outside the repository.
 */
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { main, VERBS, type CliIO } from "../../src/cli/main";

const ROOT = resolve(__dirname, "../..");
const doc = readFileSync(join(ROOT, "docs", "interface.md"), "utf8");

async function help(...argv: string[]): Promise<string> {
  const out: string[] = [];
  const io: CliIO = { out: (l) => void out.push(l), err: (l) => void out.push(l) };
  await main(argv, io);
  return out.join("\n");
}

function filesUnder(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? filesUnder(path) : [path];
  });
}

describe("docs/interface.md", () => {
  it("describes every verb, and every option each verb's help names", async () => {
    expect(await help("--help")).toMatch(/docs\/interface\.md/);
    for (const verb of Object.keys(VERBS).filter((v) => v !== "demo")) {
      const usage = await help(verb, "--help");
      expect(usage, verb).toMatch(/docs\/interface\.md/);
      expect(doc, verb).toContain(`\`${verb} <in.xlsx>\``);
      for (const option of new Set(usage.match(/--[a-z][a-z-]*/g) ?? [])) expect(doc, `${verb} ${option}`).toContain(option);
    }
  });

  it("names every JSON field of the takedown results and every exit status", () => {
    for (const field of ["units", "members", "type", "level", "reactions", "shearMax", "momentMax", "tributaryArea", "llrFactor", "columns", "cumulative", "floors", "kllAt", "reducedLive", "combos", "foundations", "perLength", "length", "loads", "balance", "applied", "supports", "problems"]) {
      expect(doc, field).toMatch(new RegExp("`[^`]*\\b" + field + "\\b[^`]*`"));
    }
    expect(doc).toMatch(/`0` done without problems; `1` problems found/);
    expect(doc).toMatch(/`2` usage or file errors/);
  });

  it("nothing in the project points to an interface document outside the repository", () => {
    const texts = [join(ROOT, "README.md"), join(ROOT, "DEVELOPERS.md"), ...filesUnder(join(ROOT, "src"))];
    for (const path of texts) expect(readFileSync(path, "utf8"), path).not.toMatch(/design\.md|design notes/i);
  });
});
