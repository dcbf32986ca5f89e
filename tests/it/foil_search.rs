//! The search proposes foil where it clearly wins: a 10 A, 3-turn secondary.

use crate::common::parse;
use turnstack::engine::search::{Settings, search};
use turnstack::model::Conductor;

/// A forward converter 36-60 V to 5 V at 10 A, 100 kHz, on the bundled ETD29 size bobbin,
/// Np 8 : Ns 3, round wire as drawn up. At 6.4 A RMS in three turns, a round secondary in
/// the 2-6 A/mm2 band is 1.1 mm2 or more: one thick wire many skin depths across (0.24 mm
/// at 100 C, 100 kHz) or strands side by side; a foil across the 19.4 mm breadth carries it
/// in 0.1-0.15 mm, under a skin depth (Dowell: low AC factor). Common practice: foil for a
/// few high-current turns.
const CASE: &str = r#"
format = 1
title = "10 A, 3-turn secondary"
bobbin = "etd29"
[setup]
temperature_c = 100
frequency_khz = 100
[[winding]]
name = "P"
role = "primary"
turns = 8
wire = "0.8mm"
[[winding]]
name = "S"
role = "secondary"
turns = 3
wire = "1.0mm"
[[winding]]
name = "R"
role = "reset"
turns = 8
wire = "0.25mm"
[[stack]]
winding = "P"
[[stack]]
tape = 1
[[stack]]
winding = "S"
[[stack]]
tape = 1
[[stack]]
winding = "R"
[[stack]]
tape = 2
[operating]
vin_min_v = 36
vin_max_v = 60
vout_v = 5
iout_a = 10
rectifier_drop_v = 0.5
duty_limit = 0.45
"#;

#[test]
fn the_search_picks_foil_for_a_10_a_three_turn_secondary() {
    let build = parse(CASE);
    let settings = Settings {
        max_strands: 3,
        threads: 1,
        ..Settings::default()
    };
    let out = search(&build, &settings, &|_, _| {}).unwrap();
    let best = out.candidates.first().expect("a candidate");
    let s = best.build.winding("S").unwrap();
    assert!(
        matches!(s.conductor, Conductor::Foil(_)),
        "{}",
        best.description
    );
    // Every round-wire secondary left on the front loses more than the best foil.
    for c in &out.candidates {
        if c.build.winding("S").unwrap().conductor == Conductor::Round {
            assert!(c.copper_loss_w > best.copper_loss_w, "{}", c.description);
        }
    }
    // And the round secondary as drawn up loses more than the foil the search chose.
    let drawn = turnstack::engine::evaluate(&build);
    let s_loss = |e: &turnstack::engine::Evaluation| {
        e.windings[1]
            .copper_loss_w
            .expect("a current from the operating point")
    };
    assert!(
        s_loss(&best.eval) < s_loss(&drawn),
        "{} vs {}",
        s_loss(&best.eval),
        s_loss(&drawn)
    );
}
