//! What limits the design: each constraint's margin as a fraction of what it allows,
//! sorted so the binding one (the smallest margin) comes first.

use crate::model::Name;

/// Current density that small switch-mode transformers run at with natural convection,
/// 3-6 A/mm^2 RMS (common practice; 500 circular mils per ampere is 3.95 A/mm^2).
pub const CURRENT_DENSITY_BAND_A_MM2: (f64, f64) = (3.0, 6.0);

/// What can limit a design; `engine::limits` reports each with its margin, binding first.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Constraint {
    /// Height with allowance against the window height.
    Fit,
    /// Duty needed at the lowest input against the duty available.
    ResetDuty,
    /// Worst-case flux swing against Bsat - Br.
    Saturation,
    /// Temperature rise against the limit.
    TemperatureRise,
    /// The highest winding current density against the band's upper end.
    CurrentDensity,
    /// Switch off-state voltage (no spike) against `switch_rating_v`, when given.
    SwitchVoltage,
    /// Hot spot (ambient + rise) against the lowest thermal class of wire, tape and bobbin.
    HotSpot,
}

impl Constraint {
    /// Every constraint, in the order reports list them when margins tie.
    pub const ALL: [Constraint; 7] = [
        Constraint::Fit,
        Constraint::ResetDuty,
        Constraint::Saturation,
        Constraint::TemperatureRise,
        Constraint::CurrentDensity,
        Constraint::SwitchVoltage,
        Constraint::HotSpot,
    ];

    /// The stable key reports and JSON use (`fit`, `reset-duty`, `hot-spot`, ...).
    pub fn key(self) -> &'static str {
        match self {
            Constraint::Fit => "fit",
            Constraint::ResetDuty => "reset-duty",
            Constraint::Saturation => "saturation",
            Constraint::TemperatureRise => "temperature-rise",
            Constraint::CurrentDensity => "current-density",
            Constraint::SwitchVoltage => "switch-voltage",
            Constraint::HotSpot => "hot-spot",
        }
    }
}

/// One constraint with what the build uses of it, what it allows, and the margin left.
#[derive(Debug, Clone, PartialEq)]
pub struct Limit {
    /// Which constraint.
    pub constraint: Constraint,
    /// `1 - used / allowed`: 0.25 means a quarter of the allowance is left; negative
    /// means the constraint is broken.
    pub margin: f64,
    /// What the build takes (in `unit`).
    pub used: f64,
    /// What the constraint allows (in `unit`).
    pub allowed: f64,
    /// Unit of `used` and `allowed` ("mm", "duty", "mT", "C", "A/mm2").
    pub unit: &'static str,
    /// What it is about, e.g. the winding with the highest current density.
    pub about: Option<Name>,
}

impl Limit {
    /// A limit with its margin worked out (`-1` when nothing is allowed).
    pub fn new(
        constraint: Constraint,
        used: f64,
        allowed: f64,
        unit: &'static str,
        about: Option<Name>,
    ) -> Self {
        // A limit that allows nothing is broken outright: -1, a finite number the JSON can
        // carry (infinity would print as null).
        let margin = if allowed > 0.0 {
            1.0 - used / allowed
        } else {
            -1.0
        };
        Limit {
            constraint,
            margin,
            used,
            allowed,
            unit,
            about,
        }
    }

    /// True when the build takes more than is allowed (margin below 0).
    pub fn broken(&self) -> bool {
        self.margin < 0.0
    }
}

/// Smallest margin first; the order of the input breaks ties.
pub fn rank(mut limits: Vec<Limit>) -> Vec<Limit> {
    limits.sort_by(|a, b| a.margin.total_cmp(&b.margin));
    limits
}
