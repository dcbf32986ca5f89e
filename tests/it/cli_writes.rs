//! Commands that write files: no silent overwrite (`--force` needed), never over the input,
//! saves through a symbolic link, a bobbin kept the same when a build is saved elsewhere, and
//! `search --out` keeping the input's comments.

use std::path::{Path, PathBuf};
use std::process::{Command, Output};
use turnstack::files::{Saved, load_build, save_build_keeping, write_atomic};

fn example(name: &str) -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR")).join(format!("examples/{name}.toml"))
}

fn run(args: &[&str]) -> Output {
    let empty = tempfile::tempdir().unwrap();
    Command::new(env!("CARGO_BIN_EXE_turnstack"))
        .args(args)
        .env("TURNSTACK_BOBBINS", empty.path())
        .output()
        .expect("the binary runs")
}

fn stderr(o: &Output) -> String {
    String::from_utf8_lossy(&o.stderr).into_owned()
}

/// A copy of an example in a fresh folder.
fn copy(name: &str) -> (tempfile::TempDir, PathBuf) {
    let dir = tempfile::tempdir().unwrap();
    let p = dir.path().join(format!("{name}.toml"));
    std::fs::copy(example(name), &p).unwrap();
    (dir, p)
}

#[test]
fn sheet_html_refuses_an_existing_file_without_force_and_the_input_always() {
    let (dir, build) = copy("bench-forward");
    let original = std::fs::read_to_string(&build).unwrap();
    let b = build.to_str().unwrap();
    // Over the input: refused, with --force too, and the build is untouched.
    for extra in [&[][..], &["--force"][..]] {
        let mut args = vec!["sheet", b, "--html", b];
        args.extend_from_slice(extra);
        let o = run(&args);
        assert_eq!(o.status.code(), Some(2), "{args:?}");
        assert!(stderr(&o).contains("is the input build"), "{}", stderr(&o));
        assert_eq!(std::fs::read_to_string(&build).unwrap(), original);
    }
    // Over another existing file: refused without --force, replaced with it.
    let page = dir.path().join("page.html");
    std::fs::write(&page, "keep me").unwrap();
    let p = page.to_str().unwrap();
    let o = run(&["sheet", b, "--html", p]);
    assert_eq!(o.status.code(), Some(2));
    assert!(
        stderr(&o).contains("exists: not replaced (add --force to replace it)"),
        "{}",
        stderr(&o)
    );
    assert_eq!(std::fs::read_to_string(&page).unwrap(), "keep me");
    let o = run(&["sheet", b, "--html", p, "--force"]);
    assert_eq!(o.status.code(), Some(0), "{}", stderr(&o));
    assert!(std::fs::read_to_string(&page).unwrap().contains("<html"));
    // Into a folder that does not exist: said so, no temporary path named.
    let o = run(&["sheet", b, "--html", "/no/such/folder/page.html"]);
    assert_eq!(o.status.code(), Some(2));
    let e = stderr(&o);
    assert!(
        e.contains("the folder /no/such/folder does not exist"),
        "{e}"
    );
    assert!(!e.contains(".tmp"), "{e}");
}

#[test]
fn search_out_refuses_to_overwrite_and_keeps_the_inputs_comments() {
    let (dir, build) = copy("bench-forward");
    let original = std::fs::read_to_string(&build).unwrap();
    let b = build.to_str().unwrap();
    let o = run(&["search", b, "--out", b, "--force"]);
    assert_eq!(o.status.code(), Some(2));
    assert!(stderr(&o).contains("is the input build"), "{}", stderr(&o));
    assert_eq!(std::fs::read_to_string(&build).unwrap(), original);

    let out = dir.path().join("picked.toml");
    std::fs::write(&out, "mine").unwrap();
    let o = run(&["search", b, "--out", out.to_str().unwrap()]);
    assert_eq!(o.status.code(), Some(2));
    assert!(
        stderr(&o).contains("exists: not replaced"),
        "{}",
        stderr(&o)
    );
    assert_eq!(std::fs::read_to_string(&out).unwrap(), "mine");

    let o = run(&["search", b, "--out", out.to_str().unwrap(), "--force"]);
    assert_eq!(o.status.code(), Some(0), "{}", stderr(&o));
    let written = std::fs::read_to_string(&out).unwrap();
    // Every comment line of the input is still there, in order.
    let comments = |t: &str| -> Vec<String> {
        t.lines()
            .filter(|l| l.trim_start().starts_with('#'))
            .map(str::to_string)
            .collect()
    };
    let (want, got) = (comments(&original), comments(&written));
    let kept = want.iter().filter(|c| got.contains(c)).count();
    assert!(
        kept * 10 >= want.len() * 9,
        "{kept} of {} comments kept:\n{written}",
        want.len()
    );
    load_build(&out).expect("the written candidate loads");
}

#[cfg(unix)]
#[test]
fn a_save_through_a_symbolic_link_writes_the_file_it_points_at() {
    let (dir, real) = copy("bench-forward");
    let link = dir.path().join("link.toml");
    std::os::unix::fs::symlink(&real, &link).unwrap();
    let mut b = load_build(&link).unwrap();
    b.title = "through the link".into();
    let saved = save_build_keeping(&link, Some(&link), &b).unwrap();
    assert!(
        std::fs::symlink_metadata(&link)
            .unwrap()
            .file_type()
            .is_symlink()
    );
    assert_eq!(load_build(&real).unwrap().title, "through the link");
    assert_eq!(saved.path, real);
    assert!(saved.kept_layout);
}

#[test]
fn stale_temporary_files_of_a_crash_are_removed_and_fresh_ones_left() {
    let dir = tempfile::tempdir().unwrap();
    let stale = dir.path().join(".turnstack-crash.tmp");
    let fresh = dir.path().join(".turnstack-running.tmp");
    let other = dir.path().join(".other.tmp");
    for p in [&stale, &fresh, &other] {
        std::fs::write(p, "x").unwrap();
    }
    let two_hours_ago = std::time::SystemTime::now() - std::time::Duration::from_secs(7200);
    for p in [&stale, &other] {
        std::fs::File::options()
            .write(true)
            .open(p)
            .unwrap()
            .set_modified(two_hours_ago)
            .unwrap();
    }
    write_atomic(&dir.path().join("b.toml"), "format = 1\n").unwrap();
    assert!(!stale.exists(), "our old temporary file is removed");
    assert!(fresh.exists(), "a recent one may belong to a running save");
    assert!(other.exists(), "another program's file is left alone");
}

/// A build whose bobbin comes from `bobbins/` beside it, with the id of a bundled bobbin of
/// other dimensions: saved into another folder, the copy must keep the local bobbin.
#[test]
fn saving_elsewhere_keeps_a_bobbin_from_beside_the_build() {
    let (dir, build) = copy("bench-forward");
    std::fs::create_dir(dir.path().join("bobbins")).unwrap();
    // The same id as the bundled E25 bobbin, but a 6.2 mm window height.
    let bundled = std::fs::read_to_string(
        Path::new(env!("CARGO_MANIFEST_DIR")).join("bobbins/e25-13-7.toml"),
    )
    .unwrap();
    let local = bundled.replace("height_mm = 4.0", "height_mm = 6.2");
    assert_ne!(local, bundled, "the test changes the window height");
    std::fs::write(dir.path().join("bobbins/e25-13-7.toml"), local).unwrap();
    let b = load_build(&build).unwrap();
    assert_eq!(b.bobbin.window.height_mm, 6.2);

    let elsewhere = tempfile::tempdir().unwrap();
    let copy_path = elsewhere.path().join("copy.toml");
    let saved: Saved = save_build_keeping(&copy_path, Some(&build), &b).unwrap();
    assert_eq!(saved.bobbin_inlined.as_deref(), Some("e25-13-7"));
    assert!(
        saved.note().contains("written into the file"),
        "{}",
        saved.note()
    );
    let back = load_build(&copy_path).unwrap();
    assert_eq!(
        back.bobbin, b.bobbin,
        "the same bobbin, not the bundled one"
    );
    // The rest of the file is as it was; the [bobbin] table comes before [setup].
    assert!(saved.kept_layout);
    let text = std::fs::read_to_string(&copy_path).unwrap();
    assert!(text.contains("temperature_c = 100     # hot-spot figure for resistance"));
    let (bobbin_at, setup_at) = (
        text.find("[bobbin]").unwrap(),
        text.find("[setup]").unwrap(),
    );
    assert!(bobbin_at < setup_at, "{text}");
    // Saved beside the original, the id still finds it: no inlining.
    let again = save_build_keeping(&build, Some(&build), &b).unwrap();
    assert_eq!(again.bobbin_inlined, None);
}

/// Every bounded flag of `search` is refused with what it expects, before any work.
#[test]
fn search_flags_out_of_bounds_are_refused_with_what_they_expect() {
    let b = example("bench-forward");
    let b = b.to_str().unwrap();
    for (flags, says) in [
        (
            &["--threads", "100000"][..],
            "--threads 100000: expected 1 to 64",
        ),
        (&["--threads", "0"][..], "--threads 0: expected 1 to 64"),
        (
            &["--max-strands", "4000000000"][..],
            "--max-strands 4000000000: expected 1 to 32",
        ),
        (
            &["--j-min", "NaN"][..],
            "--j-min NaN: expected a current density",
        ),
        (
            &["--j-max", "inf"][..],
            "--j-max inf: expected a current density",
        ),
        (&["--j-min", "7"][..], "--j-min 7 is above --j-max 6"),
        (
            &["--max-rise-c=-1"][..],
            "--max-rise-c -1: expected a temperature rise",
        ),
        (
            &["--max-leakage-uh", "0"][..],
            "--max-leakage-uh 0: expected a leakage inductance",
        ),
        (
            &["--isolation-wraps", "1000"][..],
            "--isolation-wraps 1000: expected at most 100",
        ),
        (&["--pick", "0"][..], "--pick 0: expected 1 or more"),
    ] {
        let mut args = vec!["search", b];
        args.extend_from_slice(flags);
        let started = std::time::Instant::now();
        let o = run(&args);
        assert_eq!(o.status.code(), Some(2), "{flags:?}");
        assert!(stderr(&o).contains(says), "{flags:?}: {}", stderr(&o));
        assert!(
            started.elapsed().as_secs() < 20,
            "{flags:?} is refused at once"
        );
    }
}

#[test]
fn search_on_a_build_without_a_secondary_names_the_file() {
    let dir = tempfile::tempdir().unwrap();
    let p = dir.path().join("primary-only.toml");
    std::fs::write(
        &p,
        "format = 1\nbobbin = \"e25-13-7\"\n[[winding]]\nname = \"P\"\nrole = \"primary\"\nturns = 24\nwire = \"0.63mm\"\n[[stack]]\nwinding = \"P\"\n",
    )
    .unwrap();
    let o = run(&["search", p.to_str().unwrap()]);
    assert_eq!(o.status.code(), Some(2));
    let e = stderr(&o);
    assert!(
        e.contains("primary-only.toml: the search needs a primary and a secondary"),
        "{e}"
    );
    assert!(e.contains("role = \"secondary\""), "{e}");
}
