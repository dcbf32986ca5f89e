//! Warnings as data: what a winder should know about a build that is valid but risky.

use super::evaluation::{Evaluation, SectionKind};
use super::limits::CURRENT_DENSITY_BAND_A_MM2;
use super::remarks::{Note, Warning, WarningAt, WarningKind};
use super::validate::Invalid;
use crate::model::{Build, Insulation, Name};

/// Window utilisation that hand winding on a bobbin rarely beats: about 0.3-0.5 of the window
/// is copper (McLyman, Transformer and Inductor Design Handbook, window utilisation K_u ~ 0.4).
pub const FILL_FACTOR_HAND_LIMIT: f64 = 0.45;

/// A full layer that leaves less than this share of a pitch to the margin tape tends to push
/// its end turns up onto the tape (common practice: one turn fewer per layer).
pub const MARGIN_CROWDING_PITCHES: f64 = 0.25;

/// Sets the evaluation's warnings and notes. `problems` are `validate(build)`, found once by
/// the caller.
pub(super) fn collect(build: &Build, problems: &[Invalid], eval: &mut Evaluation) {
    // Room for what most builds get, so that the list rarely grows.
    let mut out = Vec::with_capacity(problems.len() + 8);
    let mut warn = |at: WarningAt, kind: WarningKind| out.push(Warning { at, kind });

    for problem in problems {
        warn(WarningAt::Build, WarningKind::Invalid(problem.clone()));
    }
    if !eval.fits {
        warn(
            WarningAt::Build,
            WarningKind::DoesNotFit {
                height_with_allowance_mm: eval.height_with_allowance_mm,
                allowance_factor: build.setup.allowance_factor,
                window_height_mm: eval.window_height_mm,
                over_mm: -eval.spare_height_mm,
            },
        );
    }
    section_warnings(build, eval, &mut warn);
    if eval.fill_factor > FILL_FACTOR_HAND_LIMIT {
        warn(
            WarningAt::Build,
            WarningKind::FillHigh {
                fill_factor: eval.fill_factor,
            },
        );
    }
    for (k, w) in build.windings.iter().enumerate() {
        if w.insulation == Insulation::Tiw && w.strands > 1 {
            warn(
                WarningAt::Winding(k),
                WarningKind::TiwStrands {
                    winding: eval.windings[k].name.clone(),
                },
            );
        }
    }
    if let Some(c) = &eval.converter {
        converter_warnings(c, &mut warn);
        output_warnings(build, c, &mut warn);
        if let Some(op) = &build.operating
            && let Some(duty_limit) = op.duty_limit.filter(|&d| d > c.reset_duty_limit)
        {
            warn(
                WarningAt::Converter,
                WarningKind::ResetBelowController {
                    duty_limit,
                    reset_duty_limit: c.reset_duty_limit,
                },
            );
        }
    }
    let mut notes = Vec::new();
    operating_warnings(build, eval, &mut warn, &mut notes);
    eval.warnings = out;
    eval.notes = notes;

    let mut bifilar: Vec<(Name, Name)> = eval
        .sections
        .iter()
        .filter_map(|s| match &s.kind {
            SectionKind::Winding {
                winding,
                partner: Some(partner),
                ..
            } => Some((winding.clone(), partner.clone())),
            _ => None,
        })
        .collect();
    bifilar.dedup();
    if !bifilar.is_empty() {
        eval.notes.push(Note::BifilarPairs(bifilar));
    }
}

/// Per winding section: past the window, a partial layer below another section, and a full
/// layer crowding the margin tape (less than `MARGIN_CROWDING_PITCHES` of a pitch spare).
fn section_warnings(
    build: &Build,
    eval: &Evaluation,
    warn: &mut impl FnMut(WarningAt, WarningKind),
) {
    let last_winding = eval
        .sections
        .iter()
        .rposition(|s| matches!(s.kind, SectionKind::Winding { .. }));
    for (i, s) in eval.sections.iter().enumerate() {
        let SectionKind::Winding {
            winding,
            turns_per_layer,
            last_layer_turns,
            layer_count,
            pitch_mm,
            spread,
            ..
        } = &s.kind
        else {
            continue;
        };
        if s.past_window {
            warn(
                WarningAt::Section(i),
                WarningKind::PastWindow {
                    section: i,
                    winding: winding.clone(),
                },
            );
        }
        // A space-wound last layer leaves no step, whatever it holds.
        if *layer_count > 0
            && last_layer_turns < turns_per_layer
            && !*spread
            && Some(i) != last_winding
        {
            warn(
                WarningAt::Section(i),
                WarningKind::PartialLayer {
                    section: i,
                    winding: winding.clone(),
                    last_layer_turns: *last_layer_turns,
                    turns_per_layer: *turns_per_layer,
                },
            );
        }
        let spare = eval.usable_width_mm - f64::from(*turns_per_layer) * pitch_mm;
        if build.setup.margin_mm > 0.0
            && *layer_count > 1
            && spare < MARGIN_CROWDING_PITCHES * pitch_mm
        {
            warn(
                WarningAt::Section(i),
                WarningKind::MarginCrowded {
                    section: i,
                    winding: winding.clone(),
                    spare_mm: spare,
                },
            );
        }
    }
}

/// The converter's warnings: duty short of what the lowest input needs, a secondary-side
/// reset that cannot settle, and a flux swing past the headroom to saturation (mT).
fn converter_warnings(
    c: &super::converter::ConverterEval,
    warn: &mut impl FnMut(WarningAt, WarningKind),
) {
    use crate::model::ResetSide;
    if c.duty_needed_at_vin_min > c.duty_max {
        warn(
            WarningAt::Converter,
            WarningKind::DutyShort {
                needed: c.duty_needed_at_vin_min,
                available: c.duty_max,
            },
        );
    }
    if c.reset_side == ResetSide::Secondary {
        if let Some(ceiling) = c.steady_duty_ceiling {
            if ceiling <= 0.0 {
                warn(
                    WarningAt::Converter,
                    WarningKind::ResetImpossible { nr: c.nr, ns: c.ns },
                );
            } else if c.duty_needed_at_vin_min > ceiling {
                warn(
                    WarningAt::Converter,
                    WarningKind::ResetSteady {
                        ceiling,
                        needed: c.duty_needed_at_vin_min,
                    },
                );
            }
        }
        warn(WarningAt::Converter, WarningKind::ResetStartup);
    }
    if let (Some(swing), Some(headroom)) = (c.flux_swing_worst_mt, c.flux_headroom_mt)
        && swing > headroom
    {
        warn(
            WarningAt::Converter,
            WarningKind::Saturation {
                swing_mt: swing,
                headroom_mt: headroom,
            },
        );
    }
}

/// A further output whose turns make a voltage off its target by more than the tolerance.
fn output_warnings(
    build: &Build,
    c: &super::converter::ConverterEval,
    warn: &mut impl FnMut(WarningAt, WarningKind),
) {
    use super::outputs::OUTPUT_TOLERANCE_FRACTION;
    for o in c.outputs.iter().filter(|o| !o.regulated) {
        if o.error_fraction.abs() <= OUTPUT_TOLERANCE_FRACTION || o.turns == 0 {
            continue;
        }
        let at = build
            .winding_index(&o.winding)
            .map_or(WarningAt::Converter, WarningAt::Winding);
        warn(
            at,
            WarningKind::OutputOffTarget {
                winding: o.winding.clone(),
                target_v: o.vout_v,
                from_turns_v: o.vout_from_turns_v,
                error_fraction: o.error_fraction,
                // Each turn adds (Vreg + Vd_reg) / Nreg to the winding's on-time voltage.
                step_v: (o.vout_from_turns_v + o.rectifier_drop_v) / f64::from(o.turns),
            },
        );
    }
}

/// Current density, temperature rise, and what the operating-point figures had to leave out.
fn operating_warnings(
    build: &Build,
    eval: &Evaluation,
    warn: &mut impl FnMut(WarningAt, WarningKind),
    notes: &mut Vec<Note>,
) {
    use crate::model::Role;
    let band = CURRENT_DENSITY_BAND_A_MM2;
    for (k, w) in eval.windings.iter().enumerate() {
        let Some(j) = w.current_density_a_mm2 else {
            continue;
        };
        if j <= band.1 {
            continue;
        }
        warn(
            WarningAt::Winding(k),
            WarningKind::CurrentDensity {
                winding: w.name.clone(),
                density_a_mm2: j,
                band,
                reset: w.role == Role::Reset,
            },
        );
    }
    if let Some(l) = &eval.losses
        && let Some(rise) = l.temperature_rise_c
        && rise > l.rise_limit_c
    {
        warn(
            WarningAt::Build,
            WarningKind::TemperatureRise {
                rise_c: rise,
                limit_c: l.rise_limit_c,
                loss_w: l.total_loss_w,
                surface_cm2: l.surface_area_cm2.unwrap_or(0.0),
            },
        );
    }
    if let Some(l) = &eval.losses
        && let Some(hot) = l.hot_spot_c
        && hot > l.class_limit_c
    {
        warn(
            WarningAt::Build,
            WarningKind::HotSpot {
                hot_c: hot,
                ambient_c: l.ambient_c,
                class_c: l.class_limit_c,
                part: l.class_binding.key(),
            },
        );
    }
    if let Some(st) = &eval.stress {
        stress_warnings(st, warn);
    }
    let Some(c) = &eval.converter else {
        return;
    };
    if build.bobbin.core.is_none() {
        notes.push(Note::NoCoreData);
    } else if c.al_nh.is_none() {
        notes.push(Note::NoInductance);
    }
    if build.bobbin.core.is_some() && build.material.as_ref().and_then(|m| m.steinmetz).is_none() {
        notes.push(Note::NoSteinmetz);
    }
    if let Some(l) = &eval.losses {
        if l.surface_estimated {
            notes.push(Note::SurfaceEstimated);
        }
        if !l.windings_without_current.is_empty() {
            notes.push(Note::NoCurrent(l.windings_without_current.clone()));
        }
    }
}

/// Layer, bifilar and section-to-section voltages (V) above what their enamel and tape stand.
fn stress_warnings(st: &super::stress::StressEval, warn: &mut impl FnMut(WarningAt, WarningKind)) {
    for ls in st.layers.iter().filter(|x| x.voltage_v > x.limit_v) {
        warn(
            WarningAt::Section(ls.section),
            WarningKind::LayerVoltage {
                section: ls.section,
                winding: ls.winding.clone(),
                volts: ls.voltage_v,
                limit_v: ls.limit_v,
                layer_tape: ls.layer_tape,
            },
        );
    }
    for b in st.bifilar.iter().filter(|x| x.voltage_v > x.limit_v) {
        warn(
            WarningAt::Section(b.inner_section),
            WarningKind::BifilarVoltage {
                section: b.inner_section,
                a: b.inner.clone(),
                b: b.outer.clone(),
                volts: b.voltage_v,
                limit_v: b.limit_v,
            },
        );
    }
    for p in st
        .between_sections
        .iter()
        .filter(|x| x.voltage_v > x.limit_v)
    {
        warn(
            WarningAt::Section(p.outer_section),
            WarningKind::SectionVoltage {
                inner: (p.inner_section, p.inner.clone()),
                outer: (p.outer_section, p.outer.clone()),
                volts: p.voltage_v,
                limit_v: p.limit_v,
                wraps: p.wraps,
            },
        );
    }
}
