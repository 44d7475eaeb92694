#!/usr/bin/env bash
# npm run db:up / db:down — start or stop the project-local PostgreSQL cluster.
source "$(dirname "$0")/lib.sh"
case "${1:-start}" in
  start) pg_start; ensure_database nightbreak; echo "DATABASE_URL=$(db_url nightbreak)" ;;
  stop) pg_stop ;;
  url) pg_start >/dev/null; db_url "${2:-nightbreak}"; echo ;;
  *) die "usage: scripts/pg.sh start|stop|url [database]" ;;
esac
