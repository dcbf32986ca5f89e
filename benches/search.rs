//! Search speed. Targets (issue: let the planner find the build): at least 500,000 candidate
//! evaluations a second on one core, and a full search on the demo build in under a second.
//!
//! - `evaluations`: brute force (no pruning, 1-2 strands) on the bench-forward example, every
//!   combination through `evaluate_with`, on one thread and on two. divan prints the rate in
//!   items a second, one item being one candidate evaluation.
//! - `full_search`: the search as `turnstack search` runs it, on the demo and each example,
//!   on one thread and on two; the items are again the candidates it evaluates (pruned
//!   combinations are not counted, though their pruning is timed).

use std::path::Path;
use turnstack::engine::search::{Settings, search};
use turnstack::files::load_build;
use turnstack::model::Build;

fn main() {
    divan::main();
}

const BUILDS: [&str; 4] = [
    "first-try",
    "bench-forward",
    "mains-isolated",
    "salvaged-too-small",
];

fn example(name: &str) -> Build {
    let path = Path::new(env!("CARGO_MANIFEST_DIR"))
        .join("examples")
        .join(format!("{name}.toml"));
    load_build(&path).unwrap_or_else(|e| panic!("{}", e.with_snippet()))
}

/// How many candidates a search with these settings sends through the engine.
fn evaluated(build: &Build, settings: &Settings) -> usize {
    search(build, settings, &|_, _| {}).unwrap().evaluated
}

fn run(bencher: divan::Bencher, build: &Build, settings: &Settings) {
    bencher
        .counter(divan::counter::ItemsCount::new(evaluated(build, settings)))
        .bench(|| {
            search(divan::black_box(build), settings, &|_, _| {})
                .unwrap()
                .evaluated
        });
}

/// Brute force on bench-forward: candidate evaluations a second, one and two threads.
#[divan::bench(consts = [1, 2], sample_count = 10)]
fn evaluations<const THREADS: usize>(bencher: divan::Bencher) {
    let settings = Settings {
        threads: THREADS,
        prune: false,
        max_strands: 2,
        ..Settings::default()
    };
    run(bencher, &example("bench-forward"), &settings);
}

/// The full search with the default settings, as the command line runs it.
#[divan::bench(args = BUILDS, consts = [1, 2], sample_count = 20)]
fn full_search<const THREADS: usize>(bencher: divan::Bencher, name: &str) {
    let settings = Settings {
        threads: THREADS,
        ..Settings::default()
    };
    run(bencher, &example(name), &settings);
}
