#!/usr/bin/env python3
"""Writes water-bath-trace.csv: INVENTED DEMO DATA for the built-in `replay` demo.

Nothing here was measured. A 20 litre water bath with a 2 kW heater is simulated as a first-order
thermal model (heat capacity 83.7 kJ/K, loss 25 W/K to a 20 degC room, so a time constant of about
56 minutes and 0.8 degC per % of heater power), stepped exactly over each 2 s sample with the
heater held constant. An old field controller (PI, Kc = 12 %/degC, Ti = 400 s, 0-100 %) produces
the logged `heater_percent`. The log starts in manual at 35 %, switches to auto at t = 240 s,
and steps the setpoint from 40 to 55 degC at t = 600 s. The sensor has seeded noise and six
dropouts, logged as blank cells and `nan`.

Run from this directory: python3 make_water_bath_trace.py
"""
import math
import random
from pathlib import Path

HERE = Path(__file__).resolve().parent  # the data is written beside this script

PERIOD_S = 2.0
DURATION_S = 1800.0
HEAT_CAPACITY_J_PER_K = 83_700.0
LOSS_W_PER_K = 25.0
HEATER_W = 2000.0
ROOM_C = 20.0
FIELD_GAIN = 12.0           # % per degC
FIELD_INTEGRAL_TIME_S = 400.0
MANUAL_UNTIL_S = 240.0
MANUAL_PERCENT = 35.0
DROPOUTS = {330.0: "", 332.0: "", 1010.0: "nan", 1400.0: "", 1402.0: "nan", 1404.0: "nan"}


def main():
    rng = random.Random(20261201)
    decay = math.exp(-PERIOD_S * LOSS_W_PER_K / HEAT_CAPACITY_J_PER_K)
    gain_c_per_percent = HEATER_W / 100.0 / LOSS_W_PER_K
    temperature = 38.0
    heater = MANUAL_PERCENT
    integral = 0.0
    was_manual = True
    lines = ["# invented demo data: a simulated water bath heater, see make_water_bath_trace.py",
             "time,setpoint,measurement,mode,manual_output,heater_percent"]
    for k in range(int(DURATION_S / PERIOD_S) + 1):
        t = k * PERIOD_S
        setpoint = 40.0 if t < 600.0 else 55.0
        manual = t < MANUAL_UNTIL_S
        measured = round(temperature + rng.gauss(0.0, 0.03), 2)
        cell = DROPOUTS.get(t, f"{measured:.2f}")
        if manual:
            heater = MANUAL_PERCENT
        elif t not in DROPOUTS:
            error = setpoint - measured
            if was_manual:
                integral = heater - FIELD_GAIN * error  # bumpless switch to auto
            step = FIELD_GAIN / FIELD_INTEGRAL_TIME_S * PERIOD_S * error
            unlimited = FIELD_GAIN * error + integral + step
            heater = min(100.0, max(0.0, unlimited))
            if heater == unlimited:
                integral += step  # conditional integration
        was_manual = manual
        lines.append(f"{t:.1f},{setpoint:.1f},{cell},{'manual' if manual else 'auto'},"
                     f"{MANUAL_PERCENT if manual else ''},{heater:.2f}")
        temperature = ROOM_C + (temperature - ROOM_C) * decay + gain_c_per_percent * heater * (1.0 - decay)
    with open(HERE / "water-bath-trace.csv", "w", encoding="utf-8") as out:
        out.write("\n".join(lines) + "\n")


if __name__ == "__main__":
    main()
