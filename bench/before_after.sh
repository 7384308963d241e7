#!/usr/bin/env bash
# Before/after in one session (issue 15): builds an older commit and the current tree (Release), then
# runs the case alternately with the old and the new binary (old, new, old, new, ...), each run in
# its own output folder, and prints a side-by-side table from the runs' summary.json files: every
# run, the medians of each side and the ratio new/old of the medians. Alternating spreads the
# machine's changing load over both sides; the figures are still wall-clock times on a shared machine.
#
# Usage: bench/before_after.sh OLD_COMMIT [repeats] [case] [rotcap run options...]
#   defaults: 3 repeats, cases/carpark_girder.toml; options are passed to both `rotcap run`s, e.g.
#   bench/before_after.sh 1f48710 2 cases/carpark_girder.toml --mesh-scale 0.45
# Environment: BUILD (the current tree's build folder, default build), OLD_BIN (a rotcap binary
#   already built from OLD_COMMIT: skips the old build), KEEP=1 keeps the temporary
#   folder with the old worktree, its build and every run's output (default: removed).
# The old commit is checked out with `git worktree add --detach` into a temporary folder and built
# there (target rotcap, -j2, nice 5); the worktree is removed on exit, also after an error.
# Keys that the old version's summary.json lacks are printed as "-".
set -euo pipefail
cd "$(dirname "$0")/.."
root="$(pwd)"
if [ $# -lt 1 ]; then
  sed -n '2,16p' "$0" | sed 's/^# \{0,1\}//'
  exit 2
fi
old_ref="$1"
repeats="${2:-3}"
case_file="${3:-cases/carpark_girder.toml}"
shift $(( $# < 3 ? $# : 3 ))
run_options=("$@")
build="${BUILD:-build}"
old_commit="$(git rev-parse --verify "${old_ref}^{commit}")"
new_commit="$(git rev-parse HEAD)"
dirty=""
git diff --quiet HEAD -- . 2>/dev/null || dirty=" + uncommitted changes"
case_abs="$(cd "$(dirname "$case_file")" && pwd)/$(basename "$case_file")"

work="$(mktemp -d /tmp/rotcap_before_after.XXXXXX)"
cleanup() {
  git -C "$root" worktree remove --force "$work/old" > /dev/null 2>&1 || true
  git -C "$root" worktree prune > /dev/null 2>&1 || true
  if [ "${KEEP:-0}" = 1 ]; then echo "kept: $work" >&2; else rm -rf "$work"; fi
}
trap cleanup EXIT

echo "building the current tree (${build}) ..." >&2
nice -n 5 cmake -S . -B "$build" -DCMAKE_BUILD_TYPE=Release > "$work/new_configure.log"
nice -n 5 cmake --build "$build" --target rotcap -j2 > "$work/new_build.log" || { tail -n 30 "$work/new_build.log" >&2; exit 1; }
if [ -n "${OLD_BIN:-}" ]; then
  old_bin="$OLD_BIN"  # a Release binary already built from OLD_COMMIT (the caller vouches for it)
else
  echo "building ${old_ref} (${old_commit:0:10}) in a temporary worktree ..." >&2
  git worktree add --detach "$work/old" "$old_commit" > /dev/null 2>&1
  nice -n 5 cmake -S "$work/old" -B "$work/old/build" -DCMAKE_BUILD_TYPE=Release > "$work/old_configure.log"
  nice -n 5 cmake --build "$work/old/build" --target rotcap -j2 > "$work/old_build.log" || { tail -n 30 "$work/old_build.log" >&2; exit 1; }
  old_bin="$work/old/build/rotcap"
fi
new_bin="$root/$build/rotcap"

export OPENBLAS_NUM_THREADS=1  # as the tests and the other benchmarks: one BLAS thread
load_before="$(cut -d' ' -f1-3 /proc/loadavg)"
: > "$work/runs.tsv"
for i in $(seq 1 "$repeats"); do
  for side in old new; do
    bin="$old_bin"; [ "$side" = new ] && bin="$new_bin"
    out="$work/runs/${side}_${i}"
    echo "run ${i}/${repeats} ${side} ..." >&2
    t0="$(date +%s.%N)"
    code=0
    "$bin" run "$case_abs" "${run_options[@]}" -o "$out" --quiet > "$work/${side}_${i}.log" 2>&1 || code=$?
    t1="$(date +%s.%N)"
    printf '%s\t%s\t%s\t%s\t%s\n' "$side" "$i" "$out" "$(awk -v a="$t0" -v b="$t1" 'BEGIN { printf "%.2f", b - a }')" "$code" >> "$work/runs.tsv"
  done
done

echo "# before/after: $(date -u '+%Y-%m-%d %H:%M UTC'), nproc $(nproc), load average before the runs: ${load_before}"
echo "# old ${old_ref} = ${old_commit:0:10}; new HEAD = ${new_commit:0:10}${dirty}; case ${case_file} ${run_options[*]}"
echo "# ${repeats} alternating pairs (old, new, old, new, ...), OPENBLAS_NUM_THREADS=1; shared machine: wall times are noisy"
python3 - "$work/runs.tsv" <<'PY'
import json, statistics, sys

# (column name, candidate paths in summary.json; the first present wins; "*name" = that key anywhere)
METRICS = [
    ("process wall s", None),
    ("exit", None),
    ("wall s", [("solver", "wall_s")]),
    ("steps", [("solver", "steps")]),
    ("iterations", [("solver", "iterations")]),
    ("factorisations", [("solver", "factorisations")]),
    ("LDL^T factorisations", [("solver", "indefinite_factorisations")]),
    ("assembly s", [("solver", "assembly_s")]),
    ("factorisation s", [("solver", "factorisation_s")]),
    ("free DOFs", [("solver", "free_dofs"), ("mesh", "free_dofs")]),
    ("M_max/Mp", [("m_max_over_mp",), "*m_max_over_mp"]),
    ("R", [("rotation_capacity",), "*rotation_capacity"]),
]


def find_anywhere(node, key):
    if isinstance(node, dict):
        if key in node:
            return node[key]
        for v in node.values():
            r = find_anywhere(v, key)
            if r is not None:
                return r
    return None


def lookup(summary, paths):
    for p in paths:
        if isinstance(p, str):
            v = find_anywhere(summary, p[1:])
        else:
            v = summary
            for k in p:
                v = v.get(k) if isinstance(v, dict) else None
        if isinstance(v, (int, float)) and not isinstance(v, bool):
            return float(v)
    return None


runs = []
for line in open(sys.argv[1]):
    side, i, folder, wall, code = line.rstrip("\n").split("\t")
    try:
        summary = json.load(open(f"{folder}/summary.json"))
    except (OSError, ValueError):
        summary = {}
    row = {"side": side, "i": int(i)}
    for name, paths in METRICS:
        row[name] = float(wall) if name == "process wall s" else float(code) if name == "exit" else lookup(summary, paths)
    runs.append(row)


COUNTS = {"exit", "steps", "iterations", "factorisations", "LDL^T factorisations", "free DOFs"}


def fmt(v, name):
    """Counts as integers (a median of two may end in .5), the rest to 4 significant digits."""
    if v is None:
        return "-"
    if name in COUNTS:
        return f"{v:.0f}" if v == int(v) else f"{v:.1f}"
    return f"{v:.1f}" if abs(v) >= 1000 else f"{v:#.4g}"


def med(side, name):
    vals = [r[name] for r in runs if r["side"] == side and r[name] is not None]
    return statistics.median(vals) if vals else None


names = [m[0] for m in METRICS]
width = max(len(n) for n in names) + 2
cols = [f"{r['side']} {r['i']}" for r in runs] + ["median old", "median new", "new/old"]
print("".ljust(width) + "".join(c.rjust(12) for c in cols))
for n in names:
    cells = [fmt(r[n], n) for r in runs]
    mo, mn = med("old", n), med("new", n)
    ratio = f"{mn / mo:.3f}" if mo and mn is not None and n != "exit" else "-"
    cells += [fmt(mo, n), fmt(mn, n), ratio]
    print(n.ljust(width) + "".join(c.rjust(12) for c in cells))
print("(process wall s: the whole `rotcap run` as the script timed it, outputs and report included; "
      "wall s: the run's own solver.wall_s)")
PY
