#!/usr/bin/env python3
"""Board data for a plant of many sample points, loopback only: server time and compressed size.

1. Declares a plant of --points feedwater sample points (invented) through the API and posts --minutes minutes
   of readings (specific, cation and degassed cation conductivity, pH; one a minute) through the ingest, so
   every point has an evaluation and levels.
2. Asks GET /api/v1/plants/{plant}/overview --requests times (gzip accepted, as the page's browser does) and
   reports the time to the first byte (server time on loopback) and the compressed and plain sizes. The first
   request is reported apart: the board reuses a point's data while it has no new readings (docs/page.md), so
   the first one reads every point afresh, as a request after new readings of every point does.

  python3 scripts/load/board_load.py --api-key "$ADMIN" --points 200
"""
import argparse
import gzip
import http.client
import json
import os
import statistics
import time
import urllib.parse
from datetime import datetime, timedelta, timezone


def request(base, key, method, path, body=None, headers=None):
    u = urllib.parse.urlparse(base)
    assert u.hostname in ("127.0.0.1", "localhost", "::1"), "loopback only"
    c = http.client.HTTPConnection(u.hostname, u.port, timeout=120)
    h = {"Authorization": "Bearer " + key, "Content-Type": "application/json"}
    h.update(headers or {})
    t0 = time.perf_counter()
    c.request(method, path, body=json.dumps(body) if body is not None else None, headers=h)
    r = c.getresponse()
    first = time.perf_counter() - t0
    data = r.read()
    c.close()
    return r.status, r.getheader("Content-Encoding"), data, first


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--base-url", default="http://127.0.0.1:8080")
    ap.add_argument("--api-key", default=os.environ.get("KWANTA_API_KEY"))
    ap.add_argument("--plant", default="board-load")
    ap.add_argument("--points", type=int, default=200)
    ap.add_argument("--minutes", type=int, default=30)
    ap.add_argument("--requests", type=int, default=30)
    ap.add_argument("--skip-fill", action="store_true")
    a = ap.parse_args()
    ids = ["BL-%03d" % i for i in range(a.points)]
    if not a.skip_fill:
        decl = {"id": a.plant, "name": "Board load plant (invented)", "blocks": [{"id": "U", "name": "Unit"}],
                "samplePoints": [{"id": p, "block": "U", "name": "Load point " + p, "cycleLocation": "FEEDWATER",
                                  "treatmentRegime": "AVT_O", "operatingTemperatureCel": 155,
                                  "operatingPressureMPa": 15} for p in ids]}
        s, _, d, _ = request(a.base_url, a.api_key, "PUT", "/api/v1/plants/" + a.plant, decl)
        assert s in (200, 201), d[:500]
        end = datetime.now(timezone.utc).replace(second=0, microsecond=0)
        for i0 in range(0, len(ids), 20):
            rows = []
            for p in ids[i0:i0 + 20]:
                k = int(p[3:])
                for m in range(a.minutes, -1, -1):
                    t = (end - timedelta(minutes=m)).strftime("%Y-%m-%dT%H:%M:%SZ")
                    cace = 0.08 + 0.4 * (k % 10 == 0)  # every tenth point above AL2
                    rows += [{"samplePoint": p, "parameter": "specific_conductivity", "time": t, "value": 8.9, "unit": "uS/cm", "compensated": True},
                             {"samplePoint": p, "parameter": "cation_conductivity", "time": t, "value": cace, "unit": "uS/cm", "compensated": True},
                             {"samplePoint": p, "parameter": "degassed_cation_conductivity", "time": t, "value": 0.06, "unit": "uS/cm", "compensated": True},
                             {"samplePoint": p, "parameter": "ph", "time": t, "value": 9.66, "unit": "[pH]"}]
            s, _, d, _ = request(a.base_url, a.api_key, "POST", "/api/v1/readings", {"readings": rows})
            assert s == 200, d[:500]
    path = "/api/v1/plants/" + a.plant + "/overview"
    times, sizes = [], []
    plain = 0
    for i in range(a.requests + 3):
        s, enc, d, first = request(a.base_url, a.api_key, "GET", path, headers={"Accept-Encoding": "gzip"})
        assert s == 200, d[:300]
        if i == 0:
            cold = first * 1000
        if i >= 3:  # warm-up
            times.append(first * 1000)
            sizes.append(len(d))
        plain = len(gzip.decompress(d)) if enc == "gzip" else len(d)
    times.sort()
    print("overview of %d points, %d requests: time to first byte median %.1f ms, p90 %.1f ms, max %.1f ms"
          % (a.points, len(times), statistics.median(times), times[int(0.9 * (len(times) - 1))], times[-1]))
    print("first request: %.1f ms (every point read afresh if the service had not cached the plant:"
          " a fresh start, or new readings of every point)" % cold)
    print("size: %d bytes gzip (Content-Encoding %s), %d bytes plain" % (sizes[-1], enc, plain))


if __name__ == "__main__":
    main()
