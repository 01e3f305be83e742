"""Published sources cited by phasepath: id -> full citation.

Docstrings, boundary curves and the report point at these ids.
"""

from __future__ import annotations

__all__ = ["SOURCES", "cite"]

SOURCES: dict[str, str] = {
    "IAPWS-R14-08": (
        "IAPWS R14-08(2011), Revised Release on the Pressure along the Melting and Sublimation "
        "Curves of Ordinary Water Substance (Plzeň, 2011); Wagner, Riethmann, Feistel & Harvey, "
        "J. Phys. Chem. Ref. Data 40, 043103 (2011), doi:10.1063/1.3657937"
    ),
    "IAPWS-95": (
        "IAPWS R6-95(2018), Revised Release on the IAPWS Formulation 1995 for the Thermodynamic "
        "Properties of Ordinary Water Substance for General and Scientific Use; Wagner & Pruss, "
        "J. Phys. Chem. Ref. Data 31, 387 (2002), doi:10.1063/1.1461829"
    ),
    "CoolProp": (
        "Bell, Wronski, Quoilin & Lemort, Pure and Pseudo-pure Fluid Thermophysical Property "
        "Evaluation and the Open-Source Thermophysical Property Library CoolProp, "
        "Ind. Eng. Chem. Res. 53, 2498 (2014), doi:10.1021/ie4033999 (CoolProp 8.0.0)"
    ),
    "SpanWagner1996": (
        "Span & Wagner, A New Equation of State for Carbon Dioxide Covering the Fluid Region from "
        "the Triple-Point Temperature to 1100 K at Pressures up to 800 MPa, J. Phys. Chem. Ref. "
        "Data 25, 1509 (1996), doi:10.1063/1.555991"
    ),
}


def cite(source_id: str) -> str:
    """Full citation for a source id (the id itself if unknown)."""
    return SOURCES.get(source_id, source_id)
