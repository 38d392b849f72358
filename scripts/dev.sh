#!/usr/bin/env bash
# npm run dev: the API restarted on change (tsx watch) and `ng serve` with a
# proxy to it, against the development database. Not for the demo: use npm start.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
ensure_node_modules
ensure_postgres
PG_PORT="${KEEPSTITCH_PG_PORT:-54330}"
PG_DIR="$DATA_DIR/pg"
export PORT="${PORT:-4300}"
export DATABASE_URL="${DATABASE_URL:-postgres://postgres@127.0.0.1:$PG_PORT/keepstitch}"
PIDS=()
stop_all() {
  for pid in "${PIDS[@]}"; do kill -TERM "$pid" 2>/dev/null || true; done
  wait 2>/dev/null || true
  pg_down "$PG_DIR"
}
trap stop_all EXIT
trap 'exit 130' INT TERM
pg_up "$PG_DIR" "$PG_PORT"
node --import tsx scripts/db.ts prepare
npx tsx watch server/index.ts & PIDS+=($!)
npx ng serve --configuration development --port 4200 & PIDS+=($!)
log "App with live reload on http://127.0.0.1:4200 (API on $PORT)"
wait -n
