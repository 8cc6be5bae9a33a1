#!/usr/bin/env bash
# One command from a fresh clone to a running app: install, migrate, seed the demo, build, start.
set -euo pipefail
cd "$(dirname "$0")/.."
[ -x node_modules/.bin/next ] || npm ci
source scripts/env.sh
npm run db:setup
if [ ! -f .next/BUILD_ID ] || [ -n "$(find app components lib models -newer .next/BUILD_ID -type f -print -quit 2>/dev/null)" ]; then
  npx next build
fi
echo "Wavesieve: http://localhost:$PORT  (demo accounts in README.md; mail outbox at /admin/outbox)"
# web app, local mail catcher, and the job scheduler (screening worker loop, nightly re-screen, digest)
exec npx concurrently --kill-others --names web,mail,jobs --prefix-colors cyan,magenta,yellow \
  "next start -p $PORT" \
  "tsx scripts/fake-smtp.ts" \
  "tsx jobs/scheduler.ts"
