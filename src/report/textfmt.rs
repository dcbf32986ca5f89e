//! The one text-formatting module of the fronts: word wrapping and cutting by display width
//! (unicode-width), padding table cells, and the short wire label ("3x0.5 mm") of tables.
//! Shared by the report, the sheet, the command line and the planner.

use unicode_width::UnicodeWidthStr;

/// Wrap `text` to `width` columns; continuation lines start with `indent`.
pub fn wrap(text: &str, width: usize, indent: &str) -> Vec<String> {
    let mut lines = Vec::new();
    let mut line = String::new();
    for word in text.split_whitespace() {
        let room = if lines.is_empty() {
            width
        } else {
            width.saturating_sub(indent.width())
        };
        if !line.is_empty() && line.width() + 1 + word.width() > room {
            lines.push(std::mem::take(&mut line));
        }
        if !line.is_empty() {
            line.push(' ');
        }
        line.push_str(word);
    }
    if !line.is_empty() || lines.is_empty() {
        lines.push(line);
    }
    lines
        .into_iter()
        .enumerate()
        .map(|(i, l)| if i == 0 { l } else { format!("{indent}{l}") })
        .collect()
}

/// Word-wrap `text` to `width` columns with no indent, cutting a word longer than the
/// width; no lines for empty text (the planner's panels).
pub fn wrap_cut(text: &str, width: usize) -> Vec<String> {
    let mut lines = Vec::new();
    let mut line = String::new();
    for word in text.split_whitespace() {
        if !line.is_empty() && line.width() + 1 + word.width() > width {
            lines.push(std::mem::take(&mut line));
        }
        if !line.is_empty() {
            line.push(' ');
        }
        line.push_str(&truncate(word, width));
    }
    if !line.is_empty() {
        lines.push(line);
    }
    lines
}

/// Pad or cut text to exactly `width` display columns (a left-aligned table cell).
pub fn pad(s: &str, width: usize) -> String {
    let s = truncate(s, width);
    let w = s.width();
    format!("{s}{}", " ".repeat(width.saturating_sub(w)))
}

/// Cut to `n` display columns.
pub fn truncate(s: &str, n: usize) -> String {
    use unicode_width::UnicodeWidthChar;
    let mut out = String::new();
    let mut w = 0;
    for c in s.chars() {
        let cw = c.width().unwrap_or(0);
        if w + cw > n {
            break;
        }
        w += cw;
        out.push(c);
    }
    out
}

/// A short wire label for tables: `3x0.5 mm`, `AWG 32`, `0.8/0.87 mm` for measured wire.
pub fn wire_label(wire: &crate::model::WireSize, strands: u32) -> String {
    use crate::model::{WireSize, trim_mm};
    let base = match *wire {
        WireSize::Measured { bare_mm, od_mm } => {
            format!("{}/{} mm", trim_mm(bare_mm), trim_mm(od_mm))
        }
        other => other.to_string(),
    };
    if strands > 1 {
        format!("{strands}x{base}")
    } else {
        base
    }
}

/// A short label of a foil or litz conductor for tables: `foil 0.2x9 mm` (thickness x the
/// width used, read from the Evaluation's figures), `litz 60x0.1 mm`, `2x litz 60x0.1 mm`
/// for bundles in parallel; `None` for round wire (see [`wire_label`]).
pub fn foil_litz_label(
    w: &crate::model::Winding,
    fig: Option<&crate::engine::conductor::ConductorFigures>,
) -> Option<String> {
    use crate::engine::conductor::ConductorFigures;
    use crate::model::{Conductor, trim_mm};
    match w.conductor {
        Conductor::Round => None,
        Conductor::Foil(f) => {
            let width = match fig {
                Some(ConductorFigures::Foil { width_mm, .. }) => Some(*width_mm),
                _ => f.width_mm,
            };
            Some(match width {
                Some(width) => format!("foil {}x{} mm", trim_mm(f.thickness_mm), trim_mm(width)),
                None => format!("foil {} mm", trim_mm(f.thickness_mm)),
            })
        }
        Conductor::Litz(l) => {
            let one = format!("litz {}x{} mm", l.strands, trim_mm(l.strand_mm));
            Some(if w.strands > 1 {
                format!("{}x {one}", w.strands)
            } else {
                one
            })
        }
    }
}

/// A winding's conductor for tables: [`wire_label`] for round wire, `litz 60x0.1` (with
/// `2x` for bundles in parallel) and `foil 0.15 mm` for the others.
pub fn conductor_label(w: &crate::model::Winding) -> String {
    use crate::model::{Conductor, trim_mm};
    match w.conductor {
        Conductor::Round => wire_label(&w.wire, w.strands),
        Conductor::Foil(f) => format!("foil {} mm", trim_mm(f.thickness_mm)),
        Conductor::Litz(l) => {
            let base = format!("litz {}x{}", l.strands, trim_mm(l.strand_mm));
            if w.strands > 1 {
                format!("{}x{base}", w.strands)
            } else {
                base
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// A foil reads thickness x width; a litz strands x strand diameter.
    #[test]
    fn conductor_labels_of_foil_and_litz() {
        use crate::model::{Conductor, Foil, Insulation, Litz, Role, Winding, WireSize};
        let mut w = Winding {
            name: "S".into(),
            role: Role::Secondary,
            turns: 3,
            wire: WireSize::Metric { bare_mm: 0.2 },
            insulation: Insulation::Grade2,
            strands: 1,
            conductor: Conductor::Foil(Foil {
                width_mm: Some(9.0),
                ..Foil::of(0.2)
            }),
            current_rms_a: None,
            start_pin: None,
            finish_pin: None,
        };
        assert_eq!(foil_litz_label(&w, None).unwrap(), "foil 0.2x9 mm");
        w.conductor = Conductor::Litz(Litz::of(60, 0.1));
        assert_eq!(foil_litz_label(&w, None).unwrap(), "litz 60x0.1 mm");
        w.strands = 2;
        assert_eq!(foil_litz_label(&w, None).unwrap(), "2x litz 60x0.1 mm");
        w.conductor = Conductor::Round;
        assert_eq!(foil_litz_label(&w, None), None);
    }

    #[test]
    fn wraps_within_width() {
        let t = "the quick brown fox jumps over the lazy dog again and again";
        for l in wrap(t, 20, "  ") {
            assert!(l.width() <= 20, "{l}");
        }
        assert_eq!(wrap("short", 20, "  "), vec!["short".to_string()]);
    }

    /// Cutting and padding count display columns, not bytes: a CJK character is two wide
    /// (Unicode Standard Annex #11, East Asian Width).
    #[test]
    fn cuts_and_pads_by_display_width() {
        assert_eq!(truncate("巻線abc", 5), "巻線a");
        assert_eq!(pad("巻", 4), "巻  ");
        assert_eq!(pad("abcdef", 3), "abc");
        assert_eq!(wrap_cut("", 10), Vec::<String>::new());
        assert_eq!(wrap_cut("abcdefghij xy", 4), vec!["abcd", "xy"]);
    }

    /// Strands in parallel are written N x wire without spaces, as the tables have it.
    #[test]
    fn wire_label_writes_strands_before_the_size() {
        use crate::model::WireSize;
        let w = WireSize::Metric { bare_mm: 0.5 };
        assert_eq!(wire_label(&w, 3), format!("3x{w}"));
        assert_eq!(wire_label(&w, 1), w.to_string());
        let m = WireSize::Measured {
            bare_mm: 0.8,
            od_mm: 0.87,
        };
        assert_eq!(wire_label(&m, 1), "0.8/0.87 mm");
    }
}
