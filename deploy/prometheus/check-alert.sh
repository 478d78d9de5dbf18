#!/usr/bin/env bash
# Shows an alert rule firing for the condenser-leak story of the fictional Brackenmoor demo plant.
#
# Starts the packaged service (embedded PostgreSQL in a scratch directory) and Prometheus with the project's
# alert rules, both on 127.0.0.1 only; pushes the invented U2-CPD cation-conductivity series of the story up to
# its AL3 phase; waits (at most CHECK_TIMEOUT seconds, default 240) until Prometheus reports KwantaActionLevel3
# firing; stops both and removes the scratch directory. Exit 0 when the alert fired.
#
# Needs: the jar (mvn -DskipTests package), java 17+, curl, python3, prometheus (Debian package "prometheus").
set -euo pipefail
cd "$(dirname "$0")/../.."

JAR=service/target/kwanta-service.jar
TIMEOUT="${CHECK_TIMEOUT:-240}"
[ -f "$JAR" ] || { echo "no $JAR: build it first with mvn -DskipTests package" >&2; exit 2; }
command -v prometheus >/dev/null || { echo "prometheus not installed (Debian package 'prometheus')" >&2; exit 2; }

free_port() { python3 -c 'import socket; s=socket.socket(); s.bind(("127.0.0.1",0)); print(s.getsockname()[1]); s.close()'; }
SERVICE_PORT=$(free_port)
PROM_PORT=$(free_port)
WORK=$(mktemp -d)
SERVICE_PID=""
PROM_PID=""
cleanup() {
  [ -n "$PROM_PID" ] && kill "$PROM_PID" 2>/dev/null && wait "$PROM_PID" 2>/dev/null || true
  [ -n "$SERVICE_PID" ] && kill "$SERVICE_PID" 2>/dev/null && wait "$SERVICE_PID" 2>/dev/null || true
  rm -rf "$WORK"
}
trap cleanup EXIT

echo "== service on 127.0.0.1:$SERVICE_PORT"
java -Xmx512m -jar "$JAR" --server.address=127.0.0.1 --server.port="$SERVICE_PORT" \
  --kwanta.embedded-database.data-directory="$WORK/postgres" \
  --kwanta.metrics.refresh=PT5S --kwanta.metrics.initial-delay=PT1S >"$WORK/service.log" 2>&1 &
SERVICE_PID=$!
for _ in $(seq 1 90); do
  curl -fsS "http://127.0.0.1:$SERVICE_PORT/actuator/health/readiness" >/dev/null 2>&1 && break
  kill -0 "$SERVICE_PID" 2>/dev/null || { cat "$WORK/service.log" >&2; exit 1; }
  sleep 1
done
curl -fsS "http://127.0.0.1:$SERVICE_PORT/actuator/health/readiness" >/dev/null

echo "== pushing the condenser-leak story (U2-CPD cation conductivity, invented), up to its AL3 phase"
python3 - "$SERVICE_PORT" <<'PY'
import json, sys, urllib.request
from datetime import datetime, timedelta, timezone
port = sys.argv[1]
def leak(m):  # 0.08 uS/cm, rise to 0.95 from 06:00 to 09:00, hold, fall to 0.08 by 13:30 (story time)
    if m < 360: return 0.08
    if m < 540: return 0.08 + 0.87 * (m - 360) / 180
    if m < 570: return 0.95
    if m < 810: return 0.95 - 0.87 * (m - 570) / 240
    return 0.08
now = datetime.now(timezone.utc).replace(second=0, microsecond=0)
start = now - timedelta(minutes=510)  # "now" is 08:30 story time: AL3 since 07:58
readings = [{"samplePoint": "U2-CPD", "parameter": "cation_conductivity",
             "time": (start + timedelta(minutes=m)).isoformat().replace("+00:00", "Z"),
             "value": round(leak(m), 5), "unit": "uS/cm"} for m in range(511)]
req = urllib.request.Request(f"http://127.0.0.1:{port}/api/v1/readings",
                             data=json.dumps({"readings": readings}).encode(),
                             headers={"Content-Type": "application/json"})
print(urllib.request.urlopen(req, timeout=60).read().decode())
PY

mkdir -p "$WORK/prometheus/rules"
cp deploy/prometheus/rules/kwanta-alerts.yml "$WORK/prometheus/rules/"
cat >"$WORK/prometheus/prometheus.yml" <<YML
global:
  scrape_interval: 5s
  evaluation_interval: 5s
rule_files:
  - rules/kwanta-alerts.yml
scrape_configs:
  - job_name: kwanta
    metrics_path: /actuator/prometheus
    static_configs:
      - targets: ["127.0.0.1:$SERVICE_PORT"]
YML
echo "== prometheus on 127.0.0.1:$PROM_PORT"
prometheus --config.file="$WORK/prometheus/prometheus.yml" --storage.tsdb.path="$WORK/prometheus/data" \
  --web.listen-address="127.0.0.1:$PROM_PORT" >"$WORK/prometheus.log" 2>&1 &
PROM_PID=$!

echo "== waiting up to ${TIMEOUT}s for KwantaActionLevel3 to fire (the rule holds for 1 minute)"
deadline=$(( $(date +%s) + TIMEOUT ))
while [ "$(date +%s)" -lt "$deadline" ]; do
  alerts=$(curl -fsS "http://127.0.0.1:$PROM_PORT/api/v1/alerts" 2>/dev/null || true)
  if echo "$alerts" | python3 -c '
import json, sys
data = json.load(sys.stdin)["data"]["alerts"]
hits = [a for a in data if a["labels"].get("alertname") == "KwantaActionLevel3" and a["state"] == "firing"
        and a["labels"].get("sample_point") == "U2-CPD"]
for a in hits:
    print("FIRING", a["labels"]["alertname"], a["labels"]["sample_point"], a["labels"]["parameter"],
          "since", a["activeAt"], "-", a["annotations"]["summary"])
sys.exit(0 if hits else 1)' 2>/dev/null; then
    exit 0
  fi
  sleep 5
done
echo "KwantaActionLevel3 did not fire within ${TIMEOUT}s; last alerts:" >&2
echo "$alerts" >&2
exit 1
