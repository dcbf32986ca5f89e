//! What a converter must do, before any turns are chosen: the input of `turnstack design`.
//! Plain data; the engine (`engine::design`) turns it into ranked builds.

use super::{Material, Operating, Setup};

/// The switch the converter uses: its rated off-state voltage and the share of it the
/// off-state voltage may take before the turn-off spike.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SwitchSpec {
    /// Rated off-state voltage of the switch (V).
    pub voltage_rating_v: f64,
    /// Fraction of the rating the off-state voltage (no spike) may use; default 0.8.
    pub derating: f64,
}

impl SwitchSpec {
    /// The default `derating` (FORMAT.md, "Requirements file"): a fifth of the rating is left
    /// for the leakage spike and the input's surges (common practice).
    pub const DEFAULT_DERATING: f64 = 0.8;

    /// `derating x voltage_rating_v` (V): the most the off-state voltage may be.
    pub fn allowed_v(&self) -> f64 {
        self.derating * self.voltage_rating_v
    }
}

/// A requirements file: the setup, the operating point (with its outputs), the core material,
/// the switch, and optionally the bobbins to try.
#[derive(Debug, Clone, PartialEq)]
pub struct Requirements {
    /// The file's `title`.
    pub title: String,
    /// `[setup]`; `frequency_khz` is required here.
    pub setup: Setup,
    /// `[operating]` and the `[[output]]` tables; `duty_limit` is required here, and
    /// `switch_rating_v` mirrors `switch.voltage_rating_v`.
    pub operating: Operating,
    /// `[material]`: the core material, needed for the flux headroom and core loss.
    pub material: Material,
    /// `[switch]`: the rating and derating.
    pub switch: SwitchSpec,
    /// `bobbins = [...]`: the ids to try; `None` tries every bobbin the library sees.
    pub bobbins: Option<Vec<String>>,
}
