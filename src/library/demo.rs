//! The demo build the program opens with no file: the bench converter's first, plain try,
//! compiled in so that an installed binary has it.

use crate::files::{BobbinLibrary, LoadError, parse_build};
use crate::model::Build;
use std::path::Path;

pub const DEMO_NAME: &str = "examples/first-try.toml";
pub const DEMO_TEXT: &str = include_str!("../../examples/first-try.toml");

/// The demo build, its bobbin from the bundled library.
pub fn demo_build() -> Result<Build, LoadError> {
    parse_build(
        DEMO_TEXT,
        Some(Path::new(DEMO_NAME)),
        &BobbinLibrary::bundled_only(),
    )
}
