#!/usr/bin/env bash
# Builds rotcap and runs the whole test suite (unit, verification, end-to-end) with ctest.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/build.sh
export OPENBLAS_NUM_THREADS=1
ctest --test-dir build --output-on-failure -j "$(nproc)" "$@"
