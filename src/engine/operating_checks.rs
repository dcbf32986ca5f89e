//! The checks on a build's operating point (`[operating]`), apart from the rest of validation.

use super::layout::Resolved;
use super::validate::{Place, positive};
use crate::model::{Build, Operating, Role};

/// The operating point: it needs a frequency, and its figures must be in range.
pub(super) fn check_operating(
    build: &Build,
    _resolved: &Resolved,
    bad: &mut dyn FnMut(Place, String),
) {
    if let Some(op) = &build.operating {
        check_needs(build, bad);
        check_voltages(op, bad);
        check_limits(op, bad);
    }
}

/// What an operating point needs besides itself: the frequency and a winding of each role.
fn check_needs(build: &Build, bad: &mut dyn FnMut(Place, String)) {
    if build.setup.frequency_khz.is_none() {
        bad(
            Place::Operating(""),
            "an [operating] point needs the switching frequency: add frequency_khz to [setup]"
                .into(),
        );
    }
    for role in [Role::Primary, Role::Secondary, Role::Reset] {
        if build.first_of(role).is_none() {
            bad(
                Place::Top("operating"),
                format!(
                    "an [operating] point needs a winding of role \"{}\"",
                    role.key()
                ),
            );
        }
    }
}

/// The input range, the shorthand output and the rectifier drop.
fn check_voltages(op: &Operating, bad: &mut dyn FnMut(Place, String)) {
    // With [[output]] tables the regulated output is checked as output #1.
    let shorthand = op.outputs.is_empty();
    for (key, v) in [
        ("vin_min_v", op.vin_min_v),
        ("vin_max_v", op.vin_max_v),
        ("vout_v", if shorthand { op.vout_v } else { 1.0 }),
    ] {
        if !positive(v) {
            bad(
                Place::Operating(key),
                format!("must be a positive voltage, got {v}"),
            );
        }
    }
    if op.vin_min_v > op.vin_max_v {
        bad(
            Place::Operating("vin_min_v"),
            format!("is above vin_max_v ({} > {})", op.vin_min_v, op.vin_max_v),
        );
    }
    if shorthand && !(op.iout_a.is_finite() && op.iout_a >= 0.0) {
        bad(
            Place::Operating("iout_a"),
            format!("must be zero or positive, got {}", op.iout_a),
        );
    }
    if !(op.rectifier_drop_v.is_finite() && op.rectifier_drop_v >= 0.0) {
        bad(
            Place::Operating("rectifier_drop_v"),
            format!("must be zero or positive, got {}", op.rectifier_drop_v),
        );
    }
}

/// The duty limit, the switch drop, the ambient and the optional positive figures.
fn check_limits(op: &Operating, bad: &mut dyn FnMut(Place, String)) {
    if let Some(d) = op.duty_limit
        && !(d > 0.0 && d < 1.0)
    {
        bad(
            Place::Operating("duty_limit"),
            format!("expected a fraction between 0 and 1, got {d}"),
        );
    }
    if !(op.switch_drop_v.is_finite() && op.switch_drop_v >= 0.0 && op.switch_drop_v < op.vin_min_v)
    {
        bad(
            Place::Operating("switch_drop_v"),
            format!(
                "expected zero or a drop below vin_min_v, got {}",
                op.switch_drop_v
            ),
        );
    }
    if let Some(t) = op.ambient_c
        && !(t.is_finite() && (-60.0..=200.0).contains(&t))
    {
        bad(
            Place::Operating("ambient_c"),
            format!("expected an ambient between -60 and 200 C, got {t}"),
        );
    }
    for (key, v) in [
        ("rise_limit_c", op.rise_limit_c),
        ("surface_area_cm2", op.surface_area_cm2),
        ("switch_rating_v", op.switch_rating_v),
    ] {
        if let Some(v) = v
            && !positive(v)
        {
            bad(Place::Operating(key), format!("must be positive, got {v}"));
        }
    }
}
