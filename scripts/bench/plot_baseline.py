#!/usr/bin/python3
"""Side-by-side baseline for `npm run bench` (issue 12): the plotting script an engineer would write.

Same families as pmchart's bench book: for each sheet (f'c, fy, gamma, bar layout) the phi-factored
P-M curves of 8 rho_g values, normalised by Ag and Ag*h, each sheet one vector PDF page (matplotlib
PdfPages), with title and axis labels but no table or title block. The curves come from a plain numpy
strain-compatibility sweep of the neutral-axis depth: ACI 318-19 22.2.2.4.1 rectangular block
(beta1 from Table 22.2.2.4.3), elastic-plastic bars (20.2.2.1), displaced concrete deducted where a
bar sits in the block, phi from Table 21.2.2 (tied), cap 0.80*phi*Po (Table 22.4.2.1).

Run with Debian's /usr/bin/python3 and its python3-numpy and python3-matplotlib packages:
    /usr/bin/python3 scripts/bench/plot_baseline.py sheets.json out.pdf
sheets.json: [{"fc": ksi, "fy": ksi, "gamma": g, "faces": 2 | 4, "perFace": n}, ...]
Prints one JSON line: {"sheets": n, "cpu": seconds of user + system CPU, imports included}.
"""
import json
import resource
import sys

import matplotlib

matplotlib.use("pdf")
import matplotlib.pyplot as plt  # noqa: E402
import numpy as np  # noqa: E402
from matplotlib.backends.backend_pdf import PdfPages  # noqa: E402

ES = 29000.0  # ksi, ACI 318-19 20.2.2.2
ECU = 0.003  # ACI 318-19 22.2.2.1
RHOS = [0.01, 0.02, 0.03, 0.04, 0.05, 0.06, 0.07, 0.08]


def bar_rows(faces, per_face, gamma):
    """Bar depths (from the compression face, h = 1) and area shares of a square section."""
    if faces == 2:
        ys = np.array([0.5 - gamma / 2, 0.5 + gamma / 2])
        return ys, np.array([0.5, 0.5])
    # four faces: per_face bars on each face, corners shared
    n_side = per_face - 2
    total = 4 * per_face - 4
    inner = np.linspace(0.5 - gamma / 2, 0.5 + gamma / 2, per_face)
    ys = inner
    counts = np.array([per_face] + [2] * n_side + [per_face], dtype=float)
    return ys, counts / total


def family(fc, fy, gamma, faces, per_face):
    beta1 = min(0.85, max(0.65, 0.85 - 0.05 * (fc - 4.0)))
    d, share = bar_rows(faces, per_face, gamma)
    c = np.concatenate([np.geomspace(0.02, 3.0, 400), [1e6]])[:, None]  # c/h
    a = np.minimum(beta1 * c, 1.0)
    eps = ECU * (c - d[None, :]) / c
    fs = np.clip(ES * eps, -fy, fy)
    fs = fs - np.where(d[None, :] < a, 0.85 * fc, 0.0)
    eps_t = -eps[:, -1]
    ety = fy / ES
    phi = np.clip(0.65 + 0.25 * (eps_t - ety) / 0.003, 0.65, 0.90)
    cc = 0.85 * fc * a[:, 0]
    mc = cc * (0.5 - a[:, 0] / 2)
    out = []
    for rho in RHOS:
        f = rho * share[None, :] * fs
        p = cc + f.sum(axis=1)
        m = mc + (f * (0.5 - d[None, :])).sum(axis=1)
        po = 0.85 * fc * (1 - rho) + fy * rho
        cap = 0.80 * 0.65 * po
        out.append((rho, np.minimum(phi * p, cap), np.maximum(phi * m, 0.0)))
    return out


def main():
    sheets = json.load(open(sys.argv[1]))
    with PdfPages(sys.argv[2], metadata={"CreationDate": None, "ModDate": None}) as pdf:
        for s in sheets:
            fig, ax = plt.subplots(figsize=(11.69, 8.27))
            for rho, p, m in family(s["fc"], s["fy"], s["gamma"], s["faces"], s["perFace"]):
                ax.plot(m, p, lw=0.8, label=f"ρg {rho:.2f}")
            ax.set_xlabel("φMn / (Ag·h)  (ksi)")
            ax.set_ylabel("φPn / Ag  (ksi)")
            ax.set_title(f"f′c {s['fc']} ksi, fy {s['fy']} ksi, γ {s['gamma']:.2f}, {s['faces']} faces × {s['perFace']}")
            ax.grid(True, lw=0.3)
            ax.legend(fontsize=7)
            ax.set_xlim(left=0)
            pdf.savefig(fig)
            plt.close(fig)
    r = resource.getrusage(resource.RUSAGE_SELF)
    print(json.dumps({"sheets": len(sheets), "cpu": r.ru_utime + r.ru_stime}))


if __name__ == "__main__":
    main()
