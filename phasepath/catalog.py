"""The catalog: names and aliases to substances, and the substances built from data this session.

:func:`substance` resolves a name or alias (case-insensitive, blanks and dashes ignored) to the
:class:`~phasepath.substances.Substance` of a CoolProp fluid, built once by
:mod:`phasepath.reference` and kept; substances built from data (:func:`from_data`) are
registered here by name, after the reference names. :func:`from_dict` rebuilds either kind from
its plain data (``Substance.to_dict``).

>>> substance("carbon dioxide").name
'CarbonDioxide'
>>> substance("Nitrogen") is substance("N2")
True
>>> "CarbonDioxide" in substances() and len(substances()) > 100
True
>>> display_name("CO2"), display_name("water"), display_name("R134a")
('carbon dioxide (CO2)', 'water (H2O)', 'R134a (C2H2F4)')

Mixtures are refused: the reference library's predefined blends and air
(``fluid_info(name, "pure") == "false"``) have a bubble point and a dew point that differ at a
given pressure, so they have no single vapor-pressure curve to cross.

>>> substance("R410A")  # doctest: +ELLIPSIS
Traceback (most recent call last):
...
phasepath.errors.UnknownSubstanceError: R410A is a mixture (a predefined blend), not a pure...
>>> "Air" in substances()
False
"""

from __future__ import annotations

import difflib
import json
import re
import threading
from collections.abc import Mapping
from functools import cache, lru_cache
from typing import Any

from . import datasheet, reference
from .eos import fluid_aliases, fluid_info, fluid_names
from .errors import PhasePathError, UnknownSubstanceError, shown
from .substances import Substance

__all__ = ["substance", "substances", "from_data", "from_dict", "registered", "display_name"]

# Common names that CoolProp's alias lists do not already hold.
_EXTRA_ALIASES = {
    "water": "Water",
    "steam": "Water",
    "h2o": "Water",
    "carbon dioxide": "CarbonDioxide",
    "carbon monoxide": "CarbonMonoxide",
    "nitrogen": "Nitrogen",
    "argon": "Argon",
    "methane": "Methane",
    "oxygen": "Oxygen",
    "hydrogen": "Hydrogen",
    "helium": "Helium",
    "neon": "Neon",
    "krypton": "Krypton",
    "xenon": "Xenon",
    "ammonia": "Ammonia",
    "propane": "n-Propane",
    "butane": "n-Butane",
    "ethane": "Ethane",
    "ethylene": "Ethylene",
    "ethanol": "Ethanol",
    "methanol": "Methanol",
    "nitrous oxide": "NitrousOxide",
    "sulfur dioxide": "SulfurDioxide",
    "hydrogen sulfide": "HydrogenSulfide",
    "heavy water": "HeavyWater",
    "air": "Air",
}

_LOADING = threading.RLock()
_REGISTRY: dict[str, Substance] = {}  # built from data this session, by name (latest wins)
_BY_RECIPE: dict[str, Substance] = {}  # identical recipes give one object


def _key(text: str) -> str:
    return re.sub(r"[\s\-_,()]+", "", text).lower()


@lru_cache(maxsize=1)
def _alias_map() -> dict[str, str]:
    out: dict[str, str] = {}
    for name in fluid_names():
        out[_key(name)] = name
        for alias in fluid_aliases(name):
            out.setdefault(_key(alias), name)
    for alias, name in _EXTRA_ALIASES.items():
        if name in out.values():
            out[_key(alias)] = name
    return out


@cache
def _pure(name: str) -> bool:
    """True for a pure fluid of the reference library (False for its blends and air)."""
    return fluid_info(name, "pure").strip().lower() == "true"


def substances() -> list[str]:
    """Every pure substance of the reference library, by its CoolProp name (blends left out)."""
    return [n for n in fluid_names() if _pure(n)]


def _mixture(name: str, typed: object) -> UnknownSubstanceError:
    what = "of nitrogen, oxygen and argon" if name == "Air" else "a predefined blend"
    return UnknownSubstanceError(
        f"{name} is a mixture ({what}), not a pure substance: at a given pressure it boils "
        f"over a range of temperatures, from its bubble point to its dew point, so it has no "
        f"single vapor-pressure curve to cross and phasepath does not model it (it plans routes "
        f"of pure substances; phasepath.substances() lists them)",
        value=typed,
    )


def substance(name: object) -> Substance:
    """The :class:`Substance` for a name or alias (case-insensitive), or a Substance itself.

    A mapping is the plain data of a substance (:meth:`Substance.to_dict`), as saved in a route
    file.
    """
    if isinstance(name, Substance):
        return name
    if isinstance(name, Mapping):
        return from_dict(name)
    if not isinstance(name, str) or not name.strip():
        raise _unknown(name)
    resolved = _alias_map().get(_key(name))
    if resolved is None:
        if name.strip() in _REGISTRY:
            return _REGISTRY[name.strip()]
        raise _unknown(name)
    if not _pure(resolved):
        raise _mixture(resolved, name)
    with _LOADING:  # first use from several threads at once: one Substance, one CoolProp load
        return _reference(resolved)


@cache
def _reference(name: str) -> Substance:
    return reference.build(name)


def _unknown(name: object) -> UnknownSubstanceError:
    suggestions: list[str] = []
    if isinstance(name, str) and name.strip():
        keys = _alias_map()
        for c in difflib.get_close_matches(_key(name), list(keys), n=4, cutoff=0.6):
            if keys[c] not in suggestions and _pure(keys[c]):
                suggestions.append(keys[c])
    hint = f"; did you mean {', '.join(map(repr, suggestions[:3]))}?" if suggestions else ""
    return UnknownSubstanceError(
        f"unknown substance {shown(name)}{hint} (phasepath.substances() lists the "
        f"names it knows; aliases such as 'CO2' or 'water' work too)",
        value=name,
        suggestions=tuple(suggestions[:3]),
    )


def from_data(name: str, **data: Any) -> Substance:
    """A substance built from data (:func:`phasepath.datasheet.from_data`), registered by name
    so that :func:`substance` and everything that takes a name finds it."""
    unknown = [k for k in data if k not in datasheet.KEYS]
    if unknown:
        raise PhasePathError(
            f"{shown(name)}: unknown input(s) {', '.join(map(repr, unknown))} for a substance "
            f"built from data; known: {', '.join(datasheet.KEYS)}",
            value=unknown[0],
        )
    sub = datasheet.from_data(name, **data)
    if _key(sub.name) not in _alias_map():  # a reference substance keeps its name
        _REGISTRY[sub.name] = sub
    return sub


def registered() -> dict[str, Substance]:
    """Substances built from data in this session, by name (the latest of each name).

    ``pp.substance(name)`` and everything that takes a name (routes, widgets) find them, after
    the reference substances: a substance built under a reference name is reachable only as an
    object.
    """
    return dict(_REGISTRY)


def from_dict(data: Mapping[str, Any]) -> Substance:
    """The substance a :meth:`Substance.to_dict` mapping describes (identical mappings give one
    object)."""
    if not isinstance(data, Mapping) or "name" not in data:
        raise PhasePathError(f"a substance mapping needs a 'name' (got {shown(data)})")
    extra = [k for k in data if k != "name" and k not in datasheet.KEYS]
    if extra:
        raise PhasePathError(
            f"substance {data.get('name')!r}: unknown key(s) "
            f"{', '.join(map(repr, extra))}; known: name, {', '.join(datasheet.KEYS)}"
        )
    if len(data) == 1:
        return substance(data["name"])
    try:
        key = json.dumps(data, sort_keys=True)
    except (TypeError, ValueError):
        key = ""
    if key and key in _BY_RECIPE:
        return _BY_RECIPE[key]
    args = {k: v for k, v in data.items() if k != "name"}
    if isinstance(args.get("triple"), list):
        args["triple"] = tuple(args["triple"])
    sub = from_data(data["name"], **args)
    if key:
        _BY_RECIPE[key] = sub
    return sub


_PREFIXES = ("Iso", "Cyclo", "Neo", "Para", "Ortho")  # written together with the next word
# Formulas as people write them where that is not the Hill order, or where the reference
# library gives none (common practice).
_FORMULAS = {
    "Ammonia": "NH3",
    "Chlorine": "Cl2",
    "HydrogenChloride": "HCl",
    "SulfurDioxide": "SO2",
    "SulfurHexafluoride": "SF6",
    "CarbonylSulfide": "COS",
    "ParaHydrogen": "H2",
    "OrthoHydrogen": "H2",
    "ParaDeuterium": "D2",
    "OrthoDeuterium": "D2",
    "Tetrahydrofuran": "C4H8O",
    "VinylChloride": "C2H3Cl",
    "n-Perfluorobutane": "C4F10",
    "n-Perfluoropentane": "C5F12",
    "n-Perfluorohexane": "C6F14",
}


def display_name(name: object) -> str:
    """A substance's plain name with its formula, as people write it: "carbon dioxide (CO2)",
    "water (H2O)", "n-propane (C3H8)"; a refrigerant or siloxane keeps its code ("R134a (C2H2F4)",
    "MD2M (C10H30O3Si4)"); the formula is written in Hill order (carbon, hydrogen, then the
    other elements alphabetically) and left out where the reference library gives none. A
    substance built from data is shown by its own name."""
    sub = substance(name)
    if not sub.named:
        return sub.name
    code = sub.name
    if re.fullmatch(r"(R|RC)\d.*|[A-Z0-9()]+|HFE\w*|SES\w*|Novec\w*", code):
        plain = code
    else:
        words = re.findall(r"[A-Z]?[a-z]+|[^A-Za-z]+|[A-Z]+(?![a-z])", code)
        out: list[str] = []
        for w in words:
            if out and out[-1].capitalize() in _PREFIXES:
                out[-1] += w.lower()
            elif out and (not out[-1][-1:].isalpha() or not w[:1].isalpha()):
                out[-1] += w.lower()
            else:
                out.append(w.lower())
        plain = " ".join(out)
    formula = _FORMULAS.get(code) or _hill(fluid_info(code, "formula"))
    return f"{plain} ({formula})" if formula and formula != plain else plain


def _hill(raw: str) -> str:
    """The reference library's formula ("C_{2}F_{4}H_{2}") in Hill order ("C2H2F4")."""
    atoms = re.findall(r"([A-Z][a-z]?)_\{(\d+)\}", raw or "")
    if not atoms:
        return ""
    count = {el: int(n) for el, n in atoms}
    first = [el for el in ("C", "H") if el in count] if "C" in count else []
    order = first + sorted(el for el in count if el not in first)
    return "".join(el + (str(count[el]) if count[el] != 1 else "") for el in order)
