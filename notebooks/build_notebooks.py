"""Write the worked-plan notebooks of this folder from the cell texts below, then run them.

    python notebooks/build_notebooks.py            # write and execute (saves reference outputs)
    python notebooks/build_notebooks.py --no-run   # write only

The executed outputs saved in each notebook are the references that
``pytest --nbval --nbval-current-env --nbval-sanitize-with phasepath/nbval_sanitize.cfg notebooks/``
compares against. Every scenario (companies, vessels, numbers) is invented for these demos.
"""

from __future__ import annotations

import sys
from pathlib import Path

HERE = Path(__file__).resolve().parent

SAFETY = (
    "> **Safety.** phasepath is a planning aid, not a safety assessment. {hazards} "
    "Follow local codes, site procedures and licensed engineering practice; the flags below are "
    "prompts for the review, not a substitute for one."
)

SETUP = """\
import phasepath as pp
from phasepath import format as F  # numbers with the digits the models support
from phasepath import format_report  # fixed-format text: the same on every machine
"""

NOTEBOOKS: dict[str, list[tuple[str, str]]] = {}

# -- 1. supercritical CO2 extraction vessel ------------------------------------------------------
NOTEBOOKS["co2_extraction_vessel.ipynb"] = [
    ("md", """\
# Charging and venting a supercritical-CO₂ extraction vessel

**Scenario (invented for this demo).** *Quillmere Botanicals* runs a 24-litre extraction vessel,
**EX-2**, rated 350 bar at 100 °C. CO₂ comes from a cylinder manifold at 20 °C and 50 bar, is
compressed (with intercooling, taken as isothermal) to 300 bar, and heated to the extraction
temperature of 50 °C. After the run the vessel is vented to the atmosphere through a
needle valve.

**Why plan it.** On the way up the CO₂ condenses in the compressor discharge and then goes
supercritical in the heater; on the way down the valve throttles it across the critical
region into the two-phase dome and, below 5.18 bar, into **dry ice**. Dry ice in a vent line
can plug it and then let go. We want every crossing, with its T and p, and a vent plan that
keeps the solid out of the valve."""),
    ("md", SAFETY.format(hazards=(
        "High-pressure CO₂ can burst equipment; vented CO₂ displaces oxygen and can asphyxiate "
        "in enclosed or low-lying spaces; dry ice and cold gas cause cold burns and can plug "
        "relief paths."))),
    ("code", SETUP),
    ("md", """\
## Plan A: charge, heat, vent straight to atmosphere

Legs: compress at 20 °C to 300 bar (isotherm), heat to 50 °C at 300 bar (isobar), then vent
through the valve to 1 atm (constant enthalpy: a throttle, no heat and no work). The vent leg
models the gas passing the valve at the start of the vent, when the vessel is still at its
run conditions."""),
    ("code", """\
plan_a = (
    pp.Route("CO2", T="20 degC", p="50 bar", title="EX-2 plan A: vent straight down")
    .isotherm(p="300 bar")
    .isobar(T="50 degC")
    .isenthalp(p="1 atm")
)
report_a = plan_a.analyze()
print(format_report(report_a, "degC", "bar"))"""),
    ("md", """\
The vent leg ends at −78.5 °C as solid plus vapor: the throttle crosses the critical region,
enters the liquid–vapor dome, and reaches the triple point (−56.6 °C, 5.18 bar) where dry ice
forms. Pre-heating the vessel contents does not by itself help, as plan B shows."""),
    ("code", """\
plan_b = (
    pp.Route("CO2", T="50 degC", p="300 bar", title="EX-2 plan B: heat to 95 degC, then vent")
    .isobar(T="95 degC")
    .isenthalp(p="1 atm")
)
print(format_report(plan_b.analyze(), "degC", "bar"))"""),
    ("md", """\
## Plan C: staged letdown with reheat

Throttle in two stages, with a heater between them: first to 40 bar, reheat to 60 °C at 40 bar,
then throttle to atmosphere. The table shows whether the second valve still sees a solid."""),
    ("code", """\
plan_c = (
    pp.Route("CO2", T="50 degC", p="300 bar", title="EX-2 plan C: staged letdown with reheat")
    .isobar(T="95 degC")
    .isenthalp(p="40 bar")
    .isobar(T="60 degC")
    .isenthalp(p="1 atm")
)
report_c = plan_c.analyze()
print(format_report(report_c, "degC", "bar"))"""),
    ("code", """\
# Which vent legs form a solid? (deposition into dry ice, or a crossing flagged for solids)
for name, report in (("A", report_a), ("B", plan_b.analyze()), ("C", report_c)):
    solid = [c for c in report.crossings if "solid" in c.to_phase]
    where = ", ".join(f"leg {c.step} at {F.quantity(c.T, 'temperature', 'degC')}"
                      for c in solid) or "none"
    print(f"plan {name}: solid forms on {where}")"""),
    ("md", """\
## Draw and adjust it in the planner

The planner widget shows plan C on the CO₂ diagram; drag a corner or type a value to try
other letdown pressures, and save the route as a file for the review."""),
    ("code", """\
planner = pp.widgets.RoutePlanner(route=plan_c)
planner"""),
    ("code", """\
from pathlib import Path

Path("routes").mkdir(exist_ok=True)
saved = plan_c.save("routes/ex2_staged_letdown.yaml")
print(saved.read_text())
assert pp.Route.load(saved).to_dict() == plan_c.to_dict()"""),
    ("md", """\
## Results and cautions

* Plans A and B form dry ice at the valve on the way to 1 atm. Plan C forms no solid: its
  first valve ends as a wet vapor at 40 bar (about four fifths vapor by mass), the heater
  vaporizes the rest and reheats it (the heat of leg 3 includes that latent heat), and the
  reheated gas stays vapor through the second valve.
* Every vent leg passes close to the critical point (31 °C, 73.8 bar): expect large swings in
  density and flow; size the heater for the worst case, not the average.
* The vent model is a single throttle from a fixed upstream state. As the vessel empties its
  own temperature and pressure fall; a sealed-vessel blowdown is not modelled here.
* Vent outdoors or to a ducted stack, monitor CO₂ in the room, and keep relief paths free of
  solids. Defer to local codes and licensed practice."""),
]

# -- 2. freeze-drying below the triple point ----------------------------------------------------
NOTEBOOKS["freeze_drying_cycle.ipynb"] = [
    ("md", """\
# A freeze-drying cycle below water's triple point

**Scenario (invented for this demo).** *Fenwright Biologics* dries an aqueous buffer in the
shelf freeze dryer **LY-3**. The cycle: freeze the filled vials at atmospheric pressure to
−45 °C, pull the chamber down to 13 Pa, raise the shelves to −20 °C for primary drying, then
to +25 °C for secondary drying.

**Why plan it.** Primary drying works only if the ice **sublimes** rather than melts: the
chamber pressure must stay below water's triple-point pressure (611.657 Pa) and below the ice
vapour pressure at the product temperature. We want the exact temperature at which the ice
starts to sublime at the chosen chamber pressure, and the heat the shelves must supply per
kilogram of ice.

**Simplification, stated.** The product is modelled as pure water. Solutes lower the freezing
point and set a collapse temperature that this pure-substance model does not know."""),
    ("md", SAFETY.format(hazards=(
        "Vacuum chambers can implode; refrigeration and condenser surfaces are cold enough to "
        "burn skin; the condenser's refrigerant and any cryogen used need their own reviews."))),
    ("code", SETUP),
    ("code", """\
cycle = (
    pp.Route("water", T="20 degC", p="1 atm", title="LY-3 cycle: freeze, evacuate, dry")
    .isobar(T="-45 degC")      # freezing on the shelves at atmospheric pressure
    .isotherm(p="13 Pa")       # chamber evacuation at the frozen temperature
    .isobar(T="-20 degC")      # primary drying: shelves warmed at 13 Pa
    .isobar(T="25 degC")       # secondary drying
)
report = cycle.analyze()
print(format_report(report, "degC", "Pa"))"""),
    ("md", """\
The ice starts to sublime at the temperature where its vapour pressure equals the chamber
pressure; above it the shelves supply the latent heat of sublimation. Checking the margin to
the triple point: the chamber pressure must stay below it for the whole drying phase."""),
    ("code", """\
water = pp.substance("water")
T_t, p_t = water.triple
sub = next(c for c in report.crossings if c.kind == "sublimation")
print(f"triple point of water:    {F.quantity(T_t, 'temperature', 'degC')}, "
      f"{F.quantity(p_t, 'pressure')}")
print(f"sublimation at 13 Pa:     {F.quantity(sub.T, 'temperature', 'degC')}")
print(f"latent heat there:        {F.quantity(sub.latent_heat, 'energy', 'kJ/kg')}")
print(f"chamber pressure margin:  {p_t / 13.0:.0f} times below the triple-point pressure")"""),
    ("md", """\
## What if the chamber pressure drifts up?

A leaking door seal lets the chamber rise. At 700 Pa, above the triple-point pressure, the
same shelf warming **melts** the ice instead: the product would collapse."""),
    ("code", """\
leak = (
    pp.Route("water", T="-45 degC", p="700 Pa", title="LY-3 with a leaking seal (700 Pa)")
    .isobar(T="-20 degC")
    .isobar(T="25 degC")
)
for c in leak.analyze().crossings:
    print(f"leg {c.step}: {c.kind:12s} at {F.quantity(c.T, 'temperature', 'degC')}, "
          f"{F.quantity(c.p, 'pressure')}")"""),
    ("md", "## The cycle in the planner"),
    ("code", """\
planner = pp.widgets.RoutePlanner(route=cycle, p_unit="Pa")
planner"""),
    ("md", """\
## Results and cautions

* At 13 Pa the ice sublimes near −40 °C; the shelves must then supply about 2.8 MJ per kg of
  ice removed, the figure that sizes the shelf heating and the condenser.
* The whole drying phase stays far below the triple-point pressure; a rise above 611.657 Pa
  melts the product (see the leaking-seal case): alarm on chamber pressure.
* Real formulations freeze below 0 °C and collapse above their own collapse temperature:
  use measured product data for those limits. Defer to site procedures and licensed practice
  for vacuum and refrigeration equipment."""),
]

# -- 3. high-pressure water processing ------------------------------------------------------------
NOTEBOOKS["high_pressure_water.ipynb"] = [
    ("md", """\
# High-pressure water processing: ice VI and ice III re-entrance

**Scenario (invented for this demo).** *Tessaline Foods* runs a 55-litre high-pressure
processing vessel, **HP-7**, rated 650 MPa, with water as the pressure medium. Two plans are
under review:

1. a *chilled cycle*: packs at 5 °C pressed to 600 MPa, and a proposal to go to 700 MPa;
2. a *pressure-assisted thaw*: frozen blocks at −20 °C pressed until they melt, warmed, then
   released.

**Why plan it.** Liquid water under a few hundred MPa freezes into the high-pressure ices (III,
V, VI). Ice forming in the vessel or in the intensifier lines can stall a cycle or damage
seals. On a cold isotherm the phase sequence is not monotonic: compressed ice Ih melts, and the
liquid then **re-freezes** into ice III a little higher up."""),
    ("md", SAFETY.format(hazards=(
        "Vessels at hundreds of MPa store large energies: a seal or closure failure is "
        "violent. Only trained staff should operate them, inside their rated envelope."))),
    ("code", SETUP),
    ("md", "## 1. Chilled cycle at 5 °C"),
    ("code", """\
chilled = pp.Route("water", T="5 degC", p="1 bar", title="HP-7 chilled cycle to 600 MPa")
chilled.isotherm(p="600 MPa").isotherm(p="1 bar")
print(format_report(chilled.analyze(), "degC", "MPa"))"""),
    ("code", """\
proposal = pp.Route("water", T="5 degC", p="1 bar", title="HP-7 proposal: 700 MPa at 5 degC")
proposal.isotherm(p="700 MPa")
report = proposal.analyze()
print(format_report(report, "degC", "MPa"))"""),
    ("md", """\
At 5 °C the medium freezes into **ice VI** just below 700 MPa. The margin at 600 MPa, and the
lowest temperature at which 700 MPa stays liquid, follow from the melting curve of ice VI:"""),
    ("code", """\
water = pp.substance("water")
ice6 = next(b for b in water.boundaries if b.label == "melting (ice VI)")
print(f"ice VI branch: {F.quantity(ice6.T_min, 'temperature', 'degC')} to "
      f"{F.quantity(ice6.T_max, 'temperature', 'degC')} ({ice6.source})")
print(f"ice VI melting pressure at 5 degC: "
      f"{F.quantity(ice6.p_of_T(278.15), 'pressure', 'MPa')}")
T_700 = ice6.temperatures_at(700e6)[0].root
print(f"700 MPa stays liquid above {F.quantity(T_700, 'temperature', 'degC')}")"""),
    ("md", "## 2. Pressure-assisted thaw at −20 °C: ice III re-entrance"),
    ("code", """\
probe = pp.Route("water", T="-20 degC", p="1 bar", title="Isotherm at -20 degC to 300 MPa")
probe.isotherm(p="300 MPa")
print(format_report(probe.analyze(), "degC", "MPa"))"""),
    ("md", """\
The −20 °C isotherm melts ice Ih at about 194 MPa and re-freezes the liquid as **ice III**
about 52 MPa higher. The thaw must hold the pressure inside that window. The plan: press to
220 MPa, warm to 10 °C at that pressure, then release."""),
    ("code", """\
thaw = (
    pp.Route("water", T="-20 degC", p="1 bar", title="HP-7 pressure-assisted thaw")
    .isotherm(p="220 MPa")
    .isobar(T="10 degC")
    .isotherm(p="1 bar")
)
thaw_report = thaw.analyze()
print(format_report(thaw_report, "degC", "MPa"))"""),
    ("code", """\
planner = pp.widgets.RoutePlanner(route=thaw, p_unit="MPa")
planner"""),
    ("md", """\
## Results and cautions

* 600 MPa at 5 °C stays liquid; the 700 MPa proposal freezes the medium into ice VI and is
  rejected unless the medium is held warmer than the temperature printed above.
* The thaw window at −20 °C is narrow (about 194 to 246 MPa): control the pressure, not just
  the set point, and expect ice III if it overshoots.
* Latent heats and the heat and work of legs in the high-pressure ices come from the
  Gibbs-energy representations of Journaux et al. (2020), an optional extra
  (`pip install "phasepath[ices]"`); without it the tables show "—" with the reason. Treat
  those figures as model estimates when sizing heating or cooling.
* Operate only within the vessel's rated pressure and temperature; defer to the
  manufacturer's instructions, local codes and licensed practice."""),
]

# -- 4. cryogenic fill with argon and nitrogen ----------------------------------------------------
NOTEBOOKS["cryogenic_fill.ipynb"] = [
    ("md", """\
# A cryogenic fill: condensing argon against liquid nitrogen

**Scenario (invented for this demo).** *Brackwater Cryogenics* fills a 180-litre liquid-argon
dewar, **DW-180**, by condensing argon gas in a coil immersed in a liquid-nitrogen bath. The
argon arrives at 20 °C and 1.2 bar.

**Why plan it.** Liquid nitrogen at atmospheric pressure boils at about −196 °C, while argon
**freezes** near −189 °C. A coil that gets as cold as the bath fills with solid argon and
blocks. The plan must find the bath pressure that keeps the coil wall above argon's freezing
point while still condensing it."""),
    ("md", SAFETY.format(hazards=(
        "Liquid nitrogen and liquid argon cause cold burns and embrittle ordinary steels; "
        "liquid trapped between closed valves can burst a line as it warms; both gases displace "
        "oxygen and can asphyxiate without warning in enclosed spaces: use oxygen monitoring."))),
    ("code", SETUP),
    ("md", "## Argon cooled all the way to the bath temperature at 1 atm"),
    ("code", """\
too_cold = pp.Route("argon", T="20 degC", p="1.2 bar", title="DW-180: argon cooled to -195 degC")
too_cold.isobar(T="-195 degC")
print(format_report(too_cold.analyze(), "degC", "bar"))"""),
    ("md", """\
The argon condenses at −184.2 °C and then freezes at −189.3 °C. The bath must run warmer.
The boiling temperature of the nitrogen bath rises with its pressure; the crossings of a
nitrogen isobar give it directly:"""),
    ("code", """\
for bath in ("1 atm", "2 bar", "2.5 bar", "3 bar"):
    n2 = pp.Route("nitrogen", T="-205 degC", p=bath).isobar(T="-150 degC")
    boil = n2.analyze().crossings[0]
    print(f"nitrogen bath at {bath:>7}: boils at {F.quantity(boil.T, 'temperature', 'degC')}")"""),
    ("md", """\
A bath held at 2.5 bar boils at about −187.2 °C: above argon's freezing point at 1.2 bar
(−189.3 °C), and below its condensation point (−184.2 °C). The fill plan condenses and
subcools the argon only to the bath temperature:"""),
    ("code", """\
fill = (
    pp.Route("argon", T="20 degC", p="1.2 bar", title="DW-180 fill: bath at 2.5 bar")
    .isobar(T="-187 degC")     # condensed in the coil, subcooled to just above the bath
    .isenthalp(p="1.05 bar")    # let down into the dewar through the fill valve
)
fill_report = fill.analyze()
print(format_report(fill_report, "degC", "bar"))"""),
    ("code", """\
planner = pp.widgets.RoutePlanner(route=fill)
planner"""),
    ("md", """\
## Results and cautions

* With the bath at 1 atm the coil freezes argon; hold the nitrogen bath at about 2.5 bar (a
  back-pressure regulator on the bath vent) so the coil stays above −189.3 °C.
* The heat removed per kilogram of argon in the coil is in the legs table: it sizes the
  nitrogen boil-off.
* The subcooled liquid passes the fill valve without flashing (liquid at both ends of leg 2).
  A warmer coil outlet would flash part of it at the valve: size the dewar vent for that case.
* Cryogens: cold burns, embrittlement, trapped-liquid overpressure and oxygen depletion. Use
  oxygen monitors and relief valves on every section that can trap liquid; defer to local
  codes, the gas supplier's instructions and licensed practice."""),
]

NOTEBOOKS["custom_solvent.ipynb"] = [
    ("md", """\
# A solvent the reference library does not know: a phase diagram from its data sheet

*Lanthorn Fine Chemicals* sells **Solvane 40**, a process solvent that no reference equation of
state covers. The supplier, the product and every number below are **invented for this demo**.
The Brackwater pilot plant wants to boil it off a batch in vessel V-7 (also invented), compress
the vapor and store the condensate cold, and needs to know, leg by leg, where it boils, condenses
and freezes.

phasepath builds the diagram from the data sheet with the published methods (Antoine fit of the
measured vapor pressures, Clausius–Clapeyron, a straight melting line), and says where the curves
rest on data and where they do not.

> **Safety.** Hot solvent vapor under pressure can burn, ignite and rupture equipment; boiling a
> solvent in a closed vessel raises its pressure fast. Cold, frozen solvent can block lines and
> relief paths. This notebook plans states; it does not size equipment or relief. Follow the
> safety data sheet, your site's rules and the local pressure-equipment codes, and have the
> design checked by licensed engineers."""),
    ("code", """\
import phasepath as pp
from phasepath import format as F  # numbers with the digits the models support

# Solvane 40 technical data sheet, Lanthorn Fine Chemicals (invented for this demo)
sheet = dict(
    vapor_points=[("50 degC", "0.85 kPa"), ("75 degC", "3.09 kPa"), ("100 degC", "9.05 kPa"),
                  ("125 degC", "22.99 kPa"), ("150 degC", "50.74 kPa"),
                  ("175 degC", "101.6 kPa"), ("200 degC", "188.65 kPa")],
    normal_boiling_point="175 degC",
    critical=("338 degC", "29.5 bar"),          # supplier's estimate
    melting_point="-38.5 degC",
    melting_slope="2.9 MPa/K",                   # supplier's estimate
    enthalpy_fusion="15.2 kJ/mol",
    molar_mass="128.2 g/mol",
    source="Lanthorn Fine Chemicals, Solvane 40 data sheet rev. C (invented)",
)
solvane = pp.Substance.from_data("Solvane 40", **sheet)
print(solvane)
for name, (T, p) in (("triple point", solvane.triple), ("critical point", solvane.critical)):
    print(f"{name}: T = {F.quantity(T, 'temperature')}, p = {F.quantity(p, 'pressure')}")"""),
    ("md", """\
## What the diagram rests on

Seven measured points are fitted by the Antoine form (it follows the curvature of ln p against
1/T); the two-parameter Clausius–Clapeyron enthalpy is reported alongside with its uncertainty.
Every note below comes from the substance itself."""),
    ("code", """\
for note in solvane.notes:
    print("-", note)"""),
    ("code", """\
fits = solvane.source_data.fits
antoine, line = fits["vapor"], fits["clausius-clapeyron"]
q, e = antoine.params, antoine.stderr  # each fitted value to the digits its error supports
print("Antoine: " + ", ".join(f"{k} = {F.fitted(q[k], e[k])} ± {F.significant(e[k], 2)}"
                              for k in "ABC"))
dH, sd = line.enthalpy() / 1e3, line.enthalpy_stderr / 1e3
print(f"Clausius-Clapeyron enthalpy of vaporization: {F.fitted(dH, sd)} ± "
      f"{F.significant(sd, 2)} kJ/mol")
print(f"rms residual: Antoine {F.significant(100 * antoine.rms, 2)} %, "
      f"straight line {F.significant(100 * line.rms, 2)} %")
print("   T [°C]   measured [kPa]   fitted [kPa]")
for T, p in antoine.points:
    fitted = antoine.pressure(T)
    print(f"{F.temperature(T, 'degC'):>9} {F.pressure(p, 'kPa'):>16} {F.pressure(fitted, 'kPa'):>14}")"""),
    ("md", """\
## The route in vessel V-7

1. heat the liquid at 1.5 bar from 20 °C to 210 °C (it boils on the way);
2. compress the vapor at 210 °C to 15 bar (it condenses);
3. cool the condensate at 15 bar to −50 °C (it freezes)."""),
    ("code", """\
route = (pp.Route(solvane, T="20 degC", p="1.5 bar", title="V-7 boil-off and cold storage")
         .isobar(T="210 degC")
         .isotherm(p="15 bar")
         .isobar(T="-50 degC"))
report = route.analyze()
print(pp.format_report(report, "degC", "bar"))"""),
    ("md", """\
The latent heats are approximate: Clausius–Clapeyron with the vapor taken as an ideal gas
(it runs a few percent high near 1 bar and more at higher pressure), and the given enthalpy of
fusion. With no equation of state, heat and work per leg are not computed, and the report says so:"""),
    ("code", """\
for leg in report.legs:
    print(f"leg {leg.step} ({leg.kind}): {leg.start.phase} -> {leg.end.phase}; heat: {leg.heat} ({leg.note})")"""),
    ("md", """\
## Where the route leaves the data

The condensation at 210 °C lies above the highest measured point (200 °C), and the freezing at
15 bar lies on the melting line far above the one measured melting point (1 atm). The report warns:"""),
    ("code", """\
for note in report.notes:
    if note.startswith("Warning"):
        print("-", note)"""),
    ("code", """\
import matplotlib

matplotlib.use("Agg")
import matplotlib.pyplot as plt

fig, ax = plt.subplots(figsize=(6.4, 4.4))
for b in solvane.boundaries:
    T, p = b.curve()
    ax.semilogy(T, p, color="0.6", lw=1, ls="--")          # the whole branch
    lo, hi = b.T_valid or (b.T_min, b.T_max)
    keep = (T >= lo) & (T <= hi)
    ax.semilogy(T[keep], p[keep], lw=2.2, label=f"{b.label} (data)")
Tr, pr = zip(*route.corners())
ax.semilogy(Tr, pr, "k-o", ms=4, label="route")
for c in report.crossings:
    ax.semilogy(c.T, c.p, "s", mfc="white", mec="k")
ax.set_xlabel("T [K]"); ax.set_ylabel("p [Pa]")
ax.set_title("Solvane 40: solid lines rest on data, dashed are extrapolated")
ax.legend(fontsize=8, loc="lower right")
fig.tight_layout()
plt.show()"""),
    ("md", """\
## When to trust such a diagram

* **Inside the data, the boiling curve is as good as the data.** Fitted to measured points with
  the Antoine form, boiling temperatures are typically within a few hundredths of a kelvin of the
  data's own curve; the residual table above shows how well the points agree with it.
* **A straight line in ln p against 1/T is not enough over a wide range.** Over 100 K the
  two-parameter Clausius–Clapeyron line misplaces a boiling point by about half a kelvin; give
  three or more points and let the Antoine fit follow the curvature.
* **Outside the data, every curve is an extrapolation.** Between the last point and the critical
  point the curve is a bridge through an estimated critical point; the report flags every crossing
  there. Treat those temperatures as estimates (a kelvin or so) and measure if they matter.
* **The melting and sublimation curves are thin.** A melting point and an estimated slope give a
  line that is fair within a few bar of the measured point and rough at tens of bar; the
  sublimation curve assumes a constant enthalpy.
* **Latent heats are approximate, heat and work are not given.** With no equation of state,
  latent heats come from Clausius–Clapeyron with an ideal gas (a few percent high near 1 bar, worse
  toward the critical point).
* **Missing data are missing.** A curve not given is not drawn, and no crossing is reported on it:
  a route may freeze where this diagram has no melting curve.

Use such a diagram for planning and review, not for design margins; confirm the critical legs with
measurements or a reference equation of state, and follow local codes and licensed practice."""),
]

# -- 7. two vent plans compared before a review ---------------------------------------------------
NOTEBOOKS["vent_plan_review.ipynb"] = [
    ("md", """\
# Two vent plans for one vessel, compared before the review

**Scenario (invented for this demo).** *Corvane Gas Works* must empty its 40-litre liquid-CO₂
buffer vessel **BV-12** (18 °C, 58 bar) before a valve is replaced. Two plans are on the table:

* **Plan A**: vent the liquid straight to the atmosphere through the drain valve;
* **Plan B**: send it through the electric vaporizer at vessel pressure (to 60 °C), then vent
  the gas through the same valve.

The shift lead, the safety engineer and the process owner review the plans together. Before the
meeting the process engineer compares them with phasepath, picks one, and files its report: a
single HTML page with the diagram, the tables, the hazard flags and cautions, the sources and the
versions that produced the numbers.

**Simplification, stated.** Each vent is modelled as one throttle from the vessel's starting
state; as the vessel empties its own temperature and pressure fall, which is not modelled here."""),
    ("md", SAFETY.format(hazards=(
        "Liquid CO₂ let down below 5.2 bar forms dry ice, which plugs valves and lines and can "
        "let go suddenly; vented CO₂ displaces oxygen and can asphyxiate in enclosed or "
        "low-lying spaces; cold gas and dry ice cause cold burns."))),
    ("code", SETUP),
    ("md", "## The two plans"),
    ("code", """\
plan_a = pp.Route("CO2", T="18 degC", p="58 bar",
                  title="BV-12 plan A: vent the liquid straight to atmosphere")
plan_a.isenthalp(p="1 atm")

plan_b = pp.Route("CO2", T="18 degC", p="58 bar",
                  title="BV-12 plan B: vaporizer to 60 degC, then vent")
plan_b.isobar(T="60 degC").isenthalp(p="1 atm")

report_a, report_b = plan_a.analyze(), plan_b.analyze()
print(format_report(report_a, "degC", "bar"))"""),
    ("code", """\
print(format_report(report_b, "degC", "bar"))"""),
    ("md", """\
## What differs

`pp.compare(a, b)` pairs the crossings of the two plans and compares each leg's end state,
fractions, heat and work and its hazard flags, within stated tolerances. `~` moved or changed,
`+` only in B, `-` only in A. The same comparison runs on the command line as
`phasepath diff A.yaml B.yaml`, which exits with status 1 when the plans differ."""),
    ("code", """\
comparison = pp.compare(plan_a, plan_b)
print(comparison.text(F.DisplayUnits("degC", "bar", "kJ/kg")))"""),
    ("code", """\
# what the safety engineer asks first: which hazards does plan B lose or gain?
for d in comparison.differences:
    if d.item == "hazard":
        print(f"{d.sign} leg {d.leg}: {d.field}")
vaporizer = report_b.legs[0]
print(f"vaporizer duty in plan B: {F.quantity(vaporizer.heat, 'energy', 'kJ/kg')} (per kg of CO2)")
print(f"gas leaves the valve at {F.quantity(report_b.legs[1].end.T, 'temperature', 'degC')}")"""),
    ("md", """\
## The chosen plan, filed for the review

Plan B keeps dry ice out of the valve at the cost of the vaporizer duty above. The team files
the plan as a route file, its report, and the side-by-side comparison; the route file goes
under version control, with its expected results, so that `phasepath check` keeps it honest."""),
    ("code", """\
import html
from pathlib import Path

folder = Path("reports")
folder.mkdir(exist_ok=True)
plan_a.save(folder / "bv12_plan_a.yaml")
plan_b.save(folder / "bv12_plan_b.yaml")
report_b.save_html(folder / "bv12_plan_b.html", route_file=folder / "bv12_plan_b.yaml")
comparison.save_html(folder / "bv12_plan_a_vs_b.html")
page = html.unescape((folder / "bv12_plan_b.html").read_text(encoding="utf-8"))
print(sorted(p.name for p in folder.iterdir()))
print("figures:", page.count("<svg"), "| tables:", page.count("<table"),
      "| cautions listed:", sum(c in page for c in report_b.cautions), "of",
      len(report_b.cautions))"""),
    ("md", """\
The same steps from a terminal (or a CI job): the report of the chosen plan, the comparison, and
the check of the plan against its expected results."""),
    ("code", """\
from phasepath import cli

status = cli.main(["diff", "reports/bv12_plan_a.yaml", "reports/bv12_plan_b.yaml",
                   "--only", "hazards"])
print("exit status:", status)"""),
    ("md", """\
## Results and cautions

* Plan A forms dry ice at the valve (about 31 % of the vented mass as solid at −78.5 °C): it
  can plug the drain valve and let go suddenly. It is rejected.
* Plan B vaporizes the liquid first (about 238 kJ per kg of CO₂) and vents gas only; the gas
  still leaves the valve close to 0 °C, so the vent line gets cold and wet.
* Both plans release CO₂: vent outdoors or to a ducted stack, monitor CO₂ where people work,
  and keep the relief path clear. The flags are prompts for the review, not a safety
  assessment: defer to local codes, site procedures and licensed practice."""),
]


NOTEBOOKS["planner.ipynb"] = [
    ("md", """\
# Route planner

Draw a compression and heating route on three linked views of a substance's phase diagram —
pressure–temperature, pressure–enthalpy and temperature–entropy — and read, leg by leg, where it
boils, condenses, melts, freezes, sublimes, deposits or goes supercritical.

**How to use the planner below**

* Pick a substance by its plain name (type to filter: `carbon dioxide (CO2)`, `water (H2O)`);
  substances you built in this session with `pp.Substance.from_data` are listed first. Choose
  the display units (entropy follows the energy unit).
* *draw* mode: the first click on any of the three views places the start; each further click
  adds a leg of the kind chosen: **constant T**, **constant p**, **constant v** (a sealed
  vessel), **constant h** (a valve or vent) and **constant s** (an ideal compressor). **auto**
  picks the kind that runs straight in the view you click: constant T or p on P–T, constant p or
  h on p–h, constant T or s on T–s. Clicks snap to a round value at the current zoom (20 °C,
  5 bar, 1 atm); hold Shift or Alt for the exact point. For a curved leg the corner lands where
  the equation of state puts the end state, and every view draws the leg's true path.
* **ends**: leave it empty to end a constant-p or constant-T leg at the click, or pick an event
  (*fully vapor*, *first liquid*, *first solid*, *5 K superheat*, …).
* Move the pointer over a view: the line under it reads the state there (T, p, phase and ice form,
  h, s, density, vapor or solid fraction). Click a corner to select it in every view; drag it in
  any view to move it in all (on p–h a drag sets p and h; each leg keeps what its kind holds).
* The leg list shows every corner with its state. Type exact values there, or a whole new leg
  under it (kind, target or `until fully vapor`); values are read as engineers write them
  (`−20 °C`, `5 barg`, `ambient`). A value that is refused stays beside its field, marked, with
  the reason, and the field keeps the route being analysed. The start box also takes a fill
  density (`450 kg/m3`) or a quality. **undo**, **redo**, **clear**, the trash button per corner.
* Give the route a title and notes; **open route file** loads a saved route (also
  `planner.load_route(path)`); **files** prepares the route file and the tables as CSV; **PNG**
  and **SVG** save the three diagrams.
* *pan/zoom* mode: drag to pan, scroll to zoom; **fit** shows the route and the curves it reaches.
* The tables show what happens at each crossing, the vapor and solid fractions at the end of each
  leg and the hazard flags (⚠); the cautions box lists their cautions."""),
    ("md", """\
> **Cautions.** The numbers are model values for planning, not a safety assessment. Compressed
> gases and liquids store energy: vessels, lines and relief devices must be rated for the route's
> highest pressure, and a sealed vessel that runs liquid-full can burst on a small warming.
> Cryogenic liquids and dry ice cause cold burns, and trapped cold liquid builds pressure as it
> warms; liquid CO2 let down below its triple-point pressure forms dry-ice snow that can plug lines
> and relief devices. CO2, nitrogen and argon displace air (asphyxiation risk in closed rooms).
> Hot water and steam scald. Follow local codes, the equipment's ratings and licensed practice."""),
    ("md", """\
## Example: charging a CO2 buffer vessel

*Invented scenario.* Kestrel Bay Beverage Co. fills a buffer vessel, tag BV-7, from a vapor header
at −30 °C and 5 bar: the gas is compressed at constant temperature to 40 bar, then warmed at 40 bar
to +20 °C before it goes to the carbonators. Where does it condense and where does it boil again?"""),
    ("code", """\
import phasepath as pp

route = (pp.Route("CO2", T="-30 degC", p="5 bar", title="BV-7 charging")
         .isotherm(p="40 bar")
         .isobar(T="20 degC"))"""),
    ("code", """\
# NBVAL_IGNORE_OUTPUT
planner = pp.widgets.RoutePlanner(route, T_unit="degC", p_unit="bar")
planner"""),
    ("md", """\
The planner's current route and report are plain Python objects: `planner.route`,
`planner.report`. Drawing on the diagram changes them; assigning `planner.route = ...` redraws."""),
    ("code", """\
print(pp.format_report(planner.report, "degC", "bar"))"""),
    ("code", """\
table = planner.crossings_table()  # the same numbers as a DataFrame, in the display units
print(list(table.columns))"""),
    ("md", """\
## Start empty and draw

An empty planner for another substance: click on the diagram to place the start, then click
to add legs."""),
    ("code", """\
# NBVAL_IGNORE_OUTPUT
pp.widgets.RoutePlanner("water", T_unit="degC", p_unit="kPa")"""),
    ("md", """\
## Example: venting a CO2 line through a valve

*Invented scenario.* At the Marrow Creek test bay, a technician plans to vent a short line of
liquid CO2 at 20 °C and 60 bar to atmosphere through a hand valve. The valve is a constant-enthalpy
leg: where does the liquid start to boil, and what leaves the valve at 1 atm?"""),
    ("code", """\
vent = pp.Route("CO2", T="20 degC", p="60 bar", title="Marrow Creek vent").isenthalp(p="1 atm")
vent_planner = pp.widgets.RoutePlanner(vent, T_unit="degC", p_unit="bar")
print(pp.format_report(vent_planner.report, "degC", "bar"))"""),
    ("code", """\
from phasepath import format as F

end = vent_planner.report.legs[0].end
print(f"leaves the valve at {F.quantity(end.T, 'temperature', 'degC')} as {end.phase}: "
      f"solid fraction {F.fraction(end.solid_fraction)} (dry-ice snow), "
      f"vapor fraction {F.fraction(end.vapor_fraction)} by mass")"""),
    ("code", """\
# NBVAL_IGNORE_OUTPUT
vent_planner"""),
    ("md", """\
## A substance built from data

*Invented data.* A solvent known only from three measured vapor pressures between 300 K and 350 K
(no triple or critical point given): once built, it is offered in every planner's substance picker,
and its curve is drawn dotted wherever it rests on no data."""),
    ("code", """\
solvent = pp.Substance.from_data(
    "demo solvent K-12", triple=(180.0, None), critical=(560.0, 4.5e6),
    vapor_points=[(300.0, 5.0e3), (325.0, 1.6e4), (350.0, 4.0e4)])
print(solvent.name in pp.widgets.RoutePlanner("CO2").picker.options)"""),
]


# -- the dry-ice window of a vent line (sweep map) -------------------------------------------------
NOTEBOOKS["dry_ice_window.ipynb"] = [
    ("md", """\
# The dry-ice window of a CO₂ vent line

**Scenario (invented for this demo).** *Harrowgate Cold Chain* vents its CO₂ buffer vessel
**BV-12** to the atmosphere through a hand valve and a short vent line, **VL-4**, before
maintenance. The valve is a throttle: constant enthalpy from the vessel to 1 atm. Let down from
the wrong vessel conditions, the stream leaves the valve as **dry-ice snow** with its vapor, and
the snow can pack the vent line and its silencer. We want the *window*: from which vessel
temperatures and pressures does the valve outlet stay free of solid, and how much solid leaves
it elsewhere?"""),
    ("md", SAFETY.format(hazards=(
        "Vented CO₂ displaces oxygen and can asphyxiate in enclosed or low-lying spaces; dry ice "
        "and the cold vent line cause cold burns; a plugged vent line can let go suddenly; the "
        "vessel is a pressure vessel and must stay within its rating while it is warmed."))),
    ("code", SETUP),
    ("md", """\
## The plan and the sweep

One leg: the valve, from the vessel state to 1 atm. The sweep varies the vessel's temperature
(10 °C to 55 °C) and pressure (50 bar to 110 bar) over a grid of 70 vessel states and analyses
each let-down (``pp.sweep``); one row per state."""),
    ("code", """\
plan = pp.Route("CO2", T="20 degC", p="60 bar", title="BV-12 vent through VL-4").isenthalp(p="1 atm")
sweep = pp.sweep(
    plan,
    start_T=[f"{t} degC" for t in range(10, 56, 5)],
    start_p=[f"{q} bar" for q in range(50, 111, 10)],
    progress=False,
)
print(len(sweep), "vessel states;", (sweep["error"] == "").sum(), "analysed")"""),
    ("md", """\
## Solid fraction at the valve outlet

The mass fraction of dry ice leaving the valve, by vessel temperature (rows) and pressure
(columns); *dry* marks an outlet of vapor only."""),
    ("code", """\
temps = sorted(set(sweep["start_T"]))
pressures = sorted(set(sweep["start_p"]))
print("T [°C] \\\\ p [bar]" + "".join(f"{F.pressure(q, 'bar'):>8}" for q in pressures))
for t in temps:
    cells = []
    for q in pressures:
        row = sweep[(sweep["start_T"] == t) & (sweep["start_p"] == q)].iloc[0]
        x = row["end_solid_fraction"]
        cells.append(f"{'dry' if x != x else F.fraction(x):>8}")
    print(f"{F.temperature(t, 'degC'):>16}" + "".join(cells))"""),
    ("md", """\
## The map

The same sweep on the P–T diagram: each square is a vessel state, coloured by the solid fraction
at the valve outlet. Hover a square for its row; click it to open that let-down in a planner
(with its p–h and T–s views) under the map."""),
    ("code", """\
# NBVAL_IGNORE_OUTPUT
pp.widgets.SweepMap(sweep, color="end_solid_fraction", T_unit="degC", p_unit="bar")"""),
    ("md", """\
The outlet is dry only where the vessel holds warm gas: the let-down then stays on the vapor side
of the two-phase dome and of the sublimation curve. A vessel of liquid, or of dense
supercritical CO₂, throttles into the dome and down to the triple point, where the liquid that
is left freezes: the outlet carries snow. The phase at the outlet, by category:"""),
    ("code", """\
# NBVAL_IGNORE_OUTPUT
pp.widgets.SweepMap(sweep, color="end_phase", T_unit="degC", p_unit="bar")"""),
    ("md", """\
## The operating window

For each vessel pressure, the lowest vessel temperature of the grid from which the outlet is dry,
and the margin that leaves above the vessel's own condensation temperature. We take the window
one grid step (5 K) above that edge."""),
    ("code", """\
co2 = pp.substance("CO2")
window = []
for q in pressures:
    dry = sorted(t for t in temps
                 if (row := sweep[(sweep["start_T"] == t) & (sweep["start_p"] == q)].iloc[0])[
                     "end_phase"] == "vapor")
    if not dry:
        print(f"{F.pressure(q, 'bar')} bar: no dry let-down on this grid")
        continue
    edge = dry[0]
    sat = co2.vapor.temperatures_at(q)[0].root if q < co2.critical[1] else None
    margin = "" if sat is None else f", {F.temperature(edge - sat, 'K')} K above saturation"
    print(f"{F.pressure(q, 'bar')} bar: dry from {F.temperature(edge, 'degC')} °C{margin}")
    window.append((q, edge + 5.0))"""),
    ("md", """\
The window goes into the plan's notes, so that the route file the crew opens in the planner
carries it (``planner.load_route(...)`` shows the notes beside the title)."""),
    ("code", """\
lines = [f"at {F.pressure(q, 'bar')} bar: vent only with the vessel at or above "
         f"{F.temperature(t, 'degC')} °C" for q, t in window]
notes = ("Dry-ice window of VL-4 (from a sweep of vessel states; valve outlet free of solid): "
         + "; ".join(lines) + ". Below it the outlet carries dry-ice snow: do not vent; warm "
         "the vessel first, within its rating.")
vent = pp.Route.from_dict({**plan.to_dict(), "notes": notes})
print(vent.title)
print(vent.notes)"""),
    ("code", """\
# NBVAL_IGNORE_OUTPUT
planner = pp.widgets.RoutePlanner(vent, T_unit="degC", p_unit="bar")
planner"""),
    ("md", """\
**What the map does not say.** The valve is taken as an ideal throttle and the vent line as
adiabatic; a long or cold line, a silencer or a partly open valve change the outlet. The grid is
5 K by 10 bar: confirm the edge with a finer sweep near the chosen window, and follow local codes
and licensed practice for venting CO₂."""),
]


def build(run: bool = True) -> None:
    import nbformat

    for name, cells in NOTEBOOKS.items():
        nb = nbformat.v4.new_notebook()
        nb.metadata["kernelspec"] = {"name": "python3", "display_name": "Python 3",
                                     "language": "python"}
        nb.metadata["language_info"] = {"name": "python"}
        for i, (kind, text) in enumerate(cells):
            cell = (nbformat.v4.new_markdown_cell(text) if kind == "md"
                    else nbformat.v4.new_code_cell(text))
            cell["id"] = f"{Path(name).stem[:20]}-{i:02d}"
            nb.cells.append(cell)
        if run:
            from nbclient import NotebookClient

            NotebookClient(nb, timeout=300, kernel_name="python3",
                           resources={"metadata": {"path": str(HERE)}}).execute()
            for cell in nb.cells:
                cell.get("metadata", {}).pop("execution", None)
        nb.metadata.pop("widgets", None)  # widget state is per run: not a reference output
        nbformat.write(nb, HERE / name)
        print(f"wrote {name}")


if __name__ == "__main__":
    build(run="--no-run" not in sys.argv[1:])
