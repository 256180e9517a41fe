"""Draw docs/sign-conventions.png: the sign conventions, partly computed by the tool itself.

Run by hand after a change of convention: python docs/conventions_figure.py
"""

from __future__ import annotations

from pathlib import Path

import matplotlib

matplotlib.use("Agg")
import matplotlib.pyplot as plt  # noqa: E402

from influence.analysis.lines import analyse_model  # noqa: E402
from influence.analysis.responses import Response  # noqa: E402
from influence.model.beamform import simple_beam  # noqa: E402
from influence.output.figures import PALETTE, draw_line  # noqa: E402


def _arrow(ax, x, y, dx, dy, text, colour=PALETTE["section"]):  # type: ignore[no-untyped-def]
    ax.annotate("", (x + dx, y + dy), (x, y),
                arrowprops={"arrowstyle": "-|>", "color": colour, "linewidth": 1.4})
    ax.annotate(text, (x + dx, y + dy), fontsize=8, color=colour, xytext=(3, 3),
                textcoords="offset points")


def main() -> None:
    figure, axes = plt.subplots(2, 2, figsize=(11, 7), layout="constrained")
    model = simple_beam(10.0)
    analysis = analyse_model(model)
    draw_line(analysis.line(Response("shear", "4")), model, ax=axes[0, 0],
              title="Shear at s = 4 on a 10 m span: -a/L left of s, (L - a)/L right of s")
    draw_line(analysis.line(Response("moment", "4")), model, ax=axes[0, 1],
              title="Moment at s = 4: sagging positive, peak s(L - s)/L under the section")

    ax = axes[1, 0]
    ax.set_title("Positive internal forces at a section (member drawn start -> end)", fontsize=10)
    ax.plot([0, 4], [0, 0], color=PALETTE["structure"], linewidth=6)
    ax.plot([5, 9], [0, 0], color=PALETTE["structure"], linewidth=6)
    _arrow(ax, 2.0, 0.0, 0.0, 1.0, "V > 0: external forces on\nthe start side sum upward")
    _arrow(ax, 7.0, 0.0, 0.0, -1.0, "and on the end side downward")
    _arrow(ax, 4.0, 0.0, 1.0, 0.0, "N: tension", PALETTE["line"])
    _arrow(ax, 5.0, 0.0, -1.0, 0.0, "", PALETTE["line"])
    ax.annotate("M sagging: tension on the underside", (4.5, -1.6), ha="center", fontsize=8,
                color=PALETTE["path"])
    ax.set_xlim(-1, 10)
    ax.set_ylim(-2, 2)
    ax.axis("off")

    ax = axes[1, 1]
    ax.set_title("Positive reactions, loads and displacements", fontsize=10)
    ax.plot([0, 8], [0, 0], color=PALETTE["structure"], linewidth=4)
    _arrow(ax, 0.0, -1.4, 0.0, 1.0, "Ry (+y)")
    _arrow(ax, -1.4, 0.0, 1.0, 0.0, "Rx (+x)")
    ax.annotate("M: counter-clockwise\nrotation: counter-clockwise", (0.2, 0.5), fontsize=8,
                color=PALETTE["section"])
    _arrow(ax, 5.0, 1.5, 0.0, -1.3, "unit load and axles: down", PALETTE["line"])
    _arrow(ax, 7.0, 0.2, 0.0, -1.0, "deflection: + down", PALETTE["path"])
    ax.set_xlim(-2, 10)
    ax.set_ylim(-2, 2)
    ax.axis("off")
    target = Path(__file__).with_name("sign-conventions.png")
    figure.savefig(target, dpi=110)
    print(f"wrote {target}")


if __name__ == "__main__":
    main()
