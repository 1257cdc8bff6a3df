/**
 * An invented three-storey building for the hand-off tests, as sheets of plain values (marks,
 * spans and loads are made up). It exercises every load the takedown carries: zone loads over
 * trib widths (reducible and not), extra line loads, partial area and line loads and point loads
 * from the Loads table, beams on girders at given positions, a beam with a balcony overhang,
 * columns stacked onto footings, and a wall. Flexural members give their overhangs as 0 when
 * they have none (a blank overhang cell beside a present column is read as an overhang, see the
 * takedown engine).
 */
import type { RawCellContent } from "hyperformula";

/**
 * The building's sheets (US units: ft, psf, plf, lb).
 * @param overhangs - keep the overhang columns (the balcony beam B2-4 cantilevers 6 ft past the
 *   wall); without them B2-4 is a plain 21 ft beam with its edge load at the wall
 */
export function handoffBuilding(overhangs = true): Record<string, RawCellContent[][]> {
  const zones: RawCellContent[][] = [
    ["Zone", "D (psf)", "L (psf)", "Lr (psf)", "S (psf)", "Reducible"],
    ["ROOF", 24, null, 20, 28, "no"],
    ["OFFICE", 68, 50, null, null, "yes"],
    ["FILE", 75, 125, null, null, "no"],
  ];
  const members: RawCellContent[][] = [
    ["Mark", "Type", "Level", "Span (ft)", "Zone", "Trib (ft)", "Start support", "Start at (ft)", "End support", "End at (ft)", "KLL", "wD (plf)", "wL (plf)", "Start overhang (ft)", "End overhang (ft)"],
    // roof
    ["RB-1", "beam", "Roof", 27, "ROOF", 6.5, "RG-A", 6.5, "RG-B", 6.5, null, 18, null, 0, 0],
    ["RB-2", "beam", "Roof", 27, "ROOF", 6.5, "RG-A", 13, "RG-B", 13, null, 18, null, 0, 0],
    ["RB-3", "beam", "Roof", 27, "ROOF", 6.5, "RG-A", 19.5, "RG-B", 19.5, null, 18, null, 0, 0],
    ["RG-A", "girder", "Roof", 26, "ROOF", 1.5, "C-1R", null, "C-2R", null, null, 45, null, 0, 0],
    ["RG-B", "girder", "Roof", 26, "ROOF", 1.5, "C-3R", null, "C-4R", null, null, 45, null, 0, 0],
    ["C-1R", "column", "Roof", 12, null, null, "C-1-2", null, null, null, null, 40, null, null, null],
    ["C-2R", "column", "Roof", 12, null, null, "C-2-2", null, null, null, null, 40, null, null, null],
    ["C-3R", "column", "Roof", 12, null, null, "C-3-2", null, null, null, null, 40, null, null, null],
    ["C-4R", "column", "Roof", 12, null, null, "C-4-2", null, null, null, null, 40, null, null, null],
    // level 2: office, a file room strip, a balcony beam
    ["B2-1", "beam", "L2", 27, "OFFICE", 6.5, "G2-A", 6.5, "G2-B", 6.5, null, 22, null, 0, 0],
    ["B2-2", "beam", "L2", 27, "OFFICE", 6.5, "G2-A", 13, "G2-B", 13, null, 22, null, 0, 0],
    ["B2-3", "beam", "L2", 27, "FILE", 6.5, "G2-A", 19.5, "G2-B", 19.5, null, 22, 15, 0, 0],
    ["B2-4", "beam", "L2", 21, "OFFICE", 5, "G2-B", 4, "W-1", null, null, 22, null, 0, 6],
    ["G2-A", "girder", "L2", 26, "OFFICE", 1.5, "C-1-2", null, "C-2-2", null, null, 68, null, 0, 0],
    ["G2-B", "girder", "L2", 26, "OFFICE", 1.5, "C-3-2", null, "C-4-2", null, 3, 68, null, 0, 0],
    ["C-1-2", "column", "L2", 13, null, null, "C-1-1", null, null, null, null, 48, null, null, null],
    ["C-2-2", "column", "L2", 13, null, null, "C-2-1", null, null, null, null, 48, null, null, null],
    ["C-3-2", "column", "L2", 13, null, null, "C-3-1", null, null, null, null, 48, null, null, null],
    ["C-4-2", "column", "L2", 13, null, null, "C-4-1", null, null, null, null, 48, null, null, null],
    // level 1 (ground floor columns onto footings)
    ["C-1-1", "column", "L1", 14, null, null, "F-1", null, null, null, null, 48, null, null, null],
    ["C-2-1", "column", "L1", 14, null, null, "F-2", null, null, null, null, 48, null, null, null],
    ["C-3-1", "column", "L1", 14, null, null, "F-3", null, null, null, null, 48, null, null, null],
    ["C-4-1", "column", "L1", 14, null, null, "F-4", null, null, null, null, 48, null, null, null],
    ["F-1", "foundation", null, null, null, null, null, null, null, null, null, null, null, null, null],
    ["F-2", "foundation", null, null, null, null, null, null, null, null, null, null, null, null, null],
    ["F-3", "foundation", null, null, null, null, null, null, null, null, null, null, null, null, null],
    ["F-4", "foundation", null, null, null, null, null, null, null, null, null, null, null, null, null],
    ["W-1", "wall", null, null, null, null, null, null, null, null, null, null, null, null, null],
  ];
  const loads: RawCellContent[][] = [
    ["Mark", "Kind", "Zone or case", "Magnitude", "Width", "From (ft)", "To (ft)"],
    ["B2-2", "area", "FILE", null, 3.25, 4, 15.5],
    ["B2-1", "line", "D", 350, null, 9, 18],
    ["B2-1", "point", "L", 2400, null, 20.5, null],
    ["RB-2", "point", "S", 900, null, 8, null],
    ["G2-A", "point", "D", 5200, null, 16, null],
    ["B2-4", "point", "D", 1100, null, 27, null],
    ["C-2-2", "point", "D", 3000, null, null, null],
  ];
  if (!overhangs) {
    members.forEach((row) => row.splice(13, 2));
    loads.forEach((row) => row[0] === "B2-4" && (row[5] = 21));
  }
  return { Zones: zones, Members: members, Loads: loads };
}
