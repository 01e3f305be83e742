"""Substances beyond the reference library: a phase diagram built from data-sheet numbers.

:func:`from_data` (also ``pp.Substance.from_data``, which registers the result by name in
:mod:`phasepath.catalog`) takes what a data sheet gives (published Antoine or Wagner
coefficients with their range, measured vapor pressures, a normal boiling point and an enthalpy
of vaporization, triple and critical points, a melting curve, an enthalpy of sublimation or
fusion) and builds a :class:`~phasepath.substances.Substance` whose boundaries are those
published forms. What is not given is not guessed: a missing melting curve means freezing is not
detected, a missing sublimation enthalpy means states below the triple point are refused, and
``Substance.notes`` says so in plain words.

The package, in the order a substance is built: :mod:`.inputs` (reading the numbers),
:mod:`.fits` (Antoine and Clausius-Clapeyron fits to measured points), :mod:`.curves`
(vapor pressure, bridges, melting and sublimation), :mod:`.build` (the assembly).

Two vapor points fix the Clausius-Clapeyron line; its enthalpy is R ln(p2/p1) / (1/T1 - 1/T2),
by hand 8.314462618 x ln 8 / (1/300 - 1/350) = 36.31 kJ/mol:

>>> import phasepath as pp
>>> sub = pp.Substance.from_data("demo", critical=(560.0, 4.5e6), triple=(180.0, None),
...     vapor_points=[(300.0, 5.0e3), (350.0, 4.0e4)])
>>> round(sub.source_data.fits["clausius-clapeyron"].enthalpy() / 1e3, 2)
36.31
>>> sub.phase(320.0, 1e5), sub.phase(320.0, 1e3), sub.phase(600.0, 5e6)
('liquid', 'vapor', 'supercritical')
"""

from .build import P_MAX_DEFAULT, SUBLIMATION_FLOOR, SubstanceData, from_data
from .curves import CC_WINDOW
from .fits import VaporFit, fit_antoine, fit_clausius_clapeyron
from .inputs import KEYS

__all__ = [
    "from_data",
    "SubstanceData",
    "VaporFit",
    "fit_antoine",
    "fit_clausius_clapeyron",
    "CC_WINDOW",
    "KEYS",
    "P_MAX_DEFAULT",
    "SUBLIMATION_FLOOR",
]
