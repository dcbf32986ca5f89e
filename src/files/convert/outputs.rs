//! The `[[output]]` tables, and how they go with `[operating] vout_v` / `iout_a` (the
//! one-output shorthand): either alone, or both saying the same of the regulated output.

use super::*;
use crate::model::Output;

/// The `[[output]]` tables as the model holds them, their keys' spans recorded.
pub(super) fn outputs_of(raw: Vec<Spanned<raw::OutputRaw>>, spans: &mut Spans) -> Vec<Output> {
    raw.into_iter()
        .map(|t| {
            let mut m = HashMap::new();
            m.insert("", t.span());
            let t = t.into_inner();
            put(&mut m, "name", &t.name);
            put(&mut m, "vout_v", &t.vout_v);
            put(&mut m, "iout_a", &t.iout_a);
            put_opt(&mut m, "rectifier_drop_v", &t.rectifier_drop_v);
            spans.output.push(m);
            Output {
                winding: t.name.into_inner(),
                vout_v: t.vout_v.into_inner(),
                iout_a: t.iout_a.into_inner(),
                rectifier_drop_v: t.rectifier_drop_v.map(Spanned::into_inner),
            }
        })
        .collect()
}

/// The regulated output's voltage and current: `[operating] vout_v` and `iout_a` (both
/// required without `[[output]]`), or the first output's (`[operating]`'s then refused unless
/// they say the same).
pub(super) fn regulated_of(
    cx: &Ctx<'_>,
    o: &raw::OperatingRaw,
    outputs: &[Output],
    whole: Span,
) -> Result<(f64, f64), LoadError> {
    let Some(first) = outputs.first() else {
        let missing = |key: &str| {
            cx.err(
                Some(whole.start..whole.start),
                format!("operating.{key}"),
                format!(
                    "missing key `{key}`: give the output as `vout_v` and `iout_a` in [operating], \
                     or as [[output]] tables (name, vout_v, iout_a)"
                ),
            )
        };
        let v = o.vout_v.as_ref().ok_or_else(|| missing("vout_v"))?;
        let i = o.iout_a.as_ref().ok_or_else(|| missing("iout_a"))?;
        return Ok((*v.get_ref(), *i.get_ref()));
    };
    for (key, given, wanted) in [
        ("vout_v", &o.vout_v, first.vout_v),
        ("iout_a", &o.iout_a, first.iout_a),
    ] {
        if let Some(g) = given
            && *g.get_ref() != wanted
        {
            return Err(cx.err(
                Some(g.span()),
                format!("operating.{key}"),
                format!(
                    "{} disagrees with the regulated output (the first [[output]], \"{}\"), which says {key} = {wanted}; \
                     with [[output]] tables leave it out of [operating] or make it the same",
                    g.get_ref(),
                    first.winding
                ),
            ));
        }
    }
    Ok((first.vout_v, first.iout_a))
}
