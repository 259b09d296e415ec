/** Reduced Planck mass in GeV, M_pl = (8πG)^(-1/2) (CODATA 2018 G; 2.435323e18, rounded as usual). */
export const REDUCED_PLANCK_MASS_GEV = 2.435e18;

/** Scalar amplitude every point is normalised to (Planck 2018 VI, arXiv:1807.06209: ln(1e10 A_s) ≈ 3.044). */
export const TARGET_AS = 2.1e-9;

/** Pivot scale of A_s and n_s: k_* = 0.05 Mpc^-1 (Planck 2018 X, arXiv:1807.06211). */
export const PIVOT_K_PER_MPC = 0.05;

/** 1 Mpc^-1 in GeV: ħc = 1.973269804e-16 GeV m (CODATA 2018, exact), 1 Mpc = 3.0856776e22 m (from memory). */
export const GEV_PER_INVERSE_MPC = 1.973269804e-16 / 3.0856776e22;

/** CMB temperature today, T_0 = 2.7255 K (Fixsen 2009, ApJ 707, 916), in GeV (k_B = 8.617333262e-14 GeV/K, CODATA 2018). */
export const CMB_TEMPERATURE_GEV = 2.7255 * 8.617333262e-14;

/** Entropy degrees of freedom today, g_s0 = 43/11 (photons and three neutrino species; common practice). */
export const ENTROPY_DOF_TODAY = 43 / 11;

/** Relativistic degrees of freedom of the full Standard Model above the electroweak scale (common practice). */
export const STANDARD_MODEL_DOF = 106.75;

/** C = γ_E + ln 2 − 2 of the second-order slow-roll results (Stewart & Lyth 1993, Phys. Lett. B 302, 171). */
export const STEWART_LYTH_C = 0.5772156649015329 + Math.LN2 - 2;
