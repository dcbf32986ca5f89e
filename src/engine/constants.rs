//! Physical constants used by the figures, each with its source.

/// Resistivity of annealed copper at 20 C, IEC 60028 (1/58 ohm mm^2/m).
pub const RHO20_OHM_M: f64 = 1.7241e-8;

/// Temperature coefficient of resistance of annealed copper at 20 C, IEC 60028 / IACS.
pub const ALPHA20_PER_K: f64 = 0.00393;

/// Permeability of free space (H/m); the pre-2019 exact value, within 1e-9 of CODATA.
pub const MU0_H_PER_M: f64 = 4.0e-7 * std::f64::consts::PI;

/// Tolerance on the fit comparison, as the spec defines it (mm).
pub const FIT_TOLERANCE_MM: f64 = 1e-9;

/// Guard against a pitch that divides the width exactly being floored one short.
pub const TURNS_PER_LAYER_EPS: f64 = 1e-9;

/// Metres in a millimetre.
pub const MM: f64 = 1e-3;
/// Square metres in a square millimetre.
pub const MM2: f64 = 1e-6;
