#!/usr/bin/env bash
# Step-size study of the demo case (cases/carpark_girder.toml): the same model traced with constant
# arc-length steps S (analysis.first_step = S, max_step_ratio = 1: cut-backs halve and regrow to S)
# for each S given (default 0.4 0.2 0.1 0.05 0.025), at one mesh (--mesh-scale F, default 1), then
# the table of bench/study_table.py, each row against the previous one. Shows how far the
# moment-rotation curve of the buckling hinge depends on the step (first order: backward-Euler
# plasticity along a non-proportional path) and backs the default step of generated models (0.05).
#
# Usage: bench/step_size_study.sh [build-dir] [mesh-scale] [step ...]
# Writes bench/results/step_size_study.txt (appends a section per call).
set -euo pipefail
cd "$(dirname "$0")/.."
build="${1:-build}"
scale="${2:-1}"
shift 2 || shift $# || true
steps=("$@")
[[ ${#steps[@]} -gt 0 ]] || steps=(0.4 0.2 0.1 0.05 0.025)
export OPENBLAS_NUM_THREADS=1
work="$(mktemp -d)"
folders=()
for s in "${steps[@]}"; do
  # The demo case with the step keys added at the top of [analysis] and room for the steps.
  sed -e "s/^max_steps = .*/max_steps = 2000/" \
      -e "s/^\[analysis\]\$/[analysis]\nfirst_step = $s\nmax_step_ratio = 1.0/" \
      cases/carpark_girder.toml > "$work/step_$s.toml"
  "$build/rotcap" run "$work/step_$s.toml" --mesh-scale "$scale" -o "$work/step_$s" --quiet || true
  folders+=("$work/step_$s")
done
mkdir -p bench/results
{
  echo
  echo "# demo step-size study: $(date -u '+%Y-%m-%d %H:%M UTC'), nproc $(nproc), commit $(git rev-parse --short HEAD 2>/dev/null || echo none)"
  echo "# rotcap run cases/carpark_girder.toml --mesh-scale $scale with first_step = S, max_step_ratio = 1 for S = ${steps[*]}"
  python3 bench/study_table.py --label step "${folders[@]}"
} | tee -a bench/results/step_size_study.txt
