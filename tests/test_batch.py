"""Batch analysis: same results in this process and in worker processes, order kept, and every
failing route reported by index with its own error.

Check values: the water vapor pressures come from IAPWS-IF97 (IAPWS R7-97(2012), region 4,
eq. 30) as implemented by the independent ``iapws`` package. IF97's saturation line agrees with
IAPWS-95 (the equation behind phasepath's water vapor pressure) to a few hundredths of a percent
(from memory); the tolerance is 3e-4 relative.
"""

from __future__ import annotations

import pytest

import phasepath as pp
from phasepath.errors import BatchError, RouteError, UnknownSubstanceError

IF97_TOL = 3e-4


def _sweep() -> list[pp.Route]:
    """Water isotherms from liquid at 60 bar down to vapor at 300 Pa, one per temperature
    (in shuffled order)."""
    temps = [
        300.0,
        440.0,
        330.0,
        410.0,
        350.0,
        280.0,
        420.0,
        390.0,
        310.0,
        370.0,
        430.0,
        290.0,
        340.0,
        380.0,
        320.0,
        400.0,
        360.0,
        450.0,
    ]
    return [
        pp.Route("water", T=T, p=60e5, title=f"isotherm {T:g} K").isotherm(p=300.0) for T in temps
    ]


def test_serial_reports_match_iapws_if97() -> None:
    from iapws.iapws97 import _PSat_T  # IAPWS R7-97(2012) eq. 30, p in MPa

    routes = _sweep()
    reports = pp.analyze_many(routes, progress=False)
    assert len(reports) == len(routes)
    for route, rep in zip(routes, reports, strict=True):
        assert rep.route is route  # order kept, and the caller's own route object
        (c,) = rep.crossings
        assert c.kind == "vaporization"
        assert c.T == route.start.T
        assert c.p == pytest.approx(_PSat_T(route.start.T) * 1e6, rel=IF97_TOL)


def test_process_results_equal_serial_results() -> None:
    routes = _sweep()
    serial = pp.analyze_many(routes, progress=False)
    parallel = pp.analyze_many(routes, workers=2, progress=False)
    assert [r.route for r in parallel] == routes  # order kept
    for a, b in zip(serial, parallel, strict=True):
        assert a == b  # crossings and leg summaries equal, field by field
        assert a.to_dict() == b.to_dict()


def test_dicts_are_accepted() -> None:
    routes = _sweep()[:3]
    reports = pp.analyze_many([r.to_dict() for r in routes], progress=False)
    assert [rep.crossings for rep in reports] == [r.analyze().crossings for r in routes]


@pytest.mark.parametrize("workers", [None, 2], ids=["serial", "processes"])
def test_bad_routes_are_each_reported(workers: int | None) -> None:
    good = _sweep()[:2]
    empty = pp.Route("water", T=300.0, p=1e5, title="no legs yet")
    unknown = {
        "substance": "unobtainium",
        "start": {"T": 300.0, "p": 1e5},
        "legs": [{"kind": "isobar", "T": 400.0}],
    }
    batch = [good[0], empty, unknown, good[1]]
    with pytest.raises(BatchError) as info:
        pp.analyze_many(batch, workers=workers, progress=False)
    err = info.value
    assert sorted(err.failures) == [1, 2]
    assert isinstance(err.failures[1], RouteError)
    assert isinstance(err.failures[2], UnknownSubstanceError)
    msg = str(err)
    assert "2 of 4 routes failed" in msg
    assert "route 1 ('no legs yet'): RouteError" in msg
    assert "route 2: UnknownSubstanceError" in msg and "unobtainium" in msg
    assert err.reports[1] is None and err.reports[2] is None
    assert err.reports[0] == good[0].analyze() and err.reports[3] == good[1].analyze()


@pytest.mark.parametrize("workers", [0, -2, 1.5, True, "2"])
def test_bad_worker_count(workers: object) -> None:
    with pytest.raises(BatchError, match="workers"):
        pp.analyze_many(_sweep()[:1], workers=workers, progress=False)  # type: ignore[arg-type]


def test_progress_bar_shows(capsys: pytest.CaptureFixture[str]) -> None:
    pp.analyze_many(_sweep()[:2], progress=True)
    assert "analysing routes" in capsys.readouterr().err
