//! `turnstack fit FILE [--bobbins DIR] [--json]`: which bobbin of the library fits the build.

use super::{Error, emit, fit_code, json_text, notice};
use crate::files::{BobbinLibrary, load_build};
use crate::model::BobbinSource;
use crate::report::fit::{FitRow, rank};
use crate::report::textfmt::truncate;
use crate::report::wrap;
use serde::Serialize;
use std::fmt::Write as _;
use std::path::{Path, PathBuf};
use std::process::ExitCode;

/// Id shown for a bobbin written inline in the build file.
pub const INLINE_ID: &str = "(this build's)";

pub fn fit(file: &Path, folders: &[PathBuf], as_json: bool) -> Result<ExitCode, Error> {
    let build = load_build(file)?;
    for d in folders {
        if !d.is_dir() {
            return Err(Error::input(format!(
                "--bobbins {}: no such folder",
                d.display()
            )));
        }
    }
    let mut library = BobbinLibrary::for_build(file);
    for d in folders {
        library = library.with_folder(d.clone());
    }
    let mut bobbins = Vec::new();
    if build.bobbin_source == BobbinSource::Inline {
        bobbins.push((INLINE_ID.to_string(), build.bobbin.clone()));
    }
    for e in library.entries() {
        match e.bobbin {
            Ok(b) => bobbins.push((e.id, b)),
            Err(err) => notice(&format!("skipped bobbin {}: {err}", e.id)),
        }
    }
    let rows = rank(&build, &bobbins);
    let text = if as_json {
        let list: Vec<_> = rows.iter().map(row_json).collect();
        json_text(&list)
    } else {
        render(&build.title, &build.bobbin_source, &rows)
    };
    emit(&text)?;
    Ok(fit_code(rows.iter().any(|r| r.fits)))
}

/// One entry of `fit --json` (FORMAT.md, "turnstack fit").
#[derive(Serialize)]
struct FitRowJson<'a> {
    bobbin: &'a str,
    name: &'a str,
    fits: bool,
    valid: bool,
    height_with_allowance_mm: f64,
    window_height_mm: f64,
    spare_height_mm: f64,
    fill_factor: f64,
    dcr_total_ohm: f64,
    /// `null` when the build has no primary-secondary pair.
    leakage_uh: Option<f64>,
    reasons: &'a [String],
}

fn row_json(r: &FitRow) -> FitRowJson<'_> {
    FitRowJson {
        bobbin: &r.bobbin,
        name: &r.name,
        fits: r.fits,
        valid: r.valid,
        height_with_allowance_mm: r.height_with_allowance_mm,
        window_height_mm: r.window_height_mm,
        spare_height_mm: r.spare_height_mm,
        fill_factor: r.fill_factor,
        dcr_total_ohm: r.dcr_total_ohm,
        leakage_uh: r.leakage_uh,
        reasons: &r.reasons,
    }
}

fn render(title: &str, source: &BobbinSource, rows: &[FitRow]) -> String {
    let mut o = String::new();
    for l in wrap(&format!("Which bobbin fits: {title}"), 80, "  ") {
        let _ = writeln!(o, "{l}");
    }
    let current = match source {
        BobbinSource::Id(id) => id.as_str(),
        BobbinSource::Inline => INLINE_ID,
    };
    let _ = writeln!(
        o,
        "Same windings and stack on every bobbin: fitting first, most spare height first.\n"
    );
    let _ = writeln!(
        o,
        "   {:<16} {:<4} {:>13} {:>7} {:>6} {:>9} {:>9}",
        "bobbin", "fits", "used / window", "spare", "fill", "DCR sum", "leakage"
    );
    let _ = writeln!(
        o,
        "   {:<16} {:<4} {:>13} {:>7} {:>6} {:>9} {:>9}",
        "", "", "mm", "mm", "", "ohm", "uH"
    );
    for r in rows {
        row_text(&mut o, r, current);
    }
    let n = rows.iter().filter(|r| r.fits).count();
    let _ = writeln!(
        o,
        "\n* the build's own bobbin. {n} of {} fit. no! = cannot be laid at all.",
        rows.len()
    );
    let _ = writeln!(
        o,
        "DCR: sum of the windings at the build's temperature. Leakage: primary-secondary."
    );
    let _ = writeln!(
        o,
        "Bundled figures are typical for the size: measure your bobbin before winding."
    );
    o
}

/// One bobbin's row of the ranking, and its reasons when it does not fit.
fn row_text(o: &mut String, r: &FitRow, current: &str) {
    let mark = if r.bobbin == current { "*" } else { " " };
    let fits = if r.fits {
        "yes"
    } else if r.valid {
        "no"
    } else {
        "no!"
    };
    let used = if r.valid {
        format!(
            "{:.2} / {:.2}",
            r.height_with_allowance_mm, r.window_height_mm
        )
    } else {
        format!("- / {:.2}", r.window_height_mm)
    };
    let spare = if r.valid {
        format!("{:+.2}", r.spare_height_mm)
    } else {
        "-".into()
    };
    let (fill, dcr, leak) = if r.valid {
        (
            format!("{:.2}", r.fill_factor),
            format!("{:.3}", r.dcr_total_ohm),
            r.leakage_uh.map_or("-".into(), |l| format!("{l:.2}")),
        )
    } else {
        ("-".into(), "-".into(), "-".into())
    };
    let _ = writeln!(
        o,
        " {mark} {:<16} {:<4} {:>13} {:>7} {:>6} {:>9} {:>9}",
        truncate(&r.bobbin, 16),
        fits,
        used,
        spare,
        fill,
        dcr,
        leak
    );
    if !r.fits {
        for reason in &r.reasons {
            for l in wrap(reason, 72, "        ") {
                let _ = writeln!(o, "      {l}");
            }
        }
    }
}
