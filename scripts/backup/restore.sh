#!/usr/bin/env bash
# Restores a dump of scripts/backup/backup.sh into a NEW, empty database (created here when it does not
# exist), in one transaction: all or nothing. Then updates the planner statistics.
#
#   scripts/backup/restore.sh DUMP TARGET_DATABASE
#
# Connection: PGHOST, PGPORT, PGUSER and PGPASSWORD / ~/.pgpass as for backup.sh; PGUSER should be the user
# the service connects with (objects are restored owned by it: --no-owner), or a superuser followed by
# ALTER ... OWNER. It refuses a target that already has tables: restore next to the damaged database, check
# it, then point the service at it (or rename the databases while the service is stopped).
# After a restore, (re)start the service: it must not keep in-memory copies of readings made before the
# restore (DEVELOPERS.md, "Ingest"). docs/operations.md has the procedure.
set -euo pipefail

[ $# -eq 2 ] || { echo "usage: $0 DUMP TARGET_DATABASE" >&2; exit 2; }
dump="$1"
target="$2"
[ -f "$dump" ] || { echo "restore: no file $dump" >&2; exit 2; }
[[ "$target" =~ ^[a-z_][a-z0-9_]*$ ]] || { echo "restore: database name must match [a-z_][a-z0-9_]*" >&2; exit 2; }
command -v pg_restore >/dev/null || { echo "restore: pg_restore not found (Debian: postgresql-client)" >&2; exit 2; }

if [ -f "$dump.sha256" ]; then
  (cd "$(dirname "$dump")" && sha256sum --quiet --check "$(basename "$dump").sha256" >&2) \
    || { echo "restore: $dump does not match its checksum file" >&2; exit 1; }
fi
pg_restore --list "$dump" >/dev/null

exists=$(psql -d postgres -tAX -v ON_ERROR_STOP=1 -c "SELECT 1 FROM pg_database WHERE datname = '$target'")
if [ "$exists" != "1" ]; then
  echo "restore: creating database $target" >&2
  psql -d postgres -qX -v ON_ERROR_STOP=1 -c "CREATE DATABASE $target"
else
  tables=$(psql -d "$target" -tAX -v ON_ERROR_STOP=1 \
    -c "SELECT count(*) FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace
        WHERE c.relkind IN ('r', 'p') AND n.nspname NOT IN ('pg_catalog', 'information_schema')")
  [ "$tables" = "0" ] || { echo "restore: database $target already has $tables tables; restore into a new one" >&2; exit 1; }
fi

echo "restore: restoring $dump into $target" >&2
pg_restore --dbname="$target" --single-transaction --exit-on-error --no-owner "$dump"
psql -d "$target" -qX -v ON_ERROR_STOP=1 -c "ANALYZE"
echo "restore: done. Point the service at $target and (re)start it." >&2
