/** The methods the report lists (docs/methods.md §3; docs/methods.md §5), each with its published source or where it is defined. */
import type { MethodNote } from "./results.js";
import { QUANTILE_METHOD } from "./stats.js";

export const METHODS: MethodNote[] = [
  {
    name: "Nitrogen equation of state",
    source: "Span, Lemmon, Jacobsen, Wagner & Yokozeki (2000), J. Phys. Chem. Ref. Data 29(6):1361",
    description:
      "Reference Helmholtz equation for nitrogen; the simulation uses an interpolation table of it (error below 0.05 %). The ideal comparison keeps the real cp0(T) and drops the residual part.",
  },
  {
    name: "Atmospheric pressure",
    source: "ISO 2533:1975 standard atmosphere (troposphere)",
    description:
      "Gauge = absolute − local atmospheric pressure: the primary station's mean reported station pressure where the records carry it, else the standard atmosphere at the station elevation; the value and its source are shown with each base, whose simulation and curves use it. The profile-level curves without a base (profiles in results.json, precharge_line.csv, band.csv) use 101.325 kPa.",
  },
  {
    name: "Accumulator temperature",
    source:
      "First-order lag (lumped capacitance), exact solution for an ambient linear in time over each step (docs/methods.md §3)",
    description:
      "T ← Ta(end) − r·τ + (T − Ta(start) + r·τ)·exp(−Δt/τ), with r the slope of the ambient (or hangar) temperature over the step, linear between grid hours; on a steady ramp the accumulator trails the air by τ. A data gap holds the last known value (r = 0); τ = 0 gives the ambient.",
  },
  {
    name: "Hangars",
    source: "coldsoak hangar model (docs/methods.md §3); first-order lag as for the accumulator",
    description:
      "During a base's hangar hours (optionally only some months; a night goes with its evening's month) the air around the aircraft is the hangar's: a heated hangar is max(outdoor air, set point); an unheated shelter follows the outdoor air through its own first-order lag (default 6 h, exact update) plus an optional offset, simulated continuously from the start of the stay's window, also while the aircraft is out.",
  },
  {
    name: "Trapped charge",
    source:
      "Linear thermal expansion and bulk modulus of the trapped fluid (textbook fluid mechanics); gas from Span et al. (2000)",
    description:
      "Between recharges the fluid is trapped: V_f = V_f,c·(1 + α(T − T_c) − (P − P_c)/K); gas volume plus fluid volume constant; gas loss lowers the amount continuously.",
  },
  {
    name: "Thermal relief",
    source: "Trapped-fluid model with a relief valve (docs/methods.md §3); gas from Span et al. (2000)",
    description:
      "Where the trapped fluid pressure would exceed the profile's relief pressure, fluid is let out and the pressure holds at the relief value; the fluid relieved is lost until the next recharge and the relief state becomes the fluid's reference, so the next cold morning reads lower. Checked at the end of every step (at least hourly); consecutive steps with the valve open are one opening. Without a relief valve a warning names each base-month where the trapped pressure exceeds 1.1 × the system high.",
  },
  {
    name: "Arrival",
    source: "coldsoak arrival states (docs/methods.md §5)",
    description:
      "The accumulator arrives with its gas on the precharge reference, in the plan's arrival state: charged (default) to nominal system pressure at the ambient of local midnight on the arrival day, then trapped; or precharge-only, the fluid side empty until the hand pump charges it to nominal system pressure at the first start, its strokes counted.",
  },
  {
    name: "Preflight and servicing",
    source: "coldsoak servicing model (docs/methods.md §5)",
    description:
      "The reading (physics at the lagged accumulator temperature) is compared with the band for the ambient temperature a technician reads. Servicing sets the gas, on the fluid-side stop, to the precharge line for the ambient temperature while the gas is at the lagged temperature; the hand pump then recharges to nominal system pressure.",
  },
  {
    name: "Start energy",
    source:
      "Isentropic real-gas expansion (Span et al. 2000) or isothermal; first law, gas work = internal-energy drop",
    description:
      "Hydraulic energy ∫(P − P_return) dV until the piston reaches its stop or the pressure falls to the starter's minimum; n identical units deliver n times one unit's energy. The requirement is interpolated linearly in ambient temperature and held beyond the table's ends. Every stay is judged in both configurations: “one accumulator” is a single unit recharged within the pump's own timer, “two accumulators” is the cold-start option (its count of units sharing the pump, within the option's timer). The configuration the stay has fitted is simulated; the other follows it as a shadow charge with the same accumulator temperature, gas amount and servicing but its own discharges and timer-limited recharges. The two energies differ by more than the unit count only when a timer stops a recharge short.",
  },
  {
    name: "Recharge",
    source: "Pump flow-versus-pressure table, isothermal compression (Span et al. 2000 for the gas)",
    description:
      "The pump recharges within its run timer (the option's timer when fitted); the charge stays where the timer leaves it.",
  },
  {
    name: "Overnight drop",
    source: "coldsoak definition (docs/methods.md §5)",
    description:
      "Value at the day's last recharge − value at the next day's first preflight (only when the next calendar day is flown), assigned to the morning's local month, for accumulator temperature, gas pressure and reading.",
  },
  {
    name: "Quantiles",
    source: "Hyndman & Fan (1996), The American Statistician 50(4):361",
    description: `One method everywhere: ${QUANTILE_METHOD}.`,
  },
  {
    name: "1-in-10-year coldest morning",
    source:
      "Gumbel (1958) Statistics of Extremes; method of moments as in Chow, Maidment & Mays (1988) Applied Hydrology §12.2",
    description:
      "Gumbel distribution fitted by the method of moments to the negated annual minima of the first-preflight ambient temperature (one value per climate year the stays map onto); needs two or more years. With n years of record the coldest observed morning is itself roughly a 1-in-n-year value, so the fitted 1-in-10-year value may lie a little above or below it.",
  },
  {
    name: "Nitrogen cylinders",
    source: "Cascade transfer between cylinders and accumulator, isothermal (Span et al. 2000 for the gas)",
    description:
      "Per base and climate year the servicings of all stays draw, in time order, from one pool of cylinders, lowest pressure first, isothermal at the site temperature; a new full cylinder is opened when the pool cannot reach the target; the hose is vented at each disconnect. Quantiles are over climate years.",
  },
  {
    name: "Climate years",
    source: "Past years of NOAA Integrated Surface Data as samples of the weather a stay may meet",
    description:
      "Each stay's month-day window is mapped onto every year of record (a window across 31 December runs into the next year; a real 29 February folds onto 28 February when the climate year has none). All stays at a base share one mapping: the earliest arrival year there maps onto the sample year and each later real year onto the following climate year, so stays that overlap in real time see the same weather in every sample. A sample is labelled by the climate year its earliest real year maps onto. A year counts at a base when every stay there has at least the plan's share of its window hours present after gap filling.",
  },
];
