//! The technician's winding sheet: its content is derived once from the Build and its
//! Evaluation here, then rendered as 80-column text (`text`) or one printable HTML page (`html`).

pub mod html;
pub mod readings;
pub mod svg;
pub mod text;

pub use crate::files::{build_id, fnv1a64};

use super::text::wire_label;
use crate::engine::{Evaluation, SectionEval, SectionKind, bench, primary_secondary_leakage};
use crate::model::{BobbinSource, Build, IsolationClass, Role, Section, Tube};

pub use crate::engine::bench::{
    AL_TOLERANCE, CUT_ROUND_MM, DCR_TOLERANCE, LEAD_ALLOWANCE_MM, MEASURE_AT_C,
};

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
    /// Allowances added per strand: two ends, plus one for every park between sections.
    pub allowances: u32,
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

/// One numbered step from the tube outward.
#[derive(Debug, Clone, PartialEq)]
pub struct Step {
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
    pub steps: Vec<Step>,
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

    let wires: Vec<WireItem> = build
        .windings
        .iter()
        .zip(&eval.windings)
        .zip(bench::cuts(build, eval))
        .map(|((w, e), cut)| WireItem {
            winding: w.name.to_string(),
            role: w.role,
            wire: wire_label(&w.wire, 1),
            grade: w.insulation.to_string(),
            strands: w.strands,
            turns: w.turns,
            length_m: e.length_m,
            allowances: cut.allowances,
            cut_each_mm: cut.cut_each_mm,
            cut_total_mm: cut.cut_total_mm,
        })
        .collect();

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

/// The numbered steps, one per stack section, from the tube outward.
fn steps(build: &Build, eval: &Evaluation) -> Vec<Step> {
    let mut steps = Vec::new();
    for (i, (sec, s_eval)) in build.stack.iter().zip(&eval.sections).enumerate() {
        let number = steps.len() + 1;
        match (sec, &s_eval.kind) {
            (Section::Tape { .. }, SectionKind::Tape { wraps }) => {
                steps.push(tape_step(build, number, i, *wraps));
            }
            (Section::Winding(_), SectionKind::Winding { .. }) => {
                steps.extend(winding_step(build, number, i, s_eval));
            }
            _ => {}
        }
    }
    steps
}

/// The step of a tape section.
fn tape_step(build: &Build, number: usize, i: usize, wraps: u32) -> Step {
    let b = &build.bobbin;
    let wraps = &wraps;
    Step {
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
fn winding_step(build: &Build, number: usize, i: usize, s_eval: &SectionEval) -> Option<Step> {
    let SectionKind::Winding {
        winding,
        with,
        turns,
        turns_per_layer,
        layer_count,
        last_layer_turns,
        layer_tape,
        ..
    } = &s_eval.kind
    else {
        return None;
    };
    let mut names = vec![winding.clone()];
    names.extend(with.clone());
    let heading = winding_heading(build, &names, with.is_some());
    let mut lines: Vec<(String, String)> = Vec::new();
    lines.extend(margin_line(build, s_eval));
    for n in &names {
        let Some(w) = build.winding(n) else { continue };
        lines.push((format!("Wire {n}"), wire_text(w)));
    }
    if with.is_some() {
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
        format!(
            "{turns} turns in {}: {turns_per_layer} a layer, {last_layer_turns} on the last layer",
            plural(*layer_count, "layer", "layers")
        ),
    ));
    if *layer_tape > 0 && *layer_count > 1 {
        lines.push((
            "Between".into(),
            format!(
                "{} of tape between layers",
                plural(*layer_tape, "wrap", "wraps")
            ),
        ));
    }
    let side = if layer_count % 2 == 1 {
        "the flange opposite the start"
    } else {
        "the flange you started at"
    };
    for n in &names {
        lines.push(("Finish".into(), finish_text(build, i, n, side)));
    }
    Some(Step {
        number,
        section: i,
        heading,
        lines,
    })
}

/// The heading of a winding step: "Winding P (primary)", or a bifilar pair.
fn winding_heading(build: &Build, names: &[crate::model::Name], bifilar: bool) -> String {
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
fn margin_line(build: &Build, s_eval: &SectionEval) -> Option<(String, String)> {
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
fn start_text(build: &Build, i: usize, n: &str) -> String {
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
fn finish_text(build: &Build, i: usize, n: &str, side: &str) -> String {
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
fn wire_text(w: &crate::model::Winding) -> String {
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
fn crossing_leads(build: &Build, eval: &Evaluation) -> Vec<String> {
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
            if let SectionKind::Winding { winding, with, .. } = &s.kind
                && (*winding == w.name || with.as_deref() == Some(w.name.as_str()))
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
                matches!(&s.kind, SectionKind::Winding { winding, with, .. }
                    if *winding == w.name || with.as_deref() == Some(w.name.as_str()))
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

fn checks(build: &Build, eval: &Evaluation, measure_at_c: f64) -> Vec<Check> {
    let mut out = Vec::new();
    for (w, dcr) in build
        .windings
        .iter()
        .zip(bench::dcr_at_bench(eval, measure_at_c))
    {
        let r = dcr.expected;
        let pins = match (&w.start_pin, &w.finish_pin) {
            (Some(a), Some(b)) => format!("between pins {a} and {b}"),
            _ => "between its start and finish".into(),
        };
        let kelvin = if r < 1.0 {
            "; under 1 ohm use a four-wire (Kelvin) meter or subtract the lead resistance"
        } else {
            ""
        };
        out.push(Check {
            what: format!("DC resistance of {}", w.name),
            value: Some(r),
            expected: format!(
                "{} at {measure_at_c:.0} C ({} to {}, +/-{:.0} %)",
                ohms(r),
                ohms(dcr.low),
                ohms(dcr.high),
                DCR_TOLERANCE * 100.0
            ),
            how: format!(
                "{pins}, leads trimmed to the pins, the part at {measure_at_c:.0} C{kelvin}; \
                 copper changes 0.393 % per kelvin (IEC 60028)"
            ),
        });
    }
    out.extend(inductance_checks(build, eval));
    out.push(polarity_check(build));
    out.extend(hipot_check(build));
    out
}

/// The magnetising inductance (from AL) and the primary-secondary leakage, where known.
fn inductance_checks(build: &Build, eval: &Evaluation) -> Vec<Check> {
    let mut out = Vec::new();
    let primary = build.first_of(Role::Primary);
    if let (Some(p), Some(al), Some(spread)) = (
        primary,
        build.bobbin.core.as_ref().and_then(|c| c.al_nh),
        bench::magnetising_at_bench(build),
    ) {
        let l = spread.expected;
        out.push(Check {
            what: format!("Magnetising inductance of {}", p.name),
            value: Some(l),
            expected: format!(
                "{} (AL {al:.0} nH x {}^2; {} to {} for the usual +/-{:.0} % of AL)",
                henries(l),
                p.turns,
                henries(spread.low),
                henries(spread.high),
                AL_TOLERANCE * 100.0
            ),
            how: "at the primary, every other winding open, core assembled and clamped, at a \
                  low test level (for example 10 kHz); much lower means a gap or a dirty \
                  mating face"
                .into(),
        });
    }
    if let (Some(p), Some(s)) = (primary, build.first_of(Role::Secondary))
        && let Some(l) = primary_secondary_leakage(build, eval)
    {
        out.push(Check {
            what: format!("Leakage inductance {} - {}", p.name, s.name),
            value: Some(l.uh),
            expected: format!(
                "about {} (an estimate from a 1-D field; leads and end turns add to it)",
                henries(l.uh)
            ),
            how: format!(
                "at the primary {} with the secondary {} shorted by a short thick link, other \
                 windings open, at the switching frequency or the meter's highest",
                p.name, s.name
            ),
        });
    }
    out
}

/// The polarity: every start pin in phase with the primary's.
fn polarity_check(build: &Build) -> Check {
    let starts: Vec<String> = build
        .windings
        .iter()
        .filter_map(|w| w.start_pin.as_ref().map(|p| format!("{} pin {p}", w.name)))
        .collect();
    Check {
        what: "Polarity".into(),
        value: None,
        expected: format!(
            "every start pin in phase with the primary's start ({})",
            if starts.is_empty() {
                "the start pins you wrote down".into()
            } else {
                starts.join(", ")
            }
        ),
        how: "drive the primary with a small sine (a signal generator, a few volts) and \
              compare each winding on a two-channel scope, grounds on the finish pins; or use \
              the meter's phase test"
            .into(),
    }
}

/// The electric-strength test, for basic or reinforced isolation.
fn hipot_check(build: &Build) -> Option<Check> {
    if let Some(iso) = &build.isolation
        && iso.class != IsolationClass::Functional
    {
        return Some(Check {
            what: "Electric strength (hipot), primary side to secondary side".into(),
            value: None,
            expected: format!(
                "no breakdown at the test voltage and time the applicable standard sets for \
                 {} insulation{}",
                iso.class.key(),
                iso.working_voltage_v
                    .map_or(String::new(), |v| format!(" at {v:.0} V working voltage"))
            ),
            how: "join all primary-side pins, join all secondary-side pins (and the core to \
                  the side the design says); only a trained person, with a current-limited \
                  hipot tester, an interlocked fixture and hands clear; discharge before \
                  touching; a part that fails is scrapped, never rewound and reused"
                .into(),
        });
    }
    None
}

fn cautions(build: &Build) -> Vec<String> {
    let no_substitute = "This sheet is no substitute for the applicable safety standard (for \
        example IEC 62368-1 or IEC 61558), local codes and the approval of a qualified person. \
        turnstack plans the layers; it does not certify anything and claims compliance with \
        nothing."
        .to_string();
    match build.isolation.as_ref().map(|i| i.class) {
        None | Some(IsolationClass::Functional) => vec![
            "Functional insulation only: this build provides no protection against electric \
             shock. Do not use it to separate mains or any hazardous voltage from anything a \
             person can touch."
                .into(),
        ],
        Some(IsolationClass::Basic) => vec![
            "Basic insulation: one level of protection against shock. Tape between primary and \
             secondary, margins for the creepage distance, sleeving on leads that cross \
             windings, and a hipot test of every part."
                .into(),
            no_substitute,
        ],
        Some(IsolationClass::Reinforced) => {
            let creepage = build
                .isolation
                .as_ref()
                .and_then(|i| i.creepage_mm)
                .map_or("the creepage distance the standard sets".to_string(), |c| {
                    format!("the {c:.1} mm creepage set in the file (half of it at each flange)")
                });
            vec![
                "Reinforced insulation between mains and what a person can touch: a fault here \
                 can kill. Wind it only if you are qualified to."
                    .into(),
                "Three layers of tape between every primary-side and secondary-side winding, \
                 flange to flange, no gaps and no wrinkles; the insulation relies on any two of \
                 the three passing the electric-strength test (thin-sheet rule), so a nicked \
                 wrap is a failed part (or triple-insulated wire on one side)."
                    .into(),
                format!("Margin tape at both flanges for {creepage}; no turn may climb onto it."),
                "Sleeving on every lead that crosses another winding or the margins, from \
                 inside the winding to the pin."
                    .into(),
                "A hipot test of every finished part, primary side to secondary side, at the \
                 level and time the standard sets, with proper equipment."
                    .into(),
                no_substitute,
            ]
        }
    }
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
