//! Plain data: the bobbin, the wire, the windings, the stack of sections, the build.
//! No I/O and no computation beyond trivial accessors; the engine reads these.

#![warn(missing_docs)]
mod bobbin;
mod build;
mod isolation;
mod measured;
mod name;
mod operating;
mod wire;

pub use bobbin::{Bobbin, Core, Tube, Window};
pub use build::{BobbinSource, Build, Role, Section, SectionRef, Setup, Winding, WindingSection};
pub use isolation::{Isolation, IsolationClass};
pub use measured::{DEFAULT_READING_C, Measured};
pub use name::Name;
pub use operating::{Material, Operating, ResetSide, Steinmetz};
pub use wire::{Insulation, WireSize, trim_mm};
