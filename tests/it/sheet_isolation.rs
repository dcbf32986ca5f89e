//! Isolation declarations: the checks of the stack against the usual layout (three wraps of
//! tape for reinforced thin-sheet insulation, IEC 60950-1 cl. 2.10.5.6; margins of half the
//! creepage at each flange, common practice) and the sheet's cautions.

use std::path::Path;
use turnstack::engine::evaluate;
use turnstack::files::{BobbinLibrary, build_to_toml, load_build, parse_build};
use turnstack::model::{Build, Insulation, Section};
use turnstack::report::sheet;

fn mains() -> Build {
    load_build(&Path::new(env!("CARGO_MANIFEST_DIR")).join("examples/mains-isolated.toml")).unwrap()
}

fn codes(b: &Build) -> Vec<&'static str> {
    evaluate(b)
        .warnings
        .iter()
        .map(|w| w.code())
        .filter(|c| c.starts_with("isolation"))
        .collect()
}

/// The example as planned (three wraps, 3 mm margins for 6 mm creepage) draws no isolation
/// warning, and its declaration survives a save and reload.
#[test]
fn mains_example_holds_its_declaration_and_round_trips() {
    let b = mains();
    let iso = b.isolation.clone().unwrap();
    assert_eq!(iso.class.key(), "reinforced");
    assert!(codes(&b).is_empty(), "{:?}", codes(&b));
    let again = parse_build(&build_to_toml(&b), None, &BobbinLibrary::bundled_only()).unwrap();
    assert_eq!(again.isolation, b.isolation);
}

/// Two wraps between primary and secondary: fewer than three, so warned; triple-insulated
/// wire on the secondary waives it.
#[test]
fn fewer_than_three_wraps_warn_unless_tiw() {
    let mut b = mains();
    b.stack[3] = Section::Tape { wraps: 2 };
    assert_eq!(codes(&b), ["isolation-wraps"]);
    let s = b.windings.iter_mut().find(|w| w.name == "S").unwrap();
    s.insulation = Insulation::Tiw;
    assert!(!codes(&b).contains(&"isolation-wraps"));
}

/// Margins of 2.5 mm against 6 mm of creepage: narrower than half of it, so warned.
#[test]
fn margins_narrower_than_half_the_creepage_warn() {
    let mut b = mains();
    b.setup.margin_mm = 2.5;
    assert_eq!(codes(&b), ["isolation-margin"]);
    b.setup.margin_mm = 3.0;
    assert!(codes(&b).is_empty());
}

/// The sheet of a reinforced build carries the cautions, the hipot check and the plain
/// statement that it is no substitute for the standard; a build with no declaration says it
/// gives no protection.
#[test]
fn sheet_cautions_follow_the_declaration() {
    let b = mains();
    let s = sheet::sheet(&b, &evaluate(&b), 20.0);
    let all = s.cautions.join(" ");
    for want in [
        "Three layers of tape",
        "any two of",
        "Margin tape",
        "Sleeving",
        "hipot",
        "no substitute",
        "qualified person",
    ] {
        assert!(all.contains(want), "missing {want}: {all}");
    }
    assert!(s.checks.iter().any(|c| c.what.contains("hipot")));
    let mut plain = b.clone();
    plain.isolation = None;
    let s = sheet::sheet(&plain, &evaluate(&plain), 20.0);
    assert!(s.cautions[0].contains("no protection against electric shock"));
    assert!(!s.checks.iter().any(|c| c.what.contains("hipot")));
}

/// A bad class in the file is refused at its line with the words that are allowed.
#[test]
fn unknown_isolation_class_is_refused_with_its_line() {
    let text = std::fs::read_to_string(
        Path::new(env!("CARGO_MANIFEST_DIR")).join("examples/mains-isolated.toml"),
    )
    .unwrap()
    .replace("class = \"reinforced\"", "class = \"double\"");
    let e = parse_build(&text, None, &BobbinLibrary::bundled_only()).unwrap_err();
    assert!(e.message.contains("\"reinforced\""), "{e}");
    assert!(e.line.is_some());
    let text = text
        .replace("class = \"double\"", "class = \"basic\"")
        .replace("creepage_mm = 6.0", "creepage_mm = -1");
    let e = parse_build(&text, None, &BobbinLibrary::bundled_only()).unwrap_err();
    assert!(e.to_string().contains("creepage_mm"), "{e}");
}
