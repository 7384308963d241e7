#!/usr/bin/env bash
# How far the demo runs from its floor: ratio = wall / (iterations x (factorisation + 2 solves)) of
# the demo's own tangent, in one session:
#  1. the demo case run whole (wall time, iterations, the LL^T and LDL^T counts);
#  2. the same case stopped at max_rotation = 8 mrad (before the peak at ~14 mrad) and then extended
#     with rotcap resume to the case's own max_rotation (past the peak): two checkpoints;
#  3. bench_solver_floor on each: median bare factorisation and solve times of that tangent.
# Usage: bench/solver_floor.sh [build-dir] [repeats]
set -euo pipefail
cd "$(dirname "$0")/.."
build="${1:-build}"
repeats="${2:-5}"
work="$(mktemp -d)"
export OPENBLAS_NUM_THREADS=1
case_file="$work/demo.toml"
cp cases/carpark_girder.toml "$case_file"
max_rotation="$(sed -n 's/^max_rotation *= *\([0-9.]*\).*/\1/p' "$case_file")"
"$build/rotcap" run "$case_file" -o "$work/whole" --quiet
sed "s/^max_rotation *= *[0-9.]*/max_rotation = 0.008/" cases/carpark_girder.toml > "$work/pre.toml"
"$build/rotcap" run "$work/pre.toml" -o "$work/pre" --quiet
"$build/bench/bench_solver_floor" "$work/pre" "$repeats" | tail -n 1 > "$work/pre_floor.json"
"$build/rotcap" resume "$work/pre" --max-rotation "$max_rotation" --quiet
"$build/bench/bench_solver_floor" "$work/pre" "$repeats" | tail -n 1 > "$work/post_floor.json"
python3 - "$work" <<'PY'
import json, sys
w = sys.argv[1]
s = json.load(open(f"{w}/whole/summary.json"))["solver"]
pre, post = (json.load(open(f"{w}/{n}_floor.json")) for n in ("pre", "post"))
n_ldlt = s["indefinite_factorisations"]
n_llt = s["factorisations"] - n_ldlt
print(f"demo: {s['free_dofs']} free DOFs, {s['steps']} steps, {s['iterations']} iterations, "
      f"{s['factorisations']} factorisations ({n_llt} LL^T attempts, {n_ldlt} LDL^T), wall {s['wall_s']:.1f} s, "
      f"assembly {s['assembly_s']:.1f} s, factorisation {s['factorisation_s']:.1f} s")
for name, f in (("before the peak", pre), ("past the peak", post)):
    llt = f"LL^T {1e3*f['llt_factorisation_s']:.0f} ms ({f['llt_status']})"
    print(f"tangent {name} (step {f['step']}, {f['negative_pivots']} negative pivots): {llt}, "
          f"LDL^T {1e3*f['ldlt_factorisation_s']:.0f} ms, solve {1e3*f['ldlt_solve_s']:.1f} ms (LDL^T), "
          f"assembly + factorisation in the program {1e3*f['evaluate_s']:.0f} ms")
# The floor takes the faster bare factorisation of each tangent (LL^T only where it succeeds) and
# weights the two tangents by the run's iterations before and past the peak (curve.csv: negative
# pivots of each step).
import csv
rows = list(csv.DictReader(open(f"{w}/whole/curve.csv")))
it_pre = sum(int(r["iterations"]) for r in rows if int(r["negative_pivots"]) == 0)
it_post = sum(int(r["iterations"]) for r in rows if int(r["negative_pivots"]) > 0)
fact_pre = pre["ldlt_factorisation_s"]
if pre["llt_status"] == "Ok": fact_pre = min(fact_pre, pre["llt_factorisation_s"])
solve_pre = pre["llt_solve_s"] if pre["llt_solve_s"] is not None else pre["ldlt_solve_s"]
per_pre = fact_pre + 2 * min(solve_pre, pre["ldlt_solve_s"])
per_post = post["ldlt_factorisation_s"] + 2 * post["ldlt_solve_s"]
floor = it_pre * per_pre + it_post * per_post
print(f"floor = iterations x (factorisation + 2 solves) = {it_pre} x {1e3*per_pre:.0f} ms (before the peak) "
      f"+ {it_post} x {1e3*per_post:.0f} ms (past it) = {floor:.1f} s")
print(f"ratio = wall / floor = {s['wall_s']:.1f} / {floor:.1f} = {s['wall_s']/floor:.2f}  (target <= 1.25)")
n_f = s["factorisations"]
per = floor / max(it_pre + it_post, 1)
print(f"with every factorisation of the run ({n_f}) as the floor: ratio {s['wall_s']/(n_f*per):.2f}")
PY
