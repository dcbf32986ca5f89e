//! `turnstack search`: let the planner try wires, strands and section orders, and report the
//! Pareto set; `--out` writes the chosen candidate as a build file.

use super::{Error, emit, load_or_demo, say};
use crate::engine::search::{self, Outcome, Series, Settings};
use crate::files::{build_to_toml, save_build};
use crate::report::search::{binding_with_cli_advice, note_sentence};
use crate::report::textfmt::truncate;
use serde::Serialize;
use std::fmt::Write as _;
use std::io::IsTerminal;
use std::path::Path;
use std::process::ExitCode;

pub struct SearchArgs<'a> {
    pub file: Option<&'a Path>,
    pub settings: Settings,
    pub json: bool,
    pub out: Option<&'a Path>,
    pub pick: usize,
}

pub fn run(args: &SearchArgs) -> Result<ExitCode, Error> {
    let build = load_or_demo(args.file)?;
    let tty = std::io::stderr().is_terminal();
    let progress = move |done: usize, total: usize| {
        if tty && total > 20_000 {
            eprint!("\rsearching: {done} of {total}");
            if done == total {
                eprint!("\r{}\r", " ".repeat(40));
            }
        }
    };
    let outcome = search::search(&build, &args.settings, &progress)?;
    if let Some(out) = args.out {
        let Some(c) = outcome.candidates.get(args.pick.saturating_sub(1)) else {
            return Err(Error::input(format!(
                "there is no candidate {} to write ({} found)",
                args.pick,
                outcome.candidates.len()
            )));
        };
        save_build(out, &c.build).map_err(|source| Error::Write {
            path: out.to_path_buf(),
            source,
        })?;
        say(&format!(
            "wrote candidate {} to {}: {}",
            args.pick,
            out.display(),
            c.description
        ));
    }
    let text = if args.json {
        outcome_json(&outcome)
    } else {
        report(&outcome, &args.settings)
    };
    emit(&text)?;
    Ok(if outcome.candidates.is_empty() {
        ExitCode::from(super::EXIT_DOES_NOT_FIT)
    } else {
        ExitCode::SUCCESS
    })
}

/// `search --json` (FORMAT.md, "turnstack search").
#[derive(Serialize)]
struct OutcomeJson<'a> {
    space: usize,
    evaluated: usize,
    pruned: usize,
    feasible: usize,
    candidates: Vec<CandidateJson<'a>>,
    /// Why nothing was found; `null` when something was.
    binding: Option<String>,
    notes: Vec<String>,
}

/// One candidate of the front, lowest loss first.
#[derive(Serialize)]
struct CandidateJson<'a> {
    description: &'a str,
    fits: bool,
    copper_loss_w: f64,
    total_loss_w: f64,
    /// `null` without a surface to estimate the rise from.
    temperature_rise_c: Option<f64>,
    leakage_uh: f64,
    spare_height_mm: f64,
    height_with_allowance_mm: f64,
    fill_factor: f64,
    /// The candidate as a build file.
    build: String,
}

fn outcome_json(o: &Outcome) -> String {
    let candidates = o
        .candidates
        .iter()
        .map(|c| CandidateJson {
            description: &c.description,
            fits: c.eval.fits,
            copper_loss_w: c.copper_loss_w,
            total_loss_w: c.objectives.loss_w,
            temperature_rise_c: c.eval.losses.as_ref().and_then(|l| l.temperature_rise_c),
            leakage_uh: c.objectives.leakage_uh,
            spare_height_mm: c.eval.spare_height_mm,
            height_with_allowance_mm: c.eval.height_with_allowance_mm,
            fill_factor: c.eval.fill_factor,
            build: build_to_toml(&c.build),
        })
        .collect();
    super::json_text(&OutcomeJson {
        space: o.space,
        evaluated: o.evaluated,
        pruned: o.pruned,
        feasible: o.feasible,
        candidates,
        binding: o.binding.as_ref().map(binding_with_cli_advice),
        notes: o.notes.iter().map(note_sentence).collect(),
    })
}

fn report(o: &Outcome, settings: &Settings) -> String {
    let mut s = String::new();
    let series = match settings.series {
        Series::Metric => "metric",
        Series::Awg => "AWG",
    };
    let _ = writeln!(
        s,
        "Searched {} combinations ({series} wire, 1-{} strands, {:.1}-{:.1} A/mm2):",
        o.space, settings.max_strands, settings.j_min_a_mm2, settings.j_max_a_mm2
    );
    let _ = writeln!(
        s,
        "  {} evaluated, {} skipped by pruning, {} fit and meet the constraints, {} on the front",
        o.evaluated,
        o.pruned,
        o.feasible,
        o.candidates.len()
    );
    for n in &o.notes {
        let _ = writeln!(s, "  note: {}", note_sentence(n));
    }
    if let Some(b) = &o.binding {
        let _ = writeln!(s, "\nNothing fits within the constraints.");
        for l in crate::report::wrap(&binding_with_cli_advice(b), 76, "  ") {
            let _ = writeln!(s, "  {l}");
        }
        return s;
    }
    let _ = writeln!(s, "\n  #    loss W  leakage uH  spare mm  build");
    for (i, c) in o.candidates.iter().enumerate() {
        let lines = crate::report::wrap(&c.description, 43, "");
        let _ = writeln!(
            s,
            "{:>3}  {:>8.3}  {:>10.3}  {:>8.2}  {}",
            i + 1,
            c.objectives.loss_w,
            c.objectives.leakage_uh,
            c.eval.spare_height_mm,
            truncate(&lines[0], 43)
        );
        for l in &lines[1..] {
            let _ = writeln!(s, "{:>35}  {}", "", truncate(l, 43));
        }
    }
    let _ = writeln!(
        s,
        "\nLoss: copper (I^2 R over each winding's waveform) plus core where the operating point\n\
         gives it; candidates over the temperature-rise limit are left out."
    );
    let _ = writeln!(
        s,
        "Write one as a build file: turnstack search FILE --out NEW.toml --pick N"
    );
    s
}
