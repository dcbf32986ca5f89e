//! `turnstack verify` as a process: exit 0 every reading within tolerance, 1 one out, 2 bad
//! input or no readings; the JSON keys; and `check --json` adding `measured` and `verify` only
//! for a build with a `[measured]` table.

use serde_json::Value;
use std::path::Path;
use std::process::{Command, Output};

const PLAN: &str = r#"format = 1
title = "verify cli part"
bobbin = "e25-13-7"

[[winding]]
name = "P"
role = "primary"
turns = 24
wire = "0.63mm"

[[winding]]
name = "S"
role = "secondary"
turns = 16
wire = "0.50mm"

[[stack]]
winding = "P"

[[stack]]
tape = 1

[[stack]]
winding = "S"
"#;

fn run(args: &[&str]) -> Output {
    let empty = tempfile::tempdir().unwrap();
    Command::new(env!("CARGO_BIN_EXE_turnstack"))
        .args(args)
        .current_dir(env!("CARGO_MANIFEST_DIR"))
        .env("TURNSTACK_BOBBINS", empty.path())
        .output()
        .expect("the binary runs")
}

fn verify_text(text: &str, json: bool) -> Output {
    let dir = tempfile::tempdir().unwrap();
    let p = dir.path().join("part.toml");
    std::fs::write(&p, text).unwrap();
    let p = p.to_str().unwrap();
    if json {
        run(&["verify", p, "--json"])
    } else {
        run(&["verify", p])
    }
}

fn out(o: &Output) -> String {
    String::from_utf8_lossy(&o.stdout).into_owned()
}

fn err(o: &Output) -> String {
    String::from_utf8_lossy(&o.stderr).into_owned()
}

// Readings of a part as planned: ratio 16/24, L = 2160 nH x 24^2 = 1244 uH less 5 %.
const CLEAN: &str = "\n[measured]\nmagnetising_uh = 1180.0\nratio = { S = 0.6667 }\n";
// The same part with 15 turns on S: 15/24 = 0.625.
const SHORT_TURN: &str = "\n[measured]\nmagnetising_uh = 1180.0\nratio = { S = 0.625 }\n";

#[test]
fn exit_0_when_every_reading_is_within_tolerance() {
    let o = verify_text(&format!("{PLAN}{CLEAN}"), false);
    assert_eq!(o.status.code(), Some(0), "{}{}", out(&o), err(&o));
    assert!(
        out(&o).contains("every reading is within tolerance"),
        "{}",
        out(&o)
    );
    assert!(
        out(&o).lines().all(|l| l.chars().count() <= 80),
        "{}",
        out(&o)
    );
}

#[test]
fn exit_1_when_a_reading_is_out_and_it_names_the_winding() {
    let o = verify_text(&format!("{PLAN}{SHORT_TURN}"), false);
    assert_eq!(o.status.code(), Some(1), "{}{}", out(&o), err(&o));
    let text = out(&o);
    assert!(
        text.contains("Voltage ratio S / P: OUT OF TOLERANCE"),
        "{text}"
    );
    assert!(text.contains("S most likely has 15 turns"), "{text}");
}

#[test]
fn exit_2_without_a_table_with_a_clear_message() {
    let o = verify_text(PLAN, false);
    assert_eq!(o.status.code(), Some(2));
    assert!(err(&o).contains("no [measured] table"), "{}", err(&o));
    assert!(out(&o).is_empty());
    let o = verify_text(&format!("{PLAN}\n[measured]\nreading_c = 22.0\n"), false);
    assert_eq!(o.status.code(), Some(2));
    assert!(err(&o).contains("holds no reading"), "{}", err(&o));
}

#[test]
fn exit_2_on_bad_input_with_line_and_column() {
    let o = verify_text(
        &format!("{PLAN}\n[measured]\ndcr_ohm = {{ X = 0.05 }}\n"),
        false,
    );
    assert_eq!(o.status.code(), Some(2));
    let line = PLAN.lines().count() + 3;
    assert!(
        err(&o).contains(&format!(":{line}:")),
        "line {line} expected: {}",
        err(&o)
    );
    assert!(err(&o).contains("unknown winding \"X\""), "{}", err(&o));
    let o = run(&["verify", "examples/no-such-part.toml"]);
    assert_eq!(o.status.code(), Some(2));
}

#[test]
fn json_of_verify_and_of_check() {
    let o = verify_text(&format!("{PLAN}{SHORT_TURN}"), true);
    assert_eq!(o.status.code(), Some(1));
    let v: Value = serde_json::from_str(&out(&o)).expect("JSON");
    assert_eq!(v["verify"]["all_within"], false);
    let ratio = v["verify"]["checks"]
        .as_array()
        .unwrap()
        .iter()
        .find(|c| c["kind"] == "ratio")
        .unwrap();
    assert_eq!(ratio["winding"], "S");
    assert_eq!(ratio["within"], false);
    assert_eq!(ratio["findings"][0]["kind"], "turns_off");
    assert_eq!(ratio["findings"][0]["likely"], 15);
    assert_eq!(ratio["findings"][0]["by"], -1);
    assert_eq!(v["measured"]["ratio"]["S"], 0.625);

    // check --json: the keys only with a table.
    let o = run(&["check", "examples/bench-forward-wound.toml", "--json"]);
    let v: Value = serde_json::from_str(&out(&o)).unwrap();
    assert!(v["measured"].is_object() && v["verify"].is_object());
    let o = run(&["check", "examples/bench-forward.toml", "--json"]);
    let v: Value = serde_json::from_str(&out(&o)).unwrap();
    assert!(v.get("measured").is_none() && v.get("verify").is_none());
}

#[test]
fn the_example_part_has_a_dirty_core() {
    let o = run(&["verify", "examples/bench-forward-wound.toml"]);
    assert_eq!(o.status.code(), Some(1), "{}", err(&o));
    let text = out(&o);
    assert!(
        text.contains("Magnetising inductance at P: OUT OF TOLERANCE"),
        "{text}"
    );
    assert!(text.contains("mating faces need cleaning"), "{text}");
    assert!(text.lines().all(|l| l.chars().count() <= 80), "{text}");
    assert!(
        Path::new(env!("CARGO_MANIFEST_DIR"))
            .join("examples/bench-forward-wound.toml")
            .exists()
    );
}

#[test]
fn the_sheet_carries_the_same_readings() {
    // Filled from the [measured] table; the expected value and band beside each.
    let o = run(&[
        "sheet",
        "examples/bench-forward-wound.toml",
        "--page-lines",
        "0",
    ]);
    let text = out(&o);
    let line = |start: &str| {
        text.lines()
            .find(|l| l.trim_start().starts_with(start))
            .unwrap_or_else(|| panic!("no line {start}: {text}"))
            .to_string()
    };
    let l = line("L magnetising P");
    // 2160 nH x 24^2 = 1244 uH, +/-25 %: 933 uH to 1555 uH.
    assert!(l.contains("1.24 mH") && l.contains("933 uH-1.56 mH") && l.ends_with("905 uH"));
    assert!(line("DCR P").ends_with("0.0575 ohm at 22 C"));
    assert!(text.lines().all(|l| l.chars().count() <= 80));
    // Without readings, a cell to write in.
    let o = run(&["sheet", "examples/bench-forward.toml", "--page-lines", "0"]);
    let text = out(&o);
    let ratio = text
        .lines()
        .find(|l| l.trim_start().starts_with("ratio S/P"))
        .unwrap();
    // 16/24 = 0.6667, +/- 0.4/24 = 1.67 %: 0.6556 to 0.6778.
    assert!(
        ratio.contains("0.6667") && ratio.contains("0.6556-0.6778"),
        "{ratio}"
    );
    assert!(ratio.ends_with("__________"), "{ratio}");
    let dir = tempfile::tempdir().unwrap();
    let html = dir.path().join("s.html");
    let o = run(&[
        "sheet",
        "examples/bench-forward-wound.toml",
        "--html",
        html.to_str().unwrap(),
    ]);
    assert_eq!(o.status.code(), Some(0), "{}", err(&o));
    let page = std::fs::read_to_string(&html).unwrap();
    assert!(page.contains("<h2>Readings</h2>") && page.contains("<td>905 uH</td>"));
}
