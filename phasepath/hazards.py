"""Hazard flags on legs and crossings, and the cautions of a route: the one place they are made.

Every flag is a :class:`~phasepath.records.Hazard` (kind, reason, caution). :func:`cautions`
turns a route's flags into its cautions, each once, in route order, followed by the cautions
that come with the substance itself; ``Report.cautions`` holds them, and the command line, the
HTML view and the planner show exactly those strings.

The flags are planning prompts, not a safety assessment: every caution defers to local codes,
site procedures and licensed practice.
"""

from __future__ import annotations

from collections.abc import Sequence
from typing import TYPE_CHECKING

from .errors import PhasePathError
from .records import LEG_KINDS, Crossing, Hazard, LegSummary, StatePoint

if TYPE_CHECKING:  # pragma: no cover
    from .substances import Substance

__all__ = [
    "leg_hazards",
    "crossing_hazards",
    "cautions",
    "CRYOGENIC_T",
    "HOT_T",
    "PRESSURIZED_P",
    "NEAR_CRITICAL",
    "DEFER",
]

#: Below this temperature a state counts as cryogenic (-150 °C; common practice).
CRYOGENIC_T = 123.15
#: Above this temperature surfaces and liquids burn or scald on contact (60 °C; common practice).
HOT_T = 333.15
#: Above this pressure equipment is pressure equipment: 0.5 bar above standard atmospheric
#: pressure, the threshold from which pressure-equipment codes commonly apply (common practice).
PRESSURIZED_P = 101325.0 + 0.5e5
#: A state is near the critical point when |T/Tc - 1| and |p/pc - 1| are both below these.
NEAR_CRITICAL = (0.02, 0.10)
#: Ambient conditions for the substance-level cautions: 20 °C and 1 atm.
AMBIENT = (293.15, 101325.0)

DEFER = "Follow local codes, site procedures and licensed practice."


def _solid_caution(sub: Substance, text: str) -> str:
    name = sub.solids.name
    sealed = ""
    if sub.triple[1] > AMBIENT[1]:  # the solid sublimes at atmospheric pressure
        sealed = (
            f" {name.capitalize()} sublimes to gas at atmospheric pressure and causes cold "
            "burns: never seal it in a closed vessel."
        )
    return f"{text}{sealed} {DEFER}"


def crossing_hazards(sub: Substance, leg_kind: str, c: Crossing) -> tuple[Hazard, ...]:
    """Flags on one crossing: solid forming in a flowing line."""
    out = []
    if LEG_KINDS[leg_kind].flowing and "solid" in c.to_phase and "solid" not in c.from_phase:
        name = sub.solids.name
        flag = f" ({c.flag})" if c.flag else ""
        out.append(
            Hazard(
                "solid-formation",
                f"{name} forms at T = {c.T:.5g} K, p = {c.p:.5g} Pa on a flowing leg{flag}",
                _solid_caution(
                    sub,
                    f"{name.capitalize()} can plug lines, valves and relief devices and release "
                    f"pressure suddenly when it breaks free.",
                ),
            )
        )
    return tuple(out)


def leg_hazards(
    sub: Substance,
    kind: str,
    states: Sequence[StatePoint],
    crossings: Sequence[Crossing],
    event: str = "",
) -> tuple[Hazard, ...]:
    """Flags on one leg from its states along the way (the first is the leg's start), its
    crossings and the event it ends on ("first solid at T = ...")."""
    out: list[Hazard] = []
    T_c, p_c = sub.critical
    flowing = LEG_KINDS[kind].flowing
    if flowing and event.startswith("first solid"):
        name = sub.solids.name
        end = states[-1]
        out.append(
            Hazard(
                "solid-formation",
                f"the leg ends where {name} starts to form (T = {end.T:.5g} K, p = {end.p:.5g} Pa) "
                f"on a flowing leg",
                _solid_caution(
                    sub,
                    f"Any further cooling or a control overshoot forms {name}, which can plug "
                    f"lines, valves and relief devices.",
                ),
            )
        )
    if not flowing:
        out += _sealed(states, crossings)
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
                f"flow and heat duty. {DEFER}",
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
                f"gas can displace oxygen and asphyxiate. {DEFER}",
            )
        )
    hot = max(s.T for s in states)
    if hot > HOT_T:
        out.append(
            Hazard(
                "hot",
                f"temperatures up to {hot:.5g} K (above 60 °C)",
                f"Hot surfaces, hot liquid and steam scald and burn: guard or insulate hot "
                f"parts and vent hot fluid away from people. {DEFER}",
            )
        )
    top = max(s.p for s in states)
    if top > PRESSURIZED_P:
        out.append(
            Hazard(
                "pressurized",
                f"pressures up to {top:.5g} Pa (above 0.5 bar gauge)",
                f"Stored pressure can burst equipment: vessels, piping, fittings and relief "
                f"devices must be rated, inspected and relieved for the highest pressure and "
                f"temperature of the route. {DEFER}",
            )
        )
    return tuple(out)


def _sealed(states: Sequence[StatePoint], crossings: Sequence[Crossing]) -> list[Hazard]:
    """Flags of a sealed vessel: going liquid-full, and the pressure it reaches."""
    out = []
    full_caution = (
        f"A liquid-full vessel can burst on a small further warming: keep the fill "
        f"below the rated fill ratio and protect it with a relief device. {DEFER}"
    )
    if states[0].phase == "liquid" and states[-1].p > states[0].p * 1.001:
        out.append(
            Hazard(
                "liquid-full",
                f"the sealed vessel is liquid-full from the start of the leg "
                f"(T = {states[0].T:.5g} K, p = {states[0].p:.5g} Pa); the pressure climbs "
                f"steeply with temperature",
                full_caution,
            )
        )
    for c in crossings:
        if c.from_phase == "liquid+vapor" and c.to_phase == "liquid":
            out.append(
                Hazard(
                    "liquid-full",
                    f"the sealed vessel becomes liquid-full at T = {c.T:.5g} K, "
                    f"p = {c.p:.5g} Pa; the pressure then climbs steeply with temperature",
                    full_caution,
                )
            )
    p_top = max(s.p for s in states)
    freezing = [
        c for c in crossings if "solid" in c.to_phase and "liquid" in c.to_phase + c.from_phase
    ]
    if freezing:
        c = freezing[0]
        out.append(
            Hazard(
                "sealed-freezing",
                f"the contents start to freeze in the sealed vessel at T = {c.T:.5g} K, "
                f"p = {c.p:.5g} Pa; the pressure then follows the melting curve, up to "
                f"{p_top:.5g} Pa on this leg",
                "A liquid freezing in a closed vessel or pipe can build pressure far beyond any "
                "rating and burst it (the burst-pipe case): drain or heat-trace what frost can "
                f"reach, and never cool a liquid-full closed vessel below its freezing point. "
                f"{DEFER}",
            )
        )
    if p_top > states[0].p * 1.001:
        out.append(
            Hazard(
                "sealed-pressure",
                f"the pressure in the sealed vessel reaches {p_top:.5g} Pa",
                "Check the vessel's rating and its relief setting against this pressure. " + DEFER,
            )
        )
    return out


# -- cautions -----------------------------------------------------------------------------------
def cautions(
    sub: Substance, legs: Sequence[LegSummary], crossings: Sequence[Crossing]
) -> tuple[str, ...]:
    """The route's cautions: each flagged hazard once, in route order, with the legs where it
    occurs ("solid-formation (leg 3): ..."), then the cautions of the substance itself."""
    found: dict[tuple[str, str], list[int]] = {}
    by_leg: dict[int, list[Crossing]] = {}
    for c in crossings:
        by_leg.setdefault(c.step, []).append(c)
    for leg in legs:
        for h in [h for c in by_leg.get(leg.step, []) for h in c.hazards] + list(leg.hazards):
            steps = found.setdefault((h.kind, h.caution), [])
            if leg.step not in steps:
                steps.append(leg.step)
    out = []
    for (kind, caution), steps in found.items():
        where = ("leg " if len(steps) == 1 else "legs ") + ", ".join(map(str, steps))
        out.append(f"{kind} ({where}): {caution}")
    out += [f"{kind}: {caution}" for kind, caution in substance_cautions(sub)]
    return tuple(out)


def substance_cautions(sub: Substance) -> list[tuple[str, str]]:
    """(kind, caution) pairs that come with the substance, from its safety group in ANSI/ASHRAE
    Standard 34 (where the reference library gives one) and its phase at 20 °C and 1 atm."""
    group = sub.safety_group
    name = sub.name
    out: list[tuple[str, str]] = []
    if group is None:
        out.append(
            (
                "unclassified",
                f"The reference library gives no ASHRAE 34 safety group for {name}: check its "
                f"toxicity, flammability and asphyxiation hazards on its safety data sheet. "
                f"{DEFER}",
            )
        )
        return out
    if group[1:] in ("2", "2L", "3"):
        out.append(
            (
                "flammable",
                f"{name} is flammable (ASHRAE 34 safety group {group}): keep ignition sources "
                f"away, and follow hazardous-area rules for releases and vents. {DEFER}",
            )
        )
    if group.startswith("B"):
        out.append(
            (
                "toxic",
                f"{name} has higher toxicity (ASHRAE 34 safety group {group}): vent it where "
                f"no one breathes it and keep exposure limits. {DEFER}",
            )
        )
    if group[1:] == "1" and _gas_at_ambient(sub):
        out.append(
            (
                "asphyxiation",
                f"{name} released from the route displaces oxygen: in enclosed or low-lying "
                f"spaces it can asphyxiate without warning; ventilate and monitor oxygen. "
                f"{DEFER}",
            )
        )
    return out


def _gas_at_ambient(sub: Substance) -> bool:
    try:
        return sub.phase(*AMBIENT) in ("vapor", "supercritical")
    except PhasePathError:  # outside the substance's models: no claim either way
        return False
