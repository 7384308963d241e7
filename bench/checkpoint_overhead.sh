#!/usr/bin/env bash
# What checkpoints cost: the demo case run alternately with [output] checkpoint_every = 1 (the
# default: one checkpoint.h5 per converged step) and 0 (none), REPS times each, in one session.
# Prints each run's path wall time (summary.json solver.wall_s), the medians, their ratio, and the
# size of one checkpoint. Usage: bench/checkpoint_overhead.sh [build-dir] [mesh-scale] [reps]
set -euo pipefail
cd "$(dirname "$0")/.."
build="${1:-build}"
scale="${2:-1.0}"
reps="${3:-3}"
work="$(mktemp -d)"
export OPENBLAS_NUM_THREADS=1 OMP_NUM_THREADS=2
for every in 1 0; do
  sed "s/^\[output\]/[output]\ncheckpoint_every = $every/" cases/carpark_girder.toml > "$work/every_$every.toml"
  grep -q "checkpoint_every = $every" "$work/every_$every.toml" || { echo "cases/carpark_girder.toml has no [output] table" >&2; exit 1; }
done
for ((r = 1; r <= reps; ++r)); do
  for every in 1 0; do
    "$build/rotcap" run "$work/every_$every.toml" -o "$work/run_${every}_$r" --mesh-scale "$scale" --threads 2 --quiet
  done
done
python3 - "$work" "$reps" <<'PY'
import json, os, statistics, sys
work, reps = sys.argv[1], int(sys.argv[2])
walls = {e: [json.load(open(f"{work}/run_{e}_{r}/summary.json"))["solver"]["wall_s"] for r in range(1, reps + 1)] for e in (1, 0)}
s = json.load(open(f"{work}/run_1_1/summary.json"))
print(f"mesh: {s['mesh']['free_dofs']} free DOFs, {s['solver']['steps']} steps")
for e in (1, 0):
    print(f"checkpoint_every = {e}: wall " + ", ".join(f"{w:.1f}" for w in walls[e]) + f" s; median {statistics.median(walls[e]):.1f} s")
print(f"ratio (with / without checkpoints, medians): {statistics.median(walls[1]) / statistics.median(walls[0]):.3f}")
for r in range(1, reps + 1):
    v = json.load(open(f"{work}/run_1_{r}/summary.json"))["solver"]
    print(f"run {r} with checkpoints: {v['checkpoints']} written in {v['checkpoint_s']:.2f} s = "
          f"{100 * v['checkpoint_s'] / v['wall_s']:.1f} % of its wall time ({1e3 * v['checkpoint_s'] / v['checkpoints']:.0f} ms each)")
print(f"one checkpoint: {os.path.getsize(f'{work}/run_1_1/checkpoint.h5') / 1e6:.1f} MB")
same = all(open(f"{work}/run_1_{r}/curve.csv").read() == open(f"{work}/run_0_1/curve.csv").read() for r in range(1, reps + 1))
print(f"curve.csv identical with and without checkpoints: {same}")
PY
