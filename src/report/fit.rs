//! Which bobbin fits a build: the same windings and stack laid onto each bobbin of a list,
//! ranked. Pure: takes the bobbins, reads only `engine::validate` and `engine::evaluate`.

use crate::engine::{evaluate, primary_secondary_leakage, validate};
use crate::model::{Bobbin, BobbinSource, Build};

/// One bobbin's answer.
#[derive(Debug, Clone, PartialEq)]
pub struct FitRow {
    pub bobbin: String,
    pub name: String,
    /// Valid on this bobbin and fits with the allowance.
    pub fits: bool,
    /// The build can be laid on this bobbin at all (no wire wider than the usable width, ...).
    pub valid: bool,
    pub height_with_allowance_mm: f64,
    pub window_height_mm: f64,
    /// Negative when too tall.
    pub spare_height_mm: f64,
    pub fill_factor: f64,
    pub dcr_total_ohm: f64,
    /// Leakage of the first primary to the first secondary, referred to the primary.
    pub leakage_uh: Option<f64>,
    /// Why it does not fit, in words; empty when it fits.
    pub reasons: Vec<String>,
}

/// The row of one bobbin.
pub fn fit_one(build: &Build, id: &str, bobbin: &Bobbin) -> FitRow {
    let mut b = build.clone();
    b.bobbin = bobbin.clone();
    b.bobbin_source = BobbinSource::Id(id.to_string());
    let problems = validate(&b);
    let eval = evaluate(&b);
    let mut reasons: Vec<String> = problems.iter().map(ToString::to_string).collect();
    if problems.is_empty() && !eval.fits {
        reasons.insert(
            0,
            format!(
                "too tall: {:.2} mm with allowance in a {:.2} mm window, {:.2} mm over",
                eval.height_with_allowance_mm, eval.window_height_mm, -eval.spare_height_mm
            ),
        );
    }
    let valid = problems.is_empty();
    FitRow {
        bobbin: id.to_string(),
        name: bobbin.name.clone(),
        fits: valid && eval.fits,
        valid,
        height_with_allowance_mm: eval.height_with_allowance_mm,
        window_height_mm: eval.window_height_mm,
        spare_height_mm: eval.spare_height_mm,
        fill_factor: eval.fill_factor,
        dcr_total_ohm: eval.windings.iter().map(|w| w.dcr_ohm).sum(),
        leakage_uh: primary_secondary_leakage(&b, &eval).map(|l| l.uh),
        reasons,
    }
}

/// Every bobbin's row, ranked: those that fit first, most spare height first; then those that
/// are valid but too tall, least over first; then those the build cannot be laid on at all.
/// Ties go by id, so the order is stable.
pub fn rank(build: &Build, bobbins: &[(String, Bobbin)]) -> Vec<FitRow> {
    let mut rows: Vec<FitRow> = bobbins
        .iter()
        .map(|(id, b)| fit_one(build, id, b))
        .collect();
    rows.sort_by(|a, b| {
        let tier = |r: &FitRow| match (r.fits, r.valid) {
            (true, _) => 0,
            (false, true) => 1,
            (false, false) => 2,
        };
        tier(a)
            .cmp(&tier(b))
            .then(b.spare_height_mm.total_cmp(&a.spare_height_mm))
            .then_with(|| a.bobbin.cmp(&b.bobbin))
    });
    rows
}
