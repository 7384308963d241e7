#!/usr/bin/env bash
# One end-to-end check of the rotcap command line, as registered by tests/cli/CMakeLists.txt.
#
#   run_cli_case.sh --rotcap BIN --scratch DIR [checks...] -- ARGS...
#
# Runs `BIN ARGS...` in the source root (ROTCAP_SOURCE_DIR, else the working directory) with
# every "@OUT@" in ARGS replaced by DIR/results, a results folder that does not exist before the
# run (DIR is emptied first). Checks, each optional:
#   --exit N              the exit code is N (default 0)
#   --stderr REGEX        stderr matches the extended regular expression (grep -E)
#   --stdout REGEX        stdout matches it
#   --stdout-not REGEX    no line of stdout matches it
#   --no-output           DIR/results does not exist after the run (no partial results folder)
#   --seed-output         DIR/results is created before the run holding a user file (notes.txt)
#                         and old results (curve.csv, fields/step_0001.vtu)
#   --unchanged           with --seed-output: after the run the folder's file list and contents
#                         are as seeded
#   --expect-file GLOB    a file matching DIR/results/GLOB exists and is not empty (repeatable)
#   --file-matches F RE   the file DIR/results/F has a line matching RE (repeatable)
# Prints what it ran and every failed check; exits 0 when all checks pass, 1 otherwise.
set -u

rotcap="" scratch="" expect_exit=0 stderr_re="" stdout_re="" stdout_not_re="" no_output=0 seed=0 unchanged=0
expect_files=() match_files=() match_res=()
while [[ $# -gt 0 ]]; do
  case "$1" in
    --rotcap) rotcap="$2"; shift 2 ;;
    --scratch) scratch="$2"; shift 2 ;;
    --exit) expect_exit="$2"; shift 2 ;;
    --stderr) stderr_re="$2"; shift 2 ;;
    --stdout) stdout_re="$2"; shift 2 ;;
    --stdout-not) stdout_not_re="$2"; shift 2 ;;
    --no-output) no_output=1; shift ;;
    --seed-output) seed=1; shift ;;
    --unchanged) unchanged=1; shift ;;
    --expect-file) expect_files+=("$2"); shift 2 ;;
    --file-matches) match_files+=("$2"); match_res+=("$3"); shift 3 ;;
    --) shift; break ;;
    *) echo "run_cli_case.sh: unknown option $1" >&2; exit 1 ;;
  esac
done
if [[ -z "$rotcap" || -z "$scratch" ]]; then
  echo "run_cli_case.sh: --rotcap and --scratch are required" >&2
  exit 1
fi

out="$scratch/results"
rm -rf "$scratch"
mkdir -p "$scratch"
args=()
for a in "$@"; do args+=("${a//@OUT@/$out}"); done

# Fingerprint of a folder: its file list and the checksums of its files.
fingerprint() {
  (cd "$1" && find . -print | LC_ALL=C sort && find . -type f -print0 | LC_ALL=C sort -z | xargs -0 -r md5sum)
}
if [[ $seed -eq 1 ]]; then
  mkdir -p "$out/fields"
  echo "the user's own notes" >"$out/notes.txt"
  printf 'step,load_factor\n0,0\n1,0.5\n' >"$out/curve.csv"
  echo "old field" >"$out/fields/step_0001.vtu"
  fingerprint "$out" >"$scratch/before.txt"
fi

cd "${ROTCAP_SOURCE_DIR:-.}" || exit 1
echo "running: $rotcap ${args[*]}"
"$rotcap" "${args[@]}" >"$scratch/stdout.txt" 2>"$scratch/stderr.txt"
code=$?
echo "exit code $code; stderr:"
cat "$scratch/stderr.txt"

failed=0
fail() { echo "FAILED: $*"; failed=1; }
[[ $code -eq $expect_exit ]] || fail "exit code $code, expected $expect_exit"
if [[ -n "$stderr_re" ]] && ! grep -Eq -- "$stderr_re" "$scratch/stderr.txt"; then
  fail "stderr does not match /$stderr_re/"
fi
if [[ -n "$stdout_not_re" ]] && grep -Eq -- "$stdout_not_re" "$scratch/stdout.txt"; then
  fail "stdout matches /$stdout_not_re/, which it must not"
fi
if [[ -n "$stdout_re" ]] && ! grep -Eq -- "$stdout_re" "$scratch/stdout.txt"; then
  echo "stdout:"; cat "$scratch/stdout.txt"
  fail "stdout does not match /$stdout_re/"
fi
if [[ $no_output -eq 1 && -e "$out" ]]; then
  fail "a results folder was left behind: $(cd "$out" && find . | tr '\n' ' ')"
fi
if [[ $unchanged -eq 1 ]]; then
  fingerprint "$out" >"$scratch/after.txt"
  if ! diff "$scratch/before.txt" "$scratch/after.txt" >"$scratch/changes.txt"; then
    fail "the existing folder was changed: $(tr '\n' ' ' <"$scratch/changes.txt")"
  fi
fi
for g in "${expect_files[@]}"; do
  found=0
  for f in $out/$g; do [[ -s "$f" ]] && found=1; done
  [[ $found -eq 1 ]] || fail "no non-empty file matches results/$g"
done
for i in "${!match_files[@]}"; do
  grep -Eq -- "${match_res[$i]}" "$out/${match_files[$i]}" 2>/dev/null ||
    fail "results/${match_files[$i]} has no line matching /${match_res[$i]}/"
done
[[ $failed -eq 0 ]] && echo "passed"
exit $failed
