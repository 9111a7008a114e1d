#!/usr/bin/env bash
# npm start: install what is missing, build what is not built, then run the whole product.
set -euo pipefail
cd "$(dirname "$0")/../.."

if [ ! -d node_modules ]; then
  echo "[loomwright] Installing dependencies (npm ci)…"
  npm ci --no-audit --no-fund
fi
bash api/scripts/postgres.sh ensure-installed

if [ ! -f shared/dist/index.js ] || [ ! -f api/dist/src/main.js ] || [ ! -f storefront/dist/index.html ] || [ ! -f backoffice/dist/index.html ]; then
  export VITE_CONFIG_NATIVE_IGNORE_WARNING=true
  echo "[loomwright] Building the API and both apps…"
  npm run build
fi

# The invented demo shop (with the sign-ins the README lists) is off unless asked for; npm start asks.
export SEED_DEMO="${SEED_DEMO:-true}"
exec node api/scripts/stack.mjs
