//! The JSON report of `check --json`, with the keys the format spec lists (and a few more).

use crate::engine::{Evaluation, SectionKind, WarningAt};
use crate::model::{BobbinSource, Build, ResetSide};
use serde_json::{Value, json};

pub fn report(build: &Build, eval: &Evaluation) -> Value {
    let sections: Vec<Value> = eval
        .sections
        .iter()
        .map(|s| match &s.kind {
            SectionKind::Tape { wraps } => json!({
                "kind": "tape", "wraps": wraps, "y_mm": s.y_mm, "height_mm": s.height_mm,
                "past_window": s.past_window,
            }),
            SectionKind::Winding {
                winding,
                with,
                turns,
                pitch_mm,
                turns_per_layer,
                layer_count,
                last_layer_turns,
                layer_height_mm,
                layer_tape,
                mlt_mm,
            } => json!({
                "kind": "winding", "winding": winding, "with": with, "turns": turns,
                "turns_per_layer": turns_per_layer, "layers": layer_count,
                "last_layer_turns": last_layer_turns, "pitch_mm": pitch_mm,
                "layer_height_mm": layer_height_mm, "layer_tape": layer_tape,
                "y_mm": s.y_mm, "height_mm": s.height_mm, "mlt_mm": mlt_mm,
                "past_window": s.past_window,
                "layer_list": s.layers.iter().map(|l| json!({
                    "y_mm": l.y_mm, "height_mm": l.height_mm, "turns": l.turns,
                    "mlt_mm": l.mlt_mm, "partial": l.partial,
                })).collect::<Vec<_>>(),
            }),
        })
        .collect();
    let windings: Vec<Value> = eval
        .windings
        .iter()
        .map(|w| {
            let mut v = json!({
                "name": w.name, "role": w.role.key(), "turns": w.turns, "strands": w.strands,
                "bare_mm": w.bare_mm, "od_mm": w.od_mm, "copper_area_mm2": w.copper_area_mm2,
                "length_m": w.length_m, "mlt_mm": w.mlt_mm, "dcr_ohm": w.dcr_ohm,
            });
            if let Some(a) = &w.ac {
                v["ac_factor"] = json!(a.ac_factor);
                v["rac_ohm"] = json!(a.rac_ohm);
                v["skin_depth_mm"] = json!(a.skin_depth_mm);
                if let Some(f) = a.ac_factor_waveform {
                    v["ac_factor_waveform"] = json!(f);
                }
                if let Some(r) = a.rac_waveform_ohm {
                    v["rac_waveform_ohm"] = json!(r);
                }
            }
            if let Some(j) = w.current_density_a_mm2 {
                v["current_density_a_mm2"] = json!(j);
            }
            if let Some(i) = w.current_rms_a {
                v["current_rms_a"] = json!(i);
            }
            if let Some(src) = w.current_source {
                v["current_source"] = json!(src.key());
            }
            if let Some(i) = w.current_model_rms_a {
                v["current_model_rms_a"] = json!(i);
            }
            if let Some(p) = w.proximity_loss_w {
                v["proximity_loss_w"] = json!(p);
            }
            if let Some(p) = w.layer_voltage_v {
                v["layer_voltage_v"] = json!(p);
            }
            if let Some(p) = w.copper_loss_w {
                v["copper_loss_w"] = json!(p);
            }
            v
        })
        .collect();
    let leakage: Vec<Value> = eval
        .leakage
        .iter()
        .map(|l| json!({"from": l.from, "to": l.to, "referred_to": l.referred_to, "uh": l.uh, "bifilar_uh": l.bifilar_uh}))
        .collect();
    let warnings: Vec<Value> = eval
        .warnings
        .iter()
        .map(|w| {
            let mut v = json!({"code": w.code(), "message": w.message()});
            match w.at {
                WarningAt::Section(i) => v["section"] = json!(i),
                WarningAt::Winding(i) => {
                    v["winding"] = json!(build.windings.get(i).map(|w| &w.name))
                }
                WarningAt::Converter => v["about"] = json!("converter"),
                WarningAt::Build => {}
            }
            v
        })
        .collect();
    let mut out = json!({
        "format": 1,
        "title": build.title,
        "bobbin": match &build.bobbin_source { BobbinSource::Id(id) => json!(id), BobbinSource::Inline => Value::Null },
        "fits": eval.fits,
        "build_height_mm": eval.build_height_mm,
        "height_with_allowance_mm": eval.height_with_allowance_mm,
        "window_height_mm": eval.window_height_mm,
        "window_width_mm": eval.window_width_mm,
        "usable_width_mm": eval.usable_width_mm,
        "spare_height_mm": eval.spare_height_mm,
        "fill_factor": eval.fill_factor,
        "temperature_c": eval.temperature_c,
        "temperature_source": eval.temperature_source.key(),
        "sections": sections,
        "windings": windings,
        "leakage": leakage,
        "warnings": warnings,
        "notes": eval.notes.iter().map(ToString::to_string).collect::<Vec<_>>(),
    });
    if let Some(c) = &eval.converter {
        let mut conv = json!({
            "reset_side": match c.reset_side { ResetSide::Primary => "primary", ResetSide::Secondary => "secondary" },
            "reset_duty_limit": c.reset_duty_limit,
            "duty_max": c.duty_max,
            "switch_voltage_v": c.switch_voltage_v,
            "duty_needed_at_vin_min": c.duty_needed_at_vin_min,
        });
        if let Some(v) = c.steady_duty_ceiling {
            conv["steady_duty_ceiling"] = json!(v);
        }
        if let Some(v) = c.flux_swing_worst_mt {
            conv["flux_swing_worst_mt"] = json!(v);
        }
        if let Some(v) = c.flux_headroom_mt {
            conv["flux_headroom_mt"] = json!(v);
        }
        conv["reset_duty_limit_primary_side"] = json!(c.reset_duty_limit_primary_side);
        conv["duty_available"] = json!(c.duty_available);
        conv["duty_needed_at_vin_max"] = json!(c.duty_needed_at_vin_max);
        conv["duty_margin"] = json!(c.duty_margin);
        conv["duty_needed_total_at_vin_min"] = json!(c.duty_needed_total_at_vin_min);
        conv["duty_used_at_vin_min"] = json!(c.duty_used_at_vin_min);
        conv["reset_time_us"] = json!(c.reset_time_us);
        conv["reset_time_worst_us"] = json!(c.reset_time_worst_us);
        for (key, v) in [
            ("flux_swing_steady_mt", c.flux_swing_steady_mt),
            ("al_nh", c.al_nh),
            ("magnetising_uh", c.magnetising_uh),
            ("magnetising_peak_a", c.magnetising_peak_a),
            ("magnetising_peak_worst_a", c.magnetising_peak_worst_a),
            ("reset_peak_a", c.reset_peak_a),
            ("reset_peak_worst_a", c.reset_peak_worst_a),
            ("reset_rms_a", c.reset_rms_a),
            ("reset_current_density_a_mm2", c.reset_current_density_a_mm2),
            ("switch_rating_v", c.switch_rating_v),
            ("leakage_ps_uh", c.leakage_ps_uh),
            ("clamp_peak_a", c.clamp_peak_a),
            ("clamp_loss_w", c.clamp_loss_w),
            ("duty_lost_to_leakage", c.duty_lost_to_leakage),
        ] {
            if let Some(v) = v {
                conv[key] = json!(v);
            }
        }
        if let Some(s) = c.al_source {
            conv["al_source"] = json!(s.key());
        }
        out["converter"] = conv;
    }
    if let Some(l) = &eval.losses {
        let mut v = json!({
            "copper_loss_w": l.copper_loss_w,
            "total_loss_w": l.total_loss_w,
            "rise_limit_c": l.rise_limit_c,
            "surface_estimated": l.surface_estimated,
            "windings_without_current": l.windings_without_current,
            "ambient_c": l.ambient_c,
            "class_limit_c": l.class_limit_c,
            "class_binding": l.class_binding.key(),
        });
        for (key, x) in [
            ("core_loss_w", l.core_loss_w),
            ("core_loss_kw_m3", l.core_loss_kw_m3),
            ("core_volume_mm3", l.core_volume_mm3),
            ("core_swing_mt", l.core_swing_mt),
            ("core_duty", l.core_duty),
            ("core_reset_fraction", l.core_reset_fraction),
            ("surface_area_cm2", l.surface_area_cm2),
            ("temperature_rise_c", l.temperature_rise_c),
            ("hot_spot_c", l.hot_spot_c),
        ] {
            if let Some(x) = x {
                v[key] = json!(x);
            }
        }
        out["losses"] = v;
    }
    out["limits"] = json!(
        eval.limits
            .iter()
            .map(|l| json!({
                "constraint": l.constraint.key(), "margin": l.margin, "used": l.used,
                "allowed": l.allowed, "unit": l.unit, "about": l.about, "broken": l.broken(),
            }))
            .collect::<Vec<_>>()
    );
    let cap = &eval.capacitance;
    out["capacitance"] = json!({
        "primary_secondary_pf": cap.primary_secondary_pf,
        "ringing_khz": cap.ringing_khz,
        "self_pf": eval.windings.iter().zip(&cap.self_pf)
            .map(|(w, c)| json!({"winding": w.name, "pf": c}))
            .collect::<Vec<_>>(),
    });
    if let Some(st) = &eval.stress {
        let pair = |p: &crate::engine::stress::PairStress| {
            json!({
                "inner_section": p.inner_section, "outer_section": p.outer_section,
                "inner": p.inner, "outer": p.outer, "voltage_v": p.voltage_v,
                "limit_v": p.limit_v, "wraps": p.wraps,
            })
        };
        out["voltage_stress"] = json!({
            "volts_per_turn_v": st.volts_per_turn_v,
            "layers": st.layers.iter().map(|l| json!({
                "section": l.section, "winding": l.winding, "voltage_v": l.voltage_v,
                "limit_v": l.limit_v, "layer_tape": l.layer_tape,
            })).collect::<Vec<_>>(),
            "bifilar": st.bifilar.iter().map(pair).collect::<Vec<_>>(),
            "between_sections": st.between_sections.iter().map(pair).collect::<Vec<_>>(),
        });
    }
    out["failures"] = json!(eval.failures().iter().map(|c| c.key()).collect::<Vec<_>>());
    out
}
