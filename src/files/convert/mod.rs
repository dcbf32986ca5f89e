//! From the file shapes to the model: defaults, enumerated words, and the engine's validation,
//! with every problem pointed at its line and column.

use super::raw::{self, BobbinBody, BobbinField, BuildFile, WireField};
use super::{BobbinLibrary, LoadError};
use crate::engine::{Invalid, Place, validate, validate_bobbin};
use crate::library::materials;
use crate::model::{
    Bobbin, BobbinSource, Build, Conductor, Core, Insulation, Isolation, IsolationClass, Material,
    Operating, ResetSide, Role, Section, Setup, Steinmetz, Tube, Winding, WindingSection, Window,
    WireSize,
};
use std::collections::HashMap;
use std::ops::Range;
use std::path::Path;
use toml::Spanned;

mod bobbin;
mod isolation;
mod material;
mod operating;
mod outputs;
mod requirements;
mod setup;
mod stack;
mod windings;

pub(super) use bobbin::bobbin_file;
use bobbin::bobbin_of;
use isolation::isolation_of;
use material::material;
use operating::operating_of;
use outputs::{outputs_of, regulated_of};
pub(super) use requirements::{build_problems, requirements};
use setup::setup_of;
use stack::stack_of;
use windings::windings_of;

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
    output: Vec<HashMap<&'static str, Span>>,
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
            Place::Output(i, k) => self.output.get(*i).and_then(|m| pick(m, k)),
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
    let lists = ["winding", "stack", "output"];
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

/// A build file's text to a checked build: each table converted in turn, then validated with
/// every problem pointed at the span its key came from.
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

    check_size(&cx, &file)?;
    let (bobbin_source, bobbin) = bobbin_of(&cx, file.bobbin, library, &mut spans)?;

    let setup = setup_of(file.setup, &mut spans);

    let windings = windings_of(&cx, file.winding, &mut spans)?;

    let stack = stack_of(&cx, file.stack, &mut spans)?;

    let operating = operating_of(&cx, file.operating, file.output, &mut spans)?;
    let material = match file.material {
        None => None,
        Some(m) => Some(material(&cx, m, &mut spans)?),
    };

    let isolation = match file.isolation {
        None => None,
        Some(i) => Some(isolation_of(&cx, i, &mut spans)?),
    };

    let measured = super::measured::convert(text, path, file.measured, &windings)?;
    let build = Build {
        title: file.title.unwrap_or_default(),
        bobbin_source,
        bobbin,
        setup,
        windings,
        stack,
        operating,
        material,
        isolation,
        measured,
    };
    let problems = validate(&build);
    if !problems.is_empty() {
        return Err(cx.invalid(&spans, &problems));
    }
    Ok(build)
}

/// The build's size: far above any hand-wound part, so that a generated or mistyped file
/// cannot make a check run for minutes (documented in FORMAT.md).
fn check_size(cx: &Ctx, file: &BuildFile) -> Result<(), LoadError> {
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
    Ok(())
}
