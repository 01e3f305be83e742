"""Values as engineers type them, read by the core's unit parser (phasepath.units), so that the
API, route files and the planner agree: one number and one unit, nothing else; the Unicode minus;
``ambient``; gauge units read against the route's ambient pressure; dimension errors in plain
words.

Check values:
* 1 atm = 101325 Pa and 1 bar = 100000 Pa exactly (definitions; common practice).
* 1 psi = 6894.757293168 Pa (NIST SP 811, 2008, Appendix B.9; from memory).
* 0 °C = 273.15 K (ITS-90 convention; common practice).
* U.S. Standard Atmosphere 1976 at 1000 m geometric: 89876 Pa (Table I; from memory).
"""

from __future__ import annotations

import pytest

import phasepath as pp
from phasepath.errors import NonFiniteError, OutOfRangeError, UnitError
from phasepath.routefile import loads_route
from phasepath.units import parse_pressure, parse_quantity, parse_temperature

ATM = 101325.0  # Pa, definition (common practice)
PSI = 6894.757293168  # Pa, NIST SP 811 Appendix B.9 (from memory)
AMBIENT_1000M = 89876.0  # Pa, U.S. Standard Atmosphere 1976, Table I (from memory)


# -- one number and one unit -----------------------------------------------------------------------
@pytest.mark.parametrize(
    "text, dimension, named",
    [
        ("1+1 bar", "pressure", "'+1 bar'"),
        ("2 bar bar", "pressure", "'bar bar'"),
        ("1 2 bar", "pressure", "'2 bar'"),
        ("5 bar * 2", "pressure", "'bar * 2'"),
        ("1,5 bar", "pressure", "decimal point"),
        ("25 degC degC", "temperature", "'degC degC'"),
        ("3-1 degC", "temperature", "'-1 degC'"),
        ("10 kg/m3 + 1", "density", "'kg/m3 + 1'"),
    ],
    ids=[
        "sum",
        "two-units",
        "two-numbers",
        "product",
        "decimal-comma",
        "two-T-units",
        "difference",
        "density-sum",
    ],
)
def test_not_one_number_and_one_unit_is_refused_naming_it(text, dimension, named):
    with pytest.raises(UnitError) as info:
        parse_quantity(text, dimension)
    msg = str(info.value)
    assert repr(text) in msg and "not one number and one unit" in msg
    assert named in msg


@pytest.mark.parametrize(
    "text, dimension, si",
    [
        ("60 bar", "pressure", 60e5),
        ("1 atm", "pressure", ATM),
        ("14.7 psi", "pressure", 14.7 * PSI),
        ("25 degC", "temperature", 298.15),
        ("25 °C", "temperature", 298.15),
        ("25\u00a0°C", "temperature", 298.15),  # a no-break space between number and unit
        ("20 deg C", "temperature", 293.15),
        ("450 kg/m3", "density", 450.0),
        ("0.45 g/cm3", "density", 450.0),
        ("2 kg/m^3", "density", 2.0),
        ("250 kJ/kg", "energy", 250e3),
        ("1.2 kJ/(kg K)", "entropy", 1200.0),
        ("1e3 kPa", "pressure", 1e6),
    ],
)
def test_one_number_and_one_unit_is_read(text, dimension, si):
    assert parse_quantity(text, dimension) == pytest.approx(si, rel=1e-12)


# -- the Unicode minus -----------------------------------------------------------------------------
def test_unicode_minus_is_a_minus():
    # U+2212, as the project's notebooks print it; 0 °C = 273.15 K (common practice)
    assert parse_temperature("\u221220 degC") == pytest.approx(253.15, abs=1e-12)
    assert parse_temperature("\u221278.5 °C") == pytest.approx(194.65, abs=1e-12)
    assert parse_pressure("1e\u22123 MPa") == pytest.approx(1000.0, rel=1e-12)
    assert parse_temperature("\u221240 degF") == pytest.approx(233.15, abs=1e-9)  # -40 °F = -40 °C


# -- ambient and gauge pressures -------------------------------------------------------------------
def test_ambient_and_gauge_read_against_the_standard_atmosphere_by_default():
    assert parse_pressure("ambient") == ATM
    assert parse_pressure(" Ambient ") == ATM
    assert parse_pressure("5 barg") == pytest.approx(5e5 + ATM, rel=1e-12)
    assert parse_pressure("5 bar(g)") == pytest.approx(5e5 + ATM, rel=1e-12)
    assert parse_pressure("30 psig") == pytest.approx(30 * PSI + ATM, rel=1e-9)
    assert parse_pressure("200 kPag") == pytest.approx(2e5 + ATM, rel=1e-12)
    assert parse_pressure("2 MPa(g)") == pytest.approx(2e6 + ATM, rel=1e-12)
    assert parse_pressure("0 barg") == ATM
    # absolute spellings are the plain unit
    assert parse_pressure("5 bara") == parse_pressure("5 bar(a)") == 5e5
    assert parse_pressure("14.7 psia") == pytest.approx(14.7 * PSI, rel=1e-12)
    # the case of the pascal family matters: mPa is a millipascal, not a megapascal
    assert parse_pressure("5 mPa") == pytest.approx(5e-3)


def test_gauge_reads_against_the_ambient_given():
    assert parse_pressure("0 psig", ambient=AMBIENT_1000M) == AMBIENT_1000M
    assert parse_pressure("ambient", ambient=AMBIENT_1000M) == AMBIENT_1000M
    assert parse_pressure("2 barg", ambient=9e4) == pytest.approx(2.9e5, rel=1e-12)
    with pytest.raises(OutOfRangeError, match="below vacuum"):
        parse_pressure("-2 barg")
    with pytest.raises(NonFiniteError, match="ambient pressure"):
        parse_pressure("1 barg", ambient=float("nan"))


def test_route_reads_gauge_and_ambient_against_its_site():
    sea = pp.Route("water", T="20 degC", p="2 barg").isotherm(p="ambient")
    assert sea.start.p == pytest.approx(2e5 + ATM, rel=1e-12)
    assert sea.legs[0].p == ATM
    high = pp.Route("water", T="20 degC", p="2 barg", elevation=1000.0).isotherm(p="0 barg")
    assert high.start.p == pytest.approx(2e5 + AMBIENT_1000M, rel=1e-4)
    assert high.legs[0].p == pytest.approx(AMBIENT_1000M, rel=1e-4)
    # what the user typed is kept as typed, so a saved route reads back the same
    assert high.to_dict()["start"]["p"] == "2 barg"
    again = pp.Route.from_dict(high.to_dict())
    assert again.corners() == high.corners()


def test_route_file_reads_gauge_against_its_elevation():
    text = (
        '{"format": "phasepath route file", "version": 1, "substance": "water", "elevation": 1000,'
        ' "start": {"T": "20 degC", "p": "1 barg"}, "legs": [{"kind": "isotherm", "p": "ambient"}]}'
    )
    route = loads_route(text, "json")
    assert route.start.p == pytest.approx(1e5 + AMBIENT_1000M, rel=1e-4)
    assert route.legs[0].p == pytest.approx(AMBIENT_1000M, rel=1e-4)


# -- dimension errors in plain words ---------------------------------------------------------------
@pytest.mark.parametrize(
    "text, dimension, words",
    [
        ("5 bar", "temperature", "'5 bar' is a pressure, not a temperature"),
        ("25 degC", "pressure", "'25 degC' is a temperature, not a pressure"),
        ("5 m/s", "temperature", "'5 m/s' is a speed, not a temperature"),
        ("5 kJ", "energy", "'5 kJ' is an energy, not a specific energy"),
        ("450 kg/m3", "pressure", "'450 kg/m3' is a density, not a pressure"),
        ("5 %", "pressure", "'5 %' is a pure number, not a pressure"),
        ("5 barg", "temperature", "'5 barg' is a gauge pressure, not a temperature"),
        (
            "ambient",
            "temperature",
            "'ambient' is a pressure (the ambient pressure), not a temperature",
        ),
    ],
)
def test_dimension_errors_in_plain_words(text, dimension, words):
    with pytest.raises(UnitError) as info:
        parse_quantity(text, dimension)
    assert words in str(info.value)


def test_route_error_names_the_field_and_the_plain_words():
    with pytest.raises(UnitError) as info:
        pp.Route("CO2", T="5 bar", p="10 bar")
    msg = str(info.value)
    assert "start temperature" in msg and "'5 bar' is a pressure, not a temperature" in msg
