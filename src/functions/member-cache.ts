/**
 * A small cache of recently solved members, keyed by the exact content of the arguments that
 * define the member (span, loads, supports). A takedown sheet asks for the reaction at each end,
 * the largest shear and the largest moment of the same member and load case in four cells, so
 * without it the same member is read and solved four times.
 *
 * Safe because the beam functions are pure: the same span, loads and supports always give the
 * same solution, whichever function asks and in whatever order the host calculates (Excel and
 * the headless evaluator run the same bundle). A hit needs every cell equal (numbers compared
 * with Object.is, so -0 and 0 are told apart); the hash only picks the candidates. Bounded: the
 * oldest entries are dropped first.
 */
import type { CellIn, Grid } from "./args";

/** Members kept; a sheet's four calls of one member come close together in any calculation order. */
export const MEMBER_CACHE_SIZE = 512;

/** The arguments that define a member, as coerced by the runner. */
export interface MemberArgs {
  readonly span: number;
  readonly loads: number | Grid;
  readonly supports: Grid | undefined;
  /** Further arguments that define the result (other load cases, a combination set, ratios), compared cell by cell. */
  readonly extra?: readonly (number | string | Grid | undefined)[];
}

// Hashing numbers by their bits is far cheaper than spelling them as text.
const f64 = new Float64Array(1);
const u32 = new Uint32Array(f64.buffer);

function mixNumber(h: number, x: number): number {
  f64[0] = x;
  h = Math.imul(h ^ u32[0]!, 0x9e3779b1);
  return Math.imul(h ^ u32[1]!, 0x85ebca6b);
}

function mixText(h: number, s: string): number {
  for (let i = 0; i < s.length; i++) h = Math.imul(h ^ s.charCodeAt(i), 0x9e3779b1);
  return Math.imul(h ^ s.length, 0x85ebca6b);
}

function mixCell(h: number, c: CellIn): number {
  if (typeof c === "number") return mixNumber(h, c);
  if (c === null) return Math.imul(h ^ 0x51, 0x9e3779b1);
  if (typeof c === "string") return mixText(Math.imul(h ^ 0x53, 0x9e3779b1), c);
  if (typeof c === "boolean") return Math.imul(h ^ (c ? 0x54 : 0x46), 0x9e3779b1);
  return mixText(Math.imul(h ^ 0x23, 0x9e3779b1), c.error);
}

function mixGrid(h: number, g: Grid): number {
  for (const row of g) {
    h = Math.imul(h ^ (row.length + 0x3b), 0x85ebca6b);
    for (const c of row) h = mixCell(h, c);
  }
  return Math.imul(h ^ g.length, 0x9e3779b1);
}

/**
 * A hash of a member's arguments (equal arguments give equal hashes).
 * @param m - span, loads and supports as coerced
 */
export function memberHash(m: MemberArgs): number {
  let h = mixNumber(0x2545f491, m.span);
  h = typeof m.loads === "number" ? mixNumber(h ^ 0x6e, m.loads) : mixGrid(h ^ 0x67, m.loads);
  if (m.supports !== undefined) h = mixGrid(h ^ 0x73, m.supports);
  if (m.extra !== undefined) {
    for (const e of m.extra) {
      if (e === undefined) h = Math.imul(h ^ 0x75, 0x9e3779b1);
      else if (typeof e === "number") h = mixNumber(h ^ 0x6e, e);
      else if (typeof e === "string") h = mixText(h ^ 0x74, e);
      else h = mixGrid(h ^ 0x67, e);
    }
  }
  return h;
}

function sameExtra(a: MemberArgs["extra"], b: MemberArgs["extra"]): boolean {
  if (a === undefined || b === undefined) return a === b;
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) {
    const x = a[i];
    const y = b[i];
    if (x === undefined || y === undefined || typeof x !== "object" || typeof y !== "object") {
      if (!Object.is(x, y)) return false;
    } else if (!sameGrid(x, y)) return false;
  }
  return true;
}

function sameCell(a: CellIn, b: CellIn): boolean {
  if (typeof a === "number" || typeof b === "number") return Object.is(a, b);
  if (a === null || b === null || typeof a !== "object" || typeof b !== "object") return a === b;
  return a.error === b.error;
}

function sameGrid(a: Grid, b: Grid): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) {
    const ra = a[i]!;
    const rb = b[i]!;
    if (ra.length !== rb.length) return false;
    for (let j = 0; j < ra.length; j++) if (!sameCell(ra[j]!, rb[j]!)) return false;
  }
  return true;
}

/**
 * True when two members' arguments are equal cell by cell.
 * @param a - one member's arguments
 * @param b - the other's
 */
export function sameMember(a: MemberArgs, b: MemberArgs): boolean {
  if (!Object.is(a.span, b.span)) return false;
  if (typeof a.loads === "number" || typeof b.loads === "number") {
    if (!Object.is(a.loads, b.loads)) return false;
  } else if (!sameGrid(a.loads, b.loads)) return false;
  if (a.supports === undefined || b.supports === undefined) {
    if (a.supports !== b.supports) return false;
  } else if (!sameGrid(a.supports, b.supports)) return false;
  return sameExtra(a.extra, b.extra);
}

interface Entry<T> {
  readonly args: MemberArgs;
  readonly value: T;
}

/** A bounded map from members' arguments to what solving them gave (values are never mutated). */
export class MemberCache<T> {
  private readonly buckets = new Map<number, Entry<T>[]>();
  /** Hashes in insertion order, for dropping the oldest. */
  private readonly order: number[] = [];
  private head = 0;

  /** @param capacity - most entries kept */
  constructor(private readonly capacity: number = MEMBER_CACHE_SIZE) {}

  /**
   * The cached value of a member, or the value `compute` gives, cached.
   * @param args - the member's coerced arguments (kept by reference: never mutated afterwards)
   * @param compute - solves the member (pure)
   */
  get(args: MemberArgs, compute: () => T): T {
    const h = memberHash(args);
    const bucket = this.buckets.get(h);
    if (bucket) for (const e of bucket) if (sameMember(e.args, args)) return e.value;
    const value = compute();
    if (this.order.length - this.head >= this.capacity) this.dropOldest();
    const entry = { args: { span: args.span, loads: args.loads, supports: args.supports, ...(args.extra !== undefined ? { extra: args.extra } : {}) }, value };
    if (bucket) bucket.push(entry);
    else this.buckets.set(h, [entry]);
    this.order.push(h);
    return value;
  }

  private dropOldest(): void {
    const h = this.order[this.head++]!;
    const bucket = this.buckets.get(h)!;
    bucket.shift();
    if (bucket.length === 0) this.buckets.delete(h);
    if (this.head > this.capacity) {
      this.order.splice(0, this.head);
      this.head = 0;
    }
  }

  /** Number of members held. */
  get size(): number {
    return this.order.length - this.head;
  }
}
