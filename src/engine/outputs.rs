//! The converter's outputs: which secondary winding feeds each, the voltage its turns make
//! against its target, and the checks on the `[[output]]` tables (see FORMAT.md, "Several
//! outputs").
//!
//! The regulated output (the first) sets the duty; every further output follows the turns:
//! in continuous conduction, with ideal switch and diodes, each secondary sees
//! `Vin Nk/Np` during the on-time and its output filter averages `D Vin Nk/Np - Vd_k`, so
//! `Vk = (Vreg + Vd_reg) Nk/Nreg - Vd_k`.

use super::validate::Place;
use crate::model::{Build, Name, OutputFigures, Role};

/// How far a further output may lie from its target before it is warned
/// (`output-off-target`): +/-5 %, the band an unregulated output of a multi-output supply is
/// commonly held to (common practice, from memory; tighter rails want a post-regulator).
pub const OUTPUT_TOLERANCE_FRACTION: f64 = 0.05;

/// One output as the engine reads it: the winding that feeds it and its figures.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct OutputAt<'a> {
    /// Index into `Build::windings`.
    pub winding: usize,
    /// Its target, current and rectifier drop after defaults.
    pub figures: OutputFigures<'a>,
}

/// Every output the operating point names, the regulated one first: the `[[output]]`
/// tables, or the shorthand's one output on the first secondary. Outputs naming no winding
/// (refused by validation) are left out; empty without an operating point.
pub fn resolve(build: &Build) -> Vec<OutputAt<'_>> {
    let Some(op) = build.operating.as_ref() else {
        return Vec::new();
    };
    op.output_figures()
        .filter_map(|figures| {
            let winding = match figures.winding {
                None => build
                    .windings
                    .iter()
                    .position(|w| w.role == Role::Secondary)?,
                Some(name) => build.winding_index(name)?,
            };
            Some(OutputAt { winding, figures })
        })
        .collect()
}

/// An output's figures from the turns (the `outputs` of the report).
#[derive(Debug, Clone, PartialEq)]
pub struct OutputEval {
    /// The secondary winding that feeds it.
    pub winding: Name,
    /// The first output: the controller holds it at its target.
    pub regulated: bool,
    /// The winding's turns.
    pub turns: u32,
    /// The target voltage (`vout_v`).
    pub vout_v: f64,
    /// The output's load current (A).
    pub iout_a: f64,
    /// The output's rectifier drop (V).
    pub rectifier_drop_v: f64,
    /// `(Vreg + Vd_reg) Nk / Nreg - Vd_k` (continuous conduction, ideal switch and diodes);
    /// the target itself for the regulated output.
    pub vout_from_turns_v: f64,
    /// `vout_from_turns_v - vout_v`.
    pub error_v: f64,
    /// `error_v / vout_v`.
    pub error_fraction: f64,
    /// The RMS current of its winding (set by the evaluation from the winding's figures).
    pub current_rms_a: Option<f64>,
}

/// The outputs' figures, when the build gives `[[output]]` tables (empty for the shorthand,
/// whose one output is the regulated one and is shown as before); `outputs` are the build's
/// as [`resolve`] gives them.
pub fn evaluate(build: &Build, outputs: &[OutputAt<'_>]) -> Vec<OutputEval> {
    let explicit = build
        .operating
        .as_ref()
        .is_some_and(|op| !op.outputs.is_empty());
    let Some(reg) = outputs.first().filter(|_| explicit) else {
        return Vec::new();
    };
    let n_reg = f64::from(build.windings[reg.winding].turns);
    let vo_reg = reg.figures.vout_v + reg.figures.rectifier_drop_v;
    outputs
        .iter()
        .enumerate()
        .map(|(k, o)| {
            let w = &build.windings[o.winding];
            let f = o.figures;
            let vout_from_turns_v = if k == 0 {
                f.vout_v
            } else if n_reg > 0.0 {
                vo_reg * f64::from(w.turns) / n_reg - f.rectifier_drop_v
            } else {
                0.0
            };
            let error_v = vout_from_turns_v - f.vout_v;
            OutputEval {
                winding: w.name.clone(),
                regulated: k == 0,
                turns: w.turns,
                vout_v: f.vout_v,
                iout_a: f.iout_a,
                rectifier_drop_v: f.rectifier_drop_v,
                vout_from_turns_v,
                error_v,
                error_fraction: if f.vout_v != 0.0 {
                    error_v / f.vout_v
                } else {
                    0.0
                },
                current_rms_a: None,
            }
        })
        .collect()
}

/// The `[[output]]` tables: each names a secondary winding, once; the first (the regulated
/// output) is the first secondary in file order; voltages positive, currents and drops zero
/// or more. A secondary without an output is allowed: it carries no load.
pub(super) fn check_outputs(
    build: &Build,
    _resolved: &super::layout::Resolved,
    bad: &mut dyn FnMut(Place, String),
) {
    let Some(op) = build.operating.as_ref() else {
        return;
    };
    let secondaries = build
        .windings
        .iter()
        .filter(|w| w.role == Role::Secondary)
        .map(|w| w.name.as_str());
    let first_secondary = secondaries.clone().next();
    // Only a refusal quotes the list: it is not built for a build that passes.
    let list = || {
        let names: Vec<&str> = secondaries.clone().collect();
        if names.is_empty() {
            "the build has none".to_string()
        } else {
            format!("the secondaries are {}", names.join(", "))
        }
    };
    for (i, o) in op.outputs.iter().enumerate() {
        match build.winding(&o.winding) {
            None => bad(
                Place::Output(i, "name"),
                format!("unknown winding \"{}\"; {}", o.winding, list()),
            ),
            Some(w) if w.role != Role::Secondary => bad(
                Place::Output(i, "name"),
                format!(
                    "\"{}\" is a {} winding; an output is fed by a secondary winding ({})",
                    o.winding,
                    w.role.key(),
                    list()
                ),
            ),
            Some(_) => {
                if let Some(j) = op.outputs[..i].iter().position(|p| p.winding == o.winding) {
                    bad(
                        Place::Output(i, "name"),
                        format!(
                            "\"{}\" already feeds output #{}; each secondary feeds one output",
                            o.winding,
                            j + 1
                        ),
                    );
                } else if i == 0 && first_secondary != Some(o.winding.as_str()) {
                    bad(
                        Place::Output(0, "name"),
                        format!(
                            "the regulated output (the first [[output]]) is fed by the first \
                             secondary winding in file order, \"{}\": list its output first, or \
                             move winding \"{}\" before it",
                            first_secondary.unwrap_or(""),
                            o.winding
                        ),
                    );
                }
            }
        }
        if !(o.vout_v.is_finite() && o.vout_v > 0.0) {
            bad(
                Place::Output(i, "vout_v"),
                format!("must be a positive voltage, got {}", o.vout_v),
            );
        }
        if !(o.iout_a.is_finite() && o.iout_a >= 0.0) {
            bad(
                Place::Output(i, "iout_a"),
                format!("must be zero or positive, got {}", o.iout_a),
            );
        }
        if let Some(d) = o.rectifier_drop_v
            && !(d.is_finite() && d >= 0.0)
        {
            bad(
                Place::Output(i, "rectifier_drop_v"),
                format!("must be zero or positive, got {d}"),
            );
        }
    }
}
