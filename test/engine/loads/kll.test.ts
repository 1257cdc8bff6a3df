import { describe, expect, it } from "vitest";
import { KLL_TABLE, kllOf } from "../../../src/engine/loads";

// ASCE/SEI 7-22 Table 4.7-2, live load element factor KLL (values recalled from memory; verify).
describe("KLL (ASCE/SEI 7-22 Table 4.7-2, recalled from memory)", () => {
  it.each([
    ["interior column", 4],
    ["exterior column without cantilever slabs", 4],
    ["edge column with cantilever slabs", 3],
    ["corner column with cantilever slabs", 2],
    ["edge beam without cantilever slabs", 2],
    ["interior beam", 2],
    ["all other members", 1],
    ["edge beam with cantilever slabs", 1],
    ["cantilever beam", 1],
    ["one-way slab", 1],
    ["two-way slab", 1],
    ["members without provisions for continuous shear transfer normal to their span", 1],
  ])("%s -> %d", (key, expected) => {
    expect(kllOf(key)).toEqual({ ok: true, value: expected });
  });

  it("matching ignores case, extra spaces, hyphens/underscores and plurals", () => {
    expect(kllOf("  Interior   COLUMNS ")).toEqual({ ok: true, value: 4 });
    expect(kllOf("one way slabs")).toEqual({ ok: true, value: 1 });
    expect(kllOf("Two_Way-Slab")).toEqual({ ok: true, value: 1 });
    expect(kllOf("Edge-Column with Cantilever Slab")).toEqual({ ok: true, value: 3 });
  });

  it("unknown or ambiguous keys are errors listing the valid keys", () => {
    for (const bad of ["exterior column", "edge beam", "girder"]) {
      const r = kllOf(bad);
      expect(r.ok).toBe(false);
      if (!r.ok) {
        expect(r.error).toMatchObject({ code: "unknownKey", argument: "element" });
        for (const e of KLL_TABLE) expect(r.error.message).toContain(e.key);
      }
    }
  });

  it("blank is a missing-argument error", () => {
    const r = kllOf("  ");
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error).toMatchObject({ code: "missing", argument: "element" });
  });
});
