//! Warnings as data: what a winder should know about a build that is valid but risky.

use super::evaluation::{Evaluation, SectionKind, Warning, WarningAt};
use super::limits::CURRENT_DENSITY_BAND_A_MM2;
use super::validate::Invalid;
use crate::model::{Build, Insulation};

/// Window utilisation that hand winding on a bobbin rarely beats: about 0.3-0.5 of the window
/// is copper (McLyman, Transformer and Inductor Design Handbook, window utilisation K_u ~ 0.4).
pub const FILL_FACTOR_HAND_LIMIT: f64 = 0.45;

/// A full layer that leaves less than this share of a pitch to the margin tape tends to push
/// its end turns up onto the tape (common practice: one turn fewer per layer).
pub const MARGIN_CROWDING_PITCHES: f64 = 0.25;

/// `problems` are `validate(build)`, found once by the caller.
pub(super) fn collect(build: &Build, problems: &[Invalid], eval: &mut Evaluation) {
    let mut out = Vec::new();
    let mut warn = |code: &'static str, at: WarningAt, message: String| {
        out.push(Warning { code, message, at })
    };

    for problem in problems {
        warn("invalid", WarningAt::Build, problem.to_string());
    }
    if !eval.fits {
        warn(
            "does-not-fit",
            WarningAt::Build,
            format!(
                "does not fit: {:.2} mm with the {:.0} % allowance against a {:.2} mm window, {:.2} mm too tall",
                eval.height_with_allowance_mm,
                (build.setup.bulge - 1.0) * 100.0,
                eval.window_height_mm,
                -eval.spare_height_mm
            ),
        );
    }
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
            ..
        } = &s.kind
        else {
            continue;
        };
        if s.past_window {
            warn(
                "past-window",
                WarningAt::Section(i),
                format!(
                    "section {} ({winding}) reaches past the window limit",
                    i + 1
                ),
            );
        }
        if *layer_count > 0 && last_layer_turns < turns_per_layer && Some(i) != last_winding {
            warn(
                "partial-layer",
                WarningAt::Section(i),
                format!(
                    "section {} ({winding}): the last layer holds {last_layer_turns} of {turns_per_layer} turns, \
                     so the section above sits on a step and the finish lead crosses over it \
                     (spread the turns across the width, or change the turns)",
                    i + 1
                ),
            );
        }
        let spare = eval.usable_width_mm - f64::from(*turns_per_layer) * pitch_mm;
        if build.setup.margin_mm > 0.0
            && *layer_count > 1
            && spare < MARGIN_CROWDING_PITCHES * pitch_mm
        {
            warn(
                "margin-crowded",
                WarningAt::Section(i),
                format!(
                    "section {} ({winding}): full layers leave {spare:.2} mm to the margin tape; the end turns \
                     can climb onto it and shorten the creepage path (wind one turn fewer per layer)",
                    i + 1
                ),
            );
        }
    }
    if eval.fill_factor > FILL_FACTOR_HAND_LIMIT {
        warn(
            "fill-high",
            WarningAt::Build,
            format!(
                "fill factor {:.2} is above the {FILL_FACTOR_HAND_LIMIT:.2} that hand winding on a bobbin usually reaches",
                eval.fill_factor
            ),
        );
    }
    for (k, w) in build.windings.iter().enumerate() {
        if w.insulation == Insulation::Tiw && w.strands > 1 {
            warn(
                "tiw-strands",
                WarningAt::Winding(k),
                format!(
                    "\"{}\": strands of triple-insulated wire in parallel are unusual; check the pitch",
                    w.name
                ),
            );
        }
    }
    if let Some(c) = &eval.converter {
        converter_warnings(c, &mut warn);
        if let Some(op) = &build.operating
            && op.duty_limit.is_some_and(|d| d > c.reset_duty_limit)
        {
            warn(
                "reset-below-controller",
                WarningAt::Converter,
                format!(
                    "the controller may command {:.0} % but the core resets only up to {:.0} %: in a load step at \
                     high input it walks up the B-H loop into saturation (lower duty_limit, or fewer reset turns)",
                    op.duty_limit.unwrap_or(0.0) * 100.0,
                    c.reset_duty_limit * 100.0
                ),
            );
        }
    }
    let mut notes = Vec::new();
    operating_warnings(build, eval, &mut warn, &mut notes);
    eval.warnings = out;
    eval.notes.extend(notes);

    let mut bifilar: Vec<String> = eval
        .sections
        .iter()
        .filter_map(|s| match &s.kind {
            SectionKind::Winding {
                winding,
                with: Some(with),
                ..
            } => Some(format!("{winding} with {with}")),
            _ => None,
        })
        .collect();
    bifilar.dedup();
    if !bifilar.is_empty() {
        eval.notes.push(format!(
            "bifilar sections ({}) share their layers: the 1-D model sees no leakage between the two windings of a pair",
            bifilar.join(", ")
        ));
    }
}

fn converter_warnings(
    c: &super::converter::ConverterEval,
    warn: &mut impl FnMut(&'static str, WarningAt, String),
) {
    use crate::model::ResetSide;
    if c.duty_needed_at_vin_min > c.duty_max {
        warn(
            "duty-short",
            WarningAt::Converter,
            format!(
                "the output needs {:.0} % duty at the lowest input but the most available is {:.0} %: \
                 the converter cannot reach its output (more secondary turns or fewer primary turns)",
                c.duty_needed_at_vin_min * 100.0,
                c.duty_max * 100.0
            ),
        );
    }
    if c.reset_side == ResetSide::Secondary {
        if let Some(ceiling) = c.steady_duty_ceiling {
            if ceiling <= 0.0 {
                warn(
                    "reset-impossible",
                    WarningAt::Converter,
                    format!(
                        "reset turns ({}) are not fewer than the secondary's ({}): the core can never reset",
                        c.nr, c.ns
                    ),
                );
            } else if c.duty_needed_at_vin_min > ceiling {
                warn(
                    "reset-steady",
                    WarningAt::Converter,
                    format!(
                        "reset from the output side takes {:.0} % of every period, so the duty must stay below \
                         {:.0} %, but {:.0} % is needed",
                        (1.0 - ceiling) * 100.0,
                        ceiling * 100.0,
                        c.duty_needed_at_vin_min * 100.0
                    ),
                );
            }
        }
        warn(
            "reset-startup",
            WarningAt::Converter,
            "with the reset returned to the output, the core cannot reset at start-up while the output is near \
             zero: the controller must limit the duty until the output is up"
                .into(),
        );
    }
    if let (Some(swing), Some(headroom)) = (c.flux_swing_worst_mt, c.flux_headroom_mt)
        && swing > headroom
    {
        warn(
            "saturation",
            WarningAt::Converter,
            format!(
                "worst-case flux swing {swing:.0} mT exceeds the {headroom:.0} mT between saturation and remanence: \
                 the core saturates (more primary turns, a larger core or a lower duty limit)"
            ),
        );
    }
}

/// Current density, temperature rise, and what the operating-point figures had to leave out.
fn operating_warnings(
    build: &Build,
    eval: &Evaluation,
    warn: &mut impl FnMut(&'static str, WarningAt, String),
    notes: &mut Vec<String>,
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
        let message = if w.role == Role::Reset {
            format!(
                "\"{}\" runs at {j:.1} A/mm2: a reset winding is thin because it carries only the magnetising \
                 current, but this one is large (a low AL, a gapped core, or few primary turns): use a thicker wire",
                w.name
            )
        } else {
            format!(
                "\"{}\" runs at {j:.1} A/mm2 RMS, above the {:.0}-{:.0} A/mm2 that small transformers usually run at \
                 (common practice): expect it to run hot",
                w.name, band.0, band.1
            )
        };
        warn("current-density", WarningAt::Winding(k), message);
    }
    if let Some(l) = &eval.losses
        && let Some(rise) = l.temperature_rise_c
        && rise > l.rise_limit_c
    {
        warn(
            "temperature-rise",
            WarningAt::Build,
            format!(
                "estimated temperature rise {rise:.0} C is above the {:.0} C limit ({:.2} W over {:.1} cm2): \
                 less loss (thinner strands, interleaving, more copper) or a larger core",
                l.rise_limit_c,
                l.total_loss_w,
                l.surface_area_cm2.unwrap_or(0.0)
            ),
        );
    }
    let Some(c) = &eval.converter else {
        return;
    };
    if build.bobbin.core.is_none() {
        notes.push(
            "the bobbin has no [core] data (ae_mm2, le_mm): flux swing, magnetising current, core loss and the \
             surface-area estimate for the temperature rise are left out"
                .into(),
        );
    } else if c.al_nh.is_none() {
        notes.push(
            "no al_nh in [core] and no mu_i in [material]: the magnetising current is taken as zero".into(),
        );
    }
    if build.bobbin.core.is_some() && build.material.as_ref().and_then(|m| m.steinmetz).is_none() {
        notes.push("no steinmetz coefficients in [material]: core loss is left out".into());
    }
    if let Some(l) = &eval.losses {
        if l.surface_estimated {
            notes.push(format!(
                "surface area estimated as {:.1} x sqrt(Wa Ae) with the bobbin window as Wa (McLyman; errs toward a \
                 higher rise); give [operating] surface_area_cm2 to use a measured one",
                super::thermal::SURFACE_KS
            ));
        }
        if !l.windings_without_current.is_empty() {
            notes.push(format!(
                "no current for {}: its copper loss is not counted (give current_rms_a)",
                l.windings_without_current.join(", ")
            ));
        }
    }
}
