#!/usr/bin/env python3
"""Figures of a failover check (check-failover.sh, check-failover-patroni.sh) from the ingest's event log
and the counts on the promoted primary; exit 1 unless every acknowledged reading is stored exactly once.

The write outage is the longest time between two acknowledgements around the stop (a batch in flight at
the stop may still be acknowledged just after it); time to recover is counted from the stop and from the
promotion to the acknowledgement that ends that outage."""
import json
import sys

events, t_stop, t_promoted = sys.argv[1], float(sys.argv[2]), float(sys.argv[3])
acked, distinct, found, doubled, stored = map(int, sys.argv[5:10])
lines = [l.split() for l in open(events)]
acks = sorted(float(t) for t, o in lines if o == "ack")
failures = sum(1 for t, o in lines if o != "ack")
gaps = [(b - a, a, b) for a, b in zip(acks, acks[1:]) if b > t_stop]
summary = json.load(open(sys.argv[4]))
print(f"readings acknowledged        {acked} ({distinct} distinct) in {summary['batches_acknowledged']} batches")
print(f"acknowledged found           {found} (missing {distinct - found}); stored more than once: {doubled}")
print(f"stored for the test points   {stored} (stored but not acknowledged: {stored - found})")
print(f"failed ingest requests       {failures} (retried)")
if gaps:
    gap, before, after = max(gaps)
    print(f"write outage                 {gap:.2f} s without an acknowledgement "
          f"(from {before - t_stop:+.2f} s to {after - t_stop:+.2f} s around the stop)")
    print(f"time to recover              {after - t_stop:.2f} s after the stop, "
          f"{after - t_promoted:.2f} s after the promotion")
else:
    print("time to recover              no acknowledgement after the stop")
print(f"state reads (header)         {summary['state_reads']}")
sys.exit(0 if found == distinct == acked and doubled == 0 and gaps else 1)
