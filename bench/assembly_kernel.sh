#!/usr/bin/env bash
# Per-assembly cost of the element and material kernel, two builds alternated in one session:
#   bash bench/assembly_kernel.sh OLD_BENCH NEW_BENCH RESULTS_DIR [ROUNDS] [REPEATS] > bench/results/assembly_kernel.txt
# OLD_BENCH / NEW_BENCH: bench_assembly_kernel executables of the two commits (the same bench source
# built against each); RESULTS_DIR: a hinge run's output folder with checkpoint.h5 (both restore the
# same state). Each round runs old then new; every run prints medians of REPEATS assemblies with 1
# and 2 threads; the table gives the median over rounds and the ratio old / new.
# The machine may be shared: the load average before and after is printed with the figures.
set -euo pipefail
old=$1 new=$2 dir=$3 rounds=${4:-5} repeats=${5:-7}
export OPENBLAS_NUM_THREADS=1
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
echo "# assembly_kernel: $(date -u '+%Y-%m-%d %H:%M UTC'), commit $(git -C "$(dirname "$0")" rev-parse --short HEAD), nproc $(nproc), $(grep -m1 'model name' /proc/cpuinfo | cut -d: -f2 | xargs)"
echo "# load average before: $(cut -d' ' -f1-3 /proc/loadavg) (the machine is shared: other work slows every figure)"
echo "# checkpoint: $dir; rounds $rounds (old, new alternated), $repeats assemblies per run and thread count"
for r in $(seq "$rounds"); do
  "$old" "$dir" "$repeats" 2>/dev/null | grep '^{' >> "$tmp/old.jsonl"
  "$new" "$dir" "$repeats" 2>/dev/null | grep '^{' >> "$tmp/new.jsonl"
done
echo "# load average after: $(cut -d' ' -f1-3 /proc/loadavg)"
python3 - "$tmp/old.jsonl" "$tmp/new.jsonl" <<'PY'
import json, statistics, sys
runs = [[json.loads(l) for l in open(p)] for p in sys.argv[1:3]]
first = runs[1][0]
print(f"# model: {first['elements']} elements, {first['layer_points']} layer points, state of path step {first['step']}")
print(f"# kernel: old {runs[0][0]['kernel']}; new {first['kernel']}")
print("quantity (median over rounds)                      old        new    old/new")
for t in (1, 2):
    for key, label, unit in (("tangent_residual_ms", "tangent+residual assembly", "ms"),
                             ("residual_ms", "residual-only assembly", "ms"),
                             ("tangent_residual_us_per_element", "tangent+residual per element (CPU)", "us"),
                             ("tangent_residual_ns_per_layer_point", "tangent+residual per layer point (CPU)", "ns")):
        o = statistics.median(r[f"threads_{t}"][key] for r in runs[0])
        n = statistics.median(r[f"threads_{t}"][key] for r in runs[1])
        print(f"{t} thread{'s' if t > 1 else ' '} {label + ' [' + unit + ']':<42} {o:9.2f} {n:9.2f} {o / n:8.2f}")
for name, rs in (("old", runs[0]), ("new", runs[1])):
    print(f"# {name} runs, 1-thread tangent+residual ms: " + " ".join(f"{r['threads_1']['tangent_residual_ms']:.1f}" for r in rs))
    print(f"# {name} runs, 2-thread tangent+residual ms: " + " ".join(f"{r['threads_2']['tangent_residual_ms']:.1f}" for r in rs))
PY
