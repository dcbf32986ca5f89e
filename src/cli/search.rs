//! `turnstack search`: let the planner try wires, strands and section orders, and report the
//! Pareto set; `--out` writes the chosen candidate as a build file.

use super::{Error, emit, load_or_demo, say};
use crate::engine::search::{self, Outcome, Series, Settings};
use crate::files::{build_to_toml, check_output, save_build_keeping};
use crate::report::search::{binding_with_cli_advice, note_sentence};
use crate::report::textfmt::truncate;
use serde::Serialize;
use std::fmt::Write as _;
use std::path::Path;
use std::process::ExitCode;

pub struct SearchArgs<'a> {
    pub file: Option<&'a Path>,
    pub settings: Settings,
    pub json: bool,
    pub out: Option<&'a Path>,
    pub pick: usize,
    /// `--out` may replace an existing file (never the input).
    pub force: bool,
}

/// Every flag checked before any work, each with what it expects.
fn check_flags(args: &SearchArgs) -> Result<(), String> {
    use search::{MAX_STRANDS, MAX_THREADS};
    let s = &args.settings;
    if !(1..=MAX_THREADS).contains(&s.threads) {
        return Err(format!(
            "--threads {}: expected 1 to {MAX_THREADS}",
            s.threads
        ));
    }
    if !(1..=MAX_STRANDS).contains(&s.max_strands) {
        return Err(format!(
            "--max-strands {}: expected 1 to {MAX_STRANDS} (strands paralleled by hand)",
            s.max_strands
        ));
    }
    for (flag, v) in [("--j-min", s.j_min_a_mm2), ("--j-max", s.j_max_a_mm2)] {
        if !(v.is_finite() && v > 0.0 && v <= 100.0) {
            return Err(format!(
                "{flag} {v}: expected a current density above 0 and at most 100 A/mm2"
            ));
        }
    }
    if s.j_min_a_mm2 > s.j_max_a_mm2 {
        return Err(format!(
            "--j-min {} is above --j-max {}: expected the lower bound first",
            s.j_min_a_mm2, s.j_max_a_mm2
        ));
    }
    if let Some(v) = s.max_leakage_uh
        && !(v.is_finite() && v > 0.0)
    {
        return Err(format!(
            "--max-leakage-uh {v}: expected a leakage inductance above 0 uH"
        ));
    }
    if let Some(v) = s.max_rise_c
        && !(v.is_finite() && v > 0.0 && v <= 200.0)
    {
        return Err(format!(
            "--max-rise-c {v}: expected a temperature rise above 0 and at most 200 C"
        ));
    }
    if let Some(w) = s.isolation_wraps
        && w > 100
    {
        return Err(format!(
            "--isolation-wraps {w}: expected at most 100 wraps of tape"
        ));
    }
    if args.pick == 0 {
        return Err("--pick 0: expected 1 or more (1 = the first candidate listed)".into());
    }
    Ok(())
}

/// `turnstack search`: the flags checked, the build made ready, the search with a progress
/// bar, the chosen candidate written when asked, then the report (exit 1 when none is found).
pub fn run(args: &SearchArgs) -> Result<ExitCode, Error> {
    check_flags(args).map_err(|why| Error::input(format!("search: {why}")))?;
    // Before the search: its result never replaces the input, nor another file unasked.
    if let Some(out) = args.out {
        check_output(out, args.file, args.force)
            .map_err(|why| Error::input(format!("search --out: {why}")))?;
    }
    let build = ready_build(args)?;
    let Some(outcome) = search_with_progress(&build, &args.settings)? else {
        return Ok(ExitCode::from(super::EXIT_INTERRUPTED));
    };
    if let Some(out) = args.out {
        write_pick(args, out, &outcome)?;
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

/// The build to search from, without its bench readings, refused when it cannot be searched
/// or its search would be too large; a large one is announced.
fn ready_build(args: &SearchArgs) -> Result<crate::model::Build, Error> {
    let mut build = load_or_demo(args.file)?;
    // The bench readings belong to the part wound from this build, not to other candidates.
    build.measured = None;
    if let Err(e) = search::search_ready(&build) {
        return Err(Error::input(match args.file {
            Some(p) => format!("{}: {e}", p.display()),
            None => e.to_string(),
        }));
    }
    // The size of the search, said before it starts; too large a one is refused.
    let size = search::space_size(&build, &args.settings);
    if size > search::MAX_SPACE {
        return Err(Error::input(format!(
            "search: {size} combinations is more than the {} a search goes through; narrow it with a lower --max-strands, a narrower --j-min/--j-max band or --isolation-wraps",
            search::MAX_SPACE
        )));
    }
    if size > 1_000_000 {
        super::notice(&format!(
            "searching {size} combinations on {} threads (Ctrl-C stops it)",
            args.settings.threads
        ));
    }
    Ok(build)
}

/// The search with a progress bar; `None` when Ctrl-C stopped it (said on stderr).
fn search_with_progress(
    build: &crate::model::Build,
    settings: &Settings,
) -> Result<Option<Outcome>, Error> {
    let bar = super::progress::Progress::new("searching");
    let stop = super::progress::ctrl_c_flag()
        .unwrap_or_else(|| std::sync::Arc::new(std::sync::atomic::AtomicBool::new(false)));
    let result = search::search_cancellable(build, settings, &|d, t| bar.update(d, t), &stop);
    bar.finish();
    match result {
        // Ctrl-C: stop cleanly, write nothing, exit as an interrupted program does (128 + 2).
        Err(e @ search::SearchError::Cancelled { .. }) => {
            super::notice(&format!("{e} (Ctrl-C); nothing was printed or written"));
            Ok(None)
        }
        r => Ok(Some(r?)),
    }
}

/// `--out`: candidate `--pick` written onto the input's text, and said.
fn write_pick(args: &SearchArgs, out: &Path, outcome: &Outcome) -> Result<(), Error> {
    let Some(c) = outcome.candidates.get(args.pick.saturating_sub(1)) else {
        return Err(Error::input(format!(
            "there is no candidate {} to write ({} found)",
            args.pick,
            outcome.candidates.len()
        )));
    };
    // Written onto the input's text: its comments and layout stay, only the values the
    // search changed are rewritten.
    let saved = save_build_keeping(out, args.file, &c.build).map_err(|source| Error::Write {
        path: out.to_path_buf(),
        source,
    })?;
    if !saved.note().is_empty() {
        super::notice(&saved.note());
    }
    say(&format!(
        "wrote candidate {} to {}: {}",
        args.pick,
        out.display(),
        c.description
    ));
    Ok(())
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
