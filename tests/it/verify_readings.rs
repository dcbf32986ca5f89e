//! Bench readings against the plan (`engine::verify`): the effective gap a low magnetising
//! inductance implies (the magnetic-circuit relation, mu_e per IEC 60205), resistance corrected
//! to the reading temperature (IEC 60028, 0.00393/K), a part wound with one turn missing, a
//! clean part, and the `[measured]` table's loading and saving.

use crate::common::{assert_rel, eval, parse};
use std::f64::consts::PI;
use turnstack::engine::evaluate;
use turnstack::engine::verify::{Finding, Quantity, ReadingCheck, Verification, verify};
use turnstack::files::{self, BobbinLibrary};
use turnstack::model::WireSize;

/// mu0 in H/m (SI, the pre-2019 exact value; the 2019 value differs by 1e-10).
const MU0: f64 = 4e-7 * PI;
/// Resistivity of annealed copper at 20 C, ohm mm^2 / m: 1/58 (IEC 60028).
const RHO20: f64 = 1.0 / 58.0;
/// Temperature coefficient of copper at 20 C, per kelvin (IEC 60028).
const ALPHA: f64 = 0.00393;

/// P 24 turns of 0.63 mm, S 16 turns of 0.50 mm on the bundled E25 size bobbin (core:
/// Ae 52 mm^2, le 57.5 mm, AL 2160 nH), resistances planned at 100 C, a ferrite of mu_i 2300.
const PLAN: &str = r#"
format = 1
title = "verify test part"
bobbin = "e25-13-7"

[setup]
temperature_c = 100

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

[[stack]]
tape = 2

[material]
bsat_mt = 380
br_mt = 100
mu_i = 2300
"#;

const AE_MM2: f64 = 52.0;
const LE_MM: f64 = 57.5;
const AL_NH: f64 = 2160.0;
const MU_I: f64 = 2300.0;
const NP: f64 = 24.0;

fn with_readings(readings: &str) -> Verification {
    let (b, e) = eval(&format!("{PLAN}\n[measured]\n{readings}\n"));
    verify(&b, &e).expect("the build has a [measured] table")
}

fn check<'a>(v: &'a Verification, q: &Quantity) -> &'a ReadingCheck {
    v.checks
        .iter()
        .find(|c| c.quantity == *q)
        .unwrap_or_else(|| panic!("no check of {q:?} in {v:#?}"))
}

fn dcr(w: &str) -> Quantity {
    Quantity::Dcr { winding: w.into() }
}

fn ratio(w: &str) -> Quantity {
    Quantity::Ratio {
        winding: w.into(),
        primary: "P".into(),
    }
}

fn magnetising() -> Quantity {
    Quantity::Magnetising {
        primary: "P".into(),
    }
}

/// Winding lengths (m) of the plan, the layout's own figure (checked in layout_cases).
fn lengths() -> (f64, f64) {
    let (_, e) = eval(PLAN);
    (e.windings[0].length_m, e.windings[1].length_m)
}

/// R = rho(T) L / A for a round wire, by hand from IEC 60028.
fn r_hand(bare_mm: f64, length_m: f64, t_c: f64) -> f64 {
    RHO20 * (1.0 + ALPHA * (t_c - 20.0)) * length_m / (PI * bare_mm * bare_mm / 4.0)
}

#[test]
fn gap_from_a_low_magnetising_inductance_by_the_magnetic_circuit() {
    // Measured 905 uH at the 24-turn primary of an ungapped core planned at AL 2160 nH.
    let v = with_readings("magnetising_uh = 905.0");
    let c = check(&v, &magnetising());
    // Planned L = AL Np^2 = 2160 nH x 576 = 1244.16 uH; the band +/-25 % of AL (common practice).
    let p = c.prediction.as_ref().unwrap();
    assert_rel(p.expected, 1244.16, 1e-9, "L = AL Np^2");
    assert_eq!(
        c.within(),
        Some(false),
        "905 uH is under 0.75 x 1244 = 933 uH"
    );
    // By hand: AL = L / N^2 = 905e-6 / 576 = 1.57118e-6 H; mu_e = AL le / (mu0 Ae) (IEC 60205)
    // = 1.57118e-6 x 0.0575 / (1.25664e-6 x 52e-6) = 1382.6; the whole gap
    // l_g = le (1/mu_e - 1/mu_i) = 57.5 mm x (1/1382.6 - 1/2300) = 0.01659 mm.
    let al_h = 905e-6 / (NP * NP);
    let mu_e = al_h * (LE_MM * 1e-3) / (MU0 * AE_MM2 * 1e-6);
    assert_rel(mu_e, 1382.6, 2e-4, "hand mu_e");
    let total_gap_mm = LE_MM * (1.0 / mu_e - 1.0 / MU_I);
    assert_rel(total_gap_mm, 0.01659, 1e-3, "hand l_g");
    // The gap added to the planned circuit: reluctances in series, g = mu0 Ae (1/AL - 1/AL0)
    // = 1.25664e-6 x 52e-6 x (1/1.57118e-6 - 1/2.160e-6) = 11.34 um.
    let extra_mm = MU0 * AE_MM2 * 1e-6 * (1.0 / al_h - 1.0 / (AL_NH * 1e-9)) * 1e3;
    assert_rel(extra_mm, 0.01134, 1e-3, "hand extra gap");
    match &c.findings[..] {
        [
            Finding::GapLarger {
                al_nh,
                mu_e: got_mu_e,
                extra_gap_mm,
                total_gap_mm: Some(got_total),
                ungapped,
            },
        ] => {
            assert_rel(*al_nh, al_h * 1e9, 1e-9, "AL from the reading");
            assert_rel(*got_mu_e, mu_e, 1e-6, "mu_e, IEC 60205");
            assert_rel(*got_total, total_gap_mm, 1e-6, "l_g = le (1/mu_e - 1/mu_i)");
            assert_rel(*extra_gap_mm, extra_mm, 1e-6, "gap beyond the plan");
            assert!(*ungapped, "no gap planned: the faces need cleaning");
        }
        other => panic!("expected one GapLarger finding, got {other:?}"),
    }
    let words = turnstack::report::verify::finding_words(&c.findings[0]);
    assert!(words.contains("mating faces need cleaning"), "{words}");
}

#[test]
fn a_high_inductance_says_al_is_above_the_figure_used() {
    // 1.4 x the plan: more than the +25 % of AL's spread.
    let v = with_readings("magnetising_uh = 1742.0");
    let c = check(&v, &magnetising());
    assert_eq!(c.within(), Some(false));
    assert!(matches!(
        c.findings[..],
        [Finding::AlHigher { gapped: false, .. }]
    ));
}

#[test]
fn resistance_is_corrected_to_the_reading_temperature() {
    // The plan states resistances at 100 C; the part is read at 22 C.
    let (lp, ls) = lengths();
    let v = with_readings("reading_c = 22.0\ndcr_ohm = { P = 0.05, S = 0.02 }");
    // IEC 60028: R(22) / R(100) = (1 + 0.00393 x 2) / (1 + 0.00393 x 80) = 1.00786 / 1.3144
    // = 0.766798.
    let (_, e) = eval(PLAN);
    for (name, len, bare, planned) in [
        ("P", lp, 0.63, e.windings[0].dcr_ohm),
        ("S", ls, 0.50, e.windings[1].dcr_ohm),
    ] {
        let p = check(&v, &dcr(name)).prediction.clone().unwrap();
        assert_rel(
            p.expected / planned,
            1.00786 / 1.3144,
            1e-5,
            "IEC 60028 ratio",
        );
        // And from the resistivity by hand: rho20 = 1/58 ohm mm^2/m, x (1 + 0.00393 x 2).
        assert_rel(p.expected, r_hand(bare, len, 22.0), 1e-3, "rho(22) L / A");
        // Tolerance +/-10 % (IEC 60317 diameter tolerance and the length estimate).
        assert_rel(p.low, 0.9 * p.expected, 1e-12, "low end");
        assert_rel(p.high, 1.1 * p.expected, 1e-12, "high end");
    }
    assert_eq!(v.reading_c, 22.0);
    assert!(!v.reading_c_assumed);
}

#[test]
fn a_resistance_a_wire_size_off_names_the_size() {
    // S wound with 0.45 mm instead of 0.50 mm: R scales as (0.50/0.45)^2 = 1.2346, read at 20 C.
    let (_, ls) = lengths();
    let r = r_hand(0.45, ls, 20.0);
    let v = with_readings(&format!("reading_c = 20.0\ndcr_ohm = {{ S = {r} }}"));
    let c = check(&v, &dcr("S"));
    assert_eq!(c.within(), Some(false), "{c:?}");
    match &c.findings[..] {
        [
            Finding::ResistanceOff {
                factor,
                implied_bare_mm,
                likely_wire,
                ..
            },
        ] => {
            assert_rel(
                *factor,
                (0.50f64 / 0.45).powi(2),
                2e-3,
                "measured / expected",
            );
            assert_rel(*implied_bare_mm, 0.45, 1e-3, "diameter from R per metre");
            assert_eq!(*likely_wire, Some(WireSize::Metric { bare_mm: 0.45 }));
        }
        other => panic!("expected ResistanceOff, got {other:?}"),
    }
}

#[test]
fn a_resistance_off_by_length_says_the_length() {
    // 17 % more resistance on P with no metric size near 0.63 / sqrt(1.17) = 0.582 mm
    // (the nearest row, 0.56 mm, lies 3.8 % away; the match needs 3 %): the length is off.
    let (lp, _) = lengths();
    let r = 1.17 * r_hand(0.63, lp, 20.0);
    let v = with_readings(&format!("reading_c = 20.0\ndcr_ohm = {{ P = {r} }}"));
    let c = check(&v, &dcr("P"));
    assert_eq!(c.within(), Some(false));
    match &c.findings[..] {
        [
            Finding::ResistanceOff {
                likely_wire: None,
                implied_length_m,
                ..
            },
        ] => assert_rel(*implied_length_m, 1.17 * lp, 2e-3, "length implied"),
        other => panic!("expected ResistanceOff by length, got {other:?}"),
    }
}

/// What the part wound with `np` and `ns` turns reads (computed here from the turns, not from
/// the program): the ratio Ns/Np of the ideal transformer, AL Np^2, and R = rho L / A at
/// 20 C with each winding's length scaled by its turns (the mean turn is the plan's: one
/// turn fewer leaves both windings in their single layer).
fn part_readings(np: u32, ns: u32) -> String {
    let (lp, ls) = lengths();
    let rp = r_hand(0.63, lp * f64::from(np) / 24.0, 20.0);
    let rs = r_hand(0.50, ls * f64::from(ns) / 16.0, 20.0);
    let l = AL_NH * f64::from(np * np) * 1e-3;
    format!(
        "reading_c = 20.0\ndcr_ohm = {{ P = {rp}, S = {rs} }}\nmagnetising_uh = {l}\n\
         ratio = {{ S = {} }}",
        f64::from(ns) / f64::from(np)
    )
}

#[test]
fn one_turn_missing_on_the_secondary_is_flagged_with_that_winding() {
    let v = with_readings(&part_readings(24, 15));
    let c = check(&v, &ratio("S"));
    // 15/24 = 0.625 against 16/24 = 0.6667: 6.25 % off; the band is 0.4 of one turn of the
    // larger winding, 0.4/24 = 1.67 %.
    assert_eq!(c.within(), Some(false));
    assert_eq!(
        c.findings,
        vec![Finding::TurnsOff {
            winding: "S".into(),
            planned: 16,
            likely: 15
        }]
    );
    assert!(!v.all_within());
    let off: Vec<_> = v.out_of_tolerance().map(|c| c.quantity.clone()).collect();
    assert_eq!(off, vec![ratio("S")], "only the ratio shows one turn of 16");
    let words = turnstack::report::verify::finding_words(&c.findings[0]);
    assert!(
        words.contains("S most likely has 15 turns, 1 turn fewer"),
        "{words}"
    );
}

#[test]
fn one_turn_extra_on_the_primary_points_at_the_primary() {
    let v = with_readings(&part_readings(25, 16));
    let c = check(&v, &ratio("S"));
    assert_eq!(c.within(), Some(false));
    assert_eq!(
        c.findings,
        vec![Finding::TurnsOff {
            winding: "P".into(),
            planned: 24,
            likely: 25
        }]
    );
}

#[test]
fn a_clean_part_passes() {
    let v = with_readings(&part_readings(24, 16));
    assert!(v.all_within(), "{v:#?}");
    assert_eq!(v.checks.len(), 4);
    assert!(v.checks.iter().all(|c| c.within() == Some(true)));
    assert!(v.checks.iter().all(|c| c.findings.is_empty()));
}

#[test]
fn leakage_gives_the_measured_to_estimated_factor() {
    let (_, e) = eval(PLAN);
    let est = e.leakage.iter().find(|l| l.to == "S").unwrap().uh;
    let v = with_readings(&format!("leakage_uh = {}", 1.2 * est));
    let c = check(
        &v,
        &Quantity::Leakage {
            primary: "P".into(),
            secondary: "S".into(),
        },
    );
    assert_eq!(c.within(), Some(true));
    match c.findings[..] {
        [Finding::LeakageFactor { factor }] => assert_rel(factor, 1.2, 1e-9, "factor"),
        _ => panic!("{c:?}"),
    }
    // Twice the estimate is out of the -30 % / +50 % band.
    let v = with_readings(&format!("leakage_uh = {}", 2.0 * est));
    assert!(!v.all_within());
}

fn load_err(readings: &str) -> files::LoadError {
    files::parse_build(
        &format!("{PLAN}\n[measured]\n{readings}\n"),
        None,
        &BobbinLibrary::bundled_only(),
    )
    .expect_err("refused")
}

#[test]
fn the_table_refuses_unknown_windings_and_bad_values_with_their_line() {
    let lines_before = PLAN.lines().count() + 2;
    let e = load_err("dcr_ohm = { P = 0.05, Q = 0.02 }");
    assert!(
        e.message
            .contains("unknown winding \"Q\"; the windings are P, S"),
        "{e}"
    );
    assert_eq!(e.line, Some(lines_before + 1), "{e}");
    assert_eq!(e.key.as_deref(), Some("measured.dcr_ohm.Q"));
    let e = load_err("magnetising_uh = -3.0");
    assert!(e.message.contains("above 0"), "{e}");
    let e = load_err("ratio = { P = 1.0 }");
    assert!(e.message.contains("first primary"), "{e}");
    let e = load_err("magnetising_uh = 5.0\nleakage_uh = 900.0");
    assert!(e.message.contains("swapped"), "{e}");
    let e = load_err("volts = 3.0");
    assert!(e.message.contains("volts"), "{e}");
    let e = load_err("reading_c = 500.0");
    assert!(e.message.contains("between -40 and 200 C"), "{e}");
}

#[test]
fn save_keeps_the_table() {
    let text = format!(
        "{PLAN}\n[measured]\nreading_c = 21.5\nfrequency_khz = 10.0\n\
         dcr_ohm = {{ S = 0.02, P = 0.05 }}\nmagnetising_uh = 1200.0\nleakage_uh = 0.6\n\
         ratio = {{ S = 0.667 }}\nhipot = \"1.5 kV 60 s, no breakdown\"\nnote = \"first part\"\n"
    );
    let b = parse(&text);
    let saved = files::build_to_toml(&b);
    let again = parse(&saved);
    assert_eq!(again.measured, b.measured, "{saved}");
    let m = again.measured.as_ref().unwrap();
    assert_eq!(m.dcr_ohm[0].0.as_str(), "P", "in the build's winding order");
    assert_eq!(m.hipot.as_deref(), Some("1.5 kV 60 s, no breakdown"));
    // A build without the table saves none.
    assert!(!files::build_to_toml(&parse(PLAN)).contains("[measured]"));
    let _ = evaluate(&again);
}

#[test]
fn readings_do_not_change_the_build_id() {
    // The sheet's id names the plan; the bench readings of a part wound from it leave it be.
    let with = parse(&format!("{PLAN}\n[measured]\nmagnetising_uh = 1200.0\n"));
    let without = parse(PLAN);
    assert_eq!(
        turnstack::report::sheet::build_id(&with),
        turnstack::report::sheet::build_id(&without)
    );
}

#[test]
fn one_turn_either_way_on_either_winding_always_leaves_the_ratio_band() {
    // Band +/- 0.4/max(Np, Nw); one turn moves Nw/Np by at least 1/(max + 1) relative, which
    // is over 0.4/max for every max >= 1.
    use turnstack::engine::verify::ratio_tolerance;
    for np in 1..=120u32 {
        for nw in 1..=120u32 {
            let planned = f64::from(nw) / f64::from(np);
            let band = ratio_tolerance(np, nw);
            for (p, w) in [(np + 1, nw), (np - 1, nw), (np, nw + 1), (np, nw - 1)] {
                if p == 0 || w == 0 {
                    continue;
                }
                let off = (f64::from(w) / f64::from(p) / planned - 1.0).abs();
                assert!(
                    off > band,
                    "Np {np} Nw {nw} -> {p}/{w}: {off} within {band}"
                );
            }
        }
    }
}
