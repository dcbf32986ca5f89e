//! What a user reads, held whole: the text and JSON report, the winding sheet (text and HTML),
//! the bobbin ranking and the search listing of every example, as snapshots. A refactoring must
//! leave them byte for byte; a change of a figure shows here as a reviewed snapshot update
//! (`cargo insta review`), never silently. The figures themselves are checked against outside
//! references in the other modules; these snapshots hold the wording and the layout.

use std::path::Path;
use std::process::Command;

const EXAMPLES: [&str; 6] = [
    "foil-litz-300k",
    "first-try",
    "bench-forward",
    "mains-isolated",
    "salvaged-too-small",
    "two-output",
];

/// stdout of the binary, with the user's bobbin folder pointed at an empty one.
fn output(args: &[&str]) -> String {
    let empty = tempfile::tempdir().unwrap();
    let o = Command::new(env!("CARGO_BIN_EXE_turnstack"))
        .args(args)
        .current_dir(env!("CARGO_MANIFEST_DIR"))
        .env("TURNSTACK_BOBBINS", empty.path())
        .output()
        .expect("the binary runs");
    assert!(
        o.status.code().is_some_and(|c| c <= 1),
        "{args:?}: {}",
        String::from_utf8_lossy(&o.stderr)
    );
    let text = String::from_utf8(o.stdout).expect("utf-8 stdout");
    text.replace(empty.path().to_str().unwrap(), "<user bobbins>")
}

fn example(name: &str) -> String {
    format!("examples/{name}.toml")
}

fn settings(name: &str) -> insta::Settings {
    let mut s = insta::Settings::clone_current();
    s.set_snapshot_suffix(name.to_string());
    s.set_prepend_module_to_snapshot(true);
    s
}

#[test]
fn text_report_of_every_example() {
    for name in EXAMPLES {
        let text = output(&["check", &example(name)]);
        settings(name).bind(|| insta::assert_snapshot!("check", text));
    }
}

#[test]
fn json_report_of_every_example() {
    for name in EXAMPLES {
        let text = output(&["check", &example(name), "--json"]);
        settings(name).bind(|| insta::assert_snapshot!("check_json", text));
    }
}

#[test]
fn text_sheet_of_every_example() {
    for name in EXAMPLES {
        let text = output(&["sheet", &example(name)]);
        settings(name).bind(|| insta::assert_snapshot!("sheet", text));
    }
}

#[test]
fn html_sheet_of_every_example() {
    for name in EXAMPLES {
        let dir = tempfile::tempdir().unwrap();
        let out = dir.path().join("sheet.html");
        output(&["sheet", &example(name), "--html", out.to_str().unwrap()]);
        let html = std::fs::read_to_string(&out).expect("the sheet was written");
        settings(name).bind(|| insta::assert_snapshot!("sheet_html", html));
    }
}

#[test]
fn bobbin_ranking_of_every_example() {
    for name in EXAMPLES {
        let text = output(&["fit", &example(name)]);
        settings(name).bind(|| insta::assert_snapshot!("fit", text));
    }
}

#[test]
fn search_listing_of_every_example() {
    for name in EXAMPLES {
        let text = output(&["search", &example(name)]);
        settings(name).bind(|| insta::assert_snapshot!("search", text));
        let json = output(&["search", &example(name), "--json"]);
        settings(name).bind(|| insta::assert_snapshot!("search_json", json));
    }
}

#[test]
fn listings_of_bobbins_and_wires() {
    let root = Path::new(env!("CARGO_MANIFEST_DIR"));
    assert!(root.join("bobbins").is_dir());
    insta::assert_snapshot!("bobbins", output(&["bobbins"]));
    insta::assert_snapshot!("wires", output(&["wires"]));
}
