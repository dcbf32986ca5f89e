//! The turn-off spike, the winding temperature solved from the ambient, the hot spot against
//! the insulation class and the pass/fail of `check`, each held to a hand computation from
//! the published relation it comes from (named beside each check).

use crate::common::{assert_rel, eval, measured_winding, round_bobbin};
use std::f64::consts::PI;
use turnstack::engine::{Constraint, InsulationPart, TemperatureSource};

/// Lee (1955) two-section case as in reference_figures.rs: P 40 and S 40 turns in 0.6 mm
/// sections 0.1 mm apart, MLT 50 mm at the centre of the field, wound between 0.8 mm margins
/// of a 20 mm window, so b_w = 18.4 mm and L = mu0 1600 x 0.05 x 0.5e-3 / 0.0184 H. The reset
/// winding R lies outside S, where the P-S field is zero, so it adds nothing to it.
fn spike_build(setup: &str, operating: &str) -> String {
    format!(
        "format = 1\ntitle = \"spike\"\n{}[bobbin.core]\nae_mm2 = 40.0\nle_mm = 50.0\nal_nh = 2000\n\
         [setup]\nmargin_mm = 0.8\ntape_mm = 0.1\nfrequency_khz = 100\n{setup}\n\
         {}{}{}\
         [[stack]]\nwinding = \"P\"\n[[stack]]\ntape = 1\n[[stack]]\nwinding = \"S\"\n\
         [[stack]]\nwinding = \"R\"\n\n\
         [operating]\nvin_min_v = 40\nvin_max_v = 60\nvout_v = 5\niout_a = 4\n{operating}\n",
        round_bobbin(20.0, 2.0, 50.0 / PI - 1.3),
        measured_winding("P", "primary", 40, 0.25, 0.3, 3),
        measured_winding("S", "secondary", 40, 0.25, 0.3, 3),
        measured_winding("R", "reset", 40, 0.15, 0.2, 1),
    )
}

const MU0: f64 = 4.0e-7 * PI;

/// Lee's formula at the wound breadth (H).
fn lee_leakage_h() -> f64 {
    MU0 * 1600.0 * 0.05 * 0.5e-3 / 0.0184
}

/// Energy in the leakage at turn-off, once a period: P = 1/2 L I^2 f (Erickson & Maksimovic,
/// Fundamentals of Power Electronics, 2nd ed.: the energy a clamp or snubber takes), with I the
/// reflected load Iout Ns/Np plus the magnetising peak Vin D T / (AL Np^2) (Faraday's law).
/// Here D = Vo Np / (Ns Vin) = 5/40, Lm = 2000 nH x 1600 = 3.2 mH, Im = 40 x 0.125 x 10 us /
/// 3.2 mH = 15.625 mA, I = 4 + 0.015625 A.
#[test]
fn clamp_loss_is_half_l_i_squared_f_with_the_reflected_and_magnetising_current() {
    let (_, e) = eval(&spike_build("temperature_c = 100", ""));
    let c = e.converter.as_ref().expect("converter");
    let l = lee_leakage_h();
    assert_rel(
        c.leakage_ps_uh.unwrap(),
        l * 1e6,
        1e-9,
        "P-S leakage (Lee at b_w)",
    );
    let im = 40.0 * 0.125 * 10e-6 / 3.2e-3;
    assert_rel(im, 0.015625, 1e-12, "hand magnetising peak");
    let i_pk = 4.0 + im;
    assert_rel(c.clamp_peak_a.unwrap(), i_pk, 1e-9, "peak at turn-off");
    let want = 0.5 * l * i_pk * i_pk * 100e3;
    assert_rel(c.clamp_loss_w.unwrap(), want, 1e-9, "clamp loss");
    // 0.5 x 2.7319 uH x 16.125 A^2 x 100 kHz = 2.2026 W.
    assert_rel(
        c.clamp_loss_w.unwrap(),
        2.2026,
        1e-3,
        "clamp loss vs 2.2026 W",
    );
}

/// The primary current rises through the leakage at Vin/L_lk before the secondary carries the
/// load: t = L_lk (Iout Ns/Np) / (Vin - V_switch). With a 2 V switch drop the ideal duty
/// Vo Np / (Ns (Vin - Vsw)) = 5/38 and the lost duty L 4 A x 100 kHz / 38 V both count against
/// the duty available (0.5 here, Np/(Np+Nr)).
#[test]
fn duty_lost_to_leakage_and_the_switch_drop_come_off_the_margin() {
    let (_, e) = eval(&spike_build("temperature_c = 100", "switch_drop_v = 2.0"));
    let c = e.converter.as_ref().expect("converter");
    let lost = lee_leakage_h() * 4.0 * 100e3 / 38.0;
    assert_rel(c.duty_lost_to_leakage.unwrap(), lost, 1e-9, "duty lost");
    assert_rel(c.duty_needed_at_vin_min, 5.0 / 40.0, 1e-12, "ideal duty");
    let total = 5.0 / 38.0 + lost;
    assert_rel(c.duty_needed_total_at_vin_min, total, 1e-9, "total duty");
    assert_rel(c.duty_margin, 0.5 - total, 1e-9, "margin");
    let reset = e
        .limits
        .iter()
        .find(|l| l.constraint == Constraint::ResetDuty)
        .unwrap();
    assert_rel(reset.used, total, 1e-9, "reset-duty limit uses the total");
}

/// Without `temperature_c` the windings sit at ambient + rise, where the rise is McLyman's
/// 450 (P / A_t)^0.826 (Transformer and Inductor Design Handbook, 3rd ed.) of the loss at that
/// temperature, and the resistance follows IEC 60028's 1 + 0.00393 (T - 20).
#[test]
fn winding_temperature_is_ambient_plus_the_rise_it_causes() {
    let op = "ambient_c = 30\nsurface_area_cm2 = 40.0";
    let (_, solved) = eval(&spike_build("", op));
    assert_eq!(
        solved.temperature_source,
        TemperatureSource::AmbientPlusRise
    );
    let l = solved.losses.as_ref().unwrap();
    let rise = 450.0 * (l.total_loss_w / 40.0f64).powf(0.826);
    assert!(rise > 5.0, "a rise worth solving for: {rise}");
    assert_rel(
        solved.temperature_c,
        30.0 + rise,
        1e-3,
        "T = ambient + rise",
    );
    // To the tolerance FORMAT.md gives the solution: 0.01 C.
    let gap = (solved.temperature_c - (30.0 + rise)).abs();
    assert!(gap < 0.01, "T is {gap} C off ambient + rise");
    assert_rel(l.hot_spot_c.unwrap(), 30.0 + rise, 1e-3, "hot spot");
    // The same build at a given 20 C: the DC resistance scales by IEC 60028's law.
    let (_, at20) = eval(&spike_build("temperature_c = 20", op));
    assert_eq!(at20.temperature_source, TemperatureSource::Given);
    assert_eq!(at20.temperature_c, 20.0);
    let ratio = 1.0 + 0.00393 * (solved.temperature_c - 20.0);
    for (a, b) in solved.windings.iter().zip(&at20.windings) {
        assert_rel(
            a.dcr_ohm,
            b.dcr_ohm * ratio,
            1e-9,
            &format!("{} DCR", a.name),
        );
    }
    // More loss at the hotter copper: the solved copper loss is above the 20 C one.
    assert!(l.copper_loss_w > at20.losses.as_ref().unwrap().copper_loss_w);
    // A given temperature wins over the ambient.
    let (_, given) = eval(&spike_build("temperature_c = 100", op));
    assert_eq!(given.temperature_c, 100.0);
}

/// IEC 60085: the insulation system runs no hotter than its class. With the tape given as
/// class A (105 C) and the rise allowed to 200 C, the hot-spot limit breaks (the rise does
/// not), and it names the tape; the other defaults are F 155 (wire) and B 130 (bobbin).
#[test]
fn hot_spot_is_held_to_the_lowest_insulation_class() {
    let op = "ambient_c = 60\nsurface_area_cm2 = 40.0\nrise_limit_c = 200";
    let (_, e) = eval(&spike_build("tape_class_c = 105", op));
    let l = e.losses.as_ref().unwrap();
    assert_eq!(l.class_limit_c, 105.0);
    assert_eq!(l.class_binding, InsulationPart::Tape);
    let hot = l.hot_spot_c.unwrap();
    assert!(hot > 105.0, "hot spot {hot}");
    let failures = e.failures();
    assert!(failures.contains(&Constraint::HotSpot), "{failures:?}");
    assert!(
        !failures.contains(&Constraint::TemperatureRise),
        "{failures:?}"
    );
    let (_, cool) = eval(&spike_build("tape_class_c = 180", op));
    assert!(!cool.failures().contains(&Constraint::HotSpot));
    // The defaults: the bobbin's class B binds before the wire's F (tape 130 ties it; the
    // first of equals in the order wire, tape, bobbin is the tape).
    let (_, d) = eval(&spike_build("", op));
    assert_eq!(d.losses.as_ref().unwrap().class_limit_c, 130.0);
    let (_, w) = eval(&spike_build("tape_class_c = 180\nbobbin_class_c = 180", op));
    let wl = w.losses.as_ref().unwrap();
    assert_eq!(
        (wl.class_limit_c, wl.class_binding),
        (155.0, InsulationPart::Wire)
    );
}

/// Erickson & Maksimovic sec. 6.3.2: the switch holds off Vin (1 + Np/Nr) = 60 x 2 = 120 V at
/// the highest input; against a 100 V rating the design fails the check.
#[test]
fn switch_rating_below_the_off_state_voltage_fails_the_check() {
    let op = "surface_area_cm2 = 40.0\nswitch_rating_v = 100";
    let (_, e) = eval(&spike_build("temperature_c = 100", op));
    let c = e.converter.as_ref().unwrap();
    assert_rel(c.switch_voltage_v, 120.0, 1e-12, "off-state voltage");
    assert!(e.failures().contains(&Constraint::SwitchVoltage));
    let op = "surface_area_cm2 = 40.0\nswitch_rating_v = 200";
    let (_, ok) = eval(&spike_build("temperature_c = 100", op));
    assert!(!ok.failures().contains(&Constraint::SwitchVoltage));
}

/// Layer-to-layer voltage with the usual return at each flange: (2 min(a, b) - 1) V_turn
/// (common practice). The isolated example's primary: 80 turns as 32, 32, 16 at
/// 375 V / 80 = 4.6875 V a turn: (2 x 32 - 1) x 4.6875 = 295.3 V; its reset, 61 and 19 turns:
/// 37 x 4.6875 = 173.4 V; R next to P, no shared reference: (80 + 80) x 4.6875 = 750 V.
#[test]
fn layer_and_section_voltages_of_the_isolated_example() {
    let (_, e) = crate::common::example("mains-isolated");
    let st = e.stress.as_ref().expect("stress figures");
    assert_rel(st.volts_per_turn_v, 375.0 / 80.0, 1e-12, "V a turn");
    let by = |n: &str| e.windings.iter().find(|w| w.name.as_str() == n).unwrap();
    assert_rel(
        by("P").layer_voltage_v.unwrap(),
        63.0 * 4.6875,
        1e-12,
        "P layers",
    );
    assert_rel(
        by("R").layer_voltage_v.unwrap(),
        37.0 * 4.6875,
        1e-12,
        "R layers",
    );
    let rp = &st.between_sections[0];
    assert_eq!((rp.inner.as_str(), rp.outer.as_str()), ("R", "P"));
    assert_rel(rp.voltage_v, 750.0, 1e-12, "R next to P");
    // P and S face each other across the barrier: left to the isolation checks.
    assert!(st.between_sections.iter().all(|p| p.outer.as_str() != "S"));
}

/// The isolated example with the reset wound bifilar with the primary: neighbouring turns hold
/// off the switch's off-state voltage, 375 x (1 + 80/80) = 750 V (Erickson & Maksimovic sec.
/// 6.3.2), far above two grade-2 films; the warning says so and names the cure.
#[test]
fn bifilar_reset_on_a_mains_primary_is_warned() {
    let path =
        std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("examples/mains-isolated.toml");
    let text = std::fs::read_to_string(path).unwrap();
    let text = text
        .replace(
            "[[stack]]\nwinding = \"R\"\nlayer_tape = 1\n\n[[stack]]\ntape = 1\n\n[[stack]]\nwinding = \"P\"\nlayer_tape = 1\n",
            "[[stack]]\nwinding = \"P\"\nwith = \"R\"\nlayer_tape = 1\n",
        )
        .replace("wire = \"awg32\"", "wire = \"0.40mm\"");
    let (_, e) = eval(&text);
    let st = e.stress.as_ref().unwrap();
    assert_eq!(st.bifilar.len(), 1, "{:?}", st.bifilar);
    assert_rel(st.bifilar[0].voltage_v, 750.0, 1e-12, "bifilar P+R");
    let w = e
        .warnings
        .iter()
        .find(|w| w.code() == "bifilar-voltage")
        .expect("bifilar-voltage warning");
    assert!(w.message().contains("750 V"), "{}", w.message());
    assert!(w.message().contains("no bifilar primary and reset"));
}

/// Bifilar P and R share their layers, so the 1-D field across the build gives them nothing;
/// what is left is the field between neighbouring wires along the layer. For an infinite row
/// of line currents alternating +I, -I at spacing s, A = (mu0 I / 2 pi) ln|tan(pi z / 2 s)|
/// (2-D magnetostatics, conformal mapping), so the flux per metre between neighbours of radii
/// r1, r2 is (mu0 / 2 pi) ln(4 s^2 / (pi^2 r1 r2)). Here 10 turns of 0.5 mm (od 0.6) with 10 of
/// 0.3 mm (od 0.4) in one layer: s = 0.5 mm, r1 = 0.25, r2 = 0.15 mm, MLT pi (D + 0.6).
#[test]
fn bifilar_leakage_comes_from_the_spacing_of_the_wire_centres() {
    let text = format!(
        "format = 1\ntitle = \"bifilar\"\n{}[setup]\ntape_mm = 0.06\n\n{}{}\
         [[stack]]\nwinding = \"P\"\nwith = \"R\"\n",
        round_bobbin(20.0, 3.0, 10.0),
        measured_winding("P", "primary", 10, 0.5, 0.6, 1),
        measured_winding("R", "reset", 10, 0.3, 0.4, 1),
    );
    let (_, e) = eval(&text);
    let pr = e
        .leakage
        .iter()
        .find(|l| l.to.as_str() == "R")
        .expect("P-R leakage");
    let per_m = 2e-7 * (4.0 * 0.5f64.powi(2) / (PI * PI * 0.25 * 0.15)).ln();
    let want_uh = per_m * 10.0 * PI * (10.0 + 0.6) * 1e-3 * 1e6;
    assert_rel(pr.uh, want_uh, 1e-9, "bifilar P-R leakage");
    assert_rel(pr.bifilar_uh, want_uh, 1e-9, "all of it between the wires");
}

/// Capacitance. Primary to secondary: the facing layers as a plate capacitor (area = MLT at
/// the face x the wound breadth) across the tape (eps_r 3.2, PET film, from memory) and the two
/// enamel films (eps_r 3.5, from memory) in series: C = eps0 A / (t_tape/3.2 + t_enamel/3.5),
/// eps0 = 8.8541878128e-12 F/m (CODATA 2018). Self-capacitance of a two-layer Z winding by the
/// layer energy method, C = 4 (m - 1) / (3 m^2) C_layer = C_layer / 3 for m = 2 (Dalessandro,
/// da Silveira Cavalcante and Kolar, IEEE Trans. Power Electronics 22(5), 2007). More tape
/// between P and S lowers C_ps; the ringing is 1 / (2 pi sqrt(L_lk C_p)).
#[test]
fn capacitance_follows_the_plate_and_the_layer_energy_method() {
    let cap = |wraps: u32| {
        let stack = format!(
            "[[stack]]\nwinding = \"P\"\n[[stack]]\ntape = {wraps}\n[[stack]]\nwinding = \"S\"\n"
        );
        let text = format!(
            "format = 1\ntitle = \"cap\"\n{}[setup]\nmargin_mm = 0.8\ntape_mm = 0.1\n\n{}{}{stack}",
            round_bobbin(20.0, 3.0, 10.0),
            measured_winding("P", "primary", 40, 0.25, 0.3, 3),
            measured_winding("S", "secondary", 40, 0.25, 0.3, 3),
        );
        eval(&text).1
    };
    let eps0 = 8.8541878128e-12;
    let b_w = 18.4e-3;
    // P: layers at 0..0.3 and 0.3..0.6 mm; the faces P/S at 0.6 and 0.6 + 0.1 wraps.
    let mlt = |y_mm: f64| PI * (10.0 + 2.0 * y_mm) * 1e-3;
    let enamel = 2.0 * 0.025e-3;
    for wraps in [1u32, 3] {
        let e = cap(wraps);
        let t = f64::from(wraps) * 0.1e-3;
        let mid = 0.6 + f64::from(wraps) * 0.1 / 2.0;
        let want_ps = eps0 * mlt(mid) * b_w / (t / 3.2 + enamel / 3.5) * 1e12;
        assert_rel(
            e.capacitance.primary_secondary_pf,
            want_ps,
            1e-9,
            &format!("C_ps with {wraps} wraps"),
        );
        let c_layer = eps0 * mlt(0.3) * b_w / (enamel / 3.5) * 1e12;
        assert_rel(
            e.capacitance.self_pf[0].unwrap(),
            c_layer / 3.0,
            1e-9,
            "C_P",
        );
        let l = e.leakage[0].uh * 1e-6;
        let f = 1.0 / (2.0 * PI * (l * c_layer / 3.0 * 1e-12).sqrt()) / 1e3;
        assert_rel(e.capacitance.ringing_khz.unwrap(), f, 1e-9, "ringing");
    }
    assert!(cap(3).capacitance.primary_secondary_pf < cap(1).capacitance.primary_secondary_pf);
}

/// A winding that carries no current of its own still loses power in the field of the others
/// (Dowell 1966, a layer with the same MMF F on both faces: P = R_layer (F / n_l)^2
/// D (2 G1 - 4 G2), G1 = (sinh 2D + sin 2D)/(cosh 2D - cos 2D),
/// G2 = (sinh D cos D + cosh D sin D)/(cosh 2D - cos 2D)). Here an auxiliary winding of one
/// layer (20 turns of 0.5 mm in a 12 mm breadth) lies between a 20-turn primary carrying
/// 2 A RMS (a sinusoid: no operating point) and the secondary, so F = 20 x 2 A.
#[test]
fn a_winding_without_current_has_proximity_loss_in_the_primary_field() {
    let w = |n: &str, role: &str, extra: &str| {
        format!(
            "[[winding]]\nname = \"{n}\"\nrole = \"{role}\"\nturns = 20\n\
             wire = {{ bare_mm = 0.5, od_mm = 0.6 }}\n{extra}"
        )
    };
    let text = format!(
        "format = 1\ntitle = \"prox\"\n{}[setup]\ntemperature_c = 100\nfrequency_khz = 100\n\n{}{}{}\
         [[stack]]\nwinding = \"P\"\n[[stack]]\nwinding = \"A\"\n[[stack]]\nwinding = \"S\"\n",
        round_bobbin(12.0, 3.0, 10.0),
        w("P", "primary", "current_rms_a = 2.0\n"),
        w("A", "auxiliary", ""),
        w("S", "secondary", "current_rms_a = 2.0\n"),
    );
    let (_, e) = eval(&text);
    let a = e.windings.iter().find(|w| w.name.as_str() == "A").unwrap();
    let rho = 1.7241e-8 * (1.0 + 0.00393 * 80.0);
    let delta_mm = (rho / (PI * 100e3 * 4.0e-7 * PI)).sqrt() * 1e3;
    let h = 0.5 * PI.sqrt() / 2.0;
    let d = (20.0 * h / 12.0f64).sqrt() * h / delta_mm;
    let g1 = ((2.0 * d).sinh() + (2.0 * d).sin()) / ((2.0 * d).cosh() - (2.0 * d).cos());
    let g2 = (d.sinh() * d.cos() + d.cosh() * d.sin()) / ((2.0 * d).cosh() - (2.0 * d).cos());
    let want = a.dcr_ohm * (20.0f64 * 2.0 / 20.0).powi(2) * d * (2.0 * g1 - 4.0 * g2);
    assert_rel(
        a.proximity_loss_w.unwrap(),
        want,
        1e-9,
        "proximity loss of A",
    );
    assert_rel(
        a.copper_loss_w.unwrap(),
        want,
        1e-9,
        "counted as its copper loss",
    );
}
