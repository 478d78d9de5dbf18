#!/usr/bin/env python3
"""Bounded ingest load test, loopback only.

Pushes JSON batches of readings (default 1000 per batch) for an invented test plant (20 sample points, 6
parameters each, 10 s resolution, in time order) to a running Kwanta service through HTTP, with evaluation and
persistence as in production, for a fixed number of seconds after a warm-up (default 30 s, same load, not
counted: a long-running service's JIT compiler has settled; the heap peak covers both). Then it times a raw COPY of the same number of
readings into the same table with psql, and reports both rates and their ratio, and the service's peak heap.

Example (service started with the README's run command, or with SPRING_DATASOURCE_URL pointing at the same
database that --db names):
  python3 scripts/load/ingest_load.py --seconds 60 --concurrency 4 --db "host=127.0.0.1 port=5432 dbname=kwanta_bench user=postgres"

Several instances on one database: give --base-url a comma-separated list (each instance started with the same
SPRING_DATASOURCE_URL on its own port); the clients are spread over them in turn, the plant is declared through the
first, and the heap figure is the first instance's. For the one-versus-two-instance figures (docs/scaling.md):
  python3 scripts/load/ingest_load.py --base-url http://127.0.0.1:8080 --concurrency 4 ...
  python3 scripts/load/ingest_load.py --base-url http://127.0.0.1:8080,http://127.0.0.1:8081 --concurrency 4 ...

Only 127.0.0.1 / localhost targets are accepted.
"""
import argparse
import http.client
import json
import os
import subprocess
import sys
import tempfile
import threading
import time
import urllib.parse
import uuid
from datetime import datetime, timedelta, timezone

PARAMS = [
    ("specific_conductivity", "uS/cm", 5.4),
    ("cation_conductivity", "uS/cm", 0.08),
    ("degassed_cation_conductivity", "uS/cm", 0.06),
    ("ph", "[pH]", 9.66),
    ("sodium", "ug/kg", 0.4),
    ("sample_temperature", "Cel", 25.0),
]


def check_loopback(url):
    host = urllib.parse.urlparse(url).hostname
    if host not in ("127.0.0.1", "localhost", "::1"):
        sys.exit("refusing non-loopback target " + host)


class Client:
    def __init__(self, base, key):
        u = urllib.parse.urlparse(base)
        self.host, self.port = u.hostname, u.port or 80
        self.headers = {"Content-Type": "application/json"}
        if key:
            self.headers["Authorization"] = "Bearer " + key
        self.conn = http.client.HTTPConnection(self.host, self.port, timeout=120)

    def request(self, method, path, body=None, headers=None):
        h = dict(self.headers)
        h.update(headers or {})
        for attempt in range(3):
            try:
                self.conn.request(method, path, body=body, headers=h)
                r = self.conn.getresponse()
                return r.status, r.read()
            except (http.client.HTTPException, OSError):
                self.conn.close()
                self.conn = http.client.HTTPConnection(self.host, self.port, timeout=120)
        raise RuntimeError("connection failed")


def wait_ready(client, seconds=180):
    deadline = time.monotonic() + seconds
    while time.monotonic() < deadline:
        try:
            status, _ = client.request("GET", "/actuator/health/readiness")
            if status == 200:
                return
        except RuntimeError:
            pass
        time.sleep(1)
    sys.exit("service not ready")


def readings_for(points, start, step_index):
    """All readings of one 10-second step (len(points) * 6 readings)."""
    t = (start + timedelta(seconds=10 * step_index)).strftime("%Y-%m-%dT%H:%M:%SZ")
    out = []
    for i, p in enumerate(points):
        wobble = 1 + 0.01 * ((step_index * 7 + i * 13) % 11 - 5) / 5
        for name, unit, base in PARAMS:
            r = {"samplePoint": p, "parameter": name, "time": t, "value": round(base * wobble, 5), "unit": unit}
            if name == "specific_conductivity":
                r["sampleTemperatureCel"] = 25.0
            out.append(r)
    return out


_TEMPLATES = {}


def step_json(points, start, step_index):
    """The readings of one step as JSON array elements, the same as json.dumps(readings_for(...)) but from a
    template per step phase (the values repeat every 11 steps), so that the load generator, which shares the
    machine's cores with the service, stays light."""
    phase = step_index % 11
    key = (id(points), phase)
    if key not in _TEMPLATES:
        _TEMPLATES[key] = ",".join(json.dumps(r, separators=(",", ":"))
                                   for r in readings_for(points, datetime(2000, 1, 1, tzinfo=timezone.utc), phase))
        _TEMPLATES[key] = _TEMPLATES[key].replace(
            (datetime(2000, 1, 1, tzinfo=timezone.utc) + timedelta(seconds=10 * phase)).strftime("%Y-%m-%dT%H:%M:%SZ"),
            "@T@")
    t = (start + timedelta(seconds=10 * step_index)).strftime("%Y-%m-%dT%H:%M:%SZ")
    return _TEMPLATES[key].replace("@T@", t)


def query(db, sql):
    return subprocess.run(["psql", db, "-At", "-v", "ON_ERROR_STOP=1", "-c", sql],
                          check=True, capture_output=True, text=True).stdout.strip()


def evaluation_storage(db):
    """Bytes per stored evaluation over every leaf partition of evaluation (this run's rows and any earlier
    ones): heap (with its TOAST, free-space and visibility maps) and indexes, from the partitions' sizes. For
    the rows that carry a finding and those that do not, the heap share is the mean heap bytes per row plus the
    difference of their mean row size (pg_column_size of the row) from the mean of all rows (a row carries a
    finding when points_at is not empty: every finding points at something); the index share is
    the same for both (the key does not depend on the findings)."""
    heap, index, rows = (int(x) for x in query(db, "SELECT sum(pg_table_size(inhrelid)) || ' ' ||"
                                                   " sum(pg_indexes_size(inhrelid)) || ' ' ||"
                                                   " (SELECT count(*) FROM evaluation) FROM pg_inherits"
                                                   " WHERE inhparent = 'evaluation'::regclass").split())
    if rows == 0:
        print("evaluation partitions: no rows")
        return
    # the shapes of the packs (V72) are counted with the rows that refer to them
    shapes, shape_heap, shape_index = (int(x) for x in query(
        db, "SELECT count(*) || ' ' || pg_table_size('evaluation_shape') || ' ' ||"
            " pg_indexes_size('evaluation_shape') FROM evaluation_shape").split())
    heap += shape_heap
    index += shape_index
    h, i = heap / rows, index / rows
    print(f"evaluation partitions: {(heap + index) / rows:.1f} bytes per evaluation (heap {h:.1f}, indexes {i:.1f};"
          f" {rows:,} evaluations, {(heap + index) / 2**20:.0f} MiB; with the {shapes:,} pack shapes of"
          f" evaluation_shape, {(shape_heap + shape_index) / 1024:.0f} KiB)")
    # every finding points at something; points_at is text[] before V70, comma-separated text from it
    found = "coalesce(points_at::text, '') NOT IN ('', '{}')"
    sizes = query(db, f"SELECT avg(pg_column_size(e.*)) || ' ' ||"
                      f" coalesce(avg(pg_column_size(e.*)) FILTER (WHERE {found}), 0) || ' ' ||"
                      f" coalesce(avg(pg_column_size(e.*)) FILTER (WHERE NOT {found}), 0) || ' ' ||"
                      f" count(*) FILTER (WHERE {found}) || ' ' ||"
                      f" coalesce(avg(octet_length(detail_pack)), 0) || ' ' ||"
                      f" coalesce(avg(octet_length(detail_pack)) FILTER (WHERE {found}), 0)"
                      f" FROM evaluation e").split()
    mean, with_f, without_f, n_found, pack, pack_f = (float(x) for x in sizes)
    for label, size, count in (("with a finding", with_f, int(n_found)),
                               ("without a finding", without_f, rows - int(n_found))):
        if count:
            print(f"  {label}: {h + size - mean + i:.1f} bytes (heap {h + size - mean:.1f}, indexes {i:.1f};"
                  f" {count:,} evaluations)")
    print(f"  detail_pack: {pack:.1f} bytes mean, {pack_f:.1f} with a finding")


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--base-url", default="http://127.0.0.1:8080")
    ap.add_argument("--api-key", default=os.environ.get("KWANTA_API_KEY"))
    ap.add_argument("--points", type=int, default=20)
    ap.add_argument("--batch", type=int, default=1000)
    ap.add_argument("--concurrency", type=int, default=4)
    ap.add_argument("--seconds", type=float, default=60, help="measured seconds")
    ap.add_argument("--days-back", type=int, default=20, help="the data starts this many days ago")
    ap.add_argument("--warmup", type=float, default=30, help="seconds of the same load sent first, not counted")
    ap.add_argument("--db", help="libpq connection string of the service's database, for the COPY baseline")
    args = ap.parse_args()
    bases = [b.strip() for b in args.base_url.split(",") if b.strip()]
    for b in bases:
        check_loopback(b)

    admin = Client(bases[0], args.api_key)
    for b in bases:
        wait_ready(Client(b, args.api_key))
    tag = uuid.uuid4().hex[:8]
    points = [f"L{tag}-{i:02d}" for i in range(args.points)]
    plant = {
        "id": f"load-{tag}", "name": "Load-test plant (invented)", "blocks": [{"id": "U1", "name": "Unit 1"}],
        "samplePoints": [
            {"id": p, "block": "U1", "name": p, "cycleLocation": "FEEDWATER", "treatmentRegime": "AVT_O",
             "operatingTemperatureCel": 155, "operatingPressureMPa": 15} for p in points],
    }
    status, body = admin.request("POST", "/api/v1/plants", json.dumps(plant))
    if status != 201:
        sys.exit(f"plant creation failed: {status} {body[:300]}")

    # far enough back that the run never reaches "now" (10 s steps of 120 readings: a day is 1.04 M readings)
    start = (datetime.now(timezone.utc) - timedelta(days=args.days_back)).replace(
        hour=0, minute=0, second=0, microsecond=0)
    per_step = len(points) * len(PARAMS)
    steps_per_batch = max(1, args.batch // per_step)
    lock = threading.Lock()
    next_step = [0]
    done = {"readings": 0, "batches": 0, "errors": 0, "latencies": []}
    # the first --warmup seconds are sent but not counted: the service's JIT compiler settles there
    measuring = [args.warmup <= 0]
    deadline = time.monotonic() + args.warmup + args.seconds

    def worker(base):
        c = Client(base, args.api_key)
        while time.monotonic() < deadline:
            with lock:
                s = next_step[0]
                next_step[0] += steps_per_batch
            payload = '{"readings":[' + ",".join(step_json(points, start, k) for k in range(s, s + steps_per_batch)) + "]}"
            n = steps_per_batch * per_step
            t0 = time.monotonic()
            status, body = c.request("POST", "/api/v1/readings", payload)
            dt = time.monotonic() - t0
            with lock:
                if not measuring[0]:
                    pass
                elif status == 200:
                    done["readings"] += n
                    done["batches"] += 1
                    done["latencies"].append(dt)
                else:
                    done["errors"] += 1
                    if done["errors"] <= 3:
                        print("error", status, body[:300], file=sys.stderr)

    heap = {"max": 0.0}

    def heap_sampler():
        c = Client(bases[0], args.api_key)
        while time.monotonic() < deadline + 1:
            try:
                status, body = c.request("GET", "/actuator/prometheus")
                if status == 200:
                    used = 0.0
                    for line in body.decode().splitlines():
                        if line.startswith("jvm_memory_used_bytes{") and 'area="heap"' in line:
                            used += float(line.rsplit(" ", 1)[1])
                    heap["max"] = max(heap["max"], used)
            except Exception:
                pass
            time.sleep(1)

    threads = [threading.Thread(target=worker, args=(bases[i % len(bases)],)) for i in range(args.concurrency)]
    sampler = threading.Thread(target=heap_sampler)
    sampler.start()
    for t in threads:
        t.start()
    if args.warmup > 0:
        time.sleep(args.warmup)
        with lock:
            measuring[0] = True
    t_start = time.monotonic()
    for t in threads:
        t.join()
    elapsed = time.monotonic() - t_start
    sampler.join()
    lat = sorted(done["latencies"])
    rate = done["readings"] / elapsed
    print(f"instances: {len(bases)}")
    print(f"HTTP ingest: {done['readings']} readings in {done['batches']} batches of ~{steps_per_batch * per_step}"
          f" over {elapsed:.1f} s = {rate:,.0f} readings/s; errors {done['errors']}")
    if lat:
        print(f"batch latency p50 {lat[len(lat) // 2] * 1000:.0f} ms, p95 {lat[int(len(lat) * 0.95)] * 1000:.0f} ms")
    print(f"service heap used, peak sample: {heap['max'] / 2**20:.0f} MiB")

    if args.db:
        # storage: every row of the reading partitions (this run's and any earlier one's), heap and indexes
        stored = query(args.db, "SELECT sum(pg_total_relation_size(inhrelid)) || ' ' ||"
                                " (SELECT count(*) FROM reading) FROM pg_inherits"
                                " WHERE inhparent = 'reading'::regclass").split()
        print(f"reading partitions: {int(stored[0]) / int(stored[1]):.1f} bytes per reading, heap and indexes"
              f" ({int(stored[1]):,} readings, {int(stored[0]) / 2**20:.0f} MiB)")
        evaluation_storage(args.db)
        n = done["readings"]
        copies = [p + "-copy" for p in points]
        point_keys = dict(line.split("|") for line in query(
            args.db, "SELECT p, reading_point_key(p) FROM unnest(ARRAY[%s]) p"
            % ",".join(f"'{p}'" for p in copies)).splitlines())
        parameter_keys = dict(line.split("|") for line in query(
            args.db, "SELECT code, parameter_key FROM reading_parameter").splitlines())
        with tempfile.NamedTemporaryFile("w", suffix=".csv", delete=False) as f:
            steps = n // per_step + 1
            for k in range(steps):
                for r in readings_for(copies, start, k):
                    f.write(f"{r['time']},{r['value']},,{point_keys[r['samplePoint']]},"
                            f"{parameter_keys[r['parameter']]},0,true\n")
            path = f.name
        t0 = time.monotonic()
        subprocess.run(["psql", args.db, "-q", "-v", "ON_ERROR_STOP=1", "-c",
                        f"\\copy reading (time, value, sample_temperature_cel, point_key, parameter_key, quality,"
                        f" compensated) FROM '{path}' CSV"], check=True)
        copy_s = time.monotonic() - t0
        copy_rate = steps * per_step / copy_s
        os.unlink(path)
        subprocess.run(["psql", args.db, "-q", "-c",
                        f"DELETE FROM reading WHERE point_key IN (SELECT point_key FROM reading_point"
                        f" WHERE sample_point_id LIKE 'L{tag}-%-copy')"], check=True)
        print(f"raw COPY (psql \\copy, same table, no evaluation): {steps * per_step} readings in {copy_s:.1f} s"
              f" = {copy_rate:,.0f} readings/s; ratio HTTP/COPY = {rate / copy_rate:.2f}")


if __name__ == "__main__":
    main()
