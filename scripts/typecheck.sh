#!/usr/bin/env bash
# npm run typecheck: every TypeScript project, no emit; stops at the first that fails.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh
for project in "${TS_PROJECTS[@]}"; do
  log "tsc -p $project"
  npx tsc --noEmit -p "$project"
done
