//! The demo build the program opens with no file, parsed from the text the library compiles
//! in (`library::demo`), its bobbin from the bundled library.

use super::{BobbinLibrary, LoadError, parse_build};
use crate::library::demo::{DEMO_NAME, DEMO_TEXT};
use crate::model::Build;
use std::path::Path;

/// The demo build, its bobbin from the bundled library.
pub fn demo_build() -> Result<Build, LoadError> {
    parse_build(
        DEMO_TEXT,
        Some(Path::new(DEMO_NAME)),
        &BobbinLibrary::bundled_only(),
    )
}
