//! The reset-ratio sweep against hand-worked relations of the single-switch forward
//! converter (primary-side reset: D_max = Np/(Np+Nr), V_off = Vin(1 + Np/Nr); reset to the
//! output: D_max = Np Vo'/(Np Vo' + Nr Vin), V_off = Vin + Vo' Np/Nr; common practice).

use turnstack::engine::reset_sweep::{ResetInputs, ResetLimit, reset_sweep, sweep};
use turnstack::model::ResetSide;

fn inputs(side: ResetSide, nr: u32, duty: Option<f64>, rating: Option<f64>) -> ResetInputs {
    ResetInputs {
        reset_side: side,
        vin_max_v: 28.0,
        vo_v: 5.5,
        np: 24,
        ns: 16,
        nr,
        duty_limit: duty,
        switch_rating_v: rating,
        derating: 1.0,
    }
}

/// Equal primary and reset turns, primary-side reset: 50 % and twice the input (common
/// practice).
#[test]
fn equal_turns_give_half_duty_and_twice_the_input_common_practice() {
    let s = sweep(inputs(ResetSide::Primary, 24, Some(0.45), Some(100.0)));
    assert!((s.current.reset_duty_limit - 0.5).abs() < 1e-12);
    assert!((s.current.switch_voltage_v - 56.0).abs() < 1e-9);
}

/// Hand-worked: Nr <= 24 x 0.55 / 0.45 = 29.3 and Nr >= 24 x 28 / (100 - 28) = 9.33, so
/// 10..29; at Nr = 24 the duty has 0.5/0.45 - 1 = 11 % room, the switch 1 - 56/100 = 44 %.
#[test]
fn primary_side_range_and_binding_worked_by_hand() {
    let s = sweep(inputs(ResetSide::Primary, 24, Some(0.45), Some(100.0)));
    assert_eq!(s.allowed, Some((10, Some(29))));
    assert_eq!(s.binding, Some(ResetLimit::Duty));
    assert!((s.duty_room.unwrap() - 0.1111).abs() < 1e-3);
    assert!((s.voltage_room.unwrap() - 0.44).abs() < 1e-9);
    // The sweep spans Np/4 = 6 to 3 Np = 72.
    assert_eq!(s.points.first().map(|p| p.nr), Some(6));
    assert_eq!(s.points.last().map(|p| p.nr), Some(72));
    // Below the range the switch binds: at Nr = 8, 28 x (1 + 3) = 112 V > 100 V.
    let low = sweep(inputs(ResetSide::Primary, 8, Some(0.45), Some(100.0)));
    assert_eq!(low.binding, Some(ResetLimit::SwitchVoltage));
    assert!((low.current.switch_voltage_v - 112.0).abs() < 1e-9);
    assert!(low.voltage_room.unwrap() < 0.0);
}

/// Reset to the output, worked by hand: Nr <= 24 x 5.5 x 0.55 / (0.45 x 28) = 5.76 and
/// Nr >= 5.5 x 24 / (100 - 28) = 1.83, so 2..5; at Nr = 5, D = 132/272 = 0.4853 and
/// V = 28 + 132/5 = 54.4 V.
#[test]
fn secondary_side_range_worked_by_hand() {
    let s = sweep(inputs(ResetSide::Secondary, 5, Some(0.45), Some(100.0)));
    assert_eq!(s.allowed, Some((2, Some(5))));
    assert!((s.current.reset_duty_limit - 132.0 / 272.0).abs() < 1e-12);
    assert!((s.current.switch_voltage_v - 54.4).abs() < 1e-9);
}

/// A 50 % duty limit needs Nr <= Np, which puts at least 2 x 28 = 56 V on the switch: a
/// 50 V rating leaves no reset ratio.
#[test]
fn a_rating_below_what_the_duty_forces_leaves_no_range() {
    let s = sweep(inputs(ResetSide::Primary, 24, Some(0.5), Some(50.0)));
    assert_eq!(s.allowed, None);
    // Without a rating only the duty bounds Nr; without either, nothing binds.
    let s = sweep(inputs(ResetSide::Primary, 24, Some(0.5), None));
    assert_eq!(s.allowed, Some((1, Some(24))));
    let s = sweep(inputs(ResetSide::Primary, 24, None, None));
    assert_eq!(s.allowed, Some((1, None)));
    assert_eq!(s.binding, None);
}

/// The sweep at the build's own Nr gives the evaluation's figures, and a build without an
/// operating point has no sweep.
#[test]
fn the_sweep_at_the_builds_nr_is_the_evaluations() {
    let path = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("examples/bench-forward.toml");
    let mut b = turnstack::files::load_build(&path).unwrap();
    let e = turnstack::engine::evaluate(&b);
    let c = e.converter.as_ref().unwrap();
    let s = reset_sweep(&b).unwrap();
    assert_eq!(s.current.reset_duty_limit, c.reset_duty_limit);
    assert_eq!(s.current.switch_voltage_v, c.switch_voltage_v);
    b.operating = None;
    assert!(reset_sweep(&b).is_none());
}

/// A search whose cancel flag is already set returns `Cancelled` before trying anything, and
/// the build it was given is unchanged; with the flag clear the same search finds candidates.
#[test]
fn a_cancelled_search_returns_promptly_and_leaves_the_build() {
    use std::sync::atomic::AtomicBool;
    use turnstack::engine::search::{SearchError, Settings, search_cancellable};
    let b = turnstack::files::demo_build().unwrap();
    let before = b.clone();
    let settings = Settings::default();
    let r = search_cancellable(&b, &settings, &|_, _| {}, &AtomicBool::new(true));
    // Promptly: not one combination was evaluated (counted, not timed).
    assert!(
        matches!(r, Err(SearchError::Cancelled { tried: 0, .. })),
        "{r:?}"
    );
    assert_eq!(b, before);
    let r = search_cancellable(&b, &settings, &|_, _| {}, &AtomicBool::new(false));
    assert!(!r.unwrap().candidates.is_empty());
}

/// The HTML sheet's design section: two charts and the sentence, for the bench example
/// (no switch rating; duty limit 0.45 so Nr <= 24 x 0.55 / 0.45 = 29.3, by hand); none for a
/// build without an operating point.
#[test]
fn the_html_sheet_has_the_reset_ratio_section() {
    use turnstack::report::sheet::{html, sheet, svg};
    let path = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("examples/bench-forward.toml");
    let mut b = turnstack::files::load_build(&path).unwrap();
    let page = |b: &turnstack::model::Build| {
        let e = turnstack::engine::evaluate(b);
        let (scale, drawing) = svg::cross_section(b, &e);
        html::render(&sheet(b, &e, 20.0), &drawing, scale)
    };
    let p = page(&b);
    assert!(p.contains("<h2>Design: the reset ratio</h2>"));
    assert_eq!(p.matches("<svg class=\"reset\"").count(), 2);
    assert!(
        p.contains("controller&#39;s duty limit binds; Nr 1 to 29 meets both"),
        "{p}"
    );
    b.operating = None;
    assert!(!page(&b).contains("Design: the reset ratio"));
}
