#!/usr/bin/env bash
# npm run fault:db — PostgreSQL stopped and restarted while the API takes writes
# (scripts/fault-db.ts), on a throwaway cluster of its own that is removed after.
exec bash "$(dirname "$0")/with-fault-db.sh" fault "${KEEPSTITCH_FAULT_PG_PORT:-54341}" scripts/fault-db.ts
