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
# The sanitized tree is built at low priority while the Release tests run: their last half is one
# long mesh study on one core, which leaves the other core to the compiler.
sanitized=1
[[ "${ROTCAP_SKIP_SANITIZED:-0}" == 1 ]] && sanitized=0
if [[ $sanitized == 1 ]]; then
  ROTCAP_SANITIZED_STEP=build nice -n 10 bash scripts/test-sanitized.sh > build-asan.log 2>&1 &
  asan_build=$!
fi
export OPENBLAS_NUM_THREADS=1 OMP_NUM_THREADS=1
status=0
ctest --test-dir build --output-on-failure -j "$jobs" "$@" || status=$?
if [[ $sanitized == 1 ]]; then
  if ! wait "$asan_build"; then
    tail -n 60 build-asan.log
    echo "test.sh: the sanitized build failed (build-asan.log)" >&2
    exit 1
  fi
  ROTCAP_SANITIZED_STEP=test bash scripts/test-sanitized.sh "$@" || status=$?
fi
exit "$status"
