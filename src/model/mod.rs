//! Plain data: the bobbin, the wire, the windings, the stack of sections, the build.
//! No I/O and no computation beyond trivial accessors; the engine reads these.

#![warn(missing_docs)]
mod bobbin;
mod build;
mod conductor;
mod isolation;
mod measured;
mod name;
mod operating;
mod requirements;
mod wire;

pub use bobbin::{Bobbin, Core, Tube, Window};
pub use build::{BobbinSource, Build, Role, Section, SectionRef, Setup, Winding, WindingSection};
pub use conductor::{
    Conductor, FOIL_INTERLEAF_MM, FOIL_MAX_MM, FOIL_MIN_MM, FOIL_OVERHANG_MM, FOIL_TAB_MM, Foil,
    LITZ_LAY_FACTOR, LITZ_PACKING, LITZ_SERVING_MM, LITZ_STRAND_MM, LITZ_STRANDS, Litz,
};
pub use isolation::{Isolation, IsolationClass};
pub use measured::{DEFAULT_READING_C, Measured};
pub use name::Name;
pub use operating::{Material, Operating, Output, OutputFigures, ResetSide, Steinmetz};
pub use requirements::{Requirements, SwitchSpec};
pub use wire::{Insulation, WireSize, trim_mm};
