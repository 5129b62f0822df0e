"""Reference frequency responses for org.loopwright.sim.frequency, generated with SciPy's signal module.

Run from this directory:  python3 frequency_responses.py
Writes controller_responses.csv and zoh_plant_responses.csv beside this script. The Java tests read only
those files; this script is kept so anyone can regenerate and inspect them (SciPy 1.17).

Controller: each term of C(s) = Kp + Ki/s + Kd*s/(1 + s*Tf) is discretised separately by
scipy.signal.cont2discrete with the method that corresponds to ours (Astrom & Wittenmark,
Computer-Controlled Systems, 3rd ed., ch. 8):
    integral   FORWARD_EULER -> 'euler', BACKWARD_EULER -> 'backward_diff', TUSTIN -> 'bilinear'
    derivative FORWARD_EULER -> 'euler', BACKWARD_EULER -> 'backward_diff', TUSTIN -> 'bilinear',
               STEP_INVARIANT -> 'zoh', RAMP_INVARIANT -> 'foh' (triangle hold)
and the sum is evaluated with scipy.signal.dfreqresp at z = exp(j*omega*h).

Zero-order-hold plant with dead time L = d*h + tau: an independent route from the one in the Java code
(which uses a state-space realisation and matrix exponentials). The ZOH equivalent's pulse response is
g_k = s(k*h - L) - s(k*h - L - h), with s(t) the continuous unit-step response (0 for t < 0) computed by
scipy.signal.lsim on a fine grid that contains every needed instant; H(e^{jwh}) = sum_k g_k e^{-jwhk},
summed until the response has died out. Plants with an integrator (whose pulse response never dies out)
use cont2discrete(method='zoh') times exp(-j*w*h*d) instead, so only whole-period delays there.
"""
import csv
import numpy as np
from scipy import signal
from pathlib import Path

HERE = Path(__file__).resolve().parent  # the data is written beside this script

INTEGRAL = {"FORWARD_EULER": "euler", "BACKWARD_EULER": "backward_diff", "TUSTIN": "bilinear"}
DERIVATIVE = {"BACKWARD_EULER": "backward_diff", "TUSTIN": "bilinear", "STEP_INVARIANT": "zoh",
              "RAMP_INVARIANT": "foh", "FORWARD_EULER": "euler"}


def omegas(h, count=25):
    nyquist = np.pi / h
    return np.geomspace(nyquist * 1e-3, nyquist * 0.98, count)


def discrete_term(num, den, h, method):
    numd, dend, _ = signal.cont2discrete((num, den), h, method=method)
    numd = np.atleast_1d(np.squeeze(numd)).copy()
    # the state-space round trip leaves ~1e-17 where the forward-Euler numerator is exactly zero
    # (dropped, like any leading zero of a polynomial in descending powers of z)
    numd[np.abs(numd) < 1e-14 * np.max(np.abs(numd))] = 0.0
    return np.trim_zeros(numd, "f"), np.atleast_1d(np.squeeze(dend))


def dresp(num, den, h, w):
    _, response = signal.dfreqresp(signal.dlti(num, den, dt=h), w=w * h)
    return response


def controller_rows():
    cases = [
        ("pid_a", 2.0, 0.5, 1.5, 0.15, 0.1),
        ("pid_b", 2.0, 0.5, 1.5, 0.15, 0.25),
        ("pid_c", 0.8, 0.05, 4.0, 0.5, 0.7),
        ("pi", 1.2, 0.4, 0.0, 0.0, 0.5),
    ]
    for name, kp, ki, kd, tf, h in cases:
        w = omegas(h)
        for integral, imethod in INTEGRAL.items():
            derivatives = DERIVATIVE.items() if kd > 0 else [("BACKWARD_EULER", None)]
            for derivative, dmethod in derivatives:
                total = np.full(w.shape, kp, dtype=complex)
                total += dresp(*discrete_term([ki], [1.0, 0.0], h, imethod), h, w)
                if kd > 0:
                    total += dresp(*discrete_term([kd, 0.0], [tf, 1.0], h, dmethod), h, w)
                for wi, hi in zip(w, total):
                    yield [name, kp, ki, kd, tf, integral, derivative, h, repr(float(wi)), repr(float(hi.real)), repr(float(hi.imag))]


def step_response(num, den, times):
    """Unit-step response at the given times (0 before t = 0), exact for a constant input."""
    out = np.zeros(len(times))
    positive = times >= 0
    t = times[positive]
    assert t[0] == 0.0, "the grid must contain t = 0 exactly"
    _, y, _ = signal.lsim((num, den), np.ones(len(t)), t)
    out[positive] = y
    return out


def zoh_by_pulse_response(num, den, dead, h, fine, settle, w):
    # every needed instant k*h - L and k*h - L - h lies on the fine grid starting at -L - h
    steps = int(round(settle / fine))
    grid = -dead - h + fine * np.arange(steps)
    s = step_response(num, den, np.where(np.abs(grid) < 1e-12, 0.0, grid))
    per = int(round(h / fine))
    ks = np.arange(steps // per - 1)
    idx = (ks + 1) * per  # grid[idx] = k*h - L, grid[idx - per] = k*h - L - h
    g = s[idx] - s[idx - per]
    return np.array([np.sum(g * np.exp(-1j * wi * h * ks)) for wi in w])


def plant_rows():
    pulse_cases = [
        # name, numerator, denominator, dead time, period, fine grid, settle time
        ("fopdt", [2.0], [5.0, 1.0], 1.3, 0.5, 0.1, 400.0),
        ("sopdt", [1.0], [0.3, 1.3, 1.0], 0.25, 0.1, 0.05, 80.0),
        ("resonant_zero", [0.5, 1.0], [1.0, 0.8, 1.0], 0.7, 0.2, 0.1, 200.0),
        ("biproper", [0.5, 1.0], [2.0, 1.0], 0.35, 0.2, 0.05, 150.0),
        ("whole_delay", [1.0], [1.0, 3.0, 3.0, 1.0], 0.6, 0.3, 0.3, 200.0),
    ]
    for name, num, den, dead, h, fine, settle in pulse_cases:
        w = omegas(h)
        for wi, hi in zip(w, zoh_by_pulse_response(num, den, dead, h, fine, settle, w)):
            yield [name, " ".join(map(repr, num)), " ".join(map(repr, den)), dead, h, repr(float(wi)), repr(float(hi.real)),
                   repr(float(hi.imag))]
    integrating = [("integrating", [1.0], [1.0, 1.0, 0.0], 0.4, 0.2)]
    for name, num, den, dead, h in integrating:
        w = omegas(h)
        d = int(round(dead / h))
        numd, dend = discrete_term(num, den, h, "zoh")
        response = dresp(numd, dend, h, w) * np.exp(-1j * w * h * d)
        for wi, hi in zip(w, response):
            yield [name, " ".join(map(repr, num)), " ".join(map(repr, den)), dead, h, repr(float(wi)), repr(float(hi.real)),
                   repr(float(hi.imag))]


def main():
    with open(HERE / "controller_responses.csv", "w", newline="") as f:
        out = csv.writer(f)
        out.writerow(["case", "kp", "ki", "kd", "tf", "integral_method", "derivative_method", "period",
                      "omega", "re", "im"])
        out.writerows(controller_rows())
    with open(HERE / "zoh_plant_responses.csv", "w", newline="") as f:
        out = csv.writer(f)
        out.writerow(["case", "numerator", "denominator", "dead_time", "period", "omega", "re", "im"])
        out.writerows(plant_rows())


if __name__ == "__main__":
    main()
