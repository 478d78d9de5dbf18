#!/usr/bin/env python3
"""Packed cold storage, bytes per reading (docs/scaling.md, "Packed cold storage"). Loopback only.

1. Fills the service's database directly (SQL) with invented readings of one kind, --days whole UTC days ending
   --age-days before today, for --series series (invented sample point ids, keys from reading_point_key()):
     regular  10 s readings, a conductivity of 0.0xx uS/cm with 3 decimals and noise (0.050-0.060), a sample
              temperature of 25.x degC with 1 decimal; what an online analyser sends
     ph       10 s readings, pH 9.xx with 2 decimals and noise, no temperature
     jitter   as regular, the times off the 10 s grid by up to +-500 ms (microsecond times)
     full     10 s readings, full-precision random doubles (the worst case: nothing to scale)
2. Waits until the running service has packed those days (it must run with kwanta.storage.packing=true; the
   defaults pack once an hour, so start it with --kwanta.storage.pack-first=PT5S --kwanta.storage.pack-every=PT10S)
   and reports: the readings packed, their size hot (the day partitions' heap and index, before packing), the
   growth of reading_pack (pg_total_relation_size: heap, TOAST and index) per reading, and the blocks' own bytes
   per reading.

  python3 scripts/load/pack_load.py --kind regular --db "host=127.0.0.1 dbname=kwanta_pack user=postgres"

Run one kind at a time on one database: the figures are the growth of reading_pack from this run.
"""
import argparse
import subprocess
import sys
import time
import uuid
from datetime import datetime, timedelta, timezone

KINDS = {
    # parameter key, value expression, temperature expression, time offset expression (microseconds)
    "regular": (2, "round((0.050 + 0.010 * random())::numeric, 3)::float8",
                "round((25 + random())::numeric, 1)::float8", "0"),
    "ph": (4, "round((9.40 + 0.20 * random())::numeric, 2)::float8", "NULL", "0"),
    "jitter": (2, "round((0.050 + 0.010 * random())::numeric, 3)::float8",
               "round((25 + random())::numeric, 1)::float8", "(random() * 1000000 - 500000)::bigint"),
    "full": (5, "random() * 10", "NULL", "0"),
}


def sql(db, statement):
    out = subprocess.run(["psql", db, "-At", "-q", "-v", "ON_ERROR_STOP=1", "-f", "-"], input=statement,
                         check=True, capture_output=True, text=True)
    return out.stdout.strip()


# the advisory lock under which the service creates, packs and drops partitions (Partitions.LOCK_KEY)
LOCK = "SELECT pg_advisory_xact_lock(x'6B77616E7461'::bigint) IS NULL;"


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--db", required=True)
    ap.add_argument("--kind", choices=sorted(KINDS), default="regular")
    ap.add_argument("--series", type=int, default=100)
    ap.add_argument("--days", type=int, default=2)
    ap.add_argument("--age-days", type=int, default=5, help="the last filled day ends this many days ago")
    ap.add_argument("--timeout", type=int, default=600, help="seconds to wait for the service to pack")
    args = ap.parse_args()

    parameter, value, temperature, offset = KINDS[args.kind]
    tag = uuid.uuid4().hex[:8].upper()
    today = datetime.now(timezone.utc).date()
    days = [today - timedelta(days=args.age_days + i) for i in range(args.days)]
    names = [f"reading_p{d.strftime('%Y%m%d')}" for d in days]
    packed_days = sql(args.db, "SELECT string_agg(day::text, ',') FROM reading_pack_day")
    for d in days:
        if packed_days and str(d) in packed_days.split(","):
            sys.exit(f"{d} is packed already: use --age-days to pick other days")
    size0 = int(sql(args.db, "SELECT pg_total_relation_size('reading_pack')"))
    blocks0 = sql(args.db, "SELECT coalesce(sum(octet_length(block)), 0) || ' ' || coalesce(sum(count), 0)"
                           " FROM reading_pack")
    bytes0, readings0 = (int(x) for x in blocks0.split())
    # one transaction under the service's lock, so that it packs only after the hot size is measured
    script = ["BEGIN;", LOCK]
    for d, name in zip(days, names):
        start = datetime(d.year, d.month, d.day, tzinfo=timezone.utc)
        script.append(f"CREATE TABLE IF NOT EXISTS {name} PARTITION OF reading FOR VALUES FROM "
                      f"('{start.isoformat()}') TO ('{(start + timedelta(days=1)).isoformat()}');")
        # in key order, as the ingest writes; times on the 10 s grid (or off it by the offset), inside the day
        script.append(f"""
            INSERT INTO reading (time, value, sample_temperature_cel, point_key, parameter_key, quality,
                                 compensated)
            SELECT greatest('{start.isoformat()}'::timestamptz,
                            least(t + make_interval(secs => ({offset}) / 1e6),
                                  '{start.isoformat()}'::timestamptz + interval '1 day' - interval '1 second')),
                   {value}, {temperature}, reading_point_key('PACK-{tag}-' || s), {parameter},
                   CASE WHEN random() < 0.001 THEN 1 ELSE 0 END, true
            FROM generate_series(1, {args.series}) AS s,
                 generate_series('{start.isoformat()}'::timestamptz,
                                 '{start.isoformat()}'::timestamptz + interval '1 day' - interval '10 seconds',
                                 interval '10 seconds') AS t
            ORDER BY 4, 5, 1
            ON CONFLICT DO NOTHING;""")
    script.append("SELECT " + " + ".join(f"pg_total_relation_size('{n}')" for n in names) + " || ' ' || ("
                  + " + ".join(f"(SELECT count(*) FROM {n})" for n in names) + ");")
    script.append("COMMIT;")
    hot, count = (int(x) for x in sql(args.db, "\n".join(script)).split()[-2:])
    print(f"kind {args.kind}: {count} readings in {len(days)} day(s), {args.series} series; "
          f"hot {hot / count:.1f} bytes per reading (heap and index)")
    deadline = time.time() + args.timeout
    while True:
        left = int(sql(args.db, "SELECT count(*) FROM pg_class WHERE relname = ANY (ARRAY["
                                + ",".join(f"'{n}'" for n in names) + "])"))
        if left == 0:
            break
        if time.time() > deadline:
            sys.exit("the service did not pack the days in time (kwanta.storage.packing=true?)")
        time.sleep(2)
    size1 = int(sql(args.db, "SELECT pg_total_relation_size('reading_pack')"))
    bytes1, readings1 = (int(x) for x in sql(
        args.db, "SELECT coalesce(sum(octet_length(block)), 0) || ' ' || coalesce(sum(count), 0)"
                 " FROM reading_pack").split())
    packed = readings1 - readings0
    print(f"kind {args.kind}: packed {packed} readings; reading_pack grew {size1 - size0} bytes: "
          f"{(size1 - size0) / packed:.2f} bytes per reading (heap, TOAST, index); "
          f"blocks alone {(bytes1 - bytes0) / packed:.2f} bytes per reading")


if __name__ == "__main__":
    main()
