# Shared by start.sh, test.sh and .ci/run: paths and small helpers. Sourced, never run.
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
export TACTUS_ROOT="$ROOT"
export TACTUS_STATE="${TACTUS_STATE:-$ROOT/.tactus}"   # git-ignored: database files, caught mail, uploads, logs
export TACTUS_DB_HOST=127.0.0.1
export TACTUS_DB_PORT="${TACTUS_DB_PORT:-3406}"
export TACTUS_DB_USER="${TACTUS_DB_USER:-tactus}"
export TACTUS_DB_PASSWORD="${TACTUS_DB_PASSWORD:-tactus-local}"
export TACTUS_SMTP_PORT="${TACTUS_SMTP_PORT:-2526}"
export TACTUS_MAIL_DIR="${TACTUS_MAIL_DIR:-$TACTUS_STATE/mail}"
export EXPO_NO_TELEMETRY=1
mkdir -p "$TACTUS_STATE/logs"

log() { printf '\033[1;36m[tactus]\033[0m %s\n' "$*" >&2; }
