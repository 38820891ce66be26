#!/usr/bin/env bash
# npm test: the same set-up as npm start (packages, MariaDB, web build), then every jest project. The test
# server, its database (tactus_test, reset each run) and its mail catcher are started by tests/setup/.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
started=$(date +%s)

bash "$ROOT/scripts/ensure-deps.sh"
bash "$ROOT/scripts/mariadb.sh"

log "building the web app for the browser tests"
(cd "$ROOT" && npm run build:web >"$TACTUS_STATE/logs/web-build.log" 2>&1) \
  || { tail -30 "$TACTUS_STATE/logs/web-build.log" >&2; exit 1; }

log "set-up took $(( $(date +%s) - started )) s; checking conventions (lint, types)"
cd "$ROOT"
status=0
npm run --silent lint || { status=1; log "npm run lint found problems (above)"; }
npm run --silent typecheck || { status=1; log "npm run typecheck found problems (above)"; }

log "running the tests"
results="$TACTUS_STATE/jest-results.json"
npx jest --ci --json --outputFile="$results" "$@" || status=$?
# One plain closing line that any reader of the log understands.
node "$ROOT/tests/setup/summary.js" "$results" || true
log "npm test took $(( $(date +%s) - started )) s"
exit $status
