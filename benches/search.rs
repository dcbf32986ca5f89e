//! Search speed: a full search on each example, with one and with two threads. Candidates
//! per second = `evaluated` (printed once per example) / the median time.

use std::path::Path;
use turnstack::engine::search::{Settings, search};
use turnstack::files::load_build;
use turnstack::model::Build;

fn main() {
    for name in EXAMPLES {
        let build = example(name);
        let out = search(&build, &Settings::default(), &|_, _| {}).unwrap();
        eprintln!(
            "{name}: space {}, evaluated {}, pruned {}",
            out.space, out.evaluated, out.pruned
        );
    }
    let bench = example("bench-forward");
    let brute = Settings {
        prune: false,
        max_strands: 2,
        ..Settings::default()
    };
    let out = search(&bench, &brute, &|_, _| {}).unwrap();
    eprintln!(
        "brute force on bench-forward (1-2 strands): evaluated {}",
        out.evaluated
    );
    divan::main();
}

const EXAMPLES: [&str; 3] = ["bench-forward", "mains-isolated", "salvaged-too-small"];

fn example(name: &str) -> Build {
    let path = Path::new(env!("CARGO_MANIFEST_DIR"))
        .join("examples")
        .join(format!("{name}.toml"));
    load_build(&path).unwrap()
}

#[divan::bench(args = EXAMPLES, consts = [1, 2], sample_count = 20)]
fn full_search<const THREADS: usize>(bencher: divan::Bencher, name: &str) {
    let build = example(name);
    let settings = Settings {
        threads: THREADS,
        ..Settings::default()
    };
    bencher.bench(|| {
        search(divan::black_box(&build), &settings, &|_, _| {})
            .unwrap()
            .evaluated
    });
}

/// Brute force on bench-forward: every combination through `evaluate_with`, for the
/// evaluations-per-second figure (evaluated, printed above, over the median time).
#[divan::bench(consts = [1, 2], sample_count = 5)]
fn brute_force_bench_forward<const THREADS: usize>(bencher: divan::Bencher) {
    let build = example("bench-forward");
    let settings = Settings {
        threads: THREADS,
        prune: false,
        max_strands: 2,
        ..Settings::default()
    };
    bencher.bench(|| {
        search(divan::black_box(&build), &settings, &|_, _| {})
            .unwrap()
            .evaluated
    });
}
