//! Reference data compiled into the program: wire tables, the bundled bobbins and the
//! generic ferrites.

pub mod bobbins;
pub mod conductors;
pub mod demo;
pub mod materials;
pub mod wires;
