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
            }
            if let Some(j) = w.current_density_a_mm2 {
                v["current_density_a_mm2"] = json!(j);
            }
            v
        })
        .collect();
    let leakage: Vec<Value> = eval
        .leakage
        .iter()
        .map(|l| json!({"from": l.from, "to": l.to, "referred_to": l.referred_to, "uh": l.uh}))
        .collect();
    let warnings: Vec<Value> = eval
        .warnings
        .iter()
        .map(|w| {
            let mut v = json!({"code": w.code, "message": w.message});
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
        "temperature_c": build.setup.temperature_c,
        "sections": sections,
        "windings": windings,
        "leakage": leakage,
        "warnings": warnings,
        "notes": eval.notes,
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
        out["converter"] = conv;
    }
    out
}
