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

free_port() { python3 -c 'import socket; s=socket.socket(); s.bind(("127.0.0.1",0)); print(s.getsockname()[1])'; }
P1=$(free_port); P2=$(free_port); P3=$(free_port)
while [ "$P2" = "$P1" ]; do P2=$(free_port); done
while [ "$P3" = "$P1" ] || [ "$P3" = "$P2" ]; do P3=$(free_port); done
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

KEY="kw_failover_$(python3 -c 'import secrets; print(secrets.token_hex(32))')"
URL="jdbc:postgresql://127.0.0.1:$P1,127.0.0.1:$P2/kwanta?targetServerType=primary"
READ_URL="jdbc:postgresql://127.0.0.1:$P2,127.0.0.1:$P1/kwanta?targetServerType=preferSecondary"
KWANTA_ADMIN_KEY=$KEY java -Xmx512m -jar "$JAR" \
  --server.address=127.0.0.1 --server.port="$P3" \
  --spring.datasource.url="$URL" --spring.datasource.username=postgres \
  --kwanta.replica.url="$READ_URL" --kwanta.demo.load-plant=false \
  > "$WORK/service.log" 2>&1 &
SERVICE_PID=$!
BASE="http://127.0.0.1:$P3"
for _ in $(seq 240); do
  curl -sf "$BASE/actuator/health/readiness" >/dev/null 2>&1 && break
  kill -0 "$SERVICE_PID" 2>/dev/null || { tail -30 "$WORK/service.log"; exit 1; }
  sleep 0.5
done
curl -sf "$BASE/actuator/health/readiness" >/dev/null || { tail -30 "$WORK/service.log"; exit 1; }

points=""
for i in 1 2 3 4; do
  points="$points${points:+,}{\"id\":\"FO$i\",\"unit\":\"U1\",\"name\":\"failover point $i\",\"cycleLocation\":\"FEEDWATER\",\"treatmentRegime\":\"AVT_O\",\"operatingTemperatureCel\":150}"
done
curl -sf -X POST "$BASE/api/v1/plants" -H "Authorization: Bearer $KEY" -H 'Content-Type: application/json' \
  -d "{\"id\":\"failover-test\",\"name\":\"Failover test plant (invented)\",\"units\":[{\"id\":\"U1\",\"name\":\"u\"}],\"samplePoints\":[$points]}" >/dev/null

python3 "$ROOT/deploy/replica/failover_ingest.py" --base "$BASE" --key "$KEY" \
  --acked "$WORK/acked.csv" --events "$WORK/events.log" --stop-file "$WORK/stop" > "$WORK/ingest.json" &
INGEST_PID=$!
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
touch "$WORK/stop"
wait "$INGEST_PID"; INGEST_PID=""

"${AS[@]}" psql -h 127.0.0.1 -p "$P2" -U postgres -qAt kwanta > "$WORK/check.txt" <<SQL
CREATE TEMP TABLE acked (sample_point_id text, parameter text, time timestamptz);
\copy acked FROM '$WORK/acked.csv' WITH (FORMAT csv)
SELECT (SELECT count(*) FROM acked) || ' ' ||
       (SELECT count(*) FROM (SELECT DISTINCT * FROM acked) d) || ' ' ||
       (SELECT count(*) FROM acked a WHERE EXISTS (SELECT 1 FROM reading r
          WHERE r.sample_point_id = a.sample_point_id AND r.parameter = a.parameter AND r.time = a.time)) || ' ' ||
       (SELECT count(*) FROM (SELECT 1 FROM reading WHERE sample_point_id LIKE 'FO%'
          GROUP BY sample_point_id, parameter, time HAVING count(*) > 1) dup) || ' ' ||
       (SELECT count(*) FROM reading WHERE sample_point_id LIKE 'FO%');
SQL
read -r ACKED DISTINCT FOUND DOUBLED STORED < "$WORK/check.txt"
python3 "$ROOT/deploy/replica/failover_figures.py" "$WORK/events.log" "$T_STOP" "$T_PROMOTED" \
  "$WORK/ingest.json" "$ACKED" "$DISTINCT" "$FOUND" "$DOUBLED" "$STORED"
