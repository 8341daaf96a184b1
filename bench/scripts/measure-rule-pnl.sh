#!/usr/bin/env bash
# Measures the whole `volcast backtest` command on the demo data with the default settings, with and without the
# rule's trading P&L stage, on the Release build. "Without" sets ruleForecaster to implied: the rule then cannot fire,
# the stage stops at once and says why, and every other stage (the same forecasters, scoring, odds checks, report)
# runs unchanged. Prints one line per run: wall seconds, user + system CPU seconds, peak RSS in MB.
#
#   bench/scripts/measure-rule-pnl.sh [RUNS] [VOLCAST]   (default 3 runs of each, alternating; VOLCAST is the
#                                                        executable to measure, default the Release build, for example
#                                                        the ReadyToRun publish: dotnet publish src/VolCast.Cli
#                                                        -p:PublishProfile=ReadyToRun -o /tmp/r2r, then /tmp/r2r/volcast)
# The last line gives what the stage adds, mean and median of each variant, in wall time and in CPU.
set -euo pipefail
root="$(cd "$(dirname "$0")/../.." && pwd)"
runs="${1:-3}"
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
volcast="${2:-}"
if [ -z "$volcast" ]; then
  dotnet build "$root/src/VolCast.Cli" -c Release -v quiet -nologo >/dev/null
  volcast="$root/src/VolCast.Cli/bin/Release/net10.0/volcast"
fi
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
    cpu="$(echo "$user + $sys" | bc)"
    printf '%-8s run %d: %6.2f s wall, %6.2f s CPU, %4d MB peak (%s)\n' "$variant" "$i" "$wall" "$cpu" "$((rss / 1024))" "$stage"
    echo "$variant $wall $cpu" >> "$work/all"
  done
done
python3 - "$work/all" <<'EOF'
import statistics as st, sys
runs = {"with": ([], []), "without": ([], [])}
for line in open(sys.argv[1]):
    variant, wall, cpu = line.split()
    runs[variant][0].append(float(wall))
    runs[variant][1].append(float(cpu))
for variant, (wall, cpu) in runs.items():
    print("%-8s %d runs: wall %.3f / %.3f s, CPU %.3f / %.3f s (mean / median)"
          % (variant, len(wall), st.mean(wall), st.median(wall), st.mean(cpu), st.median(cpu)))
def adds(i, f):
    return 100 * (f(runs["with"][i]) / f(runs["without"][i]) - 1)
print("the stage adds: wall %+.1f%% (mean) / %+.1f%% (median), CPU %+.1f%% / %+.1f%%"
      % (adds(0, st.mean), adds(0, st.median), adds(1, st.mean), adds(1, st.median)))
EOF
