"""Routes: a start state and an ordered list of legs through pressure-temperature space.

>>> import phasepath as pp
>>> route = pp.Route("CO2", T="-23 degC", p="20 bar").isotherm(p=1e5).isobar(T=180.0)
>>> [(leg.kind, round(leg.T, 2), leg.p) for leg in route.legs]
[('isotherm', 250.15, 100000.0), ('isobar', 180.0, 100000.0)]

A start on the vapor-pressure curve with its vapor fraction (quality): saturated liquid at 10 bar.

>>> start = pp.Route("N2", p="10 bar", quality=0.0).start.state
>>> start.phase, start.vapor_fraction, round(start.T, 2)
('liquid', 0.0, 103.75)

Rule for a start exactly on a boundary (the same for every leg kind): a start given by its
state (a quality, or a density that is exactly a saturated density) is that state; a start
given as (T, p) that lies exactly on a boundary takes the phase of the side the first leg leaves
into, read a hair along the leg's moving coordinate with the other held at the start (T on an
isobar and a sealed vessel, p on an isotherm, a valve and a compressor).
"""

from __future__ import annotations

import math
import numbers
from typing import TYPE_CHECKING, Any

from . import states
from .catalog import substance
from .correlations.atmosphere import ambient_pressure
from .errors import OutOfRangeError, PhasePathError, RouteError
from .records import EVENT_DELTA, EVENTS, LEG_KINDS, Leg, StatePoint
from .rootfind import find_root
from .substances import Substance
from .units import parse_pressure, parse_quantity, parse_temperature

if TYPE_CHECKING:  # pragma: no cover
    from .report import Report

__all__ = ["Route", "Leg", "LEG_KINDS"]

_SAME = 1e-12  # relative: a leg shorter than this is a zero-length leg
_ARRIVE = 1e-9  # fraction of the last leg, back from its end, at which its arrival side is read


def _parse(
    kind: str,
    value: object,
    where: str,
    elevation: float | None = None,
    sub: Substance | None = None,
) -> float:
    try:
        if kind == "p" and isinstance(value, str) and value.strip().lower() == "ambient":
            return ambient_pressure(0.0 if elevation is None else elevation)
        if kind == "density":
            return parse_quantity(value, "density")
        ambient = ambient_pressure(0.0 if elevation is None else elevation)
        return parse_temperature(value) if kind == "T" else parse_pressure(value, ambient=ambient)
    except PhasePathError as exc:
        valid = sub.valid_range(kind) if sub is not None and kind in ("T", "p") else None
        raise exc.within(where, value=value, valid=valid) from exc


class Route:
    """A planned route: the substance, a start state and legs added in order.

    Parameters
    ----------
    substance : str or Substance
        A name or alias known to phasepath (``"CO2"``, ``"water"``), or a Substance.
    T, p : float, str or pint.Quantity
        Start temperature and pressure. Numbers are SI (K, Pa); strings carry their unit
        (``"25 degC"``, ``"60 bar"``, ``"14.7 psi"``).
    density : float, str or pint.Quantity, optional
        Start density [kg/m3] instead of ``p``: with ``T`` it fixes a state inside the
        two-phase region too (a cylinder's fill density).
    quality : float, optional
        Start vapor mass fraction, 0 (saturated liquid) to 1 (saturated vapor), with ``T`` or
        ``p`` (not both): a start on the vapor-pressure curve, between the triple point and
        the critical point.
    elevation : float, optional
        Site elevation [m]; a pressure written ``"ambient"`` is then the U.S. Standard
        Atmosphere 1976 pressure there (sea level if no elevation is given).
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
        density: object = None,
        elevation: float | None = None,
        quality: object = None,
    ) -> None:
        self.substance = substance(substance_)
        self.title = str(title)
        self.notes = str(notes)
        if elevation is not None:
            ambient_pressure(elevation)  # validates it
        self.elevation = elevation
        if quality is not None:
            self.start = self._quality_start(T, p, density, quality)
            self.legs: list[Leg] = []
            return
        T0 = _parse("T", T, "start temperature", sub=self.substance)
        if density is not None:
            if p is not None:
                raise RouteError("give the start pressure or the start density, not both")
            rho = _parse("density", density, "start density")
            given = {"T": T, "density": density}
            if not rho > 0:
                raise OutOfRangeError(f"start density {density!r} is not positive")
            self._check(T0, self.substance.triple[1], "start state", given, T_only=True)
            state = self._guard(
                lambda: states.flash_Tv(self.substance, T0, 1.0 / rho), "start state", given
            )
            self.start = Leg("start", state.T, state.p, given, state=state)
        else:
            p0 = _parse("p", p, "start pressure", elevation, sub=self.substance)
            self._check(T0, p0, "start state", {"T": T, "p": p})
            self.start = Leg("start", T0, p0, {"T": T, "p": p})
        self.legs = []

    def _quality_start(self, T: object, p: object, density: object, quality: object) -> Leg:
        """The start on the vapor-pressure curve at T or p with vapor mass fraction quality."""
        sub = self.substance
        if density is not None:
            raise RouteError("give the start quality or the start density, not both")
        if (T is None) == (p is None):
            raise RouteError(
                "a start with a quality needs its temperature T or its pressure p, not both: "
                "the other follows from the vapor-pressure curve"
            )
        x = _fraction(quality, "start quality")
        T_t, p_t = sub.triple
        T_c, p_c = sub.critical
        if sub.vapor is None:
            raise RouteError(f"{sub.name} has no vapor-pressure curve: a quality needs one")
        if T is not None:
            T0 = _parse("T", T, "start temperature", sub=sub)
            given: dict[str, Any] = {"T": T, "quality": quality}
            if not T_t <= T0 < T_c:
                raise OutOfRangeError(
                    f"start temperature {T!r}: a quality is defined on the vapor-pressure curve, "
                    f"from the triple point ({T_t:.6g} K) to below the critical point "
                    f"({T_c:.6g} K)",
                    value=T,
                )
            T_s, p_s = T0, sub.vapor.p_of_T(T0)
        else:
            p0 = _parse("p", p, "start pressure", self.elevation, sub=sub)
            given = {"p": p, "quality": quality}
            if not p_t <= p0 < p_c:
                raise OutOfRangeError(
                    f"start pressure {p!r}: a quality is defined on the vapor-pressure curve, "
                    f"from the triple point ({p_t:.6g} Pa) to below the critical point "
                    f"({p_c:.6g} Pa)",
                    value=p,
                )
            T_s, p_s = sub.vapor.temperatures_at(p0)[0].root, p0
        state = self._guard(
            lambda: states.saturated_mixture(sub, T_s, p_s, x), "start state", given
        )
        return Leg("start", T_s, p_s, given, state=state)

    # -- building ------------------------------------------------------------------------------
    def isobar(self, T: object = None, *, until: str | None = None) -> Route:
        """Add a constant-pressure leg to temperature ``T``, or until an event; chainable.

        ``until`` is one of "fully vapor", "fully liquid", "first liquid", "first vapor",
        "first solid", "N K superheat" or "N K subcooling" (N a number).
        """
        where = f"leg {len(self.legs) + 1} (isobar)"
        if until is not None:
            return self._until("isobar", until, T, where)
        T1 = _parse("T", T, f"{where} temperature", sub=self.substance)
        return self._add(Leg("isobar", T1, self.end.p, {"T": T}))

    def isotherm(self, p: object = None, *, until: str | None = None) -> Route:
        """Add a constant-temperature leg to pressure ``p``, or until an event; chainable.

        ``until`` is one of "fully liquid", "fully vapor", "first liquid", "first vapor" or
        "first solid".
        """
        where = f"leg {len(self.legs) + 1} (isotherm)"
        if until is not None:
            return self._until("isotherm", until, p, where)
        p1 = _parse("p", p, f"{where} pressure", self.elevation, sub=self.substance)
        return self._add(Leg("isotherm", self.end.T, p1, {"p": p}))

    def isochore(self, T: object = None, p: object = None) -> Route:
        """Add a constant-volume leg (a sealed vessel) to temperature ``T`` or pressure ``p``."""
        n = len(self.legs) + 1
        where = f"leg {n} (isochore)"
        if (T is None) == (p is None):
            raise RouteError(f"{where}: give the end temperature T or the end pressure p, not both")
        start = self.end_state(self._towards("T", T, p))
        rho = self._need(start.rho, where, start)
        sub = self.substance
        if T is not None:
            T1 = _parse("T", T, f"{where} temperature", sub=self.substance)
            given: dict[str, Any] = {"T": T}
            self._check(T1, sub.triple[1], f"{where} end state", given, T_only=True)
            end = self._guard(
                lambda: states.flash_Tv(sub, T1, 1.0 / rho), f"{where} end state", given
            )
        else:
            p1 = _parse("p", p, f"{where} pressure", self.elevation, sub=self.substance)
            given = {"p": p}
            self._check(start.T, p1, f"{where} end state", given, p_only=True)
            end = self._guard(
                lambda: _isochore_to_p(sub, start, rho, p1), f"{where} end state", given
            )
        return self._add(Leg("isochore", end.T, end.p, given, state=end))

    def isenthalp(self, p: object) -> Route:
        """Add a constant-enthalpy leg (a valve or vent) to pressure ``p``; chainable."""
        return self._constant("isenthalp", "h", p)

    def isentrope(self, p: object) -> Route:
        """Add a constant-entropy leg (an ideal compressor or expander) to pressure ``p``."""
        return self._constant("isentrope", "s", p)

    def add(self, kind: str, **target: object) -> Route:
        """Add a leg by kind name: ``route.add("isobar", T=300)``."""
        if kind not in LEG_KINDS:
            raise RouteError(f"unknown leg kind {kind!r}; known: {', '.join(LEG_KINDS)}")
        try:
            return getattr(self, kind)(**target)
        except TypeError:
            raise RouteError(
                f"an {kind} leg does not take {', '.join(map(repr, target))}"
            ) from None

    def _constant(self, kind: str, prop: str, p: object) -> Route:
        where = f"leg {len(self.legs) + 1} ({kind})"
        start = self.end_state(self._towards("p", None, p))
        value = self._need(start.h if prop == "h" else start.s, where, start)
        p1 = _parse("p", p, f"{where} pressure", self.elevation, sub=self.substance)
        given = {"p": p}
        self._check(start.T, p1, f"{where} end state", given, p_only=True)
        sub = self.substance
        end = self._guard(lambda: states.flash_p(sub, p1, prop, value), f"{where} end state", given)
        return self._add(Leg(kind, end.T, end.p, given, state=end))

    def _until(self, kind: str, until: str, target: object, where: str) -> Route:
        if target is not None:
            raise RouteError(f"{where}: give a target or an event (until=...), not both")
        sub = self.substance
        end = self.end
        given = {"until": until}
        text = until.strip().lower() if isinstance(until, str) else ""
        if (
            end.state is not None
            and end.state.phase == "liquid+vapor"
            and text
            in (
                "first liquid",
                "first vapor",
            )
        ):
            raise RouteError(
                f"{where}: {until!r} cannot be reached: the leg starts in the two-phase region "
                f"(vapor fraction {end.state.vapor_fraction:.4g}), where liquid and vapor are "
                "both present already; use 'fully vapor' or 'fully liquid'"
            )
        T, p, phase, event = _resolve_event(sub, kind, end.T, end.p, until, where)
        state = None
        if phase is not None:
            state = self._guard(
                lambda: states.single_state(sub, T, p, phase), f"{where} end state", given
            )
        self._check(T, p, f"{where} end state", given)
        return self._add(Leg(kind, T, p, given, state=state, event=event))

    def _towards(self, coord: str, T: object, p: object) -> tuple[str, float] | None:
        """(moving coordinate, direction) of a leg about to start from the route's start."""
        if self.legs or self.start.state is not None:
            return None
        try:
            if T is not None:
                return "T", _parse("T", T, "target", sub=self.substance) - self.start.T
            target = _parse("p", p, "target", self.elevation, sub=self.substance)
        except PhasePathError:
            return None  # the leg itself reports the bad target
        return coord, target - self.start.p

    def _need(self, value: float | None, where: str, start: StatePoint) -> float:
        if value is None:
            raise RouteError(
                f"{where}: the state it starts from (T = {start.T:.6g} K, "
                f"p = {start.p:.6g} Pa, {start.phase}) has no model: {start.model}"
            )
        return value

    def _guard(self, make: Any, where: str, given: dict[str, Any]) -> StatePoint:
        try:
            state = make()
        except PhasePathError as exc:
            raise exc.within(f"{where} ({_given_text(given)})") from exc
        return state

    def end_state(self, towards: tuple[str, float] | None = None) -> StatePoint:
        """The state at the last corner, with h, s and density where a model covers it.

        A corner on a boundary takes the side the last leg arrives from; the route's start
        (given as T and p) on a boundary takes the side the next leg leaves into: ``towards``
        is its moving coordinate and the direction ("p", +1.0) (see the module's rule).
        """
        leg = self.end
        if leg.state is not None:
            return leg.state
        T, p = leg.T, leg.p
        if self.legs:  # a corner on a boundary takes the side the leg arrives from
            T0, p0 = self.corners()[-2]
            T, p = T + (T0 - T) * _ARRIVE, p + (p0 - p) * _ARRIVE
        elif towards is not None:  # the start takes the side the first leg leaves into
            coord, sign = towards
            if coord == "T":
                T = T * (1 + math.copysign(_ARRIVE, sign))
            else:
                p = p * (1 + math.copysign(_ARRIVE, sign))
            try:
                self.substance.check_state(T, p)
            except PhasePathError:
                T, p = leg.T, leg.p
        phase, form = self.substance.classify(T, p)
        state = states.single_state(self.substance, leg.T, leg.p, phase, form)
        if towards is not None and (phase, form) != self.substance.classify(leg.T, leg.p):
            # a start on a boundary: keep the side chosen, so the analysis starts there too
            self._start_side = state
        return state

    def _add(self, leg: Leg) -> Route:
        end = self.end
        n = len(self.legs) + 1
        side: StatePoint | None = getattr(self, "_start_side", None)
        if side is not None:
            del self._start_side
            if not self.legs and end is self.start:
                self._check(leg.T, leg.p, f"leg {n} ({leg.kind}) end state", leg.given)
                self.start = Leg("start", end.T, end.p, end.given, state=side)
                end = self.start
        changes = (
            leg.state is not None
            and end.state is not None
            and (leg.state.key, leg.state.vapor_fraction)
            != (end.state.key, end.state.vapor_fraction)
        )  # e.g. "until fully vapor" from a two-phase start: same T and p, another state
        if (
            not changes
            and abs(leg.T - end.T) <= _SAME * end.T
            and abs(leg.p - end.p) <= _SAME * end.p
        ):
            raise RouteError(
                f"leg {n} ({leg.kind} to {_given_text(leg.given)}) has zero length: "
                f"it ends where it starts (T = {end.T:.6g} K, p = {end.p:.6g} Pa)"
            )
        self._check(leg.T, leg.p, f"leg {n} ({leg.kind}) end state", leg.given)
        self.legs.append(leg)
        return self

    def _check(
        self,
        T: float,
        p: float,
        where: str,
        given: dict[str, Any],
        T_only: bool = False,
        p_only: bool = False,
    ) -> None:
        sub = self.substance
        try:
            if T_only:  # only T is known yet: check it against the temperature range
                sub.check_state(T, min(max(p, 1.0), sub.p_max))
            elif p_only:  # only p is known yet
                sub.check_state(min(max(T, sub.T_min), sub.T_max), p)
            else:
                sub.check_state(T, p)
        except PhasePathError as exc:
            raise exc.within(f"{where} ({_given_text(given)})") from exc

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

    def analyze(self, basis: str = "steady-flow") -> Report:
        """Analyse every leg: the crossings, the states and the heat and work per kg.

        ``basis`` for heat and work: "steady-flow" (per kg through a device) or "closed"
        (per kg in a closed vessel).
        """
        from .analysis import analyze

        return analyze(self, basis)

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
        last = self.end
        if last.state is not None and last.state.rho is not None and "+" in last.state.phase:
            out = Route(self.substance, T=last.T, density=last.state.rho, title=self.title)
        else:
            out = Route(self.substance, T=corners[-1][0], p=corners[-1][1], title=self.title)
        for leg, (T, p) in zip(reversed(self.legs), reversed(corners[:-1]), strict=False):
            coord = LEG_KINDS[leg.kind].moves
            out.add(leg.kind, **{coord: T if coord == "T" else p})
        return out

    def to_dict(self) -> dict[str, Any]:
        """Plain data: the substance, the start and the legs as the user wrote them."""
        return {
            "substance": self.substance.name if self.substance.named else self.substance,
            "title": self.title,
            "notes": self.notes,
            "elevation": self.elevation,
            "start": dict(self.start.given),
            "legs": [{"kind": leg.kind, **leg.given} for leg in self.legs],
        }

    @classmethod
    def from_dict(cls, data: dict[str, Any]) -> Route:
        """Build a route from :meth:`to_dict` output."""
        start = data.get("start", {})
        route = cls(
            data["substance"],
            T=start.get("T"),
            p=start.get("p"),
            density=start.get("density"),
            quality=start.get("quality"),
            elevation=data.get("elevation"),
            title=data.get("title", ""),
            notes=data.get("notes", ""),
        )
        for leg in data.get("legs", []):
            leg = dict(leg)
            route.add(leg.pop("kind"), **leg)
        return route

    # -- files ---------------------------------------------------------------------------------
    @classmethod
    def load(cls, path: Any) -> Route:
        """Read a route file (JSON or YAML); see :mod:`phasepath.io`."""
        from .routefile import load_route

        return load_route(path)

    def save(self, path: Any) -> Any:
        """Write this route to a route file (``.json``, ``.yaml``, ``.yml``); returns the path."""
        from .routefile import save_route

        return save_route(self, path)


def _fraction(value: object, where: str) -> float:
    """A mass fraction from 0 to 1 (a plain number)."""
    if isinstance(value, bool) or not isinstance(value, (numbers.Real, str)):
        raise RouteError(f"{where} {value!r} is not a number from 0 to 1", value=value)
    try:
        x = float(value)
    except ValueError:
        raise RouteError(f"{where} {value!r} is not a number from 0 to 1", value=value) from None
    if not (math.isfinite(x) and 0.0 <= x <= 1.0):
        raise OutOfRangeError(
            f"{where} {value!r} is outside 0 (saturated liquid) to 1 (saturated vapor)",
            value=value,
        )
    return x


def _given_text(given: dict[str, Any]) -> str:
    return ", ".join(f"{k}={v!r}" if isinstance(v, str) else f"{k}={v}" for k, v in given.items())


def _isochore_to_p(sub: Substance, start: StatePoint, rho: float, p1: float) -> StatePoint:
    """The state on the isochore through ``start`` where the pressure is p1."""

    def gap(T: float) -> float:
        try:
            return states.flash_Tv(sub, T, 1.0 / rho).p - p1
        except OutOfRangeError:
            return 1e300  # beyond the models: too high a pressure

    lo, hi = (start.T, sub.T_max) if p1 > start.p else (sub.T_min, start.T)
    r = find_root(
        gap,
        lo,
        hi,
        what=(
            f"p = {p1!r} Pa at constant density {rho:.6g} kg/m3 of {sub.name} "
            f"(between {lo:.6g} K and {hi:.6g} K)"
        ),
    )
    return states.flash_Tv(sub, r.root, 1.0 / rho)


def _resolve_event(
    sub: Substance, kind: str, T: float, p: float, until: str, where: str
) -> tuple[float, float, str | None, str]:
    """(T, p, end phase or None, event text) of a leg that ends on an event."""
    text = until.strip().lower() if isinstance(until, str) else ""
    m = EVENT_DELTA.match(text)
    if text not in EVENTS and not m:
        raise RouteError(
            f"{where}: unknown event {until!r}; known: {', '.join(EVENTS)}, "
            f"'N K superheat', 'N K subcooling'"
        )
    T_t, p_t = sub.triple
    T_c, p_c = sub.critical
    vapor = sub.vapor
    if text == "first solid" and sub.classify(T, p)[0] == "solid":
        raise RouteError(
            f"{where}: {until!r} cannot be reached: the leg starts as solid "
            f"(T = {T:.6g} K, p = {p:.6g} Pa)"
        )
    if text == "first solid":
        if kind == "isobar":
            if p < p_t:
                if sub.sublimation is None:
                    raise RouteError(f"{where}: {sub.name} has no published sublimation curve")
                T1 = states.temperature_on(sub.sublimation, p)
            else:
                melt = sub.melting_temperature(p)
                if melt is None:
                    raise RouteError(f"{where}: no melting curve of {sub.name} at p = {p:.6g} Pa")
                T1 = melt[0]
            return T1, p, None, f"first solid at T = {T1:.6g} K"
        curves = (
            [b for b in sub.melting if b.T_min <= T <= b.T_max]
            if T >= T_t
            else ([sub.sublimation] if sub.sublimation is not None else [])
        )
        if not curves:
            raise RouteError(f"{where}: no solid boundary of {sub.name} at T = {T:.6g} K")
        p1 = min(b.p_of_T(T) for b in curves)
        return T, p1, None, f"first solid at p = {p1:.6g} Pa"
    if vapor is None:
        raise RouteError(f"{where}: {sub.name} has no vapor-pressure curve")
    if kind == "isobar":
        if not p_t <= p < p_c:
            raise RouteError(
                f"{where}: {until!r} needs a pressure between the triple point ({p_t:.6g} Pa) "
                f"and the critical point ({p_c:.6g} Pa); the leg is at {p:.6g} Pa"
            )
        T_s = vapor.temperatures_at(p)[0].root
        if not m:
            _check_side(until, text, T, T_s, T < T_s, "T", "K", where)
        if m:
            dT = float(m.group(1)) * (1 if m.group(2).lower() == "superheat" else -1)
            return T_s + dT, p, None, f"{m.group(1)} K {m.group(2).lower()} (T_sat = {T_s:.6g} K)"
        phase = "vapor" if text in ("fully vapor", "first liquid") else "liquid"
        return T_s, p, phase, f"{text} at T = {T_s:.6g} K"
    if m:
        raise RouteError(f"{where}: {until!r} applies to a constant-pressure leg only")
    if not T_t <= T <= T_c:
        raise RouteError(
            f"{where}: {until!r} needs a temperature between the triple point ({T_t:.6g} K) and "
            f"the critical point ({T_c:.6g} K); the leg is at {T:.6g} K"
        )
    p_s = vapor.p_of_T(T)
    _check_side(until, text, p, p_s, p > p_s, "p", "Pa", where)
    phase = "vapor" if text in ("fully vapor", "first liquid") else "liquid"
    return T, p_s, phase, f"{text} at p = {p_s:.6g} Pa"


def _check_side(
    until: str,
    text: str,
    start: float,
    sat: float,
    liquid_side: bool,
    name: str,
    unit: str,
    where: str,
) -> None:
    """Refuse an event the leg moves away from: "first liquid" from the liquid side, etc.

    ``liquid_side`` tells where the leg starts: below the saturation temperature on an isobar,
    above the vapor pressure on an isotherm. A start on the curve is left to the zero-length check.
    """
    needs_liquid = text in ("fully vapor", "first vapor")
    if abs(start - sat) <= 1e-9 * abs(sat) or liquid_side == needs_liquid:
        return
    side, other = ("vapor", "liquid") if needs_liquid else ("liquid", "vapor")
    raise RouteError(
        f"{where}: {until!r} cannot be reached: the leg starts on the {side} side "
        f"({name} = {start:.6g} {unit}; saturation at {sat:.6g} {unit}), and {until!r} is "
        f"approached from the {other} side"
    )
