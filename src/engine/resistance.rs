//! DC resistance of copper conductors (IEC 60028 resistivity and temperature coefficient).

use super::constants::{ALPHA20_PER_K, MM2, RHO20_OHM_M};
use std::f64::consts::PI;

/// Resistivity of annealed copper at `temperature_c` (ohm m), IEC 60028 linear law.
pub fn rho_ohm_m(temperature_c: f64) -> f64 {
    RHO20_OHM_M * (1.0 + ALPHA20_PER_K * (temperature_c - 20.0))
}

/// Bare cross-section (mm^2) of a round conductor.
pub fn area_mm2(bare_mm: f64) -> f64 {
    PI * bare_mm * bare_mm / 4.0
}

/// Resistance per metre (ohm/m) of `strands` round conductors in parallel.
pub fn ohm_per_m(bare_mm: f64, strands: u32, temperature_c: f64) -> f64 {
    rho_ohm_m(temperature_c) / (f64::from(strands.max(1)) * area_mm2(bare_mm) * MM2)
}

/// The ratio R(T2)/R(T1) for copper, IEC 60028.
pub fn temperature_ratio(from_c: f64, to_c: f64) -> f64 {
    rho_ohm_m(to_c) / rho_ohm_m(from_c)
}
