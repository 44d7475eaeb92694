#!/usr/bin/env bash
# npm run bench: prints speed figures. Pure benchmarks run in-process; HTTP ones run
# against a production build on loopback with a seeded database of their own.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
ensure_node_modules
ensure_chromium
pg_start
export PG_ADMIN_URL
ensure_secret
TSX="$ROOT/node_modules/.bin/tsx"

for bench in tests/bench/*.bench.ts; do
  case "$bench" in *schedule.bench.ts|*http*.bench.ts) continue ;; esac
  log "$bench"
  "$TSX" "$bench" || log "$bench failed"
done

ensure_database nightbreak_bench fresh
export DATABASE_URL
DATABASE_URL=$(db_url nightbreak_bench)
"$TSX" scripts/migrate.ts >/dev/null
"$TSX" scripts/seed.ts >/dev/null
if [ ! -f .next/BUILD_ID ] || [ -n "$(find app components lib db -newer .next/BUILD_ID -type f | head -n 1)" ]; then
  log "building the app"
  npx next build > "$DATA_DIR/build.log" 2>&1 || die "next build failed (.data/build.log)"
fi
mkdir -p "$DATA_DIR/bench"
source "$ROOT/scripts/services.sh"
start_services "$(free_port 3200)" "$DATA_DIR/bench"
export BENCH_BASE_URL="$APP_URL"
BENCH_TOKEN=$("$TSX" tests/bench/bench-token.ts admin@nightbreak.test)
export BENCH_TOKEN
for bench in tests/bench/schedule.bench.ts tests/bench/http*.bench.ts; do
  [ -f "$bench" ] || continue
  log "$bench"
  "$TSX" "$bench" || log "$bench failed"
done
stop_services
