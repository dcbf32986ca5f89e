//! The `[material]` table: a bundled ferrite (the key `grade`) with the file's keys over it.

use super::*;

/// `[material]`: a bundled ferrite's typical figures, with the file's explicit keys over them.
pub(super) fn material(
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
    let ferrite = match &m.grade {
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
        bsat_mt: need(m.bsat_mt, "bsat_mt", ferrite.map(|g| g.bsat_mt))?,
        br_mt: need(m.br_mt, "br_mt", ferrite.map(|g| g.br_mt))?,
        mu_i: m.mu_i.map(Spanned::into_inner).or(ferrite.map(|g| g.mu_i)),
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
            .or(ferrite.map(|g| g.steinmetz)),
        gap_mm: m.gap_mm.map(Spanned::into_inner),
        ferrite: ferrite.map(|g| g.id.to_string()),
    })
}
