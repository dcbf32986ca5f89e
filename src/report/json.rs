//! The JSON report of `check --json`, with the keys the format spec lists (and a few more).
//!
//! Each object of the report is a struct here, so the contract is typed: a key is a field, a
//! key that is present only sometimes is an `Option` skipped when empty, and a key that is
//! always present but may be `null` is an `Option` that is not skipped. The fields borrow from
//! the `Evaluation`; nothing is computed. `cli::json_text` prints the keys of every object in
//! alphabetical order (serde_json's map), whatever the order of the fields.

use crate::engine::{
    AcFigures, ConverterEval, Evaluation, LayerEval, LeakageEval, Limit, LossEval, SectionEval,
    SectionKind, Warning, WarningAt, WindingEval,
};
use crate::model::{BobbinSource, Build, Name, ResetSide};
use serde::Serialize;

pub use super::json_stress::{
    CapacitanceJson, LayerStressJson, PairStressJson, SelfCapacitanceJson, StressJson,
};
use super::json_stress::{capacitance, stress};

/// The whole report: the top-level object of `check --json`.
#[derive(Debug, Serialize)]
pub struct Report<'a> {
    pub format: u32,
    pub title: &'a str,
    /// The bobbin's id in the library; `null` for a bobbin written inline.
    pub bobbin: Option<&'a str>,
    pub fits: bool,
    pub build_height_mm: f64,
    pub height_with_allowance_mm: f64,
    pub window_height_mm: f64,
    pub window_width_mm: f64,
    pub usable_width_mm: f64,
    pub spare_height_mm: f64,
    pub fill_factor: f64,
    /// The winding temperature the figures use (given, or ambient + rise solved).
    pub temperature_c: f64,
    /// Where `temperature_c` comes from: `given` or `solved`.
    pub temperature_source: &'static str,
    pub sections: Vec<SectionJson<'a>>,
    pub windings: Vec<WindingJson<'a>>,
    pub leakage: Vec<LeakageJson<'a>>,
    pub warnings: Vec<WarningJson<'a>>,
    pub notes: Vec<String>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub converter: Option<ConverterJson>,
    /// Each output, with `[[output]]` tables (see `report::json_outputs`).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub outputs: Option<Vec<super::json_outputs::OutputJson<'a>>>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub losses: Option<LossesJson<'a>>,
    pub limits: Vec<LimitJson<'a>>,
    /// Primary-secondary and each winding's own capacitance, and the ringing.
    pub capacitance: CapacitanceJson<'a>,
    /// Layer, bifilar and section voltages, with an operating point.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub voltage_stress: Option<StressJson<'a>>,
    /// The limits the design breaks (fit included); empty when it passes.
    pub failures: Vec<&'static str>,
    /// The bench readings as read (`[measured]`), when the build has them.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub measured: Option<serde_json::Value>,
    /// Each reading against its prediction (`engine::verify`), when the build has readings.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub verify: Option<serde_json::Value>,
}

/// One entry of `sections`: a tape section or a winding section.
#[derive(Debug, Serialize)]
#[serde(tag = "kind", rename_all = "lowercase")]
pub enum SectionJson<'a> {
    Tape {
        wraps: u32,
        y_mm: f64,
        height_mm: f64,
        past_window: bool,
    },
    Winding {
        winding: &'a Name,
        with: Option<&'a Name>,
        turns: u32,
        turns_per_layer: u32,
        layers: u32,
        last_layer_turns: u32,
        pitch_mm: f64,
        layer_height_mm: f64,
        layer_tape: u32,
        spread: bool,
        y_mm: f64,
        height_mm: f64,
        mlt_mm: f64,
        past_window: bool,
        layer_list: Vec<LayerJson>,
    },
}

/// One layer of a winding section (`layer_list`).
#[derive(Debug, Serialize)]
pub struct LayerJson {
    pub y_mm: f64,
    pub height_mm: f64,
    pub turns: u32,
    pub mlt_mm: f64,
    pub partial: bool,
}

/// One entry of `windings`.
#[derive(Debug, Serialize)]
pub struct WindingJson<'a> {
    pub name: &'a Name,
    pub role: &'static str,
    pub turns: u32,
    pub strands: u32,
    /// `round`, `foil` or `litz`.
    pub conductor: &'static str,
    pub bare_mm: f64,
    pub od_mm: f64,
    pub copper_area_mm2: f64,
    /// A foil's own figures.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub foil: Option<super::json_conductor::FoilJson>,
    /// A litz's own figures.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub litz: Option<super::json_conductor::LitzJson>,
    pub length_m: f64,
    pub mlt_mm: f64,
    pub dcr_ohm: f64,
    /// Present when the setup gives a frequency.
    #[serde(flatten, skip_serializing_if = "Option::is_none")]
    pub ac: Option<AcJson>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub current_density_a_mm2: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub current_rms_a: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub current_source: Option<&'static str>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub current_model_rms_a: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub copper_loss_w: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub proximity_loss_w: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub layer_voltage_v: Option<f64>,
}

/// The AC figures of a winding, written among its other keys.
#[derive(Debug, Serialize)]
pub struct AcJson {
    pub ac_factor: f64,
    pub rac_ohm: f64,
    pub skin_depth_mm: f64,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub ac_factor_waveform: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub rac_waveform_ohm: Option<f64>,
}

/// One entry of `leakage`.
#[derive(Debug, Serialize)]
pub struct LeakageJson<'a> {
    pub from: &'a Name,
    pub to: &'a Name,
    pub referred_to: &'a Name,
    pub uh: f64,
    /// The part of `uh` from the spacing of a bifilar pair's wires.
    pub bifilar_uh: f64,
}

/// One entry of `warnings`, with the one key (if any) that says what it is beside.
#[derive(Debug, Serialize)]
pub struct WarningJson<'a> {
    pub code: &'static str,
    pub message: String,
    /// The stack index of the section it is about.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub section: Option<usize>,
    /// The winding it is about (present, `null` if the index has no winding).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub winding: Option<Option<&'a Name>>,
    /// `"converter"` for a warning about the operating point.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub about: Option<&'static str>,
}

/// The `converter` object, present with an operating point.
#[derive(Debug, Serialize)]
pub struct ConverterJson {
    pub reset_side: &'static str,
    pub reset_duty_limit: f64,
    pub reset_duty_limit_primary_side: f64,
    pub duty_max: f64,
    pub duty_available: f64,
    pub switch_voltage_v: f64,
    pub duty_needed_at_vin_min: f64,
    pub duty_needed_at_vin_max: f64,
    pub duty_margin: f64,
    pub duty_needed_total_at_vin_min: f64,
    pub duty_used_at_vin_min: f64,
    pub reset_time_us: f64,
    pub reset_time_worst_us: f64,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub steady_duty_ceiling: Option<f64>,
    /// Present when the bobbin has core data.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub flux_swing_worst_mt: Option<f64>,
    /// Present when the build gives a `[material]`.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub flux_headroom_mt: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub flux_swing_steady_mt: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub al_nh: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub al_source: Option<&'static str>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub magnetising_uh: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub magnetising_peak_a: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub magnetising_peak_worst_a: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub reset_peak_a: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub reset_peak_worst_a: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub reset_rms_a: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub reset_current_density_a_mm2: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub switch_rating_v: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub leakage_ps_uh: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub clamp_peak_a: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub clamp_loss_w: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub duty_lost_to_leakage: Option<f64>,
}

/// The `losses` object, present when some winding has a current.
#[derive(Debug, Serialize)]
pub struct LossesJson<'a> {
    pub copper_loss_w: f64,
    pub total_loss_w: f64,
    pub rise_limit_c: f64,
    pub surface_estimated: bool,
    pub windings_without_current: &'a [Name],
    pub ambient_c: f64,
    pub class_limit_c: f64,
    pub class_binding: &'static str,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub hot_spot_c: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub core_loss_w: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub core_loss_kw_m3: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub core_volume_mm3: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub core_swing_mt: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub core_duty: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub core_reset_fraction: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub surface_area_cm2: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub temperature_rise_c: Option<f64>,
}

/// One entry of `limits`, binding first.
#[derive(Debug, Serialize)]
pub struct LimitJson<'a> {
    pub constraint: &'static str,
    pub margin: f64,
    pub used: f64,
    pub allowed: f64,
    pub unit: &'static str,
    pub about: Option<&'a Name>,
    pub broken: bool,
}

impl Report<'_> {
    /// The report as a JSON value (keys sorted), for a caller that reads it back.
    pub fn to_value(&self) -> serde_json::Value {
        serde_json::to_value(self).unwrap_or_default()
    }
}

/// The report of `check --json` for a build and its evaluation.
pub fn report<'a>(build: &'a Build, eval: &'a Evaluation) -> Report<'a> {
    let checked = build
        .measured
        .as_ref()
        .and_then(|_| crate::engine::verify::verify(build, eval));
    Report {
        format: 1,
        title: &build.title,
        bobbin: match &build.bobbin_source {
            BobbinSource::Id(id) => Some(id.as_str()),
            BobbinSource::Inline => None,
        },
        fits: eval.fits,
        build_height_mm: eval.build_height_mm,
        height_with_allowance_mm: eval.height_with_allowance_mm,
        window_height_mm: eval.window_height_mm,
        window_width_mm: eval.window_width_mm,
        usable_width_mm: eval.usable_width_mm,
        spare_height_mm: eval.spare_height_mm,
        fill_factor: eval.fill_factor,
        temperature_c: eval.temperature_c,
        temperature_source: eval.temperature_source.key(),
        sections: eval.sections.iter().map(section).collect(),
        windings: eval.windings.iter().map(winding).collect(),
        leakage: eval.leakage.iter().map(leakage).collect(),
        warnings: eval.warnings.iter().map(|w| warning(build, w)).collect(),
        notes: eval.notes.iter().map(ToString::to_string).collect(),
        converter: eval.converter.as_ref().map(converter),
        outputs: eval
            .converter
            .as_ref()
            .and_then(|c| super::json_outputs::outputs(&c.outputs)),
        losses: eval.losses.as_ref().map(losses),
        limits: eval.limits.iter().map(limit).collect(),
        capacitance: capacitance(eval),
        voltage_stress: eval.stress.as_ref().map(stress),
        failures: eval.failures().iter().map(|c| c.key()).collect(),
        // Both or neither, as `verify --json` gives them.
        measured: checked
            .as_ref()
            .and(build.measured.as_ref().map(super::verify::measured_json)),
        verify: checked.as_ref().map(super::verify::verify_json),
    }
}

fn section(s: &SectionEval) -> SectionJson<'_> {
    match &s.kind {
        SectionKind::Tape { wraps } => SectionJson::Tape {
            wraps: *wraps,
            y_mm: s.y_mm,
            height_mm: s.height_mm,
            past_window: s.past_window,
        },
        SectionKind::Winding {
            winding,
            partner,
            turns,
            pitch_mm,
            turns_per_layer,
            layer_count,
            last_layer_turns,
            layer_height_mm,
            layer_tape,
            spread,
            mlt_mm,
        } => SectionJson::Winding {
            winding,
            with: partner.as_ref(),
            turns: *turns,
            turns_per_layer: *turns_per_layer,
            layers: *layer_count,
            last_layer_turns: *last_layer_turns,
            pitch_mm: *pitch_mm,
            layer_height_mm: *layer_height_mm,
            layer_tape: *layer_tape,
            spread: *spread,
            y_mm: s.y_mm,
            height_mm: s.height_mm,
            mlt_mm: *mlt_mm,
            past_window: s.past_window,
            layer_list: s.layers.iter().map(layer).collect(),
        },
    }
}

fn layer(l: &LayerEval) -> LayerJson {
    LayerJson {
        y_mm: l.y_mm,
        height_mm: l.height_mm,
        turns: l.turns,
        mlt_mm: l.mlt_mm,
        partial: l.partial,
    }
}

fn winding(w: &WindingEval) -> WindingJson<'_> {
    WindingJson {
        name: &w.name,
        role: w.role.key(),
        turns: w.turns,
        strands: w.strands,
        conductor: w.conductor.kind_key(),
        bare_mm: w.bare_mm,
        od_mm: w.od_mm,
        copper_area_mm2: w.copper_area_mm2,
        foil: super::json_conductor::foil(&w.conductor),
        litz: super::json_conductor::litz(&w.conductor),
        length_m: w.length_m,
        mlt_mm: w.mlt_mm,
        dcr_ohm: w.dcr_ohm,
        ac: w.ac.as_ref().map(ac),
        current_density_a_mm2: w.current_density_a_mm2,
        current_rms_a: w.current_rms_a,
        current_source: w.current_source.map(|s| s.key()),
        current_model_rms_a: w.current_model_rms_a,
        copper_loss_w: w.copper_loss_w,
        proximity_loss_w: w.proximity_loss_w,
        layer_voltage_v: w.layer_voltage_v,
    }
}

fn ac(a: &AcFigures) -> AcJson {
    AcJson {
        ac_factor: a.ac_factor,
        rac_ohm: a.rac_ohm,
        skin_depth_mm: a.skin_depth_mm,
        ac_factor_waveform: a.ac_factor_waveform,
        rac_waveform_ohm: a.rac_waveform_ohm,
    }
}

fn leakage(l: &LeakageEval) -> LeakageJson<'_> {
    LeakageJson {
        from: &l.from,
        to: &l.to,
        referred_to: &l.referred_to,
        uh: l.uh,
        bifilar_uh: l.bifilar_uh,
    }
}

fn warning<'a>(build: &'a Build, w: &Warning) -> WarningJson<'a> {
    let mut out = WarningJson {
        code: w.code(),
        message: w.message(),
        section: None,
        winding: None,
        about: None,
    };
    match w.at {
        WarningAt::Section(i) => out.section = Some(i),
        WarningAt::Winding(i) => out.winding = Some(build.windings.get(i).map(|w| &w.name)),
        WarningAt::Converter => out.about = Some("converter"),
        WarningAt::Build => {}
    }
    out
}

fn converter(c: &ConverterEval) -> ConverterJson {
    ConverterJson {
        reset_side: match c.reset_side {
            ResetSide::Primary => "primary",
            ResetSide::Secondary => "secondary",
        },
        reset_duty_limit: c.reset_duty_limit,
        reset_duty_limit_primary_side: c.reset_duty_limit_primary_side,
        duty_max: c.duty_max,
        duty_available: c.duty_available,
        switch_voltage_v: c.switch_voltage_v,
        duty_needed_at_vin_min: c.duty_needed_at_vin_min,
        duty_needed_at_vin_max: c.duty_needed_at_vin_max,
        duty_margin: c.duty_margin,
        duty_needed_total_at_vin_min: c.duty_needed_total_at_vin_min,
        duty_used_at_vin_min: c.duty_used_at_vin_min,
        reset_time_us: c.reset_time_us,
        reset_time_worst_us: c.reset_time_worst_us,
        steady_duty_ceiling: c.steady_duty_ceiling,
        flux_swing_worst_mt: c.flux_swing_worst_mt,
        flux_headroom_mt: c.flux_headroom_mt,
        flux_swing_steady_mt: c.flux_swing_steady_mt,
        al_nh: c.al_nh,
        al_source: c.al_source.map(|s| s.key()),
        magnetising_uh: c.magnetising_uh,
        magnetising_peak_a: c.magnetising_peak_a,
        magnetising_peak_worst_a: c.magnetising_peak_worst_a,
        reset_peak_a: c.reset_peak_a,
        reset_peak_worst_a: c.reset_peak_worst_a,
        reset_rms_a: c.reset_rms_a,
        reset_current_density_a_mm2: c.reset_current_density_a_mm2,
        switch_rating_v: c.switch_rating_v,
        leakage_ps_uh: c.leakage_ps_uh,
        clamp_peak_a: c.clamp_peak_a,
        clamp_loss_w: c.clamp_loss_w,
        duty_lost_to_leakage: c.duty_lost_to_leakage,
    }
}

fn losses(l: &LossEval) -> LossesJson<'_> {
    LossesJson {
        copper_loss_w: l.copper_loss_w,
        total_loss_w: l.total_loss_w,
        rise_limit_c: l.rise_limit_c,
        surface_estimated: l.surface_estimated,
        windings_without_current: &l.windings_without_current,
        ambient_c: l.ambient_c,
        class_limit_c: l.class_limit_c,
        class_binding: l.class_binding.key(),
        hot_spot_c: l.hot_spot_c,
        core_loss_w: l.core_loss_w,
        core_loss_kw_m3: l.core_loss_kw_m3,
        core_volume_mm3: l.core_volume_mm3,
        core_swing_mt: l.core_swing_mt,
        core_duty: l.core_duty,
        core_reset_fraction: l.core_reset_fraction,
        surface_area_cm2: l.surface_area_cm2,
        temperature_rise_c: l.temperature_rise_c,
    }
}

fn limit(l: &Limit) -> LimitJson<'_> {
    LimitJson {
        constraint: l.constraint.key(),
        margin: l.margin,
        used: l.used,
        allowed: l.allowed,
        unit: l.unit,
        about: l.about.as_ref(),
        broken: l.broken(),
    }
}
