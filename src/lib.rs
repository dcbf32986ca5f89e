//! turnstack: plan the hand winding of small switch-mode power transformers, layer by layer
//! in a real bobbin window, with the figures that decide whether the build works.
//!
//! Data flows one way: files (TOML) -> `model` -> `engine::evaluate` -> `Evaluation` ->
//! text, JSON, the winding sheet and the terminal UI.

pub mod cli;
pub mod engine;
pub mod files;
pub mod library;
pub mod model;
pub mod report;
pub mod tui;
