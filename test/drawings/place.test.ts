import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { overlaps, placeLabels } from "../../src/drawings/place";

describe("placeLabels", () => {
  const request = fc.record({
    anchorX: fc.double({ min: 0, max: 320, noNaN: true }),
    width: fc.double({ min: 4, max: 120, noNaN: true }),
    height: fc.double({ min: 6, max: 36, noNaN: true }),
    leader: fc.boolean(),
  });

  it("never lets two labels overlap, keeps them inside the bounds and on their side of the baseline (property)", () => {
    fc.assert(
      fc.property(fc.array(request, { maxLength: 25 }), fc.constantFrom<"up" | "down">("up", "down"), (reqs, direction) => {
        const placed = placeLabels(reqs, { baseY: 100, direction, step: 5, minX: 2, maxX: 318, gap: 2 });
        expect(placed).toHaveLength(reqs.length);
        placed.forEach((p, i) => {
          expect(p.box.x0).toBeGreaterThanOrEqual(2 - 1e-9);
          expect(p.box.x1).toBeLessThanOrEqual(318 + 1e-9);
          if (direction === "up") expect(p.box.y1).toBeLessThanOrEqual(100);
          else expect(p.box.y0).toBeGreaterThanOrEqual(100);
          for (let j = 0; j < i; j++) expect(overlaps(p.box, (placed[j] as typeof p).box)).toBe(false);
        });
      }),
      { numRuns: 300 },
    );
  });

  it("keeps a label at its anchor when there is room, and moves the second of two clashing labels", () => {
    const [a, b] = placeLabels(
      [
        { anchorX: 100, width: 40, height: 10 },
        { anchorX: 105, width: 40, height: 10 },
      ],
      { baseY: 0, direction: "down", step: 5, minX: 0, maxX: 320 },
    );
    expect(a?.box).toEqual({ x0: 80, y0: 0, x1: 120, y1: 10 });
    expect(overlaps(a!.box, b!.box)).toBe(false);
  });
});
