//! The bench figures the winding sheet quotes (`engine::bench`), against their outside
//! definitions: copper's temperature coefficient (IEC 60028) and L = AL N^2 (the definition
//! of AL, any ferrite handbook).

use crate::common::example;
use turnstack::engine::bench::{self, Spread};
use turnstack::engine::primary_secondary_leakage;
use turnstack::model::Role;

/// IEC 60028: annealed copper's resistance rises by 0.00393 per kelvin of the value at 20 C,
/// so R(20 C) = R(T) / (1 + 0.00393 (T - 20)). The examples evaluate at 100 C.
#[test]
fn dcr_at_the_bench_follows_iec_60028() {
    let (b, e) = example("bench-forward");
    assert!((b.setup.temperature_c - 100.0).abs() < 1e-9);
    let at_bench = bench::dcr_at_bench(&e, 20.0);
    assert_eq!(at_bench.len(), e.windings.len());
    for (w, got) in e.windings.iter().zip(&at_bench) {
        let want = w.dcr_ohm / (1.0 + 0.00393 * 80.0);
        assert!(
            ((got.expected - want) / want).abs() < 1e-3,
            "{}: {} against {want}",
            w.name,
            got.expected
        );
        assert!(got.low < got.expected && got.expected < got.high);
    }
    // At the build's own temperature the figure is the evaluation's.
    for (w, got) in e.windings.iter().zip(bench::dcr_at_bench(&e, 100.0)) {
        assert!((got.expected - w.dcr_ohm).abs() < 1e-12 * w.dcr_ohm.max(1.0));
    }
}

/// L = AL N^2, AL in nH per turn squared: the first primary's magnetising inductance in uH.
#[test]
fn magnetising_inductance_is_al_times_turns_squared() {
    for name in [
        "bench-forward",
        "mains-isolated",
        "salvaged-too-small",
        "first-try",
    ] {
        let (b, _) = example(name);
        let al = b.bobbin.core.as_ref().and_then(|c| c.al_nh);
        let p = b.first_of(Role::Primary).unwrap();
        match (al, bench::magnetising_at_bench(&b)) {
            (Some(al), Some(Spread { expected, .. })) => {
                let n = f64::from(p.turns);
                let want_uh = al * n * n / 1000.0;
                assert!((expected - want_uh).abs() < 1e-9 * want_uh, "{name}");
            }
            (None, None) => {}
            (al, got) => panic!("{name}: AL {al:?} but {got:?}"),
        }
    }
}

/// The pair the sheet, the ranking and the search quote is the first primary to the first
/// secondary, referred to the primary.
#[test]
fn the_primary_secondary_pair_is_the_first_of_each_role() {
    let (b, e) = example("bench-forward");
    let l = primary_secondary_leakage(&b, &e).expect("a P-S pair");
    assert_eq!(l.from, b.first_of(Role::Primary).unwrap().name);
    assert_eq!(l.to, b.first_of(Role::Secondary).unwrap().name);
    assert_eq!(l.referred_to, l.from);
    assert!(l.uh > 0.0);
}
