/** The methods the report lists (docs/methods.md §3, §5, §7), each with its published source or where it is defined. */
import type { MethodNote } from "./results.js";
import { QUANTILE_METHOD } from "./stats.js";
import { VARIANT_DESCRIPTIONS } from "./whatIfVariants.js";

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
    name: "Break-even temperatures and design point",
    source:
      "Start energy as above (Span et al. 2000, isentropic); bisection root finding (simple-statistics) on the real-gas model (docs/methods.md, “Break-even temperatures”)",
    description:
      "For one accumulator and the option's count, with the gas amount on the low, nominal or high precharge line and charged to the low or nominal system pressure: the start energy at equilibrium (accumulator at the ambient) and after the base's typical (median) and P90 overnight drop of the accumulator temperature (charged that much warmer, fluid trapped, cooled), against the requirement. A break-even temperature is the ambient below which a case falls short: a scan every 4 K (and at the requirement table's rows) brackets the warmest crossing with a shortfall on its cold side, and bisection narrows it to 0.0001 K; without a crossing in the band command's range it is none, short everywhere or never short (judged at the cold end). The cold design point is the base's 1-in-10-year coldest morning.",
  },
  {
    name: "Climate design temperatures",
    source:
      "ASHRAE Handbook — Fundamentals, chapter “Climatic Design Information” (from memory); Hyndman & Fan (1996) type 7",
    description:
      "From a base's hourly series (filled hours included) over the plan's climate years in local time, a year counting when the plan's share of its hours holds a value (a month likewise for the monthly values): the annual 99.6 % and 99 % cold dry-bulb temperatures (the 0.4 % and 1 % quantiles of all hours of the years), each month's 1 % value and the coldest month's (lowest mean), the coldest hour of each year with its mean and 1-in-10 and 1-in-30-year values (Gumbel as for the coldest morning, bootstrap intervals), and the hours per year below the plan's cold thresholds with the longest run of consecutive hours below each (a missing hour ends a run).",
  },
  {
    name: "What-if variants",
    source: "coldsoak what-if runs (docs/methods.md, “What-if variants”)",
    description: `Each variant is the plan simulated again over the same climate years, judged on each base's worst month (the highest share of starts short with one accumulator as planned; the first on ties) by the change, in percentage points, of the shares short with one and with two accumulators and out of band. The variants: ${VARIANT_DESCRIPTIONS.map((v) => `${v.label} (${v.description})`).join("; ")}. “One” and “two” follow both configurations in every run, so the cold-start option on every aircraft changes them only through the fitted configuration's longer recharge timer and its trapped charge.`,
  },
  {
    name: "Quantiles",
    source: "Hyndman & Fan (1996), The American Statistician 50(4):361",
    description: `One method everywhere: ${QUANTILE_METHOD}.`,
  },
  {
    name: "1-in-10 and 1-in-30-year coldest morning",
    source:
      "Gumbel (1958) Statistics of Extremes; method of moments as in Chow, Maidment & Mays (1988) Applied Hydrology §12.2",
    description:
      "Gumbel distribution fitted by the method of moments to the negated annual minima of the first-preflight ambient temperature (one value per climate year the stays map onto); needs two or more years. With n years of record the coldest observed morning is itself roughly a 1-in-n-year value, so the fitted values may lie a little above or below it; a 1-in-30-year value from fewer than 30 years is an extrapolation, and the report says from how many years it comes. Both carry a 90 % bootstrap interval over climate years.",
  },
  {
    name: "Confidence over climate years",
    source:
      "Nonparametric bootstrap, Efron (1979) Annals of Statistics 7(1):1; percentile interval, Efron & Tibshirani (1993) An Introduction to the Bootstrap, ch. 13",
    description:
      "Every share that drives a status (short starts with one and with two accumulators, first preflights below and above the band) is given with its minimum, median and maximum across climate years and a 90 % interval: climate years are resampled with replacement (2000 resamples, seeded, on streams of their own), the pooled share — events over counts of the resampled years — is recomputed on each resample, and the interval is its 5 % and 95 % type-7 quantiles. The 1-in-10 and 1-in-30-year values are refitted on each resample of the annual minima.",
  },
  {
    name: "Statuses and aircraft actions",
    source: "coldsoak decision rules (docs/methods.md §6)",
    description:
      "A base-month is judged from the aircraft there, each with its own configuration: act when one without the cold-start option has more than the short-start threshold of its starts short with one accumulator, or one with the option still has with two; else watch when more than the out-of-band threshold of first preflights read below or above the band; else OK. No stay: no aircraft there; no data: aircraft there but no usable climate year covers their stay (a month with both says “part no data” and is judged from the covered stays); low confidence: fewer usable years than climate.minYears (the fewest among the stays there). Each stay gets an action from its own months: fit the option before arrival (needed from the first day of the first month above the threshold with one accumulator; not needed from the first day of the month after the last), fitted and needed, fitted and not needed, fitted but still short (hangar or a later first start), keep as is, or no data. Planning estimates, never instructions: fitting or removing equipment follows the approved data.",
  },
  {
    name: "Nitrogen demand",
    source:
      "coldsoak demand model (docs/methods.md §7); Poisson counts by inversion, Devroye (1986) Non-Uniform Random Variate Generation, ch. X",
    description:
      "Servicing by the operations policy as simulated; unscheduled full recharges, a seeded Poisson count per stay (rate per aircraft-month × the stay's months, days uniform over the stay), each one accumulator from vented (local atmosphere) to the precharge line at the day's site temperature; other uses of the carts per aircraft per flown day or week. The two added items are built from the stays' days and the climate, outside the hour-by-hour simulation. Site temperature: the day's mean outdoor temperature. Samples: climate years × 20 draws of the seeded events (1 without unscheduled recharges).",
  },
  {
    name: "Nitrogen cylinders",
    source: "Cascade transfer between cylinders and accumulator, isothermal (Span et al. 2000 for the gas)",
    description:
      "Per base and sample the demand events of all stays draw, in time order, from one pool of cylinders, lowest pressure first, isothermal at the site temperature; a new full cylinder is opened when the pool cannot meet an event; the hose is vented at each disconnect; other uses draw down to the spent pressure. A cylinder is spent below the lowest precharge target plus the transfer differential; usable gas = fill − residual at that pressure. Drawn from cylinders = added to accumulators + vented from hoses + given to other uses; gas released from accumulators is shown apart. Quantiles are over the samples.",
  },
  {
    name: "Nitrogen stock and fleet",
    source: "coldsoak stock and roll-up rules (docs/methods.md §7)",
    description:
      "Stock line: cylinders shipped × usable gas per cylinder at the day's site temperature; the stock runs out at P90 on the first day the P90 demand since the last top-up exceeds it. Fleet demand: quantiles of the fleet total per climate year and draw, all bases on one real-time mapping onto the climate years; fleet cylinders and carts: sums of the bases' own counts.",
  },
  {
    name: "Climate years",
    source: "Past years of NOAA Integrated Surface Data as samples of the weather a stay may meet",
    description:
      "Each stay's month-day window is mapped onto every year of record (a window across 31 December runs into the next year; a real 29 February folds onto 28 February when the climate year has none). All stays at a base share one mapping: the earliest arrival year there maps onto the sample year and each later real year onto the following climate year, so stays that overlap in real time see the same weather in every sample. A sample is labelled by the climate year its earliest real year maps onto. A year counts for a stay when its window on that year has at least the plan's share of its hours present after gap filling; each stay uses its own usable years, and a year is a sample of the base when it counts for any stay there.",
  },
];
