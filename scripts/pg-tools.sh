# PostgreSQL client tools for backup.sh, restore.sh and reconcile.sh: which database, which binaries, and how to
# hand them a password without showing it in the process list. Sourced after lib.sh, not run.

# The database the app uses: NUXT_DATABASE_URL, or the project's own cluster (started if needed), database `emberline`.
database_url() {
  if [ -n "${NUXT_DATABASE_URL:-}" ]; then
    echo "$NUXT_DATABASE_URL"
  else
    load_secrets
    bash "$ROOT/scripts/pg.sh" start >&2
    local_db_url emberline
  fi
}

# Client binaries: the newest /usr/lib/postgresql/*/bin (as scripts/pg.sh), else those on PATH. pg_dump must be at
# least as new as the server it dumps; EMBERLINE_PG_BIN points at another folder (e.g. a newer client for a managed server).
find_client_bin() {
  local dir
  if [ -n "${EMBERLINE_PG_BIN:-}" ]; then echo "$EMBERLINE_PG_BIN"; return 0; fi
  for dir in $(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V -r); do
    [ -x "$dir/pg_dump" ] && [ -x "$dir/pg_restore" ] && { echo "$dir"; return 0; }
  done
  command -v pg_dump >/dev/null 2>&1 && { dirname "$(command -v pg_dump)"; return 0; }
  return 1
}
# Sets PGBIN, installing the client tools when none are found.
need_client_tools() {
  PGBIN=$(find_client_bin || true)
  if [ -z "$PGBIN" ]; then
    say "PostgreSQL client tools are missing: installing the Debian package 'postgresql-client' (apt-get)"
    export DEBIAN_FRONTEND=noninteractive
    apt-get update -qq && apt-get install -y -qq --no-install-recommends postgresql-client >/dev/null
    PGBIN=$(find_client_bin)
  fi
}

# The URL without its password, for messages and manifests.
redact_url() { node -e 'const u = new URL(process.argv[1]); if (u.password) u.password = "***"; console.log(u.toString())' "$1"; }

# Runs a client tool against URL with the password in PGPASSWORD, not on the command line.
with_url() {
  local url=$1; shift
  local bare password
  bare=$(node -e 'const u = new URL(process.argv[1]); u.password = ""; console.log(u.toString())' "$url")
  password=$(node -e 'console.log(decodeURIComponent(new URL(process.argv[1]).password))' "$url")
  PGPASSWORD="$password" "$@" --dbname="$bare"
}
