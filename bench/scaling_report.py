#!/usr/bin/env python3
"""Table, power-law fits and log-log plot of bench_scaling's output (bench/scaling.sh).

Usage: scaling_report.py RESULTS.jsonl TABLE.txt PLOT.svg HEADER_LINE...

Input: one JSON object per line, as bench_scaling prints it (times in s, memory in MB).
Output: TABLE.txt (the header lines, one row per size, the fitted exponents) and PLOT.svg (two
log-log panels against free DOFs: times per operation in ms; peak RSS in MB and factor nonzeros in
millions; each with the N^1 and N^1.5 guides through the smallest size's LDL^T time or peak RSS).
Fit: p of cost = c N^p by least squares on (ln N, ln cost) over all sizes (standard library only:
no numpy or matplotlib needed).
"""
import json
import math
import sys

PARTS = [  # key, table / legend name, colour
    ("assembly_s", "assembly", "#1b4f9c"),
    ("llt_factorisation_s", "LL^T factorisation", "#c0392b"),
    ("ldlt_factorisation_s", "LDL^T factorisation", "#e67e22"),
    ("llt_solve_s", "solve (LL^T)", "#27ae60"),
    ("analysis_s", "symbolic analysis (once)", "#8e44ad"),
]
MEMORY = [("peak_rss_mb", "peak RSS [MB]", "#2c3e50"), ("factor_nonzeros", "factor nnz [1e6]", "#16a085")]


def fit_exponent(ns, ys):
    """Least-squares slope of ln y on ln n; None with fewer than two usable points."""
    pts = [(math.log(n), math.log(y)) for n, y in zip(ns, ys) if y is not None and y > 0]
    if len(pts) < 2:
        return None
    mx = sum(p[0] for p in pts) / len(pts)
    my = sum(p[1] for p in pts) / len(pts)
    sxx = sum((p[0] - mx) ** 2 for p in pts)
    return sum((p[0] - mx) * (p[1] - my) for p in pts) / sxx if sxx > 0 else None


def table(rows, header):
    out = list(header)
    out.append("scale  flange x web    nodes  free DOFs  assembly ms  LL^T ms  LDL^T ms  solve ms  "
               "analysis ms  peak RSS MB  program RSS MB  factor nnz  load factor  max eps_p  load avg")
    for r in rows:
        solve = r["llt_solve_s"] if r["llt_solve_s"] is not None else r["ldlt_solve_s"]
        out.append(f"{r['mesh_scale']:5.2f}  {r['flange_elements']:4d} x {r['web_elements']:<4d}  {r['nodes']:7d}  "
                   f"{r['free_dofs']:9d}  {1e3 * r['assembly_s']:11.1f}  {1e3 * r['llt_factorisation_s']:7.1f}  "
                   f"{1e3 * r['ldlt_factorisation_s']:8.1f}  {1e3 * solve:8.2f}  {1e3 * r['analysis_s']:11.1f}  "
                   f"{r['peak_rss_mb']:11.0f}  {r['rss_program_mb']:14.0f}  {r['factor_nonzeros']:10.3e}  "
                   f"{r['state']['load_factor']:11.3f}  {r['state']['max_plastic_strain']:9.2e}  "
                   f"{r.get('load_average', '-'):>8}")
    ns = [r["free_dofs"] for r in rows]
    out.append("")
    out.append(f"fitted exponent p of cost ~ N^p (least squares on ln N, ln cost; {len(rows)} sizes, "
               f"N = {min(ns)} .. {max(ns)} free DOFs):")
    for key, name, _ in PARTS + MEMORY:
        p = fit_exponent(ns, [r[key] for r in rows])
        verdict = "" if p is None else ("  <= 1.5: yes" if p <= 1.5 else "  <= 1.5: NO")
        line = f"  {name:28s} p = {'-' if p is None else f'{p:.2f}'}{verdict}"
        if len(rows) >= 6:  # the upper sizes alone: is the growth steepening?
            k = len(rows) // 2 + 1
            pu = fit_exponent(ns[-k:], [r[key] for r in rows[-k:]])
            line += f"   (largest {k} sizes: p = {'-' if pu is None else f'{pu:.2f}'})"
        if key in rows[0].get("min", {}):
            pm = fit_exponent(ns, [r["min"][key] for r in rows])
            line += f"   (smallest of the repeats: p = {'-' if pm is None else f'{pm:.2f}'})"
        out.append(line)
    return "\n".join(out) + "\n"


def tick_text(v):
    """1, 2, 5 x 10^d as short text: 500, 20k, 1M, 0.2."""
    for div, suffix in ((1e6, "M"), (1e3, "k")):
        if v >= div:
            return f"{v / div:g}{suffix}"
    return f"{v:g}"


def log_range(values):
    """log10 limits a little wider than the data (5 % of the span, at least 0.05 decades)."""
    lo, hi = math.log10(min(values)), math.log10(max(values))
    pad = max(0.05 * (hi - lo), 0.05)
    return lo - pad, hi + pad


def panel(x0, y0, w, h, series, guides, y_label, title):
    """One log-log panel as SVG elements, legend below it; series: (name, colour, xs, ys, dash)."""
    xs_all = [x for s in series for x in s[2]]
    ys_all = [y for s in series + guides for y in s[3] if y and y > 0]
    lx0, lx1 = log_range(xs_all)
    ly0, ly1 = log_range(ys_all)

    def px(x):
        return x0 + w * (math.log10(x) - lx0) / (lx1 - lx0)

    def py(y):
        return y0 + h - h * (math.log10(y) - ly0) / (ly1 - ly0)

    def ticks(l0, l1):
        for d in range(math.floor(l0), math.ceil(l1) + 1):
            for m in range(1, 10):
                v = m * 10.0 ** d
                if l0 <= math.log10(v) <= l1:
                    yield v, m in (1, 2, 5)

    e = [f'<rect x="{x0}" y="{y0}" width="{w}" height="{h}" fill="none" stroke="#333"/>',
         f'<text x="{x0 + w / 2}" y="{y0 - 10}" text-anchor="middle" font-size="14">{title}</text>']
    for v, major in ticks(lx0, lx1):
        X = px(v)
        e.append(f'<line x1="{X:.1f}" y1="{y0}" x2="{X:.1f}" y2="{y0 + h}" stroke="{"#ccc" if major else "#eee"}"/>')
        if major:
            e.append(f'<text x="{X:.1f}" y="{y0 + h + 16}" text-anchor="middle" font-size="11">{tick_text(v)}</text>')
    for v, major in ticks(ly0, ly1):
        Y = py(v)
        e.append(f'<line x1="{x0}" y1="{Y:.1f}" x2="{x0 + w}" y2="{Y:.1f}" stroke="{"#ccc" if major else "#eee"}"/>')
        if major:
            e.append(f'<text x="{x0 - 5}" y="{Y + 4:.1f}" text-anchor="end" font-size="11">{tick_text(v)}</text>')
    e.append(f'<text x="{x0 + w / 2}" y="{y0 + h + 36}" text-anchor="middle" font-size="12">free DOFs N</text>')
    e.append(f'<text x="{x0 - 48}" y="{y0 + h / 2}" text-anchor="middle" font-size="12" '
             f'transform="rotate(-90 {x0 - 48} {y0 + h / 2})">{y_label}</text>')
    legend = []
    for name, colour, xs, ys, dash in guides + series:
        pts = [(px(x), py(y)) for x, y in zip(xs, ys) if y and y > 0]
        d = " ".join(f"{a:.1f},{b:.1f}" for a, b in pts)
        style = ' stroke-dasharray="6 4"' if dash else ""
        e.append(f'<polyline points="{d}" fill="none" stroke="{colour}" stroke-width="{1.2 if dash else 2}"{style}/>')
        if not dash:
            e += [f'<circle cx="{a:.1f}" cy="{b:.1f}" r="3" fill="{colour}"/>' for a, b in pts]
        legend.append((name, colour, dash))
    for i, (name, colour, dash) in enumerate(legend):  # two columns below the axis label
        X = x0 + (i % 2) * (w / 2)
        Y = y0 + h + 58 + 16 * (i // 2)
        style = ' stroke-dasharray="6 4"' if dash else ""
        e.append(f'<line x1="{X}" y1="{Y - 4}" x2="{X + 24}" y2="{Y - 4}" stroke="{colour}" stroke-width="2"{style}/>')
        e.append(f'<text x="{X + 30}" y="{Y}" font-size="11">{name}</text>')
    return e


def guide_pair(ns, y_at_first):
    """N^1 and N^1.5 through (min N, y_at_first) over the measured range."""
    n0, n1 = min(ns), max(ns)
    return [("guide: ~ N", "#777", [n0, n1], [y_at_first, y_at_first * (n1 / n0)], True),
            ("guide: ~ N^1.5", "#aaa", [n0, n1], [y_at_first, y_at_first * (n1 / n0) ** 1.5], True)]


def plot(rows):
    ns = [r["free_dofs"] for r in rows]
    ps = {key: fit_exponent(ns, [r[key] for r in rows]) for key, _, _ in PARTS + MEMORY}

    def label(key, name):
        return f"{name} (p = {ps[key]:.2f})" if ps[key] is not None else name

    times = []
    for key, name, colour in PARTS:
        times.append((label(key, name), colour, ns, [None if r[key] is None else 1e3 * r[key] for r in rows], False))
    first = min(range(len(rows)), key=lambda i: ns[i])
    g1 = guide_pair(ns, 1e3 * rows[first]["ldlt_factorisation_s"])
    mem = [(label("peak_rss_mb", "peak RSS [MB]"), MEMORY[0][2], ns, [r["peak_rss_mb"] for r in rows], False),
           (label("factor_nonzeros", "LL^T factor nnz [1e6]"), MEMORY[1][2], ns,
            [r["factor_nonzeros"] / 1e6 for r in rows], False)]
    g2 = guide_pair(ns, rows[first]["peak_rss_mb"])
    W, H = 1160, 580
    e = [f'<svg xmlns="http://www.w3.org/2000/svg" width="{W}" height="{H}" viewBox="0 0 {W} {H}" '
         f'font-family="sans-serif">', f'<rect width="{W}" height="{H}" fill="white"/>']
    e += panel(80, 40, 460, 400, times, g1, "time per operation [ms] (median)", "cost per Newton iteration (analysis: once per run)")
    e += panel(660, 40, 460, 400, mem, g2, "MB  /  millions of nonzeros", "memory")
    e.append(f'<text x="{W / 2}" y="{H - 8}" text-anchor="middle" font-size="11">rotcap bench_scaling: '
             f'cost ~ N^p, p by least squares on the log-log points; guides through the smallest size\'s LDL^T time '
             f'and peak RSS; medians, wall clock (see scaling.txt for the machine\'s load)</text>')
    e.append("</svg>")
    return "\n".join(e) + "\n"


def main():
    if len(sys.argv) < 4:
        print(__doc__)
        return 2
    rows = [json.loads(l) for l in open(sys.argv[1]) if l.strip().startswith("{")]
    rows.sort(key=lambda r: r["free_dofs"])
    text = table(rows, sys.argv[4:])
    open(sys.argv[2], "w").write(text)
    open(sys.argv[3], "w").write(plot(rows))
    sys.stdout.write(text)
    return 0


if __name__ == "__main__":
    sys.exit(main())
