#!/usr/bin/env bash
# Debian's Chromium for the Playwright tests; never a browser download.
set -euo pipefail
if [ -x /usr/lib/chromium/chromium ]; then exit 0; fi
if [ "$(id -u)" != "0" ]; then
  echo "Chromium is missing. Install Debian's package: sudo apt-get install -y chromium" >&2
  exit 1
fi
echo "[loomwright] Installing Chromium from Debian's packages (apt-get)…"
apt-get update -qq
DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
