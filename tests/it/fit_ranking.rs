//! The fit ranking on a folder of test bobbins, against the order worked by hand from the
//! layout rules of FORMAT.md (turns per layer = floor(width / pitch), height x bulge).

use std::path::{Path, PathBuf};
use std::process::Command;
use turnstack::files::{load_build, parse_bobbin};
use turnstack::model::Bobbin;
use turnstack::report::fit::rank;

fn fixtures() -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/fixtures")
}

fn bobbins() -> Vec<(String, Bobbin)> {
    let dir = fixtures().join("fit-bobbins");
    let mut out = Vec::new();
    for id in ["t-short", "t-too-narrow", "t-roomy", "t-narrow", "t-snug"] {
        let p = dir.join(format!("{id}.toml"));
        let text = std::fs::read_to_string(&p).unwrap();
        out.push((id.to_string(), parse_bobbin(&text, Some(&p)).unwrap()));
    }
    out
}

/// Worked by hand (P: 20 turns od 0.5, tape 2 x 0.06, S: 10 turns od 1.0, bulge 1.10):
/// width 10: P 1 layer 0.5, S 1 layer 1.0, build 1.62, x1.1 = 1.782 mm;
/// width 5: P 2 layers 1.0, S 2 layers 2.0, build 3.12, x1.1 = 3.432 mm;
/// width 0.9: S (od 1.0) cannot be laid. Spare: roomy 4.0 - 1.782 = 2.218, snug 0.218,
/// short -0.282, narrow 3.0 - 3.432 = -0.432.
#[test]
fn ranking_follows_the_hand_worked_spare_heights() {
    let build = load_build(&fixtures().join("fit-build.toml")).unwrap();
    let rows = rank(&build, &bobbins());
    let ids: Vec<&str> = rows.iter().map(|r| r.bobbin.as_str()).collect();
    assert_eq!(
        ids,
        ["t-roomy", "t-snug", "t-short", "t-narrow", "t-too-narrow"]
    );
    let spare: Vec<f64> = rows[..4].iter().map(|r| r.spare_height_mm).collect();
    for (got, want) in spare.iter().zip([2.218, 0.218, -0.282, -0.432]) {
        assert!((got - want).abs() < 1e-9, "{got} vs {want}");
    }
    assert_eq!(
        rows.iter().map(|r| r.fits).collect::<Vec<_>>(),
        [true, true, false, false, false]
    );
    // Too tall is a reason in words; a wire wider than the usable width is a validation problem.
    assert!(
        rows[2].reasons[0].starts_with("too tall"),
        "{:?}",
        rows[2].reasons
    );
    assert!(!rows[4].valid);
    assert!(
        rows[4].reasons.iter().any(|r| r.contains("usable")),
        "{:?}",
        rows[4].reasons
    );
    // Fill factor: copper area / window area = (20 x pi 0.45^2/4 + 10 x pi 0.9^2/4) / (10 x 4).
    let copper = 20.0 * std::f64::consts::PI * 0.45f64.powi(2) / 4.0
        + 10.0 * std::f64::consts::PI * 0.9f64.powi(2) / 4.0;
    assert!((rows[0].fill_factor - copper / 40.0).abs() < 1e-12);
}

/// `fit --json` prints an array, best first, with the keys the issue names.
#[test]
fn fit_json_lists_fixtures_in_rank_order() {
    let user = tempfile::tempdir().unwrap();
    let out = Command::new(env!("CARGO_BIN_EXE_turnstack"))
        .args(["fit", "--json", "--bobbins"])
        .arg(fixtures().join("fit-bobbins"))
        .arg(fixtures().join("fit-build.toml"))
        .env("TURNSTACK_BOBBINS", user.path())
        .output()
        .unwrap();
    assert_eq!(
        out.status.code(),
        Some(0),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).unwrap();
    let list = v.as_array().unwrap();
    for key in [
        "bobbin",
        "fits",
        "spare_height_mm",
        "fill_factor",
        "dcr_total_ohm",
    ] {
        assert!(list.iter().all(|r| r.get(key).is_some()), "missing {key}");
    }
    let pos = |id: &str| list.iter().position(|r| r["bobbin"] == id).unwrap();
    assert!(pos("t-roomy") < pos("t-snug"));
    assert!(pos("t-snug") < pos("t-short"));
    assert!(pos("t-short") < pos("t-narrow"));
    assert!(pos("t-narrow") < pos("t-too-narrow"));
    // Fitting ones first, then the rest.
    let fits: Vec<bool> = list.iter().map(|r| r["fits"].as_bool().unwrap()).collect();
    assert!(fits.windows(2).all(|w| w[0] || !w[1]), "{fits:?}");
}

/// The example that does not fit gets an answer: some bundled bobbin fits it, and the
/// exit code says so.
#[test]
fn fit_answers_the_salvaged_example() {
    let user = tempfile::tempdir().unwrap();
    let file = Path::new(env!("CARGO_MANIFEST_DIR")).join("examples/salvaged-too-small.toml");
    let out = Command::new(env!("CARGO_BIN_EXE_turnstack"))
        .arg("fit")
        .arg(&file)
        .env("TURNSTACK_BOBBINS", user.path())
        .output()
        .unwrap();
    assert_eq!(out.status.code(), Some(0));
    let text = String::from_utf8(out.stdout).unwrap();
    assert!(
        text.contains("(this build's)") && text.contains(" yes "),
        "{text}"
    );
    assert!(text.lines().all(|l| l.chars().count() <= 80), "{text}");
}
