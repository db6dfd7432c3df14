#!/usr/bin/env bash
# npm start: set everything up on a fresh machine, then run Headroom with its demo data.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

PGPORT="${PGPORT:-54329}"
PORT="${PORT:-3000}"
# Everything the app keeps between runs; HEADROOM_DATA moves it (the stop test uses a temp folder).
DATA_ROOT="${HEADROOM_DATA:-$ROOT/.data}"
# Without SMTP_URL/SMTP_HOST the server runs a local mail catcher: mail is kept, not sent.
MAIL_CATCHER_PORT="${MAIL_CATCHER_PORT:-2525}"
MAIL_DIR="${MAIL_DIR:-$DATA_ROOT/mail}"
STORAGE_DIR="${STORAGE_DIR:-$DATA_ROOT/uploads}"
DATA_DIR="$DATA_ROOT/postgres"

ensure_postgres
ensure_node_modules

SERVER_PID=""
WATCH_PID=""
cleanup() {
  trap - INT TERM EXIT HUP
  [ -n "$WATCH_PID" ] && kill "$WATCH_PID" 2>/dev/null
  if [ -n "$SERVER_PID" ] && kill -0 "$SERVER_PID" 2>/dev/null; then
    say "stopping the server"
    kill -TERM "$SERVER_PID" 2>/dev/null || true
    wait "$SERVER_PID" 2>/dev/null || true
  fi
  say "stopping PostgreSQL"
  pg_down "$DATA_DIR"
}
# package.json runs this script with `exec`, so npm's forwarded TERM/INT reach this shell;
# the traps turn any of them into one clean stop of the server and PostgreSQL.
trap cleanup EXIT
trap 'exit 130' INT
trap 'exit 143' TERM
trap 'exit 129' HUP
# A parent that dies without a word (kill -9 on npm) must not leave the app running.
PARENT_PID=$PPID
(
  while kill -0 "$PARENT_PID" 2>/dev/null; do sleep 1; done
  kill -TERM $$ 2>/dev/null
) &
WATCH_PID=$!

mkdir -p "$DATA_ROOT"
pg_up "$DATA_DIR" "$PGPORT"
createdb_if_missing "$PGPORT" headroom
export DATABASE_URL="postgres://headroom@127.0.0.1:$PGPORT/headroom"
export STORAGE_DIR

say "migrating the database"
node --import tsx scripts/migrate.ts
say "checking demo data"
node --import tsx scripts/seed.ts
if [ "${HEADROOM_SKIP_BUILD:-0}" = "1" ]; then
  say "client build skipped (HEADROOM_SKIP_BUILD=1)"
else
  say "building the client"
  # Built as it ships (production React), whatever NODE_ENV the server will run with.
  env NODE_ENV=production npx vite build --logLevel warn
fi

# development, not production: a local run shows its caught mail at /dev/mail, which
# production never serves (and production refuses to start without SMTP settings).
export PORT NODE_ENV="${NODE_ENV:-development}" MAIL_CATCHER_PORT MAIL_DIR
node --import tsx server/index.ts &
SERVER_PID=$!

if [ -n "${SMTP_URL:-}${SMTP_HOST:-}" ]; then
  MAIL_LINE="Mail goes out through the SMTP server in SMTP_URL/SMTP_HOST."
else
  MAIL_LINE="Mail is caught, not sent: read it at http://127.0.0.1:$PORT/dev/mail
  (invitations, password resets, notices; files in ${MAIL_DIR#"$ROOT"/})."
fi
for _ in $(seq 1 100); do
  if node -e "fetch('http://127.0.0.1:$PORT/api/health').then(r=>process.exit(r.ok?0:1),()=>process.exit(1))"; then break; fi
  kill -0 "$SERVER_PID" 2>/dev/null || die "the server stopped while starting (see the log above)"
  sleep 0.2
done
cat <<MSG

  Headroom is running at http://127.0.0.1:$PORT

  Demo sign-ins (password for all: headroom-demo)
    owner   owner@example.test    Marisol Okafor, owns "Gravel Hauler"
    crew    crew@example.test     Teddy Brandt, wrenches on it
    shop    shop@example.test     Ridgeback Fuel Lab, rebuilds its injectors
    viewer  viewer@example.test   Jo Whitlock, follows the build

  $MAIL_LINE

  Ctrl-C (or TERM to npm) stops the server and PostgreSQL. Data stays in ${DATA_ROOT#"$ROOT"/}/ (delete it to reset).

MSG
wait "$SERVER_PID"
