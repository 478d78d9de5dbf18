#!/usr/bin/env python3
"""Figures of a failover check (check-failover.sh, check-failover-patroni.sh) from the ingest's event log
and the counts on the promoted primary; exit 1 unless every acknowledged reading is stored exactly once."""
import json, sys
events, t_stop, t_promoted = sys.argv[1], float(sys.argv[2]), float(sys.argv[3])
acked, distinct, found, doubled, stored = map(int, sys.argv[5:10])
lines = [l.split() for l in open(events)]
acks_after = [float(t) for t, o in lines if o == "ack" and float(t) > t_stop]
last_before = max((float(t) for t, o in lines if o == "ack" and float(t) <= t_stop), default=t_stop)
failures = sum(1 for t, o in lines if o != "ack")
summary = json.load(open(sys.argv[4]))
first = acks_after[0] if acks_after else float("nan")
print(f"readings acknowledged        {acked} ({distinct} distinct) in {summary['batches_acknowledged']} batches")
print(f"acknowledged found           {found} (missing {distinct - found}); stored more than once: {doubled}")
print(f"stored for the test points   {stored} (stored but not acknowledged: {stored - found})")
print(f"failed ingest requests       {failures} (retried)")
print(f"writes: last ack before stop {t_stop - last_before:.2f} s before it; first ack after stop {first - t_stop:.2f} s after it")
print(f"time to recover              {first - t_promoted:.2f} s after promotion, {first - t_stop:.2f} s after the stop")
print(f"state reads (header)         {summary['state_reads']}")
sys.exit(0 if found == distinct == acked and doubled == 0 and acks_after else 1)
