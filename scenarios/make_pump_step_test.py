"""Writes pump-step-test.csv: INVENTED DEMO DATA for `loopwright identify`, not a measured pump.

A booster pump's drive steps from 40 % to 60 % at t = 2 s; the pressure answers as a first-order
lag with dead time (gain 0.05 bar/%, time constant 2 s, dead time 0.4 s) on top of 2 bar, with
seeded sensor noise of 0.002 bar. Run: python3 make_pump_step_test.py
"""
import numpy as np
from pathlib import Path

HERE = Path(__file__).resolve().parent  # the data is written beside this script

h, end = 0.05, 15.0
t = np.round(np.arange(0.0, end + h / 2, h), 6)
u = np.where(t >= 2.0, 60.0, 40.0)
gain, tau, dead = 0.05, 2.0, 0.4
elapsed = np.clip(t - 2.0 - dead, 0.0, None)
y = 2.0 + gain * 40.0 + gain * 20.0 * (1.0 - np.exp(-elapsed / tau))
y += np.random.default_rng(7).normal(0.0, 0.002, t.size)
with open(HERE / "pump-step-test.csv", "w") as f:
    f.write("time,input,output\n")
    for row in zip(t, u, y):
        f.write("%.2f,%.1f,%.5f\n" % row)
