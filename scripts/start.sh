#!/usr/bin/env bash
# One command from a fresh machine to a running Sagline with the demo basin:
# npm packages, PostgreSQL (Debian's, private cluster on 127.0.0.1), migrations,
# demo data, production build, server on http://127.0.0.1:3000.
#   npm start            build and serve
#   npm start -- --dev   serve with `next dev` instead
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib-setup.sh"
cd "$ROOT"

MODE="${1:-}"
PORT="${PORT:-3000}"

ensure_node_modules
say "Starting PostgreSQL"
bash scripts/db.sh start
export DATABASE_URL="${DATABASE_URL:-$(bash scripts/db.sh url)}"
ensure_secret
export NEXTAUTH_URL="${NEXTAUTH_URL:-http://127.0.0.1:$PORT}"

say "Migrating the database"
npx tsx scripts/migrate.ts latest
say "Loading the demo basin"
npx tsx scripts/seed.ts

if [ "$MODE" != "--dev" ]; then
  say "Building"
  npx next build
fi

say "Starting the local fake SMTP server (messages kept in .data/mail, listed at /dev/mail)"
export SAGLINE_SMTP_PORT="${SAGLINE_SMTP_PORT:-2525}"
export SMTP_URL="${SMTP_URL:-smtp://127.0.0.1:$SAGLINE_SMTP_PORT}"
export SAGLINE_DEV_PAGES="${SAGLINE_DEV_PAGES:-1}"
setsid npx tsx scripts/fake-smtp.ts &
SMTP_PID=$!

# Run a command again whenever it exits (a crash, an out-of-memory kill), waiting
# 1, 2, 4 … up to 30 s between tries; after a minute of running the wait starts
# again at 1 s. Stopping the loop's process group stops the loop and the command.
supervise() {
  local name="$1" delay=1 started status
  shift
  while true; do
    started=$SECONDS
    status=0
    "$@" || status=$?
    if (( SECONDS - started >= 60 )); then delay=1; fi
    echo "[start] the $name exited (status $status); starting it again in $delay s" >&2
    sleep "$delay"
    delay=$(( delay * 2 > 30 ? 30 : delay * 2 ))
  done
}

say "Starting the background worker (model and allocation runs, e-mail outbox), restarted if it exits"
# its own process group, so stopping it also stops the loop and the node process under npx
setsid bash -c "$(declare -f supervise); supervise worker npx tsx scripts/worker.ts" &
WORKER_PID=$!
trap 'kill -- "-$WORKER_PID" 2>/dev/null || true; kill -- "-$SMTP_PID" 2>/dev/null || true' EXIT INT TERM

if [ "$MODE" = "--dev" ]; then
  say "Serving (development) on http://127.0.0.1:$PORT"
  npx next dev -H 127.0.0.1 -p "$PORT"
else
  say "Serving on http://127.0.0.1:$PORT  (Ctrl-C stops the web server and the worker; 'npm run db -- stop' stops PostgreSQL)"
  npx next start -H 127.0.0.1 -p "$PORT"
fi
