/**
 * `coldsoak init <folder>`: writes a commented starter plan (`plan.yaml`), a starter schedule
 * (`schedule.csv`), a `climate/` folder for the user's ISD files and a `README.txt` saying what to put
 * where. Refuses to overwrite any existing file (exit 2) and then writes nothing at all.
 */
import { existsSync } from "node:fs";
import { mkdir } from "node:fs/promises";
import { basename, join, resolve } from "node:path";
import { inputError } from "../errors.js";
import { writeFileAtomic } from "../fsutil.js";

/** Plan names name the output folder: letters, digits, spaces, - _ . (same rule as the plan reader). */
const NAME_RE = /^[A-Za-z0-9][A-Za-z0-9 _.-]*$/;

/**
 * A valid plan name from a folder name: accents are dropped (Unicode NFD, then the combining marks
 * removed), other characters become "-"; "my-plan" if nothing is left.
 */
export function planNameFromFolder(folder: string): string {
  const cleaned = basename(resolve(folder))
    .normalize("NFD")
    .replace(/[\u0300-\u036f]/g, "")
    .replace(/[^A-Za-z0-9 _.-]/g, "-")
    .replace(/^[^A-Za-z0-9]+/, "");
  return cleaned === "" || !NAME_RE.test(cleaned) ? "my-plan" : cleaned;
}

/** The starter plan file. Every value is an example to be replaced; it validates as it stands. */
export function starterPlanText(name: string): string {
  return `# coldsoak plan file: starter written by \`coldsoak init\`. Edit it for your own fleet.
#
# EVERY VALUE BELOW IS AN EXAMPLE, NOT MAINTENANCE DATA. Replace each one with the figures of your
# approved maintenance data and the manufacturer's instructions before you rely on any result.
#
# Quantities are text with their unit: "1450 psig @ 70 F", "4.9 L", "2 h", "30 kJ", "1.2 L/min".
# Pressures: psig/psia, bar/bara, kPa/kPaa, MPa/MPaa (plain bar, kPa and MPa are gauge). A bare "psi",
# "bar" or "kPa" is a pressure DIFFERENCE (a tolerance, a differential, a loss rate).
# Temperatures: F, C or K. Times of day are local times at the base, "HH:MM".
#
# Run it with:   coldsoak plan plan.yaml        (the report lands in out/<name>/report.html)

name: ${name}                  # names the output folder out/<name>/
units: us                      # us (psig, °F, in³, lb, scf) or si (bar, °C, L, kg, normal m³): output only
seed: 1                        # every random input (gas-loss rates, drawn weekdays) comes from this seed
schedule: schedule.csv         # the deployment schedule, relative to this file

climate:
  # Folders or files of NOAA Integrated Surface Data, relative to this file. See README.txt.
  paths: [climate]
  # years: { from: 1991, to: 2020 }   # optional: only these years of record (default: all in the data)
  gapHours: 3                  # gaps up to this many hours are filled linearly
  minYearShare: 0.8            # a year counts for a stay when this share of its hours is present
  minYears: 5                  # fewer usable years than this at a base gives a warning

bases:
  # One entry per base. stations: ISD ids "USAF-WBAN" in priority order; a later station fills the
  # hours the first one misses. Find the id in the file names (USAF-WBAN-YEAR.gz).
  - name: Home Base
    stations: ["000000-00000"]                                  # REPLACE with your station id
    # optional overnight hangar: kind heated (the inside is the warmer of heatedTo and the outdoor
    # air) or shelter (unheated: follows the outdoor air through timeConstant, default 6 h, plus an
    # offset); months limits it to part of the year (default: all year)
    hangar: { kind: heated, heatedTo: "50 F", in: "20:00", out: "06:00", months: [Nov, Dec, Jan, Feb, Mar] }
  - name: Forward Base
    stations: ["000000-00000"]                                  # REPLACE with your station id

profiles:
  # One accumulator profile per accumulator type; the schedule names it (default: the first one).
  - name: standard
    accumulator:
      gasVolumeEmpty: "300 in3"          # gas volume, piston on the fluid-side stop (0 % fill)
      gasVolumeFull: "60 in3"            # gas volume, piston on the gas-side stop (100 % fill)
    precharge:
      reference: "1450 psig @ 70 F"      # service reference: precharge P at temperature T
      tolerance: "50 psi"                # ± band around the reference
    system: { low: "2850 psig", nominal: "3000 psig", high: "3150 psig" }
    fluid:
      expansionPerK: "8e-4 /K"           # volumetric expansion coefficient of the hydraulic fluid
      bulkModulus: "1.5 GPa"
      lineVolume: "0.2 L"                # fluid trapped in the lines with the accumulator
    thermalTimeConstant: "2 h"           # accumulator lag behind the air; "0 s" = at air temperature
    gasLoss: { rate: "5 psi/month", spread: 0.3 }   # median slow loss at the reference temperature;
                                                    # spread = standard deviation of ln(rate) across aircraft
    starter: { minUsefulPressure: "1000 psig", returnPressure: "0 psig", expansion: isentropic }
    # Energy one start needs against air temperature (cold oil drags). With the values above, one
    # accumulator charged to the nominal system pressure at the air temperature meets this table down
    # to -20 F (about 16.9 kJ delivered there against 16 kJ needed); colder, the cold-start option's
    # two accumulators are needed (two deliver about 30 kJ at -40 F). A charge trapped since a warmer
    # afternoon delivers less than that: the report says how often a start falls short.
    startEnergy:
      - { ambient: "-40 F", energy: "18 kJ" }
      - { ambient: "0 F", energy: "14 kJ" }
      - { ambient: "70 F", energy: "12 kJ" }
    pump:
      curve:                             # recharge pump flow against pressure, pressures increasing
        - { pressure: "0 psig", flow: "1.2 L/min" }
        - { pressure: "3000 psig", flow: "0.8 L/min" }
      # Recharge run timer: after a full start the pump refills one accumulator in about 85 s at -40 F
      # (the coldest row of startEnergy) and 140 s at 70 F, within the timer.
      timer: "3 min"
    handPump: { displacement: "1 in3", efficiency: 0.9 }
    coldStartOption: { count: 2, timer: "6 min" }   # second accumulator in parallel, longer timer

operations:
  startTimes: ["06:30", "13:00"]         # local start times; the first of the day is the preflight check
  weekdays: [Mon, Tue, Wed, Thu, Fri]    # or a count 1-7: that many weekdays drawn from the seed
  prechargeCheckDays: 7                  # precharge checked at the first start every N days of a stay
  outOfBand: adjust-precharge            # log | adjust-precharge: what a technician does out of band

nitrogen:
  cylinder: { waterVolume: "49 L", fill: "2200 psig @ 70 F" }
  transferDifferential: "50 psi"         # a cylinder gives gas while above the accumulator by this much
  hoseVolume: "10 in3"                   # vented at each disconnect
  cylindersPerCart: 2
  # Demand beyond the servicing policy (each optional; remove the "# " to use an example):
  # unscheduledRechargesPerAircraftMonth: 0.03   # full recharges after accumulator, valve or seal work
  #                                              # (seeded Poisson events; default 0)
  # otherUse: { amount: "3 scf", per: week }     # other uses of the same carts (struts, tyres) per
  #                                              # aircraft: a mass or normal volume per flown-day or week
  # stock: { cylinders: 4, resupplyEvery: "4 weeks" }   # full cylinders shipped to each base, topped
  #                                              # back up at an interval (optional); per base as
  #                                              # cylinders: { Home Base: 6, Forward Base: 4 }

thresholds: { shortStartsPct: 1, outOfBandPct: 2 }   # % of starts short that calls for the option; % of first preflights out of band that calls for a watch
`;
}

/** The starter schedule: header and two example stays. */
export function starterScheduleText(): string {
  return `aircraft,base,arrive,depart,cold_start_option,profile
A01,Home Base,2027-10-01,2027-12-01,no,standard
A01,Forward Base,2027-12-01,2028-03-01,no,standard
`;
}

/** The note about what goes where, in particular where to get the climate files. */
export function starterReadmeText(): string {
  return `coldsoak plan folder
====================

plan.yaml     the plan: bases, accumulator profiles, operations, nitrogen supply. Every value in it is
              an example: replace them with your approved maintenance data before use.
schedule.csv  the deployment schedule, one stay per row:
              aircraft,base,arrive,depart,cold_start_option,profile
              A stay covers the days from "arrive" up to, not including, "depart" (YYYY-MM-DD).
climate/      put the hourly weather files of your bases' stations here (sub-folders are fine).

Climate files
-------------
coldsoak reads NOAA's Integrated Surface Data (ISD), the hourly surface observations that the US
National Oceanic and Atmospheric Administration (NOAA) publishes free of charge through its National
Centers for Environmental Information (NCEI). On NCEI's data access pages, look for "Integrated Surface
Data" or "Global Hourly"; files are organised by year and named by station, USAF-WBAN-YEAR (for
example 123456-99999-2020.gz). NOAA's station list ("ISD history") gives each station's id, name,
position and period of record.

Any of these layouts works, plain or gzipped, detected from the content:
  - the ISD full archive format (one file per station and year);
  - ISD-Lite (one line per hour; the station id comes from the file name USAF-WBAN-YEAR);
  - the comma-separated global-hourly layout (a quoted header row with STATION, DATE, TMP, ...).

Take ten years or more per station: the report's statistics pool the years of record. Then write each
station's id into plan.yaml under bases[].stations and check the files with

    coldsoak climate climate/

Planning estimates only: not maintenance data. Follow the approved maintenance data, the
manufacturer's instructions, local rules and high-pressure gas precautions.
`;
}

/** Files `init` writes, relative to the folder. */
export const INIT_FILES = ["plan.yaml", "schedule.csv", "README.txt"] as const;

/**
 * Writes the starter files into `folder` (created if missing). Throws InputError, before writing
 * anything, when one of the files already exists. Returns the paths written.
 */
export async function initFolder(folder: string, name?: string): Promise<string[]> {
  const planName = name ?? planNameFromFolder(folder);
  if (!NAME_RE.test(planName)) {
    throw inputError(
      "--name",
      undefined,
      undefined,
      `"${planName}": expected a name of letters, digits, spaces, - _ or . (it names the output folder)`,
    );
  }
  const existing = INIT_FILES.map((f) => join(folder, f)).filter((p) => existsSync(p));
  if (existing.length > 0) {
    throw inputError(
      existing[0]!,
      undefined,
      undefined,
      "already exists; init never overwrites a file (choose an empty folder)",
    );
  }
  await mkdir(join(folder, "climate"), { recursive: true });
  const contents: Record<(typeof INIT_FILES)[number], string> = {
    "plan.yaml": starterPlanText(planName),
    "schedule.csv": starterScheduleText(),
    "README.txt": starterReadmeText(),
  };
  const written: string[] = [];
  for (const f of INIT_FILES) {
    const path = join(folder, f);
    await writeFileAtomic(path, contents[f]);
    written.push(path);
  }
  return written;
}

export interface InitCliOptions {
  name?: string;
}

/** `coldsoak init` once its options are parsed: writes the starter files and says what next. */
export async function initAction(folder: string, opts: InitCliOptions): Promise<void> {
  const written = await initFolder(folder, opts.name);
  for (const p of written) process.stdout.write(`wrote ${p}\n`);
  process.stdout.write(
    `created ${join(folder, "climate")}/ for your ISD files (see ${join(folder, "README.txt")})\n` +
      `next: edit ${join(folder, "plan.yaml")}, then run: coldsoak plan ${join(folder, "plan.yaml")}\n`,
  );
}
