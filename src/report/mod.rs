//! Renderings of an Evaluation: the readable check report, the JSON report and the lists.
//! They read the Evaluation; they compute no figure of their own.

pub mod design;
pub mod fit;
pub mod json;
pub mod json_conductor;
pub mod json_outputs;
pub mod json_stress;
pub mod search;
pub mod sheet;
pub mod text;
pub mod textfmt;
pub mod verify;
pub mod verify_conductor;
pub mod verify_findings;

pub use textfmt::wrap;
