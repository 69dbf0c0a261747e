#!/usr/bin/env bash
# Run fropa over an archive in N shards on one machine with GNU parallel (Debian package `parallel`), then
# merge them: the result is what one `fropa detect` over the whole archive gives.
#   deploy/shards/parallel.sh ARCHIVE OUTDIR [SHARDS] [detect options...]
# SHARDS defaults to the number of cores; each shard runs one detection thread (--jobs 1). Shard outputs go to
# OUTDIR/shard-K.ndjson, the merged bundle (events.csv, events.json, fronts.csv, fronts.json, summary.txt) to
# OUTDIR/merged/. FROPA names the command (default `fropa`). A shard that exits 3 (some stations failed and were
# skipped, each named on its standard error) still counts as done; any other failure stops the run.
set -euo pipefail
if [ $# -lt 2 ]; then
  echo "usage: $0 ARCHIVE OUTDIR [SHARDS] [detect options...]" >&2
  exit 2
fi
archive=$1
out=$2
shift 2
shards=$(nproc)
if [ $# -gt 0 ] && [[ $1 =~ ^[0-9]+$ ]]; then
  shards=$1
  shift
fi
fropa=${FROPA:-fropa}
mkdir -p "$out"
extra=''
if [ $# -gt 0 ]; then extra=$(printf ' %q' "$@"); fi
seq 1 "$shards" | parallel --halt now,fail=1 \
  "$fropa detect $(printf %q "$archive")$extra --shard {}/$shards --jobs 1 --quiet --out $(printf %q "$out")/shard-{}.ndjson || [ \$? -eq 3 ]"
status=0
$fropa merge "$out"/shard-*.ndjson --out-dir "$out/merged" || status=$?
exit "$status"
