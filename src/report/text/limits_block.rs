//! The limits table of the report, the binding limit first.

use super::*;

pub(super) fn limit_figure(l: &Limit, x: f64) -> String {
    match l.unit {
        "duty" => format!("{:.1} %", x * 100.0),
        "mm" => format!("{x:.2} mm"),
        "mT" => format!("{x:.0} mT"),
        "C" => format!("{x:.1} C"),
        u => format!("{x:.1} {u}"),
    }
}

pub(super) fn limits_block(o: &mut String, eval: &Evaluation) {
    if eval.limits.is_empty() {
        return;
    }
    let _ = writeln!(o, "\nWhat limits the design (binding first)");
    let _ = writeln!(o, "  constraint            used        allowed     margin");
    for (i, l) in eval.limits.iter().enumerate() {
        let name = match &l.about {
            Some(a) => format!("{} ({})", l.constraint.key(), a),
            None => l.constraint.key().to_string(),
        };
        let tag = if l.broken() {
            "  BROKEN"
        } else if i == 0 {
            "  binding"
        } else {
            ""
        };
        let _ = writeln!(
            o,
            "  {:<20} {:>11}  {:>11}  {:>7.0} %{tag}",
            truncate(&name, 20),
            limit_figure(l, l.used),
            limit_figure(l, l.allowed),
            l.margin * 100.0
        );
    }
}
