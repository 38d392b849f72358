#!/usr/bin/env bash
# Checks that the PostgreSQL clusters of the scripts work from a clone in a
# folder only root can enter (as root's home is on Debian, mode 0700), where
# the postgres user that runs PostgreSQL cannot reach the project:
#   bash scripts/check-closed-folder.sh [COMMIT]   (default HEAD)
# Clones COMMIT into a new 0700 folder, starts, uses and stops a cluster there
# with pg_up/pg_down and with scripts/with-test-db.sh, then removes all of it.
# As another user than root PostgreSQL runs as that user, so there is nothing to check.
set -uo pipefail
source "$(dirname "$0")/lib.sh"

if [ "$(id -u)" != 0 ]; then
  log "Not root: PostgreSQL runs as this user, who can enter its own folders; nothing to check."
  exit 0
fi
ensure_postgres || exit 1

COMMIT="${1:-HEAD}"
PORT="${KEEPSTITCH_CLOSED_PG_PORT:-54363}"
HOME700="$(mktemp -d /tmp/keepstitch-closed-XXXXXX)"
chmod 700 "$HOME700"
CLONE="$HOME700/ks"
cleanup() {
  (source "$CLONE/scripts/lib.sh" >/dev/null 2>&1 && pg_down "$CLONE/.data/pg" && pg_down "$CLONE/.data/closed/pg") >/dev/null 2>&1
  # This checkout's pg_remove knows where a clone's cluster is kept away, even when the clone's does not.
  pg_remove "$CLONE/.data/pg"
  pg_remove "$CLONE/.data/closed/pg"
  rm -rf "$HOME700"
}
trap cleanup EXIT

git clone -q --no-checkout "$ROOT" "$CLONE" && git -C "$CLONE" checkout -q "$(git rev-parse "$COMMIT")" || exit 1
ln -s "$ROOT/node_modules" "$CLONE/node_modules"
log "Clone of $(git -C "$CLONE" rev-parse --short HEAD) in $CLONE (folder mode $(stat -c %a "$HOME700"))"

query() { psql -h 127.0.0.1 -p "$PORT" -U postgres -d "$1" -Atc 'SELECT 1'; }

(
  source "$CLONE/scripts/lib.sh" && ensure_postgres || exit 1
  pg_up "$DATA_DIR/pg" "$PORT" || exit 1
  [ "$(query postgres)" = 1 ] || { echo "The cluster started but answers no query." >&2; exit 1; }
  pg_down "$DATA_DIR/pg"
  # Started again, the same cluster is used.
  pg_up "$DATA_DIR/pg" "$PORT" >/dev/null && psql -h 127.0.0.1 -p "$PORT" -U postgres -Atc 'CREATE DATABASE kept' >/dev/null || exit 1
  pg_down "$DATA_DIR/pg" && pg_up "$DATA_DIR/pg" "$PORT" >/dev/null || exit 1
  [ "$(query kept)" = 1 ] || { echo "The cluster lost its database when it was stopped and started." >&2; exit 1; }
  pg_down "$DATA_DIR/pg"
) || { echo "pg_up/pg_down do not work from a folder only root can enter." >&2; exit 1; }

(
  cd "$CLONE" && KEEPSTITCH_DEV_TEST_NAME=closed KEEPSTITCH_DEV_TEST_PG_PORT="$PORT" bash scripts/with-test-db.sh psql "postgres://postgres@127.0.0.1:$PORT/keepstitch_test" -Atc 'SELECT 1' >/dev/null
) || { echo "scripts/with-test-db.sh does not work from a folder only root can enter." >&2; exit 1; }

log "Clusters start, keep their data and stop from a folder only root can enter."
