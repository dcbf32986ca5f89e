//! The converter's operating point and the core material, both optional in a build.

/// Where the reset winding returns the magnetising energy.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum ResetSide {
    /// The reset winding clamps to the input.
    Primary,
    /// The reset winding returns the magnetising energy to the output.
    Secondary,
}

/// The forward converter's operating point: input range, output and the switch.
#[derive(Debug, Clone, PartialEq)]
pub struct Operating {
    /// Where the reset winding returns its energy; default the input.
    pub reset_side: ResetSide,
    /// Lowest input voltage (V), where the duty is highest.
    pub vin_min_v: f64,
    /// Highest input voltage (V), where the switch sees the most off-state voltage.
    pub vin_max_v: f64,
    /// Output voltage (V).
    pub vout_v: f64,
    /// Output current (A).
    pub iout_a: f64,
    /// Forward drop of each diode in the power path (V); default 0.
    pub rectifier_drop_v: f64,
    /// The controller's maximum duty (0 to 1); `None` leaves the reset limit alone to cap it.
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
    /// Coefficient k (kW/m^3 at 1 kHz and 1 T).
    pub k: f64,
    /// Frequency exponent alpha.
    pub alpha: f64,
    /// Flux density exponent beta.
    pub beta: f64,
}

/// The core's ferrite. With a `grade`, the values are that grade's typical figures with the
/// file's explicit keys written over them; the values here are always the resolved ones.
#[derive(Debug, Clone, PartialEq)]
pub struct Material {
    /// The generic ferrite grade the typical figures come from, when one is named.
    pub grade: Option<String>,
    /// Saturation flux density (mT) at the working temperature.
    pub bsat_mt: f64,
    /// Remanent flux density (mT), where the flux returns to after each cycle.
    pub br_mt: f64,
    /// Initial permeability of the ferrite, when known.
    pub mu_i: Option<f64>,
    /// Core-loss coefficients, when known.
    pub steinmetz: Option<Steinmetz>,
    /// Total air gap in the magnetic path of the assembled core; with `mu_i` it sets AL.
    pub gap_mm: Option<f64>,
}
