#!/usr/bin/env python3
"""Writes src/test/resources/reference/bench-log-worked-example.csv, the worked example of docs/bench-logs.md.

Kirchhoff's current law at the diode node of a series-resistor log and the first-order propagation of the stated
tolerances (docs/bench-logs.md, "Worked example"), computed apart from the Java code with Python's decimal module
at 30 digits, for line 45 of fixtures/bench/simulated-meter-loading.csv. Run from anywhere:
python3 verify/tools/bench_log_worked_example.py (needs only Python 3).
"""
import os
from decimal import Decimal as D, getcontext

getcontext().prec = 30
ROOT = os.path.dirname(os.path.dirname(os.path.dirname(os.path.abspath(__file__))))
OUT = os.path.join(ROOT, "src", "test", "resources", "reference", "bench-log-worked-example.csv")

# the file's settings and its line 45: 5,10meg,0.461941
supply, series, meter_reading = D(5), D("1e7"), D("0.461941")
meter_resistance, meter_tolerance = D("1e7"), D("0.01")
source_resistance, resistor_tolerance = D("0.05"), D("0.001")
supply_fraction, supply_offset = D("0.0002"), D("0.001")        # 0.02 % + 1 mV
meter_fraction, meter_offset = D("0.000035"), 5 * D("1e-6")     # 0.0035 % + 5 counts of 1 uV

sqrt3 = D(3).sqrt()
total = series + source_resistance
meter_current = meter_reading / meter_resistance
current = (supply - meter_reading) / total - meter_current
u_supply = (supply_fraction * supply + supply_offset) / sqrt3
u_meter = (meter_fraction * meter_reading + meter_offset) / sqrt3
u_series = resistor_tolerance * series / sqrt3
u_meter_resistance = meter_tolerance * meter_resistance / sqrt3
contributions = [u_supply / total,
                 -(1 / total + 1 / meter_resistance) * u_meter,
                 -(supply - meter_reading) / total ** 2 * u_series,
                 meter_reading / meter_resistance ** 2 * u_meter_resistance]
u_current = sum(c * c for c in contributions).sqrt()
covariance = -(1 / total + 1 / meter_resistance) * u_meter ** 2
correlation = covariance / (u_current * u_meter)

with open(OUT, "w", encoding="utf-8", newline="\n") as f:
    f.write("# Worked example of docs/bench-logs.md: line 45 of fixtures/bench/simulated-meter-loading.csv\n")
    f.write("# (Vsupply 5 V, Rseries 10 Mohm, Vmeter 0.461941 V; Rmeter 10 Mohm 1 %, Rsource 0.05 ohm, resistor 0.1 %,\n")
    f.write("# supply 0.02 % + 1 mV, voltmeter 0.0035 % + 5 counts of 1 uV).\n")
    f.write("# Source: computed apart from cardwright by verify/tools/bench_log_worked_example.py, Python decimal at\n")
    f.write("# 30 digits (Kirchhoff's current law and first-order propagation of uniform tolerances), 18 digits printed.\n")
    f.write("# columns: diode current [A], meter current [A], u(I) [A], u(V) [V], correlation of V and I [1]\n")
    f.write(", ".join(format(x, ".17e") for x in (current, meter_current, u_current, u_meter, correlation)) + "\n")
