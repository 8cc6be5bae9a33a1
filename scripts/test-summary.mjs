// Adds the vitest JSON report and the e2e counts into the one closing line CI reads.
import { readFileSync, existsSync } from "node:fs";

function read(file) {
  return existsSync(file) ? JSON.parse(readFileSync(file, "utf8")) : null;
}

const unit = read("test-results/vitest.json");
const e2e = read("test-results/e2e.json");
let passed = 0;
let failed = 0;
let unitFailed = 0;
if (unit) {
  passed += unit.numPassedTests;
  failed += unit.numFailedTests;
  // A file that fails to load has no tests but must still count as a failure.
  failed += unit.testResults.filter((f) => f.status === "failed" && f.assertionResults.length === 0).length;
  // Tests that never finished (their worker process died) are failures too, and so is a run vitest
  // itself calls unsuccessful (an unhandled error) even when every test it counted passed.
  const unfinished = unit.numTotalTests - unit.numPassedTests - unit.numFailedTests - (unit.numPendingTests ?? 0) - (unit.numTodoTests ?? 0);
  if (unfinished > 0) failed += unfinished;
  if (unit.success === false && failed === 0) failed += 1;
  unitFailed = failed;
} else failed += 1;
if (e2e) {
  passed += e2e.passed;
  failed += e2e.failed;
} else failed += 1;
console.log(`unit: ${unit ? `${unit.numPassedTests} passed, ${unitFailed} failed` : "no report"}; e2e: ${e2e ? `${e2e.passed} passed, ${e2e.failed} failed` : "no report"}`);
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed > 0 || passed === 0 ? 1 : 0);
