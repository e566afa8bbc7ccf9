"""An outside comparison for `npm run bench -- speed`, not part of Cavitas: a plain vectorised
numpy/scipy script that does the inversion job of `invert` on the speed case (point regions, free
intensity and centre, log-power misfit), written the way a scientist would script it.

It reads the case file (the same observed spectra, stations and unknown ranges as `invert` gets) and a
kernel table (Ez and horizontal-magnetic power per unit intensity on a theta grid, per frequency), which
the benchmark writes from Cavitas's own kernel tables: the peer does not compute the cavity's kernels
itself, so the comparison is of the inversion alone. Starts: a scrambled Halton sequence
(scipy.stats.qmc.Halton, seeded) over the unknown box, intensities searched as ln I; each start runs
scipy.optimize.least_squares (trust-region reflective, bounds, two-point finite-difference Jacobian,
default settings).
Prints one JSON line: best misfit (chi-square), its parameters, and the seconds spent.

usage: python3 invert_peer.py case.json kernels.json starts seed
"""

import json
import sys
import time

import numpy as np
from scipy.optimize import least_squares
from scipy.stats import qmc

from peer_model import COMPONENT_CODE, model_power

t0 = time.perf_counter()
case = json.load(open(sys.argv[1]))
kern = json.load(open(sys.argv[2]))
starts = int(sys.argv[3])
seed = int(sys.argv[4])

theta = np.asarray(kern["theta"])  # radians, uniform grid
ez_tab = np.asarray(kern["ez"])  # (n_theta, n_freq)
bh_tab = np.asarray(kern["bh"])
freqs = np.asarray(kern["frequencies"])
dtheta = theta[1] - theta[0]

stations = {s["code"]: (np.radians(s["lat"]), np.radians(s["lon"])) for s in case["stations"]}
obs = case["observed"]
st_lat = np.array([stations[o["station"]][0] for o in obs])
st_lon = np.array([stations[o["station"]][1] for o in obs])
comp = np.array([COMPONENT_CODE[o["component"]] for o in obs])
f_index = np.array([np.searchsorted(freqs, np.asarray(o["frequencies"]) - 1e-9) for o in obs])  # (n_series, n_bins)
log_obs = np.log(np.array([o["power"] for o in obs]))
inv_sigma = 1.0 / np.array([o["sigmaLog"] for o in obs])[:, None]

unknowns = case["unknowns"]
lower = []
upper = []
for u in unknowns:
    lower += [np.log(max(u["intensity"]["min"], u["intensity"]["max"] * 1e-9)), u["lat"]["min"], u["lon"]["min"]]
    upper += [np.log(u["intensity"]["max"]), u["lat"]["max"], u["lon"]["max"]]
lower = np.array(lower)
upper = np.array(upper)


def kernels(th):
    """Linear interpolation of the tables at angular distances th (any shape) -> (..., n_freq)."""
    x = np.clip(th / dtheta, 0, len(theta) - 1.000001)
    i = x.astype(int)
    w = (x - i)[..., None]
    return (1 - w) * ez_tab[i] + w * ez_tab[i + 1], (1 - w) * bh_tab[i] + w * bh_tab[i + 1]


def residuals(p):
    total = np.take_along_axis(model_power(p, st_lat, st_lon, comp, kernels), f_index, axis=1)
    return ((np.log(np.maximum(total, 1e-300)) - log_obs) * inv_sigma).ravel()


sampler = qmc.Halton(d=len(lower), scramble=True, seed=seed)
points = qmc.scale(sampler.random(starts), lower, upper)
best = None
for p0 in points:
    r = least_squares(residuals, p0, bounds=(lower, upper), method="trf")
    chi2 = float(2 * r.cost)
    if best is None or chi2 < best[0]:
        best = (chi2, r.x)
print(json.dumps({"starts": starts, "bestMisfit": best[0], "params": best[1].tolist(), "seconds": time.perf_counter() - t0}))
