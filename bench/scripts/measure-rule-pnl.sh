#!/usr/bin/env bash
# Measures the whole `volcast backtest` command on the demo data with the default settings, with and without the
# rule's trading P&L stage, on the Release build. "Without" sets ruleForecaster to implied: the rule then cannot fire,
# the stage stops at once and says why, and every other stage (the same forecasters, scoring, odds checks, report)
# runs unchanged. Prints one line per run: wall seconds, user + system CPU seconds, peak RSS in MB.
#
#   bench/scripts/measure-rule-pnl.sh [RUNS]        (default 3 runs of each, alternating)
set -euo pipefail
root="$(cd "$(dirname "$0")/../.." && pwd)"
runs="${1:-3}"
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
dotnet build "$root/src/VolCast.Cli" -c Release -v quiet -nologo >/dev/null
volcast="$root/src/VolCast.Cli/bin/Release/net10.0/volcast"
prices="$root/data-demo/alder-ridge.csv"
implied="$root/data-demo/alder-ridge-implied-30d.csv"
echo '{}' > "$work/with.json"
echo '{"ruleForecaster": "implied"}' > "$work/without.json"
for i in $(seq 1 "$runs"); do
  for variant in with without; do
    out="$work/out-$variant-$i"
    /usr/bin/time -f "%e %U %S %M" -o "$work/time" \
      "$volcast" backtest --prices "$prices" --implied "$implied" --iv-unit decimal --config "$work/$variant.json" --out "$out" >/dev/null
    read -r wall user sys rss < "$work/time"
    test -f "$out/trades.csv" && stage="P&L stage ran" || stage="no P&L stage"
    printf '%-8s run %d: %6.2f s wall, %6.2f s CPU, %4d MB peak (%s)\n' "$variant" "$i" "$wall" "$(echo "$user + $sys" | bc)" "$((rss / 1024))" "$stage"
  done
done
