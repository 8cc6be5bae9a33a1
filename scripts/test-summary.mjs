// Adds the vitest JSON report and the e2e counts into the one closing line CI reads.
import { readFileSync, existsSync } from "node:fs";

function read(file) {
  return existsSync(file) ? JSON.parse(readFileSync(file, "utf8")) : null;
}

const unit = read("test-results/vitest.json");
const e2e = read("test-results/e2e.json");
let passed = 0;
let failed = 0;
if (unit) {
  passed += unit.numPassedTests;
  failed += unit.numFailedTests;
  // A file that fails to load has no tests but must still count as a failure.
  failed += unit.testResults.filter((f) => f.status === "failed" && f.assertionResults.length === 0).length;
} else failed += 1;
if (e2e) {
  passed += e2e.passed;
  failed += e2e.failed;
} else failed += 1;
console.log(`unit: ${unit ? `${unit.numPassedTests} passed, ${unit.numFailedTests} failed` : "no report"}; e2e: ${e2e ? `${e2e.passed} passed, ${e2e.failed} failed` : "no report"}`);
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed > 0 || passed === 0 ? 1 : 0);
