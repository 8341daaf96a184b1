#!/usr/bin/env bash
# A batch split into shards with nothing but xargs (processes on this machine) or ssh (a few machines), all writing
# into one shared output folder, then the reduce here once every shard has ended.
#   deploy/xargs/shards.sh PRICES_DIR IMPLIED_DIR CONFIG OUT_DIR SHARDS            # SHARDS processes on this machine
#   deploy/xargs/shards.sh PRICES_DIR IMPLIED_DIR CONFIG OUT_DIR host1 host2 ...   # one shard per host, over ssh
# With hosts, every host must see the four paths under the same names (an NFS mount or a synced folder) and run the
# same volcast version (the reduce refuses names computed by another). Rerun the script after a failure: each shard
# keeps the names it already finished, so only what is missing is computed. VOLCAST names the command
# (default volcast; for example VOLCAST="dotnet /opt/volcast/volcast.dll").
set -uo pipefail

if [ "$#" -lt 5 ]; then
  echo "usage: $0 PRICES_DIR IMPLIED_DIR CONFIG OUT_DIR (SHARDS | HOST...)" >&2
  exit 2
fi

prices=$1 implied=$2 config=$3 out=$4
shift 4
volcast=${VOLCAST:-volcast}
common=(batch --prices-dir "$prices" --implied-dir "$implied" --iv-unit decimal --config "$config" --out "$out" --reports summary --jobs 1)

if [ "$#" -eq 1 ] && [[ $1 =~ ^[0-9]+$ ]]; then
  n=$1
  # xargs starts the N shards at once (-P); it returns non-zero when any shard did, which the reduce then explains.
  seq 0 $((n - 1)) | xargs -P "$n" -I{} $volcast "${common[@]}" --shard "{}/$n"
  # The same with GNU parallel:  parallel -j "$n" $volcast "${common[@]}" --shard {}/"$n" ::: $(seq 0 $((n - 1)))
else
  hosts=("$@")
  n=${#hosts[@]}
  for k in "${!hosts[@]}"; do
    ssh "${hosts[$k]}" "$volcast $(printf '%q ' "${common[@]}") --shard $k/$n" &
  done
  wait
fi

# The reduce needs only the output folder: the names and the options come from $out/batch-plan.json, which every shard wrote.
exec $volcast batch --reduce --out "$out"
