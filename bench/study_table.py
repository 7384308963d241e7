#!/usr/bin/env python3
"""Table of finished rotcap results folders (summary.json): M_max, theta at M_max, theta_u, R, theta_p,
run sizes and failure mode, each row's change against the previous one. Used by the studies in bench/.

Usage: bench/study_table.py [--label mesh|step] RESULTS_DIR ...
  --label mesh: rows named by [mesh] flange x web elements (default); step: by the arc-length step
  (analysis.first_step, with max_step_ratio) and the mesh."""
import json
import sys

args = sys.argv[1:]
label = "mesh"
if args[:1] == ["--label"]:
    label, args = args[1], args[2:]
rows = []
for folder in args:
    s = json.load(open(f"{folder}/summary.json"))
    m, a, v = s["input"]["mesh"], s["input"]["analysis"], s["solver"]
    name = f"{m['flange_elements']} x {m['web_elements']}"
    if m.get("aspect", 1.0) != 1.0:
        name += f", aspect {m['aspect']:g}"
    if label == "step":
        name = f"{a['first_step']:g} (x{a['max_step_ratio']:g}), {name}"
    rows.append((name, s, v))
head = "mesh (flange x web)" if label == "mesh" else "step (ratio), mesh"
print(f"{head:20s}{'nodes':>7s}{'free DOFs':>10s}{'M_max kNm':>11s}{'M/Mp':>8s}"
      f"{'th(M_max)':>10s}{'theta_u':>9s}{'R':>7s}{'theta_p':>9s}{'steps':>6s}{'iter':>6s}{'wall s':>8s}  failure mode")
prev = None
for name, s, v in rows:
    r = s["rotation_capacity"]
    print(f"{name:20s}{v['nodes']:7d}{v['free_dofs']:10d}{s['m_max_kNm']:11.2f}{s['m_max_over_mp']:8.4f}"
          f"{s['theta_at_m_max_mrad']:10.2f}{(s['theta_u_mrad'] or 0):9.2f}{(r or 0):7.3f}{s['theta_p_mrad']:9.3f}"
          f"{v['steps']:6d}{v['iterations']:6d}{v['wall_s']:8.1f}  {s['failure_mode']}")
    if prev:
        def ch(k):
            return 100.0 * (s[k] / prev[k] - 1.0) if s[k] and prev[k] else float("nan")
        print(f"{'  change vs previous':31s}{ch('m_max_kNm'):+10.2f}%{'':8s}{ch('theta_at_m_max_mrad'):+9.2f}%"
              f"{ch('theta_u_mrad'):+8.2f}%{ch('rotation_capacity'):+6.1f}%{ch('theta_p_mrad'):+8.2f}%")
    prev = s
print("(theta in mrad; wall times are single runs on a shared machine)")
