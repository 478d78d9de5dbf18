#!/usr/bin/env bash
# The failover check of check-failover.sh with a high-availability pair managed by Patroni and etcd
# (Debian packages patroni and etcd-server), loopback only: one etcd member, two Patroni nodes over
# PostgreSQL 15 in synchronous mode, the packaged service on a two-host URL (targetServerType=primary), a
# sustained ingest (failover_ingest.py); then the leader node is killed (Patroni with SIGKILL, its
# PostgreSQL stopped immediately: a lost machine), Patroni promotes the synchronous standby by itself
# when the leader key expires (ttl 10 s), and every acknowledged reading must be found exactly once.
# Exit 1 when a reading is missing or doubled. Cleans up its processes and directory.
#
#   bash deploy/replica/check-failover-patroni.sh    # needs service/target/kwanta-service.jar
set -euo pipefail

ROOT=$(cd "$(dirname "$0")/../.." && pwd)
PGBIN=${PGBIN:-/usr/lib/postgresql/15/bin}
JAR=${JAR:-$ROOT/service/target/kwanta-service.jar}
BEFORE=${BEFORE:-15}
AFTER=${AFTER:-25}
for tool in patroni etcd "$PGBIN/pg_ctl"; do
  command -v "$tool" >/dev/null || { echo "missing $tool (apt-get install -y patroni etcd-server)" >&2; exit 2; }
done
[ -f "$JAR" ] || { echo "no $JAR: mvn -B -ntp -o -q package -DskipTests" >&2; exit 2; }

WORK=$(mktemp -d /tmp/kwanta-patroni.XXXXXX)
chmod 755 "$WORK"
SERVICE_PID="" INGEST_PID="" ETCD_PID="" PAT1_PID="" PAT2_PID=""
AS=()
if [ "$(id -u)" = 0 ]; then chown postgres: "$WORK"; AS=(runuser -u postgres --); fi

cleanup() {
  set +e
  for p in "$INGEST_PID" "$SERVICE_PID" "$PAT1_PID" "$PAT2_PID"; do [ -n "$p" ] && kill "$p" 2>/dev/null; done
  for _ in $(seq 50); do
    alive=0
    for p in "$SERVICE_PID" "$PAT1_PID" "$PAT2_PID"; do [ -n "$p" ] && kill -0 "$p" 2>/dev/null && alive=1; done
    [ "$alive" = 0 ] && break; sleep 0.2
  done
  for p in "$SERVICE_PID" "$PAT1_PID" "$PAT2_PID"; do [ -n "$p" ] && kill -9 "$p" 2>/dev/null; done
  for d in pg1 pg2; do
    [ -f "$WORK/$d/postmaster.pid" ] && "${AS[@]}" "$PGBIN/pg_ctl" -D "$WORK/$d" -m immediate stop >/dev/null 2>&1
  done
  [ -n "$ETCD_PID" ] && kill "$ETCD_PID" 2>/dev/null && wait "$ETCD_PID" 2>/dev/null
  rm -rf "$WORK"
}
trap cleanup EXIT INT TERM

. "$ROOT/deploy/replica/failover_common.sh"
for v in PE PP P1 P2 R1 R2 P3; do take_port "$v"; done
now() { date +%s.%N; }
echo "work directory $WORK; etcd :$PE, PostgreSQL :$P1 :$P2, Patroni REST :$R1 :$R2, service :$P3"

etcd --name kw --data-dir "$WORK/etcd" --enable-v2=true \
  --listen-client-urls "http://127.0.0.1:$PE" --advertise-client-urls "http://127.0.0.1:$PE" \
  --listen-peer-urls "http://127.0.0.1:$PP" --initial-advertise-peer-urls "http://127.0.0.1:$PP" \
  --initial-cluster "kw=http://127.0.0.1:$PP" > "$WORK/etcd.log" 2>&1 &
ETCD_PID=$!
for _ in $(seq 50); do curl -sf "http://127.0.0.1:$PE/health" >/dev/null && break; sleep 0.2; done

node_config() { # name pgport restport
  cat <<YAML
scope: kwanta-failover
name: $1
restapi:
  listen: 127.0.0.1:$3
  connect_address: 127.0.0.1:$3
etcd:
  host: 127.0.0.1:$PE
bootstrap:
  dcs:
    ttl: 10
    loop_wait: 1
    retry_timeout: 3
    maximum_lag_on_failover: 1048576
    synchronous_mode: true
    postgresql:
      use_pg_rewind: false
      parameters:
        max_connections: 60
        max_wal_senders: 5
        wal_level: replica
        hot_standby: "on"
  initdb:
  - encoding: UTF8
  - locale: C.UTF-8
  pg_hba:
  - host replication replicator 127.0.0.1/32 trust
  - host all all 127.0.0.1/32 trust
postgresql:
  listen: 127.0.0.1:$2
  connect_address: 127.0.0.1:$2
  data_dir: $WORK/$1
  bin_dir: $PGBIN
  pgpass: $WORK/pgpass-$1
  authentication:
    replication:
      username: replicator
      password: replicator-loopback
    superuser:
      username: postgres
      password: postgres-loopback
  parameters:
    unix_socket_directories: '$WORK'
YAML
}
node_config pg1 "$P1" "$R1" > "$WORK/pg1.yml"
node_config pg2 "$P2" "$R2" > "$WORK/pg2.yml"
chmod 644 "$WORK"/pg?.yml
start_node() { # the pid file holds Patroni's own pid (exec), not runuser's, so kill reaches Patroni
  "${AS[@]}" sh -c 'echo $$ > "$1.pid"; exec patroni "$1.yml"' sh "$WORK/$1" > "$WORK/patroni-$1.log" 2>&1 &
  for _ in $(seq 50); do [ -s "$WORK/$1.pid" ] && break; sleep 0.1; done
}
start_node pg1
PAT1_PID=$(cat "$WORK/pg1.pid")
for _ in $(seq 150); do curl -sf "http://127.0.0.1:$R1/primary" >/dev/null && break; sleep 0.2; done
start_node pg2
PAT2_PID=$(cat "$WORK/pg2.pid")
for _ in $(seq 300); do curl -sf "http://127.0.0.1:$R2/sync" >/dev/null && break; sleep 0.2; done
curl -sf "http://127.0.0.1:$R2/sync" >/dev/null || { echo "pg2 did not become the synchronous standby"; tail -20 "$WORK/patroni-pg2.log"; exit 1; }
echo "patroni: pg1 leader, pg2 synchronous standby"
PGPASSWORD=postgres-loopback psql -h 127.0.0.1 -p "$P1" -U postgres -qAtc "CREATE DATABASE kwanta" postgres

start_service "$P1" "$P2" "$P3" postgres-loopback
start_ingest
sleep "$BEFORE"

T_STOP=$(now)
kill -9 "$PAT1_PID"; PAT1_PID=""
"${AS[@]}" "$PGBIN/pg_ctl" -D "$WORK/pg1" -m immediate stop >/dev/null
echo "leader pg1 killed (Patroni SIGKILL, PostgreSQL immediate stop)"
for _ in $(seq 300); do curl -sf "http://127.0.0.1:$R2/primary" >/dev/null && break; sleep 0.1; done
T_PROMOTED=$(now)
curl -sf "http://127.0.0.1:$R2/primary" >/dev/null || { echo "pg2 was not promoted"; tail -20 "$WORK/patroni-pg2.log"; exit 1; }
echo "Patroni promoted pg2 $(python3 -c "print(f'{$T_PROMOTED-$T_STOP:.2f}')") s after the kill"
sleep "$AFTER"
stop_ingest_and_check "$P2" "$T_STOP" "$T_PROMOTED" postgres-loopback
