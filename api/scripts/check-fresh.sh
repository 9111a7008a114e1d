#!/usr/bin/env bash
# The newcomer check: clone the committed repository into an empty folder and run the README's two
# commands there, exactly as written, failing if either needs anything the README does not say.
# Usage: npm run check:fresh   (keeps the folder with --keep)
set -euo pipefail
src=$(git -C "$(dirname "$0")" rev-parse --show-toplevel)
dir=$(mktemp -d /tmp/loomwright-fresh.XXXX)
echo "[check:fresh] cloning $src into $dir"
git clone -q "$src" "$dir/loomwright"
cd "$dir/loomwright"
free() { node api/scripts/free-port.mjs; }

# 1. npm start: on ports of its own, so a running copy elsewhere does not interfere.
export PORT=$(free) PG_PORT=$(free) PAYMENT_FAKE_PORT=$(free) MAIL_FAKE_SMTP_PORT=$(free) MAIL_FAKE_HTTP_PORT=$(free)
export PG_DATA=.data/postgres
setsid npm start >"$dir/start.log" 2>&1 &
starter=$!
deadline=$((SECONDS + 900))
until grep -q 'READY' "$dir/start.log"; do
  if ! kill -0 "$starter" 2>/dev/null || [ $SECONDS -gt $deadline ]; then
    echo "[check:fresh] npm start did not come up; last lines:"; tail -n 30 "$dir/start.log"; exit 1
  fi
  sleep 2
done
fail=0
curl -fsS "http://localhost:$PORT/api/health" | grep -q '"db":"up"' || { echo "[check:fresh] /api/health is not up"; fail=1; }
curl -fsS "http://localhost:$PORT/" | grep -q '<div id="root" data-prerendered="/">' || { echo "[check:fresh] the storefront is not served"; fail=1; }
curl -fsS "http://localhost:$PORT/backoffice/" | grep -q '<div id="root">' || { echo "[check:fresh] the backoffice is not served"; fail=1; }
# Ctrl-C, as a person would press it: the whole process group gets SIGINT.
kill -INT -- "-$starter" 2>/dev/null || true
wait "$starter" || true
if bash api/scripts/postgres.sh status "$PG_DATA" >/dev/null 2>&1; then
  echo "[check:fresh] PostgreSQL was still running after Ctrl-C"; fail=1
fi
[ $fail -eq 0 ] || exit 1
echo "[check:fresh] npm start served the storefront, the backoffice and a healthy API, and Ctrl-C stopped it all"
unset PORT PG_PORT PAYMENT_FAKE_PORT MAIL_FAKE_SMTP_PORT MAIL_FAKE_HTTP_PORT PG_DATA

# 2. npm test.
npm test
echo "[check:fresh] npm test passed in a fresh clone"
[ "${1:-}" = "--keep" ] || rm -rf "$dir"
