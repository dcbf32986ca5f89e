//! The capacitance, the voltage stress and the losses of the report.

use super::*;

pub(super) fn capacitance_block(o: &mut String, eval: &Evaluation) {
    let c = &eval.capacitance;
    let _ = writeln!(
        o,
        "\nCapacitance (plates across tape and enamel, eps_r 3.2 and 3.5, from memory)"
    );
    let _ = writeln!(
        o,
        "  primary - secondary    {:>8.1} pF",
        c.primary_secondary_pf
    );
    for (w, cs) in eval.windings.iter().zip(&c.self_pf) {
        if let Some(cs) = cs {
            let _ = writeln!(
                o,
                "  {:<8} self          {cs:>8.1} pF (layer energy method)",
                truncate(&w.name, 8)
            );
        }
    }
    if let Some(f) = c.ringing_khz {
        let _ = writeln!(
            o,
            "  ringing, P-S leakage against the primary's own: {:.2} MHz",
            f / 1e3
        );
    }
}

pub(super) fn stress_block(o: &mut String, st: &crate::engine::stress::StressEval) {
    let _ = writeln!(
        o,
        "\nVoltage stress ({:.2} V a turn at most; usual working figures, from memory)",
        st.volts_per_turn_v
    );
    let mark = |v: f64, lim: f64| if v > lim { "  OVER" } else { "" };
    for l in &st.layers {
        let _ = writeln!(
            o,
            "  stack #{:<2} {:<8} layer to layer   {:>7.0} V of {:>5.0} V{}",
            l.section + 1,
            truncate(&l.winding, 8),
            l.voltage_v,
            l.limit_v,
            mark(l.voltage_v, l.limit_v)
        );
    }
    for b in &st.bifilar {
        let pair = format!("{}+{}", b.inner, b.outer);
        let _ = writeln!(
            o,
            "  stack #{:<2} {:<8} bifilar pair     {:>7.0} V of {:>5.0} V{}",
            b.inner_section + 1,
            truncate(&pair, 8),
            b.voltage_v,
            b.limit_v,
            mark(b.voltage_v, b.limit_v)
        );
    }
    for p in &st.between_sections {
        let pair = format!("{}/{}", p.inner, p.outer);
        let _ = writeln!(
            o,
            "  stack #{}/#{:<2} {:<6} between sections {:>7.0} V of {:>5.0} V{}",
            p.inner_section + 1,
            p.outer_section + 1,
            truncate(&pair, 6),
            p.voltage_v,
            p.limit_v,
            mark(p.voltage_v, p.limit_v)
        );
    }
    if st.layers.is_empty() && st.bifilar.is_empty() && st.between_sections.is_empty() {
        let _ = writeln!(
            o,
            "  single-layer sections, no bifilar pairs: nothing to check"
        );
    }
}

pub(super) fn losses_block(o: &mut String, l: &LossEval) {
    let _ = writeln!(o, "\nLosses and temperature rise");
    let _ = writeln!(
        o,
        "  copper                 {:>7.3} W at vin min",
        l.copper_loss_w
    );
    if !l.windings_without_current.is_empty() {
        let _ = writeln!(
            o,
            "    not counted (no current): {}",
            l.windings_without_current.join(", ")
        );
    }
    core_loss_lines(o, l);
    let _ = writeln!(o, "  total                  {:>7.3} W", l.total_loss_w);
    match (l.surface_area_cm2, l.temperature_rise_c) {
        (Some(a), Some(t)) => {
            let how = if l.surface_estimated {
                "estimated from Wa x Ae"
            } else {
                "given"
            };
            let _ = writeln!(
                o,
                "  surface {a:.1} cm2 ({how}): {:.3} W/cm2",
                l.total_loss_w / a
            );
            let _ = writeln!(
                o,
                "  temperature rise       {t:>7.1} C (McLyman) against a {:.0} C limit",
                l.rise_limit_c
            );
            if let Some(hot) = l.hot_spot_c {
                let class = crate::engine::thermal::class_letter(l.class_limit_c)
                    .map_or(String::new(), |c| format!("class {c} "));
                let _ = writeln!(
                    o,
                    "  hot spot               {hot:>7.1} C in {:.0} C air, against {class}{:.0} C ({})",
                    l.ambient_c,
                    l.class_limit_c,
                    l.class_binding.key()
                );
            }
        }
        _ => {
            let _ = writeln!(
                o,
                "  temperature rise: not computed (no core data to estimate the surface;"
            );
            let _ = writeln!(o, "    give [operating] surface_area_cm2)");
        }
    }
}

/// The core loss by iGSE with its waveform, or why it is not computed.
fn core_loss_lines(o: &mut String, l: &LossEval) {
    match (l.core_loss_w, l.core_loss_kw_m3) {
        (Some(w), Some(p)) => {
            let _ = writeln!(
                o,
                "  core (iGSE)            {w:>7.3} W at vin max: {p:.1} kW/m3 x {:.0} mm3",
                l.core_volume_mm3.unwrap_or(0.0)
            );
            if let (Some(b), Some(d), Some(r)) =
                (l.core_swing_mt, l.core_duty, l.core_reset_fraction)
            {
                let _ = writeln!(
                    o,
                    "    swing {b:.1} mT, rising over {:.1} %, reset over {:.1} % of the period",
                    d * 100.0,
                    r * 100.0
                );
            }
        }
        _ => {
            let no_time = l.core_duty.is_some_and(|d| d <= 0.0)
                || l.core_reset_fraction.is_some_and(|r| r <= 0.0);
            let why = if l.core_volume_mm3.is_none() {
                "no [core] data"
            } else if no_time {
                "no duty available, so no flux waveform to take the loss of"
            } else {
                "no steinmetz coefficients in [material]"
            };
            let _ = writeln!(o, "  core                   not computed: {why}");
        }
    }
}
