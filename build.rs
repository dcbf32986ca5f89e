//! Compiles every `bobbins/*.toml` into the binary, so an installed program has the library.

use std::fmt::Write as _;
use std::path::Path;

fn main() {
    let dir = Path::new(env!("CARGO_MANIFEST_DIR")).join("bobbins");
    println!("cargo:rerun-if-changed=bobbins");
    let mut files: Vec<_> = std::fs::read_dir(&dir)
        .map(|rd| {
            rd.filter_map(|e| e.ok().map(|e| e.path()))
                .filter(|p| p.extension().is_some_and(|x| x == "toml"))
                .collect()
        })
        .unwrap_or_default();
    files.sort();
    let mut out = String::from("&[\n");
    for path in &files {
        println!("cargo:rerun-if-changed={}", path.display());
        let id = path.file_stem().unwrap().to_string_lossy();
        let _ = writeln!(
            out,
            "    ({id:?}, include_str!({:?})),",
            path.display().to_string()
        );
    }
    out.push_str("]\n");
    let dest = Path::new(&std::env::var("OUT_DIR").unwrap()).join("bundled_bobbins.rs");
    std::fs::write(dest, out).unwrap();
}
