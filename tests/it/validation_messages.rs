//! The loader's messages, held against FORMAT.md "Validation": every broken file in
//! tests/broken/ must be refused with the message its `.expected` sidecar describes, naming the
//! file, the line:column where the toml library gives one, and the key. Also: parse never
//! panics on arbitrary text or on mutations of the examples.

use crate::common::{Expected, broken_dir, broken_files, read_expected};
use proptest::prelude::*;
use std::path::{Path, PathBuf};
use turnstack::files::{self, BobbinLibrary, LoadError};

/// Check one load error against its expectation; returns a description of what is wrong.
fn mismatch(path: &Path, err: &LoadError, exp: &Expected) -> Option<String> {
    let first = err.to_string();
    let mut wrong = Vec::new();
    if err.path.as_deref() != Some(path) {
        wrong.push(format!("path {:?}", err.path));
    }
    let got_at = err.line.zip(err.column);
    if got_at != exp.at {
        wrong.push(format!("position {got_at:?}, expected {:?}", exp.at));
    }
    if err.key != exp.key {
        wrong.push(format!("key {:?}, expected {:?}", err.key, exp.key));
    }
    // The first line reads `file:line:col: key: message` (parts without a value left out).
    let mut prefix = path.display().to_string();
    if let Some((l, c)) = exp.at {
        prefix.push_str(&format!(":{l}:{c}"));
    }
    prefix.push_str(": ");
    if let Some(k) = &exp.key {
        prefix.push_str(k);
        prefix.push_str(": ");
    }
    if !first.starts_with(&prefix) {
        wrong.push(format!("first line does not start with {prefix:?}"));
    }
    for piece in &exp.has {
        if !first.contains(piece.as_str()) {
            wrong.push(format!("missing {piece:?}"));
        }
    }
    (!wrong.is_empty()).then(|| format!("{}:\n  {first}\n  {}", path.display(), wrong.join("\n  ")))
}

/// FORMAT.md "Validation": each broken file is refused with its expected message.
#[test]
fn every_broken_file_is_refused_with_its_expected_message() {
    let files = broken_files();
    // The validation list of the spec plus the extra cases: far more than a handful.
    assert!(files.len() >= 30, "only {} broken files", files.len());
    let mut failures = Vec::new();
    for path in &files {
        let exp = read_expected(&path.with_extension("expected"));
        match files::load_build(path) {
            Ok(_) => failures.push(format!("{}: was accepted", path.display())),
            Err(e) => failures.extend(mismatch(path, &e, &exp)),
        }
    }
    assert!(failures.is_empty(), "\n{}", failures.join("\n"));
}

/// Every sidecar belongs to a broken file, so none is silently skipped.
#[test]
fn every_expected_sidecar_has_its_broken_file() {
    for e in std::fs::read_dir(broken_dir()).unwrap() {
        let p = e.unwrap().path();
        match p.extension().and_then(|x| x.to_str()) {
            Some("expected") => assert!(p.with_extension("toml").is_file(), "{}", p.display()),
            Some("toml") => assert!(p.with_extension("expected").is_file(), "{}", p.display()),
            _ => panic!("stray file {}", p.display()),
        }
    }
}

/// FORMAT.md "Validation": an unknown bobbin id lists the ids that exist, every one of them.
#[test]
fn unknown_bobbin_id_lists_every_bundled_id() {
    let path = broken_dir().join("unknown-bobbin-id.toml");
    let err = files::load_build(&path).unwrap_err();
    let ids = turnstack::library::bobbins::bundled();
    assert!(ids.len() >= 8);
    for (id, _) in ids {
        assert!(
            err.message.contains(id),
            "{id} not listed in {}",
            err.message
        );
    }
}

/// A minimal valid build naming bobbin `id`, with the bobbin line on line 3.
fn build_naming(id: &str) -> String {
    format!(
        "format = 1\ntitle = \"bench former\"\nbobbin = \"{id}\"\n\n\
         [[winding]]\nname = \"P\"\nrole = \"primary\"\nturns = 20\nwire = \"0.40mm\"\n\n\
         [[stack]]\nwinding = \"P\"\n"
    )
}

const GOOD_BOBBIN: &str = "format = 1\nname = \"bench former\"\norigin = \"measured\"\n\n\
    [window]\nwidth_mm = 12.0\nheight_mm = 3.0\n\n[tube]\nshape = \"round\"\ndiameter_mm = 8.0\n";

/// Write `build.toml` and `bobbins/<id>.toml` into a temporary folder.
fn beside(id: &str, bobbin_text: &str) -> (tempfile::TempDir, PathBuf, PathBuf) {
    let dir = tempfile::tempdir().unwrap();
    std::fs::create_dir(dir.path().join("bobbins")).unwrap();
    let bobbin = dir.path().join("bobbins").join(format!("{id}.toml"));
    std::fs::write(&bobbin, bobbin_text).unwrap();
    let build = dir.path().join("build.toml");
    std::fs::write(&build, build_naming(id)).unwrap();
    (dir, build, bobbin)
}

/// FORMAT.md "Lookup": a bobbin file beside the build is found first and used.
#[test]
fn bobbin_file_beside_the_build_is_used() {
    let (_dir, build, _) = beside("bench-former", GOOD_BOBBIN);
    let b = files::load_build(&build).unwrap();
    assert_eq!(b.bobbin.window.width_mm, 12.0);
    assert_eq!(b.bobbin.name, "bench former");
}

/// FORMAT.md "Validation": a broken bobbin file beside the build is refused, and the message
/// names both the build's `bobbin` line and the bobbin file with its own line:column and key.
#[test]
fn broken_bobbin_file_beside_the_build_names_both_files() {
    let cases = [
        // (bobbin text, line:col in the bobbin file, pieces of the message)
        (
            GOOD_BOBBIN.replace("width_mm = 12.0", "width = 12.0"),
            "6:1",
            vec!["unknown field `width`", "`width_mm`"],
        ),
        (
            GOOD_BOBBIN.replace("height_mm = 3.0", "height_mm = -3.0"),
            "7:13",
            vec![
                "window.height_mm",
                "must be a positive length in mm, got -3",
            ],
        ),
        (
            GOOD_BOBBIN.replace("format = 1", "format = 3"),
            "1:10",
            vec!["format", "reads format 1, the file says 3"],
        ),
        (
            GOOD_BOBBIN.replace("\"round\"", "\"oval\""),
            "10:9",
            vec!["tube.shape", "unknown tube shape \"oval\""],
        ),
    ];
    for (text, at, pieces) in cases {
        let (_dir, build, bobbin) = beside("cracked", &text);
        let err = files::load_build(&build).unwrap_err();
        let first = err.to_string();
        let head = format!(
            "{}:3:10: bobbin: bobbin \"cracked\" cannot be used: ",
            build.display()
        );
        assert!(first.starts_with(&head), "{first}");
        let inner = format!("{}:{at}: ", bobbin.display());
        assert!(first.contains(&inner), "{inner:?} not in {first}");
        for p in pieces {
            assert!(first.contains(p), "{p:?} not in {first}");
        }
    }
}

/// FORMAT.md "Bobbin file": a bobbin file must say `format = 1` (an inline table need not).
#[test]
fn bobbin_file_without_format_is_refused() {
    let text = GOOD_BOBBIN.replace("format = 1\n", "");
    let err = files::parse_bobbin(&text, Some(Path::new("bobbins/x.toml"))).unwrap_err();
    assert_eq!(err.key.as_deref(), Some("format"));
    assert!(err.message.contains("format = 1"), "{}", err.message);
    assert!(
        err.to_string().starts_with("bobbins/x.toml:1:1: format: "),
        "{err}"
    );
}

/// FORMAT.md "Bobbin file": a round tube takes `diameter_mm`, not the rect keys.
#[test]
fn round_tube_with_a_rect_key_is_refused() {
    let text = GOOD_BOBBIN.replace("diameter_mm = 8.0", "diameter_mm = 8.0\nwidth_mm = 8.0");
    let err = files::parse_bobbin(&text, Some(Path::new("b.toml"))).unwrap_err();
    assert_eq!(err.key.as_deref(), Some("tube.width_mm"));
    assert_eq!((err.line, err.column), (Some(12), Some(12)));
    assert!(
        err.message.contains("round tube has no `width_mm`"),
        "{}",
        err.message
    );
}

/// A missing file is refused with the file named and the reason, not a panic.
#[test]
fn missing_build_file_names_the_file() {
    let path = broken_dir().join("no-such-file.toml");
    let err = files::load_build(&path).unwrap_err();
    let first = err.to_string();
    assert!(first.starts_with(&path.display().to_string()), "{first}");
    assert!(first.contains("no such file"), "{first}");
}

fn examples() -> Vec<String> {
    ["bench-forward", "mains-isolated", "salvaged-too-small"]
        .iter()
        .map(|n| {
            let p = Path::new(env!("CARGO_MANIFEST_DIR")).join(format!("examples/{n}.toml"));
            std::fs::read_to_string(p).unwrap()
        })
        .collect()
}

/// Parse, and when the text is accepted, evaluate and render it: none of it may panic.
fn load_and_use(text: &str) {
    let lib = BobbinLibrary::bundled_only();
    match files::parse_build(text, Some(Path::new("fuzz.toml")), &lib) {
        Ok(build) => {
            let eval = turnstack::engine::evaluate(&build);
            let _ = turnstack::report::text::render(&build, &eval);
            let _ = turnstack::report::json::report(&build, &eval);
        }
        Err(e) => {
            let _ = e.with_snippet();
        }
    }
}

/// One edit of a text, by character position (so the text stays valid UTF-8).
#[derive(Debug, Clone)]
enum Edit {
    Delete(usize),
    Insert(usize, char),
    Replace(usize, char),
    /// Cut a line out.
    DropLine(usize),
    /// Put a line in twice.
    RepeatLine(usize),
}

fn apply(text: &str, edits: &[Edit]) -> String {
    let mut chars: Vec<char> = text.chars().collect();
    for e in edits {
        let n = chars.len().max(1);
        match *e {
            Edit::Delete(i) if !chars.is_empty() => {
                chars.remove(i % n);
            }
            Edit::Insert(i, c) => chars.insert(i % (chars.len() + 1), c),
            Edit::Replace(i, c) if !chars.is_empty() => chars[i % n] = c,
            Edit::DropLine(i) | Edit::RepeatLine(i) => {
                let s: String = chars.iter().collect();
                let mut lines: Vec<&str> = s.lines().collect();
                if !lines.is_empty() {
                    let k = i % lines.len();
                    if matches!(e, Edit::DropLine(_)) {
                        lines.remove(k);
                    } else {
                        lines.insert(k, lines[k]);
                    }
                }
                chars = lines.join("\n").chars().collect();
            }
            _ => {}
        }
    }
    chars.into_iter().collect()
}

/// Characters that matter to TOML and to the numbers of a build, plus anything at all.
fn edit_char() -> impl Strategy<Value = char> {
    prop_oneof![
        prop::sample::select(vec![
            '=', '"', '[', ']', '{', '}', ',', '.', '-', '+', '#', '\n', ' ', '0', '1', '9', 'e',
            '_', 'x', '\'',
        ]),
        any::<char>(),
    ]
}

fn edit() -> impl Strategy<Value = Edit> {
    prop_oneof![
        any::<usize>().prop_map(Edit::Delete),
        (any::<usize>(), edit_char()).prop_map(|(i, c)| Edit::Insert(i, c)),
        (any::<usize>(), edit_char()).prop_map(|(i, c)| Edit::Replace(i, c)),
        any::<usize>().prop_map(Edit::DropLine),
        any::<usize>().prop_map(Edit::RepeatLine),
    ]
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 256, ..ProptestConfig::default() })]

    /// A panic is a bug (design): arbitrary text is refused with a message or accepted.
    #[test]
    fn parse_build_never_panics_on_arbitrary_text(text in any::<String>()) {
        load_and_use(&text);
    }

    /// Text made of TOML's own pieces gets further into the loader than random characters.
    #[test]
    fn parse_build_never_panics_on_toml_like_text(
        text in "(format = 1\n|bobbin = \"e25-13-7\"\n|\\[\\[winding\\]\\]\n|\\[\\[stack\\]\\]\n|\\[setup\\]\n|name = \"P\"\n|turns = -?[0-9]{1,3}\n|wire = \"[a-z0-9.]{1,6}\"\n|role = \"[a-z]{1,9}\"\n|tape = [0-9]\n|winding = \"[PS]\"\n|[a-z_]{1,8} = [0-9.e-]{1,6}\n){0,24}"
    ) {
        load_and_use(&text);
    }

    /// Random edits of the three examples: refused with a message or accepted, never a panic.
    #[test]
    fn parse_build_never_panics_on_mutated_examples(
        which in 0usize..3,
        edits in prop::collection::vec(edit(), 1..5),
    ) {
        let text = apply(&examples()[which], &edits);
        load_and_use(&text);
    }
}

/// A build file given where requirements are wanted, or back, is refused at the foreign
/// table with a sentence naming the command that reads it; a build that is merely wrong says
/// nothing of requirements.
#[test]
fn the_wrong_kind_of_file_names_the_command_that_reads_it() {
    let lib = BobbinLibrary::bundled_only();
    let build = std::fs::read_to_string("examples/first-try.toml").unwrap();
    let req = std::fs::read_to_string("examples/requirements/bench-supply-5v.toml").unwrap();

    let e = files::parse_requirements(&build, None, &lib).unwrap_err();
    assert!(e.message.contains("looks like a build file"), "{e}");
    assert!(e.message.contains("turnstack check"), "{e}");

    let e = files::parse_build(&req, None, &lib).unwrap_err();
    assert!(e.message.contains("looks like a requirements file"), "{e}");
    assert!(e.message.contains("turnstack design"), "{e}");

    let wrong = build.replacen("format = 1", "format = 1\nbobin = \"x\"", 1);
    let e = files::parse_build(&wrong, None, &lib).unwrap_err();
    assert!(!e.message.contains("requirements"), "{e}");
}
