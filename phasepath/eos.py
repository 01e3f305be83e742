"""Guarded access to CoolProp's reference equations of state (low-level ``AbstractState``).

Every call here keeps inside the range where CoolProp's answer is trustworthy and turns a NaN, an
infinity or a library exception into a :class:`~phasepath.errors.PropertyError` naming the state
and the substance. Nothing outside this module and :mod:`phasepath.substances` calls CoolProp.
"""

from __future__ import annotations

import math
import threading

import CoolProp.CoolProp as CP

from .errors import OutOfRangeError, PropertyError

__all__ = ["EOS", "fluid_names", "fluid_aliases", "fluid_info", "library_version"]

_STATE_CACHE = 4096  # remembered single-phase states per substance

_PHASE_FLAG = {
    "liquid": CP.iphase_liquid,
    "vapor": CP.iphase_gas,
    "supercritical": CP.iphase_supercritical,
}


def fluid_names() -> list[str]:
    """Every fluid CoolProp 8 knows, by its CoolProp name."""
    return sorted(CP.get_global_param_string("fluids_list").split(","))


def fluid_aliases(name: str) -> list[str]:
    """CoolProp's aliases of a fluid (formula, refrigerant number, other spellings)."""
    return [a.strip() for a in CP.get_fluid_param_string(name, "aliases").split(",") if a.strip()]


def fluid_info(name: str, key: str) -> str:
    """One of CoolProp's text facts about a fluid: "formula", "CAS", "ASHRAE34", "pure"."""
    return str(CP.get_fluid_param_string(name, key))


def library_version() -> str:
    """The version of the reference library (CoolProp)."""
    return str(CP.get_global_param_string("version"))


class EOS:
    """One CoolProp ``AbstractState`` per substance, reused for every call.

    Saturation calls are kept strictly inside [T_triple, T_crit] / [p_triple, p_crit]: outside
    that range CoolProp returns numbers that look plausible and are wrong.
    """

    def __init__(self, name: str) -> None:
        self.name = name
        self._lock = threading.RLock()
        try:
            self._as = CP.AbstractState("HEOS", name)
        except Exception as exc:  # pragma: no cover - names are checked before
            raise PropertyError(f"CoolProp cannot load {name!r}: {exc}") from None
        a = self._as
        self.T_triple = float(a.Ttriple())
        self.T_crit = float(a.T_critical())
        self.p_crit = float(a.p_critical())
        self.T_min = float(a.Tmin())
        self.T_max = float(a.Tmax())
        self.p_max = float(a.pmax())
        self.molar_mass = float(a.molar_mass())
        # The triple-point pressure is the EOS vapor pressure at T_triple, from the same
        # saturation call the vapor-pressure branch uses, so that the curves meet exactly.
        a.update(CP.QT_INPUTS, 0.0, self.T_triple)
        self.p_triple = float(a.p())
        self.has_melting_line = bool(a.has_melting_line())
        self.calls = 0
        # (T, p, phase) -> (h, s, rho): a route's corners are evaluated again on every analysis
        # (a moved corner changes two legs and leaves the other states as they were)
        self._states: dict[tuple[float, float, str], tuple[float, float, float]] = {}
        # T -> both saturated phases (the two sides of one boundary point are read together)
        self._saturated: dict[
            float, tuple[tuple[float, float, float], tuple[float, float, float]]
        ] = {}

    # -- saturation ---------------------------------------------------------------------------
    def _check_sat_T(self, T: float) -> None:
        if not (self.T_triple <= T <= self.T_crit):
            raise OutOfRangeError(
                f"T = {T!r} K is outside the vapor-pressure curve of {self.name}: "
                f"{self.T_triple} K to {self.T_crit} K"
            )

    def p_sat(self, T: float) -> float:
        """Vapor pressure [Pa] at T [K]."""
        self._check_sat_T(T)
        return self._sat(CP.QT_INPUTS, 0.0, T, "p")

    def T_sat(self, p: float) -> float:
        """Saturation temperature [K] at p [Pa]."""
        if not (self.p_triple <= p <= self.p_crit):
            raise OutOfRangeError(
                f"p = {p!r} Pa is outside the vapor-pressure curve of {self.name}: "
                f"{self.p_triple:.6g} Pa to {self.p_crit:.6g} Pa"
            )
        T = self._sat(CP.PQ_INPUTS, p, 0.0, "T")
        # the library's inverse can land a float step outside the curve at its ends
        return min(max(T, self.T_triple), self.T_crit)

    def latent_heat_vaporization(self, T: float) -> float:
        """h'' - h' [J/kg] at T [K] on the vapor-pressure curve."""
        liquid, vapor = self.saturated(T)
        return vapor[0] - liquid[0]

    def _sat(self, pair: int, a: float, b: float, out: str) -> float:
        return self._update(pair, a, b, (out,), f"saturation state ({a}, {b})")[0]

    def _update(
        self, pair: int, a: float, b: float, outputs: tuple[str, ...], what: str
    ) -> tuple[float, ...]:
        """One guarded CoolProp update: the named outputs, finite, or a PropertyError."""
        with self._lock:
            st = self._as
            try:
                self.calls += 1
                st.update(pair, a, b)  # type: ignore[arg-type]
                values = tuple(float(getattr(st, name)()) for name in outputs)
            except Exception as exc:
                raise PropertyError(f"{self.name}: {what} failed: {exc}") from None
        for v, name in zip(values, outputs, strict=False):
            if name != "Q":
                self._finite(v, what)
        return values

    # -- melting line ---------------------------------------------------------------------------
    def melting_range(self) -> tuple[float, float, float, float]:
        """(T_min, T_max, p_min, p_max) of CoolProp's melting line."""
        a = self._as
        return (
            float(a.melting_line(CP.iT_min, -1, 0)),
            float(a.melting_line(CP.iT_max, -1, 0)),
            float(a.melting_line(CP.iP_min, -1, 0)),
            float(a.melting_line(CP.iP_max, -1, 0)),
        )

    def p_melt(self, T: float) -> float:
        """CoolProp's melting pressure [Pa] at T [K] (no range check: the caller checks)."""
        return self._melting_line(CP.iP, CP.iT, T, f"melting pressure at T = {T} K")

    def T_melt(self, p: float) -> float:
        """CoolProp's melting temperature [K] at p [Pa] (no range check: the caller checks)."""
        return self._melting_line(CP.iT, CP.iP, p, f"melting temperature at p = {p} Pa")

    def _melting_line(self, out: int, given: int, value: float, what: str) -> float:
        with self._lock:
            try:
                self.calls += 1
                v = self._as.melting_line(out, given, value)
            except Exception as exc:
                raise PropertyError(f"{self.name}: {what} failed: {exc}") from None
        return self._finite(v, what)

    # -- single-phase states --------------------------------------------------------------------
    def state(self, T: float, p: float, phase: str) -> tuple[float, float, float]:
        """(h [J/kg], s [J/(kg K)], rho [kg/m3]) of a fluid state in a known phase.

        The phase is imposed, so that states next to a boundary (and vapor below the triple-point
        temperature, extrapolated along the gas branch) are computed rather than refused.
        Results are remembered (up to 4096 states; ``calls`` counts only real evaluations).
        """
        if phase not in _PHASE_FLAG:
            raise PropertyError(f"{self.name}: no equation of state for the {phase} phase")
        known = self._states.get((T, p, phase))
        if known is not None:
            return known
        with self._lock:
            a = self._as
            try:
                self.calls += 1
                a.specify_phase(_PHASE_FLAG[phase])
                a.update(CP.PT_INPUTS, p, T)
                out = (a.hmass(), a.smass(), a.rhomass())
            except Exception as exc:
                a.unspecify_phase()
                if not (self.T_triple <= T and phase != "vapor" or p > self.p_crit):
                    raise PropertyError(
                        f"{self.name}: no {phase} state at T = {T} K, p = {p} Pa ({exc})"
                    ) from None
                # next to the critical point an imposed phase can fail: let CoolProp decide
                try:
                    self.calls += 1
                    a.update(CP.PT_INPUTS, p, T)
                    out = (a.hmass(), a.smass(), a.rhomass())
                except Exception as exc2:
                    raise PropertyError(
                        f"{self.name}: no {phase} state at T = {T} K, p = {p} Pa ({exc2})"
                    ) from None
            finally:
                a.unspecify_phase()
        for v in out:
            self._finite(v, f"{phase} state at T = {T} K, p = {p} Pa")
        if len(self._states) >= _STATE_CACHE:
            self._states.clear()
        self._states[(T, p, phase)] = out
        return out

    def state_unimposed(self, T: float, p: float) -> tuple[float, float, float]:
        """(h, s, rho) of a single-phase state where the phase is unique (at or above the
        critical temperature and pressure), with no phase imposed: there the library's own
        phase logic converges the density more tightly than an imposed phase does (on the
        critical isotherm, 3e-10 against 2e-16 in h)."""
        h, s, rho = self._update(
            CP.PT_INPUTS, p, T, ("hmass", "smass", "rhomass"), f"state at T = {T} K, p = {p} Pa"
        )
        return h, s, rho

    def state_DT(self, rho: float, T: float) -> tuple[float, float, float]:
        """(p [Pa], h [J/kg], s [J/(kg K)]) of a single-phase fluid state from density and T.

        The caller makes sure the state is single-phase (outside the saturation dome).
        """
        p, h, s = self._update(
            CP.DmassT_INPUTS,
            rho,
            T,
            ("p", "hmass", "smass"),
            f"fluid state at T = {T} K, density = {rho} kg/m3",
        )
        return p, h, s

    def flash(self, prop: str, p: float, value: float) -> tuple[float, float, float, float, float]:
        """(T, h, s, rho, quality) from p [Pa] and h [J/kg] or s [J/(kg K)]: CoolProp's own flash.

        Used for fluid states above the triple-point pressure; the caller checks the answer.
        """
        pair, a, b = (CP.HmassP_INPUTS, value, p) if prop == "h" else (CP.PSmass_INPUTS, p, value)
        T, h, s, rho, q = self._update(
            pair,
            a,
            b,
            ("T", "hmass", "smass", "rhomass", "Q"),
            f"state at p = {p} Pa with {prop} = {value}",
        )
        return T, h, s, rho, q

    def slope_along(self, held: str, T: float, p: float, phase: str) -> float:
        """The slope of a curved leg at a single-phase state: dT/dp [K/Pa] at constant h or s,
        dp/dT [Pa/K] at constant density ("v")."""
        of, wrt, const = {
            "h": (CP.iT, CP.iP, CP.iHmass),
            "s": (CP.iT, CP.iP, CP.iSmass),
            "v": (CP.iP, CP.iT, CP.iDmass),
        }[held]
        with self._lock:
            a = self._as
            try:
                self.calls += 1
                a.specify_phase(_PHASE_FLAG[phase])
                a.update(CP.PT_INPUTS, p, T)
                v = a.first_partial_deriv(of, wrt, const)
            except Exception as exc:
                raise PropertyError(
                    f"{self.name}: slope at T = {T} K, p = {p} Pa failed: {exc}"
                ) from None
            finally:
                a.unspecify_phase()
        return self._finite(v, f"slope at T = {T} K, p = {p} Pa")

    def saturated(self, T: float) -> tuple[tuple[float, float, float], tuple[float, float, float]]:
        """((h, s, rho) of the saturated liquid, (h, s, rho) of the saturated vapor) at T [K]:
        one saturation update, both phases read from it."""
        self._check_sat_T(T)
        known = self._saturated.get(T)
        if known is not None:
            return known
        with self._lock:
            a = self._as
            try:
                self.calls += 1
                a.update(CP.QT_INPUTS, 0.0, T)
                liq = a.saturated_liquid_keyed_output
                vap = a.saturated_vapor_keyed_output
                out = (
                    (liq(CP.iHmass), liq(CP.iSmass), liq(CP.iDmass)),
                    (vap(CP.iHmass), vap(CP.iSmass), vap(CP.iDmass)),
                )
            except Exception as exc:
                raise PropertyError(f"{self.name}: saturation at T = {T} K failed: {exc}") from None
        for side in out:
            for v in side:
                self._finite(v, f"saturation at T = {T} K")
        result = (
            (float(out[0][0]), float(out[0][1]), float(out[0][2])),
            (float(out[1][0]), float(out[1][1]), float(out[1][2])),
        )
        if len(self._saturated) >= _STATE_CACHE:
            self._saturated.clear()
        self._saturated[T] = result
        return result

    def _finite(self, v: float, what: str) -> float:
        v = float(v)
        if not math.isfinite(v):
            raise PropertyError(f"{self.name}: {what} is not finite")
        return v
