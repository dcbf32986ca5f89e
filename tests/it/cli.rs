//! The `turnstack` binary as a script or a user meets it: exit codes (0 fits, 1 does not fit,
//! 2 bad input), the text report within 80 columns, the JSON report's keys (FORMAT.md "The JSON
//! report") agreeing with the text, the listings, and the user's bobbin folder.

use crate::common::{broken_files, read_expected};
use serde_json::Value;
use std::path::{Path, PathBuf};
use std::process::{Command, Output};
use unicode_width::UnicodeWidthStr;

fn root() -> &'static Path {
    Path::new(env!("CARGO_MANIFEST_DIR"))
}

fn example_path(name: &str) -> PathBuf {
    root().join(format!("examples/{name}.toml"))
}

const EXAMPLES: [&str; 3] = ["bench-forward", "mains-isolated", "salvaged-too-small"];

/// Run the binary with the user's bobbin folder pointed at `user_bobbins` (an empty folder by
/// default, so that whatever the machine holds does not leak into the test).
fn run_with(args: &[&str], user_bobbins: &Path) -> Output {
    Command::new(env!("CARGO_BIN_EXE_turnstack"))
        .args(args)
        .env("TURNSTACK_BOBBINS", user_bobbins)
        .output()
        .expect("the binary runs")
}

fn run(args: &[&str]) -> Output {
    let empty = tempfile::tempdir().unwrap();
    run_with(args, empty.path())
}

fn code(o: &Output) -> i32 {
    o.status.code().expect("exited with a code")
}

fn stdout(o: &Output) -> String {
    String::from_utf8(o.stdout.clone()).expect("utf-8 stdout")
}

fn stderr(o: &Output) -> String {
    String::from_utf8(o.stderr.clone()).expect("utf-8 stderr")
}

fn json_of(o: &Output) -> Value {
    serde_json::from_str(&stdout(o)).unwrap_or_else(|e| panic!("not JSON ({e}):\n{}", stdout(o)))
}

/// FORMAT.md: exit 0 when the build fits and every limit holds, 1 when it is valid but does
/// not fit or breaks a limit (the isolated example runs over its temperature-rise limit); the
/// last line says which.
#[test]
fn check_exit_codes_say_whether_each_example_fits() {
    for (name, want, fits) in [
        ("bench-forward", 0, true),
        ("mains-isolated", 1, true),
        ("salvaged-too-small", 1, false),
    ] {
        let p = example_path(name);
        let o = run(&["check", p.to_str().unwrap()]);
        assert_eq!(code(&o), want, "{name}: {}", stderr(&o));
        assert!(stderr(&o).is_empty(), "{name}: {}", stderr(&o));
        let out = stdout(&o);
        let verdict = if fits { "FITS:" } else { "DOES NOT FIT:" };
        assert!(
            out.lines().any(|l| l.starts_with(verdict)),
            "{name}:\n{out}"
        );
        // The last paragraph (it may wrap over lines).
        let last = out.trim_end().rsplit("\n\n").next().unwrap_or_default();
        let outcome = if want == 0 { "PASSES:" } else { "FAILS:" };
        assert!(last.starts_with(outcome), "{name}: last line {last:?}");
        if name == "mains-isolated" {
            assert!(last.contains("temperature-rise"), "{last}");
        }
    }
}

/// `check` with no file reports the bundled demo build, the bench converter's first try; it
/// fits but runs over its temperature-rise limit, so `check` exits 1 on it.
#[test]
fn check_without_a_file_reports_the_demo_build() {
    let demo = run(&["check"]);
    assert_eq!(code(&demo), 1, "{}", stderr(&demo));
    let p = example_path("first-try");
    let file = run(&["check", p.to_str().unwrap()]);
    assert_eq!(stdout(&demo), stdout(&file));
    assert!(stdout(&demo).starts_with("Bench supply 5 V channel"));
}

fn all_reports() -> Vec<(String, String)> {
    let mut v: Vec<(String, String)> = EXAMPLES
        .iter()
        .map(|n| {
            let p = example_path(n);
            (n.to_string(), stdout(&run(&["check", p.to_str().unwrap()])))
        })
        .collect();
    v.push(("demo".into(), stdout(&run(&["check"]))));
    v
}

/// style.md / report: the text report fits 80 columns.
#[test]
fn text_report_fits_80_columns() {
    for (name, text) in all_reports() {
        assert!(
            text.lines().count() > 20,
            "{name}: report too short:\n{text}"
        );
        for line in text.lines() {
            assert!(
                line.width() <= 80,
                "{name}: {} columns: {line:?}",
                line.width()
            );
        }
    }
}

/// The text report stays within 80 columns when the names, the bobbin id, the setup figures
/// and the verdict's numbers are all long (a build that overflows a 10 mm window by 10 mm).
#[test]
fn text_report_fits_80_columns_with_long_names_and_numbers() {
    let dir = tempfile::tempdir().unwrap();
    let id = "drawer-former-salvaged-from-the-old-bench-supply";
    std::fs::create_dir(dir.path().join("bobbins")).unwrap();
    std::fs::write(
        dir.path().join("bobbins").join(format!("{id}.toml")),
        "format = 1\nname = \"a former with a long name, measured with callipers on the bench\"\n\
         origin = \"measured\"\n[window]\nwidth_mm = 15.2\nheight_mm = 10.25\n\
         [tube]\nshape = \"rect\"\nwidth_mm = 8.7\ndepth_mm = 8.7\ncorner_radius_mm = 0.5\n",
    )
    .unwrap();
    let text = std::fs::read_to_string(example_path("bench-forward"))
        .unwrap()
        .replace("bobbin = \"e25-13-7\"", &format!("bobbin = \"{id}\""))
        .replace("temperature_c = 100", "temperature_c = -40.25")
        .replace(
            "frequency_khz = 100",
            "frequency_khz = 132.75\nmargin_mm = 2.5",
        )
        // Ten times the secondary turns: it overflows the window by far more than 10 mm.
        .replace("turns = 16", "turns = 160")
        .replace("\"P\"", "\"primary-winding-first-half\"")
        .replace("\"S\"", "\"secondary-winding-five-volt\"")
        .replace("\"R\"", "\"reset-winding-thin\"")
        .replace(
            "title = \"Bench supply",
            "title = \"A very long title that goes on and on about the bench supply",
        );
    let p = dir.path().join("long.toml");
    std::fs::write(&p, text).unwrap();
    let o = run(&["check", p.to_str().unwrap()]);
    assert_eq!(code(&o), 1, "{}", stderr(&o));
    let out = stdout(&o);
    assert!(out.contains("DOES NOT FIT"), "{out}");
    assert!(out.contains(id), "{out}");
    for line in out.lines() {
        assert!(line.width() <= 80, "{} columns: {line:?}", line.width());
    }
}

/// The listings fit 80 columns too.
#[test]
fn listings_fit_80_columns() {
    for cmd in ["bobbins", "wires"] {
        let o = run(&[cmd]);
        assert_eq!(code(&o), 0, "{cmd}: {}", stderr(&o));
        for line in stdout(&o).lines() {
            assert!(
                line.width() <= 80,
                "{cmd}: {} columns: {line:?}",
                line.width()
            );
        }
    }
}

fn has_keys(v: &Value, keys: &[&str], what: &str) {
    for k in keys {
        assert!(v.get(k).is_some(), "{what}: no key {k:?} in {v}");
    }
}

/// FORMAT.md "The JSON report": the keys it lists, with their kinds.
#[test]
fn json_report_has_the_spec_keys() {
    for name in EXAMPLES {
        let p = example_path(name);
        let o = run(&["check", p.to_str().unwrap(), "--json"]);
        let v = json_of(&o);
        has_keys(
            &v,
            &[
                "fits",
                "build_height_mm",
                "height_with_allowance_mm",
                "window_height_mm",
                "fill_factor",
                "sections",
                "windings",
                "leakage",
                "warnings",
            ],
            name,
        );
        let failures = v["failures"].as_array().expect("failures");
        assert_eq!(
            failures.is_empty(),
            code(&o) == 0,
            "{name}: failures vs exit code"
        );
        assert_eq!(
            v["fits"].as_bool(),
            Some(!failures.iter().any(|f| f == "fit")),
            "{name}: fits vs failures"
        );
        for k in [
            "build_height_mm",
            "height_with_allowance_mm",
            "window_height_mm",
            "fill_factor",
        ] {
            assert!(v[k].is_f64(), "{name}: {k} is {}", v[k]);
        }
        let sections = v["sections"].as_array().unwrap();
        assert!(!sections.is_empty());
        for s in sections {
            match s["kind"].as_str() {
                Some("winding") => {
                    has_keys(
                        s,
                        &[
                            "winding",
                            "with",
                            "turns",
                            "turns_per_layer",
                            "layers",
                            "height_mm",
                            "mlt_mm",
                        ],
                        name,
                    );
                    assert!(s["with"].is_null() || s["with"].is_string());
                    assert!(s["turns"].is_u64() && s["layers"].is_u64());
                }
                Some("tape") => has_keys(s, &["wraps", "height_mm"], name),
                other => panic!("{name}: section kind {other:?}"),
            }
        }
        for w in v["windings"].as_array().unwrap() {
            // Every example gives a frequency, so the AC figures are there.
            has_keys(
                w,
                &[
                    "name",
                    "turns",
                    "length_m",
                    "mlt_mm",
                    "dcr_ohm",
                    "ac_factor",
                    "rac_ohm",
                ],
                name,
            );
        }
        // Every primary-secondary and primary-reset pair: one primary, one of each other here.
        let leakage = v["leakage"].as_array().unwrap();
        assert_eq!(leakage.len(), 2, "{name}");
        for l in leakage {
            has_keys(l, &["from", "to", "referred_to", "uh"], name);
        }
        for w in v["warnings"].as_array().unwrap() {
            has_keys(w, &["code", "message"], name);
        }
    }
}

/// FORMAT.md: with an operating point the report has `converter` with its five keys
/// (`flux_swing_worst_mt` because the bobbin has core data, `flux_headroom_mt` because the
/// build gives a material); without core data no flux swing; without an operating point, no
/// `converter`.
#[test]
fn json_converter_keys_follow_the_operating_point() {
    for name in ["bench-forward", "mains-isolated"] {
        let p = example_path(name);
        let v = json_of(&run(&["check", p.to_str().unwrap(), "--json"]));
        has_keys(
            &v["converter"],
            &[
                "reset_duty_limit",
                "switch_voltage_v",
                "duty_needed_at_vin_min",
                "flux_swing_worst_mt",
                "flux_headroom_mt",
            ],
            name,
        );
    }
    // The salvaged bobbin was measured without its core: a converter, but no flux swing.
    let p = example_path("salvaged-too-small");
    let v = json_of(&run(&["check", p.to_str().unwrap(), "--json"]));
    has_keys(
        &v["converter"],
        &[
            "reset_duty_limit",
            "switch_voltage_v",
            "duty_needed_at_vin_min",
        ],
        "salvaged",
    );
    assert!(
        v["converter"].get("flux_swing_worst_mt").is_none(),
        "{}",
        v["converter"]
    );
    // The same build without its [operating] table has no converter at all.
    let text = std::fs::read_to_string(&p).unwrap();
    let cut = text.find("[operating]").unwrap();
    let dir = tempfile::tempdir().unwrap();
    let q = dir.path().join("no-operating.toml");
    std::fs::write(&q, &text[..cut]).unwrap();
    let v = json_of(&run(&["check", q.to_str().unwrap(), "--json"]));
    assert!(v.get("converter").is_none(), "{}", v["converter"]);
}

/// FORMAT.md: `ac_factor` and `rac_ohm` only when the setup gives a frequency; without
/// `[material]` there is no `flux_headroom_mt`.
#[test]
fn json_leaves_out_figures_whose_inputs_are_missing() {
    let dir = tempfile::tempdir().unwrap();
    // Without a frequency (and so without the operating point that needs one).
    let text = std::fs::read_to_string(example_path("salvaged-too-small")).unwrap();
    let text = text[..text.find("[operating]").unwrap()].replace("frequency_khz = 100\n", "");
    let p = dir.path().join("no-frequency.toml");
    std::fs::write(&p, text).unwrap();
    let v = json_of(&run(&["check", p.to_str().unwrap(), "--json"]));
    for w in v["windings"].as_array().unwrap() {
        assert!(
            w.get("ac_factor").is_none() && w.get("rac_ohm").is_none(),
            "{w}"
        );
        assert!(w["dcr_ohm"].is_f64());
    }

    let text = std::fs::read_to_string(example_path("bench-forward")).unwrap();
    let cut = text.find("[material]").unwrap();
    let end = text[cut..]
        .find("\n# Expected")
        .map_or(text.len(), |i| cut + i);
    let p = dir.path().join("no-material.toml");
    std::fs::write(&p, format!("{}{}", &text[..cut], &text[end..])).unwrap();
    let o = run(&["check", p.to_str().unwrap(), "--json"]);
    assert_eq!(code(&o), 0, "{}", stderr(&o));
    let c = &json_of(&o)["converter"];
    assert!(c["flux_swing_worst_mt"].is_f64());
    assert!(c.get("flux_headroom_mt").is_none(), "{c}");
}

/// The text's `shown` is the JSON number `x` rounded to `places` decimals. Compared as numbers
/// within half a unit of the last place (plus 1e-9 of slack): serde_json's default float
/// parser can land one ulp off the written value, which flips an exact tie such as 3.7125.
#[track_caller]
fn same_at(shown: &str, x: &Value, places: usize, what: &str) {
    let x = x
        .as_f64()
        .unwrap_or_else(|| panic!("{what}: not a number: {x}"));
    let decimals = shown.split_once('.').map_or(0, |(_, d)| d.len());
    assert_eq!(
        decimals, places,
        "{what}: {shown:?} should have {places} decimals"
    );
    let t: f64 = shown
        .parse()
        .unwrap_or_else(|_| panic!("{what}: {shown:?} is not a number"));
    let half = 0.5 * 10f64.powi(-(places as i32));
    assert!(
        (t - x).abs() <= half + 1e-9,
        "{what}: text {shown}, JSON {x}"
    );
}

/// The text report and the JSON report are the same figures: every number the text prints is
/// the JSON value at the text's rounding.
#[test]
fn json_numbers_equal_the_text_report_rounding() {
    for name in EXAMPLES {
        let p = example_path(name);
        let text = stdout(&run(&["check", p.to_str().unwrap()]));
        let v = json_of(&run(&["check", p.to_str().unwrap(), "--json"]));
        let lines: Vec<&str> = text.lines().collect();

        // "  build 2.840 mm, x1.10 = 3.124 mm; usable width 15.20 mm; fill factor 0.297"
        let build = lines.iter().find(|l| l.starts_with("  build ")).unwrap();
        let t: Vec<&str> = build.split_whitespace().collect();
        same_at(t[1], &v["build_height_mm"], 3, &format!("{name}: {build}"));
        same_at(
            t[5],
            &v["height_with_allowance_mm"],
            3,
            &format!("{name}: {build}"),
        );
        same_at(
            t[t.len() - 1],
            &v["fill_factor"],
            3,
            &format!("{name}: {build}"),
        );

        // Stack rows, in order: "  1  P+R bifilar  12  15  1  12  0.704  36.2" / "  2  tape x1  0.060".
        let head = lines
            .iter()
            .position(|l| l.contains("section        turns"))
            .unwrap();
        let mut rows = lines[head + 1..]
            .iter()
            .take_while(|l| !l.is_empty())
            .filter(|l| !l.starts_with("       "));
        for s in v["sections"].as_array().unwrap() {
            let row = rows
                .next()
                .unwrap_or_else(|| panic!("{name}: too few stack rows"));
            let row = row.replace("PAST LIMIT", "");
            let t: Vec<&str> = row.split_whitespace().collect();
            let n = t.len();
            if s["kind"] == "tape" {
                assert_eq!(t[2], format!("x{}", s["wraps"]), "{name}: {row}");
                same_at(t[n - 1], &s["height_mm"], 3, &format!("{name}: {row}"));
            } else {
                assert_eq!(t[n - 6], s["turns"].to_string(), "{name}: {row}");
                assert_eq!(t[n - 5], s["turns_per_layer"].to_string(), "{name}: {row}");
                assert_eq!(t[n - 4], s["layers"].to_string(), "{name}: {row}");
                same_at(t[n - 2], &s["height_mm"], 3, &format!("{name}: {row}"));
                same_at(t[n - 1], &s["mlt_mm"], 1, &format!("{name}: {row}"));
            }
        }

        // Winding rows: "  P  primary  24  0.63 mm  1.020  42.5  0.0741  5.6".
        let head = lines
            .iter()
            .position(|l| l.contains("length m  MLT mm"))
            .unwrap();
        for (row, w) in lines[head + 1..]
            .iter()
            .zip(v["windings"].as_array().unwrap())
        {
            let t: Vec<&str> = row.split_whitespace().collect();
            let n = t.len();
            assert_eq!(t[0], w["name"].as_str().unwrap(), "{name}: {row}");
            assert_eq!(t[2], w["turns"].to_string(), "{name}: {row}");
            same_at(t[n - 4], &w["length_m"], 3, &format!("{name}: {row}"));
            same_at(t[n - 3], &w["mlt_mm"], 1, &format!("{name}: {row}"));
            same_at(t[n - 2], &w["dcr_ohm"], 4, &format!("{name}: {row}"));
        }

        // AC rows: "  P      AC factor   1.42   Rac   0.1052 ohm".
        for w in v["windings"].as_array().unwrap() {
            let wname = w["name"].as_str().unwrap();
            let row = lines
                .iter()
                .find(|l| l.contains("AC factor") && l.split_whitespace().next() == Some(wname))
                .unwrap_or_else(|| panic!("{name}: no AC row for {wname}"));
            let t: Vec<&str> = row.split_whitespace().collect();
            same_at(t[3], &w["ac_factor"], 2, &format!("{name}: {row}"));
            same_at(t[5], &w["rac_ohm"], 4, &format!("{name}: {row}"));
        }

        // Leakage: "  P - S: 0.489 uH referred to P".
        for l in v["leakage"].as_array().unwrap() {
            let lead = format!(
                "  {} - {}: ",
                l["from"].as_str().unwrap(),
                l["to"].as_str().unwrap()
            );
            let row = lines.iter().find(|x| x.starts_with(&lead)).unwrap();
            let t: Vec<&str> = row.split_whitespace().collect();
            same_at(t[3], &l["uh"], 3, &format!("{name}: {row}"));
            assert!(row.contains(&format!(
                "referred to {}",
                l["referred_to"].as_str().unwrap()
            )));
        }

        // Converter: percentages at one decimal, volts and millitesla at one.
        if let Some(c) = v.get("converter") {
            let find = |lead: &str| {
                let row = lines
                    .iter()
                    .find(|l| l.trim_start().starts_with(lead))
                    .unwrap();
                row.trim_start()[lead.len()..]
                    .split_whitespace()
                    .next()
                    .unwrap()
                    .to_string()
            };
            let pct = |key: &str| serde_json::json!(c[key].as_f64().unwrap() * 100.0);
            same_at(&find("reset duty limit"), &pct("reset_duty_limit"), 1, name);
            same_at(
                &find("duty needed at vin min"),
                &pct("duty_needed_at_vin_min"),
                1,
                name,
            );
            same_at(&find("switch off-state"), &c["switch_voltage_v"], 1, name);
            if c.get("flux_swing_worst_mt").is_some() {
                same_at(
                    &find("worst-case flux swing"),
                    &c["flux_swing_worst_mt"],
                    1,
                    name,
                );
            }
        }

        // Warnings: every code in the JSON is printed.
        for w in v["warnings"].as_array().unwrap() {
            let code = format!("! {}", w["code"].as_str().unwrap());
            assert!(text.contains(&code), "{name}: {code} not in the text");
        }
    }
}

/// style.md: bad input exits 2 with one clear message on stderr (file:line:col) and nothing on
/// stdout; every broken file of tests/broken gives its expected message.
#[test]
fn broken_files_exit_2_with_the_message_on_stderr_only() {
    let files = broken_files();
    assert!(files.len() >= 30);
    for path in files {
        let exp = read_expected(&path.with_extension("expected"));
        let o = run(&["check", path.to_str().unwrap()]);
        assert_eq!(code(&o), 2, "{}", path.display());
        assert!(
            o.stdout.is_empty(),
            "{}: stdout {:?}",
            path.display(),
            stdout(&o)
        );
        let err = stderr(&o);
        let first = err.lines().next().unwrap_or("");
        let mut lead = format!("turnstack: {}", path.display());
        if let Some((l, c)) = exp.at {
            lead.push_str(&format!(":{l}:{c}"));
        }
        assert!(
            first.starts_with(&lead),
            "{first:?} does not start with {lead:?}"
        );
        for piece in &exp.has {
            assert!(first.contains(piece.as_str()), "{piece:?} not in {first:?}");
        }
        // The same file as JSON: still an error on stderr, no half-written JSON.
        let o = run(&["check", path.to_str().unwrap(), "--json"]);
        assert_eq!(code(&o), 2);
        assert!(o.stdout.is_empty());
    }
}

/// A file that is not there is bad input: exit 2, the path and the reason on stderr.
#[test]
fn missing_file_exits_2() {
    let p = root().join("examples/no-such-build.toml");
    let o = run(&["check", p.to_str().unwrap()]);
    assert_eq!(code(&o), 2);
    assert!(o.stdout.is_empty());
    let err = stderr(&o);
    assert!(
        err.contains(p.to_str().unwrap()) && err.contains("no such file"),
        "{err}"
    );
}

/// `bobbins` lists the bundled library: at least 8 ids, every bundled one marked so.
#[test]
fn bobbins_lists_the_bundled_library() {
    let o = run(&["bobbins"]);
    assert_eq!(code(&o), 0, "{}", stderr(&o));
    let out = stdout(&o);
    let bundled: Vec<&str> = out
        .lines()
        .filter(|l| l.split_whitespace().nth(1) == Some("bundled"))
        .map(|l| l.split_whitespace().next().unwrap())
        .collect();
    assert!(bundled.len() >= 8, "{out}");
    for (id, _) in turnstack::library::bobbins::bundled() {
        assert!(bundled.contains(id), "{id} not listed:\n{out}");
    }
    let v = json_of(&run(&["bobbins", "--json"]));
    assert!(v.as_array().unwrap().len() >= 8);
}

/// `wires` lists AWG 10..44 (ASTM B258 range of the table) and the metric rows 0.05..2 mm.
#[test]
fn wires_lists_awg_10_to_44_and_metric_0_05_to_2_mm() {
    let o = run(&["wires"]);
    assert_eq!(code(&o), 0, "{}", stderr(&o));
    let out = stdout(&o);
    let firsts: Vec<&str> = out
        .lines()
        .filter_map(|l| l.split_whitespace().next())
        .collect();
    for n in 10..=44 {
        assert!(
            firsts.contains(&format!("awg{n}").as_str()),
            "awg{n}:\n{out}"
        );
    }
    let rows = turnstack::library::wires::metric_rows();
    for r in rows {
        let key = format!("{}mm", turnstack::model::trim_mm(r.nominal_mm));
        assert!(firsts.contains(&key.as_str()), "{key}:\n{out}");
    }
    assert_eq!(rows.first().unwrap().nominal_mm, 0.05);
    assert_eq!(rows.last().unwrap().nominal_mm, 2.0);
    assert!(firsts.contains(&"0.05mm") && firsts.contains(&"2mm"));
    // AWG 24 at 20 C: 0.0842 ohm/m (NBS Handbook 100: 84.22 ohm/km).
    let awg24 = out.lines().find(|l| l.starts_with("awg24 ")).unwrap();
    assert!(awg24.contains("0.0842"), "{awg24}");
    let v = json_of(&run(&["wires", "--json"]));
    assert_eq!(v.as_array().unwrap().len(), 35 + rows.len());
}

const USER_BOBBIN: &str = "format = 1\nname = \"bench former from the drawer\"\n\
    origin = \"measured with callipers\"\n\n[window]\nwidth_mm = 12.5\nheight_mm = 3.5\n\n\
    [tube]\nshape = \"round\"\ndiameter_mm = 9.0\n";

/// FORMAT.md "Lookup": a bobbin in $TURNSTACK_BOBBINS is listed as the user's and usable by id
/// from a build anywhere; it is searched before the bundled library.
#[test]
fn user_bobbin_folder_is_listed_and_usable_by_id() {
    let user = tempfile::tempdir().unwrap();
    std::fs::write(user.path().join("drawer-former.toml"), USER_BOBBIN).unwrap();
    // The user's copy of a bundled id wins over the bundled one.
    std::fs::write(
        user.path().join("e25-13-7.toml"),
        USER_BOBBIN.replace("width_mm = 12.5", "width_mm = 14.0"),
    )
    .unwrap();

    let o = run_with(&["bobbins"], user.path());
    assert_eq!(code(&o), 0, "{}", stderr(&o));
    let out = stdout(&o);
    let row = out
        .lines()
        .find(|l| l.starts_with("drawer-former "))
        .unwrap_or_else(|| panic!("{out}"));
    assert_eq!(row.split_whitespace().nth(1), Some("yours"), "{row}");
    assert!(row.contains("12.50") && row.contains("3.50"), "{row}");
    let shadow = out.lines().find(|l| l.starts_with("e25-13-7 ")).unwrap();
    assert_eq!(shadow.split_whitespace().nth(1), Some("yours"), "{shadow}");
    assert!(out.contains(&user.path().display().to_string()), "{out}");

    // A build in another folder names the user's bobbin by id.
    let elsewhere = tempfile::tempdir().unwrap();
    let build = "format = 1\ntitle = \"drawer build\"\nbobbin = \"drawer-former\"\n\n\
                 [[winding]]\nname = \"P\"\nrole = \"primary\"\nturns = 20\nwire = \"0.40mm\"\n\n\
                 [[stack]]\nwinding = \"P\"\n";
    let p = elsewhere.path().join("b.toml");
    std::fs::write(&p, build).unwrap();
    let o = run_with(&["check", p.to_str().unwrap(), "--json"], user.path());
    assert_eq!(code(&o), 0, "{}", stderr(&o));
    let v = json_of(&o);
    assert_eq!(v["bobbin"], "drawer-former");
    assert_eq!(v["window_height_mm"].as_f64(), Some(3.5));

    // Without the folder the id is unknown: exit 2.
    let o = run(&["check", p.to_str().unwrap()]);
    assert_eq!(code(&o), 2);
    assert!(
        stderr(&o).contains("unknown bobbin id \"drawer-former\""),
        "{}",
        stderr(&o)
    );

    // The shadowed bundled id resolves to the user's copy.
    let p2 = elsewhere.path().join("c.toml");
    std::fs::write(&p2, build.replace("drawer-former", "e25-13-7")).unwrap();
    let v = json_of(&run_with(
        &["check", p2.to_str().unwrap(), "--json"],
        user.path(),
    ));
    assert_eq!(v["window_width_mm"].as_f64(), Some(14.0));
}
