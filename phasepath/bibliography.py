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
    # Published melting and sublimation curves (correlations.sublimation_reviews,
    # sublimation_reference_eos, melting_published, helium)
    "BrownZiegler1980": (
        "Brown & Ziegler, Vapor pressure and heats of vaporization and sublimation of liquids and "
        "solids of interest in cryogenics below 1-atm pressure, Adv. Cryog. Eng. 25, 662 (1980), "
        "doi:10.1007/978-1-4613-9856-1_76"
    ),
    "REFPROP10": (
        "Lemmon, Bell, Huber & McLinden, NIST Standard Reference Database 23: Reference Fluid "
        "Thermodynamic and Transport Properties (REFPROP), Version 10.0, National Institute of "
        "Standards and Technology (2018), doi:10.18434/T4/1502528"
    ),
    "REFPROP10-BZ": (
        "Brown & Ziegler (1980) temperature terms with the constant term refitted to the triple "
        "point of the reference equation of state, as distributed with the fluid files of NIST "
        "REFPROP 10 (see BrownZiegler1980, REFPROP10)"
    ),
    "REFPROP10-FS": (
        "Fray & Schmitt (2009) temperature terms with the constant term refitted to the triple "
        "point of the reference equation of state, as distributed with the fluid files of NIST "
        "REFPROP 10 (see FraySchmitt2009, REFPROP10)"
    ),
    "Lemmon-REFPROP10-sub": (
        "Lemmon (2002-2003), sublimation-pressure fits of xenon, krypton, oxygen and normal "
        "hydrogen, unpublished; distributed with the fluid files of NIST REFPROP 10 (REFPROP10)"
    ),
    "Bell-REFPROP10-N2O": (
        "Bell (2018), sublimation-pressure fit of nitrous oxide, unpublished; distributed with "
        "the fluid file of NIST REFPROP 10 (REFPROP10)"
    ),
    "Gao2023-NH3": (
        "Gao, Wu, Bell, Harvey & Lemmon, A Reference Equation of State with an Associating Term "
        "for the Thermodynamic Properties of Ammonia, J. Phys. Chem. Ref. Data 52, 013102 (2023), "
        "doi:10.1063/5.0128269"
    ),
    "GuderWagner2009": (
        "Guder & Wagner, A Reference Equation of State for the Thermodynamic Properties of Sulfur "
        "Hexafluoride (SF6) for Temperatures from the Melting Line to 625 K and Pressures up to "
        "150 MPa, J. Phys. Chem. Ref. Data 38, 33 (2009), doi:10.1063/1.3037344"
    ),
    "MichelsPrins1962": (
        "Michels & Prins, The melting lines of argon, krypton and xenon up to 1500 atm; "
        "representation of the results by a law of corresponding states, Physica 28, 101 (1962), "
        "doi:10.1016/0031-8914(62)90096-4"
    ),
    "LemmonSpan2006": (
        "Lemmon & Span, Short Fundamental Equations of State for 20 Industrial Fluids, J. Chem. "
        "Eng. Data 51, 785 (2006), doi:10.1021/je050186n"
    ),
    "Leachman2009": (
        "Leachman, Jacobsen, Penoncello & Lemmon, Fundamental Equations of State for "
        "Parahydrogen, Normal Hydrogen, and Orthohydrogen, J. Phys. Chem. Ref. Data 38, 721 "
        "(2009), doi:10.1063/1.3160306"
    ),
    "MillsGrilly1955": (
        "Mills & Grilly, Melting Curves of He3, He4, H2, D2, Ne, N2, and O2 up to 3500 kg/cm2, "
        "Phys. Rev. 99, 480 (1955), doi:10.1103/PhysRev.99.480"
    ),
    "McCartyArp1990": (
        "McCarty & Arp, A New Wide Range Equation of State for Helium, Adv. Cryog. Eng. 35, 1465 "
        "(1990), doi:10.1007/978-1-4613-0639-9_174"
    ),
    "Datchi2000": (
        "Datchi, Loubeyre & LeToullec, Extended and accurate determination of the melting curves "
        "of argon, helium, ice (H2O), and hydrogen (H2), Phys. Rev. B 61, 6535 (2000), "
        "doi:10.1103/PhysRevB.61.6535"
    ),
    "Dunaeva2010": (
        "Dunaeva, Antsyshkin & Kuskov, Phase diagram of H2O: Thermodynamic functions of the "
        "phase transitions of high-pressure ices, Solar System Research 44, 202-222 (2010), "
        "doi:10.1134/S0038094610030044 (Table 2: equations of the phase boundaries)"
    ),
    "Journaux2020": (
        "Journaux et al., Holistic Approach for Studying Planetary Hydrospheres: Gibbs "
        "Representation of Ices Thermodynamics, Elasticity, and the Water Phase Diagram to "
        "2,300 MPa, J. Geophys. Res. Planets 125, e2019JE006176 (2020), doi:10.1029/2019JE006176 "
        "(software: seafreeze, GPL-3.0; an optional extra of phasepath)"
    ),
    "Younglove1982": (
        "Younglove, Thermophysical Properties of Fluids. I. Argon, Ethylene, Parahydrogen, "
        "Nitrogen, Nitrogen Trifluoride, and Oxygen, J. Phys. Chem. Ref. Data 11, Suppl. 1 (1982)"
    ),
}


def cite(source_id: str) -> str:
    """Full citation for a source id (the id itself if unknown)."""
    return SOURCES.get(source_id, source_id)
