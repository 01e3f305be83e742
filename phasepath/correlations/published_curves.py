"""Tables of the published melting and sublimation curves, keyed by CoolProp fluid name.

``SUBLIMATION_EQUATIONS`` and ``MELTING_EQUATIONS`` map a CoolProp 8.0.0 fluid name to

    (function name, published triple point (T [K], p [Pa]) used by the equation or None,
     T_min [K], T_max [K], source id)

``None`` means the equation's form does not contain a triple point (power series in 1/T, Simon
forms in absolute units). ``FUNCTIONS`` and ``SLOPES`` map each function name to the pressure
function and to its exact dp/dT. ``FLAGS`` holds, per (kind, fluid), what a caller must know
before joining the curve to the equation of state: a large miss of the EOS triple point, an
unpublished source, an attribution we could not confirm. The misses themselves are measured in
``tests/test_published_curves.py``.

Sources: :mod:`phasepath.bibliography` ids.
"""

from __future__ import annotations

from collections.abc import Callable

from . import helium, melting_published, sublimation_reference_eos, sublimation_reviews

__all__ = ["SUBLIMATION_EQUATIONS", "MELTING_EQUATIONS", "FUNCTIONS", "SLOPES", "FLAGS"]

Entry = tuple[str, "tuple[float, float] | None", float, float, str]

SUBLIMATION_EQUATIONS: dict[str, Entry] = {
    "Ammonia": (
        "sublimation_pressure_ammonia_gao2023",
        (195.49, 6053.39),
        15.0,
        195.49,
        "Gao2023-NH3",
    ),
    "CarbonMonoxide": (
        "sublimation_pressure_co_brown_ziegler",
        None,
        14.0,
        68.127,
        "BrownZiegler1980",
    ),
    "Ethane": ("sublimation_pressure_ethane_refprop", None, 20.0, 90.368, "REFPROP10-BZ"),
    "Neon": ("sublimation_pressure_neon_refprop", None, 7.0, 24.556, "REFPROP10-BZ"),
    "ParaHydrogen": (
        "sublimation_pressure_parahydrogen_refprop",
        None,
        8.7,
        13.8033,
        "REFPROP10-BZ",
    ),
    "HydrogenSulfide": ("sublimation_pressure_h2s_refprop", None, 118.0, 187.7, "REFPROP10-FS"),
    "SulfurHexafluoride": (
        "sublimation_pressure_sf6_guder_wagner",
        (223.555, 231429.0),
        141.0,
        223.555,
        "GuderWagner2009",
    ),
    "Xenon": (
        "sublimation_pressure_xenon_lemmon",
        (161.405, 81750.0),
        102.0,
        161.405,
        "Lemmon-REFPROP10-sub",
    ),
    "Krypton": (
        "sublimation_pressure_krypton_lemmon",
        (115.775, 73197.0),
        73.0,
        115.775,
        "Lemmon-REFPROP10-sub",
    ),
    "Oxygen": (
        "sublimation_pressure_oxygen_lemmon",
        (54.361, 146.28),
        43.8,
        54.361,
        "Lemmon-REFPROP10-sub",
    ),
    "Hydrogen": (
        "sublimation_pressure_hydrogen_lemmon",
        (13.957, 7700.0),
        8.8,
        13.957,
        "Lemmon-REFPROP10-sub",
    ),
    "NitrousOxide": ("sublimation_pressure_n2o_bell", None, 115.0, 182.33, "Bell-REFPROP10-N2O"),
}

MELTING_EQUATIONS: dict[str, Entry] = {
    "Ammonia": (
        "melting_pressure_ammonia_gao2023",
        (195.49, 6053.39),
        195.49,
        725.0,
        "Gao2023-NH3",
    ),
    "Xenon": (
        "melting_pressure_xenon_michels_prins",
        None,
        161.405,
        melting_published._XE_TMAX,
        "MichelsPrins1962",
    ),
    "SulfurHexafluoride": (
        "melting_pressure_sf6_guder_wagner",
        (223.555, 231429.0),
        223.555,
        melting_published._SF6_TMAX,
        "GuderWagner2009",
    ),
    "Hydrogen": (
        "melting_pressure_hydrogen_leachman",
        (13.957, 7357.8),
        13.957,
        melting_published._H2_TMAX,
        "Leachman2009",
    ),
    "Helium": (
        "melting_pressure_helium4_mills_grilly",
        None,
        helium.MELTING_T_MIN,
        helium.MELTING_T_MAX,
        "MillsGrilly1955",
    ),
}

_MODULES = (sublimation_reviews, sublimation_reference_eos, melting_published, helium)


def _lookup(name: str) -> Callable[[float], float]:
    for m in _MODULES:
        f = getattr(m, name, None)
        if f is not None:
            return f
    raise KeyError(name)


#: function name -> pressure function p(T) [Pa].
FUNCTIONS: dict[str, Callable[[float], float]] = {
    e[0]: _lookup(e[0]) for e in (*SUBLIMATION_EQUATIONS.values(), *MELTING_EQUATIONS.values())
}

#: function name -> its exact slope dp/dT [Pa/K].
SLOPES: dict[str, Callable[[float], float]] = {
    name: _lookup(name.replace("_pressure_", "_dpdT_")) for name in FUNCTIONS
}

#: (kind, fluid) -> what to know before joining the curve to the equation of state.
FLAGS: dict[tuple[str, str], str] = {
    ("melting", "Helium"): (
        "no solid-liquid-vapor triple point: CoolProp's triple point is the lambda point; the "
        "melting curve starts at 2.10 K and 3.63 MPa here and must not be joined to the "
        "vapor-pressure curve"
    ),
    ("sublimation", "Hydrogen"): (
        "fit through p_t = 7.7 kPa, 4.6 % above the EOS triple point (7.358 kPa); unpublished"
    ),
    ("melting", "Xenon"): (
        "Michels & Prins Simon fit with REFPROP's adjusted constant; original constant unconfirmed"
    ),
    ("melting", "Hydrogen"): "attribution to Leachman et al. (2009) from memory",
    ("melting", "SulfurHexafluoride"): "upper limit (150 MPa) is our choice",
    ("sublimation", "Xenon"): "unpublished fit (Lemmon), distributed with REFPROP 10",
    ("sublimation", "Krypton"): (
        "unpublished fit (Lemmon), distributed with REFPROP 10; its triple point (115.775 K, "
        "73.197 kPa) misses the EOS triple point (115.77 K, 73.50 kPa) by 0.047 K along the curve"
    ),
    ("sublimation", "Oxygen"): (
        "unpublished fit (Lemmon), distributed with REFPROP 10; Clapeyron over 0.95 T_t to T_t "
        "implies a fusion heat of about 0.06 kJ/mol, far below the 0.44 kJ/mol of the "
        "literature (from memory): its slope near T_t is doubtful"
    ),
    ("sublimation", "NitrousOxide"): "unpublished fit (Bell 2018), distributed with REFPROP 10",
    ("sublimation", "CarbonMonoxide"): (
        "ends at Brown & Ziegler's triple point 68.127 K, 0.033 K below the EOS triple point"
    ),
}
