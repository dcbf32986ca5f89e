//! The text of a build file: `build_to_toml` writes every table of a build, one helper a
//! table, in the order FORMAT.md lists them; reading the text back gives the same build.

use super::save::{bobbin_keys, num, quote, wire_text};
use crate::model::{
    BobbinSource, Build, Conductor, Foil, Insulation, Isolation, Litz, Material, Measured,
    Operating, Output, ResetSide, Section, Setup, Winding, WireSize,
};
use std::fmt::Write as _;

/// A build file; reading it back gives the same build.
pub fn build_to_toml(build: &Build) -> String {
    let mut out = String::from("format = 1\n");
    let _ = writeln!(out, "title = {}", quote(&build.title));
    match &build.bobbin_source {
        BobbinSource::Id(id) => {
            let _ = writeln!(out, "bobbin = {}", quote(id));
        }
        BobbinSource::Inline => {
            out.push_str("\n[bobbin]\n");
            bobbin_keys(&mut out, &build.bobbin, "bobbin.");
        }
    }
    setup_keys(&mut out, &build.setup);
    for w in &build.windings {
        winding_keys(&mut out, w);
    }
    for section in &build.stack {
        stack_keys(&mut out, section);
    }
    if let Some(o) = &build.operating {
        operating_keys(&mut out, o);
    }
    for o in build.operating.iter().flat_map(|o| &o.outputs) {
        output_keys(&mut out, o);
    }
    if let Some(m) = &build.material {
        material_keys(&mut out, m);
    }
    if let Some(i) = &build.isolation {
        isolation_keys(&mut out, i);
    }
    if let Some(m) = &build.measured {
        measured_keys(&mut out, m);
    }
    out
}

/// `[setup]`: temperature (only when given), bulge, margin, tape, frequency, the classes.
fn setup_keys(out: &mut String, s: &Setup) {
    let _ = writeln!(out, "\n[setup]");
    // Left out, the windings are taken at ambient + rise: a save must not fix them at 20 C.
    if s.temperature_given {
        let _ = writeln!(out, "temperature_c = {}", num(s.temperature_c));
    }
    let _ = writeln!(out, "bulge = {}", num(s.allowance_factor));
    let _ = writeln!(out, "margin_mm = {}", num(s.margin_mm));
    let _ = writeln!(out, "tape_mm = {}", num(s.tape_mm));
    if let Some(f) = s.frequency_khz {
        let _ = writeln!(out, "frequency_khz = {}", num(f));
    }
    for (key, v) in [
        ("wire_class_c", s.wire_class_c),
        ("tape_class_c", s.tape_class_c),
        ("bobbin_class_c", s.bobbin_class_c),
    ] {
        if let Some(v) = v {
            let _ = writeln!(out, "{key} = {}", num(v));
        }
    }
}

/// One `[[winding]]`: name, role, turns, its wire and the keys that differ from the defaults.
fn winding_keys(out: &mut String, w: &Winding) {
    let _ = writeln!(out, "\n[[winding]]");
    let _ = writeln!(out, "name = {}", quote(&w.name));
    let _ = writeln!(out, "role = \"{}\"", w.role.key());
    let _ = writeln!(out, "turns = {}", w.turns);
    let _ = writeln!(out, "wire = {}", wire_value(w.conductor, w.wire));
    // Foil has no enamel: the key is written only when a file gave another grade.
    if !matches!(w.conductor, Conductor::Foil(_)) || w.insulation != Insulation::Grade2 {
        let _ = writeln!(out, "insulation = \"{}\"", w.insulation.key());
    }
    if w.strands != 1 {
        let _ = writeln!(out, "strands = {}", w.strands);
    }
    if let Some(c) = w.current_rms_a {
        let _ = writeln!(out, "current_rms_a = {}", num(c));
    }
    if let Some(p) = &w.start_pin {
        let _ = writeln!(out, "start_pin = {}", quote(p));
    }
    if let Some(p) = &w.finish_pin {
        let _ = writeln!(out, "finish_pin = {}", quote(p));
    }
}

/// The value of a winding's `wire` key: a foil or litz table, a measured pair, or a size.
fn wire_value(conductor: Conductor, wire: WireSize) -> String {
    match (conductor, wire) {
        (Conductor::Foil(f), _) => foil_table(&f),
        (Conductor::Litz(l), _) => litz_table(&l),
        (Conductor::Round, WireSize::Measured { bare_mm, od_mm }) => {
            format!("{{ bare_mm = {}, od_mm = {} }}", num(bare_mm), num(od_mm))
        }
        (Conductor::Round, other) => quote(&wire_text(&other)),
    }
}

/// One `[[stack]]`: a tape or a winding's section with the keys it states.
fn stack_keys(out: &mut String, section: &Section) {
    let _ = writeln!(out, "\n[[stack]]");
    match section {
        Section::Tape { wraps } => {
            let _ = writeln!(out, "tape = {wraps}");
        }
        Section::Winding(ws) => {
            let _ = writeln!(out, "winding = {}", quote(&ws.winding));
            if let Some(t) = ws.turns {
                let _ = writeln!(out, "turns = {t}");
            }
            if let Some(w) = &ws.partner {
                let _ = writeln!(out, "with = {}", quote(w));
            }
            if ws.layer_tape > 0 {
                let _ = writeln!(out, "layer_tape = {}", ws.layer_tape);
            }
            if ws.spread {
                let _ = writeln!(out, "spread = true");
            }
        }
    }
}

/// `[operating]`: the converter, the input range, the regulated output when there are no
/// `[[output]]` tables, and the optional limits.
fn operating_keys(out: &mut String, o: &Operating) {
    let _ = writeln!(out, "\n[operating]");
    let _ = writeln!(out, "converter = \"forward\"");
    let side = match o.reset_side {
        ResetSide::Primary => "primary",
        ResetSide::Secondary => "secondary",
    };
    let _ = writeln!(out, "reset_side = \"{side}\"");
    let _ = writeln!(out, "vin_min_v = {}", num(o.vin_min_v));
    let _ = writeln!(out, "vin_max_v = {}", num(o.vin_max_v));
    // With [[output]] tables the regulated output is the first of them.
    if o.outputs.is_empty() {
        let _ = writeln!(out, "vout_v = {}", num(o.vout_v));
        let _ = writeln!(out, "iout_a = {}", num(o.iout_a));
    }
    let _ = writeln!(out, "rectifier_drop_v = {}", num(o.rectifier_drop_v));
    if let Some(d) = o.duty_limit {
        let _ = writeln!(out, "duty_limit = {}", num(d));
    }
    if let Some(v) = o.rise_limit_c {
        let _ = writeln!(out, "rise_limit_c = {}", num(v));
    }
    if let Some(v) = o.surface_area_cm2 {
        let _ = writeln!(out, "surface_area_cm2 = {}", num(v));
    }
    if o.switch_drop_v != 0.0 {
        let _ = writeln!(out, "switch_drop_v = {}", num(o.switch_drop_v));
    }
    for (key, v) in [
        ("ambient_c", o.ambient_c),
        ("switch_rating_v", o.switch_rating_v),
    ] {
        if let Some(v) = v {
            let _ = writeln!(out, "{key} = {}", num(v));
        }
    }
}

/// One `[[output]]`: the winding that feeds it, its voltage and current, its own drop.
fn output_keys(out: &mut String, o: &Output) {
    let _ = writeln!(out, "\n[[output]]");
    let _ = writeln!(out, "name = {}", quote(&o.winding));
    let _ = writeln!(out, "vout_v = {}", num(o.vout_v));
    let _ = writeln!(out, "iout_a = {}", num(o.iout_a));
    if let Some(d) = o.rectifier_drop_v {
        let _ = writeln!(out, "rectifier_drop_v = {}", num(d));
    }
}

/// `[material]`: the bundled ferrite (key `grade`), then only the values that differ from it.
fn material_keys(out: &mut String, m: &Material) {
    let _ = writeln!(out, "\n[material]");
    // With a bundled ferrite, only the values that differ from it are written: they are the
    // user's overrides, and reading the file back gives the same material.
    let ferrite = m
        .ferrite
        .as_deref()
        .and_then(crate::library::materials::find);
    if let Some(g) = ferrite {
        let _ = writeln!(out, "grade = {}", quote(g.id));
    }
    if ferrite.is_none_or(|g| g.bsat_mt != m.bsat_mt) {
        let _ = writeln!(out, "bsat_mt = {}", num(m.bsat_mt));
    }
    if ferrite.is_none_or(|g| g.br_mt != m.br_mt) {
        let _ = writeln!(out, "br_mt = {}", num(m.br_mt));
    }
    if let Some(mu) = m.mu_i
        && ferrite.is_none_or(|g| g.mu_i != mu)
    {
        let _ = writeln!(out, "mu_i = {}", num(mu));
    }
    if let Some(st) = m.steinmetz
        && ferrite.is_none_or(|g| g.steinmetz != st)
    {
        let _ = writeln!(
            out,
            "steinmetz = {{ k = {}, alpha = {}, beta = {} }}",
            num(st.k),
            num(st.alpha),
            num(st.beta)
        );
    }
    if let Some(g) = m.gap_mm {
        let _ = writeln!(out, "gap_mm = {}", num(g));
    }
}

/// `[isolation]`: the class and the figures the build states.
fn isolation_keys(out: &mut String, i: &Isolation) {
    let _ = writeln!(out, "\n[isolation]");
    let _ = writeln!(out, "class = \"{}\"", i.class.key());
    if let Some(v) = i.working_voltage_v {
        let _ = writeln!(out, "working_voltage_v = {}", num(v));
    }
    if let Some(c) = i.creepage_mm {
        let _ = writeln!(out, "creepage_mm = {}", num(c));
    }
}

/// A foil's inline wire table with every key the build states (defaults stay left out).
fn foil_table(f: &Foil) -> String {
    let mut keys = vec![format!("foil_mm = {}", num(f.thickness_mm))];
    for (k, v) in [
        ("width_mm", f.width_mm),
        ("interleaf_mm", f.interleaf_mm),
        ("overhang_mm", f.overhang_mm),
        ("tab_mm", f.tab_mm),
    ] {
        if let Some(v) = v {
            keys.push(format!("{k} = {}", num(v)));
        }
    }
    format!("{{ {} }}", keys.join(", "))
}

/// A litz's inline wire table with every key the build states (defaults stay left out).
fn litz_table(l: &Litz) -> String {
    let mut keys = vec![
        format!("litz_strands = {}", l.strands),
        format!("strand_mm = {}", num(l.strand_mm)),
    ];
    for (k, v) in [
        ("serving_mm", l.serving_mm),
        ("packing", l.packing),
        ("lay_factor", l.lay_factor),
    ] {
        if let Some(v) = v {
            keys.push(format!("{k} = {}", num(v)));
        }
    }
    format!("{{ {} }}", keys.join(", "))
}

/// `[measured]`: the bench readings, keys in the order FORMAT.md lists them.
fn measured_keys(out: &mut String, m: &Measured) {
    let _ = writeln!(out, "\n[measured]");
    if let Some(c) = m.reading_c {
        let _ = writeln!(out, "reading_c = {}", num(c));
    }
    if let Some(f) = m.frequency_khz {
        let _ = writeln!(out, "frequency_khz = {}", num(f));
    }
    let table = |pairs: &[(crate::model::Name, f64)]| {
        let items: Vec<String> = pairs
            .iter()
            .map(|(n, x)| {
                let key = if !n.is_empty()
                    && n.chars()
                        .all(|c| c.is_ascii_alphanumeric() || c == '_' || c == '-')
                {
                    n.to_string()
                } else {
                    quote(n)
                };
                format!("{key} = {}", num(*x))
            })
            .collect();
        format!("{{ {} }}", items.join(", "))
    };
    if !m.dcr_ohm.is_empty() {
        let _ = writeln!(out, "dcr_ohm = {}", table(&m.dcr_ohm));
    }
    if let Some(l) = m.magnetising_uh {
        let _ = writeln!(out, "magnetising_uh = {}", num(l));
    }
    if let Some(l) = m.leakage_uh {
        let _ = writeln!(out, "leakage_uh = {}", num(l));
    }
    if !m.ratio.is_empty() {
        let _ = writeln!(out, "ratio = {}", table(&m.ratio));
    }
    if let Some(h) = &m.hipot {
        let _ = writeln!(out, "hipot = {}", quote(h));
    }
    if let Some(n) = &m.note {
        let _ = writeln!(out, "note = {}", quote(n));
    }
}
