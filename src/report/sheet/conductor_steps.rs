//! The sheet's lines for foil and litz windings: what to cut (foil, interleaf, tabs), how to
//! fix and insulate the tabs, how to terminate litz; the figures come from the Evaluation and
//! `engine::foil_cut`, the words are common practice and say so.

use super::*;
use crate::engine::conductor::ConductorFigures;
use crate::engine::foil_cut::{FOIL_END_ALLOWANCE_MM, FoilCut, INTERLEAF_OVERLAP_MM, foil_cut};
use crate::model::{Conductor, Winding, trim_mm};

/// The bill of materials' wire and grade cells of a foil or litz winding; `None` for round
/// wire.
pub(super) fn bom_cells(w: &Winding, fig: &ConductorFigures) -> Option<(String, String)> {
    match (w.conductor, fig) {
        (Conductor::Foil(f), ConductorFigures::Foil { width_mm, .. }) => Some((
            format!("foil {}x{}", trim_mm(f.thickness_mm), trim_mm(*width_mm)),
            String::new(),
        )),
        (Conductor::Litz(l), _) => Some((
            format!("litz {}x{}", l.strands, trim_mm(l.strand_mm)),
            String::new(),
        )),
        _ => None,
    }
}

/// The conductor lines of winding `n` in a step: for foil what to cut and how to fix the
/// tabs, for litz the bundle and its termination; `None` for round wire.
pub(super) fn conductor_lines(
    build: &Build,
    eval: &Evaluation,
    n: &str,
) -> Option<Vec<(String, String)>> {
    let k = build.winding_index(n)?;
    let w = &build.windings[k];
    match w.conductor {
        Conductor::Round => None,
        Conductor::Foil(_) => foil_cut(build, eval, k).map(|c| foil_lines(n, w, &c)),
        Conductor::Litz(l) => {
            let e = eval.windings.get(k)?;
            Some(litz_lines(n, w, &l, e.od_mm))
        }
    }
}

fn foil_lines(n: &str, w: &Winding, c: &FoilCut) -> Vec<(String, String)> {
    vec![
        (
            format!("Foil {n}"),
            format!(
                "copper foil {} mm thick, {} mm wide, cut {:.0} mm long ({} turns wound, \
                 {:.0} mm, plus {FOIL_END_ALLOWANCE_MM:.0} mm at each end for the tab lands, \
                 rounded up); cut square with shears, then file or deburr both cut ends and \
                 any nick in the edges: a burr cuts through the interleaf and shorts a turn",
                trim_mm(c.thickness_mm),
                trim_mm(c.width_mm),
                c.foil_cut_mm,
                w.turns,
                c.wound_mm
            ),
        ),
        (
            "Interleaf".into(),
            format!(
                "{} mm insulating film (polyester, common practice), {} mm wide so it \
                 stands {} mm past each foil edge, cut {:.0} mm long: it goes on under the \
                 foil from the first turn, and one more wrap closes over the last turn with \
                 {INTERLEAF_OVERLAP_MM:.0} mm of overlap, taped down",
                trim_mm(c.interleaf_mm),
                trim_mm(c.interleaf_width_mm),
                trim_mm(c.overhang_mm),
                c.interleaf_cut_mm
            ),
        ),
        (
            "Tabs".into(),
            format!(
                "two copper tabs, each long enough to run {} mm from the winding to its pin: \
                 solder or crimp each across the foil's end land (common practice), the \
                 joint smooth, no solder spikes or sharp corners; round the corners of the \
                 foil and the tab; cover the joint and the foil edge under it with polyimide \
                 or polyester tape on both faces, and sleeve the tab where it crosses other \
                 turns or the flange to its pin",
                trim_mm(c.tab_mm)
            ),
        ),
    ]
}

fn litz_lines(n: &str, w: &Winding, l: &crate::model::Litz, od_mm: f64) -> Vec<(String, String)> {
    let bundles = if w.strands > 1 {
        format!("{} bundles side by side as one turn, each ", w.strands)
    } else {
        String::new()
    };
    vec![
        (
            format!("Wire {n}"),
            format!(
                "{bundles}litz of {} strands of {} mm {} enamel, {:.2} mm over the serving",
                l.strands,
                trim_mm(l.strand_mm),
                w.insulation,
                od_mm
            ),
        ),
        (
            "Litz ends".into(),
            "at each end, before it goes to the pin: unwrap the serving back just past where \
             the end will be soldered and bind it there with thread or tape so it does not \
             unravel; remove the enamel as it allows (solderable enamel in a solder pot at the \
             temperature its maker gives; other enamels by stripping, chemical or abrasive, \
             never by nicking the strands), tin the whole stripped length, then check under a \
             lens that every strand is bright and tinned and none is broken or left out; a \
             missing strand shows as a DC resistance above its band (checks below)"
                .to_string(),
        ),
    ]
}

/// The winding sheet's note on the DC check of a litz winding.
pub(super) fn litz_dcr_note(w: &Winding) -> &'static str {
    match w.conductor {
        Conductor::Litz(_) => "; above the band, look for strands broken or left untinned at a pin",
        _ => "",
    }
}

/// The turns line of a foil section: one turn a layer.
pub(super) fn foil_turns_text(turns: u32) -> String {
    format!(
        "{} one a layer: wind the foil and the interleaf together, the foil centred across \
         the breadth, its edges square to the flanges all the way (no drift to one side), \
         each turn pulled flat and tight",
        plural(turns, "turn,", "turns,")
    )
}

/// The winding's conductor is foil.
pub(super) fn is_foil(build: &Build, n: &str) -> bool {
    build
        .winding(n)
        .is_some_and(|w| matches!(w.conductor, Conductor::Foil(_)))
}

/// The bill of materials' rows of each foil winding: the foil, the interleaf and the tabs
/// (cut as their step says, not with the wire's lead allowance).
pub(super) fn foil_materials(build: &Build, eval: &Evaluation) -> Vec<(String, String)> {
    let mut out = Vec::new();
    for (k, w) in build.windings.iter().enumerate() {
        let Some(c) = foil_cut(build, eval, k) else {
            continue;
        };
        out.push((
            format!("Foil {}", w.name),
            format!(
                "copper {} mm thick, {} x {:.0} mm (the wound length plus {FOIL_END_ALLOWANCE_MM:.0} \
                 mm at each end; no wire lead allowance)",
                trim_mm(c.thickness_mm),
                trim_mm(c.width_mm),
                c.foil_cut_mm
            ),
        ));
        out.push((
            format!("Interleaf {}", w.name),
            format!(
                "film {} mm thick, {} x {:.0} mm",
                trim_mm(c.interleaf_mm),
                trim_mm(c.interleaf_width_mm),
                c.interleaf_cut_mm
            ),
        ));
        out.push((
            format!("Tabs {}", w.name),
            format!(
                "2 copper tabs reaching {} mm from the winding to the pins, and polyimide or \
                 polyester tape to cover them",
                trim_mm(c.tab_mm)
            ),
        ));
    }
    out
}
