/** Run by tests/engine-pool.test.ts in a child process: one pooled analysis, then nothing. The process must exit by itself. */
import { readFileSync } from "node:fs";
import { analyseOffThread } from "@/lib/engine/pool";

const run = await analyseOffThread(readFileSync("fixtures/golden/layout-iso-pa.csv", "utf8"), {});
console.log(`verdict=${run.result.verdict}`);
