#!/usr/bin/env bash
# Mesh study of the demo case (cases/carpark_girder.toml): `rotcap run --mesh-scale F` for each
# factor F (default 0.45 0.667 1 1.5, i.e. 8 x 10, 12 x 15, 18 x 23 (the default), 28 x 35 elements
# across flange x web), then the table of bench/study_table.py: M_max, theta at M_max, theta_u, R,
# theta_p, the failure mode and the run sizes, each change against the previous level. About 7 min on
# 2 cores: a study for bench/, not a test (the CI test runs the last two levels, stopping past the peak).
#
# Usage: bench/demo_mesh_study.sh [build-dir] [factor ...]
#        bench/demo_mesh_study.sh --table RESULTS_DIR ...   (tabulate finished results folders)
# Writes bench/results/demo_mesh_study.txt (runs) or prints the table (--table).
set -euo pipefail
cd "$(dirname "$0")/.."

table() { python3 bench/study_table.py --label mesh "$@"; }

if [[ "${1:-}" == "--table" ]]; then
  shift
  table "$@"
  exit 0
fi
build="${1:-build}"
shift || true
factors=("$@")
[[ ${#factors[@]} -gt 0 ]] || factors=(0.45 0.667 1 1.5)
export OPENBLAS_NUM_THREADS=1
work="$(mktemp -d)"
folders=()
for f in "${factors[@]}"; do
  "$build/rotcap" run cases/carpark_girder.toml --mesh-scale "$f" -o "$work/scale_$f" --quiet || true
  folders+=("$work/scale_$f")
done
mkdir -p bench/results
{
  echo "# demo mesh study: $(date -u '+%Y-%m-%d %H:%M UTC'), nproc $(nproc), commit $(git rev-parse --short HEAD 2>/dev/null || echo none)"
  echo "# rotcap run cases/carpark_girder.toml --mesh-scale F for F = ${factors[*]}"
  table "${folders[@]}"
} | tee bench/results/demo_mesh_study.txt
