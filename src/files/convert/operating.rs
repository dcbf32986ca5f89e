//! The `[operating]` table.

use super::*;

/// `[operating]`, when given, with the `[[output]]` tables.
pub(super) fn operating_of(
    cx: &Ctx<'_>,
    raw: Option<Spanned<raw::OperatingRaw>>,
    raw_outputs: Vec<Spanned<raw::OutputRaw>>,
    spans: &mut Spans,
) -> Result<Option<Operating>, LoadError> {
    Ok(match raw {
        None => {
            if let Some(first) = raw_outputs.first() {
                return Err(cx.err(
                    Some(first.span()),
                    "output #1",
                    "[[output]] tables need an [operating] point (vin_min_v, vin_max_v, ...) to feed them",
                ));
            }
            None
        }
        Some(o) => {
            let whole = o.span();
            spans.top.insert("operating", whole.clone());
            let o = o.into_inner();
            let outputs = outputs_of(raw_outputs, spans);
            let (vout_v, iout_a) = regulated_of(cx, &o, &outputs, whole)?;
            let sp = &mut spans.operating;
            put(sp, "vin_min_v", &o.vin_min_v);
            put(sp, "vin_max_v", &o.vin_max_v);
            put_opt(sp, "vout_v", &o.vout_v);
            put_opt(sp, "iout_a", &o.iout_a);
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
                vout_v,
                iout_a,
                outputs,
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
