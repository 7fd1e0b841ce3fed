"""Reference for the fitArrhenius benchmark: scipy.stats.linregress on ln(value) against 1/(kT).

Reads {"temperatureK": [...], "value": [...], "runs": n, "warmup": m} as JSON on stdin and
prints {"medianMs": ..., "slope": ...} as JSON: the median time of the transform plus the
regression, the same work fitArrhenius does on the same points. Exits 3 without numpy/scipy.
"""
import json
import sys
import time

try:
    import numpy as np
    from scipy.stats import linregress
except ImportError:
    sys.exit(3)

BOLTZMANN_EV_PER_K = 8.617333262e-5

data = json.load(sys.stdin)
t = np.asarray(data["temperatureK"], dtype=float)
v = np.asarray(data["value"], dtype=float)


def fit():
    return linregress(1.0 / (BOLTZMANN_EV_PER_K * t), np.log(v))


for _ in range(data["warmup"]):
    fit()
samples = []
for _ in range(data["runs"]):
    t0 = time.perf_counter()
    result = fit()
    samples.append((time.perf_counter() - t0) * 1e3)
samples.sort()
print(json.dumps({"medianMs": samples[len(samples) // 2], "slope": result.slope}))
