//! The demo build the program opens with no file, parsed from the text the library compiles
//! in (`library::demo`), its bobbin from the bundled library.

use super::{BobbinLibrary, LoadError, parse_build, parse_requirements};
use crate::library::demo::{DEMO_NAME, DEMO_REQUIREMENTS_NAME, DEMO_REQUIREMENTS_TEXT, DEMO_TEXT};
use crate::model::{Build, Requirements};
use std::path::Path;

/// The demo build, its bobbin from the bundled library.
pub fn demo_build() -> Result<Build, LoadError> {
    parse_build(
        DEMO_TEXT,
        Some(Path::new(DEMO_NAME)),
        &BobbinLibrary::bundled_only(),
    )
}

/// The requirements of the demo's converter (examples/requirements/bench-supply-5v.toml),
/// the planner's "from requirements" form starts from them.
pub fn demo_requirements() -> Result<Requirements, LoadError> {
    parse_requirements(
        DEMO_REQUIREMENTS_TEXT,
        Some(Path::new(DEMO_REQUIREMENTS_NAME)),
        &BobbinLibrary::bundled_only(),
    )
}
