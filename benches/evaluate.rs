//! Time of `engine::evaluate` on each example build and on the bundled demo (target: well under
//! 20 us for the demo, so the planner can re-evaluate on every key press). Files are loaded once,
//! outside the timed loop.

use std::path::Path;
use turnstack::engine::evaluate;
use turnstack::files::demo_build;
use turnstack::files::load_build;
use turnstack::model::Build;

fn main() {
    divan::main();
}

fn example(name: &str) -> Build {
    let p = Path::new(env!("CARGO_MANIFEST_DIR")).join(format!("examples/{name}.toml"));
    load_build(&p).unwrap_or_else(|e| panic!("{}", e.with_snippet()))
}

#[divan::bench(args = ["bench-forward", "mains-isolated", "salvaged-too-small"])]
fn evaluate_example(bencher: divan::Bencher, name: &str) {
    let build = example(name);
    bencher.bench_local(|| evaluate(divan::black_box(&build)));
}

#[divan::bench]
fn evaluate_demo(bencher: divan::Bencher) {
    let build = demo_build().unwrap_or_else(|e| panic!("{}", e.with_snippet()));
    bencher.bench_local(|| evaluate(divan::black_box(&build)));
}
