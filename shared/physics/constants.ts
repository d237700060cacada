/** Magnetic constant µ0 in H/m (CODATA 2018: 1.25663706212e-6; 4π×10⁻⁷ to 1.5e-10 relative). */
export const MU0 = 1.25663706212e-6;

/** Standard acceleration of gravity, m/s² (CGPM 1901, exact). */
export const STANDARD_GRAVITY = 9.80665;
