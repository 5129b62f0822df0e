"""Exact relay limit cycle of 1/(s+1)^3 (relay amplitude d = 1, no hysteresis, setpoint 0).

Simulates the plant by its exact zero-order-hold discretisation (SciPy expm) with a fine step of
1e-5 s, switching the relay at the first sample past each zero crossing, and writes the period and
the amplitude (half the peak-to-peak swing) after the cycle has settled. Used by
RelayExperimentTest as the reference for what a perfect relay experiment measures; the describing
function then gives Ku = 4d/(pi*a). Run: python3 relay_third_order_lag.py > relay-third-order-lag.csv
"""
import numpy as np
from scipy.linalg import expm

A = np.array([[-1.0, 0.0, 0.0], [1.0, -1.0, 0.0], [0.0, 1.0, -1.0]])
B = np.array([1.0, 0.0, 0.0])
h = 1e-5
M = expm(np.block([[A, B[:, None]], [np.zeros((1, 4))]]) * h)
phi, gamma = M[:3, :3], M[:3, 3]
x = np.zeros(3)
u = 1.0
t = 0.0
up = []
ys = []
for _ in range(int(40.0 / h)):
    x = phi @ x + gamma * u
    t += h
    y = x[2]
    if u > 0 and y > 0:
        u = -1.0
    elif u < 0 and y < 0:
        u = 1.0
        up.append(t)
    if t > 25.0:
        ys.append(y)
period = float(np.mean(np.diff(up)[-3:]))
amplitude = (max(ys) - min(ys)) / 2.0
print("period_seconds,amplitude")
print(f"{period:.6f},{amplitude:.6f}")
