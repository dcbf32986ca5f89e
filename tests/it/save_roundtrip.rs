//! Comment-keeping saves: every example, and generated annotated copies of them, loaded into
//! the planner, edited with its own keys, saved through the run loop's save, keep every
//! comment and every untouched line byte for byte, and read back as the build the planner
//! holds, with the same figures.

use crate::tui_support::press;
use std::path::{Path, PathBuf};
use turnstack::engine::evaluate;
use turnstack::files::{build_text, load_build};
use turnstack::tui::theme::Theme;
use turnstack::tui::{App, Effect, run::perform};

fn examples() -> Vec<PathBuf> {
    let dir = Path::new(env!("CARGO_MANIFEST_DIR")).join("examples");
    let mut v: Vec<PathBuf> = std::fs::read_dir(dir)
        .unwrap()
        .filter_map(|e| e.ok().map(|e| e.path()))
        .filter(|p| p.extension().is_some_and(|x| x == "toml"))
        .collect();
    v.sort();
    assert!(v.len() >= 4, "the examples are found");
    v
}

/// Edits made with the planner's keys: each a key script and a word for the failure message.
const EDITS: &[(&str, &str)] = &[
    ("", "no edit"),
    ("+", "more tape on the first section"),
    ("jj+", "more tape on the third section"),
    ("<tab>+", "one more turn on the first winding"),
    ("<tab>j-", "one turn less on the second winding"),
    ("jd", "delete the second section"),
    ("K", "move the first section outward"),
    ("+u", "an edit undone"),
];

/// The lines of `a` not in a longest common subsequence with `b`.
fn unmatched(a: &[&str], b: &[&str]) -> (Vec<String>, Vec<String>) {
    let (m, n) = (a.len(), b.len());
    let mut l = vec![vec![0u32; n + 1]; m + 1];
    for i in (0..m).rev() {
        for j in (0..n).rev() {
            l[i][j] = if a[i] == b[j] {
                l[i + 1][j + 1] + 1
            } else {
                l[i + 1][j].max(l[i][j + 1])
            };
        }
    }
    let (mut i, mut j) = (0, 0);
    let (mut gone, mut new) = (Vec::new(), Vec::new());
    while i < m || j < n {
        if i < m && j < n && a[i] == b[j] {
            i += 1;
            j += 1;
        } else if j < n && (i == m || l[i][j + 1] >= l[i + 1][j]) {
            new.push(b[j].to_string());
            j += 1;
        } else {
            gone.push(a[i].to_string());
            i += 1;
        }
    }
    (gone, new)
}

fn comments(text: &str) -> Vec<&str> {
    text.lines()
        .filter(|l| l.trim_start().starts_with('#'))
        .collect()
}

/// The key of a `key = value` line, or the header of a table line.
fn key_of(line: &str) -> &str {
    line.split('=').next().unwrap_or("").trim()
}

/// Load `text` as `file_name` in a fresh folder, run `keys` in the planner, save with `W`
/// through the run loop, and check what the issue asks of a save.
fn edit_and_check(text: &str, keys: &str, what: &str) -> bool {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("build.toml");
    std::fs::write(&path, text).unwrap();
    let build = load_build(&path).expect("the file loads");
    let mut app = App::new(build, Some(path.clone()));
    app.ui.theme = Theme::plain();
    press(&mut app, keys);
    let effects = press(&mut app, "W");
    assert_eq!(effects, [Effect::Save(path.clone())], "{what}: W saves");
    assert!(!perform(&mut app, effects[0].clone()));
    assert!(!app.dirty(), "{what}: saved");
    let saved = std::fs::read_to_string(&path).unwrap();

    // It reads back as the build the planner holds, with the same figures.
    let back = load_build(&path).unwrap_or_else(|e| panic!("{what}: reload: {e}\n{saved}"));
    assert_eq!(back, app.doc.build, "{what}");
    assert_eq!(evaluate(&back), evaluate(&app.doc.build), "{what}");

    let before: Vec<&str> = text.lines().collect();
    let after: Vec<&str> = saved.lines().collect();
    let (gone, new) = unmatched(&before, &after);
    if std::env::var_os("SHOW_SAVE_DIFF").is_some() {
        eprintln!("{what}: {gone:?} -> {new:?}");
    }
    if app.doc.build == load_build_text(text, &path) {
        assert_eq!(
            saved, text,
            "{what}: a save with no change writes the same bytes"
        );
    }
    // Every comment stays, in order; a moved section takes the comments above it along; a
    // removed one takes them away, and no other.
    if keys.contains('d') {
        let (_, added) = unmatched(&comments(text), &comments(&saved));
        assert!(added.is_empty(), "{what}: comments only removed: {added:?}");
    } else if keys.contains('K') {
        let mut a = comments(&saved);
        let mut b = comments(text);
        a.sort_unstable();
        b.sort_unstable();
        assert_eq!(a, b, "{what}: comments kept");
    } else {
        assert_eq!(comments(&saved), comments(text), "{what}: comments kept");
    }
    // A changed line keeps its key (and its trailing comment when the value had one).
    for g in &gone {
        let g_key = key_of(g);
        let moved = new.contains(g);
        let changed = new.iter().any(|n| key_of(n) == g_key);
        let section_line = keys.contains('d') || keys.contains('K');
        assert!(
            moved || changed || section_line,
            "{what}: line {g:?} lost\n--- saved:\n{saved}"
        );
        if let Some((_, c)) = g.split_once(" #")
            && !section_line
        {
            assert!(
                new.iter().any(|n| n.ends_with(c)),
                "{what}: the comment of {g:?} is kept"
            );
        }
    }
    // Few lines change: an edit changes one or two values (a section and its winding).
    if !keys.contains('d') && !keys.contains('K') {
        assert!(
            gone.len() <= 3 && new.len() <= 3,
            "{what}: {gone:?} became {new:?}"
        );
    }
    // The file changes exactly when the planner's build did.
    let changed = app.doc.build != load_build_text(text, &path);
    assert_eq!(
        saved != text,
        changed,
        "{what}: the file changes with the build"
    );
    changed
}

fn load_build_text(text: &str, path: &Path) -> turnstack::model::Build {
    turnstack::files::parse_build(
        text,
        Some(path),
        &turnstack::files::BobbinLibrary::for_build(path),
    )
    .unwrap()
}

#[test]
fn every_example_edited_in_the_planner_keeps_its_comments_and_untouched_lines() {
    for ex in examples() {
        let text = std::fs::read_to_string(&ex).unwrap();
        let mut changed = 0;
        for (keys, what) in EDITS {
            changed += usize::from(edit_and_check(
                &text,
                keys,
                &format!("{} ({what})", ex.display()),
            ));
        }
        // Most edits apply to every example (a refused one leaves the file as it was).
        assert!(changed >= EDITS.len() / 2, "{}: {changed}", ex.display());
    }
}

/// A small deterministic generator (linear congruential, constants of Knuth's MMIX).
struct Lcg(u64);

impl Lcg {
    fn next(&mut self) -> u64 {
        self.0 = self
            .0
            .wrapping_mul(6364136223846793005)
            .wrapping_add(1442695040888963407);
        self.0 >> 33
    }
    fn chance(&mut self, in_ten: u64) -> bool {
        self.next() % 10 < in_ten
    }
}

/// An example annotated the way people annotate: comment lines between lines, trailing
/// comments on keys and table headers, whole numbers written without a point, extra spaces.
fn annotate(text: &str, seed: u64) -> String {
    let mut r = Lcg(seed);
    let mut out = String::new();
    for (n, line) in text.lines().enumerate() {
        if r.chance(3) {
            out.push_str(&format!("# note {seed}-{n}: checked on the bench\n"));
        }
        let t = line.trim();
        let is_key = !t.is_empty() && !t.starts_with('#') && t.contains('=');
        let mut l = line.to_string();
        if is_key && !l.contains('#') && !l.contains('{') {
            let (k, v) = l.split_once('=').unwrap();
            let v = v.trim();
            // `40.0` written as `40`: the same number.
            let v = match v.strip_suffix(".0") {
                Some(w) if r.chance(5) && w.parse::<i64>().is_ok() => w.to_string(),
                _ => v.to_string(),
            };
            let pad = if r.chance(3) { "   " } else { " " };
            l = format!("{}{pad}={pad}{v}", k.trim_end());
        }
        if (is_key || t.starts_with('[')) && !l.contains('#') && r.chance(4) {
            l.push_str(&format!("   # why {n}"));
        }
        out.push_str(&l);
        out.push('\n');
        if t.is_empty() && r.chance(2) {
            out.push('\n');
        }
    }
    out
}

#[test]
fn generated_annotated_files_keep_every_comment_through_planner_edits() {
    let mut count = 0;
    for ex in examples() {
        let text = std::fs::read_to_string(&ex).unwrap();
        for seed in 1..=6u64 {
            let annotated = annotate(&text, seed);
            assert!(
                comments(&annotated).len() > comments(&text).len(),
                "the generator adds notes"
            );
            for (keys, what) in EDITS {
                edit_and_check(
                    &annotated,
                    keys,
                    &format!("{} seed {seed} ({what})", ex.display()),
                );
                count += 1;
            }
        }
    }
    assert!(count >= 4 * 6 * EDITS.len());
}

#[test]
fn a_metric_wire_keeps_all_its_digits() {
    // IEC 60317 gives nominal diameters to 3 decimals; a measured 0.31549 mm must not be
    // rounded, and 0.00004 mm must not become 0 mm (which the loader refuses).
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("b.toml");
    for wire in ["0.31549mm", "0.00004mm", "0.5mm", "1.0000001mm"] {
        let text = std::fs::read_to_string(&examples()[0]).unwrap().replacen(
            "wire = \"0.63mm\"",
            &format!("wire = \"{wire}\""),
            1,
        );
        std::fs::write(&path, &text).unwrap();
        let Ok(b) = load_build(&path) else {
            continue;
        };
        // Written fresh (no base text) and onto the file: both read back the same.
        let (fresh, _) = build_text(&b, None, &path);
        std::fs::write(&path, &fresh).unwrap();
        assert_eq!(load_build(&path).unwrap(), b, "{wire} fresh");
        let digits = wire.trim_end_matches("mm").trim_end_matches('0');
        assert!(fresh.contains(digits), "{wire}: {fresh}");
    }
}

proptest::proptest! {
    #![proptest_config(proptest::prelude::ProptestConfig { cases: 64, ..Default::default() })]

    /// Whatever text the base file holds (a half-edited file, another program's TOML), the
    /// save never panics and what it writes reads back as the build.
    #[test]
    fn a_save_onto_any_text_reads_back_as_the_build(
        base in "(format = 1\n|bobbin = \"e13-7-4\"\n|\\[\\[winding\\]\\]\n|\\[\\[stack\\]\\]\n|\\[setup\\]\n|\\[operating\\]\n|name = \"[PSR]\"\n|turns = [0-9]{1,3}\n|wire = \"awg2[0-9]\"\n|tape = [0-9]\n|# a note\n|winding = \"[PS]\"\n|[a-z_]{1,8} = [0-9.]{1,4}\n|\n){0,30}"
    ) {
        let path = Path::new(env!("CARGO_MANIFEST_DIR")).join("examples/bench-forward.toml");
        let build = load_build(&path).unwrap();
        let (text, _) = build_text(&build, Some(&base), &path);
        let back = turnstack::files::parse_build(
            &text,
            Some(&path),
            &turnstack::files::BobbinLibrary::for_build(&path),
        );
        proptest::prop_assert_eq!(back.ok(), Some(build));
    }
}

/// The line diff of a save of `build` onto `text`: (lines gone, lines new).
fn diff_of(text: &str, path: &Path, build: &turnstack::model::Build) -> (Vec<String>, Vec<String>) {
    let (saved, info) = build_text(build, Some(text), path);
    assert!(info.kept_layout, "merged, not regenerated");
    let back = load_build_text(&saved, path);
    assert_eq!(&back, build);
    let a: Vec<&str> = text.lines().collect();
    let b: Vec<&str> = saved.lines().collect();
    unmatched(&a, &b)
}

#[test]
fn new_and_removed_tables_go_where_a_person_would_put_them() {
    let path = examples()
        .into_iter()
        .find(|p| p.ends_with("salvaged-too-small.toml"))
        .unwrap();
    let text = std::fs::read_to_string(&path).unwrap();
    let b = load_build(&path).unwrap();

    // An inline bobbin's window height: that one line.
    let mut taller = b.clone();
    taller.bobbin.window.height_mm += 0.5;
    let (gone, new) = diff_of(&text, &path, &taller);
    assert_eq!(gone.len(), 1, "{gone:?}");
    assert!(
        gone[0].starts_with("height_mm") && new[0].starts_with("height_mm"),
        "{new:?}"
    );

    // A new [isolation] table: one block, after the last table the build has before it.
    let mut iso = b.clone();
    iso.isolation = Some(turnstack::model::Isolation {
        class: turnstack::model::IsolationClass::Functional,
        working_voltage_v: None,
        creepage_mm: None,
    });
    let (gone, new) = diff_of(&text, &path, &iso);
    assert!(gone.is_empty(), "{gone:?}");
    let mut new = new;
    new.sort();
    assert_eq!(new, ["", "[isolation]", "class = \"functional\""]);
    // After the last table's keys, before the notes that close the file.
    let (saved, _) = build_text(&iso, Some(&text), &path);
    let at = saved.find("[isolation]").unwrap();
    assert!(saved[..at].contains("duty_limit = 0.45"));
    assert!(saved[at..].contains("# Expected layout, worked by hand"));

    // The operating table removed: its lines go, the rest stays in order.
    let mut bare = b.clone();
    bare.operating = None;
    let (gone, new) = diff_of(&text, &path, &bare);
    assert!(new.is_empty(), "{new:?}");
    assert!(gone.iter().any(|l| l == "[operating]"), "{gone:?}");

    // The inline bobbin traded for a bundled id: the [bobbin] tables go, `bobbin = "id"`
    // takes their place among the top keys, the rest stays.
    let mut bundled = b.clone();
    let lib = turnstack::files::BobbinLibrary::bundled_only();
    bundled.bobbin = lib.find("e13-7-4").unwrap().unwrap();
    bundled.bobbin_source = turnstack::model::BobbinSource::Id("e13-7-4".into());
    let (gone, new) = diff_of(&text, &path, &bundled);
    assert_eq!(new, ["bobbin = \"e13-7-4\""]);
    assert!(gone.iter().any(|l| l == "[bobbin.window]"), "{gone:?}");
    assert!(gone.iter().all(|l| !l.starts_with("[setup]")));

    // A new winding goes after the last winding, before the stack.
    let mut more = b.clone();
    let mut aux = more.windings[0].clone();
    aux.name = "AUX".into();
    aux.role = turnstack::model::Role::Auxiliary;
    aux.turns = 3;
    more.windings.push(aux);
    more.stack.push(turnstack::model::Section::Winding(
        turnstack::model::WindingSection {
            winding: "AUX".into(),
            turns: None,
            partner: None,
            layer_tape: 0,
            spread: false,
        },
    ));
    assert_eq!(turnstack::engine::validate(&more), []);
    {
        let (saved, _) = build_text(&more, Some(&text), &path);
        let aux_at = saved.find("name = \"AUX\"").unwrap();
        let first_stack = saved.find("[[stack]]").unwrap();
        let last_winding_name = saved[..aux_at].rfind("[[winding]]").unwrap();
        assert!(
            aux_at < first_stack,
            "the new winding is listed with the others"
        );
        assert!(saved[..last_winding_name].matches("[[winding]]").count() == b.windings.len());
        assert_eq!(load_build_text(&saved, &path), more);
    }
}
