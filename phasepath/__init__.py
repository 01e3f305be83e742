"""phasepath: plan compression and heating routes for a pure substance on its phase diagram."""

from __future__ import annotations

from . import errors
from .errors import (
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

__version__ = "0.1.0"

__all__ = [
    "substance",
    "substances",
    "Substance",
    "Route",
    "Leg",
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
    "__version__",
]
