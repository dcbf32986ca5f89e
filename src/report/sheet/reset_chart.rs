//! The sheet's design section: the reset ratio's sweep (`engine::reset_sweep`) as two inline
//! SVG charts against Nr, the reset duty limit over the controller's limit and the switch
//! voltage under its rating, the build's Nr marked; and a line saying what binds.

use super::svg::escape;
use crate::engine::reset_sweep::{ResetLimit, ResetSweep};
use std::fmt::Write as _;

/// One chart's size on paper (mm) and its margins for the axis labels.
const W: f64 = 80.0;
const H: f64 = 50.0;
const LEFT: f64 = 12.0;
const BOTTOM: f64 = 8.0;
const TOP: f64 = 4.0;

/// What binds at the build's Nr and the allowed range, in words.
pub fn summary(r: &ResetSweep) -> String {
    let nr = r.inputs.nr;
    let bind = match r.binding {
        Some(ResetLimit::Duty) => "the controller's duty limit binds",
        Some(ResetLimit::SwitchVoltage) => "the switch rating binds",
        None => "neither a duty limit nor a switch rating is given",
    };
    let range = match r.allowed {
        Some((lo, Some(hi))) => format!("Nr {lo} to {hi} meets both"),
        Some((lo, None)) => format!("Nr {lo} or more meets both"),
        None => "no reset turns meet both".into(),
    };
    format!("At Nr = {nr}: {bind}; {range}.")
}

/// A polyline of `(nr, value)` in a chart whose value axis runs `0..y_max`.
fn chart(
    o: &mut String,
    r: &ResetSweep,
    values: &[f64],
    y_max: f64,
    limit: Option<f64>,
    what: &str,
) {
    let (lo, hi) = (
        f64::from(r.points.first().map_or(1, |p| p.nr)),
        f64::from(r.points.last().map_or(1, |p| p.nr)),
    );
    let span = (hi - lo).max(1.0);
    let x = |n: f64| LEFT + (n - lo) / span * (W - LEFT - 2.0);
    let y = |v: f64| TOP + (1.0 - (v / y_max).clamp(0.0, 1.0)) * (H - TOP - BOTTOM);
    let _ = write!(
        o,
        "<svg class=\"reset\" width=\"{W}mm\" height=\"{H}mm\" viewBox=\"0 0 {W} {H}\"><rect x=\"{LEFT}\" y=\"{TOP}\" width=\"{:.2}\" height=\"{:.2}\" fill=\"none\" stroke=\"#000\" stroke-width=\"0.2\"/>",
        W - LEFT - 2.0,
        H - TOP - BOTTOM
    );
    let pts: Vec<String> = r
        .points
        .iter()
        .zip(values)
        .map(|(p, v)| format!("{:.2},{:.2}", x(f64::from(p.nr)), y(*v)))
        .collect();
    let _ = write!(
        o,
        "<polyline points=\"{}\" fill=\"none\" stroke=\"#000\" stroke-width=\"0.4\"/>",
        pts.join(" ")
    );
    if let Some(l) = limit {
        let _ = write!(
            o,
            "<line x1=\"{LEFT}\" y1=\"{0:.2}\" x2=\"{1:.2}\" y2=\"{0:.2}\" stroke=\"#000\" stroke-width=\"0.3\" stroke-dasharray=\"1.5 1\"/>",
            y(l),
            W - 2.0
        );
    }
    let xn = x(f64::from(r.inputs.nr));
    let _ = write!(
        o,
        "<line x1=\"{xn:.2}\" y1=\"{TOP}\" x2=\"{xn:.2}\" y2=\"{:.2}\" stroke=\"#000\" stroke-width=\"0.2\" stroke-dasharray=\"0.4 0.6\"/><text x=\"{xn:.2}\" y=\"{:.2}\" font-size=\"2.4\" text-anchor=\"middle\">Nr {}</text>",
        H - BOTTOM,
        TOP - 0.8,
        r.inputs.nr
    );
    let _ = write!(
        o,
        "<text x=\"{LEFT}\" y=\"{0:.2}\" font-size=\"2.4\">{lo}</text><text x=\"{1:.2}\" y=\"{0:.2}\" font-size=\"2.4\" text-anchor=\"end\">{hi} reset turns</text><text x=\"1\" y=\"{2:.2}\" font-size=\"2.4\">{3}</text><text x=\"1\" y=\"{4:.2}\" font-size=\"2.4\">0</text><text x=\"{LEFT}\" y=\"{5:.2}\" font-size=\"2.4\">{6}</text></svg>",
        H - 2.0,
        W - 2.0,
        TOP + 2.0,
        fmt_axis(y_max),
        H - BOTTOM,
        H - BOTTOM + 3.2,
        escape(what)
    );
}

fn fmt_axis(v: f64) -> String {
    if v <= 1.0 {
        format!("{v:.1}")
    } else {
        format!("{v:.0}")
    }
}

/// The design section of the HTML sheet.
pub fn html_section(o: &mut String, r: &ResetSweep) {
    o.push_str("<h2>Design: the reset ratio</h2><figure>");
    let duty: Vec<f64> = r.points.iter().map(|p| p.reset_duty_limit).collect();
    chart(o, r, &duty, 1.0, r.inputs.duty_limit, "reset duty limit");
    let volts: Vec<f64> = r.points.iter().map(|p| p.switch_voltage_v).collect();
    let top = volts
        .iter()
        .copied()
        .chain(r.switch_allowed_v)
        .fold(0.0_f64, f64::max)
        * 1.1;
    chart(
        o,
        r,
        &volts,
        top.max(1.0),
        r.switch_allowed_v,
        "switch voltage, V",
    );
    let limits = format!(
        "Solid: the figure against the reset turns Nr for Np = {}; dashed: the controller's duty limit{} and the switch rating{}; dotted: this build's Nr.",
        r.inputs.np,
        r.inputs
            .duty_limit
            .map_or(" (none given)".into(), |d| format!(" {d:.2}")),
        r.switch_allowed_v
            .map_or(" (none given)".into(), |v| format!(" {v:.0} V"))
    );
    let _ = write!(
        o,
        "<figcaption>{} {}</figcaption></figure>",
        escape(&limits),
        escape(&summary(r))
    );
}
