//! The figures of the bench, for the winding sheet: how much wire to cut for each winding,
//! and what the finished part should measure (DC resistance at the bench temperature,
//! magnetising inductance, primary-secondary leakage), each with the spread to expect. The
//! sheet only renders these.

use super::measured_core;
use super::resistance::temperature_ratio;
use super::{Evaluation, LeakageEval};
use crate::model::{Build, Role, Section};

/// Wire left at each end of a winding for the lead to its pin and the soldering (common
/// practice for bobbins of this size: enough to reach any pin and to strip and tin the end).
pub const LEAD_ALLOWANCE_MM: f64 = 100.0;

/// Cut lengths are rounded up to this, so the reel is never cut short.
pub const CUT_ROUND_MM: f64 = 10.0;

/// Tolerance on the expected DC resistance: wire diameter tolerance of IEC 60317 (about +/-1 %
/// on the diameter, so +/-2 % on the copper area), the hand-wound length (the allowance the
/// build carries is 10 %) and the meter's lead resistance at milliohm levels (common practice).
pub const DCR_TOLERANCE: f64 = 0.10;

/// Tolerance on AL of an ungapped ferrite pair as sold (from memory: +/-25 % is the usual figure).
pub const AL_TOLERANCE: f64 = 0.25;

/// Default temperature at which the technician measures resistance: the bench, 20 C.
pub const MEASURE_AT_C: f64 = 20.0;

/// The wire to cut for one winding.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Cut {
    /// Lead allowances added per strand: two ends, plus one for every park between sections.
    pub lead_allowances: u32,
    /// Per strand: the winding length plus the allowances, rounded up to [`CUT_ROUND_MM`].
    pub cut_each_mm: f64,
    /// Every strand's piece together.
    pub cut_total_mm: f64,
}

/// An expected reading and the band it may fall in.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Spread {
    /// The reading the plan expects (in the quantity's unit: ohm, uH).
    pub expected: f64,
    /// Lowest reading still as planned.
    pub low: f64,
    /// Highest reading still as planned.
    pub high: f64,
}

impl Spread {
    /// `expected` with a relative tolerance either way.
    pub fn around(expected: f64, tolerance: f64) -> Self {
        Spread {
            expected,
            low: expected * (1.0 - tolerance),
            high: expected * (1.0 + tolerance),
        }
    }
}

fn round_up(x: f64, step: f64) -> f64 {
    (x / step - 1e-9).ceil() * step
}

/// The stack indices of the sections that wind the winding `name` (as `winding` or
/// `partner`), in stack order.
pub fn sections_winding(build: &Build, name: &str) -> Vec<usize> {
    build
        .stack
        .iter()
        .enumerate()
        .filter(|(_, s)| match s {
            Section::Winding(ws) => ws.winding == name || ws.partner.as_deref() == Some(name),
            Section::Tape { .. } => false,
        })
        .map(|(i, _)| i)
        .collect()
}

/// The wire to cut for each winding, in the build's order.
pub fn cuts(build: &Build, eval: &Evaluation) -> Vec<Cut> {
    build
        .windings
        .iter()
        .zip(&eval.windings)
        .map(|(w, e)| {
            let parks = sections_winding(build, &w.name).len().saturating_sub(1) as u32;
            let lead_allowances = 2 + parks;
            let cut_each_mm = round_up(
                e.length_m * 1000.0 + f64::from(lead_allowances) * LEAD_ALLOWANCE_MM,
                CUT_ROUND_MM,
            );
            Cut {
                lead_allowances,
                cut_each_mm,
                cut_total_mm: cut_each_mm * f64::from(w.strands),
            }
        })
        .collect()
}

/// Each winding's DC resistance (ohm) at the bench temperature `measure_at_c`, from the
/// evaluation's at the build's temperature (IEC 60028's temperature coefficient), with
/// [`DCR_TOLERANCE`] either way; in the build's order.
pub fn dcr_at_bench(eval: &Evaluation, measure_at_c: f64) -> Vec<Spread> {
    let ratio = temperature_ratio(eval.temperature_c, measure_at_c);
    eval.windings
        .iter()
        .map(|e| Spread::around(e.dcr_ohm * ratio, DCR_TOLERANCE))
        .collect()
}

/// The first primary's magnetising inductance (uH) from the core's AL, with
/// [`AL_TOLERANCE`] either way; `None` without a primary or an AL.
pub fn magnetising_at_bench(build: &Build) -> Option<Spread> {
    let p = build.first_of(Role::Primary)?;
    let al = build.bobbin.core.as_ref().and_then(|c| c.al_nh)?;
    Some(Spread::around(
        measured_core::inductance_uh(al, p.turns),
        AL_TOLERANCE,
    ))
}

/// The leakage of the first primary to the first secondary (referred to the primary), the
/// pair the sheet, the bobbin ranking and the search quote.
pub fn primary_secondary_leakage<'a>(
    build: &Build,
    eval: &'a Evaluation,
) -> Option<&'a LeakageEval> {
    let p = build.first_of(Role::Primary)?;
    let s = build.first_of(Role::Secondary)?;
    eval.leakage
        .iter()
        .find(|l| l.from == p.name && l.to == s.name)
}
