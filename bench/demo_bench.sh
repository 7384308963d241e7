#!/usr/bin/env bash
# The demo's model size, wall time, steps, iterations per step and the split of time between
# assembly, factorisation and the rest, from one run of `rotcap demo` (summary.json "solver").
# Usage: bench/demo_bench.sh [build-dir]; run on an otherwise idle machine.
set -euo pipefail
cd "$(dirname "$0")/.."
build="${1:-build}"
out="$(mktemp -d)/demo"
export OPENBLAS_NUM_THREADS=1
"$build/rotcap" demo -o "$out" --quiet
python3 - "$out/summary.json" <<'PY'
import json, sys
s = json.load(open(sys.argv[1]))
v = s["solver"]
rest = v["wall_s"] - v["assembly_s"] - v["factorisation_s"]
print(f"nodes {v['nodes']}, elements {v['elements']}, free DOFs {v['free_dofs']}")
print(f"steps {v['steps']}, iterations {v['iterations']} ({v['iterations_per_step']:.2f} per step), cut-backs {v['cutbacks']}, factorisations {v['factorisations']}")
print(f"wall {v['wall_s']:.1f} s: assembly {v['assembly_s']:.1f} s ({100*v['assembly_s']/v['wall_s']:.0f} %), "
      f"factorisation {v['factorisation_s']:.1f} s ({100*v['factorisation_s']/v['wall_s']:.0f} %), rest {rest:.1f} s (buckling, output, solves)")
ni, ti = v["indefinite_factorisations"], v["indefinite_factorisation_s"]
nd, td = v["factorisations"] - ni, v["factorisation_s"] - ti
print(f"factorisations: {nd} LL^T attempts {td:.1f} s ({1e3*td/max(nd,1):.0f} ms each, failed ones included), "
      f"{ni} supernodal LDL^T {ti:.1f} s ({1e3*ti/max(ni,1):.0f} ms each)")
print(f"R = {s['rotation_capacity']}, M_max/Mp = {s['m_max_over_mp']:.4f}")
PY
