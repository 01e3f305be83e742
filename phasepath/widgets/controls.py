"""The planner's controls and page layout: built here, wired to the planner's handlers there.

The page, top to bottom: the substance picker and the drawing tools; the display units; the
route document (title, notes, open a route file); the three linked views (P–T large, p–h and
T–s below it) beside the start box and the leg list; the status line; the crossings and
per-leg tables; the exports; the cautions.
"""

from __future__ import annotations

from typing import TYPE_CHECKING, Any

import ipywidgets as W

from ..records import EVENTS, LEG_KINDS
from ..units import ENERGY_UNITS, PRESSURE_UNITS, TEMPERATURE_UNITS
from . import export
from .leglist import LegList
from .panels import CSS, energy_legend_html, legend_html

if TYPE_CHECKING:  # pragma: no cover
    from .planner import RoutePlanner

__all__ = ["build", "arrange", "KIND_CHOICES", "EVENT_CHOICES"]

KIND_CHOICES = ("auto", *LEG_KINDS)
_KIND_BUTTONS = [
    (
        "auto",
        "auto",
        "constant T or p on P–T, constant p or h on p–h, constant T or s on T–s, "
        "from the click's direction",
    )
] + [(kind.label, name, f"next leg: {kind.device}") for name, kind in LEG_KINDS.items()]
#: Events offered for ending a drawn constant-p or constant-T leg ("" = at the click).
EVENT_CHOICES = (*EVENTS, "5 K superheat", "5 K subcooling")
_UNIT_TEXT = {"degC": "°C", "degF": "°F", "K": "K"}


def build(pl: RoutePlanner) -> None:
    """Make the planner's controls (attributes of the planner)."""
    pl.picker = W.Combobox(
        options=list(pl._names),
        ensure_option=False,
        continuous_update=False,
        placeholder="type to filter…",
        description="Substance",
        layout=W.Layout(width="300px"),
    )
    pl.kind_toggle = W.ToggleButtons(
        options=[(label, kind) for label, kind, _ in _KIND_BUTTONS],
        value="auto",
        tooltips=[tip for _, _, tip in _KIND_BUTTONS],
        style={"button_width": "84px"},
    )
    pl.until_pick = W.Combobox(
        options=list(EVENT_CHOICES),
        value="",
        ensure_option=False,
        continuous_update=False,
        placeholder="at the click",
        description="ends",
        tooltip="end the next constant-p or constant-T leg on an event",
        style={"description_width": "initial"},
        layout=W.Layout(width="165px"),
    )
    pl.mode_toggle = W.ToggleButtons(
        options=[("draw", "draw"), ("pan/zoom", "pan")],
        value="draw",
        style={"button_width": "80px"},
        tooltips=[
            "clicks add corners (snapped to round values; hold Shift or Alt for the exact "
            "point); drag a corner to move it",
            "drag to pan, scroll to zoom",
        ],
    )
    button = W.Layout(width="80px")
    pl.fit_btn = W.Button(
        description="fit",
        icon="expand",
        tooltip="show the route and the curves it reaches",
        layout=W.Layout(width="70px"),
    )
    pl.undo_btn = W.Button(description="undo", icon="undo", layout=button)
    pl.redo_btn = W.Button(description="redo", icon="repeat", layout=button)
    pl.clear_btn = W.Button(description="clear", icon="eraser", layout=button)
    initial = {"description_width": "initial"}
    pl.T_pick = W.Dropdown(
        options=[(_UNIT_TEXT[u], u) for u in TEMPERATURE_UNITS],
        description="temperature",
        style=initial,
        layout=W.Layout(width="170px"),
    )
    pl.p_pick = W.Dropdown(
        options=list(PRESSURE_UNITS),
        description="pressure",
        style=initial,
        layout=W.Layout(width="160px"),
    )
    pl.e_pick = W.Dropdown(
        options=list(ENERGY_UNITS),
        description="energy",
        style=initial,
        layout=W.Layout(width="160px"),
    )
    pl.start_T = W.Text(placeholder="T, e.g. 25 degC", layout=W.Layout(width="110px"))
    pl.start_p = W.Text(placeholder="p, e.g. 1 bar", layout=W.Layout(width="110px"))
    pl.start_q = W.Text(
        placeholder="quality 0–1",
        tooltip="vapor mass fraction of a saturated start",
        layout=W.Layout(width="90px"),
    )
    pl.start_btn = W.Button(description="place start", layout=W.Layout(width="100px"))
    pl.start_msg = W.HTML()
    pl.title_field = W.Text(
        placeholder="route title",
        continuous_update=False,
        description="title",
        style=initial,
        layout=W.Layout(width="320px"),
    )
    pl.notes_field = W.Textarea(
        placeholder="notes: the plan, the operating window, who checked it",
        continuous_update=False,
        description="notes",
        style=initial,
        layout=W.Layout(width="460px", height="52px"),
    )
    pl.upload = W.FileUpload(
        accept=".json,.yaml,.yml",
        multiple=False,
        description="open route file",
        layout=W.Layout(width="150px"),
    )
    pl.legs = LegList(pl._edit_corner, pl._delete_corner, pl._typed_leg, pl.select)
    pl.status = W.HTML()
    pl.results = W.HTML()
    pl.legend = W.HTML(legend_html())
    pl.energy_legend = W.HTML(energy_legend_html())
    pl.cautions = W.HTML()
    pl.files_btn = W.Button(
        description="files",
        icon="download",
        layout=button,
        tooltip="prepare route.json, crossings.csv and legs.csv of the route shown",
    )
    pl.report_btn = W.Button(
        description="report",
        icon="file-text",
        layout=button,
        tooltip="prepare report.html: the route's review report (one self-contained, printable "
        "page: diagrams, tables, hazards, cautions, sources, provenance)",
    )
    pl.downloads = W.HTML(export.ON_REQUEST)
    pl.png_btn = W.Button(
        description="PNG", icon="image", layout=button, tooltip="save the three diagrams as PNG"
    )
    pl.svg_btn = W.Button(
        description="SVG", icon="image", layout=button, tooltip="save the three diagrams as SVG"
    )
    pl.style_html = W.HTML(CSS, layout=W.Layout(height="0px", overflow="hidden"))


def arrange(pl: RoutePlanner) -> list[Any]:
    """The page's rows, top to bottom."""
    bar = W.HBox(
        [
            pl.picker,
            pl.kind_toggle,
            pl.until_pick,
            pl.mode_toggle,
            pl.fit_btn,
            pl.undo_btn,
            pl.redo_btn,
            pl.clear_btn,
        ],
        layout=W.Layout(flex_flow="row wrap", align_items="center"),
    )
    units = W.HBox(
        [W.HTML("<b>Units</b>&nbsp;&nbsp;"), pl.T_pick, pl.p_pick, pl.e_pick],
        layout=W.Layout(align_items="center"),
    )
    doc = W.HBox(
        [pl.title_field, pl.notes_field, pl.upload],
        layout=W.Layout(align_items="center", flex_flow="row wrap"),
    )
    doc.add_class("pp-doc")
    pl.start_box = W.VBox(
        [
            W.HTML("<div class='pp-h'>Start state</div>"),
            W.HBox([pl.start_T, pl.start_p, pl.start_q]),
            W.HBox([pl.start_btn]),
            W.HTML(
                "<span style='font-size:11px;color:#555'>p may be a fill density instead "
                "(450 kg/m3); a quality (vapor fraction) starts on the saturation curve at T "
                "or at p</span>"
            ),
            pl.start_msg,
        ]
    )
    side = W.VBox([pl.start_box, pl.legs], layout=W.Layout(flex="0 0 400px", padding="0 0 0 12px"))
    c = pl.canvases
    for view in ("ph", "Ts"):  # side by side, sharing the width
        c[view].box.layout.flex = "1 1 0"
    lower = W.HBox([c["ph"].box, c["Ts"].box], layout=W.Layout(width="100%"))
    plots = W.VBox(
        [c["pT"].box, pl.legend, lower, pl.energy_legend, c["pT"].css],
        layout=W.Layout(flex="1 1 auto", min_width="0"),
    )
    files = W.HBox(
        [
            W.HTML("<b>Export</b>&nbsp;"),
            pl.files_btn,
            pl.report_btn,
            pl.downloads,
            W.HTML("&nbsp;diagrams:&nbsp;"),
            pl.png_btn,
            pl.svg_btn,
        ],
        layout=W.Layout(align_items="center", flex_flow="row wrap"),
    )
    return [
        pl.style_html,
        bar,
        units,
        doc,
        W.HBox([plots, side]),
        pl.status,
        pl.results,
        files,
        pl.cautions,
    ]
