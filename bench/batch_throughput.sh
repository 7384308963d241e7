#!/usr/bin/env bash
# Throughput of rotcap sweep on the eight coarse cases of bench/data/batch_eight_flanges.toml:
# two single-threaded workers (-j 2 --threads 1) against one worker with two threads
# (-j 1 --threads 2). Prints both wall times, the cases per minute and their ratio; run by
# bench/run_benchmarks.sh into bench/results/batch_throughput.txt. Needs 2 cores; an idle machine.
# Usage: bench/batch_throughput.sh [build-dir]   (default: build)
set -euo pipefail
cd "$(dirname "$0")/.."
build="${1:-build}"
rotcap="$build/rotcap"
plan=bench/data/batch_eight_flanges.toml
scratch="$(mktemp -d)"
trap 'rm -rf "$scratch"' EXIT
export ROTCAP_NO_PDF=1
sweep() {  # workers threads -> wall seconds
  local start end
  start=$(date +%s.%N)
  "$rotcap" sweep "$plan" -o "$scratch/w$1_t$2" -j "$1" --threads "$2" > "$scratch/w$1_t$2.txt" 2>&1 ||
    { cat "$scratch/w$1_t$2.txt" >&2; return 1; }
  end=$(date +%s.%N)
  echo "$end - $start" | bc -l
}
t_pool=$(sweep 2 1)
t_threads=$(sweep 1 2)
grep -h "done" "$scratch/w2_t1/status.csv" | wc -l | xargs echo "cases done (2 x 1 thread):"
grep -h "done" "$scratch/w1_t2/status.csv" | wc -l | xargs echo "cases done (1 x 2 threads):"
printf "2 workers x 1 thread : %7.1f s for 8 cases (%.2f cases/min)\n" "$t_pool" "$(echo "480 / $t_pool" | bc -l)"
printf "1 worker  x 2 threads: %7.1f s for 8 cases (%.2f cases/min)\n" "$t_threads" "$(echo "480 / $t_threads" | bc -l)"
printf "throughput ratio (2 x 1) / (1 x 2): %.2f\n" "$(echo "$t_threads / $t_pool" | bc -l)"
# The mean wall time per case of each run (status.csv, measured by the runner).
for d in w2_t1 w1_t2; do
  awk -F, 'NR > 1 { s += $NF; n++ } END { printf "%s: mean case wall %.1f s over %d cases\n", FILENAME, s / n, n }' \
    "$scratch/$d/status.csv" | sed "s|$scratch/||"
done
