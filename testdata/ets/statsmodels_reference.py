"""External reference for lagmill's exponential smoothing baseline (org.lagmill.eval.EtsFitter).

Runs statsmodels' ETSModel (Debian package python3-statsmodels 0.13.5+dfsg, general-purpose statistics library) with
initialization_method="heuristic" on two series and writes statsmodels_expected.csv, which EtsExternalCheckTest reads:
  - elec_equip: the monthly EU manufacture of electrical equipment index shipped with statsmodels
    (statsmodels.datasets.elec_equip, Eurostat, public domain), season 12; its values are copied to elec_equip.csv;
  - daily: daily_units.csv (an invented daily series written by make_daily_series.py), season 7.
For every model form it records the heuristic initial states, the one-step fitted values, the log-likelihood and a
14-step forecast at fixed smoothing parameters, and the maximum-likelihood fit (parameters, log-likelihood, forecast).
Run: cd testdata/ets && /usr/bin/python3 statsmodels_reference.py
"""
import csv

import numpy as np
import statsmodels
from statsmodels.datasets import elec_equip
from statsmodels.tsa.exponential_smoothing.ets import ETSModel

FORMS = {
    # name: (error, trend, damped, seasonal)
    "ANN": ("add", None, False, None),
    "AAN": ("add", "add", False, None),
    "AAdN": ("add", "add", True, None),
    "ANA": ("add", None, False, "add"),
    "AAA": ("add", "add", False, "add"),
    "AAdA": ("add", "add", True, "add"),
    "MNM": ("mul", None, False, "mul"),
    "MAM": ("mul", "add", False, "mul"),
    "MAdM": ("mul", "add", True, "mul"),
}
FIXED = {"smoothing_level": 0.3, "smoothing_trend": 0.05, "smoothing_seasonal": 0.1, "damping_trend": 0.9}
HORIZON = 14


def main():
    elec = elec_equip.load_pandas().data.iloc[:, 0].to_numpy(dtype=float)
    with open("elec_equip.csv", "w") as out:
        out.write("value\n")
        for v in elec:
            out.write(f"{v!r}\n")
    daily = np.loadtxt("daily_units.csv", skiprows=1)
    rows = [("dataset", "form", "quantity", "index", "value")]
    rows.append(("all", "all", "statsmodels_version", 0, statsmodels.__version__))
    for dataset, y, m in (("elec_equip", elec, 12), ("daily", daily, 7)):
        for name, (error, trend, damped, seasonal) in FORMS.items():
            model = ETSModel(y, error=error, trend=trend, damped_trend=damped, seasonal=seasonal,
                             seasonal_periods=m if seasonal else None, initialization_method="heuristic")
            rows.append((dataset, name, "initial_level", 0, repr(float(model.initial_level))))
            if trend:
                rows.append((dataset, name, "initial_trend", 0, repr(float(model.initial_trend))))
            if seasonal:
                for j, s in enumerate(model.initial_seasonal):
                    rows.append((dataset, name, "initial_seasonal", j, repr(float(s))))
            fixed = np.array([FIXED[p] for p in model.param_names])
            rows.append((dataset, name, "fixed_loglike", 0, repr(float(model.loglike(fixed)))))
            smoothed = model.smooth(fixed)
            for t, f in enumerate(smoothed.fittedvalues):
                rows.append((dataset, name, "fixed_fitted", t, repr(float(f))))
            for k, f in enumerate(smoothed.forecast(HORIZON)):
                rows.append((dataset, name, "fixed_forecast", k, repr(float(f))))
            fit = model.fit(disp=False)
            for p, v in zip(model.param_names, fit.params):
                rows.append((dataset, name, "fit_" + p, 0, repr(float(v))))
            rows.append((dataset, name, "fit_loglike", 0, repr(float(fit.llf))))
            for k, f in enumerate(fit.forecast(HORIZON)):
                rows.append((dataset, name, "fit_forecast", k, repr(float(f))))
    with open("statsmodels_expected.csv", "w", newline="") as out:
        csv.writer(out).writerows(rows)


if __name__ == "__main__":
    main()
