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
/// (100e3 x 24 x 52e-6) = 101 mT of 280 mT; and, as an engineer expects of a 20 W part on an
/// E25 size core at 100 kHz, a core loss of a few tens of mW and a rise of tens of C.
#[test]
fn bench_forward_figures_are_the_hand_worked_ones() {
    let (_, e) = example("bench-forward.toml");
    let c = e.converter.as_ref().unwrap();
    assert!((c.reset_duty_limit - 0.5).abs() < 1e-12);
    assert!((c.switch_voltage_v - 56.0).abs() < 1e-9);
    assert!((c.flux_swing_worst_mt.unwrap() - 100.96).abs() < 0.01);
    let l = e.losses.as_ref().unwrap();
    let core = l.core_loss_w.unwrap();
    assert!(core > 0.001 && core < 0.3, "{core}");
    assert!(l.copper_loss_w > 0.2 && l.copper_loss_w < 1.5);
    let rise = l.temperature_rise_c.unwrap();
    assert!(rise > 10.0 && rise < 40.0, "{rise}");
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
