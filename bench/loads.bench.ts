/**
 * Throughput of the load functions: the engine calls behind COMBINE (governing combination of
 * 25 LRFD / 24 ASD rows) and LL_REDUCE, and the same through the worksheet-function layer
 * (argument runner included). A takedown of a large building calls them once per column per
 * level, so 100,000 calls per second keeps a 10,000-cell takedown under a tenth of a second.
 */
import { governingCombination, reducedLiveLoad, type LoadEffects } from "../src/engine/loads";
import { installCustomFunctionsGlobal } from "../src/workbook/headless-shim";
import { opsPerSecond, report } from "./timing";

let sink = 0;

/** Varied inputs so that the measurement does not ride on one branch. */
const EFFECTS: LoadEffects[] = Array.from({ length: 64 }, (_, i) => ({
  D: 40 + i,
  L: 25 + (i % 7),
  Lr: (i % 3) * 4,
  S: (i % 5) * 3,
  R: i % 2,
  W: (i % 11) - 5,
  E: (i % 13) - 6,
}));

export async function run(): Promise<void> {
  let i = 0;
  report(
    "COMBINE engine, LRFD max (25 combinations)",
    opsPerSecond(() => {
      sink += governingCombination(EFFECTS[i++ & 63]!, { method: "LRFD", halfLive: false }, "max").value;
    }),
    "calls/s",
    ">= 100,000",
  );
  report(
    "COMBINE engine, ASD min (24 combinations)",
    opsPerSecond(() => {
      sink += governingCombination(EFFECTS[i++ & 63]!, { method: "ASD", halfLive: false }, "min").value;
    }),
    "calls/s",
    ">= 100,000",
  );
  report(
    "LL_REDUCE engine (Eq. 4.7-1 with limits)",
    opsPerSecond(() => {
      const r = reducedLiveLoad({ lo: 50, kll: 4, at: 100 + (i++ & 1023) * 10, floors: 1 + (i & 3), units: "US" });
      if (r.ok) sink += r.value;
    }),
    "calls/s",
    ">= 100,000",
  );

  installCustomFunctionsGlobal();
  const f = await import("../src/functions/load-functions");
  report(
    "COMBINE worksheet function (runner + engine)",
    opsPerSecond(() => {
      const x = EFFECTS[i++ & 63]!;
      sink += f.combine(x.D, x.L, x.Lr, x.S, x.R, x.W, x.E, "LRFD", "max");
    }),
    "calls/s",
    ">= 100,000",
  );
  report(
    "LL_REDUCE worksheet function (runner + engine)",
    opsPerSecond(() => {
      sink += f.llReduce(50, 4, 100 + (i++ & 1023) * 10, 2, "US");
    }),
    "calls/s",
    ">= 100,000",
  );
  if (sink === Number.MIN_VALUE) console.log(sink);
}
