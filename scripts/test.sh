#!/usr/bin/env bash
# npm test: set up what is missing, start a throwaway PostgreSQL, then run every
# check: type-checks, jest (shared and server), karma (Angular components), the
# production build and the end-to-end specs in Chromium. Ends with one line
# "N passed, N failed" and a non-zero exit on any failure.
set -uo pipefail
source "$(dirname "$0")/lib.sh"

ensure_node_modules || exit 1
ensure_postgres || exit 1
ensure_chromium || exit 1

TEST_DIR="$DATA_DIR/test"
PG_PORT="${KEEPSTITCH_TEST_PG_PORT:-54339}"
OUT="$ROOT/test-output"
export NODE_ENV=test
export DATABASE_URL="postgres://postgres@127.0.0.1:$PG_PORT/keepstitch_test"
export CHROME_BIN=/usr/bin/chromium

cleanup() {
  pg_remove "$TEST_DIR/pg"
  rm -rf "$TEST_DIR"
}
trap cleanup EXIT
trap 'exit 130' INT TERM

pg_remove "$TEST_DIR/pg"
rm -rf "$TEST_DIR" "$OUT"
mkdir -p "$OUT"
# A throwaway cluster: durability is not needed, speed is.
PG_FSYNC=off pg_up "$TEST_DIR/pg" "$PG_PORT" || exit 1
node --import tsx -e "require('./scripts/db.ts').ensureDatabase(process.env.DATABASE_URL).catch(e => { console.error(e.message); process.exit(1); })" || exit 1

PASSED=0
FAILED=0
SUMMARY=()
record() { # name passed failed
  PASSED=$((PASSED + $2)); FAILED=$((FAILED + $3))
  SUMMARY+=("$(printf '%-22s %5s passed, %s failed' "$1" "$2" "$3")")
}
# Reads {passed, failed} from a results file written by a runner.
counts() { # file kind
  node -e '
    const fs = require("fs");
    const [file, kind] = process.argv.slice(1);
    try {
      const r = JSON.parse(fs.readFileSync(file, "utf8"));
      if (kind === "jest") console.log(r.numPassedTests, r.numFailedTests + r.numRuntimeErrorTestSuites);
      else console.log(r.passed, r.failed);
    } catch { console.log(0, 1); }' "$1" "$2"
}

log "Type-checking every part"
for project in "${TS_PROJECTS[@]}"; do
  if npx tsc --noEmit -p "$project"; then record "tsc $project" 1 0; else record "tsc $project" 0 1; fi
done

log "Every locked package accepts the Node versions package.json promises"
if npx tsx scripts/check-engines.ts; then record "engines" 1 0; else record "engines" 0 1; fi

log "jest: shared maths and server (real PostgreSQL)"
npx jest --ci --json --outputFile="$OUT/jest.json" 2>&1 | grep -v '^\s*$' | tail -n 60
read -r p f < <(counts "$OUT/jest.json" jest); record "jest" "$p" "$f"

# A fault run (each on a PostgreSQL cluster of its own), counted as one check.
fault() { # label log-name lines command...
  local label="$1" out="$OUT/$2.log" lines="$3"; shift 3
  if "$@" >"$out" 2>&1; then
    grep -v -e '^\s*at ' -e '^ok ' "$out" | tail -n "$lines"; record "fault: $label" 1 0
  else
    grep -v '^\s*at ' "$out" | tail -n 40; record "fault: $label" 0 1
  fi
}
log "Faults: PostgreSQL stopped and started again under writes"
fault "db restart" fault-db 7 bash scripts/fault-db.sh
log "Faults: the server killed with SIGKILL mid-upload and started again"
fault "upload kill" fault-upload 17 npm run --silent fault:upload

log "PostgreSQL from a clone in a folder only root can enter"
fault "closed folder" closed-folder 3 bash scripts/check-closed-folder.sh

log "karma: Angular components in headless Chromium"
npx ng test --watch=false --progress=false 2>&1 | tail -n 40
read -r p f < <(counts "$OUT/karma.json" karma); record "karma" "$p" "$f"

log "Production build"
if npx ng build --configuration production --progress=false >"$OUT/build.log" 2>&1; then
  record "ng build" 1 0
else
  cat "$OUT/build.log"; record "ng build" 0 1
fi

log "End-to-end: the real server and Chromium"
npx jest --ci --config e2e/jest.config.js --json --outputFile="$OUT/e2e.json" 2>&1 | grep -v '^\s*$' | tail -n 40
read -r p f < <(counts "$OUT/e2e.json" jest); record "e2e" "$p" "$f"

echo
printf '%s\n' "${SUMMARY[@]}"
echo "$PASSED passed, $FAILED failed"
[ "$FAILED" -eq 0 ]
