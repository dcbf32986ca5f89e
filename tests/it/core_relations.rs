//! AL, effective permeability and the equivalent gap against the magnetic-circuit relations
//! (McLyman, Transformer and Inductor Design Handbook, 3rd ed. 2004, inductor design chapter,
//! from memory; the effective-permeability note of IEC 60205), with worked examples.

use std::process::Command;
use turnstack::engine::measured_core::{
    GapReading, Leg, al_nh, al_with_gap_nh, equivalent_gap_mm, le_from_path_mm, mu_e,
    mu_e_with_gap, read_gap,
};
use turnstack::files::parse_bobbin;

/// IEC 60205 note: mu_i = 3000, le = 100 mm, lg = 0.002 mm gives mu_e = 2830 (2830.19).
#[test]
fn effective_permeability_matches_the_iec_60205_note_example() {
    let m = mu_e_with_gap(3000.0, 100.0, 0.002);
    assert!((m - 2830.19).abs() < 0.01, "{m}");
    // And back: that mu_e is 0.002 mm of air in a 3000 material.
    assert!((equivalent_gap_mm(m, 3000.0, 100.0) - 0.002).abs() < 1e-12);
}

/// Magnetic circuit (McLyman, from memory): AL = mu0 Ae / (lg + le/mu_r). Ae 52 mm^2,
/// le 57.5 mm, mu_r 2000, lg 0.5 mm: 123.6 nH; ungapped 2273 nH (worked by hand).
#[test]
fn gapped_al_matches_the_magnetic_circuit_by_hand() {
    let al = al_with_gap_nh(52.0, 57.5, 2000.0, 0.5);
    assert!((al - 123.6).abs() < 0.05, "{al}");
    let ungapped = al_with_gap_nh(52.0, 57.5, 2000.0, 0.0);
    assert!((ungapped - 2273.0).abs() < 1.0, "{ungapped}");
}

/// Worked example: 20 turns on that gapped core read L = AL N^2 = 49.43 uH; from the reading,
/// AL = L / N^2, mu_e = AL le / (mu0 Ae) = 57.5 / (0.5 + 57.5/2000) = 108.8, and the
/// equivalent gap for mu_i 2000 comes back as the 0.5 mm put in.
#[test]
fn test_winding_recovers_the_gap_of_a_known_core() {
    let l_uh = al_with_gap_nh(52.0, 57.5, 2000.0, 0.5) * 400.0 / 1000.0;
    assert!((l_uh - 49.43).abs() < 0.01, "{l_uh}");
    let al = al_nh(l_uh, 20);
    let m = mu_e(al, 57.5, 52.0);
    assert!((m - 57.5 / (0.5 + 57.5 / 2000.0)).abs() < 1e-6, "{m}");
    let g = equivalent_gap_mm(m, 2000.0, 57.5);
    assert!((g - 0.5).abs() < 1e-9, "{g}");
    assert_eq!(read_gap(g), GapReading::Gapped);
}

/// Worked example of a salvaged E20-size pair (numbers worked by hand): centre leg 5.9 x 5.9
/// gives Ae 34.81 mm^2; 20 turns read 560 uH, so AL = 1400 nH; with le 46 mm, mu_e = 1472;
/// for a material of mu_i 2300 that is an equivalent gap of 0.0112 mm: more than clean
/// faces leave, so the faces want cleaning.
#[test]
fn salvaged_core_worked_example() {
    let ae = Leg::Rect {
        width_mm: 5.9,
        depth_mm: 5.9,
    }
    .area_mm2();
    assert!((ae - 34.81).abs() < 1e-9);
    let al = al_nh(560.0, 20);
    assert!((al - 1400.0).abs() < 1e-9);
    let m = mu_e(al, 46.0, ae);
    assert!((m - 1472.2).abs() < 0.1, "{m}");
    let g = equivalent_gap_mm(m, 2300.0, 46.0);
    assert!((g - 0.01125).abs() < 0.00001, "{g}");
    assert_eq!(read_gap(g), GapReading::Gapped);
    // Stating a lower mu_i than the core shows gives a negative gap: the reading says so.
    assert_eq!(
        read_gap(equivalent_gap_mm(m, 1000.0, 46.0)),
        GapReading::Negative
    );
}

/// Geometry: a round leg's area is pi d^2 / 4; the mean path estimate is the loop's perimeter.
#[test]
fn round_leg_area_and_path_estimate() {
    let a = Leg::Round { diameter_mm: 8.0 }.area_mm2();
    assert!((a - 50.265).abs() < 0.001);
    assert_eq!(le_from_path_mm(14.0, 8.0), 44.0);
}

/// `measure bobbin --save` writes a bobbin file that reads back, with the core figures, and
/// refuses to replace it without --force.
#[test]
fn measure_saves_a_bobbin_file_and_will_not_overwrite() {
    let dir = tempfile::tempdir().unwrap();
    let run = |extra: &[&str]| {
        Command::new(env!("CARGO_BIN_EXE_turnstack"))
            .args([
                "measure",
                "bobbin",
                "--id",
                "my-e20",
                "--window",
                "10.8x3.0",
                "--tube-rect",
                "7.1x7.1",
                "--corner",
                "0.5",
                "--leg-rect",
                "5.9x5.9",
                "--le",
                "46",
                "--turns",
                "20",
                "--inductance-uh",
                "560",
                "--mu-i",
                "2300",
                "--save",
            ])
            .args(extra)
            .env("TURNSTACK_BOBBINS", dir.path())
            .output()
            .unwrap()
    };
    let out = run(&[]);
    assert_eq!(
        out.status.code(),
        Some(0),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let stdout = String::from_utf8(out.stdout).unwrap();
    assert!(
        stdout.contains("dirty"),
        "the gap reading names dirty faces: {stdout}"
    );
    let path = dir.path().join("my-e20.toml");
    let b = parse_bobbin(&std::fs::read_to_string(&path).unwrap(), Some(&path)).unwrap();
    let core = b.core.unwrap();
    assert_eq!(core.ae_mm2, 34.81);
    assert_eq!(core.le_mm, 46.0);
    assert_eq!(core.al_nh, Some(1400.0));
    assert_eq!(b.window.width_mm, 10.8);
    let again = run(&[]);
    assert_eq!(again.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&again.stderr).contains("--force"));
    assert_eq!(run(&["--force"]).status.code(), Some(0));
}
