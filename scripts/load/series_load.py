#!/usr/bin/env python3
"""Bounded query load test, loopback only: one-day series bucketed to at most 1000 points.

1. Fills the service's database directly (SQL, not HTTP) with invented readings: --days days x --points sample
   points x 6 parameters at 10 s resolution (defaults 30 x 20 x 6 = 31.1 million rows), plus evaluations for
   the derived series, for a test plant it declares through the API. Partitions are created with the service's
   naming (reading_pYYYYMMDD, evaluation_pYYYYMMDD).
2. Asks --requests random one-day series (measured or derived parameter) with maxPoints=1000 and reports the
   latency percentiles. With --range-days N each request asks for the N days ending at the end of the filled
   data instead (--range-days 90: the page's longest trend, a 90-day trend over 30 days of 10 s data).

  python3 scripts/load/series_load.py --db "host=127.0.0.1 port=5432 dbname=kwanta_bench user=postgres"
Use --skip-fill to query data filled by an earlier run (the plant id is printed).

The fill also brings the hourly and daily rollups up to date (refresh_reading_rollups and, for the derived series,
refresh_evaluation_rollups, as the ingest keeps them in step) and reports the readings' storage per row (heap and indexes). For the long-trend figures of docs/scaling.md
(1 year and 90 days of one series of 10 s data), a scaled-down set with the same per-series density:
  python3 scripts/load/series_load.py --days 365 --points 1 --measured-only --range-days 365 --requests 60 --db "..."
  python3 scripts/load/series_load.py --skip-fill TAG --days 365 --points 1 --measured-only --range-days 90 --requests 60 --db "..."
The derived series alone (--derived-only), e.g. a 90-day trend of pH at temperature over 30 days of one point:
  python3 scripts/load/series_load.py --days 30 --points 1 --derived-only --range-days 90 --requests 60 --db "..."
A series' query reads only its own rows (keyed by sample point and parameter), so its time depends on the rows per
series, not on how many other series the database holds.
"""
import argparse
import http.client
import json
import os
import random
import subprocess
import sys
import time
import urllib.parse
import uuid
from datetime import datetime, timedelta, timezone

PARAMS = ["specific_conductivity", "cation_conductivity", "degassed_cation_conductivity", "ph", "sodium",
          "sample_temperature"]
DERIVED = ["cation_conductivity_25", "ph_at_temperature"]


def psql(db, sql):
    subprocess.run(["psql", db, "-q", "-v", "ON_ERROR_STOP=1", "-c", sql], check=True)


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--base-url", default="http://127.0.0.1:8080")
    ap.add_argument("--api-key", default=os.environ.get("KWANTA_API_KEY"))
    ap.add_argument("--db", required=True)
    ap.add_argument("--days", type=int, default=30)
    ap.add_argument("--points", type=int, default=20)
    ap.add_argument("--requests", type=int, default=300)
    ap.add_argument("--range-days", type=int, default=0, help="ask N days ending at the data's end")
    ap.add_argument("--skip-fill", metavar="PLANT_TAG")
    ap.add_argument("--derived-only", action="store_true", help="ask only the derived series")
    ap.add_argument("--measured-only", action="store_true",
                    help="fill no evaluations and ask only measured parameters (the long-trend figures)")
    args = ap.parse_args()
    u = urllib.parse.urlparse(args.base_url)
    if u.hostname not in ("127.0.0.1", "localhost", "::1"):
        sys.exit("refusing non-loopback target")
    headers = {"Content-Type": "application/json"}
    if args.api_key:
        headers["Authorization"] = "Bearer " + args.api_key
    conn = http.client.HTTPConnection(u.hostname, u.port or 80, timeout=60)

    end = datetime.now(timezone.utc).replace(hour=0, minute=0, second=0, microsecond=0)
    start = end - timedelta(days=args.days)
    tag = args.skip_fill or uuid.uuid4().hex[:8]
    points = [f"S{tag}-{i:02d}" for i in range(args.points)]
    if not args.skip_fill:
        plant = {"id": f"series-{tag}", "name": "Series load plant (invented)",
                 "blocks": [{"id": "U1", "name": "Unit 1"}],
                 "samplePoints": [{"id": p, "block": "U1", "name": p, "cycleLocation": "FEEDWATER",
                                   "treatmentRegime": "AVT_O", "operatingTemperatureCel": 155} for p in points]}
        conn.request("POST", "/api/v1/plants", json.dumps(plant), headers)
        r = conn.getresponse()
        r.read()
        if r.status != 201:
            sys.exit(f"plant creation failed: {r.status}")
        t0 = time.monotonic()
        day = start.date()
        while day <= end.date():
            s = day.strftime("%Y%m%d")
            for table in ("reading", "evaluation"):
                psql(args.db, f"CREATE TABLE IF NOT EXISTS {table}_p{s} PARTITION OF {table} FOR VALUES FROM "
                              f"('{day} 00:00:00+00') TO ('{day + timedelta(days=1)} 00:00:00+00')")
            day += timedelta(days=1)
        for d in range(args.days):
            d0 = start + timedelta(days=d)
            psql(args.db, f"""
                INSERT INTO reading (time, value, point_key, parameter_key, quality, compensated)
                SELECT t, 1 + 0.1 * sin(extract(epoch FROM t) / 600.0) + random() * 0.01, k.point_key,
                       q.parameter_key, 0, true
                FROM (SELECT reading_point_key(p) AS point_key FROM unnest(ARRAY{points}::text[]) p) k,
                     (SELECT parameter_key FROM reading_parameter WHERE code = ANY (ARRAY{PARAMS}::text[])) q,
                     generate_series('{d0.isoformat()}'::timestamptz,
                                     '{(d0 + timedelta(days=1)).isoformat()}'::timestamptz - interval '10 s',
                                     interval '10 s') t
                ORDER BY k.point_key, q.parameter_key, t""")
            if args.measured_only:
                continue
            psql(args.db, f"""
                INSERT INTO evaluation (point_key, time, config_version, cation_conductivity_25,
                                        ph_at_temperature, instrument_in_doubt, details)
                SELECT k.point_key, t, 1, 0.08 + random() * 0.01, 6.9 + random() * 0.05, false, '{{}}'
                FROM (SELECT reading_point_key(p) AS point_key FROM unnest(ARRAY{points}::text[]) p) k,
                     generate_series('{d0.isoformat()}'::timestamptz,
                                     '{(d0 + timedelta(days=1)).isoformat()}'::timestamptz - interval '10 s',
                                     interval '10 s') t
                ORDER BY k.point_key, t""")
        filled = time.monotonic() - t0
        t1 = time.monotonic()
        psql(args.db, f"DO $$ BEGIN PERFORM refresh_reading_rollups('{start.isoformat()}', '{end.isoformat()}'); END $$")
        if not args.measured_only:
            psql(args.db, f"DO $$ BEGIN PERFORM refresh_evaluation_rollups('{start.isoformat()}',"
                          f" '{end.isoformat()}'); END $$")
        rollups = time.monotonic() - t1
        psql(args.db, "VACUUM ANALYZE reading")
        psql(args.db, "VACUUM ANALYZE evaluation")
        psql(args.db, "VACUUM ANALYZE reading_rollup_hour")
        psql(args.db, "VACUUM ANALYZE reading_rollup_day")
        psql(args.db, "VACUUM ANALYZE evaluation_rollup_hour")
        psql(args.db, "VACUUM ANALYZE evaluation_rollup_day")
        rows = args.days * args.points * 8640
        evaluations = 0 if args.measured_only else rows
        print(f"filled {rows * len(PARAMS):,} readings and {evaluations:,} evaluations in {filled:.0f} s,"
              f" rollups refreshed in {rollups:.0f} s (plant tag {tag})")
        size = subprocess.run(
            ["psql", args.db, "-At", "-c",
             "SELECT sum(pg_total_relation_size(inhrelid)) FROM pg_inherits WHERE inhparent = 'reading'::regclass"],
            check=True, capture_output=True, text=True).stdout.strip()
        print(f"reading partitions: {int(size) / (rows * len(PARAMS)):.0f} bytes per reading, heap and indexes"
              f" (all readings of the database)")

    conn = http.client.HTTPConnection(u.hostname, u.port or 80, timeout=60)  # the fill outlasts keep-alive
    rnd = random.Random(1)
    latencies = []
    errors = 0
    for _ in range(args.requests):
        p = rnd.choice(points)
        par = rnd.choice(PARAMS if args.measured_only else DERIVED if args.derived_only else PARAMS + DERIVED)
        if args.range_days:
            d0, d1 = end - timedelta(days=args.range_days), end
        else:
            d0 = start + timedelta(days=rnd.randrange(args.days))
            d1 = d0 + timedelta(days=1)
        q = urllib.parse.urlencode({"parameter": par, "from": d0.isoformat().replace("+00:00", "Z"),
                                    "to": d1.isoformat().replace("+00:00", "Z"), "maxPoints": 1000})
        t0 = time.monotonic()
        conn.request("GET", f"/api/v1/sample-points/{p}/series?{q}", headers=headers)
        r = conn.getresponse()
        body = r.read()
        latencies.append(time.monotonic() - t0)
        if r.status != 200:
            errors += 1
        elif len(json.loads(body)["buckets"]) > 1000:
            sys.exit("more than 1000 buckets")
    latencies.sort()
    pct = lambda q: latencies[min(len(latencies) - 1, int(len(latencies) * q))] * 1000
    what = f"{args.range_days}-day" if args.range_days else "one-day"
    print(f"{args.requests} {what} series (10 s data, maxPoints=1000): p50 {pct(0.5):.1f} ms, p95 {pct(0.95):.1f} ms,"
          f" max {latencies[-1] * 1000:.1f} ms; errors {errors}")


if __name__ == "__main__":
    main()
