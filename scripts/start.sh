#!/usr/bin/env bash
# npm start: install what is missing, start MariaDB and the mail catcher, build the web app, migrate, seed the
# demo studio once and serve everything at one URL. Ctrl-C stops the server and the catcher (MariaDB stays up).
set -euo pipefail
source "$(dirname "$0")/lib.sh"
started=$(date +%s)

bash "$ROOT/scripts/ensure-deps.sh"
bash "$ROOT/scripts/mariadb.sh"

export TACTUS_DB_NAME=tactus_dev
export TACTUS_PORT="${TACTUS_PORT:-4610}"
export TACTUS_PUBLIC_URL="${TACTUS_PUBLIC_URL:-http://127.0.0.1:$TACTUS_PORT}"
export TACTUS_SERVE_WEB=1
# One JSON line per request goes to the log file, not the console (server/log.ts).
export TACTUS_LOG_FILE="${TACTUS_LOG_FILE:-$TACTUS_STATE/logs/server.log}"

"$ROOT/node_modules/.bin/tsx" "$ROOT/server/mail/catcher-cli.ts" &
catcher=$!
trap 'kill $catcher 2>/dev/null || true' EXIT

log "building the web app"
(cd "$ROOT" && npm run build:web >"$TACTUS_STATE/logs/web-build.log" 2>&1) \
  || { tail -30 "$TACTUS_STATE/logs/web-build.log" >&2; exit 1; }

"$ROOT/node_modules/.bin/tsx" "$ROOT/server/scripts/seed.ts"
log "ready in $(( $(date +%s) - started )) s: open $TACTUS_PUBLIC_URL (caught mail: $TACTUS_PUBLIC_URL/dev/mail)"
"$ROOT/node_modules/.bin/tsx" "$ROOT/server/index.ts"
