#!/usr/bin/env bash
# The built-in test mail server (scripts/fake-smtp.ts) in the background, on 127.0.0.1.
# Usage: scripts/mail.sh start|stop|status
#   EMBERLINE_FAKE_SMTP_PORT  port (default 2525); each port has its own pid file and log in .data/
#   NUXT_DATABASE_URL         the database whose captured_mail table receives the messages (start)
# A second start on the same port is a no-op while the running server stores into the same database.
source "$(dirname "$0")/lib.sh"

PORT="${EMBERLINE_FAKE_SMTP_PORT:-2525}"
if [ "$PORT" = 2525 ]; then NAME=fake-smtp; else NAME="fake-smtp-$PORT"; fi
PID_FILE="$DATA/$NAME.pid"
DB_FILE="$DATA/$NAME.db"
LOG_FILE="$DATA/$NAME.log"

# The pid of our running server on this port, or nothing (a stale pid file or a reused pid does not count).
running_pid() {
  [ -f "$PID_FILE" ] || return 0
  local pid; pid=$(cat "$PID_FILE" 2>/dev/null || true)
  if [ -n "$pid" ] && kill -0 "$pid" 2>/dev/null && tr '\0' ' ' < "/proc/$pid/cmdline" 2>/dev/null | grep -q 'fake-smtp'; then
    echo "$pid"
  fi
}

stop() {
  local pid; pid=$(running_pid)
  if [ -n "$pid" ]; then
    kill "$pid" 2>/dev/null || true
    for _ in $(seq 1 50); do kill -0 "$pid" 2>/dev/null || break; sleep 0.1; done
    say "test mail server on 127.0.0.1:$PORT stopped"
  fi
  rm -f "$PID_FILE" "$DB_FILE"
}

start() {
  : "${NUXT_DATABASE_URL:?NUXT_DATABASE_URL must name the database that receives the messages}"
  # Which database a running server stores into, kept as a hash (the URL holds a password).
  local db_hash; db_hash=$(printf '%s' "$NUXT_DATABASE_URL" | sha256sum | cut -d' ' -f1)
  local pid; pid=$(running_pid)
  if [ -n "$pid" ]; then
    if [ "$(cat "$DB_FILE" 2>/dev/null || true)" = "$db_hash" ]; then
      say "test mail server already running on 127.0.0.1:$PORT"
      return 0
    fi
    say "test mail server on 127.0.0.1:$PORT stores into another database: restarting it"
    stop
  fi
  rm -f "$PID_FILE"
  echo "$db_hash" > "$DB_FILE"
  # Its own session, so that stopping the app (Ctrl-C) leaves it running for the next start.
  cd "$ROOT"
  EMBERLINE_FAKE_SMTP_PORT="$PORT" EMBERLINE_FAKE_SMTP_PID_FILE="$PID_FILE" \
    setsid node --import tsx scripts/fake-smtp.ts >>"$LOG_FILE" 2>&1 </dev/null &
  local child=$!
  # The server writes its pid file once it listens.
  for _ in $(seq 1 150); do
    if [ -n "$(running_pid)" ]; then
      say "test mail server listening on 127.0.0.1:$PORT (messages appear on the admin's Mail page; log .data/$NAME.log)"
      return 0
    fi
    kill -0 "$child" 2>/dev/null || break
    sleep 0.1
  done
  kill "$child" 2>/dev/null || true
  rm -f "$DB_FILE"
  echo "The test mail server did not start on 127.0.0.1:$PORT; the end of .data/$NAME.log:" >&2
  tail -n 15 "$LOG_FILE" >&2 || true
  return 1
}

case "${1:-status}" in
  start) start ;;
  stop) stop ;;
  status)
    pid=$(running_pid)
    if [ -n "$pid" ]; then echo "test mail server running on 127.0.0.1:$PORT (pid $pid)"; else echo "test mail server not running on port $PORT"; exit 1; fi
    ;;
  *) echo "usage: scripts/mail.sh start|stop|status"; exit 2 ;;
esac
