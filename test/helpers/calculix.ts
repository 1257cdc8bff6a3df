/**
 * Independent finite-element reference for the single-member solver: writes a CalculiX input
 * deck for a {@link BeamModel}, runs `ccx` and reads the nodal results back.
 *
 * Model (see /work/shared/pitfalls.md, "CalculiX as an independent beam reference"):
 * - the member lies along global x, gravity acts along -y; B32R elements (3-node quadratic
 *   beams, expanded internally into 20-node bricks) with a rectangular section, width along z
 *   and depth along y;
 * - engineering-constants material with Poisson's ratios 0, transverse moduli 10·E and shear
 *   moduli 1000·E, so the expanded solid reproduces Euler–Bernoulli bending (no shear
 *   deformation, no anticlastic effects);
 * - a node at every support, load end, point load and applied moment, elements no longer than
 *   about the section depth;
 * - line loads as consistent (work-equivalent) nodal forces, point loads as nodal forces,
 *   applied moments as nodal moments on rotational DOF 6 (about z, counter-clockwise +).
 *
 * Test-only code: it uses Node modules and throws on misuse.
 */
import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { BeamLoad, BeamModel, LineLoad } from "../../src/engine/beam/types";

/** Material and section of the reference model, in one consistent set of units. */
export interface CcxSection {
  /** Young's modulus (force / length²). */
  readonly e: number;
  /** Section width, along global z (length). */
  readonly width: number;
  /** Section depth, along global y, the bending direction (length). */
  readonly depth: number;
}

/** A steel-like default in kN and m: E = 200 GPa, 0.25 m wide, 0.5 m deep. */
export const defaultSection: CcxSection = { e: 2e8, width: 0.25, depth: 0.5 };

/** Second moment of area of the rectangular section about z (length⁴). */
export function inertiaOf(section: CcxSection): number {
  return (section.width * section.depth ** 3) / 12;
}

/** Flexural rigidity E·I of the section (force · length²). */
export function flexuralRigidityOf(section: CcxSection): number {
  return section.e * inertiaOf(section);
}

/** The finite-element mesh: node positions (1-based node n sits at x[n - 1]). */
export interface BeamMesh {
  /** Positions of all nodes, ascending; element k uses nodes 2k+1, 2k+2, 2k+3 (1-based). */
  readonly x: readonly number[];
  /** 1-based node number of each support, in the order of model.supports. */
  readonly supportNodes: readonly number[];
}

/** Results read back from CalculiX, in the solver's sign conventions. */
export interface CcxBeamResult {
  readonly mesh: BeamMesh;
  /** Downward deflection at every node (length), same order as mesh.x. */
  readonly deflection: readonly number[];
  /** Vertical reaction at each support (upward +), loads applied at the support node added back. */
  readonly reactions: readonly number[];
  /**
   * Bending moment (sagging +) at every node from the element section forces in the .frd file
   * (6 significant digits, averaged between the elements meeting at a node: meaningful only
   * where the moment is continuous or at the member ends).
   */
  readonly sectionMoment: readonly number[];
  /** Shear V = dM/dx at every node from the same section forces (same caveats). */
  readonly sectionShear: readonly number[];
  /** The input deck that was run, for diagnostics. */
  readonly deck: string;
}

/** True when the `ccx` executable can be started. */
export function ccxAvailable(): boolean {
  // `ccx -v` exits with a non-zero status even when it works; only a spawn error means absent.
  const probe = spawnSync("ccx", ["-v"], { stdio: "pipe", timeout: 10_000 });
  return probe.error === undefined;
}

/** Positions where the mesh must have a node: ends, supports, load ends, point loads, moments. */
export function keyPositions(model: BeamModel): number[] {
  const xs: number[] = [0, model.span, ...model.supports.map((s) => s.x)];
  for (const load of model.loads) {
    if (load.kind === "line") xs.push(load.start, load.end);
    else xs.push(load.x);
  }
  return uniqueSorted(xs);
}

function uniqueSorted(xs: readonly number[]): number[] {
  const sorted = [...xs].sort((a, b) => a - b);
  return sorted.filter((x, i) => i === 0 || x - sorted[i - 1] > 1e-9);
}

/**
 * Mesh with nodes at every key position and elements no longer than `maxElementLength`
 * (each interval between key positions is split into equal elements).
 */
export function meshBeam(model: BeamModel, maxElementLength: number): BeamMesh {
  const keys = keyPositions(model);
  const x: number[] = [keys[0]];
  for (let i = 1; i < keys.length; i++) {
    const a = keys[i - 1];
    const length = keys[i] - a;
    const count = Math.max(1, Math.ceil(length / maxElementLength - 1e-9));
    for (let k = 1; k <= 2 * count; k++) x.push(k === 2 * count ? keys[i] : a + (length * k) / (2 * count));
  }
  const supportNodes = model.supports.map((s) => nodeAt(x, s.x));
  return { x, supportNodes };
}

/** 1-based number of the end node (odd number) at position xAt; throws if there is none. */
function nodeAt(x: readonly number[], xAt: number): number {
  for (let i = 0; i < x.length; i += 2) if (Math.abs(x[i] - xAt) < 1e-9) return i + 1;
  throw new Error(`no mesh node at x = ${xAt}`);
}

/**
 * Work-equivalent nodal forces of a load varying linearly from wa to wb over a 3-node quadratic
 * element of length le: F_i = ∫ N_i w dx with N1 = (1-s)(1-2s), N2 = 4s(1-s), N3 = s(2s-1),
 * s = x/le. Exact integrals: [le·wa/6, le·(wa+wb)/3, le·wb/6]. Because ΣN_i = 1 and ΣN_i·x_i = x,
 * these forces have exactly the resultant and the first moment of the element's load, so the
 * statics of every element are exact and only the element's bending interpolation is approximate.
 */
export function consistentNodalForces(le: number, wa: number, wb: number): [number, number, number] {
  return [(le * wa) / 6, (le * (wa + wb)) / 3, (le * wb) / 6];
}

/** Intensity of a line load at x (0 outside its extent). */
function intensityAt(load: LineLoad, x: number): number {
  if (x < load.start - 1e-9 || x > load.end + 1e-9) return 0;
  const length = load.end - load.start;
  return length === 0 ? 0 : load.w1 + ((load.w2 - load.w1) * (x - load.start)) / length;
}

/**
 * Downward nodal forces (per node, same order as mesh.x) and nodal moments (CCW +) equivalent to
 * the model's loads.
 */
export function nodalLoads(model: BeamModel, mesh: BeamMesh): { down: number[]; moment: number[] } {
  const down = mesh.x.map(() => 0);
  const moment = mesh.x.map(() => 0);
  for (const load of model.loads) addLoad(load, mesh, down, moment);
  return { down, moment };
}

function addLoad(load: BeamLoad, mesh: BeamMesh, down: number[], moment: number[]): void {
  if (load.kind === "point") {
    down[nodeAt(mesh.x, load.x) - 1] += load.p;
    return;
  }
  if (load.kind === "moment") {
    moment[nodeAt(mesh.x, load.x) - 1] += load.m;
    return;
  }
  for (let i = 0; i + 2 < mesh.x.length; i += 2) {
    const xa = mesh.x[i];
    const xb = mesh.x[i + 2];
    // Key positions guarantee an element is wholly inside or wholly outside the load.
    if (xa < load.start - 1e-9 || xb > load.end + 1e-9) continue;
    const f = consistentNodalForces(xb - xa, intensityAt(load, xa), intensityAt(load, xb));
    down[i] += f[0];
    down[i + 1] += f[1];
    down[i + 2] += f[2];
  }
}

/** A number for the deck: 12 significant digits, never 20 characters or more. */
export function deckNumber(v: number): string {
  if (!Number.isFinite(v)) throw new Error(`non-finite number in deck: ${v}`);
  const text = String(Number(v.toPrecision(12)));
  if (text.length >= 20) throw new Error(`deck number too long: ${text}`);
  return text;
}

/**
 * The input deck. Restraints: DOF 2 (vertical) and 3 (out of plane) at every support; DOF 1
 * (axial) and 4 (torsion) at the first support only; DOF 4, 5 and 6 in addition at fixed
 * supports. No load acts along x or z, so the extra restraints carry nothing.
 */
export function writeDeck(model: BeamModel, section: CcxSection, mesh: BeamMesh): string {
  const { down, moment } = nodalLoads(model, mesh);
  const e = section.e;
  const lines: string[] = ["** beam reference model, generated by test/helpers/calculix.ts", "*NODE, NSET=NALL"];
  mesh.x.forEach((x, i) => lines.push(`${i + 1},${deckNumber(x)},0,0`));
  lines.push("*ELEMENT, TYPE=B32R, ELSET=EBEAM");
  for (let k = 0; 2 * k + 2 < mesh.x.length; k++) lines.push(`${k + 1},${2 * k + 1},${2 * k + 2},${2 * k + 3}`);
  lines.push(
    "*MATERIAL, NAME=EB",
    "*ELASTIC, TYPE=ENGINEERING CONSTANTS",
    // E1, E2, E3, nu12, nu13, nu23, G12, G13 / G23, temperature; 1 = global x = beam axis.
    `${deckNumber(e)},${deckNumber(10 * e)},${deckNumber(10 * e)},0,0,0,${deckNumber(1000 * e)},${deckNumber(1000 * e)}`,
    `${deckNumber(1000 * e)},0`,
    "*BEAM SECTION, ELSET=EBEAM, MATERIAL=EB, SECTION=RECT",
    `${deckNumber(section.width)},${deckNumber(section.depth)}`,
    // Local 1-direction along z (width); local 2 = t x n1 = -y carries the depth.
    "0,0,1",
    "*BOUNDARY",
  );
  lines.push(...restraintLines(model, mesh));
  lines.push("*STEP", "*STATIC", "*CLOAD");
  let loadCount = 0;
  mesh.x.forEach((_, i) => {
    if (down[i] !== 0) lines.push(`${i + 1},2,${deckNumber(-down[i])}`);
    if (moment[i] !== 0) lines.push(`${i + 1},6,${deckNumber(moment[i])}`);
    if (down[i] !== 0 || moment[i] !== 0) loadCount++;
  });
  if (loadCount === 0) throw new Error("model has no load");
  lines.push("*NODE PRINT, NSET=NALL", "U,RF", "*EL FILE, SECTION FORCES, OUTPUT=2D", "S", "*END STEP");
  return lines.join("\n") + "\n";
}

function restraintLines(model: BeamModel, mesh: BeamMesh): string[] {
  if (model.supports.length === 0) throw new Error("model has no support");
  const firstIndex = model.supports.reduce((best, s, i) => (s.x < model.supports[best].x ? i : best), 0);
  const lines: string[] = [];
  model.supports.forEach((support, i) => {
    const node = mesh.supportNodes[i];
    const dofs = new Set<number>([2, 3]);
    if (i === firstIndex) [1, 4].forEach((d) => dofs.add(d));
    if (support.type === "fixed") [4, 5, 6].forEach((d) => dofs.add(d));
    for (const d of [...dofs].sort()) lines.push(`${node},${d},${d}`);
  });
  return lines;
}

/** Runs `ccx -i job` in a fresh temporary directory; returns the .dat and .frd texts. */
export function runCcx(deck: string, timeoutMs = 30_000): { dat: string; frd: string } {
  const dir = mkdtempSync(join(tmpdir(), "loadpath-ccx-"));
  try {
    writeFileSync(join(dir, "job.inp"), deck);
    const log = execFileSync("ccx", ["-i", "job"], {
      cwd: dir,
      timeout: timeoutMs,
      stdio: "pipe",
      env: { ...process.env, OMP_NUM_THREADS: "1", CCX_NPROC_STIFFNESS: "1", CCX_NPROC_EQUATION_SOLVER: "1" },
    }).toString();
    // ccx exits 0 even when it rejects a deck: look for its error messages instead.
    if (/\*ERROR/.test(log)) throw new Error(`ccx rejected the deck:\n${log.slice(-2000)}`);
    return { dat: readFileSync(join(dir, "job.dat"), "utf8"), frd: readFileSync(join(dir, "job.frd"), "utf8") };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Node → [x, y, z] values of one `*NODE PRINT` block of the .dat file, found by its heading. */
export function parseDatBlock(dat: string, heading: "displacements" | "forces"): Map<number, [number, number, number]> {
  const lines = dat.split(/\r?\n/);
  const start = lines.findIndex((l) => l.trim().startsWith(`${heading} (`));
  if (start < 0) throw new Error(`no "${heading}" block in the .dat file`);
  const out = new Map<number, [number, number, number]>();
  for (let i = start + 1; i < lines.length; i++) {
    const line = lines[i].trim();
    if (line === "") {
      if (out.size > 0) break;
      continue;
    }
    const parts = line.split(/\s+/).map(Number);
    if (parts.length !== 4 || parts.some((v) => Number.isNaN(v))) throw new Error(`unreadable .dat line: ${line}`);
    out.set(parts[0], [parts[1], parts[2], parts[3]]);
  }
  return out;
}

/**
 * Node → six section-force components of the STRESS block written with `SECTION FORCES`
 * (fixed columns: " -1", node in 10, then 12 characters per value).
 */
export function parseFrdSectionForces(frd: string): Map<number, number[]> {
  const lines = frd.split(/\r?\n/);
  const start = lines.findIndex((l) => /^ -4 {2}STRESS/.test(l));
  if (start < 0) throw new Error("no STRESS block in the .frd file");
  const out = new Map<number, number[]>();
  for (let i = start + 1; i < lines.length && !lines[i].startsWith(" -3"); i++) {
    const line = lines[i];
    if (!line.startsWith(" -1")) continue;
    const node = Number(line.slice(3, 13));
    const values = [0, 1, 2, 3, 4, 5].map((k) => Number(line.slice(13 + 12 * k, 25 + 12 * k)));
    if (Number.isNaN(node) || values.some((v) => Number.isNaN(v))) throw new Error(`unreadable .frd line: ${line}`);
    out.set(node, values);
  }
  return out;
}

/**
 * Solves the model with CalculiX. Elements are at most `maxElementLength` long (default: the
 * section depth). Reactions add back the nodal loads applied at the support node, which the
 * printed RF leaves out.
 */
export function solveWithCalculix(
  model: BeamModel,
  section: CcxSection = defaultSection,
  maxElementLength: number = section.depth,
): CcxBeamResult {
  const mesh = meshBeam(model, maxElementLength);
  const deck = writeDeck(model, section, mesh);
  const { dat, frd } = runCcx(deck);
  const u = parseDatBlock(dat, "displacements");
  const rf = parseDatBlock(dat, "forces");
  const sf = parseFrdSectionForces(frd);
  const { down } = nodalLoads(model, mesh);
  const get = <T>(map: Map<number, T>, node: number): T => {
    const v = map.get(node);
    if (v === undefined) throw new Error(`node ${node} missing from CalculiX output`);
    return v;
  };
  const deflection = mesh.x.map((_, i) => -get(u, i + 1)[1]);
  // RF_y = reaction + applied y-force at that node (applied y-force = -down).
  const reactions = mesh.supportNodes.map((n) => get(rf, n)[1] + down[n - 1]);
  // Section forces (elements run towards +x): column SYY is the shear dM/dx, SYZ the sagging moment;
  // calibrated against a cantilever (hogging -PL at the fixed end, V = +P).
  const sectionShear = mesh.x.map((_, i) => get(sf, i + 1)[1]);
  const sectionMoment = mesh.x.map((_, i) => get(sf, i + 1)[4]);
  return { mesh, deflection, reactions, sectionMoment, sectionShear, deck };
}

/** Downward resultant and its moment about `about` of the part of a line load left of `cut`. */
function lineLoadLeftOf(load: LineLoad, cut: number, about: number): { force: number; moment: number } {
  const c = Math.min(cut, load.end);
  const length = c - load.start;
  if (length <= 0) return { force: 0, moment: 0 };
  const wc = intensityAt(load, c);
  const force = ((load.w1 + wc) * length) / 2;
  // ∫ w(s)(c - s) ds over [start, c] for linear w = length²·(2·w1 + wc)/6.
  const momentAboutC = (length * length * (2 * load.w1 + wc)) / 6;
  return { force, moment: momentAboutC + force * (about - c) };
}

function isLeftOf(xi: number, x: number, side: "left" | "right"): boolean {
  return side === "right" ? xi <= x + 1e-12 : xi < x - 1e-12;
}

/**
 * Bending moment (sagging +) at x by statics of the free body left of x, from given vertical
 * reactions (up +) and reaction couples (CCW +). Side "right" includes point items at x.
 */
export function momentByStatics(
  model: BeamModel,
  reactions: readonly number[],
  couples: readonly number[],
  x: number,
  side: "left" | "right" = "right",
): number {
  let m = 0;
  model.supports.forEach((s, i) => {
    if (isLeftOf(s.x, x, side)) m += reactions[i] * (x - s.x) - couples[i];
  });
  for (const load of model.loads) {
    if (load.kind === "line") m -= lineLoadLeftOf(load, x, x).moment;
    else if (load.kind === "point") m -= isLeftOf(load.x, x, side) ? load.p * (x - load.x) : 0;
    else m -= isLeftOf(load.x, x, side) ? load.m : 0;
  }
  return m;
}

/** Shear V = dM/dx at x by statics of the free body left of x (side as for the moment). */
export function shearByStatics(
  model: BeamModel,
  reactions: readonly number[],
  x: number,
  side: "left" | "right" = "right",
): number {
  let v = 0;
  model.supports.forEach((s, i) => {
    if (isLeftOf(s.x, x, side)) v += reactions[i];
  });
  for (const load of model.loads) {
    if (load.kind === "line") v -= lineLoadLeftOf(load, x, x).force;
    else if (load.kind === "point" && isLeftOf(load.x, x, side)) v -= load.p;
  }
  return v;
}

/** Sum of the line-load intensities at x (down +). */
function totalIntensityAt(model: BeamModel, x: number): number {
  return model.loads.reduce((sum, load) => sum + (load.kind === "line" ? intensityAt(load, x) : 0), 0);
}

/**
 * Bending moment (sagging +) at a member end (x = 0 or x = span) from the CalculiX section
 * forces, corrected for the way they reach the node. CalculiX evaluates the section forces at
 * the element's two Gauss stations s = ±1/√3 along the axis and extrapolates them linearly to
 * the nodes, which misses the quadratic part c·s² of the moment by 2c/3 at s = ±1, with
 * c = M''·h²/2 = -w·h²/2 (w = line-load intensity at the element centre, h = half the element
 * length). Measured on statically determinate cantilevers (uniform and both triangular loads,
 * two element lengths): after adding 2c/3 the end moment is exact to about 7e-6 relative, the
 * cubic part of the moment needing no correction. The fixed-fixed closed forms in
 * test/engine/beam/calculix.test.ts check it again on every run.
 */
export function endSectionMoment(model: BeamModel, result: CcxBeamResult, end: "left" | "right"): number {
  const n = result.mesh.x.length;
  const [i0, i2] = end === "left" ? [0, 2] : [n - 3, n - 1];
  const x0 = result.mesh.x[i0];
  const x2 = result.mesh.x[i2];
  const h = (x2 - x0) / 2;
  const wMid = totalIntensityAt(model, (x0 + x2) / 2);
  const c = (-wMid * h * h) / 2;
  const missing = (2 * c) / 3;
  return result.sectionMoment[end === "left" ? 0 : n - 1] + missing;
}

/**
 * Reaction couples (CCW +) at the supports: 0 at pins; at fixed supports from moment
 * equilibrium of the whole member with the CalculiX vertical reactions. With two fixed
 * supports equilibrium leaves one unknown too many: the first must then be at x = 0 and its
 * couple is taken from the corrected CalculiX section moment there (M(0+) = -C; no applied
 * moment may sit at x = 0).
 */
export function reactionCouples(model: BeamModel, result: CcxBeamResult): number[] {
  const fixed = model.supports.map((s, i) => (s.type === "fixed" ? i : -1)).filter((i) => i >= 0);
  const couples = model.supports.map(() => 0);
  if (fixed.length === 0) return couples;
  if (fixed.length > 2) throw new Error("more than two fixed supports: couples not derivable");
  if (fixed.length === 2) {
    const first = fixed[0];
    if (model.supports[first].x !== 0) throw new Error("with two fixed supports the first must be at x = 0");
    if (model.loads.some((l) => l.kind === "moment" && l.x === 0)) throw new Error("applied moment at a fixed x = 0");
    couples[first] = -endSectionMoment(model, result, "left");
  }
  const unknown = fixed[fixed.length - 1];
  // With every reaction, couple and load included, the moment just right of the span end must
  // vanish; the couple still missing (counted as 0 so far) enters it as -C.
  couples[unknown] = momentByStatics(model, result.reactions, couples, model.span, "right");
  return couples;
}
