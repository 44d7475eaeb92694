#!/usr/bin/env bash
# npm run demo: install what is missing, start PostgreSQL, migrate, seed an empty
# database, build, start the app (and the local fakes), print where and how to sign in.
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

ensure_node_modules
pg_start
export PG_ADMIN_URL
ensure_database nightbreak
export DATABASE_URL="${DATABASE_URL:-$(db_url nightbreak)}"
npx tsx scripts/migrate.ts
npx tsx scripts/seed.ts
ensure_secret

log "building the app (about a minute)"
npx next build > "$DATA_DIR/build.log" 2>&1 || { tail -n 40 "$DATA_DIR/build.log"; die "next build failed (log: .data/build.log)"; }

mkdir -p "$DATA_DIR/logs"
source "$ROOT/scripts/services.sh"
start_services "${PORT:-$(free_port 3000)}" "$DATA_DIR/logs"

cat <<MSG

  Nightbreak is running at $APP_URL
  Health: $APP_URL/api/health      Logs: .data/logs/

  Demo sign-ins (password: nightbreak-demo)
    pi@nightbreak.test         principal investigator
    director@nightbreak.test   director
    observer@nightbreak.test   observer
    night@nightbreak.test      night assistant
    admin@nightbreak.test      administrator

  Ctrl-C stops the app; PostgreSQL keeps running (npm run db:down stops it).

MSG
wait
