//! `turnstack design REQ.toml [--bobbins DIR]... [--json] [--out BUILD.toml --pick N]`:
//! the designs that meet the requirements, best first; `--out` writes one as a build file.

use super::{EXIT_DOES_NOT_FIT, Error, emit, json_text, notice, say};
use crate::engine::design::{DesignSettings, design};
use crate::files::{BobbinLibrary, build_text, check_output, load_requirements, write_atomic};
use crate::model::Bobbin;
use crate::report::design as words;
use std::path::{Path, PathBuf};
use std::process::ExitCode;
use std::sync::Arc;
use std::sync::atomic::{AtomicBool, Ordering};

pub struct DesignArgs<'a> {
    pub file: &'a Path,
    pub folders: &'a [PathBuf],
    pub json: bool,
    pub out: Option<&'a Path>,
    pub pick: usize,
    pub force: bool,
}

/// The bobbins to try: the file's `bobbins` list, or every bobbin the library sees (beside
/// the file, the user's folder, each `--bobbins DIR`, bundled); those without core data are
/// left out with a notice.
fn candidates(library: &BobbinLibrary, only: Option<&[String]>) -> Vec<(String, Bobbin)> {
    let mut out = Vec::new();
    for e in library.entries() {
        if only.is_some_and(|ids| !ids.contains(&e.id)) {
            continue;
        }
        match e.bobbin {
            Ok(b) if b.core.is_some() => out.push((e.id, b)),
            Ok(_) => {}
            Err(err) => notice(&format!("skipped bobbin {}: {err}", e.id)),
        }
    }
    out
}

pub fn run(args: &DesignArgs) -> Result<ExitCode, Error> {
    // Before the library is read (a large folder takes a while): a Ctrl-C from here on stops
    // the design cleanly, at its start if it came during the reading.
    let stop = super::progress::ctrl_c_flag().unwrap_or_else(|| Arc::new(AtomicBool::new(false)));
    if args.pick == 0 {
        return Err(Error::input(
            "design: --pick 0: expected 1 or more (1 = the first design listed)",
        ));
    }
    for d in args.folders {
        if !d.is_dir() {
            return Err(Error::input(format!(
                "--bobbins {}: no such folder",
                d.display()
            )));
        }
    }
    if let Some(out) = args.out {
        check_output(out, Some(args.file), args.force)
            .map_err(|why| Error::input(format!("design --out: {why}")))?;
    }
    let mut library = BobbinLibrary::for_build(args.file);
    for d in args.folders {
        library = library.with_folder(d.clone());
    }
    let req = load_requirements(args.file, &library)?;
    let bobbins = candidates(&library, req.bobbins.as_deref());
    let bar = super::progress::Progress::new("designing");
    let outcome = design(
        &req,
        &bobbins,
        &DesignSettings::default(),
        &|done, total| bar.update(done, total),
        &stop,
    );
    bar.finish();
    // Ctrl-C: stop cleanly, write nothing, exit as an interrupted program does (128 + 2).
    if stop.load(Ordering::Relaxed) {
        notice(&format!(
            "design stopped after {} of {} bobbins (Ctrl-C); nothing was printed or written",
            outcome.tried,
            bobbins.len()
        ));
        return Ok(ExitCode::from(super::EXIT_INTERRUPTED));
    }
    if let Some(out) = args.out {
        let Some(d) = outcome.designs.get(args.pick - 1) else {
            return Err(Error::input(format!(
                "there is no design {} to write ({} found)",
                args.pick,
                outcome.designs.len()
            )));
        };
        let (text, saved) = build_text(&d.build, None, out);
        write_atomic(out, &text).map_err(|source| Error::Write {
            path: out.to_path_buf(),
            source,
        })?;
        if !saved.note().is_empty() {
            notice(&saved.note());
        }
        say(&format!(
            "wrote design {} ({}) to {}",
            args.pick,
            d.bobbin,
            out.display()
        ));
    }
    let text = if args.json {
        json_text(&words::json(&outcome, req.switch.allowed_v()))
    } else {
        words::render(&req.title, &outcome)
    };
    emit(&text)?;
    Ok(if outcome.designs.is_empty() {
        ExitCode::from(EXIT_DOES_NOT_FIT)
    } else {
        ExitCode::SUCCESS
    })
}
