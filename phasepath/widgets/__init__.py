"""Jupyter widgets of phasepath: the only package that imports ipywidgets and bqplot.

>>> import phasepath as pp
>>> planner = pp.widgets.RoutePlanner("CO2")      # display it in a notebook
>>> planner.route is None                          # nothing drawn yet
True
"""

from .planner import RoutePlanner
from .sweepmap import SweepMap

__all__ = ["RoutePlanner", "SweepMap"]
