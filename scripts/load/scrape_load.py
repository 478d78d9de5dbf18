#!/usr/bin/env python3
"""Bounded scrape benchmark, loopback only: time GET /actuator/prometheus with --points sample points x 8
parameters exposed (default 200 x 8).

Declares an invented plant with the sample points, ingests one hour of readings at one-minute steps for 8
parameters each, waits for the sample gauges to refresh, then times --scrapes scrapes.

  python3 scripts/load/scrape_load.py --api-key $KEY
"""
import argparse
import http.client
import json
import os
import sys
import time
import urllib.parse
import uuid
from datetime import datetime, timedelta, timezone

PARAMS = [("specific_conductivity", "uS/cm", 5.4), ("cation_conductivity", "uS/cm", 0.08),
          ("degassed_cation_conductivity", "uS/cm", 0.06), ("ph", "[pH]", 9.66), ("sodium", "ug/kg", 0.4),
          ("dissolved_oxygen", "ug/kg", 5.0), ("silica", "ug/kg", 3.0), ("sample_temperature", "Cel", 25.0)]


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--base-url", default="http://127.0.0.1:8080")
    ap.add_argument("--api-key", default=os.environ.get("KWANTA_API_KEY"))
    ap.add_argument("--points", type=int, default=200)
    ap.add_argument("--scrapes", type=int, default=50)
    ap.add_argument("--wait", type=float, default=40, help="seconds to wait for the gauges to refresh")
    args = ap.parse_args()
    u = urllib.parse.urlparse(args.base_url)
    if u.hostname not in ("127.0.0.1", "localhost", "::1"):
        sys.exit("refusing non-loopback target")
    headers = {"Content-Type": "application/json"}
    if args.api_key:
        headers["Authorization"] = "Bearer " + args.api_key
    conn = http.client.HTTPConnection(u.hostname, u.port or 80, timeout=120)

    def call(method, path, body=None):
        conn.request(method, path, body, headers)
        r = conn.getresponse()
        return r.status, r.read()

    tag = uuid.uuid4().hex[:6]
    points = [f"P{tag}-{i:03d}" for i in range(args.points)]
    plant = {"id": f"scrape-{tag}", "name": "Scrape benchmark plant (invented)",
             "blocks": [{"id": "U1", "name": "Unit 1"}],
             "samplePoints": [{"id": p, "block": "U1", "name": p, "cycleLocation": "FEEDWATER",
                               "treatmentRegime": "AVT_O", "operatingTemperatureCel": 155} for p in points]}
    status, body = call("POST", "/api/v1/plants", json.dumps(plant))
    if status != 201:
        sys.exit(f"plant creation failed: {status} {body[:200]}")
    now = datetime.now(timezone.utc).replace(second=0, microsecond=0)
    batch = []
    for minute in range(60, 0, -1):
        t = (now - timedelta(minutes=minute)).strftime("%Y-%m-%dT%H:%M:%SZ")
        for p in points:
            for name, unit, base in PARAMS:
                batch.append({"samplePoint": p, "parameter": name, "time": t, "value": base, "unit": unit})
        if len(batch) >= 8000:
            status, body = call("POST", "/api/v1/readings", json.dumps({"readings": batch}))
            if status != 200:
                sys.exit(f"ingest failed: {status} {body[:200]}")
            batch = []
    if batch:
        call("POST", "/api/v1/readings", json.dumps({"readings": batch}))
    time.sleep(args.wait)
    latencies, size, series = [], 0, 0
    for _ in range(args.scrapes):
        t0 = time.monotonic()
        status, body = call("GET", "/actuator/prometheus")
        latencies.append(time.monotonic() - t0)
        size = len(body)
        series = sum(1 for line in body.decode().splitlines() if line.startswith("kwanta_sample") and tag in line)
    latencies.sort()
    pct = lambda q: latencies[min(len(latencies) - 1, int(len(latencies) * q))] * 1000
    print(f"{args.scrapes} scrapes, {size / 1024:.0f} KiB, {series} kwanta_sample series of the test plant:"
          f" p50 {pct(0.5):.1f} ms, p95 {pct(0.95):.1f} ms, max {latencies[-1] * 1000:.1f} ms")


if __name__ == "__main__":
    main()
