//! The Evaluation: every figure of a build, computed once, read by every front end.

use super::ac;
use super::capacitance::{self, CapacitanceEval};
use super::conductor;
use super::constants::{FIT_TOLERANCE_MM, MM};
use super::converter::{self, ConverterEval};
use super::currents::{self, CurrentSource, WindingCurrent};
use super::isolation;
use super::layout::{self, Laid, LaidKind};
use super::leakage;
use super::limits::{self, CURRENT_DENSITY_BAND_A_MM2, Constraint, Limit};
use super::losses::{self, LossEval};
use super::memo::Memo;
use super::remarks::{Note, Warning, WarningAt, WarningKind};
use super::resistance::rho_ohm_m;
use super::stress::{self, StressEval};
use super::thermal;
use super::validate::validate_resolved;
use super::warnings;
use super::{harmonics, litz};
use crate::model::{Build, Conductor, Name, Role};

mod ac_figures;
mod ac_litz;
mod design_limits;
mod sections;
mod temperature;

use ac_figures::ac_figures;
use design_limits::design_limits;
use sections::{first_ps_leakage, leakage_pairs, section_eval, winding_length_mm};
pub use temperature::TemperatureSource;
use temperature::{Electrical, solve_temperature};

/// Every figure of a build, worked out once by `evaluate`: the fit in the window, each
/// section and winding, leakage, the converter, stress, capacitance, losses, the limits,
/// and the warnings and notes. The fronts only read it.
#[derive(Debug, Clone, PartialEq)]
pub struct Evaluation {
    /// `window.width_mm - 2 margin_mm`.
    pub usable_width_mm: f64,
    /// The bobbin window's width between the flanges (mm).
    pub window_width_mm: f64,
    /// The bobbin window's height from the tube surface (mm).
    pub window_height_mm: f64,
    /// Sum of the section heights (mm), before the allowance.
    pub build_height_mm: f64,
    /// Build height x the allowance factor.
    pub height_with_allowance_mm: f64,
    /// The height with allowance is within the window height.
    pub fits: bool,
    /// `window_height_mm - height_with_allowance_mm`; negative when it does not fit.
    pub spare_height_mm: f64,
    /// Copper area of every turn and strand over the window area (width x height).
    pub fill_factor: f64,
    /// The winding temperature the resistances are taken at, and where it came from.
    pub temperature_c: f64,
    /// Where `temperature_c` came from (given, ambient + rise, ...).
    pub temperature_source: TemperatureSource,
    /// Each section of the stack as laid, from the tube outward.
    pub sections: Vec<SectionEval>,
    /// Each winding's figures, in `build.windings` order.
    pub windings: Vec<WindingEval>,
    /// The leakage inductance of each pair of windings that has one.
    pub leakage: Vec<LeakageEval>,
    /// The forward converter's figures (with an operating point).
    pub converter: Option<ConverterEval>,
    /// Voltage between adjacent layers, bifilar pairs and sections (with an operating point).
    pub stress: Option<StressEval>,
    /// Primary-secondary and self-capacitance, and the ringing against the leakage.
    pub capacitance: CapacitanceEval,
    /// Copper, core, total loss and temperature rise (with an operating point).
    pub losses: Option<LossEval>,
    /// What limits the design, the binding constraint first.
    pub limits: Vec<Limit>,
    /// What a winder should know: each warning and where the fronts show it.
    pub warnings: Vec<Warning>,
    /// Remarks that are not warnings (e.g. what the 1-D leakage model cannot see).
    pub notes: Vec<Note>,
}

/// One layer of a winding section as laid.
#[derive(Debug, Clone, PartialEq)]
pub struct LayerEval {
    /// Inner face above the tube surface.
    pub y_mm: f64,
    /// Height of the layer (mm).
    pub height_mm: f64,
    /// Turns in the layer.
    pub turns: u32,
    /// Mean length of a turn at the layer's centre (mm).
    pub mlt_mm: f64,
    /// Holds fewer than the section's turns per layer.
    pub partial: bool,
}

/// What a section holds, with the figures of its layout.
#[derive(Debug, Clone, PartialEq)]
pub enum SectionKind {
    /// Insulation tape over the whole width.
    Tape {
        /// Wraps of tape.
        wraps: u32,
    },
    /// Turns of a winding (and its bifilar partner), in layers.
    Winding {
        /// The winding.
        winding: Name,
        /// The bifilar partner, when there is one.
        partner: Option<Name>,
        /// Turns of this section.
        turns: u32,
        /// Width one turn takes along the layer (mm), every strand (and the partner) together.
        pitch_mm: f64,
        /// Turns that fit across the usable width.
        turns_per_layer: u32,
        /// Number of layers.
        layer_count: u32,
        /// Turns in the outermost layer.
        last_layer_turns: u32,
        /// Height of one layer of wire (mm), without the layer tape.
        layer_height_mm: f64,
        /// Wraps of tape between the layers.
        layer_tape: u32,
        /// The last layer's turns spaced evenly across the width (`spread = true`).
        spread: bool,
        /// Sum over layers of (turns x MLT) / turns.
        mlt_mm: f64,
    },
}

/// One section of the stack as laid: what it holds, where it sits, its layers.
#[derive(Debug, Clone, PartialEq)]
pub struct SectionEval {
    /// Tape or winding, with its layout figures.
    pub kind: SectionKind,
    /// Inner face above the tube surface.
    pub y_mm: f64,
    /// Height of the section (mm), layers and layer tape.
    pub height_mm: f64,
    /// The layers from the inside outward (none for tape).
    pub layers: Vec<LayerEval>,
    /// Some of the section lies beyond the window height (without the allowance).
    pub past_window: bool,
}

/// A winding's AC resistance at the switching frequency (Dowell), sinusoidal and, with a
/// waveform, summed over its harmonics.
#[derive(Debug, Clone, PartialEq)]
pub struct AcFigures {
    /// Skin depth in copper at `frequency_khz` and the winding temperature (mm).
    pub skin_depth_mm: f64,
    /// Sinusoid at `frequency_khz` (the format contract's `ac_factor`).
    pub ac_factor: f64,
    /// AC resistance for a sinusoid (ohm): `ac_factor x dcr_ohm`.
    pub rac_ohm: f64,
    /// Summed over the harmonics of the winding's own waveform, when it has one.
    pub ac_factor_waveform: Option<f64>,
    /// AC resistance for the winding's own waveform (ohm): `ac_factor_waveform x dcr_ohm`.
    pub rac_waveform_ohm: Option<f64>,
}

/// One winding's figures: wire, length, resistance, AC figures, current and loss.
#[derive(Debug, Clone, PartialEq)]
pub struct WindingEval {
    /// The winding's name.
    pub name: Name,
    /// What it does in the converter.
    pub role: Role,
    /// Total turns.
    pub turns: u32,
    /// Conductors in parallel.
    pub strands: u32,
    /// Bare copper diameter of one strand (mm).
    pub bare_mm: f64,
    /// Overall diameter of one strand over its insulation (mm).
    pub od_mm: f64,
    /// Copper area of all strands together (a foil's section, a litz's strands).
    pub copper_area_mm2: f64,
    /// The conductor's kind and own figures (`engine::conductor::figures`).
    pub conductor: crate::engine::conductor::ConductorFigures,
    /// Wire length of one strand over all the winding's turns (m), leads left out.
    pub length_m: f64,
    /// Mean length of a turn over all the winding's sections (mm).
    pub mlt_mm: f64,
    /// DC resistance (ohm) at `temperature_c`, the strands in parallel (IEC 60028).
    pub dcr_ohm: f64,
    /// AC figures, when the setup gives a frequency.
    pub ac: Option<AcFigures>,
    /// Current density from the RMS current used (given, or from the operating point).
    pub current_density_a_mm2: Option<f64>,
    /// RMS current used: `current_rms_a` when given, else the operating point's.
    pub current_rms_a: Option<f64>,
    /// Where `current_rms_a` came from.
    pub current_source: Option<CurrentSource>,
    /// What the operating point gives, shown beside a given current for comparison.
    pub current_model_rms_a: Option<f64>,
    /// `I_rms^2 x` the waveform AC resistance (or the sinusoidal one, or DC, when that is
    /// all there is; see the format document).
    pub copper_loss_w: Option<f64>,
    /// The highest voltage between two adjacent layers of this winding's sections (with an
    /// operating point; see `engine::stress`).
    pub layer_voltage_v: Option<f64>,
    /// Loss from the primary-secondary field in a winding other than the first primary and
    /// secondary (its layers' proximity loss), included in `copper_loss_w`.
    pub proximity_loss_w: Option<f64>,
}

/// The leakage inductance between two windings, referred to one of them.
#[derive(Debug, Clone, PartialEq)]
pub struct LeakageEval {
    /// The winding the meter is on.
    pub from: Name,
    /// The winding shorted.
    pub to: Name,
    /// The winding whose turns the figure is referred to.
    pub referred_to: Name,
    /// The 1-D field across the build plus `bifilar_uh`.
    pub uh: f64,
    /// The share from the field between neighbouring wires of sections the two wind bifilar.
    pub bifilar_uh: f64,
}

impl Evaluation {
    /// What makes the build fail a check: not fitting, and every other broken limit, in the
    /// order of the limits table (the worst first). Empty when the design passes.
    pub fn failures(&self) -> Vec<Constraint> {
        let mut out = Vec::new();
        if !self.fits {
            out.push(Constraint::Fit);
        }
        out.extend(
            self.limits
                .iter()
                .filter(|l| l.broken() && l.constraint != Constraint::Fit)
                .map(|l| l.constraint),
        );
        out
    }
}

pub(super) fn evaluate(build: &Build, memo: &mut Memo) -> Evaluation {
    memo.trim();
    let resolved = layout::Resolved::new(build);
    let wires = &resolved.wires;
    let laid = layout::lay_out(build, &resolved);
    let window = &build.bobbin.window;

    let build_height_mm: f64 = laid.iter().map(|l| l.height_mm).sum();
    let height_with_allowance_mm = build_height_mm * build.setup.allowance_factor;
    let fits = height_with_allowance_mm <= window.height_mm + FIT_TOLERANCE_MM;

    let leakage = leakage_pairs(build, &laid, wires);
    let problems = validate_resolved(build, &resolved);
    let (
        temperature_c,
        temperature_source,
        Electrical {
            windings,
            converter,
            losses,
            ac_warnings,
        },
    ) = solve_temperature(build, &laid, wires, problems.is_empty(), &leakage, memo);
    let fill_factor = fill_factor(build, &windings);

    let stress = converter
        .as_ref()
        .and_then(|c| stress::evaluate(build, &laid, c));
    let mut windings = windings;
    if let Some(st) = &stress {
        for (w, v) in windings.iter_mut().zip(&st.layer_voltage_v) {
            w.layer_voltage_v = *v;
        }
    }
    let capacitance = capacitance::evaluate(
        build,
        &laid,
        wires,
        layout::usable_width_mm(build),
        first_ps_leakage(build, &leakage),
    );
    // Last, since the layers move into the sections.
    let sections = laid
        .into_iter()
        .map(|l| section_eval(build, l, window.height_mm))
        .collect();

    let mut eval = Evaluation {
        usable_width_mm: layout::usable_width_mm(build),
        window_width_mm: window.width_mm,
        window_height_mm: window.height_mm,
        build_height_mm,
        height_with_allowance_mm,
        fits,
        spare_height_mm: window.height_mm - height_with_allowance_mm,
        fill_factor,
        temperature_c,
        temperature_source,
        sections,
        windings,
        leakage,
        limits: Vec::new(),
        converter,
        stress,
        capacitance,
        losses,
        warnings: Vec::new(),
        notes: Vec::new(),
    };
    eval.limits = design_limits(&eval);
    warnings::collect(build, &problems, &mut eval);
    eval.warnings.extend(ac_warnings);
    isolation::warnings(build, &resolved.sections, &mut eval.warnings);
    eval
}

/// The copper area of every winding's turns over the window area (0 for an empty window).
fn fill_factor(build: &Build, windings: &[WindingEval]) -> f64 {
    let window = &build.bobbin.window;
    let window_area = window.width_mm * window.height_mm;
    if window_area > 0.0 {
        build
            .windings
            .iter()
            .zip(windings)
            .map(|(w, e)| f64::from(w.turns) * e.copper_area_mm2)
            .sum::<f64>()
            / window_area
    } else {
        0.0
    }
}
