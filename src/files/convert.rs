//! From the file shapes to the model: defaults, enumerated words, and the engine's validation,
//! with every problem pointed at its line and column.

use super::raw::{self, BobbinBody, BobbinField, BuildFile, WireField};
use super::{BobbinLibrary, LoadError};
use crate::engine::{Invalid, Place, validate, validate_bobbin};
use crate::library::materials;
use crate::model::{
    Bobbin, BobbinSource, Build, Core, Insulation, Isolation, IsolationClass, Material, Operating,
    ResetSide, Role, Section, Setup, Steinmetz, Tube, Winding, WindingSection, Window, WireSize,
};
use std::collections::HashMap;
use std::ops::Range;
use std::path::Path;
use toml::Spanned;

type Span = Range<usize>;

pub use crate::engine::validate::{MAX_SECTIONS, MAX_WINDINGS};

/// Spans of the keys validation may point at, by place.
#[derive(Default)]
struct Spans {
    top: HashMap<&'static str, Span>,
    bobbin: HashMap<&'static str, Span>,
    setup: HashMap<&'static str, Span>,
    winding: Vec<HashMap<&'static str, Span>>,
    section: Vec<HashMap<&'static str, Span>>,
    operating: HashMap<&'static str, Span>,
    material: HashMap<&'static str, Span>,
}

impl Spans {
    fn of(&self, place: &Place) -> Option<Span> {
        let pick =
            |m: &HashMap<&'static str, Span>, k: &str| m.get(k).or_else(|| m.get("")).cloned();
        match place {
            Place::Top(k) => self.top.get(k).cloned(),
            Place::Bobbin(k) => pick(&self.bobbin, k).or_else(|| self.top.get("bobbin").cloned()),
            Place::Setup(k) => pick(&self.setup, k),
            Place::Winding(i, k) => self.winding.get(*i).and_then(|m| pick(m, k)),
            Place::Section(i, k) => self.section.get(*i).and_then(|m| pick(m, k)),
            Place::Operating(k) => {
                pick(&self.operating, k).or_else(|| self.top.get("operating").cloned())
            }
            Place::Material(k) => {
                pick(&self.material, k).or_else(|| self.top.get("material").cloned())
            }
        }
    }
}

struct Ctx<'a> {
    text: &'a str,
    path: Option<&'a Path>,
}

impl Ctx<'_> {
    fn err(
        &self,
        span: Option<Span>,
        key: impl Into<String>,
        message: impl Into<String>,
    ) -> LoadError {
        LoadError::at(self.text, self.path, span, Some(key.into()), message.into())
    }

    /// A parse error from the toml library, with the key it is about (read off the line)
    /// and Rust type names put in words a user knows.
    fn syntax(&self, e: &toml::de::Error) -> LoadError {
        let mut message = e.message().trim().to_string();
        for (rust, words) in [
            ("expected u32", "expected a whole number, 0 or more"),
            ("expected i64", "expected a whole number"),
            ("expected f64", "expected a number"),
            ("expected a string", "expected text in quotes"),
        ] {
            message = message.replace(rust, words);
        }
        let mut span = e.span();
        let mut key = span
            .clone()
            .and_then(|span| key_before(self.text, span.start));
        if message.contains("recursion limit") || message.contains("max recursion depth") {
            // The parser stops without a place, or at a bracket: name the deepest line.
            let (at, depth) = deepest_line(self.text);
            if span.is_none() {
                span = Some(at..at);
                key = None;
            }
            message = format!(
                "keys nested {depth} levels deep; a build file nests at most 3, as in `[bobbin.window]`"
            );
        } else if message.starts_with("invalid type")
            && let Some(better) = span.clone().and_then(|s| header_shape(self.text, s.start))
        {
            message = better;
        }
        LoadError::at(self.text, self.path, span, key, message)
    }

    fn invalid(&self, spans: &Spans, problems: &[Invalid]) -> LoadError {
        let first = &problems[0];
        let mut e = self.err(
            spans.of(&first.place),
            first.place.to_string(),
            first.message.clone(),
        );
        e.also = problems[1..]
            .iter()
            .map(|p| self.located(spans, p))
            .collect();
        e
    }

    /// `line:column: place: message` for a further problem.
    fn located(&self, spans: &Spans, p: &Invalid) -> String {
        let e = self.err(spans.of(&p.place), p.place.to_string(), p.message.clone());
        match (e.line, e.column) {
            (Some(l), Some(c)) => format!("{l}:{c}: {}: {}", p.place, p.message),
            _ => p.to_string(),
        }
    }

    fn format(&self, format: Option<&Spanned<i64>>, whole: Span) -> Result<(), LoadError> {
        match format {
            None => Err(self.err(
                Some(whole.start..whole.start),
                "format",
                "missing key `format`; expected `format = 1`",
            )),
            Some(f) if *f.get_ref() != 1 => Err(self.err(
                Some(f.span()),
                "format",
                format!("this program reads format 1, the file says {}", f.get_ref()),
            )),
            Some(_) => Ok(()),
        }
    }
}

/// The tables a build has once (`[setup]`) and the lists it has one of per entry
/// (`[[winding]]`): a header of the wrong shape, said in those words.
fn header_shape(text: &str, offset: usize) -> Option<String> {
    let start = text[..offset.min(text.len())]
        .rfind('\n')
        .map_or(0, |i| i + 1);
    let line = text[start..].lines().next()?.trim();
    let line = line.split('#').next()?.trim();
    let lists = ["winding", "stack"];
    if let Some(name) = line.strip_prefix("[[").and_then(|l| l.strip_suffix("]]")) {
        let name = name.trim();
        if !lists.contains(&name) {
            return Some(format!(
                "`[[{name}]]` makes a list of tables, but a build has one `{name}`: expected `[{name}]`"
            ));
        }
    } else if let Some(name) = line.strip_prefix('[').and_then(|l| l.strip_suffix(']')) {
        let name = name.trim();
        if lists.contains(&name) {
            return Some(format!(
                "`[{name}]` is one table, but a build lists its {name} entries: expected `[[{name}]]`, once for each"
            ));
        }
    }
    None
}

/// The start of the most deeply nested line (dotted keys, brackets and braces) and its depth.
fn deepest_line(text: &str) -> (usize, usize) {
    let mut best = (0, 0);
    let mut offset = 0;
    let mut open = 0usize;
    for line in text.split_inclusive('\n') {
        let mut depth = open;
        let mut peak = open;
        let mut quoted = false;
        for c in line.chars() {
            match c {
                '"' => quoted = !quoted,
                '#' if !quoted => break,
                '[' | '{' if !quoted => {
                    depth += 1;
                    peak = peak.max(depth);
                }
                ']' | '}' if !quoted => depth = depth.saturating_sub(1),
                _ => {}
            }
        }
        let key = line.split('=').next().unwrap_or("");
        let dots = if line.contains('=') || line.trim_start().starts_with('[') {
            key.matches('.').count() + 1
        } else {
            0
        };
        let here = peak.max(dots);
        if here > best.1 {
            best = (offset, here);
        }
        // Arrays may run over several lines.
        open = depth;
        offset += line.len();
    }
    best
}

/// The key of a `key = value` line when `offset` lies in its value.
fn key_before(text: &str, offset: usize) -> Option<String> {
    let start = text[..offset.min(text.len())]
        .rfind('\n')
        .map_or(0, |i| i + 1);
    let (key, _) = text[start..offset.min(text.len())].split_once('=')?;
    let key = key.trim();
    (!key.is_empty() && !key.starts_with('[') && !key.contains(['{', ',', '"']))
        .then(|| key.to_string())
}

fn put<T>(m: &mut HashMap<&'static str, Span>, key: &'static str, v: &Spanned<T>) {
    m.insert(key, v.span());
}

fn put_opt<T>(m: &mut HashMap<&'static str, Span>, key: &'static str, v: &Option<Spanned<T>>) {
    if let Some(v) = v {
        m.insert(key, v.span());
    }
}

pub(super) fn bobbin_file(text: &str, path: Option<&Path>) -> Result<Bobbin, LoadError> {
    let cx = Ctx { text, path };
    let body: BobbinBody = toml::from_str(text).map_err(|e| cx.syntax(&e))?;
    cx.format(body.format.as_ref(), 0..0)?;
    let mut spans = HashMap::new();
    let bobbin = bobbin_body(&cx, body, &mut spans)?;
    let problems = validate_bobbin(&bobbin);
    if !problems.is_empty() {
        let s = Spans {
            bobbin: spans,
            ..Default::default()
        };
        return Err(cx.invalid(&s, &problems));
    }
    Ok(bobbin)
}

fn bobbin_body(
    cx: &Ctx,
    b: BobbinBody,
    spans: &mut HashMap<&'static str, Span>,
) -> Result<Bobbin, LoadError> {
    put(spans, "window", &b.window);
    put(spans, "tube", &b.tube);
    let (window_span, window) = (b.window.span(), b.window.into_inner());
    spans.insert("window", window_span);
    put(spans, "window.width_mm", &window.width_mm);
    put(spans, "window.height_mm", &window.height_mm);
    let tube_span = b.tube.span();
    let t = b.tube.into_inner();
    put_opt(spans, "tube.width_mm", &t.width_mm);
    put_opt(spans, "tube.depth_mm", &t.depth_mm);
    put_opt(spans, "tube.corner_radius_mm", &t.corner_radius_mm);
    put_opt(spans, "tube.diameter_mm", &t.diameter_mm);
    let need = |v: Option<Spanned<f64>>, key: &str, shape: &str| {
        v.map(Spanned::into_inner).ok_or_else(|| {
            cx.err(
                Some(tube_span.clone()),
                format!("tube.{key}"),
                format!("missing key `{key}`: a {shape} tube needs it"),
            )
        })
    };
    let refuse = |v: &Option<Spanned<f64>>, key: &str, shape: &str| match v {
        Some(v) => Err(cx.err(
            Some(v.span()),
            format!("tube.{key}"),
            format!("a {shape} tube has no `{key}`"),
        )),
        None => Ok(()),
    };
    let tube = match t.shape.get_ref().as_str() {
        "rect" => {
            refuse(&t.diameter_mm, "diameter_mm", "rect")?;
            Tube::Rect {
                width_mm: need(t.width_mm, "width_mm", "rect")?,
                depth_mm: need(t.depth_mm, "depth_mm", "rect")?,
                corner_radius_mm: t.corner_radius_mm.map_or(0.0, Spanned::into_inner),
            }
        }
        "round" => {
            refuse(&t.width_mm, "width_mm", "round")?;
            refuse(&t.depth_mm, "depth_mm", "round")?;
            refuse(&t.corner_radius_mm, "corner_radius_mm", "round")?;
            Tube::Round {
                diameter_mm: need(t.diameter_mm, "diameter_mm", "round")?,
            }
        }
        other => {
            return Err(cx.err(
                Some(t.shape.span()),
                "tube.shape",
                format!("unknown tube shape \"{other}\"; expected \"rect\" or \"round\""),
            ));
        }
    };
    let core = b.core.map(|c| {
        spans.insert("core", c.span());
        let c = c.into_inner();
        put(spans, "core.ae_mm2", &c.ae_mm2);
        put(spans, "core.le_mm", &c.le_mm);
        put_opt(spans, "core.ve_mm3", &c.ve_mm3);
        put_opt(spans, "core.al_nh", &c.al_nh);
        Core {
            ae_mm2: c.ae_mm2.into_inner(),
            le_mm: c.le_mm.into_inner(),
            ve_mm3: c.ve_mm3.map(Spanned::into_inner),
            al_nh: c.al_nh.map(Spanned::into_inner),
        }
    });
    if let Some(p) = &b.pins
        && *p.count.get_ref() == 0
    {
        return Err(cx.err(Some(p.count.span()), "pins.count", "must be at least 1"));
    }
    Ok(Bobbin {
        name: b.name.unwrap_or_default(),
        origin: b.origin.unwrap_or_default(),
        window: Window {
            width_mm: window.width_mm.into_inner(),
            height_mm: window.height_mm.into_inner(),
        },
        tube,
        core,
        pin_count: b.pins.map(|p| p.count.into_inner()),
    })
}

pub(super) fn build(
    text: &str,
    path: Option<&Path>,
    library: &BobbinLibrary,
) -> Result<Build, LoadError> {
    let cx = Ctx { text, path };
    let file: BuildFile = toml::from_str(text).map_err(|e| cx.syntax(&e))?;
    cx.format(Some(&file.format), 0..0)?;
    let mut spans = Spans::default();
    spans.top.insert("format", file.format.span());
    spans.top.insert("bobbin", file.bobbin.span());
    spans.top.insert("winding", 0..0);
    spans.top.insert("stack", 0..0);

    // Build size: far above any hand-wound part, so that a generated or mistyped file cannot
    // make a check run for minutes (documented in FORMAT.md).
    for (what, count, limit, span) in [
        (
            "windings",
            file.winding.len(),
            MAX_WINDINGS,
            file.winding.get(MAX_WINDINGS).map(Spanned::span),
        ),
        (
            "stack sections",
            file.stack.len(),
            MAX_SECTIONS,
            file.stack.get(MAX_SECTIONS).map(Spanned::span),
        ),
    ] {
        if count > limit {
            let key = if what == "windings" {
                format!("winding #{}", limit + 1)
            } else {
                format!("stack #{}", limit + 1)
            };
            return Err(cx.err(
                span,
                key,
                format!("{count} {what} is more than this program takes (at most {limit}; a hand-wound part has a few)"),
            ));
        }
    }
    let (bobbin_source, bobbin) = bobbin_of(&cx, file.bobbin, library, &mut spans)?;

    let setup = setup_of(file.setup, &mut spans);

    let windings = windings_of(&cx, file.winding, &mut spans)?;

    let stack = stack_of(&cx, file.stack, &mut spans)?;

    let operating = operating_of(&cx, file.operating, &mut spans)?;
    let material = match file.material {
        None => None,
        Some(m) => Some(material(&cx, m, &mut spans)?),
    };

    let isolation = match file.isolation {
        None => None,
        Some(i) => {
            spans.top.insert("isolation", i.span());
            let i = i.into_inner();
            put(&mut spans.top, "isolation.class", &i.class);
            put_opt(
                &mut spans.top,
                "isolation.working_voltage_v",
                &i.working_voltage_v,
            );
            put_opt(&mut spans.top, "isolation.creepage_mm", &i.creepage_mm);
            let class = IsolationClass::from_key(i.class.get_ref()).ok_or_else(|| {
                cx.err(
                    Some(i.class.span()),
                    "isolation.class",
                    format!(
                        "unknown isolation class \"{}\"; expected \"functional\", \"basic\" or \"reinforced\"",
                        i.class.get_ref()
                    ),
                )
            })?;
            Some(Isolation {
                class,
                working_voltage_v: i.working_voltage_v.map(Spanned::into_inner),
                creepage_mm: i.creepage_mm.map(Spanned::into_inner),
            })
        }
    };

    let measured = super::measured::convert(text, path, file.measured, &windings)?;
    let mut build = Build {
        title: file.title.unwrap_or_default(),
        bobbin_source,
        bobbin,
        setup,
        windings,
        stack,
        operating,
        material,
        isolation,
    };
    let problems = validate(&build);
    if !problems.is_empty() {
        return Err(cx.invalid(&spans, &problems));
    }
    build.set_measured(measured);
    Ok(build)
}

/// The build's bobbin: looked up by id in the library, or written inline.
fn bobbin_of(
    cx: &Ctx<'_>,
    field: Spanned<BobbinField>,
    library: &BobbinLibrary,
    spans: &mut Spans,
) -> Result<(BobbinSource, Bobbin), LoadError> {
    let bobbin_span = field.span();
    Ok(match field.into_inner() {
        BobbinField::Id(id) => match library.find(&id) {
            Some(Ok(b)) => (BobbinSource::Id(id), b),
            Some(Err(e)) => {
                return Err(cx.err(
                    Some(bobbin_span),
                    "bobbin",
                    format!("bobbin \"{id}\" cannot be used: {e}"),
                ));
            }
            None => {
                let ids = library.ids();
                return Err(cx.err(
                    Some(bobbin_span),
                    "bobbin",
                    format!(
                        "unknown bobbin id \"{id}\"; the bobbins that exist are: {}",
                        ids.join(", ")
                    ),
                ));
            }
        },
        BobbinField::Inline(body) => (
            BobbinSource::Inline,
            bobbin_body(cx, *body, &mut spans.bobbin)?,
        ),
    })
}

/// `[setup]`, its defaults where a key is left out.
fn setup_of(raw: Option<raw::SetupRaw>, spans: &mut Spans) -> Setup {
    match raw {
        None => Setup::default(),
        Some(s) => {
            put_opt(&mut spans.setup, "temperature_c", &s.temperature_c);
            put_opt(&mut spans.setup, "bulge", &s.bulge);
            put_opt(&mut spans.setup, "margin_mm", &s.margin_mm);
            put_opt(&mut spans.setup, "tape_mm", &s.tape_mm);
            put_opt(&mut spans.setup, "frequency_khz", &s.frequency_khz);
            put_opt(&mut spans.setup, "wire_class_c", &s.wire_class_c);
            put_opt(&mut spans.setup, "tape_class_c", &s.tape_class_c);
            put_opt(&mut spans.setup, "bobbin_class_c", &s.bobbin_class_c);
            let d = Setup::default();
            let v = |x: Option<Spanned<f64>>, default: f64| x.map_or(default, Spanned::into_inner);
            Setup {
                temperature_given: s.temperature_c.is_some(),
                temperature_c: v(s.temperature_c, d.temperature_c),
                wire_class_c: s.wire_class_c.map(Spanned::into_inner),
                tape_class_c: s.tape_class_c.map(Spanned::into_inner),
                bobbin_class_c: s.bobbin_class_c.map(Spanned::into_inner),
                bulge: v(s.bulge, d.bulge),
                margin_mm: v(s.margin_mm, d.margin_mm),
                tape_mm: v(s.tape_mm, d.tape_mm),
                frequency_khz: s.frequency_khz.map(Spanned::into_inner),
                measured: None,
            }
        }
    }
}

/// The `[[winding]]` tables, in order.
fn windings_of(
    cx: &Ctx<'_>,
    raw: Vec<Spanned<raw::WindingRaw>>,
    spans: &mut Spans,
) -> Result<Vec<Winding>, LoadError> {
    let mut windings = Vec::new();
    for w in raw {
        let mut m = HashMap::new();
        m.insert("", w.span());
        let w = w.into_inner();
        put(&mut m, "name", &w.name);
        put(&mut m, "turns", &w.turns);
        put(&mut m, "wire", &w.wire);
        put_opt(&mut m, "strands", &w.strands);
        put_opt(&mut m, "current_rms_a", &w.current_rms_a);
        let index = windings.len() + 1;
        let role = Role::from_key(w.role.get_ref()).ok_or_else(|| {
            cx.err(
                Some(w.role.span()),
                format!("winding #{index} role"),
                format!("unknown role \"{}\"; expected \"primary\", \"secondary\", \"reset\" or \"auxiliary\"", w.role.get_ref()),
            )
        })?;
        let insulation = match &w.insulation {
            None => Insulation::Grade2,
            Some(g) => Insulation::from_key(g.get_ref()).ok_or_else(|| {
                cx.err(
                    Some(g.span()),
                    format!("winding #{index} insulation"),
                    format!("unknown insulation \"{}\"; expected \"grade1\", \"grade2\", \"grade3\" or \"tiw\"", g.get_ref()),
                )
            })?,
        };
        let wire_span = w.wire.span();
        let wire = match w.wire.into_inner() {
            WireField::Named(n) => WireSize::parse(&n).ok_or_else(|| {
                cx.err(
                    Some(wire_span),
                    format!("winding #{index} wire"),
                    format!("unknown wire \"{n}\"; expected \"awgNN\" (e.g. \"awg27\"), a bare diameter like \"0.355mm\", or {{ bare_mm = 0.40, od_mm = 0.452 }}"),
                )
            })?,
            WireField::Measured { bare_mm, od_mm } => WireSize::Measured { bare_mm, od_mm },
        };
        spans.winding.push(m);
        windings.push(Winding {
            name: w.name.into_inner().into(),
            role,
            turns: w.turns.into_inner(),
            wire,
            insulation,
            strands: w.strands.map_or(1, Spanned::into_inner),
            current_rms_a: w.current_rms_a.map(Spanned::into_inner),
            start_pin: w.start_pin.map(|p| p.0),
            finish_pin: w.finish_pin.map(|p| p.0),
        });
    }
    Ok(windings)
}

/// The `[[stack]]` sections, from the tube outward.
fn stack_of(
    cx: &Ctx<'_>,
    raw: Vec<Spanned<raw::SectionRaw>>,
    spans: &mut Spans,
) -> Result<Vec<Section>, LoadError> {
    let mut stack = Vec::new();
    for s in raw {
        let mut m = HashMap::new();
        m.insert("", s.span());
        let whole = s.span();
        let s = s.into_inner();
        put_opt(&mut m, "winding", &s.winding);
        put_opt(&mut m, "turns", &s.turns);
        put_opt(&mut m, "with", &s.with);
        put_opt(&mut m, "layer_tape", &s.layer_tape);
        put_opt(&mut m, "tape", &s.tape);
        let index = stack.len() + 1;
        let section = match (s.winding, s.tape) {
            (Some(w), None) => Section::Winding(WindingSection {
                winding: w.into_inner(),
                turns: s.turns.map(Spanned::into_inner),
                with: s.with.map(Spanned::into_inner),
                layer_tape: s.layer_tape.map_or(0, Spanned::into_inner),
            }),
            (None, Some(t)) => {
                for (key, span) in [
                    ("turns", s.turns.map(|x| x.span())),
                    ("with", s.with.map(|x| x.span())),
                    ("layer_tape", s.layer_tape.map(|x| x.span())),
                ] {
                    if let Some(span) = span {
                        return Err(cx.err(
                            Some(span),
                            format!("stack #{index} {key}"),
                            format!("a tape section takes only `tape`, not `{key}`"),
                        ));
                    }
                }
                Section::Tape {
                    wraps: t.into_inner(),
                }
            }
            (Some(_), Some(t)) => {
                return Err(cx.err(
                    Some(t.span()),
                    format!("stack #{index}"),
                    "a section is either a winding or tape, not both",
                ));
            }
            (None, None) => {
                return Err(cx.err(
                    Some(whole),
                    format!("stack #{index}"),
                    "missing key: expected `winding = \"name\"` or `tape = wraps`",
                ));
            }
        };
        spans.section.push(m);
        stack.push(section);
    }
    Ok(stack)
}

/// `[operating]`, when given.
fn operating_of(
    cx: &Ctx<'_>,
    raw: Option<Spanned<raw::OperatingRaw>>,
    spans: &mut Spans,
) -> Result<Option<Operating>, LoadError> {
    Ok(match raw {
        None => None,
        Some(o) => {
            spans.top.insert("operating", o.span());
            let o = o.into_inner();
            let sp = &mut spans.operating;
            put(sp, "vin_min_v", &o.vin_min_v);
            put(sp, "vin_max_v", &o.vin_max_v);
            put(sp, "vout_v", &o.vout_v);
            put(sp, "iout_a", &o.iout_a);
            put_opt(sp, "rectifier_drop_v", &o.rectifier_drop_v);
            put_opt(sp, "duty_limit", &o.duty_limit);
            put_opt(sp, "rise_limit_c", &o.rise_limit_c);
            put_opt(sp, "surface_area_cm2", &o.surface_area_cm2);
            put_opt(sp, "switch_drop_v", &o.switch_drop_v);
            put_opt(sp, "ambient_c", &o.ambient_c);
            put_opt(sp, "switch_rating_v", &o.switch_rating_v);
            if let Some(c) = &o.converter
                && c.get_ref() != "forward"
            {
                return Err(cx.err(
                    Some(c.span()),
                    "operating.converter",
                    format!(
                        "unknown converter \"{}\"; this version knows \"forward\" (single switch)",
                        c.get_ref()
                    ),
                ));
            }
            let reset_side = match &o.reset_side {
                None => ResetSide::Primary,
                Some(r) => match r.get_ref().as_str() {
                    "primary" => ResetSide::Primary,
                    "secondary" => ResetSide::Secondary,
                    other => {
                        return Err(cx.err(Some(r.span()), "operating.reset_side", format!("unknown reset side \"{other}\"; expected \"primary\" or \"secondary\"")));
                    }
                },
            };
            Some(Operating {
                reset_side,
                vin_min_v: o.vin_min_v.into_inner(),
                vin_max_v: o.vin_max_v.into_inner(),
                vout_v: o.vout_v.into_inner(),
                iout_a: o.iout_a.into_inner(),
                rectifier_drop_v: o.rectifier_drop_v.map_or(0.0, Spanned::into_inner),
                duty_limit: o.duty_limit.map(Spanned::into_inner),
                rise_limit_c: o.rise_limit_c.map(Spanned::into_inner),
                surface_area_cm2: o.surface_area_cm2.map(Spanned::into_inner),
                switch_drop_v: o.switch_drop_v.map_or(0.0, Spanned::into_inner),
                ambient_c: o.ambient_c.map(Spanned::into_inner),
                switch_rating_v: o.switch_rating_v.map(Spanned::into_inner),
            })
        }
    })
}

/// `[material]`: a bundled grade's typical figures, with the file's explicit keys over them.
fn material(
    cx: &Ctx,
    m: Spanned<raw::MaterialRaw>,
    spans: &mut Spans,
) -> Result<Material, LoadError> {
    let whole = m.span();
    spans.top.insert("material", whole.clone());
    let m = m.into_inner();
    let sp = &mut spans.material;
    put_opt(sp, "grade", &m.grade);
    put_opt(sp, "bsat_mt", &m.bsat_mt);
    put_opt(sp, "br_mt", &m.br_mt);
    put_opt(sp, "mu_i", &m.mu_i);
    put_opt(sp, "steinmetz", &m.steinmetz);
    put_opt(sp, "gap_mm", &m.gap_mm);
    let grade = match &m.grade {
        None => None,
        Some(g) => Some(materials::find(g.get_ref()).ok_or_else(|| {
            cx.err(
                Some(g.span()),
                "material.grade",
                format!(
                    "unknown grade \"{}\"; the bundled grades are: {}",
                    g.get_ref(),
                    materials::ids().join(", ")
                ),
            )
        })?),
    };
    let need = |v: Option<Spanned<f64>>, key: &str, typical: Option<f64>| {
        v.map(Spanned::into_inner).or(typical).ok_or_else(|| {
            cx.err(
                Some(whole.start..whole.start),
                format!("material.{key}"),
                format!("missing key `{key}`; give it, or a `grade` that supplies it"),
            )
        })
    };
    Ok(Material {
        bsat_mt: need(m.bsat_mt, "bsat_mt", grade.map(|g| g.bsat_mt))?,
        br_mt: need(m.br_mt, "br_mt", grade.map(|g| g.br_mt))?,
        mu_i: m.mu_i.map(Spanned::into_inner).or(grade.map(|g| g.mu_i)),
        steinmetz: m
            .steinmetz
            .map(|s| {
                let s: raw::SteinmetzRaw = s.into_inner();
                Steinmetz {
                    k: s.k,
                    alpha: s.alpha,
                    beta: s.beta,
                }
            })
            .or(grade.map(|g| g.steinmetz)),
        gap_mm: m.gap_mm.map(Spanned::into_inner),
        grade: grade.map(|g| g.id.to_string()),
    })
}
