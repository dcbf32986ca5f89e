//! Partial last layers spaced across the width (`spread`), as a winder would wind a layer
//! that has another section over it: what the design and the search hand out.

use super::{Evaluation, WarningKind, evaluate};
use crate::model::{Build, Section};

/// `build` with every partial last layer that has another section wound over it spaced
/// across the width, and its evaluation; `None` where nothing is to be spaced or spacing
/// would not do. Spacing raises the voltage between that layer and the one below (FORMAT.md,
/// "A spread last layer"): a section whose films would then not stand it stays close-wound,
/// and a build that passed is never traded for one that does not. Loss, leakage and height
/// do not change.
pub fn space_partial_layers(build: &Build, eval: &Evaluation) -> Option<(Build, Evaluation)> {
    let warned = |e: &Evaluation, pick: fn(&WarningKind) -> Option<usize>| -> Vec<usize> {
        e.warnings.iter().filter_map(|w| pick(&w.kind)).collect()
    };
    let partial = warned(eval, |k| match k {
        WarningKind::PartialLayer { section, .. } => Some(*section),
        _ => None,
    });
    if partial.is_empty() {
        return None;
    }
    let layer_voltage = |k: &WarningKind| match k {
        WarningKind::LayerVoltage { section, .. } => Some(*section),
        _ => None,
    };
    let set = |b: &mut Build, sections: &[usize], on: bool| {
        for &i in sections {
            if let Some(Section::Winding(ws)) = b.stack.get_mut(i) {
                ws.spread = on;
            }
        }
    };
    let mut spaced = build.clone();
    set(&mut spaced, &partial, true);
    let mut e = evaluate(&spaced);
    // Every spaced section whose layers its films do not stand goes back to close-wound
    // (spacing only raises a layer voltage, so one over before stays over).
    let stressed: Vec<usize> = warned(&e, layer_voltage)
        .into_iter()
        .filter(|i| partial.contains(i))
        .collect();
    if !stressed.is_empty() {
        set(&mut spaced, &stressed, false);
        if spaced == *build {
            return None;
        }
        e = evaluate(&spaced);
    }
    // A guard: no failure the engine counts today moves with spacing, but a build that
    // passed must never come back failing.
    let before = eval.failures();
    e.failures()
        .iter()
        .all(|f| before.contains(f))
        .then_some((spaced, e))
}
