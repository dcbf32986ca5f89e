//! The relations `turnstack design` chooses turns by, each worked by hand here: the reset
//! ratio's two limits at equal turns, Faraday's law for the least primary, the duty for the
//! secondary, and a two-output job whose second output lands within 5 % of its target.

use std::sync::atomic::AtomicBool;
use turnstack::engine::design::reset_ratio::{ResetBind, ResetNeeds, least_off_state_v, try_nr};
use turnstack::engine::design::turns::{least_primary_for_flux, secondary_for_duty};
use turnstack::engine::design::{DesignSettings, design};
use turnstack::files::{BobbinLibrary, parse_requirements};
use turnstack::model::ResetSide;

/// Primary-side reset with as many reset turns as primary turns: the core resets in as long
/// as it was driven, so the reset duty limit is 50 % and the switch sees twice the input
/// (common practice).
#[test]
fn equal_reset_and_primary_turns_give_half_duty_and_twice_the_input_common_practice() {
    let needs = ResetNeeds {
        side: ResetSide::Primary,
        vin_max_v: 36.0,
        vo_v: 5.5,
        duty_limit: 0.45,
        allowed_v: 80.0,
    };
    let c = try_nr(&needs, 20, 6, 20, 0.3).expect("both limits hold");
    assert!(
        (c.reset_duty_limit - 0.5).abs() < 1e-12,
        "{}",
        c.reset_duty_limit
    );
    assert!(
        (c.switch_voltage_v - 72.0).abs() < 1e-9,
        "{}",
        c.switch_voltage_v
    );
    // 0.5 against 0.45 leaves 11 % of the duty; 72 V against 80 V leaves 10 %.
    assert_eq!(c.binds, ResetBind::SwitchVoltage);
    // The least the off-state voltage can be at a duty limit of 0.5: 2 x the highest input.
    assert!((least_off_state_v(40.0, 0.5) - 80.0).abs() < 1e-9);
    // A tighter switch refuses the equal reset.
    let tight = ResetNeeds {
        allowed_v: 70.0,
        ..needs
    };
    assert!(try_nr(&tight, 20, 6, 20, 0.3).is_none());
}

/// Faraday's law over the longest on-time, the form of the forward-converter design equations
/// in McLyman, Transformer and Inductor Design Handbook (3rd ed., chapter on the forward
/// converter; from memory, the page not verified): Np = Vin_max D_max / (f Ae dB). Worked by
/// hand for 28 V, D 0.45, 100 kHz, Ae 52 mm^2, dB = 380 - 100 = 280 mT:
/// 12.6e-6 V s / (52e-6 m^2 x 0.28 T) = 8.65, so 9 turns; then Ns >= 9 x 5.5 V / (0.4275 x
/// 20 V) = 5.79, so 6 turns.
#[test]
fn least_primary_and_secondary_follow_faradays_law_and_the_duty_worked_by_hand() {
    assert_eq!(least_primary_for_flux(28.0, 0.45, 100e3, 52.0, 280.0), 9);
    assert_eq!(secondary_for_duty(9, 5.5, 20.0, 0.45 * 0.95), 6);
    // At exactly the headroom the whole number is kept: 12.6e-6 / (45e-6 x 0.28) = 1.0 x 10.
    assert_eq!(least_primary_for_flux(28.0, 0.45, 100e3, 45.0, 280.0), 10);
}

const TWO_OUTPUTS: &str = r#"
format = 1
title = "two outputs"
bobbins = ["etd29"]

[setup]
frequency_khz = 100

[operating]
vin_min_v = 20
vin_max_v = 28
rectifier_drop_v = 0.5
duty_limit = 0.45
ambient_c = 40

[[output]]
name = "S5"
vout_v = 5
iout_a = 3

[[output]]
name = "S12"
vout_v = 12
iout_a = 0.3
rectifier_drop_v = 0.7

[material]
grade = "mnzn-power-100c"

[switch]
voltage_rating_v = 100
"#;

/// A 5 V and a 12 V output: the 12 V winding's whole turns give, by hand, (5 + 0.5) N12 /
/// N5 - 0.7 V, within 5 % of 12 V on every design offered.
#[test]
fn a_two_output_job_keeps_the_second_output_within_5_percent() {
    let library = BobbinLibrary::bundled_only();
    let req = parse_requirements(TWO_OUTPUTS, None, &library).unwrap_or_else(|e| panic!("{e}"));
    let bobbins: Vec<_> = library
        .entries()
        .into_iter()
        .filter(|e| e.id == "etd29")
        .map(|e| (e.id, e.bobbin.unwrap()))
        .collect();
    let outcome = design(
        &req,
        &bobbins,
        &DesignSettings::default(),
        &|_, _| {},
        &AtomicBool::new(false),
    );
    assert!(!outcome.designs.is_empty(), "{:?}", outcome.binding);
    for d in &outcome.designs {
        let n5 = d.build.winding("S5").unwrap().turns;
        let n12 = d.build.winding("S12").unwrap().turns;
        let v12 = 5.5 * f64::from(n12) / f64::from(n5) - 0.7;
        assert!(
            (v12 - 12.0).abs() / 12.0 <= 0.05,
            "{n5} and {n12} turns give {v12} V"
        );
        assert!((d.outputs[1].vout_from_turns_v - v12).abs() < 1e-9);
        assert!(d.eval.failures().is_empty());
    }
    // The JSON keys FORMAT.md documents ("Requirements file and `turnstack design`"), no
    // more and no fewer.
    let v = serde_json::to_value(turnstack::report::design::json(
        &outcome,
        req.switch.allowed_v(),
    ))
    .unwrap();
    let keys = |v: &serde_json::Value| v.as_object().unwrap().keys().cloned().collect::<Vec<_>>();
    assert_eq!(keys(&v), ["binding", "designs"]);
    let d = &v["designs"][0];
    let mut want = vec![
        "binding_limit",
        "binding_margin",
        "bobbin",
        "description",
        "duty_limit",
        "duty_margin",
        "flux_headroom_mt",
        "flux_swing_worst_mt",
        "outputs",
        "reset_binds",
        "reset_duty_limit",
        "reset_ratio",
        "spare_height_mm",
        "switch_allowed_v",
        "switch_voltage_v",
        "temperature_rise_c",
        "total_loss_w",
        "turns",
    ];
    want.sort_unstable();
    assert_eq!(keys(d), want);
    assert_eq!(
        keys(&d["outputs"][0]),
        ["turns", "vout_from_turns_v", "vout_v", "winding"]
    );
    assert_eq!(keys(&d["turns"]), ["P", "R", "S12", "S5"]);
}
