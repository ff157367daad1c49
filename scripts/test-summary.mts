// Sums the suites' own counts (vitest's JSON reports) into the one closing line
// CI reads: "N passed, N failed". A missing report counts as a failed suite.
import { existsSync, readFileSync } from "node:fs";

let passed = 0;
let failed = 0;
for (const file of process.argv.slice(2)) {
  if (!existsSync(file)) {
    console.log(`[summary] ${file}: no report (suite did not run)`);
    failed += 1;
    continue;
  }
  const r = JSON.parse(readFileSync(file, "utf8")) as {
    numPassedTests: number;
    numFailedTests: number;
    numTotalTests: number;
    testResults?: { status: string; message?: string; name: string }[];
  };
  // A file that failed to load has no tests but a failed status.
  const brokenFiles = (r.testResults ?? []).filter((t) => t.status === "failed" && t.message).length;
  console.log(`[summary] ${file}: ${r.numPassedTests} passed, ${r.numFailedTests} failed${brokenFiles ? `, ${brokenFiles} file(s) with errors` : ""}`);
  passed += r.numPassedTests;
  failed += r.numFailedTests + (r.numFailedTests === 0 ? brokenFiles : 0);
  if (r.numTotalTests === 0) failed += 1;
}
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed > 0 ? 1 : 0);
