import type { DbHandle } from "../../server/db/client.ts";
import { verifyChains } from "../../server/features/history/history.chain.ts";

/** verifyChains over every seeded event; a broken chain is a bug in the fixtures (or the chain) and stops the bench. */
export function benchVerifyChains({ db }: DbHandle) {
  const tv = performance.now();
  const verdict = verifyChains(db);
  console.log(`\nverifyChains over ${verdict.checked.toLocaleString("en-GB")} events: ${verdict.ok ? "intact" : "BROKEN"} in ${((performance.now() - tv) / 1000).toFixed(2)} s`);
  if (!verdict.ok) throw new Error(`history chain broken: ${JSON.stringify(verdict.brokenAt)}`);
}
