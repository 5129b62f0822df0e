"""Writes drying-oven-step-test.csv: INVENTED DEMO DATA for `loopwright design`, not a measured oven.

A small drying oven of our own invention: the heater's power (%) steps from 30 % to 40 % at
t = 30 s; the air temperature answers through two lags (the heating element, 12 s, and the air and
walls, 60 s) and 5 s of transport delay, with a gain of 0.8 degC per %, on top of 45 degC, with
seeded sensor noise of 0.05 degC, sampled every second for 10 minutes. Run:
python3 make_drying_oven_step_test.py
"""
import numpy as np
from pathlib import Path

HERE = Path(__file__).resolve().parent  # the data is written beside this script

h, end = 1.0, 600.0
t = np.arange(0.0, end + h / 2, h)
u = np.where(t >= 30.0, 40.0, 30.0)
gain, t1, t2, dead = 0.8, 60.0, 12.0, 5.0
tau = np.clip(t - 30.0 - dead, 0.0, None)
# unit step response of 1/((t1 s + 1)(t2 s + 1))
step = 1.0 - (t1 * np.exp(-tau / t1) - t2 * np.exp(-tau / t2)) / (t1 - t2)
y = 45.0 + gain * 10.0 * step
y += np.random.default_rng(13).normal(0.0, 0.05, t.size)
with open(HERE / "drying-oven-step-test.csv", "w") as f:
    f.write("time,input,output\n")
    for row in zip(t, u, y):
        f.write("%.1f,%.1f,%.3f\n" % row)
