#!/usr/bin/env python3
"""Board data for a plant of many sample points, loopback only: server time and compressed size.

1. Declares a plant of --points feedwater sample points (invented) through the API and posts --minutes minutes
   of readings (specific, cation and degassed cation conductivity, pH; one a minute) through the ingest, so
   every point has an evaluation and levels.
2. Asks GET /api/v1/plants/{plant}/overview --requests times (gzip accepted, as the page's browser does) and
   reports the time to the first byte (server time on loopback) and the compressed and plain sizes. The first
   request is reported apart: the board reuses a point's data while it has no new readings (docs/page.md), so
   the first one reads every point afresh, as a request after new readings of every point does.
3. With --feed SECONDS, a live feed runs meanwhile: every SECONDS a batch with a new reading set of every point
   (the time of the batch), so every point has new readings between two requests, as under a historian writing
   every point; --gap spaces the requests (seconds).
4. Prints the server's stages from the Server-Timing header (a board computed on the request: freshness,
   diagnosis, levels, latest, states, tag, json; a board kept from before: "stored", with the time its
   computation took off the request path), how old the boards answered were (request time - asOf), and under a
   feed how many answers did not yet hold the last batch committed before the request (docs/page.md#performance).

  python3 scripts/load/board_load.py --api-key "$ADMIN" --points 200
  python3 scripts/load/board_load.py --api-key "$ADMIN" --points 200 --skip-fill --feed 10 --gap 5
"""
import argparse
import gzip
import http.client
import json
import os
import re
import statistics
import threading
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
    request.timing = r.getheader("Server-Timing") or ""
    return r.status, r.getheader("Content-Encoding"), data, first


def stages(header):
    """The stages of a Server-Timing header (name;dur=ms, ...) as a dict of ms."""
    out = {}
    for part in header.split(","):
        name, *params = part.strip().split(";")
        for q in params:
            if q.startswith("dur="):
                out[name] = float(q[4:])
    return out


def reading_set(p, when):
    """One reading of each of the four parameters at a point; every tenth point above AL2 (invented)."""
    t = when.strftime("%Y-%m-%dT%H:%M:%SZ")
    cace = 0.08 + 0.4 * (int(p[3:]) % 10 == 0)
    return [{"samplePoint": p, "parameter": "specific_conductivity", "time": t, "value": 8.9, "unit": "uS/cm", "compensated": True},
            {"samplePoint": p, "parameter": "cation_conductivity", "time": t, "value": cace, "unit": "uS/cm", "compensated": True},
            {"samplePoint": p, "parameter": "degassed_cation_conductivity", "time": t, "value": 0.06, "unit": "uS/cm", "compensated": True},
            {"samplePoint": p, "parameter": "ph", "time": t, "value": 9.66, "unit": "[pH]"}]


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--base-url", default="http://127.0.0.1:8080")
    ap.add_argument("--api-key", default=os.environ.get("KWANTA_API_KEY"))
    ap.add_argument("--plant", default="board-load")
    ap.add_argument("--points", type=int, default=200)
    ap.add_argument("--minutes", type=int, default=30)
    ap.add_argument("--requests", type=int, default=30)
    ap.add_argument("--skip-fill", action="store_true")
    ap.add_argument("--feed", type=float, default=0, help="seconds between live batches (0: no feed)")
    ap.add_argument("--gap", type=float, default=0, help="seconds between board requests")
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
        per = max(1, 9000 // (4 * (a.minutes + 1)))  # points per batch (at most 10,000 readings)
        for i0 in range(0, len(ids), per):
            rows = []
            for p in ids[i0:i0 + per]:
                for m in range(a.minutes, -1, -1):
                    rows += reading_set(p, end - timedelta(minutes=m))
            s, _, d, _ = request(a.base_url, a.api_key, "POST", "/api/v1/readings", {"readings": rows})
            assert s == 200, d[:500]
    stop = threading.Event()
    fed = []
    written = []  # when each live batch's request had returned (committed)
    if a.feed > 0:
        def feed():
            while not stop.wait(a.feed):
                t = datetime.now(timezone.utc).replace(microsecond=0)
                rows = [r for p in ids for r in reading_set(p, t)]
                t0 = time.perf_counter()
                s, _, d, _ = request(a.base_url, a.api_key, "POST", "/api/v1/readings", {"readings": rows})
                assert s == 200, d[:500]
                fed.append(time.perf_counter() - t0)
                written.append(datetime.now(timezone.utc))
        threading.Thread(target=feed, daemon=True).start()
        time.sleep(a.feed + 1)
    path = "/api/v1/plants/" + a.plant + "/overview"
    times, sizes, timings, ages, computed, behind = [], [], [], [], [], []
    plain = 0
    for i in range(a.requests + 3):
        asked = datetime.now(timezone.utc)
        s, enc, d, first = request(a.base_url, a.api_key, "GET", path, headers={"Accept-Encoding": "gzip"})
        assert s == 200, d[:300]
        if i == 0:
            cold = first * 1000
        if i >= 3:  # warm-up
            times.append(first * 1000)
            sizes.append(len(d))
            timings.append(stages(request.timing))
            m = re.search(r'board;desc="computed in ([0-9.]+) ms"', request.timing)
            if m:
                computed.append(float(m.group(1)))
        body = gzip.decompress(d) if enc == "gzip" else d
        plain = len(body)
        if i >= 3:
            # how old the board was when answered: asOf against the request's own clock
            as_of = datetime.fromisoformat(json.loads(body)["asOf"].replace("Z", "+00:00"))
            ages.append((asked - as_of).total_seconds())
            # a board behind the feed: computed before the last batch committed before the request
            done = [w for w in written if w <= asked]
            behind.append((asked - done[-1]).total_seconds() if done and as_of < done[-1] else None)
        if a.gap > 0:
            time.sleep(a.gap)
    stop.set()
    rest = [ft - sum(t.values()) for ft, t in zip(times, timings)]
    times.sort()
    print("overview of %d points, %d requests: time to first byte median %.1f ms, p90 %.1f ms, max %.1f ms"
          % (a.points, len(times), statistics.median(times), times[int(0.9 * (len(times) - 1))], times[-1]))
    print("first request: %.1f ms (every point read afresh if the service had not cached the plant:"
          " a fresh start, or new readings of every point)" % cold)
    if any(timings):
        names = list(dict.fromkeys(k for t in timings for k in t))
        print("server stages (Server-Timing), median / p90 ms: " + ", ".join(
            "%s %.1f / %.1f" % (n, statistics.median(sorted(t.get(n, 0) for t in timings)),
                                sorted(t.get(n, 0) for t in timings)[int(0.9 * (len(timings) - 1))])
            for n in names)
            + "; the rest of the time to first byte (JSON, gzip, filters): median %.1f ms"
            % statistics.median(rest))
    if computed:
        computed.sort()
        print("boards answered were computed off the request path in: median %.1f ms, p90 %.1f ms,"
              " max %.1f ms (%d of %d answers)" % (statistics.median(computed),
                                                    computed[int(0.9 * (len(computed) - 1))],
                                                    computed[-1], len(computed), len(times)))
    ages.sort()
    print("board age when answered (request time - asOf): median %.2f s, p90 %.2f s, max %.2f s"
          % (statistics.median(ages), ages[int(0.9 * (len(ages) - 1))], ages[-1]))
    if written:
        late = sorted(b for b in behind if b is not None)
        print("answers without the last batch committed before the request: %d of %d%s"
              % (len(late), len(behind), (", that batch committed %.2f-%.2f s before the request"
                                          % (late[0], late[-1])) if late else ""))
    print("size: %d bytes gzip (Content-Encoding %s), %d bytes plain" % (sizes[-1], enc, plain))
    if fed:
        print("live feed: %d batches of %d readings, every %.0f s, median %.0f ms each"
              % (len(fed), 4 * len(ids), a.feed, 1000 * statistics.median(fed)))


if __name__ == "__main__":
    main()
