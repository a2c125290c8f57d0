#!/usr/bin/python3
# A scripted reference pipeline for the benchmark: the steps of one Eggline batch done plainly with numpy, scipy,
# scikit-image and tifffile, single-threaded, as a lab might script them. It is a yardstick for speed, not a second
# implementation to trust: its numbers are only printed so a run that silently did nothing would show.
#
# Steps per file: read the whole stack (tifffile), mean over Z per channel, segment (Gaussian smoothing of the
# channels' sum, 4 noise SDs above its median, largest component, holes filled), AP axis (principal axis of the mask, poles at its
# extremes), orientation (the end where the gradient channel is higher is anterior), background (median outside the
# embryo, per channel), an edge band 12 um deep (Euclidean distance transform), 100 bins over x/EL, fit of
# A*exp(-x/lambda)+B over 0.1-0.6 EL (scipy curve_fit), and the half-maximum boundary of channel 2.
#
# Usage: /usr/bin/python3 bench/reference_pipeline.py [--read-only] FILE...
# Prints one JSON line per file ({"file", "seconds", "lambda_el", "boundary_el"}) and a summary line.
import json
import sys
import time

import numpy as np
import tifffile
from scipy import ndimage, optimize
from skimage import filters, measure

EDGE_DEPTH_UM = 12.0
BINS = 100
FIT_RANGE = (0.1, 0.6)


def read_czyx(path):
    """The stack as float32 (C, Z, Y, X) and the pixel size in um (1.0 when unknown)."""
    with tifffile.TiffFile(path) as tif:
        series = tif.series[0]
        data = series.asarray()
        axes = series.axes
        px = 1.0
        if tif.ome_metadata:
            import re
            m = re.search(r'PhysicalSizeX="([0-9.eE+-]+)"', tif.ome_metadata)
            if m:
                px = float(m.group(1))
    for a in 'CZ':
        if a not in axes:
            data = data[np.newaxis]
            axes = a + axes
    data = np.transpose(data, [axes.index(a) for a in 'CZYX'] + [i for i, a in enumerate(axes) if a not in 'CZYX'])
    return data.reshape(data.shape[:4]), px


def analyse(path):
    stack, px = read_czyx(path)
    proj = stack.mean(axis=1, dtype=np.float64).astype(np.float32)  # (C, Y, X)
    smooth = filters.gaussian(proj.sum(axis=0), sigma=2, preserve_range=True)
    level = np.median(smooth)
    noise = 1.4826 * np.median(np.abs(smooth - level))
    mask = smooth > level + 4 * noise
    labels = measure.label(mask)
    if labels.max() == 0:
        raise ValueError('no embryo found')
    largest = np.argmax(np.bincount(labels.ravel())[1:]) + 1
    mask = ndimage.binary_fill_holes(labels == largest)
    ys, xs = np.nonzero(mask)
    pts = np.stack([xs, ys], axis=1).astype(np.float64)
    centre = pts.mean(axis=0)
    w, v = np.linalg.eigh(np.cov((pts - centre).T))
    u = v[:, np.argmax(w)]
    t = (pts - centre) @ u
    t0, t1 = t.min(), t.max()
    x_el = (t - t0) / (t1 - t0)
    grad = proj[0][ys, xs]
    outside = ~mask
    bg = [float(np.median(c[outside])) for c in proj]
    if grad[x_el < 0.1].mean() < grad[x_el > 0.9].mean():
        x_el = 1 - x_el
    depth_px = EDGE_DEPTH_UM / px
    dist = ndimage.distance_transform_edt(mask)
    band = dist[ys, xs] <= depth_px
    bins = np.minimum((x_el[band] * BINS).astype(int), BINS - 1)
    counts = np.bincount(bins, minlength=BINS)
    centres = (np.arange(BINS) + 0.5) / BINS
    profiles = []
    for c in range(min(2, proj.shape[0])):
        values = proj[c][ys, xs][band] - bg[c]
        sums = np.bincount(bins, weights=values, minlength=BINS)
        profiles.append(np.where(counts > 0, sums / np.maximum(counts, 1), np.nan))
    sel = (centres >= FIT_RANGE[0]) & (centres <= FIT_RANGE[1]) & np.isfinite(profiles[0])
    xs_fit, ys_fit = centres[sel], profiles[0][sel]
    p0 = (max(ys_fit[0] - ys_fit[-1], 1.0), 0.2, ys_fit[-1])
    (a, lam, b), _ = optimize.curve_fit(lambda x, a, lam, b: a * np.exp(-x / lam) + b, xs_fit, ys_fit, p0=p0, bounds=([0, 0.01, -np.inf], [np.inf, 5, np.inf]), maxfev=2000)
    boundary = float('nan')
    if len(profiles) > 1:
        p = profiles[1]
        ok = np.isfinite(p)
        half = (np.nanmax(p) + np.nanmin(p)) / 2
        above = np.nonzero(ok & (p >= half))[0]
        if len(above):
            boundary = float(centres[above[-1]])
    return float(lam), boundary


def main(argv):
    read_only = argv and argv[0] == '--read-only'
    files = argv[1:] if read_only else argv
    t_all = time.perf_counter()
    for path in files:
        t0 = time.perf_counter()
        if read_only:
            read_czyx(path)
            lam, boundary = float('nan'), float('nan')
        else:
            try:
                lam, boundary = analyse(path)
            except Exception as e:  # a bad file must not stop the batch, as in Eggline
                print(json.dumps({'file': path, 'error': str(e).splitlines()[0] if str(e) else type(e).__name__}))
                continue
        print(json.dumps({'file': path, 'seconds': time.perf_counter() - t0, 'lambda_el': lam, 'boundary_el': boundary}))
    print(json.dumps({'files': len(files), 'seconds': time.perf_counter() - t_all}))


if __name__ == '__main__':
    main(sys.argv[1:])
