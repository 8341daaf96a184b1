#!/usr/bin/env bash
# A batch split over a Slurm job array, and the reduce as a job that starts only when every task succeeded.
# Submit from a login node with the folders on a file system every node mounts (home, project or scratch):
#   deploy/slurm/batch-array.sh /shared/prices /shared/implied /shared/config.json /shared/out [SHARDS]
# Each array task takes its shard from SLURM_ARRAY_TASK_ID and SLURM_ARRAY_TASK_COUNT (--shard auto), so the array
# must be one unbroken range (0-N); a failed task can be resubmitted alone (sbatch --array=K ...), and it keeps the
# names it had already finished.
set -euo pipefail

if [ "$#" -lt 4 ]; then
  echo "usage: $0 PRICES_DIR IMPLIED_DIR CONFIG OUT_DIR [SHARDS]" >&2
  exit 2
fi

prices=$1 implied=$2 config=$3 out=$4 shards=${5:-8}
volcast=${VOLCAST:-volcast}   # the published CLI, or "dotnet /path/to/volcast.dll"
common=(batch --prices-dir "$prices" --implied-dir "$implied" --iv-unit decimal --config "$config" --out "$out" --reports summary)
mkdir -p "$out/logs"

# --parsable prints the job id alone; the reduce depends on every task of the array ending with exit code 0.
# A shard that had a bad input file exits 3 after finishing its other names; use afterany instead of afterok to
# reduce anyway (the reduce then lists the failed names in the summary, as one batch does).
array=$(sbatch --parsable --array="0-$((shards - 1))" --cpus-per-task=2 --mem=2G --time=04:00:00 \
  --job-name=volcast-shards --output="$out/logs/shard-%a.log" \
  --wrap="$volcast ${common[*]@Q} --shard auto --jobs \${SLURM_CPUS_PER_TASK:-1}")

# The reduce needs only the output folder: the names and the options come from $out/batch-plan.json, which every task wrote.
sbatch --parsable --dependency="afterok:${array}" --cpus-per-task=1 --mem=1G --time=00:30:00 \
  --job-name=volcast-reduce --output="$out/logs/reduce.log" \
  --wrap="$volcast batch --reduce --out ${out@Q}"
