import { dirname, resolve } from "node:path";
import { z } from "zod";
import { inputError } from "../errors.js";
import { readInputText } from "../fsutil.js";
import {
  gaugePa,
  type PointPressure,
  parseClockMinutes,
  parseEnergyJ,
  parseExpansionPerK,
  parseFlowM3S,
  parseGasAmountKg,
  parsePointPressure,
  parsePressureAt,
  parsePressureDifference,
  parsePressureRatePaS,
  parseTemperatureK,
  parseTimeS,
  parseVolumeM3,
  S_PER_MONTH,
  STANDARD_ATMOSPHERE_PA,
} from "../units/index.js";
import { hangarSchema, refuseFormerHangarKeys } from "./planHangar.js";
import {
  BULK_MODULUS,
  ENERGY,
  EXPANSION,
  FLOW,
  GAS_AMOUNT,
  GAS_TEMPERATURE,
  limited,
  numberIn,
  PRESSURE_DIFFERENCE,
  pointWithin,
  pressureAtWithin,
  RESUPPLY_INTERVAL,
  TIME_CONSTANT,
  TIMER,
  VOLUME,
  VOLUME_OR_NONE,
  warmPrechargeProblem,
} from "./planLimits.js";
import { q } from "./planQuantity.js";
import { describeIssue, issueError, nodeLine, planDocument, writtenText } from "./planYaml.js";
import { WHAT_IF_NAMES } from "./whatIfVariants.js";

export { yamlPathText } from "./planYaml.js";

const pressureAt = q(parsePressureAt, pressureAtWithin);
const pointPressure = q(parsePointPressure, pointWithin);
const clock = q(parseClockMinutes);
const gasTemperature = limited(parseTemperatureK, GAS_TEMPERATURE);
const volume = limited(parseVolumeM3, VOLUME);
const volumeOrNone = limited(parseVolumeM3, VOLUME_OR_NONE);
const pressureDifference = limited(parsePressureDifference, PRESSURE_DIFFERENCE);
const timer = limited(parseTimeS, TIMER);
const NAME_RE = /^[A-Za-z0-9][A-Za-z0-9 _.-]*$/;
/** Longest plan name: it names the output folder and, with a run tag, its hidden version folder. */
export const MAX_PLAN_NAME_LENGTH = 100;
/** What `coldsoak screen` adds to the plan's name for its output folder. */
export const SCREEN_SUFFIX = "-screen";

export const WEEKDAY_NAMES = ["Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"] as const;
const WEEKDAY_FULL_NAMES = ["Monday", "Tuesday", "Wednesday", "Thursday", "Friday", "Saturday", "Sunday"];
const weekdayName = z.string().transform((s, ctx) => {
  // A day's name or its start of at least three letters ("Mon", "Tues", "Monday"), never more ("Monkey").
  const i = WEEKDAY_FULL_NAMES.findIndex((d) => d.toLowerCase().startsWith(s.toLowerCase()));
  if (i < 0 || s.length < 3) {
    ctx.addIssue({
      code: "custom",
      message: `"${s}" is not a day name; expected Mon, Tue, Wed, Thu, Fri, Sat or Sun`,
    });
    return z.NEVER;
  }
  return i + 1; // ISO weekday, Monday = 1
});

const baseSchema = z.strictObject({
  name: z.string().min(1),
  stations: z
    .array(z.string().regex(/^\d{6}-\d{5}$/, 'expected an ISD station id "USAF-WBAN", e.g. "725300-94846"'))
    .min(1),
  hangar: hangarSchema.optional(),
});

const profileSchema = z
  .strictObject({
    name: z.string().min(1),
    accumulator: z.strictObject({
      gasVolumeEmpty: volume,
      gasVolumeFull: volume,
    }),
    precharge: z.strictObject({ reference: pressureAt, tolerance: pressureDifference }),
    system: z.strictObject({ low: pointPressure, nominal: pointPressure, high: pointPressure }),
    reliefPressure: pointPressure.optional(),
    fluid: z.strictObject({
      expansionPerK: limited(parseExpansionPerK, EXPANSION),
      bulkModulus: limited(parsePressureDifference, BULK_MODULUS),
      lineVolume: volumeOrNone,
    }),
    thermalTimeConstant: limited(parseTimeS, TIME_CONSTANT),
    gasLoss: z.strictObject({
      rate: q(parsePressureRatePaS),
      spread: numberIn(0, 3).default(0),
    }),
    starter: z.strictObject({
      minUsefulPressure: pointPressure,
      returnPressure: pointPressure.prefault("0 psig"),
      expansion: z.enum(["isentropic", "isothermal"]).default("isentropic"),
    }),
    startEnergy: z
      .array(z.strictObject({ ambient: gasTemperature, energy: limited(parseEnergyJ, ENERGY) }))
      .min(1),
    pump: z.strictObject({
      curve: z
        .array(z.strictObject({ pressure: pointPressure, flow: limited(parseFlowM3S, FLOW) }))
        .min(1)
        .refine((c) => c.some((r) => r.flow > 0), {
          message: "expected a pump that delivers: a flow above 0",
        }),
      timer,
    }),
    handPump: z.strictObject({
      displacement: volume,
      efficiency: numberIn(0, 1, { minOpen: true }),
    }),
    coldStartOption: z.strictObject({
      count: numberIn(1, 4, { int: true }).default(2),
      timer,
    }),
  })
  .superRefine((p, ctx) => {
    if (p.accumulator.gasVolumeFull >= p.accumulator.gasVolumeEmpty) {
      ctx.addIssue({
        code: "custom",
        path: ["accumulator", "gasVolumeFull"],
        message: "expected a gas volume at 100 % fill smaller than gasVolumeEmpty",
      });
    }
    const sys = p.system;
    if (sys.low.isGauge !== sys.nominal.isGauge || sys.nominal.isGauge !== sys.high.isGauge) {
      ctx.addIssue({
        code: "custom",
        path: ["system"],
        message: "expected low, nominal and high all gauge or all absolute",
      });
    } else if (!(sys.low.pa <= sys.nominal.pa && sys.nominal.pa <= sys.high.pa)) {
      ctx.addIssue({ code: "custom", path: ["system"], message: "expected low ≤ nominal ≤ high" });
    }
    // Gauge comparisons (an absolute value is compared as if the atmosphere were 101.325 kPa).
    const g = (x: PointPressure) => gaugePa(x, STANDARD_ATMOSPHERE_PA);
    const ref = g(p.precharge.reference.pressure);
    if (!(p.precharge.tolerance < ref)) {
      ctx.addIssue({
        code: "custom",
        path: ["precharge", "tolerance"],
        message: "expected a tolerance smaller than the reference precharge",
      });
    } else if (!(ref + p.precharge.tolerance < g(sys.low))) {
      ctx.addIssue({
        code: "custom",
        path: ["precharge", "reference"],
        message: "expected the precharge plus its tolerance below the lowest system pressure",
      });
    }
    if (p.reliefPressure !== undefined && !(g(p.reliefPressure) > g(sys.high))) {
      ctx.addIssue({
        code: "custom",
        path: ["reliefPressure"],
        message: "expected a relief pressure above the system's high limit (system.high)",
      });
    }
    if (!(p.gasLoss.rate * S_PER_MONTH < ref)) {
      ctx.addIssue({
        code: "custom",
        path: ["gasLoss", "rate"],
        message: "expected a loss per month smaller than the reference precharge",
      });
    }
    if (!(g(p.starter.returnPressure) < g(p.starter.minUsefulPressure))) {
      ctx.addIssue({
        code: "custom",
        path: ["starter", "returnPressure"],
        message: "expected a return pressure below the minimum useful pressure",
      });
    }
    if (!(g(p.starter.minUsefulPressure) < g(sys.nominal))) {
      ctx.addIssue({
        code: "custom",
        path: ["starter", "minUsefulPressure"],
        message: "expected a minimum useful pressure below the nominal system pressure",
      });
    }
    const temps = p.startEnergy.map((r) => r.ambient);
    for (let i = 1; i < temps.length; i++) {
      if (temps[i]! <= temps[i - 1]!) {
        ctx.addIssue({
          code: "custom",
          path: ["startEnergy", i, "ambient"],
          message: "expected ambient temperatures in increasing order",
        });
      }
    }
    const pressures = p.pump.curve.map((r) => r.pressure.pa + (r.pressure.isGauge ? 0 : -1e12));
    for (let i = 1; i < pressures.length; i++) {
      if (pressures[i]! <= pressures[i - 1]!) {
        ctx.addIssue({
          code: "custom",
          path: ["pump", "curve", i, "pressure"],
          message: "expected pump-curve pressures in increasing order, all gauge or all absolute",
        });
      }
    }
  });

const operationsSchema = z.strictObject({
  startTimes: z
    .array(clock)
    .min(1)
    .refine((t) => t.every((m, i) => i === 0 || m > t[i - 1]!), {
      message: "expected start times in increasing order within the day",
    }),
  weekdays: z
    .union([numberIn(1, 7, { int: true }), z.array(weekdayName).min(1)])
    .default(7)
    .refine((w) => typeof w === "number" || new Set(w).size === w.length, {
      message: "expected each weekday once",
    }),
  prechargeCheckDays: numberIn(1, 3650, { int: true }),
  outOfBand: z.enum(["log", "adjust-precharge"]).default("log"),
  /** The accumulator's state on arrival at a base (docs/methods.md §5, "Arrival"). */
  arrival: z.enum(["charged", "precharge-only"]).default("charged"),
});

/** A value for every base, or a mapping of base names to values (a base not named has none). */
export type PerBase<T> = T | Record<string, T>;

/** The value of a `PerBase` setting for one base; undefined where a mapping does not name it. */
export function forBase<T>(value: PerBase<T> | undefined, base: string): T | undefined {
  if (value === undefined || value === null) return undefined;
  if (typeof value === "object" && !Array.isArray(value)) return (value as Record<string, T>)[base];
  return value as T;
}

/**
 * One value for every base, or a mapping of base names to values; the names are checked against the
 * plan's bases below. Issues keep their path (the base name's key included).
 */
function perBase<T extends z.ZodType>(schema: T, expected: string) {
  const byName = z.record(z.string(), schema);
  return z.unknown().transform((v, ctx): PerBase<z.output<T>> => {
    const mapping = typeof v === "object" && v !== null && !Array.isArray(v);
    const r = (mapping ? byName : schema).safeParse(v);
    if (r.success) return r.data as PerBase<z.output<T>>;
    for (const issue of r.error.issues) {
      const message = issue.code === "invalid_type" ? `expected ${expected}` : describeIssue(issue);
      ctx.addIssue({ code: "custom", message, path: issue.path.filter((p) => typeof p !== "symbol") });
    }
    return z.NEVER;
  });
}

const stockCylinders = perBase(
  numberIn(0, 10000, { int: true }),
  "a whole number of full cylinders, or base names with their numbers",
);
const resupplyInterval = perBase(
  limited(parseTimeS, RESUPPLY_INTERVAL),
  'a duration such as "4 weeks", or base names with their durations',
);

/**
 * Nitrogen supply and demand (docs/methods.md §7): the cylinders and cascade, and the demand beyond the
 * servicing policy — unscheduled full recharges (Poisson, per aircraft-month), other uses of the same
 * carts per aircraft, and the stock shipped per base. Every demand item is optional (default none).
 */
const nitrogenSchema = z.strictObject({
  cylinder: z.strictObject({ waterVolume: volume, fill: pressureAt }),
  transferDifferential: pressureDifference,
  hoseVolume: volumeOrNone,
  cylindersPerCart: numberIn(1, 100, { int: true }),
  unscheduledRechargesPerAircraftMonth: numberIn(0, 30).default(0),
  otherUse: z
    .strictObject({
      amount: limited(parseGasAmountKg, GAS_AMOUNT),
      per: z.enum(["flown-day", "week"]),
    })
    .optional(),
  stock: z.strictObject({ cylinders: stockCylinders, resupplyEvery: resupplyInterval.optional() }).optional(),
});

export const planSchema = z
  .strictObject({
    name: z
      .string()
      .regex(NAME_RE, "expected a name of letters, digits, spaces, - _ or . (it names the output folder)")
      .refine((s) => s.length <= MAX_PLAN_NAME_LENGTH, {
        message: `expected a name of at most ${MAX_PLAN_NAME_LENGTH} characters (it names the output folder)`,
      })
      .refine((n) => !n.endsWith(SCREEN_SUFFIX), {
        message: `expected a name not ending in "${SCREEN_SUFFIX}" (coldsoak screen writes out/<plan name>${SCREEN_SUFFIX})`,
      }),
    units: z.enum(["us", "si"]).default("us"),
    // The random streams take the seed as a 32-bit unsigned integer (random.ts).
    seed: numberIn(0, 2 ** 32 - 1, { int: true }).default(0),
    assumptionOrigin: z.enum(["plan file", "demo"]).default("plan file"),
    schedule: z.string().min(1).optional(),
    climate: z.strictObject({
      paths: z.array(z.string().min(1)).min(1),
      years: z
        .strictObject({
          from: numberIn(1900, 2100, { int: true }),
          to: numberIn(1900, 2100, { int: true }),
        })
        .refine((y) => y.from <= y.to, { message: "expected from ≤ to" })
        .optional(),
      gapHours: numberIn(0, 48, { int: true }).default(3),
      minYearShare: numberIn(0, 1).default(0.8),
      minYears: numberIn(1, 200, { int: true }).default(5),
      cacheDir: z.string().min(1).optional(),
      stationHistory: z.string().min(1).optional(),
      /** Temperatures the design hours below count under (default −20, −30, −40 in the plan's unit). */
      coldThresholds: z.array(q(parseTemperatureK)).min(1).max(8).optional(),
    }),
    // Optional in the file: `coldsoak screen` reads a plan without bases, schedule or nitrogen; `plan`
    // refuses one without them (requirePlanSections).
    bases: z.array(baseSchema).min(1).optional(),
    profiles: z.array(profileSchema).min(1),
    operations: operationsSchema,
    nitrogen: nitrogenSchema.optional(),
    thresholds: z
      .strictObject({
        shortStartsPct: numberIn(0, 100).default(1),
        outOfBandPct: numberIn(0, 100).default(2),
      })
      .default({ shortStartsPct: 1, outOfBandPct: 2 }),
    /** What-if variants run with the plan (docs/methods.md, "What-if variants"). */
    whatIf: z
      .array(z.enum(WHAT_IF_NAMES))
      .min(1)
      .refine((v) => new Set(v).size === v.length, { message: "expected each variant once" })
      .optional(),
  })
  .superRefine((p, ctx) => {
    const seen = (items: { name: string }[], key: string) => {
      const names = new Set<string>();
      items.forEach((it, i) => {
        if (names.has(it.name))
          ctx.addIssue({ code: "custom", path: [key, i, "name"], message: `duplicate name "${it.name}"` });
        names.add(it.name);
      });
    };
    seen(p.bases ?? [], "bases");
    seen(p.profiles, "profiles");
    p.profiles.forEach((profile, i) => {
      const message = warmPrechargeProblem(profile, p.bases ?? [], p.units);
      if (message !== null)
        ctx.addIssue({ code: "custom", path: ["profiles", i, "precharge", "reference"], message });
    });
    const baseNames = new Set((p.bases ?? []).map((b) => b.name));
    const stock = p.nitrogen?.stock;
    for (const key of ["cylinders", "resupplyEvery"] as const) {
      const v = stock?.[key];
      if (typeof v !== "object" || v === null) continue;
      for (const name of Object.keys(v)) {
        if (baseNames.has(name)) continue;
        ctx.addIssue({
          code: "custom",
          path: ["nitrogen", "stock", key, name],
          message: `"${name}" is not a base of the plan; expected one of the plan's bases: ${[...baseNames].join(", ")}`,
        });
      }
    }
  });

/** A plan file as validated: `bases` and `nitrogen` may be absent (a plan for `coldsoak screen`). */
export type PlanFileInput = z.output<typeof planSchema>;
export type ProfileInput = PlanFileInput["profiles"][number];
export type BaseInput = NonNullable<PlanFileInput["bases"]>[number];
export type HangarInput = NonNullable<BaseInput["hangar"]>;
export type NitrogenInput = NonNullable<PlanFileInput["nitrogen"]>;
export type { PointPressure };

/** Where a validated plan came from, and a way to point back at its lines. */
interface PlanSource {
  file: string;
  dir: string;
  /** Line of a YAML path (the nearest existing parent when absent), 1-based. */
  lineOf(path: (string | number)[]): number;
  /** True when the YAML file sets this path (false: the value is a default). */
  has(path: (string | number)[]): boolean;
  /**
   * The value at a YAML path exactly as written in the file ("1.4 GPa", "0.80"; a list's items joined
   * by ", "), or null when the file does not set it.
   */
  written(path: (string | number)[]): string | null;
}

/** A validated plan file, with or without bases and nitrogen. */
export interface PlanFile extends PlanFileInput, PlanSource {}

/** What the simulation and its statistics read of a plan: every section but the nitrogen logistics. */
export interface PlanCore extends Omit<PlanFile, "bases" | "nitrogen"> {
  bases: BaseInput[];
}

/** A plan the planning engine runs: with its bases and its nitrogen logistics. */
export interface Plan extends PlanCore {
  nitrogen: NitrogenInput;
}

/** The sections `coldsoak plan` needs beyond those every plan file has. */
const PLAN_SECTIONS = [
  ["bases", "a list of bases, each with its name and climate stations"],
  ["nitrogen", "the nitrogen section (cylinder, transferDifferential, hoseVolume, cylindersPerCart)"],
] as const;

/**
 * The plan with the sections the planning engine needs; a missing one is refused at the line of the
 * plan's first key (`plan.yaml:6:bases: missing; …`), saying that only `coldsoak screen` reads a plan without it.
 */
export function requirePlanSections(p: PlanFile): Plan {
  for (const [key, expected] of PLAN_SECTIONS) {
    if (p[key] === undefined)
      throw inputError(
        p.file,
        p.lineOf([key]),
        key,
        `missing; expected ${expected} (only "coldsoak screen" reads a plan without it)`,
      );
  }
  return p as Plan;
}

/** Parses and validates plan text; throws InputError `file:line:yaml.path: message`. */
export function parsePlanText(text: string, file: string): Plan {
  return requirePlanSections(parsePlanFileText(text, file));
}

/** parsePlanText for a plan that may lack bases and nitrogen (`coldsoak screen`, `coldsoak band`). */
export function parsePlanFileText(text: string, file: string): PlanFile {
  const { doc, lc, raw } = planDocument(text, file);
  refuseFormerHangarKeys(raw, file, (path) => nodeLine(doc, lc, path));
  const parsed = planSchema.safeParse(raw, { reportInput: true });
  if (!parsed.success) throw issueError(file, doc, lc, parsed.error.issues[0]!);
  const has = (path: (string | number)[]) => doc.hasIn(path);
  return {
    ...parsed.data,
    file,
    dir: dirname(resolve(file)),
    lineOf: (path) => nodeLine(doc, lc, path),
    has,
    written: (path) => (has(path) ? writtenText(doc.getIn(path, true)) : null),
  };
}

/** Reads and validates a plan file for the planning engine (bases and nitrogen required). */
export async function loadPlan(file: string): Promise<Plan> {
  return requirePlanSections(await loadPlanFile(file));
}

/** Reads and validates a plan file that may lack bases and nitrogen. */
export async function loadPlanFile(file: string): Promise<PlanFile> {
  const text = await readInputText(file, "the plan file");
  return parsePlanFileText(text, file);
}
