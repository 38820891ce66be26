#!/usr/bin/env bash
# Installs what a fresh machine lacks: Debian packages (only when missing) and node_modules (npm ci when the
# lock file changed since the last install). Safe to run again; does nothing when all is present.
set -euo pipefail
source "$(dirname "$0")/lib.sh"

need=()
command -v mariadbd >/dev/null 2>&1 || [ -x /usr/sbin/mariadbd ] || need+=(mariadb-server)
command -v chromium >/dev/null 2>&1 || need+=(chromium)
command -v ffmpeg >/dev/null 2>&1 || need+=(ffmpeg)
command -v fluidsynth >/dev/null 2>&1 || need+=(fluidsynth)
[ -f /usr/share/sounds/sf2/FluidR3_GM.sf2 ] || need+=(fluid-soundfont-gm)
command -v flock >/dev/null 2>&1 || need+=(util-linux)
if [ ${#need[@]} -gt 0 ]; then
  log "installing Debian packages: ${need[*]}"
  SUDO=""; [ "$(id -u)" -eq 0 ] || SUDO="sudo"
  # One installer at a time, even when start and test run together.
  exec 8>/tmp/tactus-apt.lock; flock 8
  $SUDO apt-get update -qq
  DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq "${need[@]}" >/dev/null
fi

stamp="$ROOT/node_modules/.tactus-lock-hash"
hash="$(sha1sum "$ROOT/package-lock.json" | cut -d' ' -f1)"
if [ ! -f "$stamp" ] || [ "$(cat "$stamp")" != "$hash" ]; then
  log "installing npm packages (npm ci)"
  (cd "$ROOT" && npm ci --no-audit --no-fund --loglevel=error)
  echo "$hash" > "$stamp"
fi
