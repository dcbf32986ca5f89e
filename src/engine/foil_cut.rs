//! The foil to cut for a foil winding, for the winding sheet: the copper strip's length and
//! width, the interleaf film's length and width, and the lead tabs. Pure figures from the
//! Build and its Evaluation; the sheet only renders them.

use super::Evaluation;
use super::bench::CUT_ROUND_MM;
use super::conductor::ConductorFigures;
use crate::model::{Build, Conductor};

/// Copper left at each end of the foil beyond its wound length: at the start, the land the
/// lead tab is soldered or crimped to before the first turn closes over it; at the finish,
/// the land of the finish tab (the project's own allowance, stated on the sheet).
pub const FOIL_END_ALLOWANCE_MM: f64 = 10.0;

/// The interleaf's overlap where its last wrap closes over the finished foil (common
/// practice: a centimetre, taped down).
pub const INTERLEAF_OVERLAP_MM: f64 = 10.0;

/// What to cut for one foil winding.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FoilCut {
    /// Copper thickness.
    pub thickness_mm: f64,
    /// Copper width used (the Evaluation's).
    pub width_mm: f64,
    /// The wound length, turns x MLT summed layer by layer (the Evaluation's length).
    pub wound_mm: f64,
    /// Wound length plus [`FOIL_END_ALLOWANCE_MM`] at each end, rounded up to [`CUT_ROUND_MM`].
    pub foil_cut_mm: f64,
    /// Interleaf film thickness.
    pub interleaf_mm: f64,
    /// Foil width plus the overhang each side, no wider than the window.
    pub interleaf_width_mm: f64,
    /// Foil cut plus one more wrap at the outermost turn's MLT plus
    /// [`INTERLEAF_OVERLAP_MM`], rounded up to [`CUT_ROUND_MM`].
    pub interleaf_cut_mm: f64,
    /// Overhang of the interleaf past each foil edge.
    pub overhang_mm: f64,
    /// Length of each lead tab from the winding to its pin.
    pub tab_mm: f64,
}

fn round_up(x: f64, step: f64) -> f64 {
    (x / step - 1e-9).ceil() * step
}

/// The foil to cut for winding `k`, or `None` when it is not foil.
pub fn foil_cut(build: &Build, eval: &Evaluation, k: usize) -> Option<FoilCut> {
    let w = build.windings.get(k)?;
    let e = eval.windings.get(k)?;
    let Conductor::Foil(f) = w.conductor else {
        return None;
    };
    let width_mm = match e.conductor {
        ConductorFigures::Foil { width_mm, .. } => width_mm,
        _ => f.width_on(build.bobbin.window.width_mm - 2.0 * build.setup.margin_mm),
    };
    let wound_mm = e.length_m * 1000.0;
    // The MLT of the outermost turn: its layer is the last of the winding in the stack.
    let outer_mlt_mm = eval
        .sections
        .iter()
        .filter(|s| matches!(&s.kind, super::SectionKind::Winding { winding, .. } if *winding == w.name))
        .flat_map(|s| s.layers.iter())
        .map(|l| l.mlt_mm)
        .next_back()
        .unwrap_or(e.mlt_mm);
    let foil_cut_mm = round_up(wound_mm + 2.0 * FOIL_END_ALLOWANCE_MM, CUT_ROUND_MM);
    Some(FoilCut {
        thickness_mm: f.thickness_mm,
        width_mm,
        wound_mm,
        foil_cut_mm,
        interleaf_mm: f.interleaf(),
        interleaf_width_mm: (width_mm + 2.0 * f.overhang()).min(build.bobbin.window.width_mm),
        interleaf_cut_mm: round_up(
            foil_cut_mm + outer_mlt_mm + INTERLEAF_OVERLAP_MM,
            CUT_ROUND_MM,
        ),
        overhang_mm: f.overhang(),
        tab_mm: f.tab(),
    })
}
