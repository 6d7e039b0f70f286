#!/usr/bin/env python3
"""Straightforward numpy area mean on the data AreaMeanBenchmark exports, for the same-run ratio.

Reads DIR/values.f32 (steps x rows x columns float32, NaN = missing, little-endian) through a
memory map, DIR/weights.f64 (each cell's area inside the region, 0 outside) and DIR/meta.json,
and computes per step the weighted mean over the region's valid cells:
    np.nansum(w * x) / sum of w where x is valid
one block of 366 steps at a time (the cube's chunk length, so memory stays bounded). It times
the whole cube warm: one untimed run first (pages the file in), then REPEATS timed runs with
time.perf_counter, and prints the median as cell-values/s (steps x region cells / seconds).
It also checks its means against DIR/java_mean.f64, the operator's result in the same run.

Usage: python3 server/bench/numpy/area_mean.py DIR [REPEATS]
"""
import json
import os
import statistics
import sys
import time

import numpy as np


def area_mean(x, idx, w, block=366):
    steps = x.shape[0]
    out = np.empty(steps)
    for t0 in range(0, steps, block):
        xb = x[t0:t0 + block][:, idx]  # the region's cells, (steps, cells) float32
        valid = ~np.isnan(xb)
        out[t0:t0 + block] = np.nansum(w * xb, axis=1) / np.sum(w * valid, axis=1)
    return out


def main():
    if len(sys.argv) < 2:
        sys.exit(__doc__)
    data = sys.argv[1]
    repeats = int(sys.argv[2]) if len(sys.argv) > 2 else 5
    with open(os.path.join(data, "meta.json")) as f:
        meta = json.load(f)
    steps, ny, nx = meta["steps"], meta["ny"], meta["nx"]
    x = np.memmap(os.path.join(data, "values.f32"), dtype="<f4", mode="r", shape=(steps, ny * nx))
    weights = np.fromfile(os.path.join(data, "weights.f64"), dtype="<f8")
    idx = np.flatnonzero(weights)
    w = weights[idx]
    print(f"numpy {np.__version__}: {steps} steps x {idx.size} region cells, load {os.getloadavg()}")

    result = area_mean(x, idx, w)  # warm-up: pages the file in
    times = []
    for _ in range(repeats):
        t0 = time.perf_counter()
        result = area_mean(x, idx, w)
        times.append(time.perf_counter() - t0)
    median = statistics.median(times)

    java = np.fromfile(os.path.join(data, "java_mean.f64"), dtype="<f8")
    both = ~np.isnan(java)
    worst = float(np.max(np.abs(result[both] - java[both]) / np.abs(java[both]))) if both.any() else float("nan")
    print(f"numpy runs (s): {' '.join(f'{t:.3f}' for t in times)}; load {os.getloadavg()}")
    print(f"numpy vs the operator's means: max relative difference {worst:.2e} over {int(both.sum())} steps")
    print(f"numpy: {steps * idx.size / median:.4e} cell-values/s (median {median:.3f} s per cube)")


if __name__ == "__main__":
    main()
