#!/usr/bin/env bash
# Builds the benchmarks (Release) and runs them one after another; each writes its output, with
# the date, the core count (nproc) and the CPU model, to bench/results/<name>.txt.
# Usage: bench/run_benchmarks.sh [build-dir]   (default: build)
# The last one, bench/scaling.sh (per-iteration cost and memory from about 10k to 300k DOFs, fitted
# exponents, plot), writes bench/results/scaling.{txt,svg,jsonl} itself. Not run here, as it needs an
# older commit: bench/before_after.sh OLD_COMMIT [repeats] [case] [rotcap run options] builds that
# commit in a temporary worktree and alternates its runs with the current tree's (table on stdout).
# Run it on an otherwise idle machine: the figures are wall-clock times.
set -euo pipefail
cd "$(dirname "$0")/.."
build="${1:-build}"
cmake -S . -B "$build" -DCMAKE_BUILD_TYPE=Release > /dev/null
cmake --build "$build" --target bench_linear_plate bench_scaling rotcap -j "$(nproc)"
mkdir -p bench/results
export OPENBLAS_NUM_THREADS=1   # CHOLMOD's BLAS single-threaded; the cores go to OpenMP assembly
cpu="$(grep -m1 'model name' /proc/cpuinfo | cut -d: -f2- | sed 's/^ *//' || true)"
run() {
  local name="$1"; shift
  {
    echo "# ${name}: $(date -u '+%Y-%m-%d %H:%M UTC'), nproc $(nproc), CPU ${cpu:-unknown}, commit $(git rev-parse --short HEAD 2>/dev/null || echo none)"
    echo "# load average before the run: $(cut -d" " -f1-3 /proc/loadavg) (other work on the machine slows every figure)"
    "$@"
  } | tee "bench/results/${name}.txt"
}
run linear_plate "$build/bench/bench_linear_plate"
run demo bench/demo_bench.sh "$build"
run batch_throughput bench/batch_throughput.sh "$build"
bench/scaling.sh "$build"
