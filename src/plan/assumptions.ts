/**
 * Every plan parameter as data for results.json: its value in the fixed JSON units (°C, kPa gauge, L,
 * J, …; plain numbers as they are), its quantity kind, the text exactly as written in the plan file
 * (null for a default) and its origin — the plan file, a default, or a demo assumption when the file
 * says `assumptionOrigin: demo`. Nothing is formatted here: the report and assumptions.csv show the
 * written text, or a default in the plan's units.
 */

import { JSON_UNITS, kToC, type QuantityKind, type QuantityValue, toJsonUnit } from "../units/index.js";
import { MONTH_NAMES } from "./calendar.js";
import { coldThresholdsK } from "./climateDesign.js";
import type { Plan, PointPressure } from "./planFile.js";
import { WEEKDAY_NAMES } from "./planFile.js";
import type { Assumption } from "./results.js";

const clock = (min: number) =>
  `${String(Math.floor(min / 60)).padStart(2, "0")}:${String(min % 60).padStart(2, "0")}`;

type Path = (string | number)[];

export function assumptionsOf(plan: Plan, weekdays: number[]): Assumption[] {
  const out: Assumption[] = [];
  const origin = (path: Path): Assumption["origin"] =>
    plan.has(path) ? (plan.assumptionOrigin === "demo" ? "demo assumption" : "plan file") : "default";
  /** One assumption; `si` numbers are converted into the kind's JSON unit. */
  const add = (
    path: Path,
    label: string,
    kind: QuantityKind,
    si: QuantityValue,
    more: { key?: string; unit?: string; atTempK?: number } = {},
  ) => {
    out.push({
      key: more.key ?? path.join("."),
      label,
      kind,
      value: typeof si === "number" ? toJsonUnit(kind, si) : si,
      unit: more.unit ?? JSON_UNITS[kind].unit,
      ...(more.atTempK === undefined ? {} : { atTempC: kToC(more.atTempK) }),
      text: plan.written(path),
      origin: origin(path),
    });
  };
  const pressureKind = (p: PointPressure): QuantityKind => (p.isGauge ? "pressureGauge" : "pressureAbsolute");

  add(["units"], "Output units", "text", plan.units);
  add(["seed"], "Seed of the random inputs", "number", plan.seed);
  const c = plan.climate;
  add(["climate", "paths"], "Climate files and folders", "text", c.paths);
  if (c.years) {
    add(["climate", "years", "from"], "First climate year", "year", c.years.from);
    add(["climate", "years", "to"], "Last climate year", "year", c.years.to);
  } else {
    add(["climate", "years"], "Climate years", "text", "every year in the data");
  }
  add(["climate", "gapHours"], "Longest gap filled linearly", "count", c.gapHours, { unit: "h" });
  add(["climate", "minYearShare"], "Share of hours for a year to count (0–1)", "fraction", c.minYearShare);
  add(["climate", "minYears"], "Usable years below which a base is flagged", "count", c.minYears);
  add(["climate", "cacheDir"], "Climate cache folder", "text", c.cacheDir ?? "<out>/.cache/climate");
  add(["climate", "stationHistory"], "Station-history list", "text", c.stationHistory ?? "none");
  coldThresholdsK(plan).forEach((k, j) => {
    add(
      ["climate", "coldThresholds", j],
      `Design temperatures: hours below, threshold ${j + 1}`,
      "temperature",
      k,
    );
  });
  add(["schedule"], "Schedule file", "text", plan.schedule ?? "given on the command line");

  plan.bases.forEach((b, i) => {
    const at = (...rest: Path) => ["bases", i, ...rest];
    const key = (rest: string) => ({ key: `bases.${b.name}.${rest}` });
    add(at("stations"), `${b.name}: stations (priority order)`, "text", b.stations, key("stations"));
    if (b.hangar) {
      const h = b.hangar;
      add(at("hangar", "kind"), `${b.name}: hangar kind`, "text", h.kind, key("hangar.kind"));
      if (h.kind === "heated") {
        add(at("hangar", "heatedTo"), `${b.name}: hangar heated to at least`, "temperature", h.heatedTo, {
          ...key("hangar.heatedTo"),
        });
      } else {
        const lag = `${b.name}: shelter air's time constant behind the outdoor air`;
        add(at("hangar", "timeConstant"), lag, "duration", h.timeConstant, key("hangar.timeConstant"));
        const offset = `${b.name}: shelter air's offset from the lagged outdoor air`;
        add(at("hangar", "offset"), offset, "temperatureDifference", h.offset, key("hangar.offset"));
      }
      add(at("hangar", "in"), `${b.name}: into the hangar`, "localTime", clock(h.in), key("hangar.in"));
      add(at("hangar", "out"), `${b.name}: out of the hangar`, "localTime", clock(h.out), key("hangar.out"));
      const months = h.months === null ? "all year" : h.months.map((m) => MONTH_NAMES[m - 1]!);
      add(
        at("hangar", "months"),
        `${b.name}: months the hangar is used`,
        "text",
        months,
        key("hangar.months"),
      );
    } else {
      add(at("hangar"), `${b.name}: overnight hangar`, "text", "none", key("hangar"));
    }
  });

  plan.profiles.forEach((p, i) => {
    const a = (path: Path, label: string, kind: QuantityKind, si: QuantityValue, atTempK?: number) =>
      add(["profiles", i, ...path], `${p.name}: ${label}`, kind, si, {
        key: `profiles.${p.name}.${path.join(".")}`,
        ...(atTempK === undefined ? {} : { atTempK }),
      });
    const pressure = (path: Path, label: string, x: PointPressure, atTempK?: number) =>
      a(path, label, pressureKind(x), x.pa, atTempK);
    a(["accumulator", "gasVolumeEmpty"], "gas volume at 0 % (V0)", "volume", p.accumulator.gasVolumeEmpty);
    a(["accumulator", "gasVolumeFull"], "gas volume at 100 % (Vmin)", "volume", p.accumulator.gasVolumeFull);
    const ref = p.precharge.reference;
    pressure(["precharge", "reference"], "precharge reference", ref.pressure, ref.tempK);
    a(["precharge", "tolerance"], "precharge tolerance (±)", "pressureDifference", p.precharge.tolerance);
    pressure(["system", "low"], "system pressure, low", p.system.low);
    pressure(["system", "nominal"], "system pressure, nominal", p.system.nominal);
    pressure(["system", "high"], "system pressure, high", p.system.high);
    if (p.reliefPressure === undefined) a(["reliefPressure"], "thermal relief pressure", "text", "none");
    else pressure(["reliefPressure"], "thermal relief pressure", p.reliefPressure);
    a(["fluid", "expansionPerK"], "fluid volumetric expansion", "expansion", p.fluid.expansionPerK);
    a(["fluid", "bulkModulus"], "fluid bulk modulus", "pressureDifference", p.fluid.bulkModulus);
    a(["fluid", "lineVolume"], "trapped line fluid volume", "volume", p.fluid.lineVolume);
    a(["thermalTimeConstant"], "thermal time constant", "duration", p.thermalTimeConstant);
    a(["gasLoss", "rate"], "gas loss rate (median)", "pressureRate", p.gasLoss.rate);
    a(["gasLoss", "spread"], "gas loss spread (σ of ln rate)", "number", p.gasLoss.spread);
    pressure(
      ["starter", "minUsefulPressure"],
      "starter minimum useful pressure",
      p.starter.minUsefulPressure,
    );
    pressure(["starter", "returnPressure"], "starter return pressure", p.starter.returnPressure);
    a(["starter", "expansion"], "gas expansion during a start", "text", p.starter.expansion);
    p.startEnergy.forEach((r, j) => {
      a(
        ["startEnergy", j, "ambient"],
        `start energy table, row ${j + 1}: air temperature`,
        "temperature",
        r.ambient,
      );
      a(
        ["startEnergy", j, "energy"],
        `start energy table, row ${j + 1}: energy required`,
        "energy",
        r.energy,
      );
    });
    p.pump.curve.forEach((r, j) => {
      pressure(["pump", "curve", j, "pressure"], `pump curve, row ${j + 1}: pressure`, r.pressure);
      a(["pump", "curve", j, "flow"], `pump curve, row ${j + 1}: flow`, "flow", r.flow);
    });
    a(["pump", "timer"], "pump run timer", "duration", p.pump.timer);
    a(["handPump", "displacement"], "hand-pump displacement", "volume", p.handPump.displacement);
    a(["handPump", "efficiency"], "hand-pump volumetric efficiency (0–1)", "fraction", p.handPump.efficiency);
    a(["coldStartOption", "count"], "cold-start option: accumulators", "count", p.coldStartOption.count);
    a(["coldStartOption", "timer"], "cold-start option: pump run timer", "duration", p.coldStartOption.timer);
  });

  const o = plan.operations;
  add(["operations", "startTimes"], "Start times (local)", "localTime", o.startTimes.map(clock));
  add(
    ["operations", "weekdays"],
    "Weekdays flown",
    "weekday",
    weekdays.map((d) => WEEKDAY_NAMES[d - 1]!),
  );
  add(["operations", "prechargeCheckDays"], "Precharge check interval", "count", o.prechargeCheckDays, {
    unit: "d",
  });
  add(["operations", "outOfBand"], "Action on an out-of-band preflight", "text", o.outOfBand);
  add(["operations", "arrival"], "Accumulator state on arrival at a base", "text", o.arrival);
  const n = plan.nitrogen;
  add(["nitrogen", "cylinder", "waterVolume"], "Cylinder water volume", "volume", n.cylinder.waterVolume);
  const fill = n.cylinder.fill;
  add(["nitrogen", "cylinder", "fill"], "Cylinder fill", pressureKind(fill.pressure), fill.pressure.pa, {
    atTempK: fill.tempK,
  });
  add(
    ["nitrogen", "transferDifferential"],
    "Transfer differential",
    "pressureDifference",
    n.transferDifferential,
  );
  add(["nitrogen", "hoseVolume"], "Hose volume vented per disconnect", "volume", n.hoseVolume);
  add(["nitrogen", "cylindersPerCart"], "Cylinders per cart", "count", n.cylindersPerCart);
  add(
    ["nitrogen", "unscheduledRechargesPerAircraftMonth"],
    "Unscheduled full recharges (Poisson rate)",
    "number",
    n.unscheduledRechargesPerAircraftMonth,
    { unit: "per aircraft-month" },
  );
  if (n.otherUse) {
    add(
      ["nitrogen", "otherUse", "amount"],
      "Other uses of the carts, per aircraft",
      "mass",
      n.otherUse.amount,
    );
    add(["nitrogen", "otherUse", "per"], "Other uses: amount per", "text", n.otherUse.per);
  } else {
    add(["nitrogen", "otherUse"], "Other uses of the carts", "text", "none");
  }
  const stock = n.stock;
  if (stock) {
    for (const [key, label, kind, unit] of [
      ["cylinders", "full cylinders shipped", "count", ""],
      ["resupplyEvery", "top-up interval", "duration", undefined],
    ] as const) {
      const v = stock[key];
      if (v === undefined) continue;
      const more = unit === undefined ? {} : { unit };
      if (typeof v === "number") {
        add(["nitrogen", "stock", key], `Stock at each base: ${label}`, kind, v, more);
        continue;
      }
      for (const [base, x] of Object.entries(v)) {
        add(["nitrogen", "stock", key, base], `Stock at ${base}: ${label}`, kind, x, more);
      }
    }
  } else {
    add(["nitrogen", "stock"], "Stock of cylinders per base", "text", "none");
  }
  add(["whatIf"], "What-if variants", "text", plan.whatIf ?? "none listed (--what-if runs every variant)");
  add(
    ["thresholds", "shortStartsPct"],
    "Share of starts short that calls for the option",
    "percent",
    plan.thresholds.shortStartsPct,
  );
  add(
    ["thresholds", "outOfBandPct"],
    "Share of first preflights out of band (below + above) that calls for a watch",
    "percent",
    plan.thresholds.outOfBandPct,
  );
  return out;
}
