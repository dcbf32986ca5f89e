//! Each winding's current waveform over one period from the operating point, and the RMS
//! current used for its losses (the user's `current_rms_a` wins, the shape stays).
//!
//! Assumptions, in the format document too: continuous conduction, output inductor ripple
//! neglected (flat-topped pulses), ideal switch and diodes, at `vin_min_v` where the duty
//! and so the RMS currents are largest.

use super::converter::ConverterEval;
use super::harmonics::Waveform;
use super::outputs::OutputAt;
use crate::model::{Build, Role};

/// Where a winding's RMS current comes from.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum CurrentSource {
    /// The winding's `current_rms_a`.
    Given,
    /// Computed from the operating point.
    OperatingPoint,
}

impl CurrentSource {
    /// The words reports and JSON show for it (`given`, `operating point`).
    pub fn key(self) -> &'static str {
        match self {
            CurrentSource::Given => "given",
            CurrentSource::OperatingPoint => "operating point",
        }
    }
}

/// One winding's RMS current (A), where it came from, and what the operating point gives.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct WindingCurrent {
    /// The RMS current used for the winding's figures.
    pub rms_a: Option<f64>,
    /// Where `rms_a` came from; `None` without a current.
    pub source: Option<CurrentSource>,
    /// What the operating point gives (first winding of each power role only).
    pub model_rms_a: Option<f64>,
    /// The waveform's shape, scaled to `rms_a` when there is one.
    pub waveform: Option<Waveform>,
}

/// The shape of each role's current, in amperes, at `vin_min_v`:
/// primary the reflected load `sum Ik Nk/Np` plus the magnetising ramp over D; secondary its
/// output's `Ik` over D (`load_a`; a secondary without an output takes the regulated one's
/// shape); reset a triangle from `Im Np/Nr` to zero over the reset time.
fn role_waveform(
    build: &Build,
    c: &ConverterEval,
    role: Role,
    load_a: Option<f64>,
) -> Option<Waveform> {
    let op = build.operating.as_ref()?;
    let d = c.duty_used_at_vin_min;
    let f_hz = build.setup.frequency_khz? * 1e3;
    match role {
        Role::Primary => {
            let reflected = c.reflected_a;
            let im = c.magnetising_peak_a.unwrap_or(0.0);
            Some(Waveform::ramp(reflected, reflected + im, 0.0, d))
        }
        Role::Secondary => Some(Waveform::pulse(
            load_a.unwrap_or_else(|| op.regulated().iout_a),
            d,
        )),
        Role::Reset => {
            let r = c.reset_time_us * 1e-6 * f_hz;
            // Without an inductance the size is unknown but the shape still sets the AC factor.
            let peak = c.reset_peak_a.unwrap_or(1.0);
            Some(Waveform::ramp(peak, 0.0, d, d + r))
        }
        Role::Auxiliary => None,
    }
}

/// Each winding's current. The first winding of each power role gets the operating point's
/// RMS, and so does every winding that feeds an output (each its own output's current).
/// `feeds` are the build's outputs as [`super::outputs::resolve`] gives them.
pub fn winding_currents(
    build: &Build,
    conv: Option<&ConverterEval>,
    feeds: &[OutputAt<'_>],
) -> Vec<WindingCurrent> {
    build
        .windings
        .iter()
        .enumerate()
        .map(|(k, w)| {
            let load_a = feeds
                .iter()
                .find(|o| o.winding == k)
                .map(|o| o.figures.iout_a);
            let shape = conv.and_then(|c| role_waveform(build, c, w.role, load_a));
            // The shape's own RMS, before any scaling to the current used.
            let shape_rms_a = shape.as_ref().map(Waveform::rms);
            let first =
                build.windings.iter().position(|x| x.role == w.role) == Some(k) || load_a.is_some();
            let sized = w.role != Role::Reset || conv.is_some_and(|c| c.reset_peak_a.is_some());
            let model_rms_a = shape_rms_a.filter(|_| first && sized);
            let (rms_a, source) = match (w.current_rms_a, model_rms_a) {
                (Some(a), _) => (Some(a), Some(CurrentSource::Given)),
                (None, Some(a)) => (Some(a), Some(CurrentSource::OperatingPoint)),
                (None, None) => (None, None),
            };
            let waveform = shape.map(|s| match (rms_a, shape_rms_a) {
                (Some(a), Some(r)) if r > 0.0 => s.scaled(a / r),
                _ => s,
            });
            WindingCurrent {
                rms_a,
                source,
                model_rms_a,
                waveform,
            }
        })
        .collect()
}
