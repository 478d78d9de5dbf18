# Shared by check-failover.sh and check-failover-patroni.sh (sourced): the packaged service on two-host
# URLs, the invented test plant, the sustained ingest, and the check of every acknowledged reading on the
# promoted primary. Expects ROOT, JAR, WORK and the variables named in each function.

# start_service P_PRIMARY P_REPLICA P_HTTP [PASSWORD]: sets KEY, BASE and SERVICE_PID; waits for readiness.
start_service() {
  KEY="kw_failover_$(python3 -c 'import secrets; print(secrets.token_hex(32))')"
  local url="jdbc:postgresql://127.0.0.1:$1,127.0.0.1:$2/kwanta?targetServerType=primary&hostRecheckSeconds=2"
  local read_url="jdbc:postgresql://127.0.0.1:$2,127.0.0.1:$1/kwanta?targetServerType=preferSecondary&hostRecheckSeconds=2"
  KWANTA_ADMIN_KEY=$KEY java -Xmx512m -jar "$JAR" \
    --server.address=127.0.0.1 --server.port="$3" \
    --spring.datasource.url="$url" --spring.datasource.username=postgres \
    --spring.datasource.password="${4:-}" \
    --kwanta.replica.url="$read_url" --kwanta.demo.load-plant=false \
    > "$WORK/service.log" 2>&1 &
  SERVICE_PID=$!
  BASE="http://127.0.0.1:$3"
  for _ in $(seq 480); do
    curl -sf "$BASE/actuator/health/readiness" >/dev/null 2>&1 && break
    kill -0 "$SERVICE_PID" 2>/dev/null || { tail -30 "$WORK/service.log"; return 1; }
    sleep 0.5
  done
  curl -sf "$BASE/actuator/health/readiness" >/dev/null || { tail -30 "$WORK/service.log"; return 1; }
  local points="" i
  for i in 1 2 3 4; do
    points="$points${points:+,}{\"id\":\"FO$i\",\"block\":\"U1\",\"name\":\"failover point $i\",\"cycleLocation\":\"FEEDWATER\",\"treatmentRegime\":\"AVT(O)\",\"operatingTemperatureCel\":150}"
  done
  curl -sf -X POST "$BASE/api/v1/plants" -H "Authorization: Bearer $KEY" -H 'Content-Type: application/json' \
    -d "{\"id\":\"failover-test\",\"name\":\"Failover test plant (invented)\",\"blocks\":[{\"id\":\"U1\",\"name\":\"u\"}],\"samplePoints\":[$points]}" >/dev/null
}

# start_ingest: sets INGEST_PID.
start_ingest() {
  python3 "$ROOT/deploy/replica/failover_ingest.py" --base "$BASE" --key "$KEY" \
    --acked "$WORK/acked.csv" --events "$WORK/events.log" --stop-file "$WORK/stop" > "$WORK/ingest.json" &
  INGEST_PID=$!
}

# stop_ingest_and_check PORT_OF_NEW_PRIMARY T_STOP T_PROMOTED [PASSWORD]: prints the figures; fails when a
# reading is missing or doubled.
stop_ingest_and_check() {
  touch "$WORK/stop"
  wait "$INGEST_PID"; INGEST_PID=""
  PGPASSWORD="${4:-}" psql -h 127.0.0.1 -p "$1" -U postgres -qAt kwanta > "$WORK/check.txt" <<SQL
CREATE TEMP TABLE acked (sample_point_id text, parameter text, time timestamptz);
\copy acked FROM '$WORK/acked.csv' WITH (FORMAT csv)
SELECT (SELECT count(*) FROM acked) || ' ' ||
       (SELECT count(*) FROM (SELECT DISTINCT * FROM acked) d) || ' ' ||
       (SELECT count(*) FROM acked a WHERE EXISTS (SELECT 1 FROM reading_named r
          WHERE r.sample_point_id = a.sample_point_id AND r.parameter = a.parameter AND r.time = a.time)) || ' ' ||
       (SELECT count(*) FROM (SELECT 1 FROM reading_named WHERE sample_point_id LIKE 'FO%'
          GROUP BY sample_point_id, parameter, time HAVING count(*) > 1) dup) || ' ' ||
       (SELECT count(*) FROM reading_named WHERE sample_point_id LIKE 'FO%');
SQL
  local acked distinct found doubled stored
  read -r acked distinct found doubled stored < "$WORK/check.txt"
  python3 "$ROOT/deploy/replica/failover_figures.py" "$WORK/events.log" "$2" "$3" \
    "$WORK/ingest.json" "$acked" "$distinct" "$found" "$doubled" "$stored"
}

take_port() { # take_port NAME: sets NAME to a free loopback port not taken before in this run
  local p
  while :; do
    p=$(python3 -c 'import socket; s=socket.socket(); s.bind(("127.0.0.1",0)); print(s.getsockname()[1])')
    case " ${USED_PORTS:-} " in *" $p "*) ;; *) USED_PORTS="${USED_PORTS:-} $p"; printf -v "$1" '%s' "$p"; return ;; esac
  done
}
