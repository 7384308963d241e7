#!/usr/bin/env bash
# Per-iteration cost against model size (issue 15, item 6): bench_scaling (bench/scaling.cpp) once per
# mesh scale, each in its own process (so that each peak RSS is that size's own), then
# bench/scaling_report.py: the table, the fitted exponents p of cost ~ N^p and the log-log plot.
# Writes bench/results/scaling.txt, scaling.svg and scaling.jsonl (the raw JSON lines, one per size).
# Usage: bench/scaling.sh [build-dir] [repeats] [case] [scales...]
#   defaults: build, 3 repeats, cases/carpark_girder.toml, scales 0.5 0.75 1 1.5 2 2.5 3
#   (about 10k to 300k free DOFs; the largest takes a few minutes and about 2 GB).
# Environment: SCALING_THREADS (assembly threads, default 1), SCALING_LOAD_FACTOR (default 0.9),
#   SCALING_RESULTS (folder of the three files, default bench/results).
# Times are wall-clock medians; run it on a machine as idle as you can get.
set -euo pipefail
cd "$(dirname "$0")/.."
build="${1:-build}"
repeats="${2:-3}"
case_file="${3:-cases/carpark_girder.toml}"
shift $(( $# < 3 ? $# : 3 ))
scales=("$@")
[ ${#scales[@]} -gt 0 ] || scales=(0.5 0.75 1 1.5 2 2.5 3)
threads="${SCALING_THREADS:-1}"
load_factor="${SCALING_LOAD_FACTOR:-0.9}"
cores="$(nproc --all)"
export OPENBLAS_NUM_THREADS=1 OMP_NUM_THREADS="$threads"
results="${SCALING_RESULTS:-bench/results}"
mkdir -p "$results"
out="$results/scaling.jsonl"
: > "$out"
cpu="$(grep -m1 'model name' /proc/cpuinfo | cut -d: -f2- | sed 's/^ *//' || true)"
header=("# scaling: $(date -u '+%Y-%m-%d %H:%M UTC'), commit $(git rev-parse --short HEAD 2>/dev/null || echo none), nproc ${cores}, CPU ${cpu:-unknown}"
        "# load average before the run: $(cut -d' ' -f1-3 /proc/loadavg) (shared machine: other builds and runs slow every figure)"
        "# case $case_file, --mesh-scale ${scales[*]}; one process per size; assembly with $threads OpenMP thread(s), one BLAS thread"
        "# state: residual stresses equilibrated, then load control to load factor $load_factor (M = $load_factor Mp), no imperfection"
        "# times: medians of $repeats repeats [ms]; analysis = ordering + symbolic factorisation, once; solve = one LL^T solve"
        "# peak RSS = ru_maxrss at the end (program state + this bench's own LL^T and LDL^T factors); program RSS = before them")
for s in "${scales[@]}"; do
  load="$(cut -d' ' -f1 /proc/loadavg)"
  echo "scale $s (load average $load) ..." >&2
  "$build/bench/bench_scaling" "$case_file" "$s" --repeats "$repeats" --threads "$threads" --load-factor "$load_factor" \
    | tail -n 1 | python3 -c "import json,sys; r=json.load(sys.stdin); r['load_average']='$load'; print(json.dumps(r))" >> "$out"
done
python3 bench/scaling_report.py "$out" "$results/scaling.txt" "$results/scaling.svg" "${header[@]}"
