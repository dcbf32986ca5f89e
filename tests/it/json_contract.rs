//! The keys of `check --json` against the contract: the key lists of the build-format spec
//! ("The JSON report: `check FILE --json`") and the additions FORMAT.md documents ("JSON
//! additions", "JSON extras"), written out here, so a renamed, lost or undocumented key fails;
//! and the keys of `design --json` (FORMAT.md, "Requirements file and `turnstack design`").

use crate::common::example;
use serde_json::Value;
use std::collections::BTreeSet;
use turnstack::report::json;

/// Keys the spec requires in every report, per object.
const TOP_REQUIRED: &[&str] = &[
    "fits",
    "build_height_mm",
    "height_with_allowance_mm",
    "window_height_mm",
    "fill_factor",
    "sections",
    "windings",
    "leakage",
    "warnings",
];
/// FORMAT.md's extras and additions at the top level (`converter` and `losses` only with an
/// operating point).
const TOP_EXTRA: &[&str] = &[
    "format",
    "title",
    "bobbin",
    "usable_width_mm",
    "spare_height_mm",
    "window_width_mm",
    "temperature_c",
    "notes",
    "limits",
    "converter",
    "losses",
    "temperature_source",
    "capacitance",
    "voltage_stress",
    "failures",
    "measured",
    "verify",
    "outputs",
];
/// Each entry of `outputs` (FORMAT.md, "Several outputs"), only with `[[output]]` tables.
const OUTPUT_KEYS: &[&str] = &[
    "winding",
    "regulated",
    "turns",
    "vout_v",
    "iout_a",
    "rectifier_drop_v",
    "vout_from_turns_v",
    "error_v",
    "error_fraction",
    "current_rms_a",
];
const WINDING_SECTION_REQUIRED: &[&str] = &[
    "kind",
    "winding",
    "with",
    "turns",
    "turns_per_layer",
    "layers",
    "height_mm",
    "mlt_mm",
];
const WINDING_SECTION_EXTRA: &[&str] = &[
    "y_mm",
    "pitch_mm",
    "layer_height_mm",
    "last_layer_turns",
    "layer_tape",
    "spread",
    "past_window",
    "layer_list",
];
const TAPE_SECTION_REQUIRED: &[&str] = &["kind", "wraps", "height_mm"];
const TAPE_SECTION_EXTRA: &[&str] = &["y_mm", "past_window"];
const LAYER_KEYS: &[&str] = &["y_mm", "height_mm", "turns", "mlt_mm", "partial"];
const WINDING_REQUIRED: &[&str] = &[
    "name",
    "turns",
    "conductor",
    "length_m",
    "mlt_mm",
    "dcr_ohm",
];
/// `ac_factor` and `rac_ohm` are required when the setup gives a frequency.
const WINDING_AC: &[&str] = &["ac_factor", "rac_ohm"];
const WINDING_EXTRA: &[&str] = &[
    "role",
    "strands",
    "bare_mm",
    "od_mm",
    "copper_area_mm2",
    "foil",
    "litz",
    "current_density_a_mm2",
    "skin_depth_mm",
    "ac_factor_waveform",
    "rac_waveform_ohm",
    "current_rms_a",
    "current_source",
    "current_model_rms_a",
    "copper_loss_w",
    "proximity_loss_w",
    "layer_voltage_v",
];
/// A foil winding's `foil` object and a litz winding's `litz` object.
const FOIL_KEYS: &[&str] = &[
    "thickness_mm",
    "width_mm",
    "interleaf_mm",
    "layer_height_mm",
    "porosity",
];
const LITZ_REQUIRED: &[&str] = &[
    "strands",
    "strand_mm",
    "strand_od_mm",
    "bundle_mm",
    "od_mm",
    "packing",
    "lay_factor",
];
const LITZ_EXTRA: &[&str] = &["strand_over_skin"];
const LEAKAGE_KEYS: &[&str] = &["from", "to", "referred_to", "uh", "bifilar_uh"];
const WARNING_REQUIRED: &[&str] = &["code", "message"];
const WARNING_EXTRA: &[&str] = &["section", "winding", "about"];
const CONVERTER_REQUIRED: &[&str] = &[
    "reset_duty_limit",
    "switch_voltage_v",
    "duty_needed_at_vin_min",
];
/// `flux_swing_worst_mt` with core data, `flux_headroom_mt` with a `[material]`.
const CONVERTER_CORE: &[&str] = &["flux_swing_worst_mt", "flux_headroom_mt"];
const CONVERTER_EXTRA: &[&str] = &[
    "reset_side",
    "duty_max",
    "steady_duty_ceiling",
    "reset_duty_limit_primary_side",
    "duty_available",
    "duty_needed_at_vin_max",
    "duty_margin",
    "duty_used_at_vin_min",
    "reset_time_us",
    "reset_time_worst_us",
    "flux_swing_steady_mt",
    "al_nh",
    "al_source",
    "magnetising_uh",
    "magnetising_peak_a",
    "magnetising_peak_worst_a",
    "reset_peak_a",
    "reset_peak_worst_a",
    "reset_rms_a",
    "reset_current_density_a_mm2",
    "duty_needed_total_at_vin_min",
    "switch_rating_v",
    "leakage_ps_uh",
    "clamp_peak_a",
    "clamp_loss_w",
    "duty_lost_to_leakage",
];
const LOSSES_REQUIRED: &[&str] = &[
    "copper_loss_w",
    "total_loss_w",
    "rise_limit_c",
    "surface_estimated",
    "windings_without_current",
    "ambient_c",
    "class_limit_c",
    "class_binding",
];
const LOSSES_EXTRA: &[&str] = &[
    "core_loss_w",
    "core_loss_kw_m3",
    "core_volume_mm3",
    "core_swing_mt",
    "core_duty",
    "core_reset_fraction",
    "surface_area_cm2",
    "temperature_rise_c",
    "hot_spot_c",
];
/// FORMAT.md, "Limits": each entry of `limits`.
const LIMIT_KEYS: &[&str] = &[
    "constraint",
    "margin",
    "used",
    "allowed",
    "unit",
    "about",
    "broken",
];

/// The object's keys hold every required key and none outside `required + extra`.
fn holds(what: &str, v: &Value, required: &[&str], extra: &[&str]) -> Result<(), String> {
    let Some(map) = v.as_object() else {
        return Err(format!("{what}: not an object"));
    };
    let keys: BTreeSet<&str> = map.keys().map(String::as_str).collect();
    let missing: Vec<_> = required.iter().filter(|k| !keys.contains(*k)).collect();
    let allowed: BTreeSet<&str> = required.iter().chain(extra).copied().collect();
    let unknown: Vec<_> = keys.difference(&allowed).collect();
    if missing.is_empty() && unknown.is_empty() {
        Ok(())
    } else {
        Err(format!(
            "{what}: missing {missing:?}, not documented {unknown:?}"
        ))
    }
}

fn check_report(name: &str, j: &Value, with_frequency: bool) -> Result<(), String> {
    holds(name, j, TOP_REQUIRED, TOP_EXTRA)?;
    for (i, s) in j["sections"].as_array().unwrap().iter().enumerate() {
        let what = format!("{name} section {i}");
        match s["kind"].as_str() {
            Some("winding") => {
                holds(&what, s, WINDING_SECTION_REQUIRED, WINDING_SECTION_EXTRA)?;
                for l in s["layer_list"].as_array().unwrap() {
                    holds(&what, l, LAYER_KEYS, &[])?;
                }
            }
            Some("tape") => holds(&what, s, TAPE_SECTION_REQUIRED, TAPE_SECTION_EXTRA)?,
            other => return Err(format!("{what}: kind {other:?}")),
        }
    }
    for w in j["windings"].as_array().unwrap() {
        if with_frequency {
            let required: Vec<&str> = WINDING_REQUIRED.iter().chain(WINDING_AC).copied().collect();
            holds(&format!("{name} winding"), w, &required, WINDING_EXTRA)?;
        } else {
            let extra: Vec<&str> = WINDING_EXTRA.iter().chain(WINDING_AC).copied().collect();
            holds(&format!("{name} winding"), w, WINDING_REQUIRED, &extra)?;
        }
        match w["conductor"].as_str() {
            Some("round") => {}
            Some("foil") => holds(&format!("{name} foil"), &w["foil"], FOIL_KEYS, &[])?,
            Some("litz") => holds(
                &format!("{name} litz"),
                &w["litz"],
                LITZ_REQUIRED,
                LITZ_EXTRA,
            )?,
            other => return Err(format!("{name} winding: conductor {other:?}")),
        }
    }
    for l in j["leakage"].as_array().unwrap() {
        holds(&format!("{name} leakage"), l, LEAKAGE_KEYS, &[])?;
    }
    for w in j["warnings"].as_array().unwrap() {
        holds(
            &format!("{name} warning"),
            w,
            WARNING_REQUIRED,
            WARNING_EXTRA,
        )?;
    }
    if let Some(c) = j.get("converter") {
        let extra: Vec<&str> = CONVERTER_EXTRA
            .iter()
            .chain(CONVERTER_CORE)
            .copied()
            .collect();
        holds(&format!("{name} converter"), c, CONVERTER_REQUIRED, &extra)?;
    }
    if let Some(l) = j.get("losses") {
        holds(&format!("{name} losses"), l, LOSSES_REQUIRED, LOSSES_EXTRA)?;
    }
    for l in j["limits"].as_array().unwrap() {
        holds(&format!("{name} limit"), l, LIMIT_KEYS, &[])?;
    }
    for o in j
        .get("outputs")
        .and_then(Value::as_array)
        .into_iter()
        .flatten()
    {
        holds(&format!("{name} output"), o, OUTPUT_KEYS, &[])?;
    }
    Ok(())
}

/// Every example's `check --json` carries the spec's keys and only documented ones.
#[test]
fn check_json_keys_are_the_documented_set() {
    for name in [
        "foil-litz-300k",
        "first-try",
        "bench-forward",
        "mains-isolated",
        "salvaged-too-small",
        "two-output",
    ] {
        let (b, e) = example(name);
        let j = json::report(&b, &e).to_value();
        let with_frequency = b.setup.frequency_khz.is_some();
        check_report(name, &j, with_frequency).unwrap();
    }
}

/// bench-forward has an operating point, core data and a `[material]`: its converter object
/// carries the two keys the spec makes conditional on them, and a winding's `with` is present
/// (as `null`) even when the section is not bifilar.
#[test]
fn conditional_keys_are_present_when_their_inputs_are() {
    let (b, e) = example("bench-forward");
    let j = json::report(&b, &e).to_value();
    for k in CONVERTER_CORE {
        assert!(j["converter"].get(*k).is_some(), "converter lacks {k}");
    }
    assert!(j.get("losses").is_some());
    let first = j["sections"]
        .as_array()
        .unwrap()
        .iter()
        .find(|s| s["kind"] == "winding")
        .unwrap();
    assert!(first.get("with").is_some());
}

/// The check itself fails on a lost key and on an undocumented one.
#[test]
fn the_key_check_catches_a_lost_and_an_unknown_key() {
    let (b, e) = example("first-try");
    let mut j = json::report(&b, &e).to_value();
    let mut lost = j.clone();
    lost.as_object_mut().unwrap().remove("fill_factor");
    assert!(check_report("lost", &lost, false).is_err());
    j["windings"][0]["dcr_mohm"] = Value::from(1.0);
    assert!(check_report("unknown", &j, false).is_err());
}

/// The outputs list is there with `[[output]]` tables, one entry per output, and left out for
/// the one-output shorthand (so the existing examples' JSON is unchanged).
#[test]
fn outputs_are_listed_only_with_output_tables() {
    let (b, e) = example("two-output");
    let j = json::report(&b, &e).to_value();
    let outputs = j["outputs"].as_array().expect("an outputs array");
    assert_eq!(outputs.len(), 2);
    assert_eq!(outputs[0]["regulated"], true);
    assert_eq!(outputs[1]["winding"], "S12");
    let (b, e) = example("bench-forward");
    assert!(json::report(&b, &e).to_value().get("outputs").is_none());
}

/// `design --json`, the top level (the contract: `designs` best first, `binding` a
/// string or null).
const DESIGN_TOP: &[&str] = &["designs", "binding"];
/// Each design: the keys the issue requires of every design...
const DESIGN_REQUIRED: &[&str] = &[
    "bobbin",
    "turns",
    "reset_duty_limit",
    "switch_voltage_v",
    "total_loss_w",
    "temperature_rise_c",
    "spare_height_mm",
];
/// ...and the further ones FORMAT.md documents ("Requirements file and `turnstack design`").
const DESIGN_EXTRA: &[&str] = &[
    "reset_ratio",
    "duty_limit",
    "switch_allowed_v",
    "duty_margin",
    "flux_swing_worst_mt",
    "flux_headroom_mt",
    "binding_limit",
    "binding_margin",
    "reset_binds",
    "outputs",
    "description",
];
/// Each entry of a design's `outputs`.
const DESIGN_OUTPUT_KEYS: &[&str] = &["winding", "turns", "vout_v", "vout_from_turns_v"];

/// The design JSON's keys and their kinds: every design carries the required keys and only
/// documented ones, `turns` maps each winding's name to a whole number, the required figures
/// are numbers, and `binding` is null with designs and a sentence without.
fn check_design_json(v: &Value) -> Result<(), String> {
    holds("design", v, DESIGN_TOP, &[])?;
    let designs = v["designs"].as_array().ok_or("designs: not an array")?;
    let binding = &v["binding"];
    match (designs.is_empty(), binding) {
        (false, Value::Null) => {}
        (true, Value::String(s)) if !s.is_empty() => {}
        (_, b) => return Err(format!("binding {b} with {} designs", designs.len())),
    }
    for (i, d) in designs.iter().enumerate() {
        let what = format!("design {i}");
        holds(&what, d, DESIGN_REQUIRED, DESIGN_EXTRA)?;
        if !d["bobbin"].is_string() {
            return Err(format!("{what}: bobbin not a string"));
        }
        let turns = d["turns"].as_object().ok_or("turns: not an object")?;
        if turns.is_empty() || !turns.values().all(|t| t.as_u64().is_some_and(|n| n > 0)) {
            return Err(format!("{what}: turns {}", d["turns"]));
        }
        for k in &DESIGN_REQUIRED[2..] {
            if !d[*k].is_number() {
                return Err(format!("{what}: {k} is {}", d[*k]));
            }
        }
        for o in d["outputs"].as_array().ok_or("outputs: not an array")? {
            holds(&format!("{what} output"), o, DESIGN_OUTPUT_KEYS, &[])?;
        }
    }
    Ok(())
}

/// The bench supply's requirements on one bundled bobbin, and with a switch too small for any
/// reset ratio (at a duty limit of 0.45 the off-state voltage is at least 28 / 0.55 = 51 V,
/// over 0.8 x 60 V).
fn design_value(rating_v: u32) -> Value {
    use std::sync::atomic::AtomicBool;
    use turnstack::engine::design::{DesignSettings, design};
    use turnstack::files::{BobbinLibrary, parse_requirements};
    let text = format!(
        "format = 1\nbobbins = [\"e25-13-7\"]\n[setup]\nfrequency_khz = 100\n[operating]\n\
         vin_min_v = 20\nvin_max_v = 28\nvout_v = 5\niout_a = 4\nrectifier_drop_v = 0.5\n\
         duty_limit = 0.45\nambient_c = 40\n[material]\ngrade = \"mnzn-power-100c\"\n\
         [switch]\nvoltage_rating_v = {rating_v}\n"
    );
    let library = BobbinLibrary::bundled_only();
    let req = parse_requirements(&text, None, &library).unwrap_or_else(|e| panic!("{e}"));
    let bobbins: Vec<_> = library
        .entries()
        .into_iter()
        .filter(|e| e.id == "e25-13-7")
        .map(|e| (e.id, e.bobbin.unwrap()))
        .collect();
    let outcome = design(
        &req,
        &bobbins,
        &DesignSettings::default(),
        &|_, _| {},
        &AtomicBool::new(false),
    );
    serde_json::to_value(turnstack::report::design::json(
        &outcome,
        req.switch.allowed_v(),
    ))
    .unwrap()
}

/// `design --json` holds the issue's keys (FORMAT.md, "Requirements file and `turnstack
/// design`"): with designs found, and with none (`binding` the sentence naming the rating).
#[test]
fn design_json_keys_are_the_documented_set() {
    let found = design_value(100);
    assert!(!found["designs"].as_array().unwrap().is_empty());
    check_design_json(&found).unwrap();
    let turns = found["designs"][0]["turns"].as_object().unwrap();
    assert_eq!(turns.keys().collect::<Vec<_>>(), ["P", "R", "S"]);
    let none = design_value(60);
    check_design_json(&none).unwrap();
    assert!(none["binding"].as_str().unwrap().contains("60 V"), "{none}");
    // The check fails on a lost key, an undocumented one, and a binding beside designs.
    let mut lost = found.clone();
    lost["designs"][0]
        .as_object_mut()
        .unwrap()
        .remove("switch_voltage_v");
    assert!(check_design_json(&lost).is_err());
    let mut unknown = found.clone();
    unknown["designs"][0]["loss_mw"] = Value::from(1.0);
    assert!(check_design_json(&unknown).is_err());
    let mut both = found;
    both["binding"] = Value::from("why");
    assert!(check_design_json(&both).is_err());
}
