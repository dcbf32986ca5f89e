//! The interactive planner: edit a winding build and watch it fit. App state and actions
//! (with undo), one key table, the views, and the terminal loop. It computes no figure: it
//! edits the Build and shows the engine's Evaluation.

pub mod action;
pub mod app;
mod core_form;
pub mod edit;
mod forms;
pub mod keymap;
pub mod run;
mod tasks;
pub mod theme;
pub mod view;

pub use action::Action;
pub use app::{App, Effect};
