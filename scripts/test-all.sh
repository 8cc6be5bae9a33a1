#!/usr/bin/env bash
# The whole test suite: vitest (unit + integration) then the browser e2e suite.
# Ends with one line: "N passed, N failed" over all suites.
set -u
cd "$(dirname "$0")/.."
export NEXT_TELEMETRY_DISABLED=1
mkdir -p test-results
rm -f test-results/vitest.json test-results/vitest-postgres.json test-results/e2e.json

# Everything on SQLite first (the PostgreSQL URL kept out of this run's environment).
env -u WAVESIEVE_TEST_POSTGRES npx vitest run --reporter=default --reporter=json --outputFile.json=test-results/vitest.json
unit_status=$?

# The database suites once more on PostgreSQL, when a server is given (.ci/run starts one with
# scripts/postgres-for-tests.sh). The engine, CLI and fuzzing suites use no database and the load
# and lock tests are about SQLite, so they run once.
pg_status=0
rm -f test-results/vitest-postgres.json
if [ -n "${WAVESIEVE_TEST_POSTGRES:-}" ]; then
  WAVESIEVE_TEST_POSTGRES="$WAVESIEVE_TEST_POSTGRES" npx vitest run tests/app tests/queue tests/jobs \
    --reporter=default --reporter=json --outputFile.json=test-results/vitest-postgres.json
  pg_status=$?
  node scripts/drop-test-databases.mjs || true
else
  echo "postgres: suite not run (set WAVESIEVE_TEST_POSTGRES to a PostgreSQL URL, see README)"
fi

if [ -x "${CHROMIUM_PATH:-/usr/bin/chromium}" ]; then
  node e2e/run.mjs
  e2e_status=$?
else
  echo "e2e: Chromium not found at ${CHROMIUM_PATH:-/usr/bin/chromium}; install it with: apt-get install chromium" >&2
  printf '{"passed":0,"failed":1,"failures":[{"test":"e2e","error":"chromium missing"}]}' > test-results/e2e.json
  e2e_status=1
fi

node scripts/test-summary.mjs
summary_status=$?
[ $unit_status -eq 0 ] && [ $pg_status -eq 0 ] && [ $e2e_status -eq 0 ] && [ $summary_status -eq 0 ]
