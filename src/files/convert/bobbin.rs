//! A bobbin file, and the build's bobbin from the library or inline.

use super::*;

pub(in crate::files) fn bobbin_file(text: &str, path: Option<&Path>) -> Result<Bobbin, LoadError> {
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

/// A bobbin's tables (window, tube, core, pins) to a bobbin, each key's span recorded.
pub(super) fn bobbin_body(
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
    let tube = tube_of(cx, b.tube, spans)?;
    let core = b.core.map(|c| core_of(c, spans));
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

/// `[tube]`: a rect (width, depth, corner radius 0 unless given) or a round (diameter); a key
/// of the other shape is refused, a missing one is asked for.
fn tube_of(
    cx: &Ctx,
    tube: Spanned<raw::TubeRaw>,
    spans: &mut HashMap<&'static str, Span>,
) -> Result<Tube, LoadError> {
    let tube_span = tube.span();
    let t = tube.into_inner();
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
    Ok(match t.shape.get_ref().as_str() {
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
    })
}

/// `[core]`: the effective area and length, and the volume and AL when given.
fn core_of(c: Spanned<raw::CoreRaw>, spans: &mut HashMap<&'static str, Span>) -> Core {
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
}

/// The build's bobbin: looked up by id in the library, or written inline.
pub(super) fn bobbin_of(
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
