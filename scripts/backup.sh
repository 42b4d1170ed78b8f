#!/usr/bin/env bash
# npm run backup: one file with everything Emberline keeps — the database (pg_dump custom format) and the uploaded
# photos and certificates — in backups/emberline-<UTC time>.tar. Restore it with `npm run restore -- FILE`.
#   NUXT_DATABASE_URL     the database to back up (default: the project's own cluster, database `emberline`)
#   EMBERLINE_UPLOAD_DIR  the uploads folder (default .data/uploads; may be empty or missing)
#   EMBERLINE_BACKUP_DIR  where the file goes (default backups/, git-ignored)
# The app may keep running: pg_dump reads one consistent snapshot without blocking writers. The database is dumped
# before the files are packed, so every file a dumped record names is already there (uploads are written before the
# record that names them and are never changed afterwards).
source "$(dirname "$0")/lib.sh"
source "$(dirname "$0")/pg-tools.sh"
need_client_tools

url=$(database_url)
upload_dir=${EMBERLINE_UPLOAD_DIR:-$ROOT/.data/uploads}
out_dir=${EMBERLINE_BACKUP_DIR:-$ROOT/backups}
mkdir -p "$out_dir"
stamp=$(date -u +%Y%m%dT%H%M%SZ)
out="$out_dir/emberline-$stamp.tar"
n=1
while [ -e "$out" ]; do n=$((n + 1)); out="$out_dir/emberline-$stamp-$n.tar"; done

work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT

say "dumping $(redact_url "$url") with $PGBIN/pg_dump"
with_url "$url" "$PGBIN/pg_dump" --format=custom --compress=6 --no-password --file="$work/database.dump"

if [ -d "$upload_dir" ]; then
  files=$(find "$upload_dir" -type f | wc -l)
  tar -C "$upload_dir" -cf "$work/uploads.tar" .
else
  files=0
  tar -cf "$work/uploads.tar" --files-from /dev/null
fi

{
  echo "Emberline backup"
  echo "created_utc=$stamp"
  echo "database=$(redact_url "$url")"
  echo "pg_dump=$("$PGBIN/pg_dump" --version)"
  echo "upload_files=$files"
  echo "database_dump_sha256=$(sha256sum "$work/database.dump" | cut -d' ' -f1)"
  echo "uploads_tar_sha256=$(sha256sum "$work/uploads.tar" | cut -d' ' -f1)"
} > "$work/MANIFEST"

# Written under a temporary name and moved into place: a half-written backup never carries the final name.
tar -C "$work" -cf "$out.partial" MANIFEST database.dump uploads.tar
mv "$out.partial" "$out"
say "backup written: $out"
echo "  database  $(redact_url "$url")  ($(du -h "$work/database.dump" | cut -f1) compressed dump)"
echo "  uploads   $upload_dir  ($files files)"
echo "  restore   npm run restore -- $out"
