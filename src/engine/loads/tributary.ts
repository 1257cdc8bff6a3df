/**
 * Tributary width of a beam and the line load it collects (common practice: each member carries
 * half of the spacing to the next parallel member on each side, plus any cantilevered edge).
 */
import { fail, ok, type Result } from "../errors";
import { finite, nonNegative } from "./checks";

/** One side of a member: the spacing to the next member, or an edge/opening with an overhang. */
interface Side {
  readonly spacing: number | null;
  readonly overhang: number | null;
  readonly spacingName: string;
  readonly overhangName: string;
}

/** Width collected on one side: half the spacing, or the overhang where the spacing is blank or 0. */
function sideWidth(side: Side): Result<number> {
  const spacing = side.spacing ?? 0;
  const overhang = side.overhang ?? 0;
  const s = nonNegative(spacing, side.spacingName);
  if (!s.ok) return s;
  const o = nonNegative(overhang, side.overhangName);
  if (!o.ok) return o;
  if (spacing > 0 && overhang > 0) {
    return fail(
      "invalid",
      `an overhang applies only at a slab edge or opening, where ${side.spacingName} is blank or 0 (${side.spacingName} is ${spacing}).`,
      side.overhangName,
    );
  }
  return ok(spacing > 0 ? spacing / 2 : overhang);
}

/**
 * Tributary width of a member between two parallel neighbours.
 * @param spacingA - distance to the neighbour on side a (length); null or 0 at a slab edge or opening
 * @param spacingB - distance to the neighbour on side b (length); null or 0 at a slab edge or opening
 * @param overhangA - slab beyond the member on side a, used only where spacingA is blank or 0 (length, default 0)
 * @param overhangB - as overhangA, on side b
 * @returns width in the same length unit: spacingA/2 + spacingB/2, an edge side contributing its overhang
 * @example tributaryWidth(10, 8) // 9 ; tributaryWidth(10, null, null, 1.5) // 6.5
 */
export function tributaryWidth(
  spacingA: number | null,
  spacingB: number | null,
  overhangA: number | null = null,
  overhangB: number | null = null,
): Result<number> {
  const a = sideWidth({ spacing: spacingA, overhang: overhangA, spacingName: "spacing_a", overhangName: "overhang_a" });
  if (!a.ok) return a;
  const b = sideWidth({ spacing: spacingB, overhang: overhangB, spacingName: "spacing_b", overhangName: "overhang_b" });
  if (!b.ok) return b;
  return ok(a.value + b.value);
}

/**
 * Line load collected by a member: area load x tributary width + extra line load, in any
 * consistent units (psf x ft = plf; kPa x m = kN/m). Loads may be negative (upward).
 * @param areaLoad - load per unit area (e.g. kip/ft^2 or kN/m^2), positive downward
 * @param tribWidth - tributary width (length), >= 0
 * @param extra - additional line load (force/length), e.g. self weight or cladding, default 0
 * @returns line load (force/length)
 * @example lineLoad(0.08, 7.5) // 0.6 kip/ft from 80 psf entered as 80/1000 ksf
 */
export function lineLoad(areaLoad: number, tribWidth: number, extra: number | null = null): Result<number> {
  const q = finite(areaLoad, "area_load");
  if (!q.ok) return q;
  const w = nonNegative(tribWidth, "trib_width");
  if (!w.ok) return w;
  const e = finite(extra ?? 0, "extra");
  if (!e.ok) return e;
  return ok(areaLoad * tribWidth + e.value);
}
