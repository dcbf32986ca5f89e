//! A requirements file (the input of `turnstack design`) from its text: the build's
//! `[setup]`, `[operating]`, `[[output]]` and `[material]` converters, the `[switch]` table
//! and the `bobbins` list, every problem at its line and column.

use super::*;
use crate::engine::design::{Turns, build_for};
use crate::model::{Requirements, SwitchSpec};
use serde::Deserialize;

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
struct RequirementsFile {
    format: Option<Spanned<i64>>,
    title: Option<String>,
    bobbins: Option<Spanned<Vec<Spanned<String>>>>,
    setup: Option<raw::SetupRaw>,
    operating: Option<Spanned<raw::OperatingRaw>>,
    #[serde(default)]
    output: Vec<Spanned<raw::OutputRaw>>,
    material: Option<Spanned<raw::MaterialRaw>>,
    switch: Option<Spanned<SwitchRaw>>,
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
struct SwitchRaw {
    voltage_rating_v: Spanned<f64>,
    derating: Option<Spanned<f64>>,
}

/// A stand-in bobbin for checking the requirements with the build's checks (its own figures
/// are never shown: every check that could name it passes).
fn stand_in_bobbin() -> Bobbin {
    Bobbin {
        name: String::new(),
        origin: String::new(),
        window: Window {
            width_mm: 10.0,
            height_mm: 5.0,
        },
        tube: Tube::Round { diameter_mm: 8.0 },
        core: None,
        pin_count: None,
    }
}

/// A missing table, pointed at the top of the file.
fn missing(cx: &Ctx<'_>, key: &str, what: &str) -> LoadError {
    cx.err(
        Some(0..0),
        key.to_string(),
        format!("missing `[{key}]`: {what}"),
    )
}

/// A requirements file's text to checked requirements: the tables it needs, then the build's
/// own checks on a build of them with one turn a winding.
pub(in crate::files) fn requirements(
    text: &str,
    path: Option<&Path>,
    library: &BobbinLibrary,
) -> Result<Requirements, LoadError> {
    let cx = Ctx { text, path };
    let file: RequirementsFile = toml::from_str(text).map_err(|e| cx.syntax(&e))?;
    cx.format(file.format.as_ref(), 0..0)?;
    let mut spans = Spans::default();
    let setup = setup_of(file.setup, &mut spans);
    if setup.frequency_khz.is_none() {
        return Err(cx.err(
            Some(0..0),
            "setup.frequency_khz",
            "missing key `frequency_khz` in [setup]: the design needs the switching frequency",
        ));
    }
    let (mut operating, op_whole) =
        required_operating(&cx, file.operating, file.output, &mut spans)?;
    let m = file.material.ok_or_else(|| {
        missing(
            &cx,
            "material",
            "the core material (a `grade`, or bsat_mt, br_mt and steinmetz)",
        )
    })?;
    let material = material(&cx, m, &mut spans)?;
    let switch = switch_of(&cx, file.switch)?;
    operating.switch_rating_v = Some(switch.voltage_rating_v);
    let bobbins = match file.bobbins {
        None => None,
        Some(list) => Some(bobbin_ids(&cx, list, library)?),
    };
    let req = Requirements {
        title: file.title.unwrap_or_default(),
        setup,
        operating,
        material,
        switch,
        bobbins,
    };
    check_as_build(&cx, &req, &spans, op_whole)?;
    Ok(req)
}

/// `[operating]` and its `[[output]]` tables, required, with the duty limit the design needs
/// and without a switch rating (that is `[switch]`'s); with the table's span.
fn required_operating(
    cx: &Ctx<'_>,
    raw: Option<Spanned<raw::OperatingRaw>>,
    outputs: Vec<Spanned<raw::OutputRaw>>,
    spans: &mut Spans,
) -> Result<(Operating, Span), LoadError> {
    let op_raw = raw.ok_or_else(|| {
        missing(
            cx,
            "operating",
            "the input range, the output and the controller's duty limit",
        )
    })?;
    if let Some(r) = &op_raw.get_ref().switch_rating_v {
        return Err(cx.err(
            Some(r.span()),
            "operating.switch_rating_v",
            "a requirements file gives the switch in its own table: `[switch]` with `voltage_rating_v` (and `derating`)",
        ));
    }
    let op_whole = op_raw.span();
    let operating = operating_of(cx, Some(op_raw), outputs, spans)?
        .ok_or_else(|| missing(cx, "operating", "the operating point"))?;
    if operating.duty_limit.is_none() {
        return Err(cx.err(
            Some(op_whole.start..op_whole.start),
            "operating.duty_limit",
            "missing key `duty_limit`: the design needs the controller's largest duty (e.g. 0.45)",
        ));
    }
    Ok((operating, op_whole))
}

/// The build's own checks, on a build of these requirements with one turn a winding (the
/// windings', sections' and bobbin's checks left out: the design chooses those), and a load
/// current on every output.
fn check_as_build(
    cx: &Ctx<'_>,
    req: &Requirements,
    spans: &Spans,
    op_whole: Span,
) -> Result<(), LoadError> {
    let problems = build_problems(req);
    if !problems.is_empty() {
        return Err(cx.invalid(spans, &problems));
    }
    if req
        .operating
        .outputs_or_shorthand()
        .iter()
        .any(|o| o.iout_a <= 0.0)
    {
        return Err(cx.err(
            Some(op_whole.start..op_whole.start),
            "operating.iout_a",
            "every output needs a load current above 0 A: the design sizes the wires from it",
        ));
    }
    Ok(())
}

/// The build's own checks, on a build of these requirements with one turn a winding: what
/// they find of the setup, the operating point and the material.
pub(in crate::files) fn build_problems(req: &Requirements) -> Vec<Invalid> {
    let turns = Turns {
        np: 1,
        outputs: vec![1; req.operating.outputs.len().max(1)],
        nr: 1,
    };
    validate(&build_for(req, "", &stand_in_bobbin(), &turns))
        .into_iter()
        .filter(|p| {
            !matches!(
                p.place,
                Place::Winding(..) | Place::Section(..) | Place::Bobbin(_)
            )
        })
        .collect()
}

/// `[switch]`: the rating (required) and the derating (default 0.8).
fn switch_of(cx: &Ctx<'_>, raw: Option<Spanned<SwitchRaw>>) -> Result<SwitchSpec, LoadError> {
    let s = raw
        .ok_or_else(|| {
            missing(
                cx,
                "switch",
                "`voltage_rating_v`, the switch's rated off-state voltage",
            )
        })?
        .into_inner();
    let v = *s.voltage_rating_v.get_ref();
    if !(v.is_finite() && v > 0.0) {
        return Err(cx.err(
            Some(s.voltage_rating_v.span()),
            "switch.voltage_rating_v",
            format!("must be a positive voltage, got {v}"),
        ));
    }
    let derating = match &s.derating {
        None => SwitchSpec::DEFAULT_DERATING,
        Some(d) => {
            let x = *d.get_ref();
            if !(x > 0.0 && x <= 1.0) {
                return Err(cx.err(
                    Some(d.span()),
                    "switch.derating",
                    format!("expected a share of the rating above 0 and at most 1, got {x}"),
                ));
            }
            x
        }
    };
    Ok(SwitchSpec {
        voltage_rating_v: v,
        derating,
    })
}

/// `bobbins = [...]`: each id found in the library, with core data.
fn bobbin_ids(
    cx: &Ctx<'_>,
    list: Spanned<Vec<Spanned<String>>>,
    library: &BobbinLibrary,
) -> Result<Vec<String>, LoadError> {
    let whole = list.span();
    let list = list.into_inner();
    if list.is_empty() {
        return Err(cx.err(
            Some(whole),
            "bobbins",
            "an empty list tries no bobbin: leave `bobbins` out to try every one",
        ));
    }
    let mut ids = Vec::new();
    for id in list {
        match library.find(id.get_ref()) {
            None => {
                return Err(cx.err(
                    Some(id.span()),
                    "bobbins",
                    format!(
                        "unknown bobbin \"{}\"; the bobbins are: {}",
                        id.get_ref(),
                        library.ids().join(", ")
                    ),
                ));
            }
            Some(Err(e)) => {
                return Err(cx.err(
                    Some(id.span()),
                    "bobbins",
                    format!("bobbin \"{}\" does not load: {e}", id.get_ref()),
                ));
            }
            Some(Ok(b)) if b.core.is_none() => {
                return Err(cx.err(
                    Some(id.span()),
                    "bobbins",
                    format!(
                        "bobbin \"{}\" has no [core] figures: the design needs ae_mm2 and le_mm for the flux",
                        id.get_ref()
                    ),
                ));
            }
            Some(Ok(_)) => ids.push(id.into_inner()),
        }
    }
    Ok(ids)
}
