#!/usr/bin/env bash
# npm test: the same setup as the demo on a database of its own, then every unit,
# integration and browser test, then one closing line with the totals.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

ensure_node_modules
ensure_chromium
NIGHTBREAK_PG_FAST=1 pg_start
export PG_ADMIN_URL
ensure_secret

RESULTS="$DATA_DIR/test-results"
rm -rf "$RESULTS"; mkdir -p "$RESULTS"
status=0

log "unit and integration tests (Vitest, real PostgreSQL)"
npx vitest run --reporter=default --reporter=json --outputFile.json="$RESULTS/vitest.json" || status=1

log "building the app for the browser tests"
npx next build > "$RESULTS/build.log" 2>&1 || { tail -n 40 "$RESULTS/build.log"; die "next build failed"; }

ensure_database nightbreak_e2e fresh
export DATABASE_URL
DATABASE_URL=$(db_url nightbreak_e2e)
npx tsx scripts/migrate.ts >/dev/null
npx tsx scripts/seed.ts

source "$ROOT/scripts/services.sh"
start_services "$(free_port 3100)" "$RESULTS"

log "browser tests (Playwright, Debian's chromium) against $APP_URL"
E2E_BASE_URL="$APP_URL" npx playwright test || status=1

stop_services
node scripts/test-summary.mjs "$RESULTS" || status=1
exit $status
