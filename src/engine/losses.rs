//! Copper and core loss of the whole transformer and the temperature rise they cause.

use super::converter::ConverterEval;
use super::core_loss;
use super::evaluation::WindingEval;
use super::magnetics;
use super::memo::Memo;
use super::thermal::{self, DEFAULT_AMBIENT_C, DEFAULT_RISE_LIMIT_C, InsulationPart};
use crate::model::{Build, Core, Name, Operating, ResetSide};

/// The losses (W) and what they do to the part's temperature (C).
#[derive(Debug, Clone, PartialEq)]
pub struct LossEval {
    /// Sum of the windings' copper losses (those that have a current).
    pub copper_loss_w: f64,
    /// Windings with no current to count (auxiliary windings without `current_rms_a`).
    pub windings_without_current: Vec<Name>,
    /// Core loss density by the iGSE, steady state at `vin_max_v`.
    pub core_loss_kw_m3: Option<f64>,
    /// Core loss (W): the density times the core's volume.
    pub core_loss_w: Option<f64>,
    /// Core volume the loss is taken over (mm3): Ve, or Ae x le.
    pub core_volume_mm3: Option<f64>,
    /// The flux swing, duty and reset fraction the core loss is taken at.
    pub core_swing_mt: Option<f64>,
    /// The duty at `vin_max_v` the core loss is taken at.
    pub core_duty: Option<f64>,
    /// The share of the period the reset takes at that duty.
    pub core_reset_fraction: Option<f64>,
    /// Copper (at `vin_min_v`) plus core (at `vin_max_v`): the worst of each, together.
    pub total_loss_w: f64,
    /// Outer surface of the wound part (cm2), given or estimated.
    pub surface_area_cm2: Option<f64>,
    /// The surface area was estimated from the area product, not given.
    pub surface_estimated: bool,
    /// Temperature rise (C) of the surface from the total loss (McLyman).
    pub temperature_rise_c: Option<f64>,
    /// The rise the user accepts (C), `[operating] rise_limit_c` or the default.
    pub rise_limit_c: f64,
    /// `[operating] ambient_c`, or the default.
    pub ambient_c: f64,
    /// `ambient_c + temperature_rise_c`.
    pub hot_spot_c: Option<f64>,
    /// The lowest thermal class of wire, tape and bobbin (IEC 60085 index, C), and whose.
    pub class_limit_c: f64,
    /// Which part (wire, tape or bobbin) has the lowest class.
    pub class_binding: InsulationPart,
}

/// `windings` carry their copper loss already.
pub fn evaluate(
    build: &Build,
    c: &ConverterEval,
    windings: &[WindingEval],
    memo: &mut Memo,
) -> LossEval {
    with_copper(&without_copper(build, c, memo), windings)
}

/// The figures of a [`LossEval`] that the windings do not move (the core's loss, the
/// surface, the limits), found once for every winding temperature tried.
#[derive(Debug, Clone, PartialEq)]
pub struct CoreAndLimits {
    /// (kW/m3, volume mm3, swing mT, duty, reset fraction), as [`core_figures`] gives them.
    core_figures: Option<(Option<f64>, f64, f64, f64, f64)>,
    /// The core loss (W), when there is a density.
    core_loss_w: Option<f64>,
    /// Given, else estimated from the area product.
    surface_area_cm2: Option<f64>,
    /// The surface was estimated.
    surface_estimated: bool,
    /// `[operating] ambient_c`, or the default.
    ambient_c: f64,
    /// `[operating] rise_limit_c`, or the default.
    rise_limit_c: f64,
    /// The lowest thermal class and whose it is.
    class: (f64, InsulationPart),
}

/// The [`CoreAndLimits`] of a build at the converter's operating point.
pub fn without_copper(build: &Build, c: &ConverterEval, memo: &mut Memo) -> CoreAndLimits {
    let op = build.operating.as_ref();
    let core = build.bobbin.core.as_ref();

    // Core loss is largest at the highest input: the same swing (CCM), over a shorter,
    // steeper on-time.
    let core_figures = op
        .zip(core)
        .map(|(op, core)| core_figures(build, c, op, core, memo));
    let core_loss_kw_m3 = core_figures.and_then(|f| f.0);
    // kW/m^3 x mm^3: 1e3 W/m^3 x 1e-9 m^3.
    let core_loss_w = core_loss_kw_m3
        .zip(core_figures.map(|f| f.1))
        .map(|(p, v)| p * v * 1e-6);

    let given = op.and_then(|o| o.surface_area_cm2);
    let estimated = core.map(|c| {
        thermal::surface_from_area_product_cm2(
            build.bobbin.window.width_mm * build.bobbin.window.height_mm,
            c.ae_mm2,
        )
    });
    let st = &build.setup;
    CoreAndLimits {
        core_figures,
        core_loss_w,
        surface_area_cm2: given.or(estimated),
        surface_estimated: given.is_none() && estimated.is_some(),
        ambient_c: op.and_then(|o| o.ambient_c).unwrap_or(DEFAULT_AMBIENT_C),
        rise_limit_c: op
            .and_then(|o| o.rise_limit_c)
            .unwrap_or(DEFAULT_RISE_LIMIT_C),
        class: thermal::binding_class(st.wire_class_c, st.tape_class_c, st.bobbin_class_c),
    }
}

/// The losses of `windings` (which carry their copper loss already) with the core's.
pub fn with_copper(fixed: &CoreAndLimits, windings: &[WindingEval]) -> LossEval {
    let copper_loss_w = windings.iter().filter_map(|w| w.copper_loss_w).sum();
    let windings_without_current = windings
        .iter()
        .filter(|w| w.copper_loss_w.is_none())
        .map(|w| w.name.clone())
        .collect();
    let core_figures = fixed.core_figures;
    let total_loss_w = copper_loss_w + fixed.core_loss_w.unwrap_or(0.0);
    let temperature_rise_c = fixed
        .surface_area_cm2
        .map(|a| thermal::rise_c(total_loss_w, a));
    let ambient_c = fixed.ambient_c;
    let (class_limit_c, class_binding) = fixed.class;
    LossEval {
        ambient_c,
        hot_spot_c: temperature_rise_c.map(|r| ambient_c + r),
        class_limit_c,
        class_binding,
        copper_loss_w,
        windings_without_current,
        core_loss_kw_m3: core_figures.and_then(|f| f.0),
        core_loss_w: fixed.core_loss_w,
        core_volume_mm3: core_figures.map(|f| f.1),
        core_swing_mt: core_figures.map(|f| f.2),
        core_duty: core_figures.map(|f| f.3),
        core_reset_fraction: core_figures.map(|f| f.4),
        total_loss_w,
        surface_area_cm2: fixed.surface_area_cm2,
        surface_estimated: fixed.surface_estimated,
        temperature_rise_c,
        rise_limit_c: fixed.rise_limit_c,
    }
}

/// The core loss at the highest input: (kW/m3 when the material has Steinmetz figures,
/// core volume mm3, flux swing mT, duty, reset fraction of the period).
fn core_figures(
    build: &Build,
    c: &ConverterEval,
    op: &Operating,
    core: &Core,
    memo: &mut Memo,
) -> (Option<f64>, f64, f64, f64, f64) {
    let f_khz = build.setup.frequency_khz.unwrap_or(0.0);
    let duty = c.duty_needed_at_vin_max.min(c.duty_available).max(0.0);
    let swing_t = op.vin_max_v * duty / (f_khz * 1e3 * f64::from(c.np) * core.ae_mm2 * 1e-6);
    // Reset to the output returns to the regulated one.
    let reg = op.regulated();
    let vo = reg.vout_v + reg.rectifier_drop_v;
    let reset = match c.reset_side {
        ResetSide::Primary => duty * f64::from(c.nr) / f64::from(c.np),
        ResetSide::Secondary => op.vin_max_v * duty * f64::from(c.nr) / (vo * f64::from(c.np)),
    }
    .min(1.0 - duty);
    let volume = magnetics::volume_mm3(core);
    let density = build
        .material
        .as_ref()
        .and_then(|m| m.steinmetz)
        .filter(|_| duty > 0.0 && reset > 0.0 && f_khz > 0.0)
        .map(|s| {
            let inputs = [s.k, s.alpha, s.beta, f_khz, swing_t, duty, reset];
            memo.core_loss(inputs, || {
                core_loss::forward_kw_m3(s.k, s.alpha, s.beta, f_khz, swing_t, duty, reset)
            })
        });
    (density, volume, swing_t * 1e3, duty, reset)
}
