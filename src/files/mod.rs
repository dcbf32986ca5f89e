//! Loading build and bobbin files with clear errors, bobbin lookup, and atomic saving.
//! The only module besides the front ends that touches the file system.

#![warn(missing_docs)]
mod build_id;
mod build_toml;
mod convert;
mod demo;
mod error;
mod keep;
mod lookup;
mod measured;
mod raw;
mod recovery;
mod save;

pub use build_id::{build_id, fnv1a64};
pub use build_toml::build_to_toml;
pub use convert::{MAX_SECTIONS, MAX_WINDINGS};
pub use demo::{demo_build, demo_requirements};
pub use error::LoadError;
pub use keep::merge_onto;
pub use lookup::{BobbinEntry, BobbinLibrary, BobbinOrigin, USER_BOBBINS_ENV, user_bobbin_dir};
pub use recovery::{
    RECOVERY_ENV, discard_recovery, read_recovery, recovery_dir, recovery_path, write_recovery,
};
pub use save::{bobbin_to_toml, check_output, resolve_target, wire_text, write_atomic};

use crate::model::{Bobbin, Build};
use std::path::{Path, PathBuf};

/// Read and check a build file; its bobbin id is looked up beside the file, in the user's
/// folder, then in the bundled library.
pub fn load_build(path: &Path) -> Result<Build, LoadError> {
    let text = std::fs::read_to_string(path).map_err(|e| LoadError::io(path, &e))?;
    let library = BobbinLibrary::for_build(path);
    parse_build(&text, Some(path), &library)
}

/// Check a build from its text. `path` is only used in messages.
pub fn parse_build(
    text: &str,
    path: Option<&Path>,
    library: &BobbinLibrary,
) -> Result<Build, LoadError> {
    convert::build(text, path, library).map_err(|e| {
        other_kind(
            e,
            text,
            &["switch"],
            "this looks like a requirements file: `turnstack design FILE` reads it",
        )
    })
}

/// Read and check a requirements file (`turnstack design`); its `bobbins` ids are looked
/// up in `library`.
pub fn load_requirements(
    path: &Path,
    library: &BobbinLibrary,
) -> Result<crate::model::Requirements, LoadError> {
    let text = std::fs::read_to_string(path).map_err(|e| LoadError::io(path, &e))?;
    parse_requirements(&text, Some(path), library)
}

/// Check a requirements file from its text. `path` is only used in messages.
pub fn parse_requirements(
    text: &str,
    path: Option<&Path>,
    library: &BobbinLibrary,
) -> Result<crate::model::Requirements, LoadError> {
    convert::requirements(text, path, library).map_err(|e| {
        other_kind(
            e,
            text,
            &["winding", "stack", "bobbin"],
            "this looks like a build file: `turnstack check FILE` reads it, and `design` reads \
             a requirements file (FORMAT.md, \"Requirements file\")",
        )
    })
}

/// A load error with `hint` added when the text has a top-level table of the other kind of
/// file (one of `marks`): the user gave a build where requirements were wanted, or back.
fn other_kind(mut e: LoadError, text: &str, marks: &[&str], hint: &str) -> LoadError {
    let foreign =
        toml::from_str::<toml::Table>(text).is_ok_and(|t| marks.iter().any(|m| t.contains_key(*m)));
    if foreign {
        e.message = format!("{}; {hint}", e.message);
    }
    e
}

/// What the loader's checks of a requirements file find in requirements typed in (the
/// planner's form), each as the sentence the file's message would give; empty when none.
pub fn requirements_problems(req: &crate::model::Requirements) -> Vec<String> {
    convert::build_problems(req)
        .iter()
        .map(ToString::to_string)
        .collect()
}

/// Check a bobbin file's text.
pub fn parse_bobbin(text: &str, path: Option<&Path>) -> Result<Bobbin, LoadError> {
    convert::bobbin_file(text, path)
}

/// What a save did besides writing the figures.
#[derive(Debug, Clone, PartialEq)]
pub struct Saved {
    /// The build as written (its bobbin inlined when the id would not find the same bobbin
    /// from the new folder); reading the file back gives exactly this.
    pub build: Build,
    /// The file written (through a symbolic link, the file it points at).
    pub path: PathBuf,
    /// The text was written onto an earlier one, keeping its comments and layout.
    pub kept_layout: bool,
    /// The bobbin id would not find the same bobbin beside the new file, so its dimensions
    /// were written into the build instead (`[bobbin]` table): the id.
    pub bobbin_inlined: Option<String>,
}

impl Saved {
    /// A short note for the status line or the terminal, empty when there is nothing to say.
    pub fn note(&self) -> String {
        match &self.bobbin_inlined {
            Some(id) => format!(
                "bobbin \"{id}\" would not be the same bobbin from the new folder, so its dimensions are written into the file"
            ),
            None => String::new(),
        }
    }
}

/// The text a save of `build` to `target` writes, onto `base` (the text it was read from)
/// when there is one. Only values the build changed are rewritten; a base that is not a build
/// file, or a merge that would not read back as the same build, gives the tidy generated text.
pub fn build_text(build: &Build, base: Option<&str>, target: &Path) -> (String, Saved) {
    let library = BobbinLibrary::for_build(target);
    let mut written = build.clone();
    let mut bobbin_inlined = None;
    // A bobbin named by id must mean the same bobbin from the new folder; otherwise (a
    // bobbin from the old folder's bobbins/, or a bundled one shadowed by a file of the same
    // id beside the new one) the dimensions go into the build.
    if let crate::model::BobbinSource::Id(id) = &build.bobbin_source {
        let same = matches!(library.find(id), Some(Ok(b)) if b == build.bobbin);
        if !same {
            written.bobbin_source = crate::model::BobbinSource::Inline;
            bobbin_inlined = Some(id.clone());
        }
    }
    let reads_back =
        |text: &str| parse_build(text, Some(target), &library).is_ok_and(|b| b == written);
    let merged = base
        .and_then(|b| merge_onto(b, &written))
        .filter(|t| reads_back(t));
    let kept_layout = merged.is_some();
    let text = merged.unwrap_or_else(|| build_to_toml(&written));
    let saved = Saved {
        build: written,
        path: resolve_target(target),
        kept_layout,
        bobbin_inlined,
    };
    (text, saved)
}

/// Save a build to `target`, keeping the comments and layout of `source` (the file it was
/// read from) or, failing that, of the file being replaced. Atomic: temporary file, rename.
pub fn save_build_keeping(
    target: &Path,
    source: Option<&Path>,
    build: &Build,
) -> std::io::Result<Saved> {
    let base = source
        .and_then(|p| std::fs::read_to_string(p).ok())
        .or_else(|| std::fs::read_to_string(target).ok());
    let (text, saved) = build_text(build, base.as_deref(), target);
    write_atomic(target, &text)?;
    Ok(saved)
}

/// Save a build, keeping the layout of the file it replaces (if any).
pub fn save_build(path: &Path, build: &Build) -> std::io::Result<()> {
    save_build_keeping(path, None, build).map(|_| ())
}
