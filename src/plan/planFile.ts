import { dirname, resolve } from "node:path";
import { type Document, isMap, isScalar, isSeq, LineCounter, parseDocument } from "yaml";
import { z } from "zod";
import { inputError } from "../errors.js";
import { readInputText } from "../fsutil.js";
import {
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
  S_PER_DAY,
  S_PER_MONTH,
  STANDARD_ATMOSPHERE_PA,
} from "../units/index.js";
import { hangarSchema } from "./planHangar.js";
import { q } from "./planQuantity.js";
import { WHAT_IF_NAMES } from "./whatIfVariants.js";

const positive = <T extends z.ZodType<number>>(s: T, what: string) =>
  s.refine((v) => v > 0, { message: `${what} must be greater than zero` });

const pressureAt = q(parsePressureAt);
const pointPressure = q(parsePointPressure);
const clock = q(parseClockMinutes);
const NAME_RE = /^[A-Za-z0-9][A-Za-z0-9 _.-]*$/;
/** What `coldsoak screen` adds to the plan's name for its output folder. */
export const SCREEN_SUFFIX = "-screen";

export const WEEKDAY_NAMES = ["Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"] as const;
const weekdayName = z.string().transform((s, ctx) => {
  const i = WEEKDAY_NAMES.findIndex((d) => s.toLowerCase().startsWith(d.toLowerCase()));
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
      gasVolumeEmpty: positive(q(parseVolumeM3), "gasVolumeEmpty"),
      gasVolumeFull: positive(q(parseVolumeM3), "gasVolumeFull"),
    }),
    precharge: z.strictObject({ reference: pressureAt, tolerance: q(parsePressureDifference) }),
    system: z.strictObject({ low: pointPressure, nominal: pointPressure, high: pointPressure }),
    reliefPressure: pointPressure.optional(),
    fluid: z.strictObject({
      expansionPerK: q(parseExpansionPerK),
      bulkModulus: positive(q(parsePressureDifference), "bulkModulus"),
      lineVolume: q(parseVolumeM3),
    }),
    thermalTimeConstant: q(parseTimeS),
    gasLoss: z.strictObject({
      rate: q(parsePressureRatePaS),
      spread: z.number().min(0).max(3).default(0),
    }),
    starter: z.strictObject({
      minUsefulPressure: pointPressure,
      returnPressure: pointPressure.prefault("0 psig"),
      expansion: z.enum(["isentropic", "isothermal"]).default("isentropic"),
    }),
    startEnergy: z.array(z.strictObject({ ambient: q(parseTemperatureK), energy: q(parseEnergyJ) })).min(1),
    pump: z.strictObject({
      curve: z.array(z.strictObject({ pressure: pointPressure, flow: q(parseFlowM3S) })).min(1),
      timer: positive(q(parseTimeS), "timer"),
    }),
    handPump: z.strictObject({
      displacement: positive(q(parseVolumeM3), "displacement"),
      efficiency: z.number().gt(0).max(1),
    }),
    coldStartOption: z.strictObject({
      count: z.number().int().min(1).max(4).default(2),
      timer: positive(q(parseTimeS), "timer"),
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
    const g = (x: PointPressure) => (x.isGauge ? x.pa : x.pa - STANDARD_ATMOSPHERE_PA);
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
    .union([z.number().int().min(1).max(7), z.array(weekdayName).min(1)])
    .default(7)
    .refine((w) => typeof w === "number" || new Set(w).size === w.length, {
      message: "expected each weekday once",
    }),
  prechargeCheckDays: z.number().int().min(1),
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
  z.number().int().min(0),
  "a whole number of full cylinders, or base names with their numbers",
);
const resupplyInterval = perBase(
  q(parseTimeS).refine((s) => s >= S_PER_DAY, { message: "expected an interval of at least one day" }),
  'a duration such as "4 weeks", or base names with their durations',
);

/**
 * Nitrogen supply and demand (docs/methods.md §7): the cylinders and cascade, and the demand beyond the
 * servicing policy — unscheduled full recharges (Poisson, per aircraft-month), other uses of the same
 * carts per aircraft, and the stock shipped per base. Every demand item is optional (default none).
 */
const nitrogenSchema = z.strictObject({
  cylinder: z.strictObject({ waterVolume: positive(q(parseVolumeM3), "waterVolume"), fill: pressureAt }),
  transferDifferential: q(parsePressureDifference),
  hoseVolume: q(parseVolumeM3),
  cylindersPerCart: z.number().int().min(1),
  unscheduledRechargesPerAircraftMonth: z.number().min(0).max(30).default(0),
  otherUse: z.strictObject({ amount: q(parseGasAmountKg), per: z.enum(["flown-day", "week"]) }).optional(),
  stock: z.strictObject({ cylinders: stockCylinders, resupplyEvery: resupplyInterval.optional() }).optional(),
});

export const planSchema = z
  .strictObject({
    name: z
      .string()
      .regex(NAME_RE, "expected a name of letters, digits, spaces, - _ or . (it names the output folder)")
      .refine((n) => !n.endsWith(SCREEN_SUFFIX), {
        message: `expected a name not ending in "${SCREEN_SUFFIX}" (coldsoak screen writes out/<plan name>${SCREEN_SUFFIX})`,
      }),
    units: z.enum(["us", "si"]).default("us"),
    seed: z
      .number()
      .int()
      .min(0)
      .max(2 ** 32 - 1)
      .default(0),
    assumptionOrigin: z.enum(["plan file", "demo"]).default("plan file"),
    schedule: z.string().min(1).optional(),
    climate: z.strictObject({
      paths: z.array(z.string().min(1)).min(1),
      years: z
        .strictObject({
          from: z.number().int().min(1900).max(2100),
          to: z.number().int().min(1900).max(2100),
        })
        .refine((y) => y.from <= y.to, { message: "expected from ≤ to" })
        .optional(),
      gapHours: z.number().int().min(0).max(48).default(3),
      minYearShare: z.number().min(0).max(1).default(0.8),
      minYears: z.number().int().min(1).default(5),
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
        shortStartsPct: z.number().min(0).max(100).default(1),
        outOfBandPct: z.number().min(0).max(100).default(2),
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
          message: `unknown base "${name}"; expected one of the plan's bases: ${[...baseNames].join(", ")}`,
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

/** "profiles[0].precharge.reference" */
export function yamlPathText(path: readonly PropertyKey[]): string {
  let out = "";
  for (const p of path) {
    if (typeof p === "number") out += `[${p}]`;
    else out += out === "" ? String(p) : `.${String(p)}`;
  }
  return out;
}

function nodeLine(doc: Document, lc: LineCounter, path: (string | number)[]): number {
  for (let n = path.length; n >= 0; n--) {
    const node = n === 0 ? doc.contents : doc.getIn(path.slice(0, n), true);
    const range = (node as { range?: [number, number, number] } | undefined)?.range;
    if (node !== undefined && node !== null && range) return lc.linePos(range[0]).line;
  }
  return 1;
}

/** The text of a YAML node as written: a scalar's source, a collection's items joined by ", ". */
function writtenText(node: unknown): string | null {
  if (isScalar(node)) return node.source ?? String(node.value);
  if (isSeq(node)) return node.items.map(writtenText).join(", ");
  if (isMap(node)) return node.items.map((p) => `${writtenText(p.key)}: ${writtenText(p.value)}`).join(", ");
  return null;
}

const article = (noun: string) => (/^[aeiou]/.test(noun) ? `an ${noun}` : `a ${noun}`);

function describeIssue(issue: z.core.$ZodIssue): string {
  switch (issue.code) {
    case "invalid_type":
      if (issue.input === undefined) {
        return `missing; expected ${issue.expected === "nonoptional" ? "a value" : article(issue.expected)}`;
      }
      return `expected ${article(issue.expected)}, found ${issue.input === null ? "nothing" : Array.isArray(issue.input) ? "a list" : typeof issue.input}`;
    case "unrecognized_keys":
      return `unknown key${issue.keys.length > 1 ? "s" : ""} ${issue.keys.map((k) => `"${k}"`).join(", ")}`;
    case "invalid_value":
      return `expected one of ${issue.values.map((v) => JSON.stringify(v)).join(", ")}`;
    case "invalid_union":
      return "expected a count 1–7 or a list of day names";
    case "too_small":
      return issue.origin === "array"
        ? `expected at least ${issue.minimum} item${Number(issue.minimum) > 1 ? "s" : ""}`
        : issue.origin === "string"
          ? "expected a non-empty text"
          : `expected a number ${issue.inclusive ? "≥" : ">"} ${issue.minimum}`;
    case "too_big":
      return `expected a number ${issue.inclusive ? "≤" : "<"} ${issue.maximum}`;
    default:
      return issue.message;
  }
}

/**
 * Keys that earlier plan files used and that now mean something else: refused with a located message
 * naming the keys that replace them (a fixed hangar temperature gave a 15 °C "heated" hangar colder than
 * July air and a −5 °C shelter colder than the air outside).
 */
function refuseFormerKeys(raw: unknown, file: string, lineOf: (path: (string | number)[]) => number): void {
  const bases = (raw as { bases?: unknown } | null)?.bases;
  if (!Array.isArray(bases)) return;
  bases.forEach((b, i) => {
    const hangar = (b as { hangar?: unknown } | null)?.hangar;
    if (hangar === null || typeof hangar !== "object" || !("temperature" in hangar)) return;
    const path = ["bases", i, "hangar", "temperature"];
    throw inputError(
      file,
      lineOf(path),
      yamlPathText(path),
      "a fixed hangar temperature is no longer read; write kind: heated with heatedTo (the set point: the inside is the warmer of it and the outdoor air), or kind: shelter (unheated: follows the outdoor air through timeConstant, default 6 h, plus offset)",
    );
  });
}

/** Parses and validates plan text; throws InputError `file:line:yaml.path: message`. */
export function parsePlanText(text: string, file: string): Plan {
  return requirePlanSections(parsePlanFileText(text, file));
}

/** parsePlanText for a plan that may lack bases and nitrogen (`coldsoak screen`, `coldsoak band`). */
export function parsePlanFileText(text: string, file: string): PlanFile {
  const lc = new LineCounter();
  const doc = parseDocument(text, { lineCounter: lc, prettyErrors: false, uniqueKeys: true });
  const yamlError = doc.errors[0];
  if (yamlError !== undefined) {
    const line = lc.linePos(yamlError.pos[0]).line;
    throw inputError(file, line, undefined, `not valid YAML: ${yamlError.message.split("\n")[0]}`);
  }
  if (!isMap(doc.contents)) {
    throw inputError(
      file,
      1,
      undefined,
      "expected a YAML mapping with the keys name, climate, bases, profiles, operations, nitrogen",
    );
  }
  const raw: unknown = doc.toJS({ maxAliasCount: 100 });
  refuseFormerKeys(raw, file, (path) => nodeLine(doc, lc, path));
  const parsed = planSchema.safeParse(raw);
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    const path = issue.path.filter((p): p is string | number => typeof p !== "symbol");
    const where = issue.code === "unrecognized_keys" ? [...path, issue.keys[0]!] : path;
    throw inputError(file, nodeLine(doc, lc, where), yamlPathText(path) || "(top)", describeIssue(issue));
  }
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
