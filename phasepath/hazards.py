"""Hazard flags on legs and crossings: each with its reason and a caution.

The flags are planning prompts, not a safety assessment: every caution defers to local codes,
site procedures and licensed practice.
"""

from __future__ import annotations

from typing import TYPE_CHECKING

from .report import Hazard

if TYPE_CHECKING:  # pragma: no cover
    from .report import Crossing, StatePoint
    from .substances import Substance

__all__ = ["leg_hazards", "crossing_hazards", "CRYOGENIC_T", "NEAR_CRITICAL"]

#: Below this temperature a state counts as cryogenic (-150 °C; common practice).
CRYOGENIC_T = 123.15
#: A state is near the critical point when |T/Tc - 1| and |p/pc - 1| are both below these.
NEAR_CRITICAL = (0.02, 0.10)

_DEFER = "Follow local codes, site procedures and licensed practice."
_FLOWING = ("isobar", "isotherm", "isenthalp", "isentrope")


def _solid_name(sub: Substance) -> str:
    return {"CarbonDioxide": "dry ice", "Water": "ice"}.get(sub.name, f"solid {sub.name}")


def crossing_hazards(sub: Substance, leg_kind: str, c: Crossing) -> tuple[Hazard, ...]:
    """Flags on one crossing: solid forming in a flowing line."""
    out = []
    if leg_kind in _FLOWING and "solid" in c.to_phase and "solid" not in c.from_phase:
        name = _solid_name(sub)
        out.append(
            Hazard(
                "solid-formation",
                f"{name} forms at T = {c.T:.5g} K, p = {c.p:.5g} Pa on a flowing leg",
                f"{name.capitalize()} can plug lines, valves and relief devices and release "
                f"pressure suddenly when it breaks free. {_DEFER}",
            )
        )
    return tuple(out)


def leg_hazards(
    sub: Substance, kind: str, states: list[StatePoint], crossings: list[Crossing], event: str = ""
) -> tuple[Hazard, ...]:
    """Flags on one leg from its sampled states (the first is the leg's start), its crossings
    and the event it ends on ("first solid at T = ...")."""
    out: list[Hazard] = []
    T_c, p_c = sub.critical
    if kind in _FLOWING and event.startswith("first solid"):
        name = _solid_name(sub)
        end = states[-1]
        out.append(
            Hazard(
                "solid-formation",
                f"the leg ends where {name} starts to form (T = {end.T:.5g} K, p = {end.p:.5g} Pa) "
                f"on a flowing leg",
                f"Any further cooling or a control overshoot forms {name}, which can plug lines, "
                f"valves and relief devices. {_DEFER}",
            )
        )
    if kind == "isochore" and states[0].phase == "liquid" and states[-1].p > states[0].p * 1.001:
        out.append(
            Hazard(
                "liquid-full",
                f"the sealed vessel is liquid-full from the start of the leg "
                f"(T = {states[0].T:.5g} K, p = {states[0].p:.5g} Pa); the pressure climbs "
                f"steeply with temperature",
                f"A liquid-full vessel can burst on a small further warming: keep the fill "
                f"below the rated fill ratio and protect it with a relief device. {_DEFER}",
            )
        )
    if kind == "isochore":
        for c in crossings:
            if c.from_phase == "liquid+vapor" and c.to_phase == "liquid":
                out.append(
                    Hazard(
                        "liquid-full",
                        f"the sealed vessel becomes liquid-full at T = {c.T:.5g} K, "
                        f"p = {c.p:.5g} Pa; the pressure then climbs steeply with temperature",
                        f"A liquid-full vessel can burst on a small further warming: keep the fill "
                        f"below the rated fill ratio and protect it with a relief device. {_DEFER}",
                    )
                )
        p_top = max(s.p for s in states)
        if p_top > states[0].p * 1.001:
            out.append(
                Hazard(
                    "sealed-pressure",
                    f"the pressure in the sealed vessel reaches {p_top:.5g} Pa",
                    "Check the vessel's rating and its relief setting against this pressure. "
                    + _DEFER,
                )
            )
    near = [
        s
        for s in states
        if abs(s.T / T_c - 1) < NEAR_CRITICAL[0] and abs(s.p / p_c - 1) < NEAR_CRITICAL[1]
    ]
    if near:
        out.append(
            Hazard(
                "near-critical",
                f"the leg passes within 2 % in T and 10 % in p of the critical point "
                f"({T_c:.5g} K, {p_c:.5g} Pa), where density and heat capacity swing steeply",
                f"Control margins shrink near the critical point; expect large swings in density, "
                f"flow and heat duty. {_DEFER}",
            )
        )
    cold = min(s.T for s in states)
    if cold < CRYOGENIC_T:
        out.append(
            Hazard(
                "cryogenic",
                f"temperatures down to {cold:.5g} K (below -150 °C)",
                f"Cryogens cause cold burns, embrittle ordinary steels, and expand several "
                f"hundred-fold on warming: never trap liquid between closed valves; vaporized "
                f"gas can displace oxygen and asphyxiate. {_DEFER}",
            )
        )
    return tuple(out)
