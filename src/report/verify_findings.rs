//! What a finding of the bench readings most likely means, in plain words (`turnstack
//! verify`, its JSON and the planner's readings panel). Reads `engine::verify`; computes no
//! figure of its own.

use super::verify_conductor::implied_conductor_words;
use crate::engine::verify::Finding;
use crate::model::{Name, WireSize};

/// What a finding most likely means, in plain words.
pub fn finding_words(f: &Finding) -> String {
    match f {
        Finding::GapLarger {
            al_nh,
            mu_e,
            extra_gap_mm,
            total_gap_mm,
            ungapped,
        } => gap_larger_words(*al_nh, *mu_e, *extra_gap_mm, *total_gap_mm, *ungapped),
        Finding::AlHigher {
            al_nh,
            mu_e,
            total_gap_mm,
            gapped,
        } => al_higher_words(*al_nh, *mu_e, *total_gap_mm, *gapped),
        Finding::TurnsOff {
            winding,
            planned,
            likely,
        } => turns_off_words(winding, *planned, *likely),
        Finding::RatioUnexplained { implied_turns } => format!(
            "the ratio matches no whole turns count ({implied_turns:.2} turns on this winding); \
             check the meter's range, which pins were measured, and for shorted turns"
        ),
        Finding::ResistanceOff {
            factor,
            conductor: Some(c),
            planned_length_m,
            implied_length_m,
            ..
        } => format!(
            "{factor:.2} times the expected resistance; {}",
            implied_conductor_words(c, *factor, *planned_length_m, *implied_length_m)
        ),
        Finding::ResistanceOff {
            factor,
            planned_bare_mm,
            implied_bare_mm,
            likely_wire,
            planned_length_m,
            implied_length_m,
            ..
        } => resistance_words(
            *factor,
            *planned_bare_mm,
            *implied_bare_mm,
            *likely_wire,
            *planned_length_m,
            *implied_length_m,
        ),
        Finding::LeakageFactor { factor } => format!(
            "measured / estimated = {factor:.2}: a correction you may keep for the next build \
             on this bobbin with the same arrangement"
        ),
    }
}

/// The words of a magnetising inductance above its prediction: AL (nH) and mu_e as
/// measured, and the gap (mm) they imply where the core is planned with one (`gapped`).
fn al_higher_words(al_nh: f64, mu_e: f64, total_gap_mm: Option<f64>, gapped: bool) -> String {
    let gap = match (total_gap_mm, gapped) {
        (Some(g), true) if g > 0.0 => {
            format!(
                "; the gap acts as {:.0} um, smaller than planned",
                g * 1000.0
            )
        }
        (_, true) => "; the gap is smaller than planned".into(),
        _ => String::new(),
    };
    format!(
        "AL is {al_nh:.0} nH and mu_e {mu_e:.0} (IEC 60205), above the figure the plan \
         uses: another grade, or core figures that are off{gap}"
    )
}

/// The words of a ratio that points at another whole number of turns on `winding`: the
/// `likely` count against the `planned` one.
fn turns_off_words(winding: &Name, planned: u32, likely: u32) -> String {
    let by = i64::from(likely) - i64::from(planned);
    let n = by.unsigned_abs();
    format!(
        "{winding} most likely has {likely} turns, {n} {} {} than the planned \
         {planned}; count them again",
        if n == 1 { "turn" } else { "turns" },
        if by < 0 { "fewer" } else { "more" }
    )
}

/// The words of a magnetising inductance below its prediction: AL (nH) and mu_e as
/// measured, the extra gap (mm) they imply and what to look at.
fn gap_larger_words(
    al_nh: f64,
    mu_e: f64,
    extra_gap_mm: f64,
    total_gap_mm: Option<f64>,
    ungapped: bool,
) -> String {
    let total = total_gap_mm.map_or(String::new(), |g| {
        format!(", an effective gap of {:.0} um in all", g * 1000.0)
    });
    let advice = if ungapped {
        "the core is planned without a gap, so the mating faces need cleaning (dust, \
         glue, tape or a burr between the halves), or the clamp is loose"
    } else {
        "the gap is larger than planned (a thicker spacer, or the faces do not close)"
    };
    format!(
        "AL is {al_nh:.0} nH and mu_e {mu_e:.0} (IEC 60205): the core acts as if it had \
         {:.0} um more gap than planned{total}; {advice}",
        extra_gap_mm * 1000.0
    )
}

/// The words of a DCR off its prediction: the wire whose resistance per metre gives it, or
/// the length (m) that would, when no size near the implied bare diameter (mm) fits.
fn resistance_words(
    factor: f64,
    planned_bare_mm: f64,
    implied_bare_mm: f64,
    likely_wire: Option<WireSize>,
    planned_length_m: f64,
    implied_length_m: f64,
) -> String {
    let wire = match likely_wire {
        Some(w) => format!(
            "the resistance per metre of {w} gives it (the plan has {planned_bare_mm:.3} \
             mm bare; {implied_bare_mm:.3} mm would match): most likely the wrong wire"
        ),
        None => format!(
            "no size near {implied_bare_mm:.3} mm bare fits the plan's wire series, so \
             the wire is most likely right and the length is off: {implied_length_m:.2} m \
             instead of {planned_length_m:.2} m (turns, a looser mean turn, or long leads)"
        ),
    };
    format!("{:.2} times the expected resistance; {wire}", factor)
}
