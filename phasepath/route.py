"""Routes: a start state and an ordered list of legs through pressure-temperature space.

>>> import phasepath as pp
>>> route = pp.Route("CO2", T="-23 degC", p="20 bar").isotherm(p=1e5).isobar(T=180.0)
>>> [(leg.kind, round(leg.T, 2), leg.p) for leg in route.legs]
[('isotherm', 250.15, 100000.0), ('isobar', 180.0, 100000.0)]
"""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import TYPE_CHECKING, Any

from .errors import PhasePathError, RouteError
from .substances import Substance, substance
from .units import parse_pressure, parse_temperature

if TYPE_CHECKING:
    from .report import Report

__all__ = ["Route", "Leg", "LEG_KINDS"]

#: Leg kinds and the coordinate each one holds fixed.
LEG_KINDS = {"isobar": "p", "isotherm": "T"}

_SAME = 1e-12  # relative: a leg shorter than this is a zero-length leg


def _reraise(exc: PhasePathError, where: str, given: object) -> PhasePathError:
    """The same error class with the user's own text in front of the message."""
    msg = str(exc)
    text = f"{where} {given!r}: {msg}" if repr(given) not in msg else f"{where}: {msg}"
    new = type(exc).__new__(type(exc))
    Exception.__init__(new, text)
    new.__dict__.update(exc.__dict__)
    return new


def _parse(kind: str, value: object, where: str) -> float:
    try:
        return parse_temperature(value) if kind == "T" else parse_pressure(value)
    except PhasePathError as exc:
        raise _reraise(exc, where, value) from None


@dataclass(frozen=True)
class Leg:
    """One leg: its kind, its end state [K, Pa] and the target as the user wrote it."""

    kind: str
    T: float
    p: float
    given: dict[str, Any] = field(default_factory=dict, compare=False)


class Route:
    """A planned route: the substance, a start state and legs added in order.

    Parameters
    ----------
    substance : str or Substance
        A name or alias known to phasepath (``"CO2"``, ``"water"``), or a Substance.
    T, p : float, str or pint.Quantity
        Start temperature and pressure. Numbers are SI (K, Pa); strings carry their unit
        (``"25 degC"``, ``"60 bar"``, ``"14.7 psi"``).
    title, notes : str
        Free text kept with the route (shown in reports and saved in route files).
    """

    def __init__(
        self,
        substance_: str | Substance,
        T: object = None,
        p: object = None,
        *,
        title: str = "",
        notes: str = "",
    ) -> None:
        self.substance = substance(substance_)
        self.title = str(title)
        self.notes = str(notes)
        T0 = _parse("T", T, "start temperature")
        p0 = _parse("p", p, "start pressure")
        self._check(T0, p0, "start state", {"T": T, "p": p})
        self.start = Leg("start", T0, p0, {"T": T, "p": p})
        self.legs: list[Leg] = []

    # -- building ------------------------------------------------------------------------------
    def isobar(self, T: object) -> Route:
        """Add a constant-pressure leg to temperature ``T``; returns the route (chainable)."""
        end = self.end
        T1 = _parse("T", T, f"leg {len(self.legs) + 1} (isobar) temperature")
        return self._add(Leg("isobar", T1, end.p, {"T": T}))

    def isotherm(self, p: object) -> Route:
        """Add a constant-temperature leg to pressure ``p``; returns the route (chainable)."""
        end = self.end
        p1 = _parse("p", p, f"leg {len(self.legs) + 1} (isotherm) pressure")
        return self._add(Leg("isotherm", end.T, p1, {"p": p}))

    def add(self, kind: str, **target: object) -> Route:
        """Add a leg by kind name: ``route.add("isobar", T=300)``."""
        if kind not in LEG_KINDS:
            raise RouteError(f"unknown leg kind {kind!r}; known: {', '.join(LEG_KINDS)}")
        return getattr(self, kind)(**target)

    def _add(self, leg: Leg) -> Route:
        end = self.end
        n = len(self.legs) + 1
        if abs(leg.T - end.T) <= _SAME * end.T and abs(leg.p - end.p) <= _SAME * end.p:
            raise RouteError(
                f"leg {n} ({leg.kind} to {_given_text(leg.given)}) has zero length: "
                f"it ends where it starts (T = {end.T:.6g} K, p = {end.p:.6g} Pa)"
            )
        self._check(leg.T, leg.p, f"leg {n} ({leg.kind}) end state", leg.given)
        self.legs.append(leg)
        return self

    def _check(self, T: float, p: float, where: str, given: dict[str, Any]) -> None:
        try:
            self.substance.check_state(T, p)
        except PhasePathError as exc:
            raise _reraise(exc, where, _given_text(given)) from None

    # -- reading -------------------------------------------------------------------------------
    @property
    def end(self) -> Leg:
        """The last corner (the start if there are no legs)."""
        return self.legs[-1] if self.legs else self.start

    def corners(self) -> list[tuple[float, float]]:
        """(T [K], p [Pa]) of the start and of every leg's end, in order."""
        return [(self.start.T, self.start.p)] + [(leg.T, leg.p) for leg in self.legs]

    def __len__(self) -> int:
        return len(self.legs)

    def __repr__(self) -> str:
        return (
            f"<Route {self.substance.name}: start T={self.start.T:.6g} K, "
            f"p={self.start.p:.6g} Pa, {len(self.legs)} legs>"
        )

    def analyze(self) -> Report:
        """Analyse every leg: the crossings, the states and the heat and work per kg."""
        from .analysis import analyze

        return analyze(self)

    # -- deriving ------------------------------------------------------------------------------
    def copy(self) -> Route:
        """An independent copy."""
        return self.with_substance(self.substance)

    def with_substance(self, name: str | Substance) -> Route:
        """The same corners as typed by the user, for another substance (re-validated)."""
        return Route.from_dict({**self.to_dict(), "substance": name})

    def reversed(self) -> Route:
        """The route run backwards: the last corner first, each leg undone in reverse order."""
        corners = self.corners()
        out = Route(self.substance, T=corners[-1][0], p=corners[-1][1], title=self.title)
        for leg, (T, p) in zip(reversed(self.legs), reversed(corners[:-1])):
            out.isobar(T=T) if leg.kind == "isobar" else out.isotherm(p=p)
        return out

    def to_dict(self) -> dict[str, Any]:
        """Plain data: the substance, the start and the legs as the user wrote them."""
        return {
            "substance": self.substance if not _is_named(self.substance) else self.substance.name,
            "title": self.title,
            "notes": self.notes,
            "start": dict(self.start.given),
            "legs": [{"kind": leg.kind, **leg.given} for leg in self.legs],
        }

    @classmethod
    def from_dict(cls, data: dict[str, Any]) -> Route:
        """Build a route from :meth:`to_dict` output."""
        start = data.get("start", {})
        route = cls(data["substance"], T=start.get("T"), p=start.get("p"),
                    title=data.get("title", ""), notes=data.get("notes", ""))
        for leg in data.get("legs", []):
            leg = dict(leg)
            route.add(leg.pop("kind"), **leg)
        return route


def _is_named(sub: Substance) -> bool:
    """True for substances that can be rebuilt from their name alone."""
    return sub.eos is not None


def _given_text(given: dict[str, Any]) -> str:
    return ", ".join(f"{k}={v!r}" if isinstance(v, str) else f"{k}={v}" for k, v in given.items())
