#!/usr/bin/env bash
# npm run backup: the database (pg_dump) and the uploaded photos in one
# timestamped archive under .data/backups/ (git-ignored). DATABASE_URL and
# UPLOAD_DIR say what to back up; by default the development cluster, which is
# started for the dump and stopped again if it was not running.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
ensure_postgres

chore_database
OUT_DIR="${BACKUP_DIR:-$DATA_DIR/backups}"
WORK="$(mktemp -d)"
cleanup() {
  rm -rf "$WORK"
  chore_done
}
trap cleanup EXIT

mkdir -p "$OUT_DIR" "$WORK/uploads"
pg_dump --format=custom --no-owner --no-privileges --file "$WORK/database.dump" "$DATABASE_URL"
if [ -d "$UPLOAD_DIR" ]; then cp -a "$UPLOAD_DIR/." "$WORK/uploads/"; fi
STAMP="$(date -u +%Y%m%dT%H%M%SZ)"
FILE="$OUT_DIR/keepstitch-$STAMP.tar.gz"
tar -C "$WORK" -czf "$FILE" database.dump uploads
echo "$FILE"
