#!/usr/bin/env python3
"""A BASELINE for timing, not part of cardwright: a plain SciPy least_squares fit of the same forward data.

verify/bench/commands runs this script as a whole process beside `cardwright fit`, to put cardwright's wall
time next to that of a short script doing the core of the same job with NumPy and SciPy: read the CSV files,
fit IS, N, RS, ISR, NR, IKF, EG and XTI of the ngspice 39 level-1 forward equations (written here from the
published equations in our own code; docs/fitting.md) to the terminal voltage at the measured current, at every
temperature at once, and print the values. It does none of cardwright's other work (term decisions, standard
errors, refit for a second dialect, cards, checks of the input), so it is a lower bound for the numerical part,
not an equivalent tool.

    python3 verify/bench/scipy_baseline.py fixtures/demo/ks1-forward-*.csv
"""
import sys

import numpy as np
from scipy.optimize import least_squares

K_OVER_Q = 1.38064852e-23 / 1.6021766208e-19  # ngspice 39 constants [V/K]
TNOM = 300.15  # 27 degC [K]
GMIN = 1e-12  # [S]


def read(paths):
    """Rows with V [V], I [A], T [degC] after the header; positive currents only (forward points)."""
    rows = []
    for p in paths:
        with open(p, encoding="utf-8") as f:
            header_seen = False
            for line in f:
                if line.startswith("#") or not line.strip():
                    continue
                if not header_seen:
                    header_seen = True
                    continue
                v, i, t = (float(x) for x in line.split(",")[:3])
                if i > 0:
                    rows.append((v, i, t + 273.15))
    a = np.array(rows)
    return a[:, 0], a[:, 1], a[:, 2]


def model_voltage(theta, current, kelvin):
    """Terminal voltage at the given current: junction voltage by Newton's method, plus I*RS."""
    log_is, n, rs, log_isr, nr, log_ikf, eg, xti = theta
    vt = K_OVER_Q * kelvin
    ratio = kelvin / TNOM
    i_s = np.exp(log_is + (ratio - 1) * eg / (n * vt) + (xti / n) * np.log(ratio))
    i_sr = np.exp(log_isr + (ratio - 1) * eg / (nr * vt) + (xti / nr) * np.log(ratio))
    ikf = np.exp(log_ikf)
    vd = n * vt * np.log1p(current / i_s)
    for _ in range(60):
        e1 = np.exp(vd / (n * vt))
        e2 = np.exp(vd / (nr * vt))
        f = ((1 - vd) ** 2 + 0.005) ** 0.25  # recombination factor with VJ = 1, M = 0.5 (defaults)
        df = 0.25 * ((1 - vd) ** 2 + 0.005) ** -0.75 * (-2 * (1 - vd))
        i0 = i_s * (e1 - 1) + i_sr * (e2 - 1) * f
        g0 = i_s * e1 / (n * vt) + i_sr * (e2 / (nr * vt) * f + (e2 - 1) * df)
        s = np.sqrt(np.maximum(i0, 0) / ikf)
        i1 = i0 / (1 + s) + GMIN * vd
        g1 = ((1 + s) * g0 - i0 * g0 / (2 * np.maximum(s, 1e-30) * ikf)) / (1 + 2 * s + i0 / ikf) + GMIN
        step = (i1 - current) / g1
        vd = vd - np.clip(step, -0.1, 0.1)
        if np.max(np.abs(step)) < 1e-13:
            break
    return vd + current * rs


def main():
    v, i, t = read(sys.argv[1:])
    start = np.array([np.log(1e-14), 1.0, 1.0, np.log(1e-11), 2.0, np.log(0.1), 1.11, 3.0])
    lower = [np.log(1e-20), 0.5, 0.0, np.log(1e-20), 1.0, np.log(1e-4), 0.5, 0.0]
    upper = [np.log(1e-6), 4.0, 100.0, np.log(1e-6), 8.0, np.log(10.0), 2.0, 10.0]
    fit = least_squares(lambda th: model_voltage(th, i, t) - v, start, bounds=(lower, upper), method="trf",
                        x_scale="jac", xtol=1e-12, ftol=1e-12)
    names = ["IS", "N", "RS", "ISR", "NR", "IKF", "EG", "XTI"]
    values = fit.x.copy()
    for k in (0, 3, 5):
        values[k] = np.exp(values[k])
    rms = np.sqrt(np.mean(fit.fun ** 2)) * 1e3
    print("baseline fit, %d points, %d evaluations, RMS %.3f mV" % (len(v), fit.nfev, rms))
    print(" ".join("%s=%.6g" % (n, x) for n, x in zip(names, values)))


if __name__ == "__main__":
    main()
