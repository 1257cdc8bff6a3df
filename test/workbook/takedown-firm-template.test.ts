/**
 * A firm's own takedown template, as it is (issue 15, items 1 and 2): a title block of three rows,
 * a group row ("Start" over G:H, "End" over I:J, as a merged title reads), headers that are not
 * the defaults, two "Supported by (...)" whose parentheses are words, two "Location (ft)" told
 * apart only by their group, and a units row. Mapped once (by header, Group/Header and column
 * letter) and built through the workbook port (what the pane runs) and through `loadpath
 * takedown`; both are checked against hand statics and against each other. An ambiguous
 * reference is a problem naming both cells, never a guess.
 * Needs `npm run build` (the headless engine loads the built functions bundle).
 */
import { existsSync, mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { cli, writeSheets } from "../report/helpers";
import { buildOn, type Built } from "./takedown-helpers";
import type { TakedownJson } from "../../src/workbook/takedown-api";
import { parseHeaderRows, parseMappings } from "../../src/cli/takedown-input";
import { checkByHand, MAP_ARGS, MAPPING, SHEETS } from "./firm-template";

describe("a firm's template with a title block, group row, units row and word parentheses", () => {
  let port: Built;
  let dir: string;
  let input: string;
  beforeAll(async () => {
    port = await buildOn(SHEETS, { mapping: { members: MAPPING } });
    dir = mkdtempSync(join(tmpdir(), "loadpath-firm-"));
    input = join(dir, "firm.xlsx");
    await writeSheets(input, SHEETS);
  });

  it("builds through the workbook port with its matching given once, by hand statics", () => {
    expect(port.result.problems).toEqual([]);
    expect(port.result.ok).toBe(true);
    checkByHand(port.result.json!);
  });

  it("builds through `loadpath takedown` with the same --map given once: same results as the port, by hand", async () => {
    const json = join(dir, "firm.json");
    const r = await cli("takedown", input, "-o", join(dir, "out.xlsx"), "--json", json, ...MAP_ARGS);
    expect(r.err).toEqual([]);
    expect(r.status).toBe(0);
    const got = JSON.parse(readFileSync(json, "utf8")) as TakedownJson;
    checkByHand(got);
    for (const mark of ["B1", "G1", "G2"]) expect(got.members[mark]!.reactions).toEqual(port.result.json!.members[mark]!.reactions);
    expect(got.columns).toEqual(JSON.parse(JSON.stringify(port.result.json!.columns)));
  });

  it("a given --header-row gives the same build; a wrong one is a problem and nothing is written", async () => {
    const json = join(dir, "given.json");
    const r = await cli("takedown", input, "--json", json, "--header-row", "members=5", "--header-row", "zones=2", ...MAP_ARGS);
    expect(r.status).toBe(0);
    checkByHand(JSON.parse(readFileSync(json, "utf8")) as TakedownJson);
    const out = join(dir, "wrong.xlsx");
    const wrong = await cli("takedown", input, "-o", out, "--header-row", "members=4", ...MAP_ARGS);
    expect(wrong.status).toBe(1);
    expect(wrong.err.join("\n")).toMatch(/Members!A4: The Members table has no column "Beam Mark"/);
    expect(existsSync(out)).toBe(false);
    expect((await cli("takedown", input, "--header-row", "members=0")).status).toBe(2);
  });

  it("`Location` for End at fits two columns: a problem naming both cells and how to choose, nothing built", async () => {
    const out = join(dir, "ambiguous.xlsx");
    const r = await cli("takedown", input, "-o", out, ...MAP_ARGS, "--map", "members.End at=Location");
    expect(r.status).toBe(1);
    const text = r.err.join("\n");
    expect(text).toMatch(/Members!H5: The Members table's End at could be H5 "Location \(ft\)" and J5 "Location \(ft\)"; none is taken/);
    expect(text).toContain("--map members.End at=H or --map members.End at=J");
    expect(existsSync(out)).toBe(false);
  });

  it("End at named as End/Location (the README's example) reads the same column as the letter J", async () => {
    const built = await buildOn(SHEETS, { mapping: { members: { ...MAPPING, "End at": "End/Location" } } });
    expect(built.result.problems).toEqual([]);
    checkByHand(built.result.json!);
  });

  it("without the word parentheses told apart, start and end are never merged: `Supported by` is missing, not guessed", async () => {
    const built = await buildOn(SHEETS, { mapping: { members: { ...MAPPING, "End support": "Supported by" } } });
    expect(built.result.ok).toBe(false);
    expect(built.result.problems.map((p) => [p.code, `${p.sheet}!${p.cell}`])).toEqual([["missingColumn", "Members!A5"]]);
  });

  it("--header-row: a bare row is every table's, a table's own entry wins; --map keeps the reference as typed", async () => {
    expect(parseHeaderRows(["5", "zones=2"])).toEqual({ headerRows: { zones: 2, members: 5, loads: 5, bearings: 5 } });
    expect(parseHeaderRows(["Members=7"])).toEqual({ headerRows: { members: 7 } });
    for (const bad of ["0", "-3", "five", "beams=4", "2.5"]) expect(parseHeaderRows([bad])).toHaveProperty("error");
    expect(parseMappings(["members.End at=End/Location", 'members.Start support="Supported by (start)"', "members.End at=J"])).toEqual({
      mapping: { zones: {}, members: { "End at": "J", "Start support": "Supported by (start)" }, loads: {}, bearings: {} },
    });
    const both = await cli("takedown", input, "--header-row", "5", "--header-row", "zones=2", ...MAP_ARGS);
    expect(both.status).toBe(0);
  });
});
