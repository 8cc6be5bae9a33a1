// Adds the vitest JSON reports (SQLite, and PostgreSQL when that suite ran) and the e2e counts into
// the one closing line CI reads.
import { readFileSync, existsSync } from "node:fs";

function read(file) {
  return existsSync(file) ? JSON.parse(readFileSync(file, "utf8")) : null;
}

/** Passed and failed of one vitest JSON report; a missing report counts as one failure. */
function vitestCounts(report) {
  if (!report) return { passed: 0, failed: 1 };
  let failed = report.numFailedTests;
  // A file that fails to load has no tests but must still count as a failure.
  failed += report.testResults.filter((f) => f.status === "failed" && f.assertionResults.length === 0).length;
  // Tests that never finished (their worker process died) are failures too, and so is a run vitest
  // itself calls unsuccessful (an unhandled error) even when every test it counted passed.
  const unfinished = report.numTotalTests - report.numPassedTests - report.numFailedTests - (report.numPendingTests ?? 0) - (report.numTodoTests ?? 0);
  if (unfinished > 0) failed += unfinished;
  if (report.success === false && failed === 0) failed += 1;
  return { passed: report.numPassedTests, failed };
}

const parts = [["unit", vitestCounts(read("test-results/vitest.json"))]];
if (process.env.WAVESIEVE_TEST_POSTGRES) parts.push(["unit on PostgreSQL", vitestCounts(read("test-results/vitest-postgres.json"))]);
const e2e = read("test-results/e2e.json");
parts.push(["e2e", e2e ? { passed: e2e.passed, failed: e2e.failed } : { passed: 0, failed: 1 }]);

const passed = parts.reduce((n, [, c]) => n + c.passed, 0);
const failed = parts.reduce((n, [, c]) => n + c.failed, 0);
console.log(parts.map(([name, c]) => `${name}: ${c.passed} passed, ${c.failed} failed`).join("; "));
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed > 0 || passed === 0 ? 1 : 0);
