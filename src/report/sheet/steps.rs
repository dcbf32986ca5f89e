//! The winding steps of the sheet, section by section, and the leads that cross.

use super::conductor_steps::{conductor_lines, foil_turns_text, is_foil};
use super::*;

/// The numbered steps, one per stack section, from the tube outward.
pub(super) fn steps(build: &Build, eval: &Evaluation) -> Vec<SheetStep> {
    let mut steps = Vec::new();
    for (i, (sec, s_eval)) in build.stack.iter().zip(&eval.sections).enumerate() {
        let number = steps.len() + 1;
        match (sec, &s_eval.kind) {
            (Section::Tape { .. }, SectionKind::Tape { wraps }) => {
                steps.push(tape_step(build, number, i, *wraps));
            }
            (Section::Winding(_), SectionKind::Winding { .. }) => {
                steps.extend(winding_step(build, eval, number, i, s_eval));
            }
            _ => {}
        }
    }
    steps
}

/// The step of a tape section.
pub(super) fn tape_step(build: &Build, number: usize, i: usize, wraps: u32) -> SheetStep {
    let b = &build.bobbin;
    let wraps = &wraps;
    SheetStep {
        number,
        section: i,
        heading: format!("Tape: {}", plural(*wraps, "wrap", "wraps")),
        lines: vec![(
            "Tape".into(),
            format!(
                "{} of {:.1} mm tape over the whole width, flange to flange, \
                 pulled flat; overlap the end a little",
                plural(*wraps, "wrap", "wraps"),
                b.window.width_mm
            ),
        )],
    }
}

/// The step of a winding section: its heading and one line per thing to do, in order
/// (`None` for a tape section).
pub(super) fn winding_step(
    build: &Build,
    eval: &Evaluation,
    number: usize,
    i: usize,
    s_eval: &SectionEval,
) -> Option<SheetStep> {
    let SectionKind::Winding {
        winding,
        partner,
        turns,
        turns_per_layer,
        layer_count,
        last_layer_turns,
        layer_tape,
        spread,
        pitch_mm,
        ..
    } = &s_eval.kind
    else {
        return None;
    };
    let mut names = vec![winding.clone()];
    names.extend(partner.clone());
    let heading = winding_heading(build, &names, partner.is_some());
    let mut lines: Vec<(String, String)> = Vec::new();
    lines.extend(margin_line(build, s_eval));
    lines.extend(conductor_or_wire_lines(build, eval, &names));
    let foil = partner.is_none() && is_foil(build, winding);
    if partner.is_some() {
        lines.push((
            "Bifilar".into(),
            format!(
                "lay the wires of {} together, side by side, and wind them as one: \
                 the turns below count the pair once; keep them in the same order \
                 across every layer",
                names.join(" and ")
            ),
        ));
    }
    for n in &names {
        lines.push(("Start".into(), start_text(build, i, n)));
    }
    lines.push((
        "Direction".into(),
        "the one sense for every winding (see the convention)".into(),
    ));
    lines.push((
        "Turns".into(),
        if foil {
            foil_turns_text(*turns)
        } else {
            turns_text(*turns, *turns_per_layer, *layer_count, *last_layer_turns)
        },
    ));
    if *spread && !foil && *last_layer_turns > 0 && last_layer_turns < turns_per_layer {
        lines.push((
            "Spacing".into(),
            spacing_text(*last_layer_turns, eval.usable_width_mm, *pitch_mm),
        ));
    }
    if *layer_tape > 0 && *layer_count > 1 {
        lines.push((
            "Between".into(),
            format!(
                "{} of tape between layers",
                plural(*layer_tape, "wrap", "wraps")
            ),
        ));
    }
    let side = finish_side(foil, *layer_count);
    for n in &names {
        lines.push(("Finish".into(), finish_text(build, i, n, side)));
    }
    Some(SheetStep {
        number,
        section: i,
        heading,
        lines,
    })
}

/// The wire line of each winding of a step, or the foil's or litz's own lines.
fn conductor_or_wire_lines(
    build: &Build,
    eval: &Evaluation,
    names: &[crate::model::Name],
) -> Vec<(String, String)> {
    let mut lines = Vec::new();
    for n in names {
        let Some(w) = build.winding(n) else { continue };
        match conductor_lines(build, eval, n) {
            Some(own) => lines.extend(own),
            None => lines.push((format!("Wire {n}"), wire_text(w))),
        }
    }
    lines
}

/// Where a section's wire ends: a foil over its start, round wire and litz at a flange.
fn finish_side(foil: bool, layers: u32) -> &'static str {
    if foil {
        "the end of the last turn, under the interleaf's closing wrap"
    } else if layers % 2 == 1 {
        "the flange opposite the start"
    } else {
        "the flange you started at"
    }
}

/// The turns line of a section of round wire or litz.
fn turns_text(turns: u32, per_layer: u32, layers: u32, last: u32) -> String {
    format!(
        "{turns} turns in {}: {per_layer} a layer, {last} on the last layer",
        plural(layers, "layer", "layers")
    )
}

/// Gaps between spaced turns below this (mm) are too small to set with a rule; the winder
/// lays the turns evenly by eye (a judgement of hand practice, from memory).
const SPACING_BY_EYE_MM: f64 = 0.2;

/// How to space a spread section's partial last layer of `last` turns, each `pitch_mm`
/// wide: evenly over the usable width, each in the middle of its share; with a word where
/// the gaps come out too small to set by hand or wide enough for the layer above to sink in.
fn spacing_text(last: u32, usable_width_mm: f64, pitch_mm: f64) -> String {
    let every = usable_width_mm / f64::from(last.max(1));
    let gap = every - pitch_mm;
    let how = if last == 1 {
        format!(
            "wind the one turn of the last layer in the middle of the width, {:.2} mm from \
             either end of the usable width",
            every / 2.0
        )
    } else {
        format!(
            "space the {last} turns of the last layer evenly across the width: one every \
             {every:.2} mm centre to centre ({usable_width_mm:.1} mm usable over {last}), \
             the first and the last {:.2} mm in from the ends of the usable width",
            every / 2.0
        )
    };
    let why = if gap < SPACING_BY_EYE_MM {
        format!(
            "; the gaps come to {gap:.2} mm, too little to measure: lay the turns evenly by \
             eye, so the section above has no step to climb"
        )
    } else if gap > pitch_mm {
        format!(
            "; the gaps ({gap:.2} mm) are wider than the wire: a wrap of tape over this layer \
             keeps the section above from sinking into them"
        )
    } else {
        "; the section above then has no step to climb".to_string()
    };
    how + &why
}

/// The heading of a winding step: "Winding P (primary)", or a bifilar pair.
pub(super) fn winding_heading(
    build: &Build,
    names: &[crate::model::Name],
    bifilar: bool,
) -> String {
    let roles: Vec<String> = names
        .iter()
        .filter_map(|n| build.winding(n))
        .map(|w| format!("{} ({})", w.name, w.role.key()))
        .collect();
    if bifilar {
        format!("Winding {} bifilar", roles.join(" with "))
    } else {
        format!("Winding {}", roles.join(""))
    }
}

/// The margin tape to lay before a winding section, when the build has margins.
pub(super) fn margin_line(build: &Build, s_eval: &SectionEval) -> Option<(String, String)> {
    (build.setup.margin_mm > 0.0).then(|| {
        (
            "Margins".into(),
            format!(
                "before the first layer, margin tape {:.1} mm wide against each \
                 flange, built up to {:.2} mm (this section's height)",
                build.setup.margin_mm, s_eval.height_mm
            ),
        )
    })
}

/// Where a winding starts in section `i`: on its start pin, or going on from the section
/// where it was parked.
pub(super) fn start_text(build: &Build, i: usize, n: &str) -> String {
    let secs = bench::sections_winding(build, n);
    let pos = secs.iter().position(|&k| k == i).unwrap_or(0);
    let w = build.winding(n);
    if pos == 0 {
        format!("{n} on {}", pin_text(&w.and_then(|w| w.start_pin.clone())))
    } else {
        format!(
            "{n}: go on with the wire left uncut at step {}",
            secs[pos - 1] + 1
        )
    }
}

/// Where a winding ends in section `i`: on its finish pin, or parked for a later section.
pub(super) fn finish_text(build: &Build, i: usize, n: &str, side: &str) -> String {
    let secs = bench::sections_winding(build, n);
    let pos = secs.iter().position(|&k| k == i).unwrap_or(0);
    let w = build.winding(n);
    if pos + 1 == secs.len() {
        format!(
            "{n} on {} (the wire ends at {side})",
            pin_text(&w.and_then(|w| w.finish_pin.clone()))
        )
    } else {
        format!(
            "{n}: do not cut; park it at {side}, it goes on at step {}",
            secs[pos + 1] + 1
        )
    }
}

/// The wire of a winding in words, with its strands laid side by side.
pub(super) fn wire_text(w: &crate::model::Winding) -> String {
    if w.strands > 1 {
        format!(
            "{} strands of {} {} laid side by side as one turn",
            w.strands,
            wire_label(&w.wire, 1),
            w.insulation
        )
    } else {
        format!("{} {}", wire_label(&w.wire, 1), w.insulation)
    }
}

/// Leads that cross a winding on the way to their pin, as "P start", "S finish", ...: a start
/// lead with a winding layer below it, a finish lead leaving from above a winding layer.
pub(super) fn crossing_leads(build: &Build, eval: &Evaluation) -> Vec<String> {
    let mut out = Vec::new();
    let winding_below = |y: f64| {
        eval.sections.iter().any(|s| {
            matches!(s.kind, SectionKind::Winding { .. })
                && s.layers.iter().any(|l| l.y_mm + 1e-9 < y)
        })
    };
    for w in &build.windings {
        let mut first: Option<f64> = None;
        let mut last: Option<f64> = None;
        for s in &eval.sections {
            if let SectionKind::Winding {
                winding, partner, ..
            } = &s.kind
                && (*winding == w.name || partner.as_deref() == Some(w.name.as_str()))
            {
                first.get_or_insert(s.y_mm);
                last = s.layers.last().map(|l| l.y_mm);
            }
        }
        if first.is_some_and(winding_below) {
            out.push(format!("{} start", w.name));
        }
        if last.is_some_and(winding_below) {
            out.push(format!("{} finish", w.name));
        }
        // A winding parked between sections crosses whatever is wound in between.
        let secs: Vec<usize> = eval
            .sections
            .iter()
            .enumerate()
            .filter(|(_, s)| {
                matches!(&s.kind, SectionKind::Winding { winding, partner, .. }
                    if *winding == w.name || partner.as_deref() == Some(w.name.as_str()))
            })
            .map(|(i, _)| i)
            .collect();
        for pair in secs.windows(2) {
            let between = eval.sections[pair[0] + 1..pair[1]]
                .iter()
                .any(|s| matches!(s.kind, SectionKind::Winding { .. }));
            if between {
                out.push(format!(
                    "{} from step {} to {}",
                    w.name,
                    pair[0] + 1,
                    pair[1] + 1
                ));
            }
        }
    }
    out
}
