//! The integration tests, one crate so the suite builds once: each module is one area's
//! checks against outside references, the CLI as a process, or the planner's buffers.

mod common;
mod tui_support;

mod ac_dowell_harmonics;
mod cli;
mod converter_examples;
mod converter_forward;
mod core_relations;
mod fidelity;
mod fit_ranking;
mod golden_outputs;
mod layout_cases;
mod reference_figures;
mod search_props;
mod sheet_content;
mod sheet_isolation;
mod sheet_print;
mod tui_app;
mod tui_forms;
mod tui_overlays;
mod tui_render;
mod validation_messages;
mod wire_tables;
