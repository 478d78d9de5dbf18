#!/usr/bin/python3
"""Write the reference grid iapws-python-grid.csv for the water-properties tests.

Run with the Debian interpreter (python3-iapws 1.5.2 is installed for it):

    /usr/bin/python3 model/src/test/python/make_water_fixture.py

Density from iapws.IAPWS97(T=T_K, P=p_MPa).rho (IF97, kg/m3), pKw from iapws._iapws._Kw(rho, T)
(IAPWS R11-07; rho in kg/m3, T in K), epsilon from iapws._iapws._Dielectric(rho, T) (IAPWS R8-97).
On the saturation line IAPWS97(T=T, x=0) (saturated liquid) is used, since IAPWS97(T, P) at
exactly p_sat returns the vapour. Grid: liquid only, t from 0 to 350 C in 5 C steps and 10 pressures per temperature, from
max(p_sat(T), 0.101325 MPa) up to 25 MPa, spaced evenly in pressure.
"""

import datetime
import os

import iapws
from iapws._iapws import _Dielectric, _Kw
from iapws.iapws97 import _PSat_T

HERE = os.path.dirname(os.path.abspath(__file__))
OUT = os.path.join(HERE, "..", "resources", "water", "iapws-python-grid.csv")


def version():
    try:
        from importlib.metadata import version as v

        return v("iapws")
    except Exception:  # noqa: BLE001 - metadata may be missing in the Debian package
        return getattr(iapws, "__version__", "unknown")


def main():
    rows = []
    for step in range(0, 71):
        t_c = 5.0 * step
        t = 273.15 + t_c
        p_low = max(_PSat_T(t), 0.101325)
        n = 10
        for k in range(n):
            p = p_low + (25.0 - p_low) * k / (n - 1)
            if k == 0:
                p = p_low
            if k == 0 and p_low > 0.101325:
                # Exactly on the saturation line IAPWS97(T, P) picks the vapour; take the
                # saturated liquid instead, which is region 1 at p_sat.
                water = iapws.IAPWS97(T=t, x=0)
                p = water.P
            else:
                water = iapws.IAPWS97(T=t, P=p)
            if water.region != 1 and not (k == 0 and water.x == 0):
                raise SystemExit("not region 1: T=%r p=%r region %r" % (t, p, water.region))
            rho = water.rho
            rows.append((t, p, rho, _Kw(rho, t), _Dielectric(rho, t)))
    with open(OUT, "w", encoding="utf-8") as f:
        f.write("# Reference grid from Debian python3-iapws %s, written %s by\n"
                % (version(), datetime.date.today().isoformat()))
        f.write("# model/src/test/python/make_water_fixture.py (run with /usr/bin/python3).\n")
        f.write("# rho_kg_per_m3: iapws.IAPWS97(T=T_K, P=p_MPa).rho (IAPWS-IF97 region 1); on the\n")
        f.write("# saturation line (first row of each T above 100 C) iapws.IAPWS97(T=T_K, x=0).rho\n")
        f.write("# pKw: iapws._iapws._Kw(rho, T) (IAPWS R11-07, rho kg/m3, T K)\n")
        f.write("# epsilon: iapws._iapws._Dielectric(rho, T) (IAPWS R8-97)\n")
        f.write("# Liquid only: 0-350 C, p from max(p_sat, 0.101325 MPa) to 25 MPa. repr() digits.\n")
        f.write("T_K,p_MPa,rho_kg_per_m3,pKw,epsilon\n")
        for row in rows:
            f.write(",".join(repr(float(x)) for x in row) + "\n")
    print("wrote %d rows to %s" % (len(rows), os.path.normpath(OUT)))


if __name__ == "__main__":
    main()
