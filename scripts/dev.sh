#!/usr/bin/env bash
# npm run dev: Vite dev server (hot reload) plus the API in watch mode, on the npm start database.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
PGPORT="${PGPORT:-54329}"
DATA_DIR="$ROOT/.data/postgres"
ensure_postgres
ensure_node_modules
trap 'pg_down "$DATA_DIR"' EXIT
mkdir -p "$ROOT/.data"
pg_up "$DATA_DIR" "$PGPORT"
createdb_if_missing "$PGPORT" headroom
export DATABASE_URL="postgres://headroom@127.0.0.1:$PGPORT/headroom"
node --import tsx scripts/migrate.ts
node --import tsx scripts/seed.ts
say "client: http://127.0.0.1:5173 (proxies /api to :3000)"
# Links in mails open the Vite client; caught mail is listed by the API server itself.
export APP_URL="${APP_URL:-http://127.0.0.1:5173}"
say "caught mail: http://127.0.0.1:3000/dev/mail"
SERVE_CLIENT=0 npx concurrently -k -n api,web -c yellow,cyan \
  "node --import tsx --watch server/index.ts" "vite --host 127.0.0.1"
