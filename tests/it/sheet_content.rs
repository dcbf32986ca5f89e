//! The winding sheet against the Evaluation it is drawn from, IEC 60028 for the expected DC
//! resistance, and the HTML page's well-formedness and self-containment.

use std::path::Path;
use turnstack::engine::{Evaluation, SectionKind, evaluate};
use turnstack::files::{BobbinLibrary, load_build, parse_build};
use turnstack::model::Build;
use turnstack::report::sheet::{self, html, svg, text};
use unicode_width::UnicodeWidthStr;

const EXAMPLES: [&str; 3] = [
    "examples/bench-forward.toml",
    "examples/mains-isolated.toml",
    "examples/salvaged-too-small.toml",
];

fn load(name: &str) -> (Build, Evaluation) {
    let b = load_build(&Path::new(env!("CARGO_MANIFEST_DIR")).join(name)).unwrap();
    let e = evaluate(&b);
    (b, e)
}

/// The text of the step that winds stack section `i` (0-based), from its heading to the next.
fn step_block(text: &str, number: usize) -> String {
    let head = format!("STEP {number}  ");
    let start = text.find(&head).unwrap_or_else(|| panic!("no {head}"));
    let rest = &text[start + head.len()..];
    let end = rest.find("STEP ").unwrap_or(rest.len());
    rest[..end].to_string()
}

/// Layout (FORMAT.md): every step of the text sheet states the section's turns, layers, turns
/// per layer and last layer exactly as the Evaluation has them, and the pins of the file.
#[test]
fn text_steps_agree_with_the_evaluation_for_every_example() {
    for name in EXAMPLES {
        let (b, e) = load(name);
        let s = sheet::sheet(&b, &e, 20.0);
        let t = text::render(&s, 0);
        assert_eq!(s.steps.len(), b.stack.len(), "{name}: one step per section");
        for (i, sec) in e.sections.iter().enumerate() {
            let block = step_block(&t, i + 1);
            // Flatten the wrapped text so that a figure split over two lines still matches.
            let flat = block.split_whitespace().collect::<Vec<_>>().join(" ");
            match &sec.kind {
                SectionKind::Tape { wraps } => {
                    let w = if *wraps == 1 { "wrap" } else { "wraps" };
                    assert!(
                        flat.contains(&format!("Tape: {wraps} {w}")),
                        "{name} #{i}: {flat}"
                    );
                }
                SectionKind::Winding {
                    winding,
                    partner,
                    turns,
                    turns_per_layer,
                    layer_count,
                    last_layer_turns,
                    ..
                } => {
                    let layers = if *layer_count == 1 { "layer" } else { "layers" };
                    let want = format!(
                        "{turns} turns in {layer_count} {layers}: {turns_per_layer} a layer, {last_layer_turns} on the last layer"
                    );
                    assert!(flat.contains(&want), "{name} #{i}: want {want} in {flat}");
                    // The last layer is what the engine laid outermost.
                    assert_eq!(sec.layers.last().unwrap().turns, *last_layer_turns);
                    for n in [Some(winding), partner.as_ref()].into_iter().flatten() {
                        let w = b.winding(n).unwrap();
                        let first = b.stack.iter().position(|x| matches!(x,
                            turnstack::model::Section::Winding(ws) if *ws.winding == **n || ws.partner.as_deref() == Some(&**n))).unwrap();
                        let last = b.stack.iter().rposition(|x| matches!(x,
                            turnstack::model::Section::Winding(ws) if *ws.winding == **n || ws.partner.as_deref() == Some(&**n))).unwrap();
                        if first == i {
                            let p = w.start_pin.as_ref().unwrap();
                            assert!(
                                flat.contains(&format!("Start {n} on pin {p}")),
                                "{name} #{i}: {flat}"
                            );
                        }
                        if last == i {
                            let p = w.finish_pin.as_ref().unwrap();
                            assert!(
                                flat.contains(&format!("Finish {n} on pin {p}")),
                                "{name} #{i}: {flat}"
                            );
                        }
                    }
                }
            }
        }
    }
}

/// Paper: the text sheet keeps to 80 columns and to the page length it was asked for.
#[test]
fn text_sheet_fits_80_columns_and_its_pages() {
    for name in EXAMPLES {
        let (b, e) = load(name);
        let t = text::render(&sheet::sheet(&b, &e, 20.0), 60);
        for page in t.split('\x0c') {
            assert!(
                page.lines().count() <= 60,
                "{name}: page of {}",
                page.lines().count()
            );
            for l in page.lines() {
                assert!(l.width() <= 80, "{name}: {l}");
            }
        }
        assert!(t.contains("page 1 of"));
    }
}

/// IEC 60028: R20 = length / (58 S m/mm^2 x area), and R(T) = R20 (1 + 0.00393 (T - 20)).
/// The bench example is figured at 100 C; the sheet's figure at 20 C and at 25 C follow.
#[test]
fn expected_dcr_follows_iec_60028_temperature_coefficient() {
    let (b, e) = load("examples/bench-forward.toml");
    assert_eq!(b.setup.temperature_c, 100.0);
    for at in [20.0, 25.0] {
        let s = sheet::sheet(&b, &e, at);
        for (w, we) in b.windings.iter().zip(&e.windings) {
            let area = std::f64::consts::PI * we.bare_mm * we.bare_mm / 4.0 * f64::from(w.strands);
            let r20 = we.length_m / (58.0 * area);
            let want = r20 * (1.0 + 0.00393 * (at - 20.0));
            let c = s
                .checks
                .iter()
                .find(|c| c.what == format!("DC resistance of {}", w.name))
                .unwrap();
            let got = c.value.unwrap();
            // 1/58 vs 1.7241e-8: the two spellings of IEC 60028 agree to 2e-5.
            assert!(
                (got - want).abs() / want < 1e-4,
                "{} at {at}: {got} vs {want}",
                w.name
            );
            assert!(c.expected.contains("+/-10 %"));
        }
    }
}

/// L = AL N^2 (IEC 60205 usage): the magnetising inductance check of the bench example.
#[test]
fn magnetising_inductance_is_al_times_turns_squared() {
    let (b, e) = load("examples/bench-forward.toml");
    let al = b.bobbin.core.as_ref().unwrap().al_nh.unwrap();
    let s = sheet::sheet(&b, &e, 20.0);
    let c = s
        .checks
        .iter()
        .find(|c| c.what.starts_with("Magnetising"))
        .unwrap();
    assert!((c.value.unwrap() - al * 24.0 * 24.0 / 1000.0).abs() < 1e-9);
}

/// The sheet's leakage check on Lee's worked case (Electronic Transformers and Circuits, 2nd
/// ed., 1955): two plain sections of 40 turns, 0.6 mm each, 0.1 mm of tape between, MLT 50 mm
/// at the field's centre, wound between 0.8 mm margins of a 20 mm window (b_w = 18.4 mm):
/// L = mu0 N^2 MLT (a/3 + b/3 + c) / b_w = 4 pi 1e-7 x 1600 x 0.05 x 0.5e-3 / 0.0184 H.
#[test]
fn sheet_leakage_check_is_lee_worked_case() {
    let d = 50.0 / std::f64::consts::PI - 1.3;
    let w = |n: &str, role: &str| {
        format!(
            "[[winding]]\nname = \"{n}\"\nrole = \"{role}\"\nturns = 40\n\
             wire = {{ bare_mm = 0.25, od_mm = 0.3 }}\nstrands = 3\n"
        )
    };
    let text = format!(
        "format = 1\ntitle = \"Lee\"\n[bobbin]\nname = \"t\"\norigin = \"t\"\n\
         [bobbin.window]\nwidth_mm = 20.0\nheight_mm = 2.0\n[bobbin.tube]\nshape = \"round\"\n\
         diameter_mm = {d:?}\n[setup]\nmargin_mm = 0.8\ntape_mm = 0.1\n\n{}{}\
         [[stack]]\nwinding = \"P\"\n[[stack]]\ntape = 1\n[[stack]]\nwinding = \"S\"\n",
        w("P", "primary"),
        w("S", "secondary")
    );
    let b = parse_build(&text, None, &BobbinLibrary::bundled_only()).unwrap();
    let e = evaluate(&b);
    let s = sheet::sheet(&b, &e, 20.0);
    let l = s
        .checks
        .iter()
        .find(|c| c.what.starts_with("Leakage"))
        .expect("a leakage check");
    let want_uh = 4.0e-7 * std::f64::consts::PI * 1600.0 * 0.05 * 0.5e-3 / 0.0184 * 1e6;
    assert!(
        (l.value.unwrap() - want_uh).abs() / want_uh < 1e-9,
        "{} vs {want_uh}",
        l.value.unwrap()
    );
}

/// A small XML-style checker: every tag closed in order, void tags written self-closed.
fn well_formed(doc: &str) -> Result<(), String> {
    let body = doc.strip_prefix("<!DOCTYPE html>\n").ok_or("no doctype")?;
    let mut stack: Vec<String> = Vec::new();
    let mut rest = body;
    while let Some(lt) = rest.find('<') {
        let text = &rest[..lt];
        if text.contains('>') {
            return Err(format!("stray > in text: {text}"));
        }
        let gt = rest[lt..].find('>').ok_or("unclosed <")? + lt;
        let tag = &rest[lt + 1..gt];
        rest = &rest[gt + 1..];
        if let Some(name) = tag.strip_prefix('/') {
            let open = stack.pop().ok_or(format!("</{name}> with nothing open"))?;
            if open != name {
                return Err(format!("</{name}> closes <{open}>"));
            }
        } else if !tag.ends_with('/') {
            let name = tag.split_whitespace().next().ok_or("empty tag")?;
            if ["meta", "br", "img", "link", "hr", "input"].contains(&name) {
                return Err(format!("void <{name}> not self-closed"));
            }
            stack.push(name.to_string());
        }
        // Text and attribute values may not hold a raw '<' (escaped as &lt;).
        if tag.contains('<') {
            return Err(format!("< inside a tag: {tag}"));
        }
    }
    if stack.is_empty() {
        Ok(())
    } else {
        Err(format!("left open: {stack:?}"))
    }
}

fn page(b: &Build, e: &Evaluation) -> String {
    let s = sheet::sheet(b, e, 20.0);
    let (k, svg) = svg::cross_section(b, e);
    html::render(&s, &svg, k)
}

/// HTML (common practice for a printable page): well formed, with no script and no reference
/// to anything outside the file.
#[test]
fn html_is_well_formed_and_self_contained() {
    for name in EXAMPLES {
        let (b, e) = load(name);
        let p = page(&b, &e);
        well_formed(&p).unwrap_or_else(|m| panic!("{name}: {m}"));
        let lower = p.to_lowercase();
        for bad in [
            "<script", " src=", " href=", "http:", "https:", "@import", "<link", "<iframe",
            "<object",
        ] {
            assert!(!lower.contains(bad), "{name}: contains {bad}");
        }
        // The only url() is the drawing's own hatch pattern.
        assert_eq!(
            lower.matches("url(").count(),
            lower.matches("url(#hatch)").count()
        );
        assert!(lower.contains("@page"));
        assert!(p.contains(&sheet::build_id(&b)));
    }
}

/// A title with markup in it is escaped, not injected.
#[test]
fn html_escapes_user_text() {
    let (mut b, _) = load("examples/bench-forward.toml");
    b.title = "<script>x</script> & \"q\"".into();
    let e = evaluate(&b);
    let p = page(&b, &e);
    assert!(!p.contains("<script"));
    well_formed(&p).unwrap();
}

/// Drawing: one band per stack section, numbered in stack order, tape bands for tape.
#[test]
fn svg_has_one_band_per_section() {
    for name in EXAMPLES {
        let (b, e) = load(name);
        let (_, svg) = svg::cross_section(&b, &e);
        let sections: Vec<usize> = svg
            .match_indices("<g class=\"band")
            .map(|(i, _)| {
                let tail = &svg[i..];
                let a = tail.find("data-section=\"").unwrap() + 14;
                tail[a..a + tail[a..].find('"').unwrap()].parse().unwrap()
            })
            .collect();
        assert_eq!(sections, (1..=b.stack.len()).collect::<Vec<_>>(), "{name}");
        let tapes = b
            .stack
            .iter()
            .filter(|s| matches!(s, turnstack::model::Section::Tape { .. }))
            .count();
        assert_eq!(
            svg.matches("<g class=\"band tape\"").count(),
            tapes,
            "{name}"
        );
    }
}

/// The build id changes when the build changes and not when only comments do.
#[test]
fn build_id_tracks_the_build_not_the_comments() {
    let path = Path::new(env!("CARGO_MANIFEST_DIR")).join("examples/bench-forward.toml");
    let text = std::fs::read_to_string(&path).unwrap();
    let lib = BobbinLibrary::bundled_only();
    let a = parse_build(&text, None, &lib).unwrap();
    let commented = format!("# a note added by hand\n{text}\n# another\n");
    let b = parse_build(&commented, None, &lib).unwrap();
    assert_eq!(sheet::build_id(&a), sheet::build_id(&b));
    let mut c = a.clone();
    c.windings[0].turns += 1;
    assert_ne!(sheet::build_id(&a), sheet::build_id(&c));
    let mut d = a.clone();
    d.bobbin.window.height_mm += 0.1;
    assert_ne!(sheet::build_id(&a), sheet::build_id(&d));
}

/// Cut lengths: per strand, the winding length plus a 100 mm allowance at each end (and one
/// per park between sections), rounded up to 10 mm (the sheet's stated rule).
#[test]
fn cut_lengths_follow_the_stated_allowance() {
    let (b, e) = load("examples/bench-forward.toml");
    let s = sheet::sheet(&b, &e, 20.0);
    for (item, we) in s.wires.iter().zip(&e.windings) {
        let raw = we.length_m * 1000.0 + f64::from(item.lead_allowances) * 100.0;
        assert!(item.cut_each_mm >= raw && item.cut_each_mm < raw + 10.0);
        assert_eq!(item.cut_each_mm % 10.0, 0.0);
        assert_eq!(
            item.cut_total_mm,
            item.cut_each_mm * f64::from(item.strands)
        );
    }
    // P is wound in two sections: two ends and one park.
    assert_eq!(s.wires[0].lead_allowances, 3);
    assert_eq!(s.wires[1].lead_allowances, 2);
}
