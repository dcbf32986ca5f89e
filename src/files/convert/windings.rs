//! The `[[winding]]` tables.

use super::*;

/// The `[[winding]]` tables, in order.
pub(super) fn windings_of(
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
        let mut conductor = Conductor::Round;
        let wire = match w.wire.into_inner() {
            WireField::Named(n) => WireSize::parse(&n).ok_or_else(|| {
                cx.err(
                    Some(wire_span),
                    format!("winding #{index} wire"),
                    format!("unknown wire \"{n}\"; expected \"awgNN\" (e.g. \"awg27\"), a bare diameter like \"0.355mm\", or {{ bare_mm = 0.40, od_mm = 0.452 }}"),
                )
            })?,
            WireField::Measured { bare_mm, od_mm } => WireSize::Measured { bare_mm, od_mm },
            WireField::Foil(f) => {
                conductor = Conductor::Foil(f);
                WireSize::Metric {
                    bare_mm: f.thickness_mm,
                }
            }
            WireField::Litz(l) => {
                conductor = Conductor::Litz(l);
                WireSize::Metric {
                    bare_mm: l.strand_mm,
                }
            }
        };
        spans.winding.push(m);
        windings.push(Winding {
            name: w.name.into_inner().into(),
            role,
            turns: w.turns.into_inner(),
            wire,
            insulation,
            strands: w.strands.map_or(1, Spanned::into_inner),
            conductor,
            current_rms_a: w.current_rms_a.map(Spanned::into_inner),
            start_pin: w.start_pin.map(|p| p.0),
            finish_pin: w.finish_pin.map(|p| p.0),
        });
    }
    Ok(windings)
}
