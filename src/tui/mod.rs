//! The interactive planner: edit a winding build and watch it fit. The document (build,
//! figures, undo history) apart from the screen's state; one module per overlay with its
//! own keys; one table of field specs per form; one key table; the views; and the terminal
//! loop, the only place that touches the terminal and writes files. It computes no figure:
//! it edits the Build and shows the engine's Evaluation.

pub mod action;
pub mod app;
mod conductor_edit;
mod core_form;
pub mod document;
pub mod edit;
pub mod fields;
pub mod job;
pub mod keymap;
mod main_keys;
pub mod overlay;
pub mod run;
mod stated_turns;
mod tasks;
pub mod theme;
pub mod ui;
pub mod view;

pub use action::Action;
pub use app::{App, Effect};
