#!/usr/bin/env python3
"""Sustained ingest for check-failover.sh, loopback only, standard library only.

Posts batches of readings for the sample points FO1..FO4 of an invented test plant, each batch with times
that no other batch has, and retries a batch until the service acknowledges it (200 with every reading
inserted or unchanged), as a historian would. Writes every acknowledged reading to --acked (CSV:
sample_point_id,parameter,time) and one line per request to --events (epoch seconds, outcome). A second
thread reads a point's state every 0.2 s and counts the Kwanta-Read-Source headers. Stops when --stop-file
exists (after the batch in hand is acknowledged or 60 s have passed), then prints a JSON summary.
"""
import argparse
import http.client
import json
import os
import sys
import threading
import time
import urllib.parse
from datetime import datetime, timedelta, timezone

PARAMS = [("specific_conductivity", "uS/cm"), ("cation_conductivity", "uS/cm")]


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--base", required=True)
    ap.add_argument("--key", required=True)
    ap.add_argument("--prefix", default="FO")
    ap.add_argument("--steps", type=int, default=25, help="time steps per batch (8 readings each)")
    ap.add_argument("--acked", required=True)
    ap.add_argument("--events", required=True)
    ap.add_argument("--stop-file", required=True)
    a = ap.parse_args()
    u = urllib.parse.urlparse(a.base)
    if u.hostname not in ("127.0.0.1", "localhost"):
        sys.exit("refusing non-loopback target " + str(u.hostname))
    headers = {"Content-Type": "application/json", "Authorization": "Bearer " + a.key}
    points = [f"{a.prefix}{i}" for i in range(1, 5)]
    start = datetime.now(timezone.utc).replace(microsecond=0) - timedelta(hours=6)
    step = timedelta(milliseconds=100)
    reads = {"replica": 0, "primary": 0, "failed": 0}
    stop_reads = threading.Event()

    def reader():
        c = http.client.HTTPConnection(u.hostname, u.port, timeout=10)
        while not stop_reads.is_set():
            try:
                c.request("GET", f"/api/v1/sample-points/{points[0]}/state", headers=headers)
                r = c.getresponse()
                r.read()
                src = r.getheader("Kwanta-Read-Source") or "primary"
                reads[src if r.status == 200 else "failed"] += 1
            except (OSError, http.client.HTTPException):
                reads["failed"] += 1
                c.close()
                c = http.client.HTTPConnection(u.hostname, u.port, timeout=10)
            time.sleep(0.2)

    t = threading.Thread(target=reader, daemon=True)
    t.start()
    conn = http.client.HTTPConnection(u.hostname, u.port, timeout=30)
    acked = open(a.acked, "w")
    events = open(a.events, "w")
    batches = acknowledged = attempts = 0
    seq = 0
    while not os.path.exists(a.stop_file):
        rows = []
        for s in range(a.steps):
            when = (start + step * (seq + s)).isoformat(timespec="milliseconds").replace("+00:00", "Z")
            for p in points:
                for code, unit in PARAMS:
                    rows.append({"samplePoint": p, "parameter": code, "time": when,
                                 "value": round(0.05 + ((seq + s) % 1000) * 1e-4, 6), "unit": unit})
        seq += a.steps
        body = json.dumps({"readings": rows})
        first_try = time.time()
        while True:
            attempts += 1
            try:
                conn.request("POST", "/api/v1/readings", body=body, headers=headers)
                r = conn.getresponse()
                answer = r.read()
                ok = r.status == 200
                if ok:
                    j = json.loads(answer)
                    ok = j["inserted"] + j["unchanged"] + j["corrected"] == len(rows)
                outcome = "ack" if ok else f"http{r.status}"
            except (OSError, http.client.HTTPException, ValueError) as e:
                ok, outcome = False, type(e).__name__
                conn.close()
                conn = http.client.HTTPConnection(u.hostname, u.port, timeout=30)
            events.write(f"{time.time():.3f} {outcome}\n")
            events.flush()
            if ok:
                break
            if time.time() - first_try > 120:
                break
            time.sleep(0.1)
        if ok:
            batches += 1
            acknowledged += len(rows)
            for row in rows:
                acked.write(f"{row['samplePoint']},{row['parameter']},{row['time']}\n")
            acked.flush()
    stop_reads.set()
    t.join(timeout=15)
    print(json.dumps({"batches_acknowledged": batches, "readings_acknowledged": acknowledged,
                      "requests": attempts, "state_reads": reads}))


if __name__ == "__main__":
    main()
