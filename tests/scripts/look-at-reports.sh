#!/usr/bin/env bash
# Writes reports for a person to look at (charts, layout, wording), which no automated check can judge:
#   demo/       volcast demo on data-demo (every section, the odds checks included)
#   no-implied/ volcast backtest of one demo asset with no implied series (the sections that then stay empty)
# Usage: tests/scripts/look-at-reports.sh [FOLDER]   (default: a new temporary folder). Prints the reports' paths.
set -euo pipefail
cd "$(dirname "$0")/../.."

out="${1:-$(mktemp -d -t volcast-look-XXXXXX)}"
mkdir -p "$out"

dotnet build src/VolCast.Cli/VolCast.Cli.csproj -c Release -nologo -v quiet >/dev/null
volcast=(dotnet src/VolCast.Cli/bin/Release/net10.0/volcast.dll)

"${volcast[@]}" demo --out "$out/demo" --force >/dev/null
"${volcast[@]}" backtest --prices data-demo/alder-ridge.csv --out "$out/no-implied" --force >/dev/null

echo "$out/demo/report.html"
echo "$out/no-implied/report.html"
