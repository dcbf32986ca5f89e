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
    /// Temperature rise the user accepts; `None` takes the engine's default.
    pub rise_limit_c: Option<f64>,
    /// Outer surface of the wound transformer; `None` lets the engine estimate it.
    pub surface_area_cm2: Option<f64>,
    /// On-state drop of the switch (V), taken off the input while it conducts; default 0.
    pub switch_drop_v: f64,
    /// Air around the transformer (C); `None` takes the engine's default.
    pub ambient_c: Option<f64>,
    /// Rated off-state voltage of the switch (V), checked against the off-state voltage.
    pub switch_rating_v: Option<f64>,
}

/// Steinmetz coefficients: P in kW/m^3 with f in kHz and B in T.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Steinmetz {
    pub k: f64,
    pub alpha: f64,
    pub beta: f64,
}

/// The core's ferrite. With a `grade`, the values are that grade's typical figures with the
/// file's explicit keys written over them; the values here are always the resolved ones.
#[derive(Debug, Clone, PartialEq)]
pub struct Material {
    pub grade: Option<String>,
    pub bsat_mt: f64,
    pub br_mt: f64,
    pub mu_i: Option<f64>,
    pub steinmetz: Option<Steinmetz>,
    /// Total air gap in the magnetic path of the assembled core; with `mu_i` it sets AL.
    pub gap_mm: Option<f64>,
}
