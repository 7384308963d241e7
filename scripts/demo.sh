#!/usr/bin/env bash
# Builds rotcap and runs the bundled demo case end to end; results go to ./rotcap_demo_results
# (the demo's default folder).
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/build.sh
export OPENBLAS_NUM_THREADS=1
./build/rotcap demo --overwrite
