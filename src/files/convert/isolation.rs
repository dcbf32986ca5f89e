//! The `[isolation]` table: the declared class and the figures it is checked with.

use super::*;

/// `[isolation]`: the class by its key, the working voltage and creepage as given.
pub(super) fn isolation_of(
    cx: &Ctx,
    i: Spanned<raw::IsolationRaw>,
    spans: &mut Spans,
) -> Result<Isolation, LoadError> {
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
    Ok(Isolation {
        class,
        working_voltage_v: i.working_voltage_v.map(Spanned::into_inner),
        creepage_mm: i.creepage_mm.map(Spanned::into_inner),
    })
}
