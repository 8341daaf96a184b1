#!/usr/bin/env bash
# Measures the batch: wall time for 40 names against (single-name backtest time x 40 / 2), and peak RSS for 20 and
# 200 names. Invented data from make-universe.py. Run from the repository root:
#   bench/VolCast.Benchmarks/Batch/measure-batch.sh [WORK_DIR]
set -euo pipefail
here=$(cd "$(dirname "$0")" && pwd)
work=${1:-$(mktemp -d)}
dotnet build -c Release src/VolCast.Cli -o "$work/bin" -v q -nologo >/dev/null
volcast() { dotnet "$work/bin/volcast.dll" "$@"; }
python3 "$here/make-universe.py" 40 10 "$work/u40"
python3 "$here/make-universe.py" 20 2 "$work/u20"
python3 "$here/make-universe.py" 200 2 "$work/u200"

echo "single-name backtests (10 years):"
total=0
for k in 000 001 002; do
  s=$(date +%s.%N)
  volcast backtest --prices "$work/u40/prices/name$k.csv" --implied "$work/u40/implied/name$k.csv" --iv-unit decimal --out "$work/single-$k" >/dev/null
  e=$(date +%s.%N)
  t=$(echo "$e - $s" | bc -l); total=$(echo "$total + $t" | bc -l); echo "  name$k: $t s"
done
single=$(echo "$total / 3" | bc -l)
s=$(date +%s.%N)
volcast batch --prices-dir "$work/u40/prices" --implied-dir "$work/u40/implied" --iv-unit decimal --out "$work/batch40" >/dev/null
e=$(date +%s.%N)
batch=$(echo "$e - $s" | bc -l)
target=$(echo "$single * 40 / 2" | bc -l)
printf 'batch of 40 names: %.1f s; single x 40 / 2 = %.1f s; ratio %.3f\n' "$batch" "$target" "$(echo "$batch / $target" | bc -l)"

for n in 20 200; do
  /usr/bin/time -v dotnet "$work/bin/volcast.dll" batch --prices-dir "$work/u$n/prices" --implied-dir "$work/u$n/implied" --iv-unit decimal --out "$work/batch$n" >/dev/null 2>"$work/time$n.txt" || true
  printf '%s names (2 years): peak RSS %s kB, wall %s\n' "$n" "$(grep 'Maximum resident' "$work/time$n.txt" | awk '{print $NF}')" "$(grep 'Elapsed (wall' "$work/time$n.txt" | awk '{print $NF}')"
done
