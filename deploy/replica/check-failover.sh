#!/usr/bin/env bash
# Failover on real PostgreSQL tooling, loopback only: a PostgreSQL 15 primary and a streaming replica
# (initdb, pg_basebackup -R, synchronous replication) in a temporary directory on free ports, the packaged
# service on a two-host URL (targetServerType=primary) with the replica as its read replica, a sustained
# ingest (failover_ingest.py), then the primary is stopped (immediate: a crash), the replica promoted
# (pg_ctl promote), and every acknowledged reading must be found exactly once on the new primary.
# Prints the figures; exit 1 when a reading is missing or doubled. Cleans up its processes and directory.
#
#   bash deploy/replica/check-failover.sh            # needs service/target/kwanta-service.jar
#   BEFORE=20 AFTER=20 STOP_MODE=fast bash deploy/replica/check-failover.sh
set -euo pipefail

ROOT=$(cd "$(dirname "$0")/../.." && pwd)
PGBIN=${PGBIN:-/usr/lib/postgresql/15/bin}
JAR=${JAR:-$ROOT/service/target/kwanta-service.jar}
BEFORE=${BEFORE:-15}   # seconds of ingest before the primary stops
PROMOTE_AFTER=${PROMOTE_AFTER:-2}  # seconds between the stop and pg_ctl promote (detection time)
AFTER=${AFTER:-15}     # seconds of ingest after the promotion
STOP_MODE=${STOP_MODE:-immediate}
[ -x "$PGBIN/pg_ctl" ] || { echo "no PostgreSQL 15 binaries in $PGBIN" >&2; exit 2; }
[ -f "$JAR" ] || { echo "no $JAR: mvn -B -ntp -o -q package -DskipTests" >&2; exit 2; }

WORK=$(mktemp -d /tmp/kwanta-failover.XXXXXX)
SERVICE_PID=""
INGEST_PID=""
AS=()
if [ "$(id -u)" = 0 ]; then
  # PostgreSQL refuses to run as root
  chown postgres: "$WORK"
  AS=(runuser -u postgres --)
fi
pg() { "${AS[@]}" "$PGBIN/$@"; }

cleanup() {
  set +e
  [ -n "$INGEST_PID" ] && kill "$INGEST_PID" 2>/dev/null
  if [ -n "$SERVICE_PID" ]; then
    kill "$SERVICE_PID" 2>/dev/null
    for _ in $(seq 50); do kill -0 "$SERVICE_PID" 2>/dev/null || break; sleep 0.2; done
    kill -9 "$SERVICE_PID" 2>/dev/null
  fi
  for d in primary replica; do
    [ -f "$WORK/$d/postmaster.pid" ] && pg pg_ctl -D "$WORK/$d" -m immediate stop >/dev/null 2>&1
  done
  rm -rf "$WORK"
}
trap cleanup EXIT INT TERM

. "$ROOT/deploy/replica/failover_common.sh"
take_port P1; take_port P2; take_port P3
now() { date +%s.%N; }

echo "work directory $WORK; primary :$P1, replica :$P2, service :$P3"
pg initdb -D "$WORK/primary" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 >/dev/null
cat >> "$WORK/primary/postgresql.conf" <<CONF
listen_addresses = '127.0.0.1'
port = $P1
unix_socket_directories = '$WORK'
wal_level = replica
max_wal_senders = 5
hot_standby = on
max_connections = 60
shared_buffers = 128MB
fsync = on
CONF
pg pg_ctl -D "$WORK/primary" -l "$WORK/primary.log" -w start >/dev/null
"${AS[@]}" psql -h 127.0.0.1 -p "$P1" -U postgres -qAtc "CREATE DATABASE kwanta" postgres

pg pg_basebackup -h 127.0.0.1 -p "$P1" -U postgres -D "$WORK/replica" -R -X stream >/dev/null
echo "port = $P2" >> "$WORK/replica/postgresql.auto.conf"
pg pg_ctl -D "$WORK/replica" -l "$WORK/replica.log" -w start >/dev/null
# synchronous replication: a commit is acknowledged only when the replica has it (set after the base
# backup, so the promoted replica does not wait for a standby of its own)
echo "synchronous_standby_names = '*'" >> "$WORK/primary/postgresql.conf"
pg pg_ctl -D "$WORK/primary" reload >/dev/null
for _ in $(seq 50); do
  state=$("${AS[@]}" psql -h 127.0.0.1 -p "$P1" -U postgres -qAtc "SELECT sync_state FROM pg_stat_replication" postgres || true)
  [ "$state" = sync ] && break; sleep 0.2
done
echo "replication: ${state:-none}"

start_service "$P1" "$P2" "$P3"
start_ingest
sleep "$BEFORE"

T_STOP=$(now)
pg pg_ctl -D "$WORK/primary" -m "$STOP_MODE" stop >/dev/null
echo "primary stopped ($STOP_MODE) at +0.0 s"
sleep "$PROMOTE_AFTER"
T_PROMOTE=$(now)
pg pg_ctl -D "$WORK/replica" -w promote >/dev/null
T_PROMOTED=$(now)
echo "replica promoted: pg_ctl promote took $(python3 -c "print(f'{$T_PROMOTED-$T_PROMOTE:.2f}')") s"
sleep "$AFTER"
stop_ingest_and_check "$P2" "$T_STOP" "$T_PROMOTED"
