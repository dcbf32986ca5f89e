//! AC resistance held against its sources: skin depth (Ramo, Whinnery & Van Duzer; copper by
//! IEC 60028), Dowell 1966 and its published forms, and the harmonic method of Hurley, Gath
//! and Breslin 2000 with the Fourier series of a pulse.

use std::f64::consts::PI;
use turnstack::engine::ac;
use turnstack::engine::harmonics::{self, Piece, Waveform};
use turnstack::engine::resistance::rho_ohm_m;

fn close(a: f64, b: f64, rel: f64) -> bool {
    (a - b).abs() <= rel * b.abs().max(1e-300)
}

/// Skin depth sqrt(rho / (pi f mu0)) (Ramo, Whinnery & Van Duzer, Fields and Waves in
/// Communication Electronics), rho by IEC 60028: 0.2090 mm at 100 kHz and 20 C.
#[test]
fn skin_depth_100khz_20c_is_0_2090_mm_ramo_whinnery_iec60028() {
    let d_mm = ac::skin_depth_m(rho_ohm_m(20.0), 100e3) * 1e3;
    assert!(close(d_mm, 0.2090, 5e-4), "{d_mm}");
}

/// Same formula and source, copper at 100 C (rho20 x 1.3144): 0.2396 mm at 100 kHz.
#[test]
fn skin_depth_100khz_100c_is_0_2396_mm_ramo_whinnery_iec60028() {
    let d_mm = ac::skin_depth_m(rho_ohm_m(100.0), 100e3) * 1e3;
    assert!(close(d_mm, 0.2396, 5e-4), "{d_mm}");
}

/// Dowell 1966, F_R = D [M(D) + 2(m^2-1)/3 D'(D)], evaluated by hand at tabulated points
/// (5 significant figures).
#[test]
fn dowell_fr_matches_hand_evaluated_table_dowell_1966() {
    let table: [(f64, [(u32, f64); 4]); 5] = [
        (0.5, [(1, 1.0055), (2, 1.0263), (3, 1.0610), (10, 1.6913)]),
        (1.0, [(1, 1.0856), (2, 1.4060), (3, 1.9400), (10, 11.658)]),
        (1.5, [(1, 1.3781), (2, 2.7793), (4, 8.3842), (8, 30.804)]),
        (2.0, [(1, 1.8978), (3, 10.561), (6, 39.799), (10, 109.10)]),
        (3.0, [(1, 3.0101), (2, 9.5383), (5, 55.236), (10, 218.44)]),
    ];
    for (d, row) in table {
        for (m, want) in row {
            let got = ac::dowell_fr(d, m);
            assert!(close(got, want, 1e-4), "D {d} m {m}: {got} vs {want}");
        }
    }
}

/// Dowell's sinh/sin form equals the G1/G2 form of Erickson & Maksimovic, Fundamentals of
/// Power Electronics (2nd ed., ch. 13): F_R = D [G1 + (2/3)(m^2 - 1)(G1 - 2 G2)], because
/// G1 - 2 G2 = (sinh D - sin D)/(cosh D + cos D).
#[test]
fn dowell_form_equals_erickson_g1_g2_form() {
    for i in 1..=60 {
        let d = 0.1 * f64::from(i);
        let dd = (d.sinh() - d.sin()) / (d.cosh() + d.cos());
        assert!(close(ac::g1(d) - 2.0 * ac::g2(d), dd, 1e-9), "D {d}");
        for m in [1u32, 2, 3, 5, 8] {
            let mf = f64::from(m);
            let erickson =
                d * (ac::g1(d) + 2.0 / 3.0 * (mf * mf - 1.0) * (ac::g1(d) - 2.0 * ac::g2(d)));
            assert!(close(ac::dowell_fr(d, m), erickson, 1e-9), "D {d} m {m}");
        }
    }
}

/// The per-layer form (MMF k-1 to k on layer k) averaged over m equal layers is Dowell's
/// m-layer formula (Dowell 1966): the general form the engine uses for interleaved windings.
#[test]
fn per_layer_form_sums_to_dowell_m_layer_formula() {
    for d in [0.3, 0.8, 1.5, 2.5] {
        for m in [1u32, 2, 3, 6] {
            let sum: f64 = (1..=m)
                .map(|k| ac::layer_factor(d, f64::from(k - 1), f64::from(k)))
                .sum();
            let mean = sum / f64::from(m);
            assert!(close(mean, ac::dowell_fr(d, m), 1e-9), "D {d} m {m}");
            let fast: f64 = (1..=m)
                .map(|k| ac::layer_factor_fast(d, f64::from(k - 1), f64::from(k)))
                .sum::<f64>()
                / f64::from(m);
            assert!(close(fast, mean, 1e-12), "fast form, D {d} m {m}");
        }
    }
}

/// Dowell 1966, per-layer loss with field on both faces: a layer whose MMF runs from -1 to +1
/// (the middle layer of an interleaved section) has D [2 G1 + 4 G2] / 4, and it loses less
/// than a layer carrying the same current with the MMF rising from 1 to 3.
#[test]
fn symmetric_mmf_layer_has_the_dowell_interleaved_value() {
    for d in [0.5, 1.0, 2.0] {
        // F_a = -1, F_b = 1: D [G1 (1 + 1) + 4 G2] / 4.
        let want = d * (2.0 * ac::g1(d) + 4.0 * ac::g2(d)) / 4.0;
        assert!(close(ac::layer_factor(d, -1.0, 1.0), want, 1e-12));
        assert!(ac::layer_factor(d, -1.0, 1.0) < ac::layer_factor(d, 1.0, 3.0));
    }
}

/// Low-frequency limit of Dowell's formula: F_R -> 1 + (5 m^2 - 1) D^4 / 45 as D -> 0
/// (series expansion of Dowell 1966; also in Hurley, Gath and Breslin 2000).
#[test]
fn dowell_low_frequency_limit() {
    for m in [1u32, 2, 3, 5, 10] {
        let mf = f64::from(m);
        let d: f64 = 0.1;
        let approx = 1.0 + (5.0 * mf * mf - 1.0) * d.powi(4) / 45.0;
        let got = ac::dowell_fr(d, m);
        assert!(
            close(got - 1.0, approx - 1.0, 1e-3),
            "m {m}: {got} vs {approx}"
        );
        assert!((ac::dowell_fr(1e-4, m) - 1.0).abs() < 1e-9);
    }
}

/// Optimum layer thickness for a sinusoid: R_ac ~ F_R(D)/D is least near
/// D_opt = (15/(5 m^2 - 1))^(1/4), where F_R = 4/3 (Hurley, Gath and Breslin 2000; Snelling,
/// Soft Ferrites, 2nd ed.). Held here against the exact formula for m >= 2.
#[test]
fn dowell_optimum_thickness_gives_four_thirds() {
    for m in 2u32..=10 {
        let mf = f64::from(m);
        let d_opt = (15.0 / (5.0 * mf * mf - 1.0)).powf(0.25);
        // Golden-section search for the minimum of F_R(D)/D on [0.1, 3].
        let (mut a, mut b) = (0.1f64, 3.0f64);
        let g = (5f64.sqrt() - 1.0) / 2.0;
        let cost = |d: f64| ac::dowell_fr(d, m) / d;
        for _ in 0..200 {
            let c = b - g * (b - a);
            let e = a + g * (b - a);
            if cost(c) < cost(e) {
                b = e;
            } else {
                a = c;
            }
        }
        let d_star = 0.5 * (a + b);
        assert!(close(d_star, d_opt, 0.025), "m {m}: {d_star} vs {d_opt}");
        let fr = ac::dowell_fr(d_star, m);
        assert!((fr - 4.0 / 3.0).abs() < 0.02, "m {m}: F_R {fr}");
    }
}

/// Fourier series of a rectangular pulse of height I and duty D (standard; as used by
/// Hurley, Gath and Breslin 2000): I_n = (2 I / (n pi)) |sin(n pi D)|. D = 0.4: n = 1..5 give
/// 0.60546, 0.18710, 0.12473, 0.15137, 0.
#[test]
fn pulse_fourier_amplitudes_match_the_series() {
    let w = Waveform::pulse(1.0, 0.4);
    for (n, want) in [(1, 0.60546), (2, 0.18710), (3, 0.12473), (4, 0.15137)] {
        assert!(
            close(w.amplitude(n), want, 1e-4),
            "n {n}: {}",
            w.amplitude(n)
        );
    }
    assert!(w.amplitude(5) < 1e-12);
    for n in 1..50 {
        let series = 2.0 / (n as f64 * PI) * (n as f64 * PI * 0.4).sin().abs();
        assert!((w.amplitude(n) - series).abs() < 1e-12, "n {n}");
    }
    assert!(close(w.dc(), 0.4, 1e-12));
}

/// Parseval's theorem: I_dc^2 + sum of I_n^2 / 2 = I_rms^2 = D I^2. With 20 000 harmonics
/// the pulse at D = 0.4 reaches 0.399995 (the tail falls as 1/n^2).
#[test]
fn parseval_holds_for_the_pulse() {
    let s = harmonics::spectrum(&Waveform::pulse(1.0, 0.4), 20_000);
    let sum = s.dc * s.dc + s.harmonic_rms_sq.iter().sum::<f64>();
    assert!((sum - 0.399995).abs() < 2e-6, "{sum}");
    assert!(close(s.rms_sq, 0.4, 1e-12));
}

/// Parseval for a trapezoid (the primary's pulse with its magnetising ramp) and a triangle
/// (the reset current): the RMS of a straight piece is sqrt(D (a^2 + a b + b^2) / 3).
#[test]
fn parseval_holds_for_ramps() {
    for (a, b, t0, t1) in [(1.0, 1.5, 0.0, 0.35), (0.3, 0.0, 0.45, 0.8)] {
        let w = Waveform::ramp(a, b, t0, t1);
        let want = (t1 - t0) * (a * a + a * b + b * b) / 3.0;
        assert!(close(w.rms().powi(2), want, 1e-12));
        let s = harmonics::spectrum(&w, 5000);
        let sum = s.dc * s.dc + s.harmonic_rms_sq.iter().sum::<f64>();
        assert!((sum - want).abs() < 1e-4 * want, "{sum} vs {want}");
    }
}

/// Hurley, Gath and Breslin 2000: R_eff/R_dc = [I_dc^2 + sum I_n^2 F_R(n)] / I_rms^2. A pure
/// sinusoid (here a sine wave made of many straight pieces) gives F_R at the fundamental,
/// and a pulse, with its DC part at F_R = 1 and its harmonics above, gives more than the
/// sinusoid whenever F_R(n) rises fast enough (a thick 3-layer winding).
#[test]
fn hurley_sum_reduces_to_the_sinusoid_and_exceeds_it_for_a_pulse() {
    let n_pieces = 2000;
    let pieces = (0..n_pieces)
        .map(|k| {
            let t0 = k as f64 / n_pieces as f64;
            let t1 = (k + 1) as f64 / n_pieces as f64;
            Piece {
                t0,
                t1,
                y0: (2.0 * PI * t0).sin(),
                y1: (2.0 * PI * t1).sin(),
            }
        })
        .collect();
    let sine = Waveform { pieces };
    let fr = |n: usize| ac::dowell_fr(1.2 * (n as f64).sqrt(), 3);
    let s = harmonics::spectrum(&sine, 100);
    let f = harmonics::waveform_factor(&s, fr);
    assert!(close(f, fr(1), 1e-5), "{f} vs {}", fr(1));

    let p = harmonics::spectrum(&Waveform::pulse(1.0, 0.4), 100);
    let fp = harmonics::waveform_factor(&p, fr);
    // By hand from the amplitudes: the DC part (0.16 of 0.4) sees 1, the fundamental
    // (0.183) sees F_R(1), the rest sees more.
    let lower =
        (0.16 + 0.5 * 0.60546f64.powi(2) * fr(1) + (0.4 - 0.16 - 0.5 * 0.60546f64.powi(2)) * fr(2))
            / 0.4;
    assert!(fp > lower, "{fp} vs {lower}");
    assert!(fp > fr(1));
}

/// Hurley, Gath and Breslin (2000), R_eff/R_dc = [I_dc^2 + sum I_n^2 F_R(D sqrt n)] / I_rms^2,
/// with the secondary's pulse (Iout over D = Vo Np / (Ns Vin) = 5/40 of the period) expanded
/// here by numerical Fourier integration (midpoint rule, 80 000 samples) rather than the
/// engine's closed form, and F_R Dowell's two-layer formula (Dowell 1966): the build is P then
/// S, two full layers each of 20 turns of 0.5 mm wire in a 12 mm breadth, on a tube so large
/// that the layers' lengths are equal, so S is a two-layer portion from zero MMF. Summed as
/// FORMAT.md defines it: harmonics 1..100 and Parseval's remainder at the 100th factor.
#[test]
fn waveform_ac_factor_matches_an_independent_fourier_integration_hurley() {
    let w = |n: &str, role: &str, turns: u32, bare: f64, od: f64| {
        format!(
            "[[winding]]\nname = \"{n}\"\nrole = \"{role}\"\nturns = {turns}\n\
             wire = {{ bare_mm = {bare:?}, od_mm = {od:?} }}\n"
        )
    };
    let text = format!(
        "format = 1\ntitle = \"Hurley case\"\n[bobbin]\nname = \"t\"\norigin = \"t\"\n\
         [bobbin.window]\nwidth_mm = 12.0\nheight_mm = 5.0\n[bobbin.tube]\nshape = \"round\"\n\
         diameter_mm = 10000.0\n[setup]\ntemperature_c = 100\nfrequency_khz = 100\n\n{}{}{}\
         [[stack]]\nwinding = \"P\"\n[[stack]]\ntape = 2\n[[stack]]\nwinding = \"S\"\n\
         [[stack]]\ntape = 1\n[[stack]]\nwinding = \"R\"\n\n\
         [operating]\nvin_min_v = 40\nvin_max_v = 60\nvout_v = 5\niout_a = 4\n",
        w("P", "primary", 40, 0.5, 0.6),
        w("S", "secondary", 40, 0.5, 0.6),
        w("R", "reset", 40, 0.15, 0.2),
    );
    let b = turnstack::files::parse_build(
        &text,
        None,
        &turnstack::files::BobbinLibrary::bundled_only(),
    )
    .expect("test build");
    let e = turnstack::engine::evaluate(&b);
    let s = e.windings.iter().find(|w| w.name.as_str() == "S").unwrap();
    let got =
        s.ac.as_ref()
            .unwrap()
            .ac_factor_waveform
            .expect("waveform factor");

    // The pulse, 4 A over 0.125 of the period, by the midpoint rule.
    let (duty, amp, samples) = (0.125f64, 4.0f64, 80_000usize);
    let i_of = |x: f64| if x < duty { amp } else { 0.0 };
    let xs: Vec<f64> = (0..samples)
        .map(|k| (k as f64 + 0.5) / samples as f64)
        .collect();
    let dc: f64 = xs.iter().map(|&x| i_of(x)).sum::<f64>() / samples as f64;
    let rms_sq: f64 = xs.iter().map(|&x| i_of(x).powi(2)).sum::<f64>() / samples as f64;
    let harmonic_sq = |n: usize| {
        let (mut re, mut im) = (0.0, 0.0);
        for &x in &xs {
            let (sn, cs) = (2.0 * PI * n as f64 * x).sin_cos();
            re += i_of(x) * cs;
            im -= i_of(x) * sn;
        }
        let (re, im) = (re / samples as f64, im / samples as f64);
        2.0 * (re * re + im * im)
    };
    // D at the fundamental: h = d sqrt(pi)/2, porosity 20 h / 12, delta at 100 C (IEC 60028).
    let rho = 1.7241e-8 * (1.0 + 0.00393 * 80.0);
    let delta_mm = (rho / (PI * 100e3 * 4.0e-7 * PI)).sqrt() * 1e3;
    let h = 0.5 * PI.sqrt() / 2.0;
    let d1 = (20.0 * h / 12.0f64).sqrt() * h / delta_mm;
    let fr = |n: usize| {
        let d = d1 * (n as f64).sqrt();
        let m = ((2.0 * d).sinh() + (2.0 * d).sin()) / ((2.0 * d).cosh() - (2.0 * d).cos());
        let dd = (d.sinh() - d.sin()) / (d.cosh() + d.cos());
        d * (m + 2.0 * (4.0 - 1.0) / 3.0 * dd)
    };
    let mut sum = dc * dc;
    let mut counted = dc * dc;
    for n in 1..=100 {
        let p = harmonic_sq(n);
        sum += p * fr(n);
        counted += p;
    }
    sum += (rms_sq - counted).max(0.0) * fr(100);
    let want = sum / rms_sq;
    assert!(close(got, want, 2e-3), "waveform factor {got} vs {want}");
    // And well above the sinusoidal factor: the pulse's harmonics count.
    assert!(want > 1.5 * fr(1), "{want} vs {}", fr(1));
}
