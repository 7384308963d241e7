#!/usr/bin/env bash
# Builds the sanitized tree (build-asan: AddressSanitizer + UndefinedBehaviorSanitizer, -O1 with
# line tables, ROTCAP_SANITIZE=ON; three UBSan checks left out by default, see below) and runs the
# fast tests under it; scripts/test.sh runs it after the Release tests. Extra arguments go to ctest. Any sanitizer report fails its test: UBSan stops
# at the first finding (-fno-sanitize-recover), ASan at its first error, LeakSanitizer at exit.
#
# Left out (ROTCAP_SANITIZE_EXCLUDE, a ctest regular expression): the long runs, every test that
# took more than 20 s under the sanitizers (2 cores, -j2): the demo and the mesh study, the hinge
# studies of tests/verification/hinge (the elastic, LTB and interrupted hinge runs stay), the
# nonlinear shell benchmarks, the determinism and SIGTERM runs, and the report tests that print
# through headless Chromium, the kill and resume trials and the sweeps and studies (many runs each). The code they run (ShellProblem, path following, the hinge study
# and its outputs) is exercised by the shorter tests that stay.
set -euo pipefail
cd "$(dirname "$0")/.."
build=build-asan
# UBSan's alignment, null and vptr checks double GCC's compile time of the Eigen-heavy files (10.5 s
# -> 6.2 s for tests/elements/shell_q4_tangent_test.cpp; the whole tree about 19 -> 16 CPU minutes);
# CI leaves them out to stay nearer its time budget (a null dereference still stops under ASan's SEGV handler). ROTCAP_SANITIZE_SKIP= (empty)
# builds with every check; the whole suite passed that way on 2026-12-03.
skip="${ROTCAP_SANITIZE_SKIP-alignment,null,vptr}"
# ROTCAP_SANITIZED_STEP: build | test | all (default); scripts/test.sh builds this tree while the
# Release tests run (their long tail leaves a core idle) and tests it afterwards.
step="${ROTCAP_SANITIZED_STEP:-all}"
jobs="$(env -u OMP_NUM_THREADS -u OMP_THREAD_LIMIT nproc)"  # GNU nproc honours OMP_NUM_THREADS (test.sh exports 1)
if [[ "$step" != test ]]; then
mkdir -p "$build"
cmake -S . -B "$build" -DCMAKE_BUILD_TYPE=RelWithDebInfo "-DCMAKE_CXX_FLAGS_RELWITHDEBINFO=-O1 -g1 -DNDEBUG" \
  -DROTCAP_SANITIZE=ON "-DROTCAP_SANITIZE_SKIP=$skip" >"$build/configure.log" 2>&1 || { cat "$build/configure.log"; exit 1; }
cmake --build "$build" -j "$jobs"  # everything: each test executable has tests that run here
fi
[[ "$step" == build ]] && exit 0
long="HingeMeshConvergence|cli\.demo$|Determinism\.|SignalStop\.|HingeDemand\.|HingeLocalBuckling\."
long+="|HingePlasticMoment\.|FittedHingeLaw\.|HingeLaws\.SlenderFlange|HingedRoofVerification\."
long+="|SlitAnnularPlateVerification\.|HemisphereVerification\.|ReportPage\.|ReportPdf\.|CurvePlot\."
long+="|Resume\.|ResumeExtension\.|Sweep\.|Study\.|batch\.mpi_sweep|HingeStepRule\."  # many cases, kill trials, 300 steps
exclude="${ROTCAP_SANITIZE_EXCLUDE:-$long}"
export OPENBLAS_NUM_THREADS=1 OMP_NUM_THREADS=1
export UBSAN_OPTIONS="print_stacktrace=1:halt_on_error=1${UBSAN_OPTIONS:+:$UBSAN_OPTIONS}"
ctest --test-dir "$build" --output-on-failure -j "$jobs" -E "$exclude" "$@"
