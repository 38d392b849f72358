#!/usr/bin/env bash
# Runs one fault script against a throwaway PostgreSQL cluster of its own in
# .data/NAME, removed afterwards with everything else in that folder:
#   bash scripts/with-fault-db.sh NAME PG_PORT scripts/fault-upload.ts
# The script gets DATABASE_URL, FAULT_DIR (the folder, for its photos) and, to
# stop and start the cluster itself, FAULT_PG_DATA and FAULT_PG_OPTS.
set -uo pipefail
source "$(dirname "$0")/lib.sh"
ensure_postgres
NAME="$1" PORT="$2" SCRIPT="$3"
DIR="$DATA_DIR/$NAME"
pg_remove "$DIR/pg"; rm -rf "$DIR"
trap 'pg_remove "$DIR/pg"; rm -rf "$DIR"' EXIT
PG_FSYNC=off pg_up "$DIR/pg" "$PORT" >/dev/null || exit 1
# The cluster may live outside the project (lib.sh, pg_place).
PG_DIR="$(pg_where "$DIR/pg")"
SOCK="$PG_DIR/run"; [ ${#SOCK} -gt 90 ] && SOCK="/tmp/keepstitch-pg-$PORT"
export DATABASE_URL="postgres://postgres@127.0.0.1:$PORT/keepstitch_fault"
export FAULT_DIR="$DIR" FAULT_PG_DATA="$PG_DIR/data"
export FAULT_PG_OPTS="-k $SOCK -c listen_addresses=127.0.0.1 -p $PORT -c fsync=off"
node --import tsx -e "require('./scripts/db.ts').ensureDatabase(process.env.DATABASE_URL)" || exit 1
node --import tsx "$SCRIPT"
