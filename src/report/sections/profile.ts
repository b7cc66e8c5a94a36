/**
 * Report section "Precharge line and fill-reading band" of a base (partial `profile`): for each
 * profile flown at the base, the precharge line with its tolerance lines against the ideal gas and the
 * fill-reading band by temperature, gauge pressures at the base's own atmosphere, as charts captioned as
 * model estimates, never as a printable servicing table (the numbers are in precharge_line.csv,
 * band.csv and base_curves.csv). Reads `BaseResult.profileCurves` (else `Results.profiles` with
 * `Results.stays` and `BaseResult.nitrogen.stays` to know which profiles the base flies).
 */
import type { BaseResult, PrechargeRow, ProfileResult, Results } from "../../plan/results.js";
import { showWithUnit } from "../../units/index.js";
import { PALETTE, xyChart } from "../charts.js";
import type { BaseContext, Figure } from "../shared.js";

/** Caption ending of every curve that looks like servicing data. */
const NOT_SERVICING = "Model estimate — not servicing data.";

export interface ProfileView {
  name: string;
  figures: Figure[];
}

export interface ProfileSectionView {
  profiles: ProfileView[];
}

/**
 * Profiles flown at a base, with their curves at the base's atmosphere (`BaseResult.profileCurves`);
 * else, from the stays, the profile-level curves at 101.325 kPa (all profiles when no stay names one).
 */
function profilesForBase(results: Results, base: BaseResult): ProfileResult[] {
  if (base.profileCurves.length > 0) return base.profileCurves;
  const names = new Set(results.stays.filter((s) => s.base === base.name).map((s) => s.profile));
  for (const s of base.nitrogen.stays) names.add(s.profile);
  const used = results.profiles.filter((p) => names.has(p.name));
  return used.length > 0 ? used : results.profiles;
}

async function profileView(
  { anchor, u, figs }: BaseContext,
  p: ProfileResult,
  id: string,
): Promise<ProfileView> {
  const T = u.temp.unit;
  const P = u.pressure.unit;
  const temps = p.prechargeLine.map((r) => r.tempC);
  /** Chart points of one precharge line (temperature, gauge pressure) in the report's units. */
  const lineOf = (kPaGauge: (r: PrechargeRow) => number) =>
    p.prechargeLine.map((r) => ({ x: u.temp.convert(r.tempC), y: u.pressure.convert(kPaGauge(r)) }));
  const xDomain: [number, number] | undefined =
    temps.length > 1 ? [u.temp.convert(Math.min(...temps)), u.temp.convert(Math.max(...temps))] : undefined;
  const precharge = figs.next(
    await xyChart({
      id: `${anchor}-${id}-precharge`,
      title: `Profile ${p.name}: precharge line, real gas against ideal gas`,
      xTitle: `Temperature (${T})`,
      yTitle: `Precharge (${P})`,
      ...(xDomain ? { xDomain } : {}),
      lines: [
        {
          name: "Real gas (Span et al. 2000)",
          color: PALETTE.blue,
          points: lineOf((r) => r.prechargeKPaGauge),
        },
        {
          name: "Tolerance, upper",
          color: PALETTE.orange,
          dash: [6, 3],
          points: lineOf((r) => r.prechargeHighKPaGauge),
        },
        {
          name: "Tolerance, lower",
          color: PALETTE.vermillion,
          dash: [6, 3],
          points: lineOf((r) => r.prechargeLowKPaGauge),
        },
        {
          name: "Ideal gas",
          color: PALETTE.black,
          dash: [2, 2],
          points: lineOf((r) => r.idealPrechargeKPaGauge),
        },
      ],
    }),
    `Precharge line of profile ${p.name} (piston on the fluid-side stop) with its tolerance lines, real gas against the ideal-gas model, in ${P} above an atmosphere of ${showWithUnit(u.pressureAbs, p.atmosphereKPaAbsolute)}. ${NOT_SERVICING}`,
  );
  const band = figs.next(
    await xyChart({
      id: `${anchor}-${id}-band`,
      title: `Profile ${p.name}: fill-reading band against temperature, one or two accumulators`,
      xTitle: `Temperature (${T})`,
      yTitle: "Fill reading (% of stroke)",
      ...(xDomain ? { xDomain } : {}),
      bands: [
        {
          name: "Band, 1 or 2 accumulators",
          color: PALETTE.green,
          points: p.band.map((r) => ({
            x: u.temp.convert(r.tempC),
            y: r.readingLowPct,
            y2: r.readingHighPct,
          })),
        },
      ],
      lines: [
        {
          name: "Nominal, real gas",
          color: PALETTE.black,
          points: p.band.map((r) => ({ x: u.temp.convert(r.tempC), y: r.readingNominalPct })),
        },
        {
          name: "Nominal, ideal gas",
          color: PALETTE.purple,
          dash: [2, 2],
          points: p.band.map((r) => ({ x: u.temp.convert(r.tempC), y: r.idealReadingNominalPct })),
        },
      ],
    }),
    `Fill-reading band at system pressure for profile ${p.name}. One accumulator and two in parallel read alike (each holds the same gas at the same pressure and temperature), so one band serves both; a second unit changes the start energy, not the reading. ${NOT_SERVICING}`,
  );
  return { name: p.name, figures: [precharge, band] };
}

export async function profileSection(ctx: BaseContext): Promise<ProfileSectionView> {
  const profiles: ProfileView[] = [];
  for (const [i, p] of profilesForBase(ctx.results, ctx.base).entries())
    profiles.push(await profileView(ctx, p, `p${i + 1}`));
  return { profiles };
}
