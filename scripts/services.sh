# start_services PORT LOGDIR: starts the built app (and the local fakes) in the background,
# waits until /api/health answers, and sets APP_URL. stop_services ends what it started.
SERVICE_PIDS=()

start_services() {
  local port=$1 logs=$2
  export APP_URL="http://127.0.0.1:$port"
  export NEXTAUTH_URL="$APP_URL"
  (cd "$ROOT" && exec npx next start -p "$port" -H 127.0.0.1) > "$logs/app.log" 2>&1 &
  SERVICE_PIDS+=($!)
  trap stop_services EXIT INT TERM
  if ! wait_http "$APP_URL/api/health" 90; then
    tail -n 40 "$logs/app.log" >&2
    die "the app did not become healthy at $APP_URL"
  fi
}

stop_services() {
  local pid
  for pid in "${SERVICE_PIDS[@]:-}"; do
    [ -n "$pid" ] || continue
    pkill -TERM -P "$pid" 2>/dev/null || true
    kill -TERM "$pid" 2>/dev/null || true
  done
  SERVICE_PIDS=()
}
