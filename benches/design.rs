//! Design speed. Target (issue: design from the requirements): the whole bundled library
//! designed, searched and ranked for the example requirements in under 2 s on the 2-core
//! machine.

use std::path::Path;
use std::sync::atomic::AtomicBool;
use turnstack::engine::design::{DesignSettings, design};
use turnstack::files::{BobbinLibrary, load_requirements};

fn main() {
    divan::main();
}

/// `turnstack design examples/requirements/bench-supply-5v.toml` over the bundled library.
#[divan::bench(sample_count = 3)]
fn full_design(bencher: divan::Bencher) {
    let path =
        Path::new(env!("CARGO_MANIFEST_DIR")).join("examples/requirements/bench-supply-5v.toml");
    let library = BobbinLibrary::bundled_only();
    let req = load_requirements(&path, &library).unwrap_or_else(|e| panic!("{e}"));
    let bobbins: Vec<_> = library
        .entries()
        .into_iter()
        .filter_map(|e| {
            e.bobbin
                .ok()
                .filter(|b| b.core.is_some())
                .map(|b| (e.id, b))
        })
        .collect();
    bencher.bench(|| {
        design(
            divan::black_box(&req),
            &bobbins,
            &DesignSettings::default(),
            &|_, _| {},
            &AtomicBool::new(false),
        )
        .designs
        .len()
    });
}
