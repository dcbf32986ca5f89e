//! The engine's figures held against outside references: NBS Handbook 100 (copper resistance),
//! IEC 60028 (resistivity, temperature coefficient), Lee / Fortescue (leakage of layered
//! windings), Dowell 1966 (AC resistance) and the forward converter's reset relations. Each
//! check names its source. (ASTM B258 diameters are held in wire_tables.rs.)

use crate::common::{assert_rel, eval, measured_winding, rect_bobbin, round_bobbin};
use std::f64::consts::PI;
use turnstack::engine::constants::{ALPHA20_PER_K, RHO20_OHM_M};
use turnstack::engine::geometry::mlt_at_mm;
use turnstack::engine::layout::{Laid, LaidKind, Layer};
use turnstack::engine::leakage::{energy_integral_m2, leakage_h, mmf_profile};
use turnstack::engine::resistance::{ohm_per_m, rho_ohm_m, temperature_ratio};
use turnstack::library::wires::awg_bare_mm;
use turnstack::model::Tube;

/// mu0 (H/m), the pre-2019 exact value 4 pi 1e-7 (SI brochure, 8th ed.), written out here so
/// the closed forms below do not lean on the engine's constant.
const MU0: f64 = 4.0e-7 * PI;

// ---------------------------------------------------------------------------------------------
// Copper resistance

/// NBS Handbook 100, Copper Wire Tables (1966), working table for standard annealed copper:
/// ohm/km at 20 C for AWG 18..40 even gauges, computed there on the ASTM B258 diameters.
/// Rows 18-30 agree with the handbook's printed ohm/1000 ft to 4 figures; rows 32-40 are the
/// same computation (1/58 ohm mm^2/m on the B258 formula diameter), from memory of the print.
#[test]
fn awg_18_to_40_resistance_per_km_matches_nbs_handbook_100() {
    let nbs_ohm_per_km = [
        (18, 20.95),
        (20, 33.31),
        (22, 52.96),
        (24, 84.22),
        (26, 133.9),
        (28, 212.9),
        (30, 338.6),
        (32, 538.3),
        (34, 856.0),
        (36, 1361.0),
        (38, 2164.0),
        (40, 3441.0),
    ];
    for (n, want) in nbs_ohm_per_km {
        let got = ohm_per_m(awg_bare_mm(n), 1, 20.0) * 1000.0;
        assert_rel(got, want, 0.005, &format!("AWG {n} ohm/km"));
    }
}

/// NBS Handbook 100 in English units: AWG 24 is 25.67 ohm per 1000 ft at 20 C (and copper is
/// about 10.37 ohm cmil/ft, so 10.37 / 404.0 cmil = 25.67).
#[test]
fn awg24_resistance_per_1000_ft_matches_nbs_handbook_100() {
    // 1000 ft = 304.8 m exactly (international foot, 1959).
    let got = ohm_per_m(awg_bare_mm(24), 1, 20.0) * 304.8;
    assert_rel(got, 25.67, 0.005, "AWG 24 ohm/1000 ft");
}

/// IEC 60028 (international standard of resistance for copper): annealed copper is
/// 1/58 ohm mm^2/m = 1.7241e-8 ohm m at 20 C.
#[test]
fn resistivity_at_20c_is_iec_60028_one_58th() {
    assert_rel(rho_ohm_m(20.0), 1.0 / 58.0 * 1e-6, 1e-4, "rho20 vs 1/58");
    assert_rel(RHO20_OHM_M, 1.7241e-8, 1e-12, "RHO20_OHM_M");
}

/// IEC 60028 / IACS: the temperature coefficient of annealed copper at 20 C is 0.00393 per K,
/// on a linear law, so R(100 C)/R(20 C) = 1 + 0.00393 x 80 = 1.3144.
#[test]
fn temperature_coefficient_is_iec_60028_and_r100_over_r20_is_1_3144() {
    assert_rel(ALPHA20_PER_K, 0.00393, 1e-12, "alpha20");
    assert_rel(temperature_ratio(20.0, 100.0), 1.3144, 1e-9, "R100/R20");
    assert_rel(rho_ohm_m(100.0), 2.2662e-8, 1e-4, "rho(100 C)");
    // Linear: one kelvin adds 0.393 % of the 20 C value, at any temperature.
    let per_k = (rho_ohm_m(61.0) - rho_ohm_m(60.0)) / rho_ohm_m(20.0);
    assert_rel(per_k, 0.00393, 1e-9, "slope");
    // The engine's per-metre figure carries the same ratio.
    let r20 = ohm_per_m(0.5, 1, 20.0);
    assert_rel(ohm_per_m(0.5, 1, 100.0) / r20, 1.3144, 1e-9, "ohm/m ratio");
    // Strands in parallel divide it (common practice: n strands = n times the copper).
    assert_rel(ohm_per_m(0.5, 3, 20.0), r20 / 3.0, 1e-12, "3 strands");
}

// ---------------------------------------------------------------------------------------------
// Leakage inductance: Lee, Electronic Transformers and Circuits, 2nd ed. (1955), credited there
// to Fortescue: L = mu0 N^2 MLT (a/3 + b/3 + c) / b_w for two plain sections of build a and b
// with a gap c between them. Worked case: N = 40, MLT = 50 mm, b_w = 20 mm, a = b = 0.6 mm,
// c = 0.1 mm: L = 4 pi 1e-7 x 1600 x 0.05 / 0.02 x 0.5e-3 = 0.8 pi uH = 2.5133 uH. Interleaved
// P/2-S-P/2 (two gaps, peak MMF halved): (1/4)(a/3 + b/3 + 2c) -> 0.24 pi uH = 0.75398 uH.
//
// The engine's MLT grows with height (2 pi per mm of build, either tube shape), so a constant
// 50 mm MLT cannot be built. It does not need to be: when F(y)^2 is symmetric about a height
// y_c and MLT is linear in y, integral F^2 MLT dy = MLT(y_c) integral F^2 dy exactly (the odd
// part integrates to zero). So each case below puts MLT(y_c) = 50 mm with a round tube of
// diameter 50/pi - 2 y_c, and the closed form with MLT = 50 mm must come out to 1e-9.

const LEE_PS_UH: f64 = 0.8 * PI; // 2.5133 uH
const LEE_INTERLEAVED_UH: f64 = 0.24 * PI; // 0.75398 uH

/// The builds below wind between margins of 0.8 mm on a 20 mm window, so the wound breadth
/// (FORMAT.md `b_w`, the spec's "window width less both margins") is 18.4 mm, and Lee's
/// formula, inverse in `b_w`, gives his figure times 20 / 18.4.
const LEE_BUILD_BW_MM: f64 = 18.4;
fn lee_at_build_breadth(lee_uh_at_20mm: f64) -> f64 {
    lee_uh_at_20mm * 20.0 / LEE_BUILD_BW_MM
}

/// One hand-made winding section of a single layer (for the function-level checks).
fn one_layer(winding: usize, y_mm: f64, height_mm: f64, turns: u32, tube: &Tube) -> Laid {
    Laid {
        y_mm,
        height_mm,
        kind: LaidKind::Winding {
            winding: Some(winding),
            partner: None,
            turns,
            pitch_mm: 0.0,
            turns_per_layer: turns,
            layer_height_mm: height_mm,
            layer_tape: 0,
            spread: false,
            layers: vec![Layer {
                y_mm,
                height_mm,
                turns,
                mlt_mm: mlt_at_mm(tube, y_mm + height_mm / 2.0),
            }],
        },
    }
}

fn tape(y_mm: f64, height_mm: f64) -> Laid {
    Laid {
        y_mm,
        height_mm,
        kind: LaidKind::Tape { wraps: 1 },
    }
}

/// Lee (1955) P-S worked case, at the level of the MMF profile and energy integral:
/// F rises 0 -> 40 across P, stays 40 across the gap, falls 40 -> 0 across S.
#[test]
fn mmf_integral_reproduces_lee_two_sections_2_5133_uh() {
    // F^2 is symmetric about y_c = 0.6 + 0.1/2 = 0.65 mm: MLT(0.65) = pi (D + 1.3) = 50 mm.
    let tube = Tube::Round {
        diameter_mm: 50.0 / PI - 1.3,
    };
    let laid = vec![
        one_layer(0, 0.0, 0.6, 40, &tube),
        tape(0.6, 0.1),
        one_layer(1, 0.7, 0.6, 40, &tube),
    ];
    // P drives +1 per turn, S returns the same ampere-turns: -40/40 per turn.
    let slabs = mmf_profile(&laid, &[1.0, -1.0]);
    let faces: Vec<(f64, f64)> = slabs.iter().map(|s| (s.f_a, s.f_b)).collect();
    assert_eq!(faces, vec![(0.0, 40.0), (40.0, 40.0), (40.0, 0.0)]);
    // integral F^2 MLT dy = N^2 MLT (a/3 + b/3 + c) = 1600 x 0.05 m x 0.5e-3 m = 4.0e-5.
    let integral = energy_integral_m2(&slabs, &tube);
    assert_rel(
        integral,
        1600.0 * 0.05 * 0.5e-3,
        1e-9,
        "integral F^2 MLT dy",
    );
    let l_uh = MU0 / 0.020 * integral * 1e6;
    assert_rel(l_uh, LEE_PS_UH, 1e-9, "P-S leakage (uH)");
    assert_rel(l_uh, 2.5133, 5e-5, "P-S leakage vs 2.5133 uH");
    // And through the engine's leakage function, referred to P.
    let l = leakage_h(&laid, &tube, 20.0, 2, (0, 40), (1, 40)) * 1e6;
    assert_rel(l, LEE_PS_UH, 1e-9, "leakage_h P-S");
}

/// Lee (1955) interleaved P/2-S-P/2 worked case: 0.75398 uH, the MMF peaking at N/2.
#[test]
fn mmf_integral_reproduces_lee_interleaved_0_75398_uh() {
    // Build 0.3 + 0.1 + 0.6 + 0.1 + 0.3 = 1.4 mm, F^2 symmetric about 0.7: D = 50/pi - 1.4.
    let tube = Tube::Round {
        diameter_mm: 50.0 / PI - 1.4,
    };
    let laid = vec![
        one_layer(0, 0.0, 0.3, 20, &tube),
        tape(0.3, 0.1),
        one_layer(1, 0.4, 0.6, 40, &tube),
        tape(1.0, 0.1),
        one_layer(0, 1.1, 0.3, 20, &tube),
    ];
    let slabs = mmf_profile(&laid, &[1.0, -1.0]);
    let faces: Vec<(f64, f64)> = slabs.iter().map(|s| (s.f_a, s.f_b)).collect();
    assert_eq!(
        faces,
        vec![
            (0.0, 20.0),
            (20.0, 20.0),
            (20.0, -20.0),
            (-20.0, -20.0),
            (-20.0, 0.0)
        ]
    );
    let l = leakage_h(&laid, &tube, 20.0, 2, (0, 40), (1, 40)) * 1e6;
    assert_rel(l, LEE_INTERLEAVED_UH, 1e-9, "P/2-S-P/2 leakage (uH)");
    assert_rel(l, 0.75398, 5e-5, "P/2-S-P/2 vs 0.75398 uH");
    // Interleaving cuts it by 2.5133 / 0.75398 = 3.33, not 4: the gaps count twice.
    assert_rel(LEE_PS_UH / l, 10.0 / 3.0, 1e-9, "interleaving ratio");
}

/// Lee's formula with the MLT growing across the build (FORMAT.md: "the integral weights it by
/// F^2"). Derived by hand for MLT(y) = M0 + k y, k = 2 pi: over P, integral (y/a)^2 (M0 + k y) dy
/// = (a/3) MLT(3a/4); over the gap, c MLT(a + c/2); over S, with u from its inner face,
/// integral (1 - u/b)^2 (M1 + k u) du = (b/3) MLT(a + c + b/4) since integral (1-t)^2 t dt = 1/12.
#[test]
fn mmf_integral_weights_a_growing_mlt_by_f_squared_lee_form() {
    // An asymmetric case on a rect tube: a = 0.6, c = 0.2, b = 0.9; Np = 40, Ns = 20.
    let tube = Tube::Rect {
        width_mm: 8.0,
        depth_mm: 6.0,
        corner_radius_mm: 1.0,
    };
    // MLT(y) = 2(8 + 6) - 8 x 1 + 2 pi (1 + y) (FORMAT.md rect tube).
    let m = |y: f64| 28.0 - 8.0 + 2.0 * PI * (1.0 + y);
    let (a, c, b) = (0.6, 0.2, 0.9);
    let laid = vec![
        one_layer(0, 0.0, a, 40, &tube),
        tape(a, c),
        one_layer(1, a + c, b, 20, &tube),
    ];
    let want_mm2 = a / 3.0 * m(0.75 * a) + c * m(a + c / 2.0) + b / 3.0 * m(a + c + b / 4.0);
    // L referred to P = mu0 Np^2 / b_w x that (heights x MLT: mm^2 -> m^2 is 1e-6), b_w 20 mm.
    let want_uh = MU0 * 1600.0 / 0.020 * want_mm2 * 1e-6 * 1e6;
    let got_uh = leakage_h(&laid, &tube, 20.0, 2, (0, 40), (1, 20)) * 1e6;
    assert_rel(got_uh, want_uh, 1e-9, "asymmetric leakage with growing MLT");
    // The same field referred to S (Lee: referred inductance scales with the turns squared).
    let to_s = leakage_h(&laid, &tube, 20.0, 2, (1, 20), (0, 40)) * 1e6;
    assert_rel(
        to_s,
        want_uh * (20.0f64 / 40.0).powi(2),
        1e-9,
        "referred to S",
    );
}

/// The text of a two-winding build for the Lee cases: window 20 mm wide, margins 0.8 mm
/// so the usable width (and the wound breadth b_w) is 18.4 mm; P and S of measured wire od 0.3 mm, 3 strands, pitch 0.9:
/// floor(18.4 / 0.9 = 20.4) = 20 turns a layer, so 40 turns are 2 full layers of 0.3 mm (a
/// section of 0.6 mm whose MMF rises at one slope throughout, as in Lee's plain section).
/// Tape 0.1 mm a wrap gives the gap c.
fn lee_build(diameter_mm: f64, s_winding: &str, stack: &str) -> String {
    format!(
        "format = 1\ntitle = \"Lee worked case\"\n{}\
         [setup]\nmargin_mm = 0.8\ntape_mm = 0.1\n\n{}\n{}\n{}",
        round_bobbin(20.0, 2.0, diameter_mm),
        measured_winding("P", "primary", 40, 0.25, 0.3, 3),
        s_winding,
        stack
    )
}

/// Lee (1955) P-S worked case built end to end as a build file: 2.5133 uH referred to P at
/// b_w = 20 mm, so 2.5133 x 20 / 18.4 = 2.7319 uH on the 18.4 mm the turns occupy.
#[test]
fn build_with_two_plain_sections_reproduces_lee_2_5133_uh() {
    let stack = "[[stack]]\nwinding = \"P\"\n[[stack]]\ntape = 1\n[[stack]]\nwinding = \"S\"\n";
    let s = measured_winding("S", "secondary", 40, 0.25, 0.3, 3);
    let (_, e) = eval(&lee_build(50.0 / PI - 1.3, &s, stack));
    // Layout as intended: 0.6 + 0.1 + 0.6 mm.
    assert_rel(e.build_height_mm, 1.3, 1e-12, "build height");
    assert_eq!(e.leakage.len(), 1);
    let l = &e.leakage[0];
    assert_eq!(
        (l.from.as_str(), l.to.as_str(), l.referred_to.as_str()),
        ("P", "S", "P")
    );
    assert_rel(
        l.uh,
        lee_at_build_breadth(LEE_PS_UH),
        1e-9,
        "P-S leakage (uH)",
    );
    assert_rel(l.uh, 2.7319, 5e-5, "vs 2.7319 uH");
}

/// Lee (1955): the same field with a 20-turn secondary of 0.6 mm wire (one layer of 0.6 mm,
/// floor(18.4/0.6 = 30.7) = 30 a layer). Referred to P it is still mu0 Np^2 MLT (...) / b_w.
#[test]
fn build_with_fewer_secondary_turns_refers_lee_leakage_to_the_primary() {
    let stack = "[[stack]]\nwinding = \"P\"\n[[stack]]\ntape = 1\n[[stack]]\nwinding = \"S\"\n";
    let s = measured_winding("S", "secondary", 20, 0.55, 0.6, 1);
    let (_, e) = eval(&lee_build(50.0 / PI - 1.3, &s, stack));
    assert_rel(e.build_height_mm, 1.3, 1e-12, "build height");
    assert_rel(
        e.leakage[0].uh,
        lee_at_build_breadth(LEE_PS_UH),
        1e-9,
        "P-S leakage referred to P",
    );
}

/// Lee (1955) interleaved P/2-S-P/2 built end to end: P in two sections of 20 turns (one layer
/// of 0.3 mm each), S of 40 turns between them, one wrap of 0.1 mm tape each side: 0.75398 uH
/// at b_w = 20 mm, 0.81955 uH at the 18.4 mm wound breadth.
#[test]
fn build_interleaved_p_s_p_reproduces_lee_0_75398_uh() {
    let stack = "[[stack]]\nwinding = \"P\"\nturns = 20\n[[stack]]\ntape = 1\n\
                 [[stack]]\nwinding = \"S\"\n[[stack]]\ntape = 1\n[[stack]]\nwinding = \"P\"\n";
    let s = measured_winding("S", "secondary", 40, 0.25, 0.3, 3);
    let (_, e) = eval(&lee_build(50.0 / PI - 1.4, &s, stack));
    assert_rel(e.build_height_mm, 1.4, 1e-12, "build height");
    assert_rel(
        e.leakage[0].uh,
        lee_at_build_breadth(LEE_INTERLEAVED_UH),
        1e-9,
        "P/2-S-P/2 leakage",
    );
    assert_rel(e.leakage[0].uh, 0.81955, 5e-5, "vs 0.81955 uH");
}

/// FORMAT.md and the spec: b_w is the wound breadth, the window width less both margins. The
/// same layers in a window twice as wide (40 mm) with margins of 10.8 mm (still 18.4 mm between
/// them) give the same leakage; with no margins the field spreads over 40 mm and Lee's formula,
/// inverse in b_w, gives 18.4 / 40 of it (the layers regroup, so that case is its own build).
#[test]
fn leakage_follows_the_wound_breadth_not_the_window_lee() {
    let stack = "[[stack]]\nwinding = \"P\"\n[[stack]]\ntape = 1\n[[stack]]\nwinding = \"S\"\n";
    let s = measured_winding("S", "secondary", 40, 0.25, 0.3, 3);
    let wide = lee_build(50.0 / PI - 1.3, &s, stack)
        .replace("width_mm = 20.0", "width_mm = 40.0")
        .replace("margin_mm = 0.8", "margin_mm = 10.8");
    let (_, e) = eval(&wide);
    assert_rel(e.usable_width_mm, 18.4, 1e-12, "usable width");
    assert_rel(
        e.leakage[0].uh,
        lee_at_build_breadth(LEE_PS_UH),
        1e-9,
        "leakage between 10.8 mm margins of a 40 mm window",
    );
    // Not the window's 40 mm: that would be half of Lee's 20 mm figure.
    assert!((e.leakage[0].uh - LEE_PS_UH / 2.0).abs() > 0.5);
}

// ---------------------------------------------------------------------------------------------
// Single-switch forward converter with a reset winding

/// A forward build: Np, Ns, Nr turns, a core of 40 mm^2, the operating point's extra lines.
fn forward(np: u32, ns: u32, nr: u32, operating: &str) -> String {
    format!(
        "format = 1\ntitle = \"forward\"\n{}[bobbin.core]\nae_mm2 = 40.0\nle_mm = 50.0\n\
         [setup]\nfrequency_khz = 100\n\n{}{}{}\
         [[stack]]\nwinding = \"P\"\n[[stack]]\nwinding = \"R\"\n[[stack]]\ntape = 2\n\
         [[stack]]\nwinding = \"S\"\n\n[operating]\nconverter = \"forward\"\n{operating}",
        rect_bobbin(20.0, 6.0, 8.0, 8.0, 0.5),
        measured_winding("P", "primary", np, 0.3, 0.35, 1),
        measured_winding("S", "secondary", ns, 0.5, 0.55, 1),
        measured_winding("R", "reset", nr, 0.2, 0.24, 1),
    )
}

/// Common practice: equal primary and reset turns give a 50 % reset duty limit and put twice
/// the input on the switch (48 V in: 96 V off-state).
#[test]
fn equal_primary_and_reset_turns_give_half_duty_and_twice_the_input_common_practice() {
    let op = "vin_min_v = 36\nvin_max_v = 48\nvout_v = 5\niout_a = 2\n";
    let (_, e) = eval(&forward(20, 5, 20, op));
    let c = e.converter.expect("converter figures");
    assert_rel(c.reset_duty_limit, 0.5, 1e-12, "reset duty limit");
    assert_rel(c.switch_voltage_v, 96.0, 1e-12, "switch voltage");
    // Without a duty_limit the reset limit alone caps the duty (FORMAT.md).
    assert_rel(c.duty_max, 0.5, 1e-12, "duty max");
}

/// Mohan, Undeland & Robbins, Power Electronics, 3rd ed., section 10-4-2 (from memory):
/// D_max = Np/(Np + Nr) and V_sw = Vin (1 + Np/Nr). At 48 V: Np 20, Nr 30 -> 0.4, 80 V;
/// Np 30, Nr 20 -> 0.6, 120 V.
#[test]
fn reset_turns_set_duty_limit_and_switch_voltage_mohan_10_4_2() {
    let op = "vin_min_v = 36\nvin_max_v = 48\nvout_v = 5\niout_a = 2\n";
    for (np, nr, d, v) in [(20, 30, 0.4, 80.0), (30, 20, 0.6, 120.0)] {
        let (_, e) = eval(&forward(np, 5, nr, op));
        let c = e.converter.unwrap();
        assert_rel(
            c.reset_duty_limit,
            d,
            1e-12,
            &format!("Np {np} Nr {nr} D_max"),
        );
        assert_rel(
            c.switch_voltage_v,
            v,
            1e-12,
            &format!("Np {np} Nr {nr} V_sw"),
        );
    }
}

/// Mohan et al. section 10-4-2 (forward converter output, continuous conduction):
/// Vo = D (Ns/Np) Vin, so with the rectifier drop Vo' = 5 + 0.5 V, Np 20, Ns 5, 36 V in:
/// D = 5.5 x 20 / (5 x 36) = 0.6111.
#[test]
fn duty_needed_follows_the_forward_output_relation_mohan_10_4_2() {
    let op = "vin_min_v = 36\nvin_max_v = 48\nvout_v = 5\niout_a = 2\nrectifier_drop_v = 0.5\n";
    let (_, e) = eval(&forward(20, 5, 20, op));
    let c = e.converter.unwrap();
    assert_rel(
        c.duty_needed_at_vin_min,
        110.0 / 180.0,
        1e-12,
        "duty needed",
    );
}

/// Faraday's law: Delta B = Vin t_on / (Np Ae). 48 V, duty 0.4 at 100 kHz (t_on = 4 us),
/// Np 20, Ae 40 mm^2: 48 x 4e-6 / (20 x 40e-6) = 0.240 T.
#[test]
fn worst_case_flux_swing_is_faradays_law_240_mt() {
    let op = "vin_min_v = 36\nvin_max_v = 48\nvout_v = 5\niout_a = 2\nduty_limit = 0.4\n";
    let (_, e) = eval(&forward(20, 5, 20, op));
    let c = e.converter.unwrap();
    // duty_limit 0.4 is below the reset limit 0.5, so it is the one that applies.
    assert_rel(c.duty_max, 0.4, 1e-12, "duty max");
    assert_rel(
        c.flux_swing_worst_mt.unwrap(),
        240.0,
        1e-9,
        "flux swing (mT)",
    );
    // No [material]: no headroom figure (FORMAT.md).
    assert!(c.flux_headroom_mt.is_none());
}

/// Reset returned to the output, derived by volt-second balance (a derived check, no published
/// text): the reset limit is Np Vo' / (Np Vo' + Nr Vin_max), the switch sees
/// Vin_max + Vo' Np/Nr, and in steady state the duty must stay below 1 - Nr/Ns
/// (Nr = Ns/2 -> 0.5). Np 20, Ns 10, Nr 5, Vo' 5.5, 48 V: 110/(110 + 240) = 0.3143; 70 V.
#[test]
fn secondary_side_reset_by_volt_second_balance_derived() {
    let op = "reset_side = \"secondary\"\nvin_min_v = 36\nvin_max_v = 48\nvout_v = 5\n\
              iout_a = 2\nrectifier_drop_v = 0.5\n";
    let (_, e) = eval(&forward(20, 10, 5, op));
    let c = e.converter.unwrap();
    assert_rel(c.reset_duty_limit, 110.0 / 350.0, 1e-12, "reset limit");
    assert_rel(
        c.switch_voltage_v,
        48.0 + 5.5 * 20.0 / 5.0,
        1e-12,
        "switch voltage",
    );
    assert_rel(c.steady_duty_ceiling.unwrap(), 0.5, 1e-12, "steady ceiling");
    // Start-up cannot reset: always warned about for this reset side (FORMAT.md).
    assert!(e.warnings.iter().any(|w| w.code() == "reset-startup"));
}

// ---------------------------------------------------------------------------------------------
// AC resistance: Dowell, "Effects of eddy currents in transformer windings", Proc. IEE 113(8),
// 1966. For m layers counted from zero MMF: F_R = D [M(D) + 2 (m^2 - 1)/3 D'(D)], with
// M = (sinh 2D + sin 2D)/(cosh 2D - cos 2D) and D' = (sinh D - sin D)/(cosh D + cos D); round
// wire as the square of equal area, h = d sqrt(pi)/2, porosity eta = n_l h / b_w.

fn dowell_m_layers(d: f64, m: f64) -> f64 {
    let big_m = ((2.0 * d).sinh() + (2.0 * d).sin()) / ((2.0 * d).cosh() - (2.0 * d).cos());
    let small = (d.sinh() - d.sin()) / (d.cosh() + d.cos());
    d * (big_m + 2.0 * (m * m - 1.0) / 3.0 * small)
}

/// Dowell (1966) worked case: d = 0.5 mm, 20 turns a layer, b_w = 12 mm, 100 C, 100 kHz:
/// h = 0.44311 mm, eta = 0.73852, delta = 0.23959 mm, D = 1.5894, F_R(m = 3) = 5.969. Built as
/// one winding of 60 turns (od 0.6: floor(12 / 0.6) = 20 a layer, 3 layers) on a round tube so
/// large (10 m across) that the three layers' lengths differ by under 4e-4, so the engine's
/// length-weighted mean of its layers is Dowell's equal-layer F_R.
#[test]
fn ac_factor_of_three_layers_matches_dowell_1966_worked_case() {
    let text = format!(
        "format = 1\ntitle = \"Dowell case\"\n{}[setup]\ntemperature_c = 100\n\
         frequency_khz = 100\n\n{}[[stack]]\nwinding = \"P\"\n",
        round_bobbin(12.0, 3.0, 10_000.0),
        measured_winding("P", "primary", 60, 0.5, 0.6, 1),
    );
    let (_, e) = eval(&text);
    let ac = e.windings[0]
        .ac
        .as_ref()
        .expect("AC figures with a frequency");
    assert_rel(
        ac.skin_depth_mm,
        0.23959,
        1e-4,
        "skin depth at 100 C, 100 kHz",
    );
    let h = 0.5 * PI.sqrt() / 2.0;
    let d = (20.0 * h / 12.0f64).sqrt() * h / 0.239_588;
    assert_rel(d, 1.5894, 1e-4, "D");
    assert_rel(
        ac.ac_factor,
        dowell_m_layers(d, 3.0),
        1e-3,
        "F_R vs Dowell m = 3",
    );
    assert_rel(ac.ac_factor, 5.969, 1e-3, "F_R vs 5.969");
    assert_rel(
        ac.rac_ohm,
        ac.ac_factor * e.windings[0].dcr_ohm,
        1e-12,
        "Rac = F_R x Rdc",
    );
}

/// Dowell (1966): with the primary's MMF starting at zero at the tube and the secondary's
/// ending at zero at the top, each winding of a P-S build is an m-layer portion of its own.
/// P: 2 layers of 20 (d 0.5), S: 2 layers of 10 x 2 strands (d 0.5): the same conductors per
/// layer, so both come to F_R(D, m = 2). Giant tube again, so the layers' lengths are equal.
#[test]
fn p_s_build_gives_each_winding_dowell_two_layer_factor() {
    let text = format!(
        "format = 1\ntitle = \"Dowell P-S\"\n{}[setup]\ntemperature_c = 100\n\
         frequency_khz = 100\n\n{}{}[[stack]]\nwinding = \"P\"\n[[stack]]\ntape = 2\n\
         [[stack]]\nwinding = \"S\"\n",
        round_bobbin(12.0, 3.0, 10_000.0),
        measured_winding("P", "primary", 40, 0.5, 0.6, 1),
        measured_winding("S", "secondary", 20, 0.5, 0.6, 2),
    );
    let (_, e) = eval(&text);
    let h = 0.5 * PI.sqrt() / 2.0;
    let delta_mm = e.windings[0].ac.as_ref().unwrap().skin_depth_mm;
    let d = (20.0 * h / 12.0f64).sqrt() * h / delta_mm;
    let want = dowell_m_layers(d, 2.0);
    for w in &e.windings {
        let ac = w.ac.as_ref().unwrap();
        assert_rel(
            ac.ac_factor,
            want,
            1e-3,
            &format!("{} F_R vs Dowell m = 2", w.name),
        );
    }
}
