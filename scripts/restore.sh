#!/usr/bin/env bash
# npm run restore FILE: replaces the database named by DATABASE_URL (by
# default the development one) and the photo folder with a backup made by
# `npm run backup`. Stop the app first: the database is dropped and recreated.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
ensure_postgres

FILE="${1:-}"
if [ -z "$FILE" ] || [ ! -f "$FILE" ]; then
  echo "Usage: npm run restore -- .data/backups/keepstitch-<time>.tar.gz" >&2
  exit 2
fi
FILE="$(cd "$(dirname "$FILE")" && pwd)/$(basename "$FILE")"
chore_database
WORK="$(mktemp -d)"
cleanup() {
  rm -rf "$WORK"
  chore_done
}
trap cleanup EXIT

tar -C "$WORK" -xzf "$FILE"
[ -f "$WORK/database.dump" ] || { echo "restore: $FILE holds no database.dump" >&2; exit 1; }
DB_NAME="${DATABASE_URL##*/}"
DB_NAME="${DB_NAME%%\?*}"
ADMIN_URL="${DATABASE_URL%/*}/postgres"
psql -q -v ON_ERROR_STOP=1 "$ADMIN_URL" -c "DROP DATABASE IF EXISTS \"$DB_NAME\" WITH (FORCE)" -c "CREATE DATABASE \"$DB_NAME\""
pg_restore --no-owner --no-privileges --exit-on-error --dbname "$DATABASE_URL" "$WORK/database.dump"
mkdir -p "$UPLOAD_DIR"
find "$UPLOAD_DIR" -mindepth 1 -delete
cp -a "$WORK/uploads/." "$UPLOAD_DIR/"
log "Restored $(basename "$FILE") into $DB_NAME and ${UPLOAD_DIR#$ROOT/}"
