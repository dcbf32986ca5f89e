//! The `[operating]` table.

use super::*;

/// `[operating]`, when given.
pub(super) fn operating_of(
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
