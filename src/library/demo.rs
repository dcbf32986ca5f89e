//! The demo build the program opens with no file: the bench converter's first, plain try,
//! compiled in so that an installed binary has it. `files::demo_build` parses it.

/// The name the demo is shown and reported under.
pub const DEMO_NAME: &str = "examples/first-try.toml";
/// The demo's build file, as written in `examples/`.
pub const DEMO_TEXT: &str = include_str!("../../examples/first-try.toml");

/// The name the requirements the planner's form starts from are known under.
pub const DEMO_REQUIREMENTS_NAME: &str = "examples/requirements/bench-supply-5v.toml";
/// The requirements the planner's "from requirements" form starts from, as written in
/// `examples/requirements/`: the demo's converter before any turns are known.
pub const DEMO_REQUIREMENTS_TEXT: &str =
    include_str!("../../examples/requirements/bench-supply-5v.toml");
