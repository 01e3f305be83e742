"""Sweeps and batches on a real Dask cluster: a local cluster of two worker processes, started
and closed here, on 127.0.0.1 only. The cluster's results must equal the serial ones bit for bit
(the expected values are phasepath's own serial results: a consistency check across engines).
"""

from __future__ import annotations

import sys
from collections.abc import Iterator

import numpy as np
import pandas as pd
import pytest

import phasepath as pp
from phasepath import batch
from phasepath.errors import BatchError, RouteError

distributed = pytest.importorskip("dask.distributed")


@pytest.fixture(scope="module")
def address() -> Iterator[str]:
    """A LocalCluster of 2 processes x 1 thread; client and cluster closed even on failure."""
    cluster = client = None
    try:
        cluster = distributed.LocalCluster(
            processes=True,
            n_workers=2,
            threads_per_worker=1,
            host="127.0.0.1",
            dashboard_address=None,
        )
        client = distributed.Client(cluster)
        client.wait_for_workers(2, timeout=60)
        yield cluster.scheduler_address
    finally:
        if client is not None:
            client.close()
        if cluster is not None:
            cluster.close()


def vent_plan() -> pp.Route:
    """Invented vessel of Larkspur Botanicals: liquid CO2 vented through a valve to 1 atm."""
    return pp.Route("CO2", T="20 degC", p="60 bar", title="Larkspur V-3 vent").isenthalp(p="1 atm")


def assert_identical(a: pd.DataFrame, b: pd.DataFrame) -> None:
    pd.testing.assert_frame_equal(a, b, check_exact=True)
    for col in a.columns:
        if a[col].dtype == np.float64:
            assert np.array_equal(
                a[col].to_numpy().view(np.uint64), b[col].to_numpy().view(np.uint64)
            )
    assert a.attrs == b.attrs


def test_sweep_on_dask_equals_serial_bit_for_bit(address: str) -> None:
    Ts = [283.15, 288.15, 293.15, 298.15, 3000.0, 290.0]  # 3000 K: beyond the EOS, error rows
    ps = [60e5, 75e5, 90e5, 120e5, 101325.0, 200e5]  # 1 atm: a zero-length leg, error rows
    serial = pp.sweep(vent_plan(), start_T=Ts, start_p=ps, progress=False)
    on_dask = pp.sweep(vent_plan(), start_T=Ts, start_p=ps, address=address, progress=False)
    assert_identical(serial, on_dask)
    assert (serial["error"] != "").sum() == 6 + 5
    assert (serial["error"] == "").sum() == 25


def test_analyze_many_on_dask(address: str) -> None:
    routes = [
        pp.Route("water", T=T, p=60e5, title=f"isotherm {T:g} K").isotherm(p=300.0)
        for T in (300.0, 340.0, 380.0, 420.0, 460.0, 320.0, 360.0, 400.0, 440.0, 310.0)
    ]
    serial = pp.analyze_many(routes, progress=False)
    on_dask = pp.analyze_many(routes, address=address, progress=False)
    assert [r.route for r in on_dask] == routes  # order kept, the caller's route objects
    for a, b in zip(serial, on_dask, strict=True):
        assert a == b and a.to_dict() == b.to_dict()
    empty = pp.Route("water", T=300.0, p=1e5, title="no legs yet")
    with pytest.raises(BatchError) as info:
        pp.analyze_many([routes[0], empty], address=address, progress=False)
    assert sorted(info.value.failures) == [1]
    assert isinstance(info.value.failures[1], RouteError)
    assert info.value.reports[0] == serial[0]


def test_workers_with_other_versions_are_refused(
    address: str, monkeypatch: pytest.MonkeyPatch
) -> None:
    # This process claims another phasepath version; the workers report their own.
    other = (("phasepath", "0.0.0-other"),) + batch._versions()[1:]
    monkeypatch.setattr(batch, "_versions", lambda: other)
    with pytest.raises(BatchError, match="install the same versions on every worker"):
        pp.sweep(vent_plan(), start_T=[293.15], address=address, progress=False)


def test_address_without_dask(monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.setitem(sys.modules, "dask.distributed", None)  # as if it were not installed
    with pytest.raises(BatchError, match="dask.distributed is not installed"):
        pp.sweep(vent_plan(), start_T=[293.15], address="tcp://127.0.0.1:1", progress=False)
    with pytest.raises(BatchError, match="dask.distributed is not installed"):
        pp.analyze_many([vent_plan()], address="tcp://127.0.0.1:1", progress=False)
