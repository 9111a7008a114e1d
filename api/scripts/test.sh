#!/usr/bin/env bash
# npm test: the whole suite. ESLint first (zero errors), then unit and API tests (vitest) against
# a PostgreSQL test cluster this script brings up itself, then the Playwright journeys on Debian's Chromium against the product
# started on free ports. Exits non-zero on any failure.
set -euo pipefail
cd "$(dirname "$0")/../.."
root=$(pwd)

if [ ! -d node_modules ]; then
  echo "[loomwright] Installing dependencies (npm ci)…"
  npm ci --no-audit --no-fund
fi
bash api/scripts/postgres.sh ensure-installed
bash api/scripts/ensure-chromium.sh

export VITE_CONFIG_NATIVE_IGNORE_WARNING=true
echo "[loomwright] Format (Prettier) and lint (ESLint), zero errors…"
npm run format:check
npm run lint

echo "[loomwright] Building…"
npm run build

test_pg_data="$root/.data/postgres-test"
test_pg_port=${TEST_PG_PORT:-$(node api/scripts/free-port.mjs)}
cleanup() { bash api/scripts/postgres.sh stop "$test_pg_data" || true; }
trap cleanup EXIT
bash api/scripts/postgres.sh start "$test_pg_data" "$test_pg_port"
export TEST_PG_PORT=$test_pg_port
export TEST_DATABASE_ADMIN_URL="postgres://postgres@127.0.0.1:$test_pg_port/postgres"

echo "[loomwright] Unit and API tests (vitest)…"
npx vitest run

echo "[loomwright] Browser journeys (Playwright on Debian's Chromium)…"
export E2E_PORT=$(node api/scripts/free-port.mjs)
export E2E_PAYMENT_PORT=$(node api/scripts/free-port.mjs)
export E2E_SMTP_PORT=$(node api/scripts/free-port.mjs)
export E2E_MAIL_HTTP_PORT=$(node api/scripts/free-port.mjs)
export E2E_OBJECT_STORE_PORT=$(node api/scripts/free-port.mjs)
(cd e2e && npx playwright test)
