// Prints one closing line for the whole suite from vitest's JSON reports: "N passed, N failed".
import { existsSync, readFileSync } from "node:fs";

let passed = 0, failed = 0, skipped = 0;
for (const file of process.argv.slice(2)) {
  if (!existsSync(file)) continue;
  const r = JSON.parse(readFileSync(file, "utf8"));
  passed += r.numPassedTests ?? 0;
  const failedTests = r.numFailedTests ?? 0;
  failed += failedTests > 0 ? failedTests : (r.numFailedTestSuites ?? 0);
  skipped += (r.numPendingTests ?? 0) + (r.numTodoTests ?? 0);
}
console.log(`${passed} passed, ${failed} failed, ${skipped} skipped`);
