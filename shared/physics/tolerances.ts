/** Eigenvalues above −PHYSICAL_TOLERANCE count as non-negative (a unit-trace ρ is then "physical"). */
export const PHYSICAL_TOLERANCE = 1e-10;
