#!/usr/bin/env bash
# npm run fault:db — PostgreSQL stopped and restarted while the API takes writes
# (scripts/fault-db.ts), on a throwaway cluster of its own that is removed after.
set -uo pipefail
source "$(dirname "$0")/lib.sh"
ensure_postgres
DIR="$DATA_DIR/fault"
PORT="${KEEPSTITCH_FAULT_PG_PORT:-54341}"
rm -rf "$DIR"
trap 'pg_down "$DIR/pg" >/dev/null 2>&1; rm -rf "$DIR"' EXIT
PG_FSYNC=off pg_up "$DIR/pg" "$PORT" >/dev/null || exit 1
SOCK="$DIR/pg/run"; [ ${#SOCK} -gt 90 ] && SOCK="/tmp/keepstitch-pg-$PORT"
export DATABASE_URL="postgres://postgres@127.0.0.1:$PORT/keepstitch_fault"
export FAULT_PG_DATA="$DIR/pg/data"
export FAULT_PG_OPTS="-k $SOCK -c listen_addresses=127.0.0.1 -p $PORT -c fsync=off"
node --import tsx -e "require('./scripts/db.ts').ensureDatabase(process.env.DATABASE_URL)" || exit 1
node --import tsx scripts/fault-db.ts
