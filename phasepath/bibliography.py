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
    "JagerSpan2012": (
        "Jäger & Span, Equation of State for Solid Carbon Dioxide Based on the Gibbs Free Energy, "
        "J. Chem. Eng. Data 57, 590 (2012), doi:10.1021/je2011677"
    ),
    "IAPWS-R10-06": (
        "IAPWS R10-06(2009), Revised Release on the Equation of State 2006 for H2O Ice Ih; "
        "Feistel & Wagner, A New Equation of State for H2O Ice Ih, J. Phys. Chem. Ref. Data 35, "
        "1021 (2006), doi:10.1063/1.2183324"
    ),
    "Span2000-N2": (
        "Span, Lemmon, Jacobsen, Wagner & Yokozeki, A Reference Equation of State for the "
        "Thermodynamic Properties of Nitrogen for Temperatures from 63.151 to 1000 K and Pressures "
        "to 2200 MPa, J. Phys. Chem. Ref. Data 29, 1361 (2000), doi:10.1063/1.1349047"
    ),
    "Tegeler1999": (
        "Tegeler, Span & Wagner, A New Equation of State for Argon Covering the Fluid Region for "
        "Temperatures from the Melting Line to 700 K at Pressures up to 1000 MPa, J. Phys. Chem. "
        "Ref. Data 28, 779 (1999), doi:10.1063/1.556037"
    ),
    "SetzmannWagner1991": (
        "Setzmann & Wagner, A New Equation of State and Tables of Thermodynamic Properties for "
        "Methane Covering the Range from the Melting Line to 625 K at Pressures up to 1000 MPa, "
        "J. Phys. Chem. Ref. Data 20, 1061 (1991), doi:10.1063/1.555898"
    ),
    "Lemmon2002-CH4-sub": (
        "Lemmon (2002), sublimation-pressure equation of methane, unpublished; distributed with "
        "the methane fluid file of NIST REFPROP (NIST Standard Reference Database 23)"
    ),
    "FraySchmitt2009": (
        "Fray & Schmitt, Sublimation of ices of astrophysical interest: A bibliographic review, "
        "Planet. Space Sci. 57, 2053 (2009), doi:10.1016/j.pss.2009.09.011"
    ),
    # Forms used for substances built from data (phasepath.correlations.vapor_pressure)
    "Antoine1888": (
        "Antoine, Tensions des vapeurs; nouvelle relation entre les tensions et les "
        "températures, Comptes Rendus 107, 681, 778, 836 (1888)"
    ),
    "Wagner1973": (
        "Wagner, New vapour pressure measurements for argon and nitrogen and a new method for "
        "establishing rational vapour pressure equations, Cryogenics 13, 470 (1973), "
        "doi:10.1016/0011-2275(73)90003-9; coefficient tables in the 3-6 form: McGarry, Ind. Eng. "
        "Chem. Process Des. Dev. 22, 313 (1983), doi:10.1021/i200021a023"
    ),
    "Poling2001": (
        "Poling, Prausnitz & O'Connell, The Properties of Gases and Liquids, 5th ed., "
        "McGraw-Hill (2001), chapter 7 and Appendix A (Wagner 2.5-5 form, Antoine constants)"
    ),
    "Clausius1850": (
        "Clausius, Über die bewegende Kraft der Wärme, Ann. Phys. 155, 500 (1850), "
        "doi:10.1002/andp.18501550403 (integrated Clausius-Clapeyron equation)"
    ),
    "SimonGlatzel1929": (
        "Simon & Glatzel, Bemerkungen zur Schmelzdruckkurve, Z. Anorg. Allg. Chem. 178, 309 "
        "(1929), doi:10.1002/zaac.19291780123"
    ),
}


def cite(source_id: str) -> str:
    """Full citation for a source id (the id itself if unknown)."""
    return SOURCES.get(source_id, source_id)
