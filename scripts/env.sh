# Shared defaults for the demo, test and CI scripts. Every value can be overridden from the environment.
export NEXT_TELEMETRY_DISABLED=1
export PORT="${PORT:-3000}"
export NEXTAUTH_URL="${NEXTAUTH_URL:-http://localhost:$PORT}"
export FAKE_SMTP_PORT="${FAKE_SMTP_PORT:-2525}"
export SMTP_URL="${SMTP_URL:-smtp://127.0.0.1:$FAKE_SMTP_PORT}"
mkdir -p data
if [ -z "${NEXTAUTH_SECRET:-}" ]; then
  # A per-install random secret, kept in the git-ignored data folder.
  [ -s data/.nextauth-secret ] || node -e 'process.stdout.write(require("crypto").randomBytes(32).toString("base64url"))' > data/.nextauth-secret
  export NEXTAUTH_SECRET="$(cat data/.nextauth-secret)"
fi
