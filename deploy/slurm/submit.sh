#!/bin/bash
# Submits a sharded coldsoak screen to Slurm: the job array of n shards (0 … n−1), then the merge,
# which starts only when every shard has succeeded (deploy/README.md).
# Usage: deploy/slurm/submit.sh plan.yaml archive/ workdir [n, default 50]
set -euo pipefail
plan=$(realpath "${1:?usage: submit.sh plan.yaml archive workdir [n]}")
archive=$(realpath "${2:?usage: submit.sh plan.yaml archive workdir [n]}")
work=${3:?usage: submit.sh plan.yaml archive workdir [n]}
shards=${4:-50}
here=$(dirname "$(realpath "$0")")
mkdir -p "$work/parts" "$work/results"
work=$(realpath "$work")

array=$(sbatch --parsable --array="0-$((shards - 1))" --chdir="$work" \
  --export=ALL,PLAN="$plan",ARCHIVE="$archive",PARTS="$work/parts" \
  "$here/screen-array.sbatch")
array=${array%%;*}
merge=$(sbatch --parsable --dependency="afterok:$array" --chdir="$work" \
  --export=ALL,PARTS="$work/parts",SHARDS="$shards",OUT="$work/results" \
  "$here/merge.sbatch")
echo "shards: job $array (array 0-$((shards - 1))); merge: job ${merge%%;*} → $work/results"
