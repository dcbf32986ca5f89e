//! The words of a foil or litz winding's resistance off its prediction (`turnstack verify`,
//! the planner's readings panel): the foil thickness or the strands the reading implies, and
//! what a technician checks. Reads `engine::verify_conductor`; computes no figure.

use crate::engine::verify_conductor::ImpliedConductor;

/// The sentence after "N times the expected resistance; " for a foil or a litz winding.
pub fn implied_conductor_words(
    c: &ImpliedConductor,
    factor: f64,
    planned_length_m: f64,
    implied_length_m: f64,
) -> String {
    let length =
        format!("or the length is off: {implied_length_m:.2} m instead of {planned_length_m:.2} m");
    match *c {
        ImpliedConductor::FoilThickness {
            planned_mm,
            implied_mm,
            width_mm,
        } => format!(
            "over the planned length and {width_mm:.1} mm width that is foil {implied_mm:.3} \
             mm thick instead of {planned_mm:.3} mm: measure the foil with a micrometer and \
             look at the tab joints, {length}"
        ),
        ImpliedConductor::LitzStrands {
            planned,
            implied,
            strand_mm,
        } if factor > 1.0 => format!(
            "that is {implied:.0} of the {planned} strands of {strand_mm:.3} mm carrying the \
             current: most likely strands left in their enamel or broken at the ends (tin the \
             ends through and count them), {length}"
        ),
        ImpliedConductor::LitzStrands {
            planned,
            implied,
            strand_mm,
        } => format!(
            "that is {implied:.0} strands of {strand_mm:.3} mm instead of {planned}: a bundle \
             of more or coarser strands than planned, {length}"
        ),
    }
}
