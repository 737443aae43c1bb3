// Physical constants (SI) shared by the microstrip and discontinuity models.
/** Vacuum permeability μ0 = 4π·10⁻⁷ H/m (the classical value the models were fitted with). */
export const MU0 = 4e-7 * Math.PI;
/** Speed of light in vacuum (m/s), exact. */
export const C0 = 299_792_458;
/** Free-space wave impedance η0 = μ0·c0 ≈ 376.730 Ω. */
export const ETA0 = MU0 * C0;
