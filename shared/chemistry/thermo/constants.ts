/**
 * Constants of the thermochemistry core. Units: K, J/(mol K), kJ/mol.
 */

/**
 * Molar gas constant R = 8.314 462 618 J/(mol K), exact in the 2019 SI (CODATA 2018; from memory).
 * The same value the NASA TM-4513 equations are evaluated with here.
 */
export const GAS_CONSTANT = 8.314462618;

/** Reference temperature of the tables, 298.15 K. It is not part of the standard state. */
export const REFERENCE_TEMPERATURE = 298.15;

/**
 * Fits whose range starts at exactly this temperature (K) are used down to
 * `REFERENCE_TEMPERATURE`: a 1.85 K extrapolation that practice accepts (NASA TM-4513 fits of
 * many gases start at 300 K; see shared/data/nasa-tm4513/SOURCE.md). No other range is ever
 * extended.
 */
export const TOLERATED_RANGE_START = 300;

/**
 * A jump of H at a joint inside one form larger than this (kJ/mol) is reported as a
 * discontinuous joint. Every joint of the NASA TM-4513 file agrees within 0.1 kJ/mol except
 * ZnSO4(a) at 540 K and Li2O(s) at 1000 K.
 */
export const JOINT_JUMP_THRESHOLD = 0.1;

/** Temperatures closer than this (K) count as the same boundary (forms share boundaries). */
export const BOUNDARY_TOLERANCE = 1e-6;
