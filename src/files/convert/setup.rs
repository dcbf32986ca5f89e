//! The `[setup]` table, with its defaults.

use super::*;

/// `[setup]`, its defaults where a key is left out.
pub(super) fn setup_of(raw: Option<raw::SetupRaw>, spans: &mut Spans) -> Setup {
    match raw {
        None => Setup::default(),
        Some(s) => {
            put_opt(&mut spans.setup, "temperature_c", &s.temperature_c);
            put_opt(&mut spans.setup, "bulge", &s.bulge);
            put_opt(&mut spans.setup, "margin_mm", &s.margin_mm);
            put_opt(&mut spans.setup, "tape_mm", &s.tape_mm);
            put_opt(&mut spans.setup, "frequency_khz", &s.frequency_khz);
            put_opt(&mut spans.setup, "wire_class_c", &s.wire_class_c);
            put_opt(&mut spans.setup, "tape_class_c", &s.tape_class_c);
            put_opt(&mut spans.setup, "bobbin_class_c", &s.bobbin_class_c);
            let d = Setup::default();
            let v = |x: Option<Spanned<f64>>, default: f64| x.map_or(default, Spanned::into_inner);
            Setup {
                temperature_given: s.temperature_c.is_some(),
                temperature_c: v(s.temperature_c, d.temperature_c),
                wire_class_c: s.wire_class_c.map(Spanned::into_inner),
                tape_class_c: s.tape_class_c.map(Spanned::into_inner),
                bobbin_class_c: s.bobbin_class_c.map(Spanned::into_inner),
                allowance_factor: v(s.bulge, d.allowance_factor),
                margin_mm: v(s.margin_mm, d.margin_mm),
                tape_mm: v(s.tape_mm, d.tape_mm),
                frequency_khz: s.frequency_khz.map(Spanned::into_inner),
            }
        }
    }
}
