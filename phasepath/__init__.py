"""phasepath: plan compression and heating routes for a pure substance on its phase diagram."""

from __future__ import annotations

from . import errors
from .batch import analyze_many
from .errors import (
    BatchError,
    NonFiniteError,
    OutOfRangeError,
    PhasePathError,
    PropertyError,
    RouteError,
    RouteFileError,
    UnitError,
    UnknownSubstanceError,
)
from .report import Crossing, LegSummary, Report, StatePoint
from .route import Leg, Route
from .substances import Substance, substance, substances
from .sweep import sweep

__version__ = "0.1.0"

__all__ = [
    "substance",
    "substances",
    "Substance",
    "Route",
    "Leg",
    "analyze_many",
    "sweep",
    "Report",
    "Crossing",
    "LegSummary",
    "StatePoint",
    "errors",
    "PhasePathError",
    "UnknownSubstanceError",
    "OutOfRangeError",
    "UnitError",
    "NonFiniteError",
    "RouteError",
    "PropertyError",
    "RouteFileError",
    "BatchError",
    "__version__",
]


def __getattr__(name: str) -> object:
    # ``pp.widgets`` is imported on first use, so the core never imports ipywidgets or bqplot.
    if name == "widgets":
        import importlib

        return importlib.import_module(".widgets", __name__)
    raise AttributeError(f"module {__name__!r} has no attribute {name!r}")
