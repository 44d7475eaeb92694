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

source "$ROOT/scripts/services.sh"
start_bench_app nightbreak_bench "$DATA_DIR/bench"
BENCH_TOKEN=$("$TSX" tests/bench/bench-token.ts admin@nightbreak.test)
export BENCH_TOKEN
for bench in tests/bench/schedule.bench.ts tests/bench/http*.bench.ts; do
  [ -f "$bench" ] || continue
  log "$bench"
  "$TSX" "$bench" || log "$bench failed"
done
stop_services
