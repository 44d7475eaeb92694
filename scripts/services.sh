# start_services PORT LOGDIR: starts the built app (and the local fakes) in the background,
# waits until /api/health answers, and sets APP_URL. stop_services ends what it started.
SERVICE_PIDS=()

start_services() {
  local port=$1 logs=$2
  export APP_URL="http://127.0.0.1:$port"
  export NEXTAUTH_URL="$APP_URL"
  trap stop_services EXIT INT TERM
  start_fakes "$logs"
  # setsid: the app gets a process group of its own, so stop_services can end all of it.
  setsid bash -c 'cd "$0" && exec node_modules/.bin/next start -p "$1" -H 127.0.0.1' "$ROOT" "$port" > "$logs/app.log" 2>&1 &
  SERVICE_PIDS+=($!)
  if ! wait_http "$APP_URL/api/health" 90; then
    tail -n 40 "$logs/app.log" >&2
    die "the app did not become healthy at $APP_URL"
  fi
}

# start_fakes LOGDIR: the local e-mail and upload fakes on free ports, storing under LOGDIR,
# and the variables that point the app's SDKs at them. Started with tsx directly (npx
# would not pass signals on), so stop_services can end them.
start_fakes() {
  local logs=$1 email_port upload_port
  email_port=$(free_port 4010)
  upload_port=$(free_port $((email_port + 1)))
  UPLOADTHING_TOKEN=$(cd "$ROOT" && node_modules/.bin/tsx --eval 'import { buildUploadThingToken } from "./lib/uploads/token.ts"; console.log(buildUploadThingToken())')
  export UPLOADTHING_TOKEN
  FAKE_EMAIL_PORT=$email_port FAKE_EMAIL_DIR="$logs/fake-email" FAKE_UPLOAD_PORT=$upload_port FAKE_UPLOAD_DIR="$logs/fake-uploads" \
    setsid bash -c 'cd "$0" && exec node_modules/.bin/tsx scripts/fakes/start.ts' "$ROOT" > "$logs/fakes.log" 2>&1 &
  SERVICE_PIDS+=($!)
  export RESEND_BASE_URL="http://127.0.0.1:$email_port"
  export RESEND_API_KEY="re_local_nightbreak_fake"
  export UPLOADTHING_INGEST_URL="http://127.0.0.1:$upload_port"
  export UPLOADTHING_API_URL="http://127.0.0.1:$upload_port"
  if ! wait_http "$RESEND_BASE_URL/_control" 30 || ! wait_http "$UPLOADTHING_API_URL/_files" 30; then
    tail -n 20 "$logs/fakes.log" >&2
    die "the local e-mail and upload fakes did not start"
  fi
}

stop_services() {
  local pid
  for pid in "${SERVICE_PIDS[@]:-}"; do
    [ -n "$pid" ] || continue
    # Each service leads its own process group (setsid): end the whole group.
    kill -TERM -- "-$pid" 2>/dev/null || kill -TERM "$pid" 2>/dev/null || true
  done
  SERVICE_PIDS=()
}

# start_bench_app DBNAME LOGDIR: a freshly seeded database of its own, a production build
# (rebuilt when any source or config is newer than it) and the app and fakes started on
# it; exports DATABASE_URL and BENCH_BASE_URL. For scripts/bench.sh and bench-load.sh.
start_bench_app() {
  local db=$1 logs=$2 tsx="$ROOT/node_modules/.bin/tsx"
  ensure_database "$db" fresh
  export DATABASE_URL
  DATABASE_URL=$(db_url "$db")
  "$tsx" scripts/migrate.ts >/dev/null
  "$tsx" scripts/seed.ts >/dev/null
  if [ ! -f .next/BUILD_ID ] || [ -n "$(find app components lib db emails next.config.mjs tailwind.config.ts -newer .next/BUILD_ID -type f | head -n 1)" ]; then
    log "building the app"
    npx next build > "$DATA_DIR/build.log" 2>&1 || die "next build failed (.data/build.log)"
  fi
  mkdir -p "$logs"
  start_services "$(free_port 3300)" "$logs"
  export BENCH_BASE_URL="$APP_URL"
}
