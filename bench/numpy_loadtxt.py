"""What a lab would write with numpy: load the round log with numpy.loadtxt, check the value ranges,
draw half the rounds as test rounds and count rounds by settings and outcomes with bincount.
Prints {seconds, peakMB, rounds} as JSON. Usage: python3 numpy_loadtxt.py <log> (plain or gzip)"""
import json
import resource
import sys
import time

import numpy as np


def main(path):
    started = time.perf_counter()
    rounds = np.loadtxt(path, delimiter=',', skiprows=1, dtype=np.int64, encoding='utf-8-sig')
    x, y, a, b = rounds[:, 1], rounds[:, 2], rounds[:, 3], rounds[:, 4]
    if ((x > 1) | (y > 2) | (a > 1) | (b > 1) | (rounds < 0).any(axis=1)).any() or (np.diff(rounds[:, 0]) <= 0).any():
        raise ValueError('bad rows')
    test = np.random.default_rng(1).random(len(rounds)) < 0.5
    counts = np.bincount(((x * 3 + y) * 2 + a) * 2 + b + 24 * test, minlength=48)
    seconds = time.perf_counter() - started
    peak_mb = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024
    print(json.dumps({'seconds': seconds, 'peakMB': peak_mb, 'rounds': int(counts.sum())}))


if __name__ == '__main__':
    main(sys.argv[1])
