//! Time of `engine::evaluate` on each example build and on the bundled demo (target, issue 13:
//! a cold evaluate of a build with an operating point under 5 us). Files are loaded once,
//! outside the timed loop. divan prints evaluations a second beside each time (one item is
//! one evaluation).
//!
//! - `evaluate_demo`, `evaluate_example`: cold, as the planner and `check` run it:
//!   `engine::evaluate` starts an empty memo on every call, so nothing is reused.
//! - `evaluate_demo_warm`, `evaluate_example_warm`: `evaluate_with` and one memo kept across
//!   the calls, as the search's candidates share it (every spectrum and harmonic sum found).
//! - `harmonic_sum`, `spectrum`: the two pieces a cold evaluate adds to a warm one, one
//!   waveform's harmonic-summed Dowell terms at one D (forty points standing for 100
//!   harmonics, `engine::harmonic_sum`), and the spectrum it sums over. A cold evaluation of
//!   an example finds three spectra and four or five sums per temperature round (one round
//!   where `temperature_c` is given; mains-isolated, solved for ambient + rise, takes three).

use std::path::Path;
use turnstack::engine::harmonics::{self, HARMONICS, Waveform};
use turnstack::engine::memo::Memo;
use turnstack::engine::{evaluate, evaluate_with};
use turnstack::files::demo_build;
use turnstack::files::load_build;
use turnstack::model::Build;

fn main() {
    divan::main();
}

const EXAMPLES: [&str; 4] = [
    "first-try",
    "bench-forward",
    "mains-isolated",
    "salvaged-too-small",
];

fn example(name: &str) -> Build {
    let p = Path::new(env!("CARGO_MANIFEST_DIR")).join(format!("examples/{name}.toml"));
    load_build(&p).unwrap_or_else(|e| panic!("{}", e.with_snippet()))
}

fn demo() -> Build {
    demo_build().unwrap_or_else(|e| panic!("{}", e.with_snippet()))
}

fn one_item() -> divan::counter::ItemsCount {
    divan::counter::ItemsCount::new(1usize)
}

#[divan::bench(args = EXAMPLES)]
fn evaluate_example(bencher: divan::Bencher, name: &str) {
    let build = example(name);
    bencher
        .counter(one_item())
        .bench_local(|| evaluate(divan::black_box(&build)));
}

#[divan::bench]
fn evaluate_demo(bencher: divan::Bencher) {
    let build = demo();
    bencher
        .counter(one_item())
        .bench_local(|| evaluate(divan::black_box(&build)));
}

#[divan::bench(args = EXAMPLES)]
fn evaluate_example_warm(bencher: divan::Bencher, name: &str) {
    let build = example(name);
    let mut memo = Memo::new();
    bencher
        .counter(one_item())
        .bench_local(|| evaluate_with(divan::black_box(&build), &mut memo));
}

#[divan::bench]
fn evaluate_demo_warm(bencher: divan::Bencher) {
    let build = demo();
    let mut memo = Memo::new();
    bencher
        .counter(one_item())
        .bench_local(|| evaluate_with(divan::black_box(&build), &mut memo));
}

/// One harmonic sum at D = 1.3 (a thick layer at 100 kHz) over the primary-like trapezoid.
#[divan::bench]
fn harmonic_sum(bencher: divan::Bencher) {
    let s = harmonics::spectrum(&Waveform::ramp(1.0, 1.3, 0.0, 0.38), HARMONICS);
    bencher.bench_local(|| harmonics::summed_terms(divan::black_box(&s), divan::black_box(1.3)));
}

/// The spectrum (100 harmonics) of the primary-like trapezoid.
#[divan::bench]
fn spectrum(bencher: divan::Bencher) {
    let w = Waveform::ramp(1.0, 1.3, 0.0, 0.38);
    bencher.bench_local(|| harmonics::spectrum(divan::black_box(&w), HARMONICS));
}
