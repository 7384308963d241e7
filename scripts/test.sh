#!/usr/bin/env bash
# Builds rotcap and runs the whole test suite (unit, verification, end-to-end) with ctest, then
# the fast tests again in a sanitized build (scripts/test-sanitized.sh; skipped with
# ROTCAP_SKIP_SANITIZED=1). Extra arguments go to both ctest runs.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/build.sh
# One BLAS and one OpenMP thread per test process: ctest runs one test per core at once, and the
# runs are then reproducible to the bit whatever the machine's core count. The core count is read
# before the export: GNU nproc honours OMP_NUM_THREADS (with it set to 1, ctest ran one test at a time).
jobs="$(nproc)"
export OPENBLAS_NUM_THREADS=1 OMP_NUM_THREADS=1
ctest --test-dir build --output-on-failure -j "$jobs" "$@"
if [[ "${ROTCAP_SKIP_SANITIZED:-0}" != 1 ]]; then
  bash scripts/test-sanitized.sh "$@"
fi
