//! The Evaluation: every figure of a build, computed once, read by every front end.

use super::ac;
use super::capacitance::{self, CapacitanceEval};
use super::constants::{FIT_TOLERANCE_MM, MM};
use super::converter::{self, ConverterEval};
use super::currents::{self, CurrentSource, WindingCurrent};
use super::layout::{self, Laid, LaidKind};
use super::leakage;
use super::limits::{self, CURRENT_DENSITY_BAND_A_MM2, Constraint, Limit};
use super::losses::{self, LossEval};
use super::memo::Memo;
use super::remarks::{Note, Warning, WarningAt, WarningKind};
use super::resistance::{area_mm2, ohm_per_m, rho_ohm_m};
use super::stress::{self, StressEval};
use super::thermal;
use super::validate::validate_resolved;
use super::warnings;
use crate::model::{Build, Name, Role};

#[derive(Debug, Clone, PartialEq)]
pub struct Evaluation {
    /// `window.width_mm - 2 margin_mm`.
    pub usable_width_mm: f64,
    pub window_width_mm: f64,
    pub window_height_mm: f64,
    pub build_height_mm: f64,
    /// Build height x bulge.
    pub height_with_allowance_mm: f64,
    pub fits: bool,
    /// `window_height_mm - height_with_allowance_mm`; negative when it does not fit.
    pub spare_height_mm: f64,
    pub fill_factor: f64,
    /// The winding temperature the resistances are taken at, and where it came from.
    pub temperature_c: f64,
    pub temperature_source: TemperatureSource,
    pub sections: Vec<SectionEval>,
    pub windings: Vec<WindingEval>,
    pub leakage: Vec<LeakageEval>,
    pub converter: Option<ConverterEval>,
    /// Voltage between adjacent layers, bifilar pairs and sections (with an operating point).
    pub stress: Option<StressEval>,
    /// Primary-secondary and self-capacitance, and the ringing against the leakage.
    pub capacitance: CapacitanceEval,
    /// Copper, core, total loss and temperature rise (with an operating point).
    pub losses: Option<LossEval>,
    /// What limits the design, the binding constraint first.
    pub limits: Vec<Limit>,
    pub warnings: Vec<Warning>,
    /// Remarks that are not warnings (e.g. what the 1-D leakage model cannot see).
    pub notes: Vec<Note>,
}

#[derive(Debug, Clone, PartialEq)]
pub struct LayerEval {
    /// Inner face above the tube surface.
    pub y_mm: f64,
    pub height_mm: f64,
    pub turns: u32,
    pub mlt_mm: f64,
    /// Holds fewer than the section's turns per layer.
    pub partial: bool,
}

#[derive(Debug, Clone, PartialEq)]
pub enum SectionKind {
    Tape {
        wraps: u32,
    },
    Winding {
        winding: Name,
        with: Option<Name>,
        turns: u32,
        pitch_mm: f64,
        turns_per_layer: u32,
        layer_count: u32,
        last_layer_turns: u32,
        layer_height_mm: f64,
        layer_tape: u32,
        /// Sum over layers of (turns x MLT) / turns.
        mlt_mm: f64,
    },
}

#[derive(Debug, Clone, PartialEq)]
pub struct SectionEval {
    pub kind: SectionKind,
    /// Inner face above the tube surface.
    pub y_mm: f64,
    pub height_mm: f64,
    pub layers: Vec<LayerEval>,
    /// Some of the section lies beyond the window height (without the allowance).
    pub past_window: bool,
}

#[derive(Debug, Clone, PartialEq)]
pub struct AcFigures {
    pub skin_depth_mm: f64,
    /// Sinusoid at `frequency_khz` (the format contract's `ac_factor`).
    pub ac_factor: f64,
    pub rac_ohm: f64,
    /// Summed over the harmonics of the winding's own waveform, when it has one.
    pub ac_factor_waveform: Option<f64>,
    pub rac_waveform_ohm: Option<f64>,
}

#[derive(Debug, Clone, PartialEq)]
pub struct WindingEval {
    pub name: Name,
    pub role: Role,
    pub turns: u32,
    pub strands: u32,
    pub bare_mm: f64,
    pub od_mm: f64,
    /// Copper area of all strands together.
    pub copper_area_mm2: f64,
    pub length_m: f64,
    pub mlt_mm: f64,
    pub dcr_ohm: f64,
    pub ac: Option<AcFigures>,
    /// Current density from the RMS current used (given, or from the operating point).
    pub current_density_a_mm2: Option<f64>,
    /// RMS current used: `current_rms_a` when given, else the operating point's.
    pub current_rms_a: Option<f64>,
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

#[derive(Debug, Clone, PartialEq)]
pub struct LeakageEval {
    pub from: Name,
    pub to: Name,
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
    let height_with_allowance_mm = build_height_mm * build.setup.bulge;
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
    let window_area = window.width_mm * window.height_mm;
    let fill_factor = if window_area > 0.0 {
        build
            .windings
            .iter()
            .zip(&windings)
            .map(|(w, e)| f64::from(w.turns) * e.copper_area_mm2)
            .sum::<f64>()
            / window_area
    } else {
        0.0
    };

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
    eval
}

/// What depends on the winding temperature: resistances, AC figures, currents, losses.
struct Electrical {
    windings: Vec<WindingEval>,
    converter: Option<ConverterEval>,
    losses: Option<LossEval>,
    ac_warnings: Vec<Warning>,
}

/// Where the temperature the resistances are taken at came from.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum TemperatureSource {
    /// `[setup] temperature_c`.
    Given,
    /// Ambient plus the predicted rise, solved to a fixed point.
    AmbientPlusRise,
    /// `[operating] ambient_c`, with no rise to add (no surface area to predict it from).
    Ambient,
    /// The format's default (20 C): neither a temperature nor an operating point to find one.
    Default,
}

impl TemperatureSource {
    pub fn key(self) -> &'static str {
        match self {
            TemperatureSource::Given => "given",
            TemperatureSource::AmbientPlusRise => "ambient + rise",
            TemperatureSource::Ambient => "ambient",
            TemperatureSource::Default => "default",
        }
    }
}

/// Stop the fixed point when the temperature moves less than this (C) ...
const TEMPERATURE_TOLERANCE_C: f64 = 0.01;
/// ... or after this many rounds (it converges in a handful: the rise grows with the
/// resistance as `(1 + alpha dT)^0.826`, a contraction for any rise a winding survives).
const TEMPERATURE_ROUNDS: usize = 30;
/// Above this the copper law and the winding are both past their use; the loop stops there.
const TEMPERATURE_CEILING_C: f64 = 250.0;

/// The temperature the resistances are taken at, where it came from, and every figure that
/// depends on it. A given `temperature_c` wins; else ambient + the predicted rise, found by
/// iterating `T = ambient + rise(losses at T)`.
fn solve_temperature(
    build: &Build,
    laid: &[Laid],
    wires: &[crate::library::wires::ResolvedWire],
    valid: bool,
    leakage: &[LeakageEval],
    memo: &mut Memo,
) -> (f64, TemperatureSource, Electrical) {
    let at = |t: f64, memo: &mut Memo| electrical(build, laid, wires, valid, leakage, t, memo);
    if build.setup.temperature_given || build.operating.is_none() {
        let source = if build.setup.temperature_given {
            TemperatureSource::Given
        } else {
            TemperatureSource::Default
        };
        let t = build.setup.temperature_c;
        return (t, source, at(t, memo));
    }
    let ambient = build
        .operating
        .as_ref()
        .and_then(|o| o.ambient_c)
        .unwrap_or(thermal::DEFAULT_AMBIENT_C);
    let mut t = ambient;
    let mut e = at(t, memo);
    if e.losses
        .as_ref()
        .and_then(|l| l.temperature_rise_c)
        .is_none()
    {
        let given_ambient = build.operating.as_ref().and_then(|o| o.ambient_c);
        return match given_ambient {
            Some(a) => (a, TemperatureSource::Ambient, e),
            None => {
                let t = build.setup.temperature_c;
                (t, TemperatureSource::Default, at(t, memo))
            }
        };
    }
    for _ in 0..TEMPERATURE_ROUNDS {
        let rise = e
            .losses
            .as_ref()
            .and_then(|l| l.temperature_rise_c)
            .unwrap_or(0.0);
        let next = (ambient + rise).min(TEMPERATURE_CEILING_C);
        if (next - t).abs() < TEMPERATURE_TOLERANCE_C {
            break;
        }
        t = next;
        e = at(t, memo);
    }
    (t, TemperatureSource::AmbientPlusRise, e)
}

/// The figures of [`Electrical`] with the windings at `temperature_c`.
fn electrical(
    build: &Build,
    laid: &[Laid],
    wires: &[crate::library::wires::ResolvedWire],
    valid: bool,
    leakage: &[LeakageEval],
    temperature_c: f64,
    memo: &mut Memo,
) -> Electrical {
    let mut windings: Vec<WindingEval> = build
        .windings
        .iter()
        .enumerate()
        .map(|(i, w)| {
            let copper_area_mm2 = f64::from(w.strands) * area_mm2(wires[i].bare_mm);
            let length_mm = winding_length_mm(laid, i);
            let length_m = length_mm * MM;
            WindingEval {
                name: w.name.clone(),
                role: w.role,
                turns: w.turns,
                strands: w.strands,
                bare_mm: wires[i].bare_mm,
                od_mm: wires[i].od_mm,
                copper_area_mm2,
                length_m,
                mlt_mm: if w.turns > 0 {
                    length_mm / f64::from(w.turns)
                } else {
                    0.0
                },
                dcr_ohm: ohm_per_m(wires[i].bare_mm, w.strands, temperature_c) * length_m,
                ac: None,
                current_density_a_mm2: None,
                current_rms_a: None,
                current_source: None,
                current_model_rms_a: None,
                copper_loss_w: None,
                layer_voltage_v: None,
                proximity_loss_w: None,
            }
        })
        .collect();

    let mut converter = if valid {
        converter::evaluate(build)
    } else {
        None
    };
    if let Some(c) = converter.as_mut()
        && let Some(l) = first_ps_leakage(build, leakage)
    {
        converter::apply_leakage(c, build, l);
    }
    if let Some(c) = converter.as_mut()
        && let Some(r) = windings.iter().find(|w| w.role == Role::Reset)
        && r.copper_area_mm2 > 0.0
    {
        c.reset_current_density_a_mm2 = c.reset_rms_a.map(|i| i / r.copper_area_mm2);
    }
    let currents = currents::winding_currents(build, converter.as_ref());
    for (w, c) in windings.iter_mut().zip(&currents) {
        w.current_rms_a = c.rms_a;
        w.current_source = c.source;
        w.current_model_rms_a = c.model_rms_a;
        w.current_density_a_mm2 = c
            .rms_a
            .filter(|_| w.copper_area_mm2 > 0.0)
            .map(|a| a / w.copper_area_mm2);
    }
    let mut ac_warnings = Vec::new();
    if build.setup.frequency_khz.is_some() {
        ac_figures(
            build,
            laid,
            temperature_c,
            wires,
            &currents,
            &mut windings,
            &mut ac_warnings,
            memo,
        );
    }
    for w in windings.iter_mut() {
        let r =
            w.ac.as_ref()
                .map_or(w.dcr_ohm, |a| a.rac_waveform_ohm.unwrap_or(a.rac_ohm));
        w.copper_loss_w = match (w.current_rms_a, w.proximity_loss_w) {
            (Some(i), p) => Some(i * i * r + p.unwrap_or(0.0)),
            (None, p) => p,
        };
    }
    let losses = converter
        .as_ref()
        .map(|c| losses::evaluate(build, c, &windings, memo));
    Electrical {
        windings,
        converter,
        losses,
        ac_warnings,
    }
}

/// A winding's length: every layer it appears in, as `winding` or as bifilar `with`.
fn winding_length_mm(laid: &[Laid], k: usize) -> f64 {
    let mut length_mm = 0.0;
    for l in laid {
        if let LaidKind::Winding {
            winding,
            with,
            layers,
            ..
        } = &l.kind
        {
            // Twice for a section bifilar with itself (refused by validation), as a pair.
            let times = usize::from(*winding == Some(k)) + usize::from(*with == Some(k));
            for _ in 0..times {
                length_mm += layers
                    .iter()
                    .map(|ly| f64::from(ly.turns) * ly.mlt_mm)
                    .sum::<f64>();
            }
        }
    }
    length_mm
}

fn section_eval(build: &Build, l: Laid, window_height_mm: f64) -> SectionEval {
    let past_window = l.y_mm + l.height_mm > window_height_mm + FIT_TOLERANCE_MM;
    match l.kind {
        LaidKind::Tape { wraps } => SectionEval {
            kind: SectionKind::Tape { wraps },
            y_mm: l.y_mm,
            height_mm: l.height_mm,
            layers: Vec::new(),
            past_window,
        },
        LaidKind::Winding {
            winding,
            with,
            turns,
            pitch_mm,
            turns_per_layer,
            layer_height_mm,
            layer_tape,
            layers,
        } => {
            let name = |i: Option<usize>| i.map(|i| build.windings[i].name.clone());
            let weighted: f64 = layers
                .iter()
                .map(|ly| f64::from(ly.turns) * ly.mlt_mm)
                .sum();
            SectionEval {
                kind: SectionKind::Winding {
                    winding: name(winding).unwrap_or_default(),
                    with: name(with),
                    turns,
                    pitch_mm,
                    turns_per_layer,
                    layer_count: layers.len() as u32,
                    last_layer_turns: layers.last().map_or(0, |ly| ly.turns),
                    layer_height_mm,
                    layer_tape,
                    mlt_mm: if turns > 0 {
                        weighted / f64::from(turns)
                    } else {
                        0.0
                    },
                },
                y_mm: l.y_mm,
                height_mm: l.height_mm,
                // The same size as a laid layer, so this reuses the laid list's memory.
                layers: layers
                    .into_iter()
                    .map(|ly| LayerEval {
                        y_mm: ly.y_mm,
                        height_mm: ly.height_mm,
                        turns: ly.turns,
                        mlt_mm: ly.mlt_mm,
                        partial: ly.turns < turns_per_layer,
                    })
                    .collect(),
                past_window,
            }
        }
    }
}

/// The leakage between the first primary and the first secondary (uH, referred to the primary).
fn first_ps_leakage(build: &Build, leakage: &[LeakageEval]) -> Option<f64> {
    let p = build.first_of(Role::Primary)?;
    let s = build.first_of(Role::Secondary)?;
    leakage
        .iter()
        .find(|l| l.from == p.name && l.to == s.name)
        .map(|l| l.uh)
}

/// Every primary-secondary and primary-reset pair, referred to the primary.
fn leakage_pairs(
    build: &Build,
    laid: &[Laid],
    wires: &[crate::library::wires::ResolvedWire],
) -> Vec<LeakageEval> {
    let count = |role: Role| build.windings.iter().filter(|w| w.role == role).count();
    let mut out =
        Vec::with_capacity(count(Role::Primary) * (count(Role::Secondary) + count(Role::Reset)));
    for (pi, p) in build
        .windings
        .iter()
        .enumerate()
        .filter(|(_, w)| w.role == Role::Primary)
    {
        for role in [Role::Secondary, Role::Reset] {
            for (oi, o) in build
                .windings
                .iter()
                .enumerate()
                .filter(|(_, w)| w.role == role)
            {
                let l_h = leakage::leakage_h(
                    laid,
                    &build.bobbin.tube,
                    layout::usable_width_mm(build),
                    build.windings.len(),
                    (pi, p.turns),
                    (oi, o.turns),
                );
                // Wound bifilar, the two share their layers: the field between neighbouring
                // wires along the layer is what is left (engine::leakage).
                let bifilar = leakage::bifilar_leakage_h(laid, pi, oi, |k| {
                    let w = &build.windings[k];
                    let strands = f64::from(w.strands.max(1));
                    (
                        0.5 * wires[k].bare_mm * strands.sqrt(),
                        strands * wires[k].od_mm,
                    )
                });
                out.push(LeakageEval {
                    from: p.name.clone(),
                    to: o.name.clone(),
                    referred_to: p.name.clone(),
                    uh: (l_h + bifilar) * 1e6,
                    bifilar_uh: bifilar * 1e6,
                });
            }
        }
    }
    out
}

/// One winding's AC sums over the layers it has, as [`ac_figures`] collects them.
#[derive(Debug, Clone, Copy, Default)]
struct AcSums {
    /// Taken from the primary-secondary excitation (else section by section from zero MMF).
    paired: bool,
    /// Left without AC figures (wound bifilar across the primary-secondary pair).
    skip: bool,
    /// The memoised spectrum of the winding's waveform, with its DC part and RMS squared.
    spectrum: Option<(usize, f64, f64)>,
    /// Sum of the layer lengths (turns x MLT).
    length: f64,
    /// Sum of the sinusoidal layer factors weighted by length.
    sine: f64,
    /// Sum of the layers' waveform AC power shares weighted by length.
    wave: f64,
    /// Proximity loss from the primary-secondary field, per ohm per metre of this winding:
    /// sum over its layers of `length x F^2 / n_l^2 x (2 a - 4 b)` (see `ac_figures`).
    proximity: f64,
}

impl AcSums {
    /// Add one layer: its D at the switching frequency, the MMF at its faces and its length.
    fn layer(&mut self, memo: &mut Memo, d: f64, f_a: f64, f_b: f64, length: f64) {
        self.length += length;
        self.sine += memo.layer_factor(d, f_a, f_b) * length;
        if let Some((si, dc, rms_sq)) = self.spectrum
            && rms_sq > 0.0
        {
            // Hurley's sum is linear in each layer's two Dowell terms, and layers of the same
            // turns share their D: the harmonics are summed once per distinct D (memoised).
            let share = if f_b == f_a || d < ac::D_SMALL {
                rms_sq - dc * dc
            } else {
                ac::layer_factor_from(memo.summed_terms(si, d), f_a, f_b)
            };
            self.wave += share * length;
        }
    }
}

/// AC factors per the spec: the first primary and first secondary under their leakage
/// excitation, every other winding section by section from zero MMF.
#[allow(clippy::too_many_arguments)]
fn ac_figures(
    build: &Build,
    laid: &[Laid],
    temperature_c: f64,
    wires: &[crate::library::wires::ResolvedWire],
    currents: &[WindingCurrent],
    windings: &mut [WindingEval],
    warnings: &mut Vec<Warning>,
    memo: &mut Memo,
) {
    let Some(f_khz) = build.setup.frequency_khz else {
        return;
    };
    let delta_mm = ac::skin_depth_m(rho_ohm_m(temperature_c), f_khz * 1e3) / MM;
    // The wound breadth: the turns lie between the margins, and so does the field.
    let b_w = layout::usable_width_mm(build);
    let p = build.windings.iter().position(|w| w.role == Role::Primary);
    let s = build
        .windings
        .iter()
        .position(|w| w.role == Role::Secondary);

    let mut sums: Vec<AcSums> = currents
        .iter()
        .map(|c| AcSums {
            spectrum: c.waveform.as_ref().map(|wave| {
                let si = memo.spectrum(wave);
                let sp = memo.spectrum_of(si);
                (si, sp.dc, sp.rms_sq)
            }),
            ..AcSums::default()
        })
        .collect();
    // D is found once per layer at the switching frequency; the n-th harmonic's is D sqrt(n).
    let d_of = |k: usize, turns: u32| {
        let conductors = f64::from(turns) * f64::from(build.windings[k].strands.max(1));
        ac::layer_d(conductors, wires[k].bare_mm, b_w, delta_mm)
    };

    if let (Some(p), Some(s)) = (p, s) {
        let bifilar_ps = laid.iter().any(|l| {
            matches!(&l.kind, LaidKind::Winding { winding: Some(a), with: Some(b), .. }
                if (*a == p && *b == s) || (*a == s && *b == p))
        });
        if bifilar_ps {
            sums[p].skip = true;
            sums[s].skip = true;
            warnings.push(Warning {
                at: WarningAt::Winding(p),
                kind: WarningKind::AcBifilarPs {
                    primary: windings[p].name.clone(),
                    secondary: windings[s].name.clone(),
                },
            });
        } else {
            sums[p].paired = true;
            sums[s].paired = true;
            // The primary's current drives the field the other windings sit in: its spectrum
            // (scaled to the RMS used), or a sinusoid of its RMS.
            let primary_drive = match (sums[p].spectrum, currents[p].rms_a) {
                (Some((si, _, rms_sq)), _) if rms_sq > 0.0 => Some((Some(si), rms_sq)),
                (_, Some(i)) if i > 0.0 => Some((None, i * i)),
                _ => None,
            };
            let return_per_turn =
                -f64::from(build.windings[p].turns) / f64::from(build.windings[s].turns.max(1));
            let weight = leakage::pair_weights(p, s, return_per_turn);
            leakage::for_each_slab_by(laid, weight, |slab| {
                let Some((si, li)) = slab.layer else { return };
                let LaidKind::Winding {
                    winding,
                    with,
                    layers,
                    ..
                } = &laid[si].kind
                else {
                    return;
                };
                let layer = &layers[li];
                // A bifilar partner other than P or S carries nothing in this excitation, so
                // the slab's faces are this winding's own MMF.
                for k in [*winding, *with]
                    .into_iter()
                    .flatten()
                    .filter(|&k| k == p || k == s)
                {
                    let length = f64::from(layer.turns) * layer.mlt_mm;
                    sums[k].layer(memo, d_of(k, layer.turns), slab.f_a, slab.f_b, length);
                }
                // Any other winding here sits in the field of P and S: Dowell's layer with
                // the same field on both faces loses `R_layer (F/n_l)^2 D (2 G1 - 4 G2)` per
                // ampere squared of the primary's, summed over its harmonics. A bifilar
                // partner sees a field that runs from F_a to F_b across the layer: its mean
                // square is taken.
                for k in [*winding, *with]
                    .into_iter()
                    .flatten()
                    .filter(|&k| k != p && k != s)
                {
                    let (fa, fb) = (slab.f_a, slab.f_b);
                    let f2 = (fa * fa + fa * fb + fb * fb) / 3.0;
                    if f2 <= 0.0 || layer.turns == 0 {
                        continue;
                    }
                    let d = d_of(k, layer.turns);
                    let (a, b) = match primary_drive {
                        Some((Some(si), _)) => memo.summed_terms(si, d),
                        Some((None, rms_sq)) => {
                            let t = ac::d_terms(d);
                            (t.0 * rms_sq, t.1 * rms_sq)
                        }
                        None => continue,
                    };
                    let n_l = f64::from(layer.turns);
                    let length = f64::from(layer.turns) * layer.mlt_mm;
                    sums[k].proximity += length * f2 / (n_l * n_l) * (2.0 * a - 4.0 * b).max(0.0);
                }
            });
        }
    }
    // Every other winding: each of its sections alone, from zero MMF at the section's face.
    for l in laid {
        let LaidKind::Winding {
            winding,
            with,
            layers,
            ..
        } = &l.kind
        else {
            continue;
        };
        for k in [*winding, *with].into_iter().flatten() {
            if sums[k].paired || sums[k].skip {
                continue;
            }
            let mut f = 0.0;
            for layer in layers {
                let f_b = f + f64::from(layer.turns);
                let length = f64::from(layer.turns) * layer.mlt_mm;
                sums[k].layer(memo, d_of(k, layer.turns), f, f_b, length);
                f = f_b;
            }
        }
    }
    for (w, sum) in windings.iter_mut().zip(&sums) {
        let total = sum.length;
        if sum.skip || total <= 0.0 {
            continue;
        }
        let ac_factor = sum.sine / total;
        let ac_factor_waveform = sum.spectrum.map(|(_, dc, rms_sq)| {
            if rms_sq <= 0.0 {
                1.0
            } else {
                (dc * dc * total + sum.wave) / (rms_sq * total)
            }
        });
        // Per ohm of the winding's DC resistance: its layers' share by length.
        w.proximity_loss_w = (sum.proximity > 0.0).then(|| w.dcr_ohm / total * sum.proximity);
        w.ac = Some(AcFigures {
            skin_depth_mm: delta_mm,
            ac_factor,
            rac_ohm: ac_factor * w.dcr_ohm,
            ac_factor_waveform,
            rac_waveform_ohm: ac_factor_waveform.map(|f| f * w.dcr_ohm),
        });
    }
}

/// Fit, duty, saturation, temperature and current density, binding first.
fn design_limits(eval: &Evaluation) -> Vec<Limit> {
    let mut out = Vec::with_capacity(Constraint::ALL.len());
    out.push(Limit::new(
        Constraint::Fit,
        eval.height_with_allowance_mm,
        eval.window_height_mm,
        "mm",
        None,
    ));
    if let Some(c) = &eval.converter {
        out.push(Limit::new(
            Constraint::ResetDuty,
            c.duty_needed_total_at_vin_min,
            c.duty_available,
            "duty",
            None,
        ));
        if let (Some(swing), Some(head)) = (c.flux_swing_worst_mt, c.flux_headroom_mt) {
            out.push(Limit::new(Constraint::Saturation, swing, head, "mT", None));
        }
    }
    if let Some(rise) = eval
        .losses
        .as_ref()
        .and_then(|l| l.temperature_rise_c.map(|r| (r, l.rise_limit_c)))
    {
        out.push(Limit::new(
            Constraint::TemperatureRise,
            rise.0,
            rise.1,
            "C",
            None,
        ));
    }
    if let Some(l) = &eval.losses
        && let Some(hot) = l.hot_spot_c
    {
        out.push(Limit::new(
            Constraint::HotSpot,
            hot,
            l.class_limit_c,
            "C",
            None,
        ));
    }
    if let Some(c) = &eval.converter
        && let Some(rating) = c.switch_rating_v
    {
        out.push(Limit::new(
            Constraint::SwitchVoltage,
            c.switch_voltage_v,
            rating,
            "V",
            None,
        ));
    }
    if let Some((name, j)) = eval
        .windings
        .iter()
        .filter_map(|w| w.current_density_a_mm2.map(|j| (&w.name, j)))
        .max_by(|a, b| a.1.total_cmp(&b.1))
    {
        out.push(Limit::new(
            Constraint::CurrentDensity,
            j,
            CURRENT_DENSITY_BAND_A_MM2.1,
            "A/mm2",
            Some(name.clone()),
        ));
    }
    limits::rank(out)
}
