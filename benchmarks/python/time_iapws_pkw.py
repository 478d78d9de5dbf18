#!/usr/bin/python3
"""Time pKw(T, p) including the density with Debian python3-iapws 1.5.2, per call.

The same quantity as WaterBenchmark.kwantaPkw: density from iapws.IAPWS97(T=T_K, P=p_MPa).rho
(IAPWS-IF97), then iapws._iapws._Kw(rho, T) (IAPWS R11-07). Inputs: 1024 liquid states drawn
like the JMH benchmark (0-350 C; p from 1.001 x max(p_sat, 0.101325 MPa) to 25 MPa, seed 42; the
draws differ from Java's generator but cover the same range). Also times IAPWS97 alone (which
computes many properties per call), the region-1 equation alone (iapws.iapws97._Region1, which
still evaluates all region-1 properties) with _Kw, and _Kw alone.

Run:  /usr/bin/python3 benchmarks/python/time_iapws_pkw.py
"""

import random
import timeit

import iapws
from iapws._iapws import _Kw
from iapws.iapws97 import _PSat_T, _Region1

SIZE = 1024


def states():
    rng = random.Random(42)
    out = []
    for _ in range(SIZE):
        t = 273.15 + rng.uniform(0, 350)
        low = max(_PSat_T(t), 0.101325) * 1.001
        out.append((t, rng.uniform(low, 25.0)))
    return out


def main():
    grid = states()
    rhos = [iapws.IAPWS97(T=t, P=p).rho for t, p in grid]

    def pkw_with_density():
        for t, p in grid:
            _Kw(iapws.IAPWS97(T=t, P=p).rho, t)

    def density_only():
        for t, p in grid:
            iapws.IAPWS97(T=t, P=p).rho

    def pkw_region1_only():
        for t, p in grid:
            _Kw(1 / _Region1(t, p)["v"], t)

    def kw_only():
        for (t, _), rho in zip(grid, rhos):
            _Kw(rho, t)

    for name, fn, number in (
        ("pKw incl. density (IAPWS97 + _Kw)", pkw_with_density, 3),
        ("density only (IAPWS97(T, P).rho)", density_only, 3),
        ("pKw incl. density (_Region1 + _Kw)", pkw_region1_only, 10),
        ("_Kw only", kw_only, 50),
    ):
        best = min(timeit.repeat(fn, number=number, repeat=5)) / number / SIZE
        print("%-36s %10.2f us per call (best of 5)" % (name, best * 1e6))


if __name__ == "__main__":
    main()
