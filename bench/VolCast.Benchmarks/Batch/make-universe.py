#!/usr/bin/env python3
"""Writes an invented universe for the batch measurement: N names of daily OHLC prices with GARCH(1,1)-like volatility
and an implied series (true forward vol plus a premium and noise). Invented data, for timing and memory only.
Usage: make-universe.py N YEARS OUT_DIR [SEED]"""
import math, os, random, sys
from datetime import date, timedelta

n, years, out = int(sys.argv[1]), int(sys.argv[2]), sys.argv[3]
seed = int(sys.argv[4]) if len(sys.argv) > 4 else 20261201
os.makedirs(os.path.join(out, "prices"), exist_ok=True)
os.makedirs(os.path.join(out, "implied"), exist_ok=True)
for k in range(n):
    rng = random.Random(seed + k)
    omega, alpha, beta = 2e-6 * (1 + k % 5), 0.05 + 0.01 * (k % 4), 0.90 - 0.01 * (k % 4)
    var = omega / (1 - alpha - beta)
    premium = 0.01 + 0.005 * (k % 7)
    price, d = 100.0, date(2004, 1, 2)
    prices, implied = ["date,open,high,low,close"], ["date,iv"]
    for _ in range(252 * years):
        while d.weekday() >= 5:
            d += timedelta(days=1)
        z = rng.gauss(0, 1)
        r = math.sqrt(var) * z
        o = price * math.exp(math.sqrt(var) * 0.2 * rng.gauss(0, 1))
        c = price * math.exp(r)
        hi = max(o, c) * math.exp(abs(rng.gauss(0, 1)) * math.sqrt(var) * 0.5)
        lo = min(o, c) * math.exp(-abs(rng.gauss(0, 1)) * math.sqrt(var) * 0.5)
        prices.append(f"{d.isoformat()},{o:.6f},{hi:.6f},{lo:.6f},{c:.6f}")
        iv = math.sqrt(252 * var) + premium + 0.01 * rng.gauss(0, 1)
        implied.append(f"{d.isoformat()},{max(iv, 0.02):.6f}")
        var = omega + alpha * r * r + beta * var
        price = c
        d += timedelta(days=1)
    name = f"name{k:03d}"
    with open(os.path.join(out, "prices", name + ".csv"), "w") as f:
        f.write("\n".join(prices) + "\n")
    with open(os.path.join(out, "implied", name + ".csv"), "w") as f:
        f.write("\n".join(implied) + "\n")
