"""Blends and air are refused: they are not pure substances.

Check values:

* CoolProp 8.0.0 marks exactly these six fluids as not pure (``get_fluid_param_string(name,
  "pure")``): Air, R404A, R407C, R410A, R507A, SES36 (reference library, read here).
* Air at 1 bar boils from about 78.8 K (bubble point) to about 81.6 K (dew point): CoolProp's
  pseudo-pure air at quality 0 and 1 (PropsSI, computed here), the glide that makes a single
  vapor-pressure curve wrong for a mixture (common practice).
"""

from __future__ import annotations

import pytest

import phasepath as pp
from phasepath.errors import UnknownSubstanceError

CP = pytest.importorskip("CoolProp.CoolProp")

BLENDS = ("Air", "R404A", "R407C", "R410A", "R507A", "SES36")


def test_the_reference_library_marks_these_six_as_mixtures():
    names = CP.get_global_param_string("fluids_list").split(",")
    mixtures = {n for n in names if CP.get_fluid_param_string(n, "pure") == "false"}
    assert mixtures == set(BLENDS)


@pytest.mark.parametrize("name", [*BLENDS, "air", "R-410A", "r404a"])
def test_blends_are_refused_with_the_reason(name):
    with pytest.raises(UnknownSubstanceError) as info:
        pp.substance(name)
    msg = str(info.value)
    assert "mixture" in msg and "bubble point" in msg and "dew point" in msg
    assert info.value.value == name


def test_routes_refuse_blends_too():
    with pytest.raises(UnknownSubstanceError, match="not a pure substance"):
        pp.Route("Air", T=300.0, p=1e5)


def test_substances_lists_pure_substances_only():
    names = set(pp.substances())
    assert not names & set(BLENDS)
    assert {"Water", "CarbonDioxide", "Nitrogen", "Oxygen", "Argon"} <= names
    for n in list(names)[:: max(1, len(names) // 12)]:
        assert CP.get_fluid_param_string(n, "pure") == "true"


def test_air_has_a_glide_at_1_bar():
    """Why: bubble and dew temperatures of air at 1 bar differ by almost 3 K."""
    bubble = CP.PropsSI("T", "P", 1e5, "Q", 0, "Air")
    dew = CP.PropsSI("T", "P", 1e5, "Q", 1, "Air")
    assert bubble == pytest.approx(78.8, abs=0.1) and dew == pytest.approx(81.6, abs=0.1)


def test_suggestions_never_offer_a_blend():
    with pytest.raises(UnknownSubstanceError) as info:
        pp.substance("R410")
    assert not set(info.value.suggestions) & set(BLENDS)
