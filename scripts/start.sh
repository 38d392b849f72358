#!/usr/bin/env bash
# npm start: set up what is missing, then serve the workroom with its demo data
# on http://127.0.0.1:4300 (PORT overrides). Ctrl-C stops the server and PostgreSQL.
set -euo pipefail
source "$(dirname "$0")/lib.sh"

ensure_node_modules
ensure_postgres

PG_PORT="${KEEPSTITCH_PG_PORT:-54330}"
PG_DIR="$DATA_DIR/pg"
export PORT="${PORT:-4300}"
export DATABASE_URL="${DATABASE_URL:-postgres://postgres@127.0.0.1:$PG_PORT/keepstitch}"
# Local fakes of the mail server and the card-payment provider, unless real ones are configured.
export FAKE_SMTP_PORT="${FAKE_SMTP_PORT:-2525}" FAKE_MAIL_API_PORT="${FAKE_MAIL_API_PORT:-2526}" FAKE_PAYMENTS_PORT="${FAKE_PAYMENTS_PORT:-12111}"
export APP_URL="${APP_URL:-http://127.0.0.1:$PORT}"
if [ -z "${SMTP_HOST:-}" ]; then export SMTP_HOST=127.0.0.1 SMTP_PORT="$FAKE_SMTP_PORT" FAKE_MAIL_API="http://127.0.0.1:$FAKE_MAIL_API_PORT"; fi
if [ -z "${PAYMENTS_SECRET_KEY:-}" ]; then export PAYMENTS_API_URL="http://127.0.0.1:$FAKE_PAYMENTS_PORT"; fi

SERVER_PID=""
FAKE_PIDS=()
stop_all() {
  for pid in "$SERVER_PID" "${FAKE_PIDS[@]}"; do
    if [ -n "$pid" ] && kill -0 "$pid" 2>/dev/null; then
      kill -TERM "$pid" 2>/dev/null || true
      wait "$pid" 2>/dev/null || true
    fi
  done
  pg_down "$PG_DIR"
}
trap stop_all EXIT
trap 'exit 130' INT TERM

pg_up "$PG_DIR" "$PG_PORT"
node --import tsx scripts/db.ts prepare

log "Building the app for production"
npx ng build --configuration production --progress=false >"$DATA_DIR/build.log" 2>&1 || {
  cat "$DATA_DIR/build.log"; exit 1; }

if [ -n "${FAKE_MAIL_API:-}" ]; then
  node --import tsx scripts/fakes/fake-smtp.ts & FAKE_PIDS+=($!)
fi
if [ -n "${PAYMENTS_API_URL:-}" ] && [ -z "${PAYMENTS_SECRET_KEY:-}" ]; then
  node --import tsx scripts/fakes/fake-payments.ts & FAKE_PIDS+=($!)
fi
node --import tsx server/index.ts &
SERVER_PID=$!
for _ in $(seq 1 60); do
  if node -e "fetch(process.argv[1]).then(r => process.exit(r.ok ? 0 : 1), () => process.exit(1))" "http://127.0.0.1:$PORT/api/health"; then break; fi
  kill -0 "$SERVER_PID" 2>/dev/null || exit 1
  sleep 0.5
done
node --import tsx scripts/banner.ts
wait "$SERVER_PID"
