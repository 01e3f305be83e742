"""The README and the code agree: the coverage table (fluid, vaporization, melting, sublimation,
solid model) against what each substance reports, and every latent-heat model the README names
against the model the records carry.

The check values are the README's own words; what they are checked against is the code. The
README's source ids are those of ``phasepath.bibliography``.
"""

from __future__ import annotations

import re
from pathlib import Path

import pytest

import phasepath as pp
from phasepath.reference import coverage

README = (Path(__file__).resolve().parents[1] / "README.md").read_text(encoding="utf-8")


def _section(title: str) -> str:
    start = README.index(f"## {title}\n")
    end = README.find("\n## ", start + 3)
    return README[start : end if end > 0 else None]


def _table() -> dict[str, list[str]]:
    rows = {}
    for line in _section("Coverage").splitlines():
        cells = [c.strip() for c in line.strip().strip("|").split("|")]
        if len(cells) != 6 or cells[0] in ("fluid", "---") or set(cells[0]) <= {"-"}:
            continue
        rows[cells[0]] = cells[1:]
    return rows


def _cell(text: str) -> tuple[str | None, bool]:
    """(source id or None, flagged unreliable) of a table cell."""
    if text == "—":
        return None, False
    m = re.fullmatch(r"`([^`]+)`( \(unreliable\))?", text)
    assert m, f"cell {text!r} is not `id` or `id` (unreliable)"
    return m.group(1), bool(m.group(2))


TABLE = _table()


def test_the_table_lists_every_fluid_with_more_than_a_vapor_pressure_curve():
    covered = set()
    for name in pp.substances():
        c = coverage(pp.substance(name))
        if c.melting or c.sublimation or c.solid_model:
            covered.add(name)
    assert set(TABLE) == covered
    m = re.search(r"The other (\d+) pure fluids", _section("Coverage"))
    assert m and int(m.group(1)) == len(pp.substances()) - len(covered)


@pytest.mark.parametrize("fluid", sorted(TABLE))
def test_each_row_is_what_the_substance_reports(fluid):
    sub = pp.substance(fluid)
    c = coverage(sub)
    vap, melt, subl, solid, _source = TABLE[fluid]
    assert _cell(vap) == (c.vaporization, False)
    for cell, kind, got in ((melt, "melting", c.melting), (subl, "sublimation", c.sublimation)):
        source, flagged = _cell(cell)
        assert source == got, (fluid, kind)
        curves = [b for b in sub.boundaries if b.kind == kind]
        assert flagged == any(not b.reliable for b in curves), (fluid, kind)
    assert _cell(solid)[0] == c.solid_model


def test_every_source_id_in_the_table_has_a_citation():
    for row in TABLE.values():
        for cell in row[:3]:
            source, _ = _cell(cell)
            if source is not None:
                assert pp.bibliography.cite(source) != source, source


def test_the_latent_heat_models_named_in_the_readme_are_the_records():
    text = " ".join(_section("What it computes, and how").split())
    water = pp.Route("water", T=260.0, p=1e5).isobar(T=400.0).analyze().crossings
    assert [c.kind for c in water] == ["melting", "vaporization"]
    melt, boil = water
    for quoted, model in (
        ("reference EOS (CoolProp), saturation", boil.latent_heat_model),
        ("minus ice Ih: IAPWS R10-06", melt.latent_heat_model),
    ):
        assert quoted in text and quoted in model
    co2 = pp.substance("CO2")
    fusion = pp.Route(co2, T=210.0, p=co2.triple[1] * 1.001).isobar(T=216.6).analyze()
    model = fusion.crossings[0].latent_heat_model
    assert (
        "minus solid CO2: Jäger & Span 2012" in text
        and "minus solid CO2: Jäger & Span 2012" in model
    )
    assert "Clausius" not in model and "not Clausius–Clapeyron" in text
    sources = " ".join(_section("Published sources").split())
    assert "enthalpy difference of the EOS liquid" in sources


def test_the_readme_names_the_methane_sublimation_source_the_code_uses():
    sources = " ".join(_section("Published sources").split())
    assert "Methane: the one-term equation of Lemmon (2002), unpublished" in sources
    assert pp.substance("methane").sublimation.source == "Lemmon2002-CH4-sub"
    assert "Lemmon" in pp.bibliography.cite("Lemmon2002-CH4-sub")


def test_the_readme_states_the_guarantee_of_curved_legs():
    text = " ".join(_section("What it computes, and how").split())
    assert (
        "every crossing of a constant-h, s or v leg with a boundary, to 1e-9 relative in p" in text
    )
    from phasepath import curved

    assert "to 1e-9 relative" in " ".join(curved.__doc__.split())
