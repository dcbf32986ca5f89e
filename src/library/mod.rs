//! Reference data compiled into the program: wire tables and the bundled bobbins.

pub mod bobbins;
pub mod demo;
pub mod wires;
