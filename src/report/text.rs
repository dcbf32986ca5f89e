//! The readable report of `turnstack check`: the stack from the tube outward with its layers,
//! the windings, leakage, converter figures, the verdict and the warnings, in 80 columns.

use super::wrap;
use crate::engine::{Evaluation, SectionKind, WarningAt};
use crate::model::{BobbinSource, Build, ResetSide, Tube};
use std::fmt::Write as _;

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
    let freq = s
        .frequency_khz
        .map_or("no frequency".to_string(), |f| format!("{f} kHz"));
    let setup = format!(
        "setup: {} C, allowance x{:.2}, margins {:.2} mm, tape {:.3} mm/wrap, {freq}",
        s.temperature_c, s.bulge, s.margin_mm, s.tape_mm
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
        s.bulge,
        eval.height_with_allowance_mm,
        eval.usable_width_mm,
        eval.fill_factor
    );
    for l in wrap(&summary, WIDTH - 2, "  ") {
        let _ = writeln!(o, "  {l}");
    }

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
                with,
                turns,
                turns_per_layer,
                layer_count,
                last_layer_turns,
                layer_tape,
                mlt_mm,
                ..
            } => {
                let name = match with {
                    Some(w) => format!("{winding}+{w} bifilar"),
                    None => winding.clone(),
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
                    let partial = if layer.partial { "  partial" } else { "" };
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

    let _ = writeln!(o, "\nWindings, resistance at {} C", s.temperature_c);
    let _ = writeln!(
        o,
        "  name   role       turns  wire             length m  MLT mm   DCR ohm  A/mm2"
    );
    for (w, model) in eval.windings.iter().zip(&build.windings) {
        let wire = wire_label(&model.wire, w.strands);
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
            let line = format!(
                "{} - {}: {:.3} uH referred to {}",
                l.from, l.to, l.uh, l.referred_to
            );
            for l in wrap(&line, WIDTH - 2, "    ") {
                let _ = writeln!(o, "  {l}");
            }
        }
    }

    if let Some(c) = &eval.converter {
        let _ = writeln!(o, "\nConverter (single-switch forward)");
        let side = match c.reset_side {
            ResetSide::Primary => "reset to the input",
            ResetSide::Secondary => "reset to the output",
        };
        let _ = writeln!(o, "  Np {} : Ns {} : Nr {}, {side}", c.np, c.ns, c.nr);
        let _ = writeln!(
            o,
            "  reset duty limit       {:>7.1} %",
            c.reset_duty_limit * 100.0
        );
        let _ = writeln!(
            o,
            "  duty needed at vin min {:>7.1} %",
            c.duty_needed_at_vin_min * 100.0
        );
        let _ = writeln!(
            o,
            "  switch off-state       {:>7.1} V (plus the leakage spike)",
            c.switch_voltage_v
        );
        if let Some(b) = c.flux_swing_worst_mt {
            let head = c
                .flux_headroom_mt
                .map_or(String::new(), |h| format!(" of {h:.0} mT headroom"));
            let _ = writeln!(o, "  worst-case flux swing  {b:>7.1} mT{head}");
        }
    }

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
            &format!("! {}{at}: {}", w.code, w.message),
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
    o
}

/// Cut to `n` display columns.
pub fn truncate(s: &str, n: usize) -> String {
    use unicode_width::UnicodeWidthChar;
    let mut out = String::new();
    let mut w = 0;
    for c in s.chars() {
        let cw = c.width().unwrap_or(0);
        if w + cw > n {
            break;
        }
        w += cw;
        out.push(c);
    }
    out
}

/// A short wire label for tables: `3x0.5 mm`, `AWG 32`, `0.8/0.87 mm` for measured wire.
pub fn wire_label(wire: &crate::model::WireSize, strands: u32) -> String {
    use crate::model::{WireSize, trim_mm};
    let base = match *wire {
        WireSize::Measured { bare_mm, od_mm } => {
            format!("{}/{} mm", trim_mm(bare_mm), trim_mm(od_mm))
        }
        other => other.to_string(),
    };
    if strands > 1 {
        format!("{strands}x{base}")
    } else {
        base
    }
}
