//! The `[[stack]]` sections, from the tube outward.

use super::*;

/// The `[[stack]]` sections, from the tube outward.
pub(super) fn stack_of(
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
        put_opt(&mut m, "spread", &s.spread);
        put_opt(&mut m, "tape", &s.tape);
        let index = stack.len() + 1;
        let section = match (s.winding, s.tape) {
            (Some(w), None) => Section::Winding(WindingSection {
                winding: w.into_inner(),
                turns: s.turns.map(Spanned::into_inner),
                partner: s.with.map(Spanned::into_inner),
                layer_tape: s.layer_tape.map_or(0, Spanned::into_inner),
                spread: s.spread.is_some_and(Spanned::into_inner),
            }),
            (None, Some(t)) => {
                for (key, span) in [
                    ("turns", s.turns.map(|x| x.span())),
                    ("with", s.with.map(|x| x.span())),
                    ("layer_tape", s.layer_tape.map(|x| x.span())),
                    ("spread", s.spread.map(|x| x.span())),
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
