//! The order of the designs and the requirement that binds each.

use super::Design;
use crate::engine::{Constraint, Evaluation};

/// A requirement's use: the constraint, how much of its allowance is left (`1 - used /
/// allowed`), and the figures.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct DesignLimit {
    /// Which requirement.
    pub constraint: Constraint,
    /// `1 - used / allowed`: the share of the allowance left.
    pub margin: f64,
    /// What the design takes (in the constraint's unit).
    pub used: f64,
    /// What the requirement allows (same unit).
    pub allowed: f64,
}

/// The requirement with the least margin: every limit the evaluation holds the build to, the
/// switch voltage against the derated rating `allowed_v` rather than the rating.
pub fn binding_limit(eval: &Evaluation, allowed_v: f64) -> DesignLimit {
    let switch_v = eval.converter.as_ref().map_or(0.0, |c| c.switch_voltage_v);
    let mut all: Vec<DesignLimit> = eval
        .limits
        .iter()
        .filter(|l| l.constraint != Constraint::SwitchVoltage)
        .map(|l| DesignLimit {
            constraint: l.constraint,
            margin: l.margin,
            used: l.used,
            allowed: l.allowed,
        })
        .collect();
    all.push(DesignLimit {
        constraint: Constraint::SwitchVoltage,
        margin: 1.0 - switch_v / allowed_v,
        used: switch_v,
        allowed: allowed_v,
    });
    all.into_iter()
        .min_by(|a, b| a.margin.total_cmp(&b.margin))
        .unwrap_or(DesignLimit {
            constraint: Constraint::Fit,
            margin: 1.0,
            used: 0.0,
            allowed: 0.0,
        })
}

/// `a` ranks before `b`: less total loss (to 0.1 mW), then more spare height, then the
/// bobbin's id (so the order does not depend on the library's order).
pub fn better(a: &Design, b: &Design) -> bool {
    order(a, b) == std::cmp::Ordering::Less
}

fn order(a: &Design, b: &Design) -> std::cmp::Ordering {
    let mw = |d: &Design| (d.total_loss_w * 1e4).round();
    mw(a)
        .total_cmp(&mw(b))
        .then(b.spare_height_mm.total_cmp(&a.spare_height_mm))
        .then(a.bobbin.cmp(&b.bobbin))
}

/// Best first.
pub fn sort(designs: &mut [Design]) {
    designs.sort_by(order);
}
