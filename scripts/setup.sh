#!/usr/bin/env bash
# Installs what the test pass needs on a fresh Debian machine: Chromium for the browser tests,
# PostgreSQL for the real-server integration run, and the npm packages from the lock file.
set -euo pipefail
cd "$(dirname "$0")/.."

need_apt=()
command -v chromium >/dev/null 2>&1 || [ -x /usr/bin/chromium ] || need_apt+=(chromium)
if ! command -v initdb >/dev/null 2>&1 && ! ls /usr/lib/postgresql/*/bin/initdb >/dev/null 2>&1; then
  need_apt+=(postgresql)
fi
if [ ${#need_apt[@]} -gt 0 ]; then
  SUDO=""; [ "$(id -u)" -ne 0 ] && SUDO="sudo"
  $SUDO apt-get update -qq
  DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq "${need_apt[@]}"
fi
npm ci --no-audit --no-fund
