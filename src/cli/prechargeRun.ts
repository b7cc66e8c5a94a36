import { InputError } from "../errors.js";
import { standardAtmospherePa } from "../physics/atmosphere.js";
import { idealGas, N2_CRITICAL_TEMP_K, N2_MAX_TEMP_K, realGas } from "../physics/nitrogen.js";
import {
  absPa,
  formatDisplay,
  kToC,
  PA_PER_BAR,
  PA_PER_KPA,
  PA_PER_PSI,
  parsePressureAt,
  parseTemperatureK,
  SI_UNITS,
  showWithUnit,
  US_UNITS,
} from "../units/index.js";
import { parseOption } from "./options.js";

const PRESSURE_UNITS = "psig psia bar barg bara kPa kPag kPaa MPa MPag MPaa";
const REF_EXAMPLE = `--ref 1450psig@70F (units: ${PRESSURE_UNITS}; F C K)`;
const AT_EXAMPLE = "--at 50F (units: F C K)";

export interface PrechargeAnswer {
  refAbsPa: number;
  refIsGauge: boolean;
  refTempK: number;
  atTempK: number;
  atmPa: number;
  elevationM: number;
  realAbsPa: number;
  idealAbsPa: number;
}

function optionError(option: string, message: string): InputError {
  return new InputError(`${option}: ${message}`);
}

/** Checks that nitrogen at this temperature is one gas phase within the equation's range. */
function checkTempRange(option: string, text: string, tempK: number): void {
  // Above the critical temperature nitrogen is a single gas phase at every pressure, so "the pressure
  // of this gas amount at T" has one answer; below it the charge may condense (Span et al. 2000).
  if (!(tempK > N2_CRITICAL_TEMP_K && tempK <= N2_MAX_TEMP_K)) {
    throw optionError(
      option,
      `${text} is outside ${kToC(N2_CRITICAL_TEMP_K).toFixed(2)} to ${kToC(N2_MAX_TEMP_K)} °C: expected a temperature above nitrogen's critical temperature (${N2_CRITICAL_TEMP_K} K, where colder gas may liquefy) and within the equation's upper limit (${N2_MAX_TEMP_K} K)`,
    );
  }
}

/** Parses the options and computes the precharge at the new temperature with both gas models. */
export function prechargeAnswer(refText: string, atText: string, elevationText = "0"): PrechargeAnswer {
  const ref = parseOption("--ref", REF_EXAMPLE, parsePressureAt, refText);
  checkTempRange("--ref", refText, ref.tempK);
  const { pressure, tempK: refTempK } = ref;
  const atTempK = parseOption("--at", AT_EXAMPLE, parseTemperatureK, atText);
  checkTempRange("--at", atText, atTempK);
  const elevationM = Number(elevationText);
  if (elevationText.trim() === "" || !Number.isFinite(elevationM)) {
    throw optionError("--elevation", `"${elevationText}" is not a number of metres, e.g. --elevation 1500`);
  }
  let atmPa: number;
  try {
    atmPa = standardAtmospherePa(elevationM);
  } catch (err) {
    // The atmosphere model names its own parameter ("elevationM: ..."); the user typed --elevation.
    const msg = err instanceof Error ? err.message : String(err);
    throw optionError("--elevation", msg.replace(/^elevationM:\s*/, ""));
  }
  const refAbsPa = absPa(pressure, atmPa);
  if (!(refAbsPa > 0)) {
    throw optionError(
      "--ref",
      `${refText} is not above absolute zero pressure (local atmosphere ${atmPa.toFixed(0)} Pa)`,
    );
  }
  if (refAbsPa > 100e6)
    throw optionError("--ref", `${refText} is above 100 MPa, not an accumulator precharge`);
  const solve = (model: typeof realGas): number =>
    model.pressurePa(model.densityMolM3(refAbsPa, refTempK), atTempK);
  return {
    refAbsPa,
    refIsGauge: pressure.isGauge,
    refTempK,
    atTempK,
    atmPa,
    elevationM,
    realAbsPa: solve(realGas),
    idealAbsPa: solve(idealGas),
  };
}

const round = (x: number, digits: number): number => {
  const f = 10 ** digits;
  return Math.round(x * f) / f;
};

/** The `--json` object: gauge pressures at the local atmosphere, temperature in °C. */
export function prechargeJson(a: PrechargeAnswer): {
  realPsig: number;
  idealPsig: number;
  realKPaGauge: number;
  idealKPaGauge: number;
  atTempC: number;
} {
  return {
    realPsig: round((a.realAbsPa - a.atmPa) / PA_PER_PSI, 3),
    idealPsig: round((a.idealAbsPa - a.atmPa) / PA_PER_PSI, 3),
    realKPaGauge: round((a.realAbsPa - a.atmPa) / PA_PER_KPA, 2),
    idealKPaGauge: round((a.idealAbsPa - a.atmPa) / PA_PER_KPA, 2),
    atTempC: round(kToC(a.atTempK), 3),
  };
}

/** A temperature in both display systems: "70.0 °F (21.1 °C)". */
function tempText(k: number): string {
  return `${showWithUnit(US_UNITS.temp, kToC(k))} (${showWithUnit(SI_UNITS.temp, kToC(k))})`;
}

/** Human-readable answer. */
export function prechargeText(a: PrechargeAnswer): string {
  const gReal = a.realAbsPa - a.atmPa;
  const gIdeal = a.idealAbsPa - a.atmPa;
  const refG = a.refAbsPa - a.atmPa;
  const row = (label: string, perUnit: number, digits: number): string =>
    `  ${label.padEnd(12)}${formatDisplay(gReal / perUnit, digits).padStart(12)}${formatDisplay(gIdeal / perUnit, digits).padStart(14)}`;
  const lines = [
    `Precharge serviced to ${formatDisplay(refG / PA_PER_PSI, 1)} psig (${formatDisplay(refG / PA_PER_BAR, 2)} bar gauge) at ${tempText(a.refTempK)}`,
    `Local atmosphere ${formatDisplay(a.atmPa / PA_PER_KPA, 3)} kPa (standard atmosphere at ${formatDisplay(a.elevationM, 0)} m); gauge = absolute − atmosphere`,
    "",
    `Precharge at ${tempText(a.atTempK)}:`,
    `  ${"".padEnd(12)}${"real gas".padStart(12)}${"ideal gas".padStart(14)}`,
    row("psig", PA_PER_PSI, 1),
    row("bar gauge", PA_PER_BAR, 2),
    row("kPa gauge", PA_PER_KPA, 0),
    "",
    "Real gas: nitrogen reference equation of state (Span et al. 2000); ideal gas: the same equation",
    "without its residual part. Planning estimate only: service from the approved maintenance data.",
  ];
  return `${lines.join("\n")}\n`;
}

export interface PrechargeCliOptions {
  ref: string;
  at: string;
  elevation: string;
  json?: boolean;
}

/** `coldsoak precharge` once its options are parsed: prints the answer or its JSON. */
export function prechargeAction(opts: PrechargeCliOptions): void {
  const answer = prechargeAnswer(opts.ref, opts.at, opts.elevation);
  process.stdout.write(
    opts.json ? `${JSON.stringify(prechargeJson(answer), null, 2)}\n` : prechargeText(answer),
  );
}
