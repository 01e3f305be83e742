"""phasepath: plan compression and heating routes for a pure substance on its phase diagram."""

from __future__ import annotations

from . import errors
from .batch import analyze_many
from .catalog import substance, substances
from .comparison import Comparison, compare
from .errors import (
    BatchError,
    NonFiniteError,
    OutOfRangeError,
    PhasePathError,
    PropertyError,
    ResultsFileError,
    RouteError,
    RouteFileError,
    UnitError,
    UnknownSubstanceError,
)
from .records import Crossing, Hazard, Leg, LegSummary, StatePoint
from .report import Report
from .route import Route
from .substances import Substance
from .sweep import sweep
from .tables import format_report
from .version import __version__

__all__ = [
    "substance",
    "substances",
    "Substance",
    "Route",
    "Leg",
    "analyze_many",
    "format_report",
    "compare",
    "Comparison",
    "sweep",
    "Report",
    "Crossing",
    "LegSummary",
    "StatePoint",
    "Hazard",
    "errors",
    "PhasePathError",
    "UnknownSubstanceError",
    "OutOfRangeError",
    "UnitError",
    "NonFiniteError",
    "RouteError",
    "PropertyError",
    "RouteFileError",
    "ResultsFileError",
    "BatchError",
    "__version__",
]


def __getattr__(name: str) -> object:
    # ``pp.widgets`` is imported on first use, so the core never imports ipywidgets or bqplot.
    if name == "widgets":
        import importlib

        return importlib.import_module(".widgets", __name__)
    raise AttributeError(f"module {__name__!r} has no attribute {name!r}")
