"""Writes daily_units.csv: an invented daily sales series (18 weeks) with a weekly pattern, a slow upward drift and
Poisson noise, for the exponential smoothing reference check. Run once; the CSV is committed."""
import numpy as np

rng = np.random.default_rng(20261202)
weekday_factor = np.array([0.8, 0.7, 0.9, 1.0, 1.3, 1.6, 0.7])
days = np.arange(126)
mean = (18 + 0.06 * days) * weekday_factor[days % 7]
units = rng.poisson(mean)
with open("daily_units.csv", "w") as out:
    out.write("units\n")
    for u in units:
        out.write(f"{int(u)}\n")
