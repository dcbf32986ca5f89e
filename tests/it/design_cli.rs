//! `turnstack design` as a process: every design offered, written with `--out` and checked
//! again with `check --json`, meets every requirement (property test); an impossible switch
//! rating exits 1 and names it; a bad requirements file exits 2 at its line and column.

use proptest::prelude::*;
use std::path::Path;
use std::process::{Command, Output};

fn turnstack(args: &[&str]) -> Output {
    Command::new(env!("CARGO_BIN_EXE_turnstack"))
        .args(args)
        .env("TURNSTACK_BOBBINS", "/nonexistent-turnstack-test-dir")
        .output()
        .unwrap()
}

fn json(out: &Output) -> serde_json::Value {
    serde_json::from_slice(&out.stdout)
        .unwrap_or_else(|e| panic!("{e}: {}", String::from_utf8_lossy(&out.stdout)))
}

/// Generated requirements: one output, primary-side reset, one bobbin to keep a case short.
#[allow(clippy::too_many_arguments)]
fn requirements(
    bobbin: &str,
    vin_min: f64,
    span: f64,
    vout: f64,
    iout: f64,
    f_khz: f64,
    duty: f64,
    rating: f64,
) -> String {
    format!(
        "format = 1\ntitle = \"generated\"\nbobbins = [\"{bobbin}\"]\n\n[setup]\nfrequency_khz = {f_khz}\n\n\
         [operating]\nvin_min_v = {vin_min}\nvin_max_v = {}\nvout_v = {vout}\niout_a = {iout}\n\
         rectifier_drop_v = 0.5\nduty_limit = {duty}\nambient_c = 40\n\n\
         [material]\ngrade = \"mnzn-power-100c\"\n\n[switch]\nvoltage_rating_v = {rating}\nderating = 0.8\n",
        vin_min * span
    )
}

fn write(dir: &Path, name: &str, text: &str) -> String {
    let p = dir.join(name);
    std::fs::write(&p, text).unwrap();
    p.to_string_lossy().into_owned()
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 4, ..ProptestConfig::default() })]

    /// Every design offered, written as a build and checked again, fits, breaks no limit,
    /// keeps the off-state voltage within the derated rating and the reset duty limit over
    /// the controller's, and reproduces the listed loss, rise and spare height.
    #[test]
    fn every_design_offered_meets_every_requirement_when_checked_again(
        bobbin in prop::sample::select(vec!["e25-13-7", "etd29", "rm10"]),
        vin_min in 12.0f64..48.0,
        span in 1.1f64..1.6,
        vout in 3.3f64..15.0,
        iout in 0.5f64..3.0,
        f_khz in 60.0f64..200.0,
        duty in 0.35f64..0.5,
        headroom in 1.05f64..1.6,
    ) {
        let vin_max = vin_min * span;
        let rating = (vin_max / (1.0 - duty) / 0.8 * headroom).ceil();
        let dir = tempfile::tempdir().unwrap();
        let req = write(dir.path(), "req.toml", &requirements(bobbin, vin_min, span, vout, iout, f_khz, duty, rating));
        let listed = turnstack(&["design", &req, "--json"]);
        let code = listed.status.code();
        prop_assert!(code == Some(0) || code == Some(1), "{}", String::from_utf8_lossy(&listed.stderr));
        let designs = json(&listed)["designs"].as_array().unwrap().clone();
        prop_assert_eq!(designs.is_empty(), code == Some(1));
        for (k, d) in designs.iter().enumerate().take(1) {
            let out = dir.path().join(format!("d{k}.toml"));
            let out = out.to_string_lossy().into_owned();
            let w = turnstack(&["design", &req, "--out", &out, "--pick", &(k + 1).to_string()]);
            prop_assert_eq!(w.status.code(), Some(0), "{}", String::from_utf8_lossy(&w.stderr));
            let checked = turnstack(&["check", &out, "--json"]);
            prop_assert_eq!(checked.status.code(), Some(0), "{}", String::from_utf8_lossy(&checked.stdout));
            let c = json(&checked);
            prop_assert!(c["fits"].as_bool().unwrap());
            prop_assert!(c["failures"].as_array().unwrap().is_empty());
            for l in c["limits"].as_array().unwrap() {
                prop_assert!(!l["broken"].as_bool().unwrap(), "{l}");
            }
            let conv = &c["converter"];
            let vsw = conv["switch_voltage_v"].as_f64().unwrap();
            prop_assert!(vsw <= 0.8 * rating + 1e-9, "{vsw} V against {}", 0.8 * rating);
            prop_assert!(conv["reset_duty_limit"].as_f64().unwrap() >= duty - 1e-12);
            let rise = c["losses"]["temperature_rise_c"].as_f64().unwrap();
            prop_assert!(rise <= c["losses"]["rise_limit_c"].as_f64().unwrap());
            let same = |a: f64, b: f64| (a - b).abs() <= 1e-6 * b.abs().max(1e-3);
            prop_assert!(same(c["losses"]["total_loss_w"].as_f64().unwrap(), d["total_loss_w"].as_f64().unwrap()));
            prop_assert!(same(rise, d["temperature_rise_c"].as_f64().unwrap()));
            prop_assert!(same(c["spare_height_mm"].as_f64().unwrap(), d["spare_height_mm"].as_f64().unwrap()));
            prop_assert!(same(vsw, d["switch_voltage_v"].as_f64().unwrap()));
            let windings = c["windings"].as_array().unwrap();
            for (name, turns) in d["turns"].as_object().unwrap() {
                let w = windings.iter().find(|w| w["name"] == name.as_str()).unwrap();
                prop_assert_eq!(&w["turns"], turns);
            }
        }
    }
}

/// The example: at a duty limit of 0.5 the off-state voltage is at least twice the
/// highest input, 2 x 40 V = 80 V (common practice), over the 48 V a 60 V switch allows at
/// 0.8 derating, by 32 V: exit 1, and the sentence names the rating and the figures.
#[test]
fn a_switch_rated_below_what_the_duty_limit_forces_exits_1_and_names_the_rating() {
    let dir = tempfile::tempdir().unwrap();
    let text = requirements("e25-13-7", 30.0, 40.0 / 30.0, 5.0, 2.0, 100.0, 0.5, 60.0);
    let req = write(dir.path(), "req.toml", &text);
    let out = turnstack(&["design", &req]);
    assert_eq!(out.status.code(), Some(1));
    let s = String::from_utf8_lossy(&out.stdout)
        .replace('\n', " ")
        .replace("   ", " ");
    let s = s.split_whitespace().collect::<Vec<_>>().join(" ");
    for part in [
        "twice the highest input",
        "2 x 40 V = 80 V",
        "60 V switch",
        "0.8 derating (48 V)",
        "by 32 V",
    ] {
        assert!(s.contains(part), "{part:?} in {s}");
    }
    let j = json(&turnstack(&["design", &req, "--json"]));
    assert!(j["designs"].as_array().unwrap().is_empty());
    assert!(j["binding"].as_str().unwrap().contains("60 V switch"));
}

/// A derating over 1 is refused at its line and column, exit 2.
#[test]
fn a_bad_derating_is_refused_at_its_line_and_column() {
    let dir = tempfile::tempdir().unwrap();
    let text = requirements("e25-13-7", 20.0, 1.4, 5.0, 2.0, 100.0, 0.45, 100.0)
        .replace("derating = 0.8", "derating = 1.5");
    let req = write(dir.path(), "req.toml", &text);
    let out = turnstack(&["design", &req]);
    assert_eq!(out.status.code(), Some(2));
    let line = text
        .lines()
        .position(|l| l.starts_with("derating"))
        .unwrap()
        + 1;
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(
        err.contains(&format!("req.toml:{line}:12: switch.derating")),
        "{err}"
    );
}

/// An unknown bobbin id in `bobbins` is refused at its place, exit 2.
#[test]
fn an_unknown_bobbin_id_is_refused_at_its_place() {
    let dir = tempfile::tempdir().unwrap();
    let text = requirements("no-such-bobbin", 20.0, 1.4, 5.0, 2.0, 100.0, 0.45, 100.0);
    let req = write(dir.path(), "req.toml", &text);
    let out = turnstack(&["design", &req]);
    assert_eq!(out.status.code(), Some(2));
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(
        err.contains("req.toml:3:12: bobbins: unknown bobbin \"no-such-bobbin\""),
        "{err}"
    );
}

/// `--out` never replaces an existing file without `--force`.
#[test]
fn design_out_refuses_an_existing_file_without_force() {
    let dir = tempfile::tempdir().unwrap();
    let text = requirements("rm10", 20.0, 1.4, 5.0, 2.0, 100.0, 0.45, 100.0);
    let req = write(dir.path(), "req.toml", &text);
    let out = write(dir.path(), "mine.toml", "# keep me\n");
    let r = turnstack(&["design", &req, "--out", &out]);
    assert_eq!(r.status.code(), Some(2));
    assert_eq!(std::fs::read_to_string(&out).unwrap(), "# keep me\n");
}

/// Ctrl-C during a design stops it cleanly: exit 130 (128 + SIGINT, as a shell reports an
/// interrupted program: common practice), a sentence on stderr, nothing on stdout and no
/// `--out` file written.
#[cfg(unix)]
#[test]
fn ctrl_c_stops_a_design_and_writes_nothing() {
    let dir = tempfile::tempdir().unwrap();
    let out = dir.path().join("picked.toml");
    // Sixteen more copies of every bundled bobbin, so that the design is still running when
    // the signal comes however fast the machine (the bundled library alone takes under a
    // second even in a test build).
    let many = dir.path().join("many");
    std::fs::create_dir(&many).unwrap();
    for entry in std::fs::read_dir("bobbins").unwrap() {
        let path = entry.unwrap().path();
        if path.extension().is_some_and(|e| e == "toml") {
            let stem = path.file_stem().unwrap().to_string_lossy().into_owned();
            for k in 0..16 {
                std::fs::copy(&path, many.join(format!("copy{k}-{stem}.toml"))).unwrap();
            }
        }
    }
    let child = Command::new(env!("CARGO_BIN_EXE_turnstack"))
        .args([
            "design",
            "examples/requirements/bench-supply-5v.toml",
            "--out",
        ])
        .arg(&out)
        .args(["--pick", "1", "--bobbins"])
        .arg(&many)
        .env("TURNSTACK_BOBBINS", "/nonexistent-turnstack-test-dir")
        .stdout(std::process::Stdio::piped())
        .stderr(std::process::Stdio::piped())
        .spawn()
        .unwrap();
    // The handler is the first thing the command sets up, a millisecond or two in.
    std::thread::sleep(std::time::Duration::from_millis(1000));
    let killed = Command::new("kill")
        .args(["-INT", &child.id().to_string()])
        .status()
        .unwrap();
    assert!(killed.success());
    let got = child.wait_with_output().unwrap();
    let stderr = String::from_utf8_lossy(&got.stderr);
    assert_eq!(got.status.code(), Some(130), "stderr: {stderr}");
    assert!(stderr.contains("Ctrl-C"), "{stderr}");
    assert!(
        got.stdout.is_empty(),
        "{}",
        String::from_utf8_lossy(&got.stdout)
    );
    assert!(!out.exists(), "nothing is written after Ctrl-C");
}
