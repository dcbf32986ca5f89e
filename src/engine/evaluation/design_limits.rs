//! The design limits of a build, the binding one first.

use super::*;

/// Fit, duty, saturation, temperature and current density, binding first.
pub(super) fn design_limits(eval: &Evaluation) -> Vec<Limit> {
    let mut out = Vec::with_capacity(Constraint::ALL.len());
    out.push(Limit::new(
        Constraint::Fit,
        eval.height_with_allowance_mm,
        eval.window_height_mm,
        "mm",
        None,
    ));
    if let Some(c) = &eval.converter {
        out.push(Limit::new(
            Constraint::ResetDuty,
            c.duty_needed_total_at_vin_min,
            c.duty_available,
            "duty",
            None,
        ));
        if let (Some(swing), Some(head)) = (c.flux_swing_worst_mt, c.flux_headroom_mt) {
            out.push(Limit::new(Constraint::Saturation, swing, head, "mT", None));
        }
    }
    if let Some(rise) = eval
        .losses
        .as_ref()
        .and_then(|l| l.temperature_rise_c.map(|r| (r, l.rise_limit_c)))
    {
        out.push(Limit::new(
            Constraint::TemperatureRise,
            rise.0,
            rise.1,
            "C",
            None,
        ));
    }
    if let Some(l) = &eval.losses
        && let Some(hot) = l.hot_spot_c
    {
        out.push(Limit::new(
            Constraint::HotSpot,
            hot,
            l.class_limit_c,
            "C",
            None,
        ));
    }
    if let Some(c) = &eval.converter
        && let Some(rating) = c.switch_rating_v
    {
        out.push(Limit::new(
            Constraint::SwitchVoltage,
            c.switch_voltage_v,
            rating,
            "V",
            None,
        ));
    }
    if let Some((name, j)) = eval
        .windings
        .iter()
        .filter_map(|w| w.current_density_a_mm2.map(|j| (&w.name, j)))
        .max_by(|a, b| a.1.total_cmp(&b.1))
    {
        out.push(Limit::new(
            Constraint::CurrentDensity,
            j,
            CURRENT_DENSITY_BAND_A_MM2.1,
            "A/mm2",
            Some(name.clone()),
        ));
    }
    limits::rank(out)
}
