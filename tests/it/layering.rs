//! The layers' borders, checked: a module may use only the layers at or below its own, in the
//! order model -> library -> engine -> files -> report -> tui / cli (DEVELOPERS.md, "How data
//! flows"). Of the two front ends the command line may start the planner; the planner does not
//! use the command line. Every path `crate::<layer>` in the code under src/ is read (the
//! `use crate::...` lines, their `{...}` groups, and paths written inline); comments are not.

use std::collections::BTreeSet;
use std::path::{Path, PathBuf};

/// The layers, lowest first; each may use its own and those before it.
const ORDER: &[&str] = &[
    "model", "library", "engine", "files", "report", "tui", "cli",
];

fn rank(layer: &str) -> Option<usize> {
    match layer {
        // The two front ends share the top rank.
        "cli" => Some(5),
        _ => ORDER.iter().position(|l| *l == layer),
    }
}

/// May code in layer `from` use layer `to`?
fn allowed(from: &str, to: &str) -> bool {
    if from == to {
        return true;
    }
    match (rank(from), rank(to)) {
        (Some(f), Some(t)) if f == t => from == "cli" && to == "tui",
        (Some(f), Some(t)) => t < f,
        // `crate::` followed by something that is not a layer (a macro, `crate::Foo`): no
        // layer is crossed.
        _ => true,
    }
}

/// The text without `//` comments (doc comments included).
fn strip_comments(text: &str) -> String {
    text.lines()
        .map(|l| match l.find("//") {
            Some(i) => &l[..i],
            None => l,
        })
        .collect::<Vec<_>>()
        .join("\n")
}

/// The first identifier of `s` (letters, digits, `_`).
fn ident(s: &str) -> &str {
    let end = s
        .find(|c: char| !(c.is_ascii_alphanumeric() || c == '_'))
        .unwrap_or(s.len());
    &s[..end]
}

/// The layers a text names after `crate::`, with `crate::{a::X, b::{Y, Z}}` read as a and b.
fn layers_used(text: &str) -> BTreeSet<String> {
    let code = strip_comments(text);
    let mut out = BTreeSet::new();
    let mut rest = code.as_str();
    while let Some(i) = rest.find("crate::") {
        rest = &rest[i + "crate::".len()..];
        let after = rest.trim_start();
        if let Some(group) = after.strip_prefix('{') {
            // Items at depth 0 of the group, each up to its first `::`.
            let mut depth = 0usize;
            let mut item_start = true;
            for (k, c) in group.char_indices() {
                match c {
                    '{' => depth += 1,
                    '}' if depth == 0 => break,
                    '}' => depth -= 1,
                    ',' if depth == 0 => item_start = true,
                    c if item_start && depth == 0 && !c.is_whitespace() => {
                        let name = ident(&group[k..]);
                        if !name.is_empty() {
                            out.insert(name.to_string());
                        }
                        item_start = false;
                    }
                    _ => {}
                }
            }
        } else {
            let name = ident(after);
            if !name.is_empty() {
                out.insert(name.to_string());
            }
        }
    }
    out
}

/// The wrong uses in a file of layer `layer`: "layer -> used".
fn violations(layer: &str, text: &str) -> Vec<String> {
    layers_used(text)
        .into_iter()
        .filter(|to| rank(to).is_some() && !allowed(layer, to))
        .map(|to| format!("{layer} -> {to}"))
        .collect()
}

fn rust_files(dir: &Path, out: &mut Vec<PathBuf>) {
    for entry in std::fs::read_dir(dir).unwrap() {
        let p = entry.unwrap().path();
        if p.is_dir() {
            rust_files(&p, out);
        } else if p.extension().is_some_and(|e| e == "rs") {
            out.push(p);
        }
    }
}

/// Every file under src/ uses only the layers at or below its own.
#[test]
fn every_import_under_src_follows_the_layer_order() {
    let src = Path::new(env!("CARGO_MANIFEST_DIR")).join("src");
    let mut files = Vec::new();
    rust_files(&src, &mut files);
    let mut wrong = Vec::new();
    let mut seen = BTreeSet::new();
    for f in &files {
        let rel = f.strip_prefix(&src).unwrap();
        let first = rel
            .components()
            .next()
            .unwrap()
            .as_os_str()
            .to_string_lossy();
        let layer = first.trim_end_matches(".rs").to_string();
        if rank(&layer).is_none() {
            // lib.rs and main.rs sit above every layer.
            assert!(
                matches!(layer.as_str(), "lib" | "main"),
                "unknown layer {layer}"
            );
            continue;
        }
        seen.insert(layer.clone());
        let text = std::fs::read_to_string(f).unwrap();
        for v in violations(&layer, &text) {
            wrong.push(format!("{}: {v}", rel.display()));
        }
    }
    assert_eq!(seen.len(), ORDER.len(), "layers found: {seen:?}");
    assert!(
        wrong.is_empty(),
        "imports against the layer order:\n{}",
        wrong.join("\n")
    );
}

/// The check catches a planted wrong import in each of its forms, and lets the right ones by.
#[test]
fn a_planted_wrong_import_is_caught() {
    assert_eq!(
        violations("engine", "use crate::tui::App;\n"),
        ["engine -> tui"]
    );
    assert_eq!(
        violations(
            "files",
            "use crate::{\n    model::Build,\n    report::{json, text},\n};\n"
        ),
        ["files -> report"]
    );
    assert_eq!(
        violations("library", "fn f() { crate::files::load_build(p); }"),
        ["library -> files"]
    );
    assert_eq!(
        violations("model", "pub use crate::engine::X;"),
        ["model -> engine"]
    );
    assert_eq!(violations("tui", "use crate::cli::main;"), ["tui -> cli"]);
    // Allowed: downward, within a layer, the command line starting the planner, comments.
    assert!(violations("report", "use crate::{engine::E, files::F, model::M};").is_empty());
    assert!(violations("engine", "use crate::engine::ac;").is_empty());
    assert!(violations("cli", "crate::tui::run::run(app)").is_empty());
    assert!(violations("engine", "/// See `crate::report::json`.\nfn f() {}").is_empty());
}
