"""What a lab would write instead: read the round log with the csv module, check each field,
count rounds by settings and outcomes for test and generation rounds (half chosen at random).
Prints {seconds, peakMB, rounds} as JSON. Usage: python3 count_rounds.py <log>"""
import csv
import gzip
import json
import random
import resource
import sys
import time


def open_log(path):
    with open(path, 'rb') as probe:
        magic = probe.read(2)
    if magic == b'\x1f\x8b':
        return gzip.open(path, 'rt', newline='', encoding='utf-8-sig')
    return open(path, newline='', encoding='utf-8-sig')


def main(path):
    started = time.perf_counter()
    counts = {True: [0] * 24, False: [0] * 24}
    rng = random.Random(1)
    rounds = 0
    with open_log(path) as handle:
        reader = csv.reader(handle)
        header = next(reader)
        where = {name: header.index(name) for name in ('round', 'x', 'y', 'a', 'b')}
        for row in reader:
            if not row:
                continue
            x, y, a, b = (int(row[where[name]]) for name in ('x', 'y', 'a', 'b'))
            int(row[where['round']])
            if x not in (0, 1) or y not in (0, 1, 2) or a not in (0, 1) or b not in (0, 1):
                raise ValueError(f'bad row {row}')
            counts[rng.random() < 0.5][((x * 3 + y) * 2 + a) * 2 + b] += 1
            rounds += 1
    seconds = time.perf_counter() - started
    peak_mb = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024
    print(json.dumps({'seconds': seconds, 'peakMB': peak_mb, 'rounds': rounds}))


if __name__ == '__main__':
    main(sys.argv[1])
