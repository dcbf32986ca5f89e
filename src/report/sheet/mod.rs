//! The technician's winding sheet: its content is derived once from the Build and its
//! Evaluation here, then rendered as 80-column text (`text`) or one printable HTML page (`html`).

pub mod html;
pub mod readings;
pub mod reset_chart;
pub mod svg;
pub mod text;

pub use crate::files::{build_id, fnv1a64};

use super::text::wire_label;
use crate::engine::{Evaluation, SectionEval, SectionKind, bench, primary_secondary_leakage};
use crate::model::{BobbinSource, Build, IsolationClass, Role, Section, Tube};

pub use crate::engine::bench::{
    AL_TOLERANCE, CUT_ROUND_MM, DCR_TOLERANCE, LEAD_ALLOWANCE_MM, MEASURE_AT_C,
};

mod checks;
mod conductor_steps;
mod steps;

use checks::{cautions, checks};
use steps::{crossing_leads, steps};

#[derive(Debug, Clone, PartialEq)]
pub struct WireItem {
    pub winding: String,
    pub role: Role,
    pub wire: String,
    pub grade: String,
    pub strands: u32,
    pub turns: u32,
    /// Winding length of one strand (the Evaluation's length).
    pub length_m: f64,
    /// Lead allowances added per strand: two ends, plus one for every park between sections.
    pub lead_allowances: u32,
    /// Per strand, rounded up to `CUT_ROUND_MM`.
    pub cut_each_mm: f64,
    pub cut_total_mm: f64,
}

#[derive(Debug, Clone, PartialEq)]
pub struct Pin {
    pub winding: String,
    pub role: Role,
    pub start: Option<String>,
    pub finish: Option<String>,
}

/// One numbered step of the winding sheet, from the tube outward (not an undo step: that is
/// `tui::document::UndoStep`).
#[derive(Debug, Clone, PartialEq)]
pub struct SheetStep {
    pub number: usize,
    /// Index into the stack.
    pub section: usize,
    pub heading: String,
    /// Label and text pairs ("Turns", "16 in 2 layers ...").
    pub lines: Vec<(String, String)>,
}

#[derive(Debug, Clone, PartialEq)]
pub struct Check {
    pub what: String,
    /// The expected figure in the unit of its kind (ohm for resistance, uH for inductance).
    pub value: Option<f64>,
    pub expected: String,
    pub how: String,
}

#[derive(Debug, Clone, PartialEq)]
pub struct Sheet {
    /// The reset ratio's sweep (HTML only: the design section's chart).
    pub reset: Option<crate::engine::reset_sweep::ResetSweep>,
    pub title: String,
    pub build_id: String,
    pub bobbin: String,
    pub core: Option<String>,
    pub fits: bool,
    pub verdict: String,
    pub wires: Vec<WireItem>,
    /// Insulation tape and margin tape and sleeving, in words.
    pub materials: Vec<(String, String)>,
    pub pins: Vec<Pin>,
    pub convention: String,
    pub steps: Vec<SheetStep>,
    pub measure_at_c: f64,
    pub checks: Vec<Check>,
    /// Expected value, band and a cell to write each reading in (`readings.rs`).
    pub readings: Vec<readings::ReadingRow>,
    /// The safety statements for the declared isolation.
    pub cautions: Vec<String>,
    pub warnings: Vec<String>,
    pub notes: Vec<String>,
}

fn plural(n: u32, one: &str, many: &str) -> String {
    format!("{n} {}", if n == 1 { one } else { many })
}

fn wraps_in_stack(eval: &Evaluation) -> u32 {
    eval.sections
        .iter()
        .map(|s| match &s.kind {
            SectionKind::Tape { wraps } => *wraps,
            SectionKind::Winding {
                layer_tape,
                layer_count,
                ..
            } => layer_tape * layer_count.saturating_sub(1),
        })
        .sum()
}

fn pin_text(p: &Option<String>) -> String {
    match p {
        Some(p) => format!("pin {p}"),
        None => "the pin of your choice (the file names none: write it here ____)".into(),
    }
}

/// The sheet of a build. `measure_at_c` is the temperature the DC resistance will be measured
/// at (20 C unless told otherwise).
pub fn sheet(build: &Build, eval: &Evaluation, measure_at_c: f64) -> Sheet {
    let (bobbin, core) = bobbin_lines(build);

    let wires = wire_items(build, eval);

    let materials = materials(build, eval);

    let pins = build
        .windings
        .iter()
        .map(|w| Pin {
            winding: w.name.to_string(),
            role: w.role,
            start: w.start_pin.clone(),
            finish: w.finish_pin.clone(),
        })
        .collect();

    let convention = "Wind every layer of every winding in the same sense: set the winder's \
        direction once and never reverse it. Each winding starts on its start pin, and that start \
        is its dot: with one sense for all, the start pins are in phase. Layers run across the \
        width and back, but the sense of rotation stays the same."
        .to_string();

    let steps = steps(build, eval);
    let checks = checks(build, eval, measure_at_c);
    let cautions = cautions(build);
    Sheet {
        reset: crate::engine::reset_sweep::reset_sweep(build),
        title: if build.title.is_empty() {
            "(untitled build)".into()
        } else {
            build.title.clone()
        },
        build_id: build_id(build),
        bobbin,
        core,
        fits: eval.fits,
        verdict: super::text::verdict(eval),
        wires,
        materials,
        pins,
        convention,
        steps,
        measure_at_c,
        checks,
        readings: readings::rows(build, eval, measure_at_c),
        cautions,
        warnings: eval
            .warnings
            .iter()
            .map(|w| format!("{}: {}", w.code(), w.message()))
            .collect(),
        notes: eval.notes.iter().map(ToString::to_string).collect(),
    }
}

/// The bill of materials' rows: each winding's wire (or foil, or litz) and its cut.
fn wire_items(build: &Build, eval: &Evaluation) -> Vec<WireItem> {
    build
        .windings
        .iter()
        .zip(&eval.windings)
        .zip(bench::cuts(build, eval))
        .enumerate()
        .map(|(k, ((w, e), cut))| {
            let (wire, grade) = conductor_steps::bom_cells(w, &e.conductor)
                .unwrap_or_else(|| (wire_label(&w.wire, 1), w.insulation.to_string()));
            // A foil is cut to its own length (engine::foil_cut), not a wire's.
            let (each, total) = match crate::engine::foil_cut::foil_cut(build, eval, k) {
                Some(c) => (c.foil_cut_mm, c.foil_cut_mm),
                None => (cut.cut_each_mm, cut.cut_total_mm),
            };
            WireItem {
                winding: w.name.to_string(),
                role: w.role,
                wire,
                grade,
                strands: w.strands,
                turns: w.turns,
                length_m: e.length_m,
                lead_allowances: cut.lead_allowances,
                cut_each_mm: each,
                cut_total_mm: total,
            }
        })
        .collect()
}

/// The bobbin in one line (id, window, tube, name) and its core figures, if known.
fn bobbin_lines(build: &Build) -> (String, Option<String>) {
    let bobbin_id = match &build.bobbin_source {
        BobbinSource::Id(id) => id.clone(),
        BobbinSource::Inline => "described in the build file".into(),
    };
    let b = &build.bobbin;
    let tube = match b.tube {
        Tube::Rect {
            width_mm, depth_mm, ..
        } => format!("rect tube {width_mm:.2} x {depth_mm:.2} mm"),
        Tube::Round { diameter_mm } => format!("round tube {diameter_mm:.2} mm"),
    };
    let mut bobbin = format!(
        "{bobbin_id}: window {:.2} mm wide x {:.2} mm high, {tube}",
        b.window.width_mm, b.window.height_mm
    );
    if !b.name.is_empty() {
        bobbin = format!("{bobbin} ({})", b.name);
    }
    let core = b.core.as_ref().map(|c| {
        let al = c
            .al_nh
            .map_or("AL not known".to_string(), |a| format!("AL {a:.0} nH"));
        format!("Ae {:.1} mm2, le {:.1} mm, {al}", c.ae_mm2, c.le_mm)
    });
    (bobbin, core)
}

/// The insulation tape, the margin tape and the sleeving, in words.
fn materials(build: &Build, eval: &Evaluation) -> Vec<(String, String)> {
    let b = &build.bobbin;
    let mut materials = Vec::new();
    let wraps = wraps_in_stack(eval);
    materials.push((
        "Insulation tape".to_string(),
        format!(
            "{:.1} mm wide (the window width), {:.3} mm thick a wrap; {} in all, each wrap \
             once round plus a short overlap",
            b.window.width_mm,
            build.setup.tape_mm,
            plural(wraps, "wrap", "wraps")
        ),
    ));
    if build.setup.margin_mm > 0.0 {
        let tallest = eval
            .sections
            .iter()
            .filter(|s| matches!(s.kind, SectionKind::Winding { .. }))
            .map(|s| s.height_mm)
            .fold(0.0, f64::max);
        materials.push((
            "Margin tape".to_string(),
            format!(
                "{:.1} mm wide, at both flanges of every winding section, built up to the \
                 section's height (the tallest is {tallest:.2} mm)",
                build.setup.margin_mm
            ),
        ));
    }
    materials.extend(conductor_steps::foil_materials(build, eval));
    let leads = crossing_leads(build, eval);
    if !leads.is_empty() {
        materials.push((
            "Sleeving".to_string(),
            format!(
                "{} ({}), each {LEAD_ALLOWANCE_MM:.0} mm, a bore to take the wire: on every \
                 lead that crosses a winding on its way to the pin",
                plural(leads.len() as u32, "piece", "pieces"),
                leads.join(", ")
            ),
        ));
    }
    materials
}

/// Ohms with a sensible number of digits: 0.0741 ohm, 12.3 mohm is written 0.0123 ohm.
pub fn ohms(r: f64) -> String {
    if r >= 10.0 {
        format!("{r:.1} ohm")
    } else if r >= 1.0 {
        format!("{r:.2} ohm")
    } else if r >= 0.1 {
        format!("{r:.3} ohm")
    } else {
        format!("{r:.4} ohm")
    }
}

/// Microhenries, or millihenries above 1000 uH.
pub fn henries(uh: f64) -> String {
    if uh >= 1000.0 {
        format!("{:.2} mH", uh / 1000.0)
    } else if uh >= 10.0 {
        format!("{uh:.0} uH")
    } else {
        format!("{uh:.2} uH")
    }
}
