#!/usr/bin/env bash
# Shows the inhibit rules of alertmanager.yml at work, on loopback only: starts Alertmanager (with this
# configuration, the receiver URL pointed at 127.0.0.1 and group_wait shortened) and webhook-log.py; posts
# invented Brackenmoor alerts: AL1 and AL3 for U2-CPD cation conductivity, AL1 for U1-CPD sodium. Passes when
# the receiver got AL3 and the U1-CPD AL1 but not the U2-CPD AL1, and Alertmanager lists that one as
# inhibited. Needs alertmanager and amtool (Debian package prometheus-alertmanager), python3, curl.
set -euo pipefail
cd "$(dirname "$0")"
# Debian names the server prometheus-alertmanager
ALERTMANAGER=$(command -v alertmanager || command -v prometheus-alertmanager || true)
[ -n "$ALERTMANAGER" ] || { echo "alertmanager not installed (Debian package prometheus-alertmanager)" >&2; exit 2; }
for tool in amtool python3 curl; do
  command -v "$tool" >/dev/null || { echo "$tool not installed" >&2; exit 2; }
done
free_port() { python3 -c 'import socket; s=socket.socket(); s.bind(("127.0.0.1",0)); print(s.getsockname()[1]); s.close()'; }
AM_PORT=$(free_port); AM_CLUSTER=$(free_port); HOOK_PORT=$(free_port)
WORK=$(mktemp -d); AM_PID=""; HOOK_PID=""
cleanup() {
  [ -n "$AM_PID" ] && kill "$AM_PID" 2>/dev/null && wait "$AM_PID" 2>/dev/null || true
  [ -n "$HOOK_PID" ] && kill "$HOOK_PID" 2>/dev/null && wait "$HOOK_PID" 2>/dev/null || true
  rm -rf "$WORK"
}
trap cleanup EXIT

sed -e "s#http://webhook-log:9095/#http://127.0.0.1:$HOOK_PORT/#" -e "s#group_wait: 30s#group_wait: 1s#" \
  alertmanager.yml >"$WORK/alertmanager.yml"
WEBHOOK_LOG_ADDRESS=127.0.0.1 WEBHOOK_LOG_PORT=$HOOK_PORT python3 webhook-log.py >"$WORK/received.log" 2>&1 &
HOOK_PID=$!
"$ALERTMANAGER" --config.file="$WORK/alertmanager.yml" --storage.path="$WORK/data" \
  --web.listen-address="127.0.0.1:$AM_PORT" --cluster.listen-address="127.0.0.1:$AM_CLUSTER" \
  >"$WORK/alertmanager.log" 2>&1 &
AM_PID=$!
URL="http://127.0.0.1:$AM_PORT"
for _ in $(seq 1 30); do curl -fsS "$URL/-/ready" >/dev/null 2>&1 && break; sleep 1; done

add() { amtool --alertmanager.url="$URL" alert add "$@" plant=brackenmoor severity=critical; }
add alertname=KwantaActionLevel3 block=U2 sample_point=U2-CPD parameter=cation_conductivity \
  --annotation=summary="U2-CPD cation_conductivity at Action Level 3"
add alertname=KwantaActionLevel1 block=U2 sample_point=U2-CPD parameter=cation_conductivity \
  --annotation=summary="U2-CPD cation_conductivity at Action Level 1"
add alertname=KwantaActionLevel1 block=U1 sample_point=U1-CPD parameter=sodium \
  --annotation=summary="U1-CPD sodium at Action Level 1"

for _ in $(seq 1 20); do
  [ "$(grep -c FIRING "$WORK/received.log" || true)" -ge 2 ] && break
  sleep 1
done
sleep 3
echo "== received:"; grep FIRING "$WORK/received.log" || true
echo "== inhibited:"; amtool --alertmanager.url="$URL" alert query --inhibited -o extended | tee "$WORK/inhibited.txt"
ok=true
grep -q "FIRING KwantaActionLevel3 .*U2-CPD" "$WORK/received.log" || { echo "AL3 was not delivered" >&2; ok=false; }
grep -q "FIRING KwantaActionLevel1 .*U1-CPD sodium" "$WORK/received.log" || { echo "U1-CPD AL1 was not delivered" >&2; ok=false; }
if grep -q "FIRING KwantaActionLevel1 .*U2-CPD" "$WORK/received.log"; then echo "U2-CPD AL1 was delivered despite AL3" >&2; ok=false; fi
grep -q "KwantaActionLevel1.*sample_point=\"\?U2-CPD" "$WORK/inhibited.txt" || { echo "U2-CPD AL1 not listed as inhibited" >&2; ok=false; }
$ok && echo "== inhibit rules hold: AL3 holds back AL1 of the same point and parameter only"
$ok
