//! The integration tests, one crate so the suite builds once: each module is one area's
//! checks against outside references, the CLI as a process, or the planner's buffers.

mod common;
mod tui_support;

mod ac_dowell_harmonics;
mod bench_figures;
mod build_limits;
mod cli;
mod cli_writes;
mod converter_examples;
mod converter_forward;
mod core_relations;
mod design_cli;
mod design_relations;
mod fidelity;
mod fit_ranking;
mod foil_litz;
mod foil_search;
mod golden_outputs;
mod json_contract;
mod layering;
mod layout_cases;
mod memo_reuse;
mod outputs;
mod recovery;
mod reference_figures;
mod reset_sweep;
mod save_roundtrip;
mod search_props;
mod sheet_content;
mod sheet_isolation;
mod sheet_print;
mod tui_app;
mod tui_foil_litz;
mod tui_forms;
mod tui_overlays;
mod tui_overwrite;
mod tui_readings;
mod tui_render;
mod tui_reset_ratio;
mod validation_messages;
mod verify_cli;
mod verify_readings;
mod wire_tables;
