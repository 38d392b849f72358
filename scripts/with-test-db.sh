#!/usr/bin/env bash
# Runs one command against a development test database, leaving PostgreSQL
# running for the next one:  bash scripts/with-test-db.sh npx jest server/clients
# `npm test` does not use this cluster; it makes and removes its own.
# Two people (or two terminals) running tests at once give each run its own
# cluster: KEEPSTITCH_DEV_TEST_NAME=other KEEPSTITCH_DEV_TEST_PG_PORT=54348.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
ensure_postgres
PG_PORT="${KEEPSTITCH_DEV_TEST_PG_PORT:-54338}"
PG_FSYNC=off pg_up "$DATA_DIR/${KEEPSTITCH_DEV_TEST_NAME:-dev-test}/pg" "$PG_PORT" >/dev/null
export NODE_ENV=test
export DATABASE_URL="postgres://postgres@127.0.0.1:$PG_PORT/keepstitch_test"
node --import tsx -e "require('./scripts/db.ts').ensureDatabase(process.env.DATABASE_URL)"
exec "$@"
