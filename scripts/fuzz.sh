#!/usr/bin/env bash
# Builds the AFL++ tree (build-fuzz: afl-clang-fast++, ASan + UBSan, ROTCAP_FUZZ=ON) and fuzzes one
# harness of fuzz/ for a given time, at the lowest CPU priority (nice 19).
#
#   scripts/fuzz.sh case|msh SECONDS [--resume]
#
# case: fuzz_case_file (case-file text -> CaseInput); msh: fuzz_gmsh_reader (MSH text -> GmshMesh).
# Seeds: the stored corpus (tests/data/fuzz_corpus/<harness>/) plus the repository's case files
# (cases/, tests/data/) or meshes. Findings go to build-fuzz/out-<harness>/default/{crashes,hangs};
# afl's counters to build-fuzz/out-<harness>/default/fuzzer_stats. --resume continues that output
# folder instead of starting from the seeds. The case harness runs in build-fuzz/work-case, which
# holds copies of the repository's meshes so that [model] mesh = "plate.msh" exists there.
# Run one fuzzer at a time on a shared machine.
set -euo pipefail
cd "$(dirname "$0")/.."
root="$PWD"
harness="${1:-}" seconds="${2:-}" resume="${3:-}"
case "$harness" in
  case) target=fuzz_case_file ;;
  msh) target=fuzz_gmsh_reader ;;
  *) echo "usage: scripts/fuzz.sh case|msh SECONDS [--resume]" >&2; exit 2 ;;
esac
[[ "$seconds" =~ ^[0-9]+$ ]] || { echo "SECONDS must be a whole number" >&2; exit 2; }
command -v afl-fuzz >/dev/null || { echo "afl-fuzz not found (Debian: apt-get install afl++)" >&2; exit 2; }

build="$root/build-fuzz"
export AFL_USE_ASAN=1 AFL_USE_UBSAN=1
if [[ ! -f "$build/CMakeCache.txt" ]]; then
  mkdir -p "$build"
  CC=afl-clang-fast CXX=afl-clang-fast++ cmake -S . -B "$build" -DCMAKE_BUILD_TYPE=RelWithDebInfo \
    -DROTCAP_FUZZ=ON >"$build/configure.log" 2>&1 || { cat "$build/configure.log"; exit 1; }
fi
nice -n 19 cmake --build "$build" -j 2 --target "$target"

seeds="$build/seeds-$harness"
rm -rf "$seeds"
mkdir -p "$seeds"
if [[ "$harness" == case ]]; then
  find cases tests/data -name '*.toml' -not -path 'tests/data/fuzz_corpus/*' | while read -r f; do
    cp "$f" "$seeds/$(echo "$f" | tr / _)"
  done
  work="$build/work-case"
  mkdir -p "$work"
  find cases tests/data -name '*.msh' -not -path 'tests/data/fuzz_corpus/*' -exec cp {} "$work/" \;
else
  find cases tests/data -name '*.msh' -not -path 'tests/data/fuzz_corpus/*' | while read -r f; do
    cp "$f" "$seeds/$(echo "$f" | tr / _)"
  done
  work="$build/work-msh"
  mkdir -p "$work"
fi
stored="tests/data/fuzz_corpus/$harness"
if [[ -d "$stored" ]]; then
  find "$stored" -maxdepth 1 -type f \( -name '*.toml' -o -name '*.msh' \) -exec cp {} "$seeds/" \;
fi

out="$build/out-$harness"
input="$seeds"
if [[ "$resume" == --resume && -d "$out/default" ]]; then
  input=-
elif [[ -n "$resume" ]]; then
  echo "nothing to resume in $out" >&2; exit 2
else
  rm -rf "$out"
fi
# Dictionary of the format's words: helps the mutator past keyword and section checks.
dict="$root/fuzz/$harness.dict"
dict_args=()
[[ -f "$dict" ]] && dict_args=(-x "$dict")
cd "$work"
# Hangs: an input is a hang after 1 s (a reader call takes well under a millisecond).
AFL_SKIP_CPUFREQ=1 AFL_NO_AFFINITY=1 AFL_NO_UI=1 AFL_IGNORE_PROBLEMS=1 nice -n 19 \
  afl-fuzz -i "$input" -o "$out" -t 1000 -V "$seconds" "${dict_args[@]}" -- "$build/fuzz/$target"
