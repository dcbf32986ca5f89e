//! The converter's operating point and the core material, both optional in a build.

#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum ResetSide {
    /// The reset winding clamps to the input.
    Primary,
    /// The reset winding returns the magnetising energy to the output.
    Secondary,
}

#[derive(Debug, Clone, PartialEq)]
pub struct Operating {
    pub reset_side: ResetSide,
    pub vin_min_v: f64,
    pub vin_max_v: f64,
    pub vout_v: f64,
    pub iout_a: f64,
    pub rectifier_drop_v: f64,
    pub duty_limit: Option<f64>,
}

/// Steinmetz coefficients: P in kW/m^3 with f in kHz and B in T.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Steinmetz {
    pub k: f64,
    pub alpha: f64,
    pub beta: f64,
}

#[derive(Debug, Clone, PartialEq)]
pub struct Material {
    pub bsat_mt: f64,
    pub br_mt: f64,
    pub mu_i: Option<f64>,
    pub steinmetz: Option<Steinmetz>,
}
