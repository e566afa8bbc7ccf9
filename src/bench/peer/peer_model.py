"""The peer's forward model, not part of Cavitas: point sources seen by station series, written in plain numpy
from the published relations (incoherent sources, so powers add; the horizontal magnetic field is perpendicular
to the great circle, so a source at bearing b shows on the north-south coil as sin^2 b and on the east-west coil as
cos^2 b; Nickolaenko & Hayakawa 2002, Resonances in the Earth-Ionosphere Cavity). The kernels (Ez and horizontal
magnetic power per unit intensity against angular distance) come in as a function, so the speed benchmark can
hand it Cavitas's tables and the siting reference its own mpmath evaluation.
"""

import numpy as np

COMPONENT_CODE = {"Ez": 0, "Bns": 1, "Bew": 2}


def distance_and_bearing(st_lat, st_lon, lat, lon):
    """Great-circle distance (radians) and bearing at the station, clockwise from north; all angles in radians."""
    cos_t = np.sin(st_lat) * np.sin(lat) + np.cos(st_lat) * np.cos(lat) * np.cos(lon - st_lon)
    th = np.arccos(np.clip(cos_t, -1, 1))
    bearing = np.arctan2(
        np.sin(lon - st_lon) * np.cos(lat), np.cos(st_lat) * np.sin(lat) - np.sin(st_lat) * np.cos(lat) * np.cos(lon - st_lon)
    )
    return th, bearing


def model_power(sources, st_lat, st_lon, comp, kernels):
    """Power of every series (rows) on the kernels' frequency grid (columns).

    sources: rows of (ln intensity, lat deg, lon deg); st_lat, st_lon: radians per series; comp: 0 Ez, 1 Bns,
    2 Bew per series; kernels(theta) -> (ez, bh), each (len(theta), n_freq).
    """
    total = None
    for ln_i, lat, lon in np.reshape(sources, (-1, 3)):
        th, bearing = distance_and_bearing(st_lat, st_lon, np.radians(lat), np.radians(lon))
        ez, bh = kernels(th)
        proj = np.where(comp == 0, 1.0, np.where(comp == 1, np.sin(bearing) ** 2, np.cos(bearing) ** 2))[:, None]
        k = np.exp(ln_i) * np.where((comp == 0)[:, None], ez, bh * proj)
        total = k if total is None else total + k
    return total
