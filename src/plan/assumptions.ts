/**
 * Every plan parameter with its value (in the plan's output units) and its origin — the plan file, a
 * default, or a demo assumption when the file says `assumptionOrigin: demo` — for the report's
 * assumptions table.
 */

import type { Plan, PointPressure } from "./planFile.js";
import { WEEKDAY_NAMES } from "./planFile.js";
import {
  formatBulkModulus,
  formatEnergy,
  formatExpansion,
  formatFlow,
  formatPressureAbs,
  formatPressureDiff,
  formatPressureGauge,
  formatRate,
  formatTemp,
  formatTime,
  formatVolume,
} from "./quantities.js";
import type { Assumption } from "./results.js";

const clock = (min: number) =>
  `${String(Math.floor(min / 60)).padStart(2, "0")}:${String(min % 60).padStart(2, "0")}`;

export function assumptionsOf(plan: Plan, weekdays: number[]): Assumption[] {
  const u = plan.units;
  const out: Assumption[] = [];
  const add = (path: (string | number)[], label: string, text: string, keyPath?: string) => {
    const sp = text.indexOf(" ");
    const numeric = sp > 0 && /^[-+\d.]/.test(text) && !text.includes(",") && !text.includes("@");
    out.push({
      key: keyPath ?? path.join("."),
      label,
      value: numeric ? text.slice(0, sp) : text,
      unit: numeric ? text.slice(sp + 1) : "",
      origin: plan.has(path)
        ? plan.assumptionOrigin === "demo"
          ? "demo assumption"
          : "plan file"
        : "default",
    });
  };
  const pp = (p: PointPressure) => (p.isGauge ? formatPressureGauge(p.pa, u) : formatPressureAbs(p.pa, u));

  add(["units"], "Output units", u);
  add(["seed"], "Seed of the random inputs", String(plan.seed));
  const c = plan.climate;
  add(["climate", "paths"], "Climate files and folders", c.paths.join(", "));
  add(
    ["climate", "years"],
    "Climate years",
    c.years ? `${c.years.from}–${c.years.to}` : "every year in the data",
  );
  add(["climate", "gapHours"], "Longest gap filled linearly", `${c.gapHours} h`);
  add(["climate", "minYearShare"], "Share of hours for a year to count", `${c.minYearShare * 100} %`);
  add(["climate", "minYears"], "Usable years below which a base is flagged", String(c.minYears));
  add(["climate", "cacheDir"], "Climate cache folder", c.cacheDir ?? "<out>/.cache/climate");
  add(["climate", "stationHistory"], "Station-history list", c.stationHistory ?? "none");
  add(["schedule"], "Schedule file", plan.schedule ?? "given on the command line");

  plan.bases.forEach((b, i) => {
    const k = (...rest: (string | number)[]) => ["bases", i, ...rest];
    const key = (rest: string) => `bases.${b.name}.${rest}`;
    add(k("stations"), `${b.name}: stations (priority order)`, b.stations.join(", "), key("stations"));
    if (b.hangar) {
      add(
        k("hangar", "temperature"),
        `${b.name}: hangar temperature`,
        formatTemp(b.hangar.temperature, u),
        key("hangar.temperature"),
      );
      add(k("hangar", "in"), `${b.name}: into the hangar`, clock(b.hangar.in), key("hangar.in"));
      add(k("hangar", "out"), `${b.name}: out of the hangar`, clock(b.hangar.out), key("hangar.out"));
    } else {
      add(k("hangar"), `${b.name}: overnight hangar`, "none", key("hangar"));
    }
  });

  plan.profiles.forEach((p, i) => {
    const k = (...rest: (string | number)[]) => ["profiles", i, ...rest];
    const a = (path: (string | number)[], label: string, text: string) =>
      add(k(...path), `${p.name}: ${label}`, text, `profiles.${p.name}.${path.join(".")}`);
    a(
      ["accumulator", "gasVolumeEmpty"],
      "gas volume at 0 % (V0)",
      formatVolume(p.accumulator.gasVolumeEmpty, u),
    );
    a(
      ["accumulator", "gasVolumeFull"],
      "gas volume at 100 % (Vmin)",
      formatVolume(p.accumulator.gasVolumeFull, u),
    );
    a(
      ["precharge", "reference"],
      "precharge reference",
      `${pp(p.precharge.reference.pressure)} @ ${formatTemp(p.precharge.reference.tempK, u)}`,
    );
    a(["precharge", "tolerance"], "precharge tolerance (±)", formatPressureDiff(p.precharge.tolerance, u));
    a(["system", "low"], "system pressure, low", pp(p.system.low));
    a(["system", "nominal"], "system pressure, nominal", pp(p.system.nominal));
    a(["system", "high"], "system pressure, high", pp(p.system.high));
    a(["fluid", "expansionPerK"], "fluid volumetric expansion", formatExpansion(p.fluid.expansionPerK, u));
    a(["fluid", "bulkModulus"], "fluid bulk modulus", formatBulkModulus(p.fluid.bulkModulus, u));
    a(["fluid", "lineVolume"], "trapped line fluid volume", formatVolume(p.fluid.lineVolume, u));
    a(["thermalTimeConstant"], "thermal time constant", formatTime(p.thermalTimeConstant));
    a(["gasLoss", "rate"], "gas loss rate (median)", formatRate(p.gasLoss.rate, u));
    a(["gasLoss", "spread"], "gas loss spread (σ of ln rate)", String(p.gasLoss.spread));
    a(["starter", "minUsefulPressure"], "starter minimum useful pressure", pp(p.starter.minUsefulPressure));
    a(["starter", "returnPressure"], "starter return pressure", pp(p.starter.returnPressure));
    a(["starter", "expansion"], "gas expansion during a start", p.starter.expansion);
    p.startEnergy.forEach((r, j) => {
      a(["startEnergy", j], `required start energy at ${formatTemp(r.ambient, u)}`, formatEnergy(r.energy));
    });
    p.pump.curve.forEach((r, j) => {
      a(["pump", "curve", j], `pump flow at ${pp(r.pressure)}`, formatFlow(r.flow, u));
    });
    a(["pump", "timer"], "pump run timer", formatTime(p.pump.timer));
    a(["handPump", "displacement"], "hand-pump displacement", formatVolume(p.handPump.displacement, u));
    a(["handPump", "efficiency"], "hand-pump volumetric efficiency", String(p.handPump.efficiency));
    a(["coldStartOption", "count"], "cold-start option: accumulators", String(p.coldStartOption.count));
    a(["coldStartOption", "timer"], "cold-start option: pump run timer", formatTime(p.coldStartOption.timer));
  });

  const o = plan.operations;
  add(["operations", "startTimes"], "Start times (local)", o.startTimes.map(clock).join(", "));
  add(
    ["operations", "weekdays"],
    "Weekdays flown",
    `${weekdays.map((d) => WEEKDAY_NAMES[d - 1]).join(", ")}${typeof o.weekdays === "number" ? ` (${o.weekdays} drawn from the seed)` : ""}`,
  );
  add(["operations", "prechargeCheckDays"], "Precharge check interval", `${o.prechargeCheckDays} days`);
  add(["operations", "outOfBand"], "Action on an out-of-band preflight", o.outOfBand);
  const n = plan.nitrogen;
  add(
    ["nitrogen", "cylinder", "waterVolume"],
    "Cylinder water volume",
    formatVolume(n.cylinder.waterVolume, u),
  );
  add(
    ["nitrogen", "cylinder", "fill"],
    "Cylinder fill",
    `${pp(n.cylinder.fill.pressure)} @ ${formatTemp(n.cylinder.fill.tempK, u)}`,
  );
  add(
    ["nitrogen", "transferDifferential"],
    "Transfer differential",
    formatPressureDiff(n.transferDifferential, u),
  );
  add(["nitrogen", "hoseVolume"], "Hose volume vented per disconnect", formatVolume(n.hoseVolume, u));
  add(["nitrogen", "cylindersPerCart"], "Cylinders per cart", String(n.cylindersPerCart));
  add(
    ["thresholds", "shortStartsPct"],
    "Share of starts short that calls for the option",
    `${plan.thresholds.shortStartsPct} %`,
  );
  return out;
}
