#!/usr/bin/env bash
# Mesh study of the demo case (cases/carpark_girder.toml): `rotcap run --mesh-scale F` for each
# factor F (default 1 1.5 2.25 3, i.e. 8 x 10, 12 x 15, 18 x 23, 24 x 30 elements across flange x
# web), then a table of M_max, theta at M_max, theta_u, R, theta_p, the failure mode and the run
# sizes, each change against the previous level. Long (about an hour on 2 cores): a study for
# bench/, not a test (the CI test runs the first two levels only, stopping past the peak).
#
# Usage: bench/demo_mesh_study.sh [build-dir] [factor ...]
#        bench/demo_mesh_study.sh --table RESULTS_DIR ...   (tabulate finished results folders)
# Writes bench/results/demo_mesh_study.txt (runs) or prints the table (--table).
set -euo pipefail
cd "$(dirname "$0")/.."

table() {
  python3 - "$@" <<'PY'
import json, sys
rows = []
for folder in sys.argv[1:]:
    s = json.load(open(f"{folder}/summary.json"))
    m, v = s["input"]["mesh"], s["solver"]
    name = f"{m['flange_elements']} x {m['web_elements']}"
    if m.get("aspect", 1.0) != 1.0:
        name += f", aspect {m['aspect']:g}"
    rows.append((name, s, v))
print(f"{'mesh (flange x web)':20s}{'nodes':>7s}{'free DOFs':>10s}{'M_max kNm':>11s}{'M/Mp':>8s}"
      f"{'th(M_max)':>10s}{'theta_u':>9s}{'R':>7s}{'theta_p':>9s}{'steps':>6s}{'iter':>6s}{'wall s':>8s}  failure mode")
prev = None
for name, s, v in rows:
    r = s["rotation_capacity"]
    print(f"{name:20s}{v['nodes']:7d}{v['free_dofs']:10d}{s['m_max_kNm']:11.2f}{s['m_max_over_mp']:8.4f}"
          f"{s['theta_at_m_max_mrad']:10.2f}{(s['theta_u_mrad'] or 0):9.2f}{(r or 0):7.3f}{s['theta_p_mrad']:9.3f}"
          f"{v['steps']:6d}{v['iterations']:6d}{v['wall_s']:8.1f}  {s['failure_mode']}")
    if prev:
        ch = lambda k: 100.0 * (s[k] / prev[k] - 1.0) if s[k] and prev[k] else float('nan')
        print(f"{'  change vs previous':31s}{ch('m_max_kNm'):+10.2f}%{'':8s}{ch('theta_at_m_max_mrad'):+9.2f}%"
              f"{ch('theta_u_mrad'):+8.2f}%{ch('rotation_capacity'):+6.1f}%{ch('theta_p_mrad'):+8.2f}%")
    prev = s
print("(theta in mrad; wall times are single runs on a shared machine)")
PY
}

if [[ "${1:-}" == "--table" ]]; then
  shift
  table "$@"
  exit 0
fi
build="${1:-build}"
shift || true
factors=("$@")
[[ ${#factors[@]} -gt 0 ]] || factors=(1 1.5 2.25 3)
export OPENBLAS_NUM_THREADS=1
work="$(mktemp -d)"
folders=()
for f in "${factors[@]}"; do
  "$build/rotcap" run cases/carpark_girder.toml --mesh-scale "$f" -o "$work/scale_$f" --quiet || true
  folders+=("$work/scale_$f")
done
mkdir -p bench/results
{
  echo "# demo mesh study: $(date -u '+%Y-%m-%d %H:%M UTC'), nproc $(nproc), commit $(git rev-parse --short HEAD 2>/dev/null || echo none)"
  echo "# rotcap run cases/carpark_girder.toml --mesh-scale F for F = ${factors[*]}"
  table "${folders[@]}"
} | tee bench/results/demo_mesh_study.txt
