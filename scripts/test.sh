#!/usr/bin/env bash
# npm test: set up what the tests need (PostgreSQL, Chromium, node modules), start a
# throwaway PostgreSQL on its own port, run every suite, and end with one line
# "N passed, N failed". Safe to run while `npm start` is running.
set -uo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

ensure_postgres
ensure_chromium
ensure_node_modules

WORK="$(mktemp -d /tmp/headroom-test.XXXXXX)"
chmod 755 "$WORK"
TEST_PGPORT="$(free_port)"
cleanup() {
  pg_down "$WORK/pg"
  rm -rf "$WORK"
}
trap cleanup EXIT
trap 'exit 130' INT TERM

pg_up "$WORK/pg" "$TEST_PGPORT" -c fsync=off -c synchronous_commit=off -c full_page_writes=off -c max_connections=200
createdb_if_missing "$TEST_PGPORT" headroom_test
export DATABASE_URL="postgres://headroom@127.0.0.1:$TEST_PGPORT/headroom_test"
export NODE_ENV=test

PASSED=0
FAILED=0
FAILED_SUITES=()

# One pass or one fail for a whole command (typecheck, lint, build).
check() {
  local name="$1"
  shift
  say "$name"
  if "$@"; then PASSED=$((PASSED + 1)); else FAILED=$((FAILED + 1)); FAILED_SUITES+=("$name"); fi
}

# count FILE EXPR_PASSED EXPR_FAILED — read counts from a JSON report.
count() {
  node -e '
    const fs = require("fs");
    const [file, p, f] = process.argv.slice(1);
    try { const r = JSON.parse(fs.readFileSync(file, "utf8")); console.log(eval(p), eval(f)); }
    catch { console.log("0 0"); }' "$@"
}

check "typecheck" npx tsc --noEmit -p tsconfig.json
check "lint" npx eslint . --max-warnings=0

say "migrating the test database"
node --import tsx scripts/migrate.ts || { FAILED=$((FAILED + 1)); FAILED_SUITES+=("migrate"); }

say "unit and API tests (Vitest)"
npx vitest run --reporter=default --reporter=json --outputFile.json="$WORK/vitest.json"
VITEST_RC=$?
read -r VP VF < <(count "$WORK/vitest.json" "r.numPassedTests" "r.numFailedTests + (r.numRuntimeErrorTestSuites||0)")
PASSED=$((PASSED + VP))
FAILED=$((FAILED + VF))
if [ "$VITEST_RC" != "0" ] && [ "$VF" = "0" ]; then FAILED=$((FAILED + 1)); FAILED_SUITES+=("vitest (exit $VITEST_RC)"); fi
[ "$VF" != "0" ] && FAILED_SUITES+=("vitest: $VF")

# Built into the throwaway folder, so a running `npm start` keeps serving its own dist/.
export E2E_CLIENT_DIR="$WORK/dist"
# NODE_ENV is "test" for the suites above; the client is built as it ships (production React).
check "client build" env NODE_ENV=production npx vite build --logLevel warn --outDir "$E2E_CLIENT_DIR" --emptyOutDir

say "end-to-end tests (Playwright in Chromium)"
export E2E_PORT="$(free_port)"
# The e2e server's mail catcher: its own port and a throwaway folder (read by the specs at /dev/mail).
E2E_MAIL_PORT="$(free_port)"
[ "$E2E_MAIL_PORT" = "$E2E_PORT" ] && E2E_MAIL_PORT="$(free_port)"
export E2E_MAIL_PORT E2E_MAIL_DIR="$WORK/mail" E2E_STORAGE_DIR="$WORK/uploads"
PLAYWRIGHT_JSON_OUTPUT_NAME="$WORK/playwright.json" npx playwright test --reporter=list,json
PW_RC=$?
read -r EP EF < <(count "$WORK/playwright.json" "r.stats.expected + r.stats.flaky" "r.stats.unexpected")
PASSED=$((PASSED + EP))
FAILED=$((FAILED + EF))
if [ "$PW_RC" != "0" ] && [ "$EF" = "0" ]; then FAILED=$((FAILED + 1)); FAILED_SUITES+=("playwright (exit $PW_RC)"); fi
[ "$EF" != "0" ] && FAILED_SUITES+=("playwright: $EF")

echo
if [ "$FAILED" != "0" ]; then say "failed: ${FAILED_SUITES[*]}"; fi
echo "$PASSED passed, $FAILED failed"
[ "$FAILED" = "0" ]
