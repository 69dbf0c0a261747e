#!/bin/bash
# Slurm job array: one fropa shard per array task, then `fropa merge` once all have finished:
#   sbatch deploy/shards/slurm.sh                         # 8 shards of $ARCHIVE into $OUT
#   sbatch --dependency=afterok:<jobid> --wrap "fropa merge $OUT --out-dir $OUT/merged"
# Task K of the array (SLURM_ARRAY_TASK_ID, 1…N) runs shard K of N (N = SLURM_ARRAY_TASK_COUNT); keep
# --array=1-N and the shard count together. Exit status 3 of a shard means some stations failed and were skipped.
#SBATCH --job-name=fropa-shards
#SBATCH --array=1-8
#SBATCH --cpus-per-task=2
#SBATCH --mem=2G
#SBATCH --output=fropa-shard-%A_%a.log
set -euo pipefail
ARCHIVE=${ARCHIVE:-/data/archive}
OUT=${OUT:-fropa-shards}
FROPA=${FROPA:-fropa}
SHARDS=${SLURM_ARRAY_TASK_COUNT:?run as a Slurm job array (sbatch)}
K=${SLURM_ARRAY_TASK_ID:?run as a Slurm job array (sbatch)}
mkdir -p "$OUT"
exec $FROPA detect "$ARCHIVE" --jobs "${SLURM_CPUS_PER_TASK:-1}" --shard "$K/$SHARDS" --quiet --out "$OUT/shard-$K.ndjson"
