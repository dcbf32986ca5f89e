//! The pure engine: turns a `Build` into an `Evaluation`. No I/O, no terminal, no clap.
//! Every figure has its one definition here (see FORMAT.md, the project's copy of the file
//! format and the definition of each figure).

#![warn(missing_docs)]
pub mod ac;
pub mod bench;
pub mod build_size;
pub mod capacitance;
pub mod conductor;
pub mod constants;
pub mod converter;
pub mod core_loss;
pub mod currents;
pub mod design;
pub mod dowell_table;
mod evaluation;
pub mod foil_cut;
pub mod geometry;
pub mod harmonic_sum;
pub mod harmonics;
pub mod isolation;
pub mod layout;
pub mod leakage;
pub mod limits;
pub mod litz;
pub mod losses;
pub mod magnetics;
mod material_checks;
pub mod measured_core;
pub mod memo;
mod operating_checks;
pub mod outputs;
mod remarks;
pub mod reset_sweep;
pub mod resistance;
pub mod search;
pub mod spacing;
pub mod stress;
pub mod thermal;
pub mod validate;
pub mod verify;
pub mod verify_conductor;
mod warnings;

pub use bench::primary_secondary_leakage;
pub use converter::ConverterEval;
pub use currents::CurrentSource;
pub use evaluation::{
    AcFigures, Evaluation, LayerEval, LeakageEval, SectionEval, SectionKind, TemperatureSource,
    WindingEval,
};
pub use limits::{Constraint, Limit};
pub use losses::LossEval;
pub use magnetics::AlSource;
pub use outputs::OutputEval;
pub use remarks::{Note, Warning, WarningAt, WarningKind};
pub use thermal::InsulationPart;
pub use validate::{Invalid, Place, validate, validate_bobbin};

use crate::model::Build;

/// Every figure of a build. Total: never panics; a build that `validate` refuses still gets
/// an evaluation (with an `invalid` warning) so that an editor can keep showing something.
pub fn evaluate(build: &Build) -> Evaluation {
    evaluate_with(build, &mut memo::Memo::new())
}

/// `evaluate`, with a memo of its costly pure parts kept by the caller across builds that
/// share them (the search's candidates). The figures are the same as `evaluate`'s.
pub fn evaluate_with(build: &Build, memo: &mut memo::Memo) -> Evaluation {
    evaluation::evaluate(build, memo)
}
