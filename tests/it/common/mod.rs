//! Helpers shared by the integration tests: builds from TOML text, relative comparison.
//! Each test binary uses a different subset, hence the allowance for unused items.
#![allow(dead_code)]

use std::path::{Path, PathBuf};
use turnstack::engine::{Evaluation, SectionEval, SectionKind, evaluate};
use turnstack::files::{self, BobbinLibrary};
use turnstack::model::Build;

/// A build from its file text; bobbin ids from the bundled library only. Panics with the
/// loader's message, so a test that writes a bad build says why.
pub fn parse(text: &str) -> Build {
    files::parse_build(
        text,
        Some(Path::new("test.toml")),
        &BobbinLibrary::bundled_only(),
    )
    .unwrap_or_else(|e| panic!("{}\n---\n{text}", e.with_snippet()))
}

pub fn eval(text: &str) -> (Build, Evaluation) {
    let b = parse(text);
    let e = evaluate(&b);
    (b, e)
}

/// One of the three example files, loaded as a user would load it.
pub fn example(name: &str) -> (Build, Evaluation) {
    let p = Path::new(env!("CARGO_MANIFEST_DIR")).join(format!("examples/{name}.toml"));
    let b = files::load_build(&p).unwrap_or_else(|e| panic!("{}", e.with_snippet()));
    let e = evaluate(&b);
    (b, e)
}

/// |got - want| <= tol x |want|.
#[track_caller]
pub fn assert_rel(got: f64, want: f64, tol: f64, what: &str) {
    let err = (got - want).abs() / want.abs().max(f64::MIN_POSITIVE);
    assert!(
        err <= tol,
        "{what}: got {got}, want {want} (rel. error {err:.3e} > {tol:.1e})"
    );
}

/// A winding section's figures: (turns, turns per layer, layers, last layer turns, mlt_mm).
pub fn winding_section(s: &SectionEval) -> (u32, u32, u32, u32, f64) {
    match &s.kind {
        SectionKind::Winding {
            turns,
            turns_per_layer,
            layer_count,
            last_layer_turns,
            mlt_mm,
            ..
        } => (
            *turns,
            *turns_per_layer,
            *layer_count,
            *last_layer_turns,
            *mlt_mm,
        ),
        SectionKind::Tape { .. } => panic!("expected a winding section, got tape"),
    }
}

/// `[bobbin]` with a round tube.
pub fn round_bobbin(width_mm: f64, height_mm: f64, diameter_mm: f64) -> String {
    format!(
        "[bobbin]\nname = \"test former\"\norigin = \"test\"\n\
         [bobbin.window]\nwidth_mm = {width_mm:?}\nheight_mm = {height_mm:?}\n\
         [bobbin.tube]\nshape = \"round\"\ndiameter_mm = {diameter_mm:?}\n"
    )
}

/// `[bobbin]` with a rect tube.
pub fn rect_bobbin(width_mm: f64, height_mm: f64, tube_w: f64, tube_d: f64, r: f64) -> String {
    format!(
        "[bobbin]\nname = \"test former\"\norigin = \"test\"\n\
         [bobbin.window]\nwidth_mm = {width_mm:?}\nheight_mm = {height_mm:?}\n\
         [bobbin.tube]\nshape = \"rect\"\nwidth_mm = {tube_w:?}\ndepth_mm = {tube_d:?}\n\
         corner_radius_mm = {r:?}\n"
    )
}

/// A `[[winding]]` of measured wire (bare and overall diameter given, so no table is involved).
pub fn measured_winding(
    name: &str,
    role: &str,
    turns: u32,
    bare_mm: f64,
    od_mm: f64,
    strands: u32,
) -> String {
    format!(
        "[[winding]]\nname = \"{name}\"\nrole = \"{role}\"\nturns = {turns}\n\
         wire = {{ bare_mm = {bare_mm:?}, od_mm = {od_mm:?} }}\nstrands = {strands}\n"
    )
}

/// The folder of broken build files and their `.expected` sidecars.
pub fn broken_dir() -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/broken")
}

/// What a `.expected` sidecar says: `at LINE:COL` (or `at -` when there is no position),
/// `key KEY` (or `key -` when the loader names the key only inside the message), and any
/// number of `has TEXT` lines, each a piece of the message's first line. `#` lines are comments.
#[derive(Debug)]
pub struct Expected {
    pub at: Option<(usize, usize)>,
    pub key: Option<String>,
    pub has: Vec<String>,
}

pub fn read_expected(path: &Path) -> Expected {
    let text = std::fs::read_to_string(path).unwrap_or_else(|e| panic!("{}: {e}", path.display()));
    let mut at = None;
    let mut key = None;
    let mut has = Vec::new();
    let mut seen_at = false;
    let mut seen_key = false;
    for line in text.lines() {
        if line.starts_with('#') || line.trim().is_empty() {
            continue;
        }
        if let Some(rest) = line.strip_prefix("at ") {
            seen_at = true;
            if rest != "-" {
                let (l, c) = rest.split_once(':').expect("at LINE:COL");
                at = Some((l.parse().unwrap(), c.parse().unwrap()));
            }
        } else if let Some(rest) = line.strip_prefix("key ") {
            seen_key = true;
            if rest != "-" {
                key = Some(rest.to_string());
            }
        } else if let Some(rest) = line.strip_prefix("has ") {
            has.push(rest.to_string());
        } else {
            panic!("{}: cannot read line {line:?}", path.display());
        }
    }
    assert!(
        seen_at && seen_key && !has.is_empty(),
        "{}: needs at, key and has lines",
        path.display()
    );
    Expected { at, key, has }
}

/// Every `tests/broken/*.toml`, sorted.
pub fn broken_files() -> Vec<PathBuf> {
    let mut v: Vec<PathBuf> = std::fs::read_dir(broken_dir())
        .unwrap()
        .map(|e| e.unwrap().path())
        .filter(|p| p.extension().is_some_and(|x| x == "toml"))
        .collect();
    v.sort();
    v
}
