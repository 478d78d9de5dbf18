#!/usr/bin/env bash
# Backs up the Kwanta database with pg_dump: every table, among them the daily partitions of reading and
# evaluation (each partition with its rows), the sequences (reading_generation), Flyway's history and the
# API keys' hashes. One file in pg_dump's custom format, checked with pg_restore --list, and its SHA-256.
#
#   scripts/backup/backup.sh [OUTPUT]        default OUTPUT: kwanta-<database>-<UTC time>.dump
#
# Connection: the libpq variables PGHOST, PGPORT, PGUSER, PGDATABASE (default kwanta), and PGPASSWORD or a
# ~/.pgpass file (never a password on the command line). Needs pg_dump and pg_restore of the server's major
# version or later (Debian: postgresql-client-15). The dump is consistent (one snapshot) while ingest goes
# on; it waits at most BACKUP_LOCK_WAIT (default 60s) for its table locks, e.g. behind a retention run
# dropping old partitions, then fails rather than hold up the ingest. docs/operations.md has the procedure.
set -euo pipefail

export PGDATABASE="${PGDATABASE:-kwanta}"
out="${1:-kwanta-${PGDATABASE}-$(date -u +%Y%m%dT%H%M%SZ).dump}"
[ -e "$out" ] && { echo "backup: $out exists; refusing to overwrite it" >&2; exit 2; }
command -v pg_dump >/dev/null || { echo "backup: pg_dump not found (Debian: postgresql-client)" >&2; exit 2; }

tmp="$out.partial"
trap 'rm -f "$tmp"' EXIT
echo "backup: dumping database $PGDATABASE on ${PGHOST:-local socket}:${PGPORT:-5432} to $out" >&2
pg_dump --format=custom --compress=6 --lock-wait-timeout="${BACKUP_LOCK_WAIT:-60s}" --file="$tmp"
# the archive must be readable before it counts as a backup
pg_restore --list "$tmp" >/dev/null
mv "$tmp" "$out"
trap - EXIT
(cd "$(dirname "$out")" && sha256sum "$(basename "$out")") >"$out.sha256"
echo "backup: done: $out ($(du -h "$out" | cut -f1)), checksum in $out.sha256" >&2
