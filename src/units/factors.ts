/**
 * Conversion factors and reference conditions: one definition each, imported by every layer.
 *
 * Inside the program everything is SI (Pa absolute, K, m³, mol, J, s); these factors convert at the
 * edges. Every factor below is exact by definition unless its comment says otherwise.
 *
 * References:
 * - A. Thompson and B. N. Taylor, "Guide for the Use of the International System of Units (SI)",
 *   NIST Special Publication 811, 2008 edition, Appendix B.8 (factors for units listed
 *   alphabetically) and section 4.2.1.1 (Celsius temperature).
 * - BIPM, "The International System of Units (SI)", 9th edition (2019): litre, bar, standard
 *   acceleration of gravity.
 * - DIN 1343 (normal conditions 0 °C, 101.325 kPa); the US compressed-gas trade's standard cubic foot
 *   (70 °F, 14.696 psia).
 * - R. Span, E. W. Lemmon, R. T Jacobsen, W. Wagner, A. Yokozeki, J. Phys. Chem. Ref. Data 29, 1361
 *   (2000): the density of nitrogen at those conditions.
 */

// ---- length and volume ----

/** 1 in = 0.0254 m (NIST SP 811, B.8: inch). */
export const M_PER_IN = 0.0254;
/** 1 ft = 0.3048 m (NIST SP 811, B.8: foot). */
export const M_PER_FT = 0.3048;
/** 1 in³ = 1.6387064 × 10⁻⁵ m³ (NIST SP 811, B.8: cubic inch). */
export const M3_PER_IN3 = M_PER_IN ** 3;
/** 1 ft³ = 0.028316846592 m³ (NIST SP 811, B.8: cubic foot, 2.831685 × 10⁻² to 7 digits). */
export const M3_PER_FT3 = M_PER_FT ** 3;
/** 1 L = 1 dm³ = 10⁻³ m³ (SI brochure; NIST SP 811, B.8: liter). */
export const M3_PER_LITRE = 1e-3;
/** 1 US gallon = 231 in³ = 3.785411784 × 10⁻³ m³ (NIST SP 811, B.8: gallon (U.S.)). */
export const M3_PER_US_GALLON = 231 * M3_PER_IN3;

// ---- mass, force, pressure, energy ----

/** 1 lb (avoirdupois) = 0.45359237 kg (NIST SP 811, B.8: pound). */
export const KG_PER_LB = 0.45359237;
/** Standard acceleration of gravity, 9.80665 m/s² (SI brochure; defines the pound-force). */
export const STANDARD_GRAVITY_M_S2 = 9.80665;
/** 1 lbf = 1 lb × 9.80665 m/s² = 4.4482216152605 N (NIST SP 811, B.8: pound-force). */
export const N_PER_LBF = KG_PER_LB * STANDARD_GRAVITY_M_S2;
/** 1 psi = 1 lbf/in² = 6894.757293168 Pa (NIST SP 811, B.8: pound-force per square inch, 6.894757 × 10³). */
export const PA_PER_PSI = (KG_PER_LB * STANDARD_GRAVITY_M_S2) / (M_PER_IN * M_PER_IN);
export const PA_PER_KPA = 1e3;
export const PA_PER_MPA = 1e6;
export const PA_PER_GPA = 1e9;
/** 1 bar = 10⁵ Pa (SI brochure; NIST SP 811, B.8: bar). */
export const PA_PER_BAR = 1e5;
/** Standard atmosphere, 101 325 Pa (NIST SP 811, B.8: atmosphere, standard; ISO 2533 sea level). */
export const STANDARD_ATMOSPHERE_PA = 101325;
/** 1 ft·lbf = 0.3048 m × 4.4482216152605 N = 1.3558179483314 J (NIST SP 811, B.8: foot pound-force). */
export const J_PER_FT_LBF = M_PER_FT * N_PER_LBF;

// ---- temperature ----

/** 0 °C = 273.15 K: T/K = t/°C + 273.15 (NIST SP 811, 4.2.1.1). */
export const ZERO_CELSIUS_K = 273.15;
/** Size of the kelvin in degrees Fahrenheit: a difference of 1 K = 1 °C = 9/5 °F (NIST SP 811, B.8). */
export const FAHRENHEIT_PER_KELVIN = 9 / 5;

/** Celsius temperature → kelvin. */
export const cToK = (c: number): number => c + ZERO_CELSIUS_K;
/** Kelvin → Celsius temperature. */
export const kToC = (k: number): number => k - ZERO_CELSIUS_K;
/** Fahrenheit temperature → kelvin: t/°C = (t/°F − 32)/1.8 (NIST SP 811, B.8: degree Fahrenheit). */
export const fToK = (f: number): number => ((f - 32) * 5) / 9 + ZERO_CELSIUS_K;
/** Kelvin → Fahrenheit temperature. */
export const kToF = (k: number): number => ((k - ZERO_CELSIUS_K) * 9) / 5 + 32;
/** Celsius → Fahrenheit temperature. */
export const cToF = (c: number): number => (c * 9) / 5 + 32;

// ---- time ----

export const S_PER_MIN = 60;
export const S_PER_HOUR = 3600;
export const S_PER_DAY = 86400;
export const S_PER_WEEK = 7 * S_PER_DAY;
/** Mean Gregorian year, 365.2425 d (146 097 days in the calendar's 400-year cycle). */
export const S_PER_YEAR = 365.2425 * S_PER_DAY;
/** Mean Gregorian month, 365.2425/12 d: the month of rates given "per month". */
export const S_PER_MONTH = (365.2425 / 12) * S_PER_DAY;

// ---- nitrogen at standard conditions ----

/** Normal conditions of the normal cubic metre: 0 °C and 101.325 kPa (DIN 1343). */
export const NORMAL_TEMP_K = ZERO_CELSIUS_K;
export const NORMAL_PRESSURE_PA = STANDARD_ATMOSPHERE_PA;
/** Standard conditions of the standard cubic foot (scf) of the US compressed-gas trade: 70 °F, 14.696 psia. */
export const SCF_TEMP_K = fToK(70);
export const SCF_PRESSURE_PA = 14.696 * PA_PER_PSI;
/**
 * Density of nitrogen at normal conditions (0 °C, 101.325 kPa), kg/m³: one normal m³ of nitrogen is
 * this mass. From the reference equation of state (Span et al. 2000: 44.63516 mol/m³, compressibility
 * 0.99954) with its molar mass 28.01348 g/mol; tests/units/factors.test.ts checks it against the
 * equation (physics/nitrogen.ts).
 */
export const N2_NORMAL_DENSITY_KG_M3 = 1.250386;
/**
 * Density of nitrogen at the scf conditions (70 °F, 14.696 psia), kg/m³: one scf of nitrogen is this
 * mass per m³ times 1 ft³. Same source (41.42378 mol/m³, compressibility 0.99977).
 */
export const N2_SCF_DENSITY_KG_M3 = 1.160424;
