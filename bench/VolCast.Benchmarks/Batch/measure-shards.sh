#!/usr/bin/env bash
# Measures a batch split into shards against the same batch in one process, on the 20 invented names of
# data-demo/universe (8 years each), default configuration and report pages: the one-process batch (--jobs 2), then
# three shards started at once into one folder (--jobs 1 each) followed by the reduce given only the folder. Prints
# wall time and CPU time (user + sys, /usr/bin/time) of each, and checks that the two summaries are the same bytes.
# Run from the repository root:
#   bench/VolCast.Benchmarks/Batch/measure-shards.sh [WORK_DIR]
set -euo pipefail
work=${1:-$(mktemp -d)}
dotnet build -c Release src/VolCast.Cli -o "$work/bin" -v q -nologo >/dev/null
prices=data-demo/universe/prices implied=data-demo/universe/implied
args=(batch --prices-dir "$prices" --implied-dir "$implied" --iv-unit decimal)
timed() { # timed NAME COMMAND...: runs the command under /usr/bin/time, keeping "wall user sys" in $work/NAME.time
  local name=$1; shift
  /usr/bin/time -f '%e %U %S' -o "$work/$name.time" "$@" >"$work/$name.log" 2>&1 || true
}
show() { awk -v n="$1" '{ printf "%-22s wall %6.1f s   cpu %6.1f s (user %.1f, sys %.1f)\n", n, $1, $2 + $3, $2, $3 }' "$work/$1.time"; }

rm -rf "$work/one" "$work/sharded"
timed one dotnet "$work/bin/volcast.dll" "${args[@]}" --out "$work/one" --jobs 2
start=$(date +%s.%N)
for k in 0 1 2; do
  timed "shard$k" dotnet "$work/bin/volcast.dll" "${args[@]}" --out "$work/sharded" --jobs 1 --shard "$k/3" &
done
wait
shards_wall=$(echo "$(date +%s.%N) - $start" | bc -l)
timed reduce dotnet "$work/bin/volcast.dll" batch --reduce --out "$work/sharded"

show one
for k in 0 1 2; do show "shard$k"; done
show reduce
awk -v w="$shards_wall" '{ cpu += $2 + $3 } END { printf "%-22s wall %6.1f s   cpu %6.1f s\n", "three shards together", w, cpu }' "$work"/shard?.time
for f in summary.csv lookbacks.csv beats-implied.csv summary.html; do
  if cmp -s "$work/one/$f" "$work/sharded/$f"; then echo "$f: same bytes"; else echo "$f: DIFFERS"; fi
done
