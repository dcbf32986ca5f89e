//! The example builds through `check`: every one shows the reset limit, the switch voltage,
//! the flux swing against saturation (where the core is known), the losses, the temperature
//! rise and the binding constraint; the figures match the hand working in each file.

use std::path::Path;
use turnstack::engine;
use turnstack::files::load_build;
use turnstack::report::{json, text};

fn example(name: &str) -> (turnstack::model::Build, engine::Evaluation) {
    let path = Path::new(env!("CARGO_MANIFEST_DIR"))
        .join("examples")
        .join(name);
    let b = load_build(&path).expect("example loads");
    let e = engine::evaluate(&b);
    (b, e)
}

/// Every example's report names the converter figures and the binding constraint, in 80
/// columns.
#[test]
fn every_example_shows_the_converter_figures_and_the_binding_constraint() {
    for name in [
        "bench-forward.toml",
        "mains-isolated.toml",
        "salvaged-too-small.toml",
    ] {
        let (b, e) = example(name);
        let report = text::render(&b, &e);
        for needle in [
            "reset duty limit",
            "switch off-state",
            "Losses and temperature rise",
            "What limits the design (binding first)",
        ] {
            assert!(report.contains(needle), "{name}: no {needle:?}\n{report}");
        }
        assert!(
            report
                .lines()
                .any(|l| l.ends_with("binding") || l.ends_with("BROKEN")),
            "{name}"
        );
        for l in report.lines() {
            assert!(
                unicode_width::UnicodeWidthStr::width(l) <= 80,
                "{name}: {l}"
            );
        }
        let j = json::report(&b, &e).to_value();
        assert!(j["converter"]["reset_duty_limit"].is_number(), "{name}");
        assert!(j["limits"][0]["constraint"].is_string(), "{name}");
        assert!(j["losses"]["copper_loss_w"].is_number(), "{name}");
    }
}

/// bench-forward's hand working: reset limit 0.50, 56 V, worst swing 28 x 0.45 /
/// (100e3 x 24 x 52e-6) = 101 mT of 280 mT; the core loss by the iGSE (Venkatachalam et al.
/// 2002) for the forward's trapezoid-free flux, evaluated here with the integral done
/// numerically; and McLyman's rise 450 (P / A_t)^0.826 over A_t = 33.8 sqrt(Wa Ae).
#[test]
fn bench_forward_figures_are_the_hand_worked_ones() {
    let (_, e) = example("bench-forward.toml");
    let c = e.converter.as_ref().unwrap();
    assert!((c.reset_duty_limit - 0.5).abs() < 1e-12);
    assert!((c.switch_voltage_v - 56.0).abs() < 1e-9);
    assert!((c.flux_swing_worst_mt.unwrap() - 100.96).abs() < 0.01);
    let l = e.losses.as_ref().unwrap();
    // iGSE at vin_max 28 V: D = Vo' Np / (Ns Vin) = 5.5 x 24 / (16 x 28); the swing
    // 28 D / (f Np Ae) T; the reset (Nr = Np) takes as long as the on-time.
    // k = 40, alpha 1.4, beta 2.6 (the file's [material]), f in kHz, B in T, P in kW/m^3.
    let (k, a, b) = (40.0f64, 1.4f64, 2.6f64);
    let d: f64 = 5.5 * 24.0 / (16.0 * 28.0);
    let swing_t: f64 = 28.0 * d / (100e3 * 24.0 * 52e-6);
    let n = 20_000;
    let integral: f64 = (0..n)
        .map(|i| {
            let t = (i as f64 + 0.5) / n as f64 * 2.0 * std::f64::consts::PI;
            t.cos().abs().powf(a)
        })
        .sum::<f64>()
        * 2.0
        * std::f64::consts::PI
        / n as f64;
    let ki = k / ((2.0 * std::f64::consts::PI).powf(a - 1.0) * 2f64.powf(b - a) * integral);
    let p_kw_m3 = ki * swing_t.powf(b) * 100f64.powf(a) * (2.0 * d.powf(1.0 - a));
    let core_w = p_kw_m3 * 2990.0 * 1e-6;
    assert!(
        (l.core_loss_w.unwrap() - core_w).abs() / core_w < 1e-4,
        "{} vs {core_w}",
        l.core_loss_w.unwrap()
    );
    // Surface: Wa = 15.2 x 4.0 mm^2, Ae = 52 mm^2: Ap = 0.6080 x 0.52 cm^4.
    let area = 33.8 * (0.608f64 * 0.52).sqrt();
    assert!((l.surface_area_cm2.unwrap() - area).abs() / area < 1e-9);
    let rise = 450.0 * (l.total_loss_w / area).powf(0.826);
    assert!((l.temperature_rise_c.unwrap() - rise).abs() / rise < 1e-9);
    // The given currents and the operating point's agree to a few per cent.
    for w in &e.windings[..2] {
        let (given, model) = (w.current_rms_a.unwrap(), w.current_model_rms_a.unwrap());
        assert!(
            (given - model).abs() / model < 0.05,
            "{}: {given} vs {model}",
            w.name
        );
    }
}

/// The salvaged bobbin has no core figures: the report says what is missing rather than
/// inventing flux or temperature, and the fit is among the broken constraints.
#[test]
fn salvaged_example_says_what_is_missing() {
    let (b, e) = example("salvaged-too-small.toml");
    assert!(e.converter.as_ref().unwrap().flux_swing_worst_mt.is_none());
    assert!(e.losses.as_ref().unwrap().temperature_rise_c.is_none());
    assert!(
        e.notes
            .iter()
            .any(|n| n.to_string().contains("no [core] data"))
    );
    assert!(
        e.limits
            .iter()
            .any(|l| l.constraint == engine::Constraint::Fit && l.broken())
    );
    assert!(text::render(&b, &e).contains("no [core] data"));
}
