//! The readable report of `turnstack check`: the stack from the tube outward with its layers,
//! the windings, leakage, converter figures, the verdict and the warnings, in 80 columns.

pub use super::textfmt::{conductor_label, truncate, wire_label};
use super::wrap;
use crate::engine::{
    AlSource, ConverterEval, CurrentSource, Evaluation, Limit, LossEval, SectionKind,
    TemperatureSource, WarningAt,
};
use crate::model::{BobbinSource, Build, ResetSide, Tube};
use std::fmt::Write as _;

mod conductor_block;
mod converter_blocks;
mod limits_block;
mod loss_blocks;
mod outputs_block;

use converter_blocks::{converter_block, currents_block};
use limits_block::{limit_figure, limits_block};
use loss_blocks::{capacitance_block, losses_block, stress_block};
use outputs_block::outputs_block;

pub const WIDTH: usize = 80;

/// One line verdict: "FITS ..." or "DOES NOT FIT ...".
pub fn verdict(eval: &Evaluation) -> String {
    if eval.fits {
        format!(
            "FITS: {:.2} mm with allowance of {:.2} mm window height, {:.2} mm spare",
            eval.height_with_allowance_mm, eval.window_height_mm, eval.spare_height_mm
        )
    } else {
        format!(
            "DOES NOT FIT: {:.2} mm with allowance of {:.2} mm window height, {:.2} mm too tall",
            eval.height_with_allowance_mm, eval.window_height_mm, -eval.spare_height_mm
        )
    }
}

/// A temperature as the report prints it: as given when whole, else to 0.1 C.
fn temperature_figure(t: f64) -> String {
    if t.fract() == 0.0 {
        format!("{t}")
    } else {
        format!("{t:.1}")
    }
}

/// Where the winding temperature came from, when it was not given.
fn temperature_how(eval: &Evaluation) -> String {
    match (eval.temperature_source, &eval.losses) {
        (TemperatureSource::AmbientPlusRise, Some(l)) => format!(
            " (ambient {} C + predicted rise)",
            temperature_figure(l.ambient_c)
        ),
        (TemperatureSource::Ambient, _) => " (ambient, no rise predicted)".into(),
        (TemperatureSource::Default, _) => " (default)".into(),
        _ => String::new(),
    }
}

/// The last line of the report: whether the design passes, and if not what fails.
pub fn outcome(eval: &Evaluation) -> String {
    let failures = eval.failures();
    if failures.is_empty() {
        return "PASSES: the build fits and every limit holds".into();
    }
    let what: Vec<String> = failures
        .iter()
        .map(|c| match eval.limits.iter().find(|l| l.constraint == *c) {
            Some(l) => format!(
                "{} ({} against {})",
                c.key(),
                limit_figure(l, l.used),
                limit_figure(l, l.allowed)
            ),
            None => c.key().to_string(),
        })
        .collect();
    format!("FAILS: {}", what.join(", "))
}

pub fn bobbin_line(build: &Build) -> String {
    let b = &build.bobbin;
    let id = match &build.bobbin_source {
        BobbinSource::Id(id) => id.clone(),
        BobbinSource::Inline => "inline".into(),
    };
    let tube = match b.tube {
        Tube::Rect {
            width_mm,
            depth_mm,
            corner_radius_mm,
        } => {
            format!("tube {width_mm:.2} x {depth_mm:.2} mm r {corner_radius_mm:.2}")
        }
        Tube::Round { diameter_mm } => format!("tube dia {diameter_mm:.2} mm"),
    };
    format!(
        "bobbin {id}: window {:.2} x {:.2} mm, {tube}",
        b.window.width_mm, b.window.height_mm
    )
}

pub fn render(build: &Build, eval: &Evaluation) -> String {
    let mut o = String::new();
    header_block(&mut o, build, eval);
    stack_block(&mut o, eval);
    windings_block(&mut o, build, eval);
    capacitance_block(&mut o, eval);
    currents_block(&mut o, eval);
    if let Some(c) = &eval.converter {
        converter_block(&mut o, c);
        outputs_block(&mut o, &c.outputs);
    }
    if let Some(st) = &eval.stress {
        stress_block(&mut o, st);
    }
    if let Some(l) = &eval.losses {
        losses_block(&mut o, l);
    }
    limits_block(&mut o, eval);
    remarks_block(&mut o, build, eval);
    o
}

/// The title, the bobbin, the setup, the verdict and the summary of heights.
fn header_block(o: &mut String, build: &Build, eval: &Evaluation) {
    let title = if build.title.is_empty() {
        "(untitled build)"
    } else {
        &build.title
    };
    for l in wrap(title, WIDTH, "  ") {
        let _ = writeln!(o, "{l}");
    }
    for l in wrap(&bobbin_line(build), WIDTH, "  ") {
        let _ = writeln!(o, "{l}");
    }
    if !build.bobbin.name.is_empty() {
        for l in wrap(&format!("  {}", build.bobbin.name), WIDTH, "  ") {
            let _ = writeln!(o, "{l}");
        }
    }
    let s = &build.setup;
    let freq = frequency_text(build);
    let setup = format!(
        "setup: {} C{}, allowance x{:.2}, margins {:.2} mm, tape {:.3} mm/wrap, {freq}",
        temperature_figure(eval.temperature_c),
        temperature_how(eval),
        s.allowance_factor,
        s.margin_mm,
        s.tape_mm
    );
    for l in wrap(&setup, WIDTH, "  ") {
        let _ = writeln!(o, "{l}");
    }
    let _ = writeln!(o);
    for l in wrap(&verdict(eval), WIDTH, "  ") {
        let _ = writeln!(o, "{l}");
    }
    let summary = format!(
        "build {:.3} mm, x{:.2} = {:.3} mm; usable width {:.2} mm; fill factor {:.3}",
        eval.build_height_mm,
        s.allowance_factor,
        eval.height_with_allowance_mm,
        eval.usable_width_mm,
        eval.fill_factor
    );
    for l in wrap(&summary, WIDTH - 2, "  ") {
        let _ = writeln!(o, "  {l}");
    }
}

/// The stack from the tube outward, one row per section.
fn stack_block(o: &mut String, eval: &Evaluation) {
    let _ = writeln!(o, "\nStack, from the tube outward");
    let _ = writeln!(
        o,
        "  #  section        turns  /layer  layers  last  height mm  MLT mm"
    );
    for (i, sec) in eval.sections.iter().enumerate() {
        let flag = if sec.past_window { "  PAST LIMIT" } else { "" };
        match &sec.kind {
            SectionKind::Tape { wraps } => {
                let _ = writeln!(
                    o,
                    "{:>3}  tape x{:<9}{:>38.3}{flag}",
                    i + 1,
                    wraps,
                    sec.height_mm
                );
            }
            SectionKind::Winding {
                winding,
                partner,
                turns,
                turns_per_layer,
                layer_count,
                last_layer_turns,
                layer_tape,
                mlt_mm,
                spread,
                ..
            } => {
                let name = match partner {
                    Some(w) => format!("{winding}+{w} bifilar"),
                    None => winding.to_string(),
                };
                let _ = writeln!(
                    o,
                    "{:>3}  {:<14} {:>5}  {:>6}  {:>6}  {:>4}  {:>9.3}  {:>6.1}{flag}",
                    i + 1,
                    truncate(&name, 14),
                    turns,
                    turns_per_layer,
                    layer_count,
                    last_layer_turns,
                    sec.height_mm,
                    mlt_mm
                );
                for (k, layer) in sec.layers.iter().enumerate() {
                    let partial = match (layer.partial, *spread) {
                        (true, true) => "  partial, spaced across the width",
                        (true, false) => "  partial",
                        _ => "",
                    };
                    let _ = writeln!(
                        o,
                        "       layer {:<3} {:>4} turns at {:>6.3} mm, MLT {:>5.1} mm{partial}",
                        k + 1,
                        layer.turns,
                        layer.y_mm,
                        layer.mlt_mm
                    );
                }
                if *layer_tape > 0 {
                    let _ = writeln!(o, "       {layer_tape} wrap(s) of tape between layers");
                }
            }
        }
    }
}

/// The switching frequency as the report writes it.
fn frequency_text(build: &Build) -> String {
    build
        .setup
        .frequency_khz
        .map_or("no frequency".to_string(), |f| format!("{f} kHz"))
}

/// The windings with their resistance, the AC figures and the leakage.
fn windings_block(o: &mut String, build: &Build, eval: &Evaluation) {
    let freq = frequency_text(build);
    let _ = writeln!(
        o,
        "\nWindings, resistance at {} C",
        temperature_figure(eval.temperature_c)
    );
    let _ = writeln!(
        o,
        "  name   role       turns  wire             length m  MLT mm   DCR ohm  A/mm2"
    );
    for (w, model) in eval.windings.iter().zip(&build.windings) {
        let wire = conductor_label(model);
        let j = w
            .current_density_a_mm2
            .map_or("-".to_string(), |j| format!("{j:.1}"));
        let _ = writeln!(
            o,
            "  {:<6} {:<9} {:>6}  {:<15} {:>9.3}  {:>6.1}  {:>8.4}  {:>5}",
            truncate(&w.name, 6),
            w.role.key(),
            w.turns,
            truncate(&wire, 15),
            w.length_m,
            w.mlt_mm,
            w.dcr_ohm,
            j
        );
    }
    conductor_block::conductor_block(o, eval);
    if let Some(a) = eval.windings.iter().find_map(|w| w.ac.as_ref()) {
        let _ = writeln!(
            o,
            "\nAC resistance at {freq} (Dowell, sinusoidal), skin depth {:.3} mm",
            a.skin_depth_mm
        );
        for w in &eval.windings {
            match &w.ac {
                Some(a) => {
                    let _ = writeln!(
                        o,
                        "  {:<6} AC factor {:>6.2}   Rac {:>8.4} ohm",
                        truncate(&w.name, 6),
                        a.ac_factor,
                        a.rac_ohm
                    );
                }
                None => {
                    let _ = writeln!(
                        o,
                        "  {:<6} no AC figure (see warnings)",
                        truncate(&w.name, 6)
                    );
                }
            }
        }
    }

    if !eval.leakage.is_empty() {
        let _ = writeln!(o, "\nLeakage inductance (1-D field across the build)");
        for l in &eval.leakage {
            let bifilar = if l.bifilar_uh > 0.0 {
                format!(" ({:.3} uH of it between the bifilar wires)", l.bifilar_uh)
            } else {
                String::new()
            };
            let line = format!(
                "{} - {}: {:.3} uH referred to {}{bifilar}",
                l.from, l.to, l.uh, l.referred_to
            );
            for l in wrap(&line, WIDTH - 2, "    ") {
                let _ = writeln!(o, "  {l}");
            }
        }
    }
}

/// The warnings and the notes.
fn remarks_block(o: &mut String, build: &Build, eval: &Evaluation) {
    let _ = writeln!(o, "\nWarnings");
    if eval.warnings.is_empty() {
        let _ = writeln!(o, "  none");
    }
    for w in &eval.warnings {
        let at = match w.at {
            WarningAt::Section(i) => format!(" [stack #{}]", i + 1),
            WarningAt::Winding(i) => {
                format!(" [{}]", build.windings.get(i).map_or("?", |w| &w.name))
            }
            _ => String::new(),
        };
        for l in wrap(
            &format!("! {}{at}: {}", w.code(), w.message()),
            WIDTH - 2,
            "    ",
        ) {
            let _ = writeln!(o, "  {l}");
        }
    }
    for n in &eval.notes {
        for l in wrap(&format!("note: {n}"), WIDTH - 2, "    ") {
            let _ = writeln!(o, "  {l}");
        }
    }
    let _ = writeln!(o);
    for l in wrap(&outcome(eval), WIDTH, "  ") {
        let _ = writeln!(o, "{l}");
    }
}
