#!/usr/bin/env python3
"""Writes a seeded synthetic daily OHLC history of N rows for the scaling measurements in bench/README.md.

Usage: make-long-history.py ROWS OUT.csv

Weekdays from 1900-01-01 on; closes follow a GARCH(1,1)-like random walk (omega 2e-6, alpha 0.08,
beta 0.90, seed 7); each bar's open, high and low are drawn around the close so the row checks hold.
A million weekdays end in the 5730s, inside the readers' accepted range of years.
"""
import datetime
import math
import random
import sys

rows = int(sys.argv[1])
rng = random.Random(7)
day = datetime.date(1900, 1, 1)
one = datetime.timedelta(days=1)
close = 100.0
var = 1e-4
with open(sys.argv[2], "w", encoding="utf-8", newline="\n") as f:
    f.write("date,open,high,low,close\n")
    for _ in range(rows):
        while day.weekday() >= 5:
            day += one
        z = rng.gauss(0.0, 1.0)
        r = math.sqrt(var) * z
        var = 2e-6 + 0.08 * r * r + 0.90 * var
        opened = close * math.exp(math.sqrt(var) * 0.3 * rng.gauss(0.0, 1.0))
        close = close * math.exp(r)
        if close < 1.0 or close > 1e6:
            close = 100.0
        hi = max(opened, close) * math.exp(abs(rng.gauss(0.0, 1.0)) * math.sqrt(var) * 0.5)
        lo = min(opened, close) * math.exp(-abs(rng.gauss(0.0, 1.0)) * math.sqrt(var) * 0.5)
        f.write(f"{day.isoformat()},{opened:.6f},{hi:.6f},{lo:.6f},{close:.6f}\n")
        day += one
