//! The currents and the converter figures of the report.

use super::*;

pub(super) fn currents_block(o: &mut String, eval: &Evaluation) {
    if eval.windings.iter().all(|w| w.current_rms_a.is_none()) {
        return;
    }
    let _ = writeln!(
        o,
        "\nCurrents and copper loss (RMS; AC factor over the waveform's harmonics)"
    );
    let _ = writeln!(
        o,
        "  name    I rms A  from       model A  AC factor   Rac ohm    loss W"
    );
    for w in &eval.windings {
        let Some(i) = w.current_rms_a else {
            let _ = writeln!(o, "  {:<6}  no current given", truncate(&w.name, 6));
            continue;
        };
        let from = match w.current_source {
            Some(CurrentSource::Given) => "given",
            _ => "op. point",
        };
        let model = w
            .current_model_rms_a
            .map_or("-".to_string(), |m| format!("{m:.3}"));
        let (fac, rac) = match &w.ac {
            Some(a) => match (a.ac_factor_waveform, a.rac_waveform_ohm) {
                (Some(f), Some(r)) => (format!("{f:.2}"), format!("{r:.4}")),
                _ => (
                    format!("{:.2} sin", a.ac_factor),
                    format!("{:.4}", a.rac_ohm),
                ),
            },
            None => ("DC".to_string(), format!("{:.4}", w.dcr_ohm)),
        };
        let loss = w
            .copper_loss_w
            .map_or("-".to_string(), |l| format!("{l:.3}"));
        let _ = writeln!(
            o,
            "  {:<6} {:>8.3}  {:<9} {:>8}  {:>9}  {:>8}  {:>8}",
            truncate(&w.name, 6),
            i,
            from,
            model,
            fac,
            rac,
            loss
        );
    }
    let band = crate::engine::limits::CURRENT_DENSITY_BAND_A_MM2;
    for w in &eval.windings {
        if let Some(p) = w.proximity_loss_w {
            let line = format!(
                "{}: {p:.3} W of its loss from the field of the others (proximity)",
                w.name
            );
            for l in wrap(&line, WIDTH - 2, "    ") {
                let _ = writeln!(o, "  {l}");
            }
        }
    }
    let _ = writeln!(
        o,
        "  current density band {:.0}-{:.0} A/mm2 RMS (common practice, natural convection)",
        band.0, band.1
    );
}

pub(super) fn converter_block(o: &mut String, c: &ConverterEval) {
    let _ = writeln!(o, "\nConverter (single-switch forward)");
    let side = match c.reset_side {
        ResetSide::Primary => "reset to the input",
        ResetSide::Secondary => "reset to the output",
    };
    let _ = writeln!(o, "  Np {} : Ns {} : Nr {}, {side}", c.np, c.ns, c.nr);
    duty_lines(o, c);
    switch_lines(o, c);
    core_lines(o, c);
}

/// The duty cycle: the reset limit, what is available and what is needed.
fn duty_lines(o: &mut String, c: &ConverterEval) {
    let pct = |x: f64| x * 100.0;
    let _ = writeln!(
        o,
        "  reset duty limit       {:>7.1} %",
        pct(c.reset_duty_limit)
    );
    if c.reset_side == ResetSide::Secondary {
        let _ = writeln!(
            o,
            "    reset to the input, these turns would allow {:.1} % ({:.1} points more)",
            pct(c.reset_duty_limit_primary_side),
            pct(c.reset_duty_limit_primary_side - c.reset_duty_limit)
        );
        if let Some(ceil) = c.steady_duty_ceiling {
            let _ = writeln!(
                o,
                "    steady state: the reset takes Nr/Ns = {:.1} % of every period",
                pct(1.0 - ceil)
            );
        }
    }
    let _ = writeln!(
        o,
        "  duty available         {:>7.1} %",
        pct(c.duty_available)
    );
    let _ = writeln!(
        o,
        "  duty needed at vin min {:>7.1} %   ideal switch",
        pct(c.duty_needed_at_vin_min)
    );
    let drop = c.duty_needed_total_at_vin_min
        - c.duty_lost_to_leakage.unwrap_or(0.0)
        - c.duty_needed_at_vin_min;
    let mut extra = Vec::new();
    if drop > 0.0 {
        extra.push(format!("+ switch drop {:.2} %", pct(drop)));
    }
    if let Some(lost) = c.duty_lost_to_leakage {
        extra.push(format!("+ leakage {:.2} %", pct(lost)));
    }
    let with = if extra.is_empty() {
        String::new()
    } else {
        format!("{} = ", extra.join(", "))
    };
    let line = format!(
        "{with}{:.1} %, margin {:+.1} points",
        pct(c.duty_needed_total_at_vin_min),
        pct(c.duty_margin)
    );
    for l in wrap(&line, WIDTH - 4, "  ") {
        let _ = writeln!(o, "    {l}");
    }
    let _ = writeln!(
        o,
        "  duty needed at vin max {:>7.1} %",
        pct(c.duty_needed_at_vin_max)
    );
}

/// The reset time, the switch voltage and the clamp loss.
fn switch_lines(o: &mut String, c: &ConverterEval) {
    let _ = writeln!(
        o,
        "  reset time             {:>7.2} us steady at vin min, {:.2} us worst case",
        c.reset_time_us, c.reset_time_worst_us
    );
    let rating = c
        .switch_rating_v
        .map_or(String::new(), |r| format!(", rated {r:.0} V"));
    let _ = writeln!(
        o,
        "  switch off-state       {:>7.1} V plus a spike set by the clamp{rating}",
        c.switch_voltage_v
    );
    if let (Some(loss), Some(pk), Some(l)) = (c.clamp_loss_w, c.clamp_peak_a, c.leakage_ps_uh) {
        let _ = writeln!(
            o,
            "  clamp or snubber       {:>7.3} W: 1/2 x {l:.2} uH (P-S) x ({pk:.3} A)^2 x f",
            loss
        );
    }
}

/// The flux swing, AL and magnetising current, and the reset winding's current.
fn core_lines(o: &mut String, c: &ConverterEval) {
    match c.flux_swing_worst_mt {
        Some(b) => {
            let head = c
                .flux_headroom_mt
                .map_or(String::new(), |h| format!(" of {h:.0} mT headroom"));
            let _ = writeln!(o, "  worst-case flux swing  {b:>7.1} mT{head}");
            if let Some(s) = c.flux_swing_steady_mt {
                let _ = writeln!(o, "  steady-state swing     {s:>7.1} mT");
            }
        }
        None => {
            let _ = writeln!(
                o,
                "  flux, magnetising current, core loss: no [core] data for this bobbin"
            );
        }
    }
    if let (Some(al), Some(src), Some(lm)) = (c.al_nh, c.al_source, c.magnetising_uh) {
        let src = match src {
            AlSource::Core => "the core's figure",
            AlSource::Gapped => "from mu_i and the gap",
            AlSource::Ungapped => "from mu_i, no gap",
        };
        let _ = writeln!(
            o,
            "  AL {al:.0} nH ({src}): magnetising inductance {lm:.0} uH"
        );
    } else if c.flux_swing_worst_mt.is_some() {
        let _ = writeln!(
            o,
            "  no AL and no mu_i: magnetising current not computed (taken as zero)"
        );
    }
    if let (Some(im), Some(iw)) = (c.magnetising_peak_a, c.magnetising_peak_worst_a) {
        let _ = writeln!(
            o,
            "  magnetising current    {:>7.1} mA peak steady, {:.1} mA worst case",
            im * 1e3,
            iw * 1e3
        );
    }
    if let (Some(pk), Some(rms), Some(w)) = (c.reset_peak_a, c.reset_rms_a, c.reset_peak_worst_a) {
        let _ = writeln!(
            o,
            "  reset winding          {:>7.1} mA peak, {:.1} mA RMS ({:.1} mA peak worst)",
            pk * 1e3,
            rms * 1e3,
            w * 1e3
        );
        if let Some(j) = c.reset_current_density_a_mm2 {
            let why = if j <= crate::engine::limits::CURRENT_DENSITY_BAND_A_MM2.1 {
                "only magnetising current: thin wire is fine"
            } else {
                "too much for a thin wire (see warnings)"
            };
            let _ = writeln!(o, "    {j:.2} A/mm2 in the reset wire, {why}");
        }
    }
}
