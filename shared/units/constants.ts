/**
 * Exact definitions every Headroom unit factor is built from, and the factors
 * derived from them. Nothing here is a rounded table value: each factor is
 * computed from the definitions so that it agrees with the printed table of
 * NIST SP 811 to every digit the table prints.
 *
 * Sources are kept beside each constant (and in {@link unitSources}) so a
 * citation can be corrected in one place.
 */

/** Citations used by the constants below and by the estimator's working. */
export const unitSources = {
  nistB8: 'NIST SP 811 (2008), Appendix B.8 (exact definition)',
  nistB9: 'NIST SP 811 (2008), Appendix B.9',
  cgpm1901: 'Standard acceleration of gravity, 3rd CGPM (1901); NIST SP 811 (2008) B.9',
  powerDefinition: 'Definition of power, P = 2πnT/60 (n in rev/min)',
  derived: 'Derived from the exact definitions (NIST SP 811 (2008) B.8/B.9)',
} as const;

/** International foot, exactly 0.3048 m (1959 agreement). NIST SP 811 (2008) B.8. */
export const FOOT_M = 0.3048;

/** Inch, exactly 0.0254 m. NIST SP 811 (2008) B.8. */
export const INCH_M = 0.0254;

/** Avoirdupois pound, exactly 0.45359237 kg. NIST SP 811 (2008) B.8. */
export const POUND_KG = 0.45359237;

/** Standard acceleration of gravity g_n, exactly 9.80665 m/s². 3rd CGPM (1901); NIST SP 811 (2008) B.9. */
export const STANDARD_GRAVITY_M_PER_S2 = 9.80665;

/** US liquid gallon, exactly 231 in³ = 3.785411784 L. NIST SP 811 (2008) B.8. */
export const US_GALLON_L = 3.785411784;

/**
 * Conventional density of mercury used to define the conventional inch of
 * mercury, 13 595.1 kg/m³ (so that 1 inHg = 3.386 389 kPa as printed in
 * NIST SP 811 (2008) B.8, footnote to "inch of mercury, conventional").
 */
export const MERCURY_CONVENTIONAL_KG_PER_M3 = 13_595.1;

/** Pound-force: lb × g_n = 4.4482216152605 N. NIST SP 811 (2008) B.9 prints 4.448222. */
export const LBF_N = POUND_KG * STANDARD_GRAVITY_M_PER_S2;

/** lbf·ft → N·m: 1.3558179483314004. NIST SP 811 (2008) B.9 prints 1.355818. */
export const LBF_FT_NM = LBF_N * FOOT_M;

/** lbf·in → N·m: 0.11298482902761668. NIST SP 811 (2008) B.9 prints 0.1129848. */
export const LBF_IN_NM = LBF_N * INCH_M;

/**
 * Horsepower (550 ft·lbf/s) → W: 745.69987158227. NIST SP 811 (2008) B.9
 * prints 745.6999. The trade's "hp" (SAE, mechanical) is this horsepower.
 */
export const HP_W = 550 * LBF_FT_NM;

/** Metric horsepower (PS, 75 kgf·m/s) → W: 735.49875 exactly. NIST SP 811 (2008) B.9 prints 735.4988. */
export const PS_W = 75 * STANDARD_GRAVITY_M_PER_S2;

/** psi (lbf/in²) → kPa: 6.894757293168361. NIST SP 811 (2008) B.9 prints 6.894757. */
export const PSI_KPA = LBF_N / (INCH_M * INCH_M) / 1000;

/** Conventional inch of mercury → kPa: 3.386389. NIST SP 811 (2008) B.8 prints 3.386389. */
export const INHG_KPA =
  (MERCURY_CONVENTIONAL_KG_PER_M3 * STANDARD_GRAVITY_M_PER_S2 * INCH_M) / 1000;

/**
 * One lb/(hp·h) in g/kWh: 453.59237 g ÷ 0.74569987158227 kWh = 608.27739…
 * Derived from the definitions (608.277 is the widely quoted value).
 */
export const LB_PER_HP_H_IN_G_PER_KWH = (POUND_KG * 1000) / (HP_W / 1000);

/**
 * 33000 / 2π = 5252.1131220… : hp = T[lbf·ft] × rpm / 5252.113. From the
 * definition of power P = 2πnT/60 with 1 hp = 550 ft·lbf/s = 33 000 ft·lbf/min.
 */
export const HP_TORQUE_RPM_CONSTANT = 33_000 / (2 * Math.PI);

/**
 * 60 000 / 2π = 9549.2965855… : kW = T[N·m] × rpm / 9549.297. From the
 * definition of power P = 2πnT/60 (W = N·m × rad/s), divided by 1000 for kW.
 */
export const KW_TORQUE_RPM_CONSTANT = 60_000 / (2 * Math.PI);
