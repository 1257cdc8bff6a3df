/**
 * Input of the load-path drawing: one member at the centre, what it carries (upstream, up to
 * the deck zones) and where its reactions go (downstream, down to the foundations), as two
 * trees whose edges carry the force passed along them.
 *
 * Filling it from the takedown graph, for member M and one case:
 * - `upstream`: one branch per end of every member U that names M as its start or end support:
 *   `{ mark: U, memberType: U's type, value: U's reaction at that end, at: that end's
 *   "Start at"/"End at" position on M, children: U's own upstream }`; a member's zone loads are
 *   leaves `{ mark: zone, memberType: "zone", value: trib x area load, unit: "kip/ft" (or
 *   "kN/m"), note: "trib 6.5 ft" }`, and rows of the Loads table leaves of the same kind.
 * - `downstream`: one branch per end of M: `{ mark: the support, memberType: its type, value:
 *   M's reaction at that end, at: the position on the support, note: "start" or "end",
 *   children: the support's own downstream }`. Further down, a value is that member's whole
 *   reaction (or a column's cumulative load at that level), not only M's share.
 * - Members on a cycle (reported as a problem by the takedown) are left out; the drawing also
 *   stops at 24 levels whatever it is given.
 */

/**
 * One node of a load-path tree and the edge that joins it to its parent (the member nearer
 * the centre).
 *
 * Upstream (in {@link LoadPathTree.upstream}): the node delivers `value` to its parent, at
 * `at` along the parent; its `children` are what it carries in turn (members, then zones).
 * Downstream (in {@link LoadPathTree.downstream}): the parent delivers `value` to this node, at
 * `at` along it; its `children` are where this node's own reactions go.
 */
export interface LoadPathBranch {
  /** Mark of the member, or the zone's name. Drawn as text. */
  readonly mark: string;
  /** beam, girder, joist, column, wall, foundation, or zone. */
  readonly memberType: string;
  /** Force passed along the edge, in the tree's force unit (or `unit`). */
  readonly value?: number;
  /** Unit of `value` when not the tree's force unit, e.g. "kip/ft" for a zone's line load. */
  readonly unit?: string;
  /** Position along the receiving member, in the tree's length unit. */
  readonly at?: number;
  /** A few words printed after the value, e.g. "start", "trib 6.5 ft". Drawn as text. */
  readonly note?: string;
  /** Further away from the centre: what this node carries (upstream) or feeds (downstream). */
  readonly children: readonly LoadPathBranch[];
}

/** The load path of one member. */
export interface LoadPathTree {
  readonly mark: string;
  readonly memberType: string;
  readonly level?: string;
  /** The case or combination of the values: "D", "L", "1.2D + 1.6L". */
  readonly caseLabel?: string;
  readonly units: { readonly force: string; readonly length: string };
  readonly upstream: readonly LoadPathBranch[];
  readonly downstream: readonly LoadPathBranch[];
}
