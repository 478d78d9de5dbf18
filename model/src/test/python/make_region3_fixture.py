#!/usr/bin/python3
"""Write the reference grid iapws-python-regions23.csv for the region 2/3 water tests.

Run with the Debian interpreter (python3-iapws 1.5.3 is installed for it):

    /usr/bin/python3 model/src/test/python/make_region3_fixture.py

Density from iapws.IAPWS97(T=T_K, P=p_MPa).rho (IF97; in region 3 python3-iapws solves Eq. 28 by
Newton's method from the SR5-05 backward equation), region from .region, pKw from
iapws._iapws._Kw(rho, T) (IAPWS R11-07). Grid: 350 to 800 C and 1 to 100 MPa, with extra points
close to the critical point and to the saturation line between 350 C and the critical temperature.
Points exactly on a region boundary are left out.
"""

import os

import iapws
from iapws._iapws import _Kw
from iapws.iapws97 import _PSat_T, _P23_T

HERE = os.path.dirname(os.path.abspath(__file__))
OUT = os.path.join(HERE, "..", "resources", "water", "iapws-python-regions23.csv")


def version():
    from importlib.metadata import version as v

    try:
        return v("iapws")
    except Exception:
        return "1.5.3 (Debian python3-iapws)"


def points():
    for t_c in range(350, 801, 25):
        for p in (1, 3, 5, 10, 16, 20, 22, 23, 25, 30, 40, 60, 80, 100):
            yield t_c + 273.15, float(p)
    # near the saturation line between 623.15 K and Tc, both sides
    for t in (625.0, 630.0, 635.0, 640.0, 643.0, 645.0, 646.0, 646.5):
        ps = _PSat_T(t)
        for f in (0.98, 0.995, 1.005, 1.02, 1.1):
            yield t, ps * f
    # near the critical point, above Tc
    for t in (647.2, 648.0, 650.0, 655.0, 660.0):
        for p in (20.0, 21.5, 22.064, 22.5, 23.0, 24.0):
            yield t, p


def main():
    rows = []
    for t, p in points():
        if t <= 863.15 and t > 623.15 and abs(p - _P23_T(t)) < 1e-6:
            continue
        w = iapws.IAPWS97(T=t, P=p)
        if w.region not in (2, 3):
            continue
        rows.append((t, p, w.region, w.rho, _Kw(w.rho, t)))
    with open(OUT, "w") as f:
        f.write(
            "# IAPWS-IF97 density (regions 2 and 3) and IAPWS R11-07 pKw computed with Debian"
            " python3-iapws %s: IAPWS97(T, P).rho and _Kw(rho, T);"
            " written by model/src/test/python/make_region3_fixture.py\n" % version()
        )
        f.write("temperature_K,pressure_MPa,if97_region,density_kg_per_m3,pKw\n")
        for t, p, r, rho, pkw in rows:
            f.write("%.6f,%.9g,%d,%.12g,%.12g\n" % (t, p, r, rho, pkw))
    print(len(rows), "rows ->", OUT)


if __name__ == "__main__":
    main()
