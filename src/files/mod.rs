//! Loading build and bobbin files with clear errors, bobbin lookup, and atomic saving.
//! The only module besides the front ends that touches the file system.

mod build_id;
mod convert;
mod demo;
mod error;
mod lookup;
mod raw;
mod save;

pub use build_id::{build_id, fnv1a64};
pub use demo::demo_build;
pub use error::LoadError;
pub use lookup::{BobbinEntry, BobbinLibrary, BobbinOrigin, USER_BOBBINS_ENV, user_bobbin_dir};
pub use save::{bobbin_to_toml, build_to_toml, write_atomic};

use crate::model::{Bobbin, Build};
use std::path::Path;

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
    convert::build(text, path, library)
}

/// Check a bobbin file's text.
pub fn parse_bobbin(text: &str, path: Option<&Path>) -> Result<Bobbin, LoadError> {
    convert::bobbin_file(text, path)
}

/// Save a build as a tidy TOML file, atomically (temporary file, then rename).
pub fn save_build(path: &Path, build: &Build) -> std::io::Result<()> {
    write_atomic(path, &build_to_toml(build))
}
