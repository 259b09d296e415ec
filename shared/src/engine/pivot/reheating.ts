import {
  CMB_TEMPERATURE_GEV, ENTROPY_DOF_TODAY, GEV_PER_INVERSE_MPC, PIVOT_K_PER_MPC, REDUCED_PLANCK_MASS_GEV, STANDARD_MODEL_DOF,
} from '../constants.js';

/** A reheating history: mean equation of state and the energy scale where radiation takes over. */
export interface Reheating {
  /** Mean equation of state w_reh during reheating, −1/3 < w ≤ 1 (w = 1/3 makes N_* independent of the scale). */
  w: number;
  /** ρ_reh^{1/4} in GeV at the end of reheating; give this or `temperatureGeV`. */
  energyGeV?: number;
  /** T_reh in GeV at the end of reheating. */
  temperatureGeV?: number;
  /** Relativistic degrees of freedom at reheating (default: the Standard Model's 106.75). */
  dof?: number;
}

/** ρ_reh in GeV⁴ and T_reh in GeV, from whichever the history gives, with ρ = (π²/30) g T⁴. */
export function reheatingDensity(reh: Reheating): { rho: number; temperature: number; dof: number } {
  const dof = reh.dof ?? STANDARD_MODEL_DOF;
  const c = (Math.PI * Math.PI * dof) / 30;
  if (reh.temperatureGeV !== undefined) {
    const T = reh.temperatureGeV;
    return { rho: c * T ** 4, temperature: T, dof };
  }
  const rho = (reh.energyGeV as number) ** 4;
  return { rho, temperature: (rho / c) ** 0.25, dof };
}

/**
 * N_* for k_* = 0.05 Mpc^-1 from the expansion history (Liddle & Leach 2003, astro-ph/0305263;
 * the form of Planck 2018 X, arXiv:1807.06211, eq. 47), written from its ingredients:
 *   N_* = ln(a_end/a_0) + ln(H_* / k_*),  a_0 = 1,
 *   ln(a_end/a_reh) = −ln(ρ_end/ρ_reh) / (3(1 + w)),
 *   ln(a_reh/a_0) = ln(T_0/T_reh) + ⅓ ln(g_s0/g_reh)  (entropy conservation),
 * with H_* and ρ_end in GeV from the normalised potential.
 *
 * @param hubbleStar H at the pivot crossing, in units of M_pl.
 * @param rhoEnd energy density at the end of inflation (3H² M_pl² = 1.5 V_end), in units of M_pl⁴.
 */
export function nStarFromReheating(reh: Reheating, hubbleStar: number, rhoEnd: number): number {
  const { rho, temperature, dof } = reheatingDensity(reh);
  const M = REDUCED_PLANCK_MASS_GEV;
  const rhoEndGeV4 = rhoEnd * M ** 4;
  const lnEndToReh = -Math.log(rhoEndGeV4 / rho) / (3 * (1 + reh.w));
  const lnRehToToday = Math.log(CMB_TEMPERATURE_GEV / temperature) + Math.log(ENTROPY_DOF_TODAY / dof) / 3;
  const kStarGeV = PIVOT_K_PER_MPC * GEV_PER_INVERSE_MPC;
  return lnEndToReh + lnRehToToday + Math.log((hubbleStar * M) / kStarGeV);
}
