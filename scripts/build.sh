#!/usr/bin/env bash
# Configures and builds rotcap (Release) in ./build. Used by test.sh and demo.sh.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/install-deps.sh
cmake -S . -B build -DCMAKE_BUILD_TYPE=Release > build-configure.log 2>&1 || { cat build-configure.log; exit 1; }
cmake --build build -j "$(nproc)"
