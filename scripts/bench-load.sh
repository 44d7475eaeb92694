#!/usr/bin/env bash
# npm run bench:load: autocannon (and, for approvals, a small timed loop) against the
# production build on loopback, on a freshly seeded database of its own; prints p50, p95,
# p99 and throughput for the visibility route, the schedule, tonight's queue, request
# submission and approval. Each run is bounded (BENCH_LOAD_SECONDS, default 8 s).
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
ensure_node_modules
pg_start
export PG_ADMIN_URL
ensure_secret
TSX="$ROOT/node_modules/.bin/tsx"

source "$ROOT/scripts/services.sh"
start_bench_app nightbreak_bench_load "$DATA_DIR/bench-load"
BENCH_TOKEN=$("$TSX" tests/bench/bench-token.ts admin@nightbreak.test)
BENCH_PI_TOKEN=$("$TSX" tests/bench/bench-token.ts pi@nightbreak.test)
BENCH_DIRECTOR_TOKEN=$("$TSX" tests/bench/bench-token.ts director@nightbreak.test)
export BENCH_TOKEN BENCH_PI_TOKEN BENCH_DIRECTOR_TOKEN

log "load against $APP_URL on $(nproc) CPUs ($(uname -m)), $(date -u +%Y-%m-%dT%H:%MZ)"
status=0
for run in tests/bench/load/[0-9]*.ts; do
  log "$run"
  "$TSX" "$run" || { log "$run failed"; status=1; }
done
stop_services
exit $status
