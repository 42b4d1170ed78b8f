#!/usr/bin/env bash
# npm run restore -- FILE [--into URL] [--yes]: puts a backup made by `npm run backup` back — the database replaced
# by the one in the file, the uploads unpacked into the uploads folder.
#   --into URL            the database to restore into (default NUXT_DATABASE_URL, else the project's `emberline`);
#                         it must exist (scripts/pg.sh ensure-db NAME makes one in the project's cluster)
#   --yes                 do not ask (needed when there is no terminal to ask on)
#   EMBERLINE_UPLOAD_DIR  the uploads folder (default .data/uploads)
# Stop every app instance first: the restore replaces every table in one transaction and waits for their locks.
#
# How: one psql transaction drops every schema of the target (DROP fires no row or TRUNCATE trigger, so the audit
# trail's append-only triggers do not object) and replays the dump as pg_restore writes it out. pg_restore creates
# triggers in its post-data section, after the rows are copied in, so neither --disable-triggers nor a superuser is
# needed. A failed restore rolls back and leaves the target exactly as it was. (pg_restore --clean cannot be used:
# it fails on the partitions of pg-boss's job table, "cannot drop inherited constraint".)
source "$(dirname "$0")/lib.sh"
source "$(dirname "$0")/pg-tools.sh"
need_client_tools

usage() { echo "usage: npm run restore -- FILE [--into DATABASE_URL] [--yes]" >&2; exit 2; }
file="" into="" yes=0
while [ $# -gt 0 ]; do
  case "$1" in
    --into) [ $# -ge 2 ] || usage; into=$2; shift 2 ;;
    --into=*) into=${1#--into=}; shift ;;
    --yes|-y) yes=1; shift ;;
    -h|--help) usage ;;
    -*) echo "unknown option $1" >&2; usage ;;
    *) [ -z "$file" ] || usage; file=$1; shift ;;
  esac
done
[ -n "$file" ] || usage
[ -f "$file" ] || { echo "no such file: $file" >&2; exit 2; }

url=${into:-$(database_url)}
upload_dir=${EMBERLINE_UPLOAD_DIR:-$ROOT/.data/uploads}
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT

tar -C "$work" -xf "$file" MANIFEST database.dump uploads.tar 2>/dev/null || { echo "$file is not an Emberline backup (no MANIFEST, database.dump and uploads.tar inside)" >&2; exit 1; }
for part in database_dump:database.dump uploads_tar:uploads.tar; do
  want=$(sed -n "s/^${part%%:*}_sha256=//p" "$work/MANIFEST")
  got=$(sha256sum "$work/${part#*:}" | cut -d' ' -f1)
  [ "$want" = "$got" ] || { echo "$file is damaged: ${part#*:} does not match its checksum in the manifest" >&2; exit 1; }
done

target=$(redact_url "$url")
tables=$(with_url "$url" "$PGBIN/psql" -X -q -At -v ON_ERROR_STOP=1 -c "select count(*) from pg_tables where schemaname not in ('pg_catalog', 'information_schema')") || { echo "cannot reach $target" >&2; exit 1; }
echo "Backup:   $file ($(sed -n 's/^created_utc=//p' "$work/MANIFEST"), $(sed -n 's/^upload_files=//p' "$work/MANIFEST") upload files)"
echo "Database: $target — its $tables tables are dropped and replaced by the backup's"
echo "Uploads:  $upload_dir — the backup's files are unpacked there (other files stay)"
if [ "$yes" != 1 ]; then
  if [ -t 0 ]; then
    read -r -p "Type yes to restore: " answer
    [ "$answer" = yes ] || { echo "Nothing was restored."; exit 1; }
  else
    echo "Refusing to restore without confirmation: no terminal to ask on. Add --yes to restore anyway." >&2
    exit 1
  fi
fi

say "restoring the database into $target"
# The dump names schema public only when its source had recreated it; it is recreated here in any case.
"$PGBIN/pg_restore" --list "$work/database.dump" | grep -Ev '^[0-9]+; [0-9]+ [0-9]+ SCHEMA - public ' > "$work/items"
drop_all=$(with_url "$url" "$PGBIN/psql" -X -q -At -v ON_ERROR_STOP=1 -c "select format('DROP SCHEMA %I CASCADE;', nspname) from pg_namespace where nspname !~ '^pg_' and nspname <> 'information_schema'")
{
  echo "SET client_min_messages = warning;"
  echo "$drop_all"
  echo "CREATE SCHEMA public;"
  "$PGBIN/pg_restore" --no-owner --no-privileges --use-list="$work/items" --file=- "$work/database.dump"
} | with_url "$url" "$PGBIN/psql" -X -q -v ON_ERROR_STOP=1 --single-transaction --file=- >/dev/null
mkdir -p "$upload_dir"
tar -C "$upload_dir" -xf "$work/uploads.tar"
say "restored: $target and $(tar -tf "$work/uploads.tar" | grep -cv '/$' || true) upload files into $upload_dir"
