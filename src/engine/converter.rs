//! Single-switch forward converter figures from the operating point: reset duty limit,
//! switch voltage, duty needed, flux swing, magnetising and reset currents (format spec).

use super::magnetics::{self, AlSource};
use super::outputs::{self, OutputAt, OutputEval};
use crate::model::{Build, Operating, ResetSide, Role};

/// The single-switch forward converter's figures at the operating point: turns, duty
/// limits and needs, switch voltage, reset time, flux swing and magnetising currents.
#[derive(Debug, Clone, PartialEq)]
pub struct ConverterEval {
    /// Where the reset winding returns its energy.
    pub reset_side: ResetSide,
    /// Primary turns (the first primary).
    pub np: u32,
    /// Secondary turns (the first secondary).
    pub ns: u32,
    /// Reset turns (the first reset winding).
    pub nr: u32,
    /// Largest duty at which the core fully resets within a period at `vin_max_v`.
    pub reset_duty_limit: f64,
    /// `Np / (Np + Nr)`: the limit the same turns would give with the reset clamped to the
    /// input (equal to `reset_duty_limit` for primary-side reset).
    pub reset_duty_limit_primary_side: f64,
    /// The duty the converter may use: min(duty_limit, reset_duty_limit).
    pub duty_max: f64,
    /// `duty_max`, and for secondary-side reset also at most `1 - Nr/Ns`.
    pub duty_available: f64,
    /// Switch off-state voltage at `vin_max_v` (no leakage spike).
    pub switch_voltage_v: f64,
    /// `[operating] switch_rating_v`, when given.
    pub switch_rating_v: Option<f64>,
    /// Duty needed at `vin_min_v`, continuous conduction, ideal switch.
    pub duty_needed_at_vin_min: f64,
    /// Duty needed at `vin_max_v`, the same way.
    pub duty_needed_at_vin_max: f64,
    /// `duty_available - duty_needed_total_at_vin_min`; negative when the output is out of
    /// reach.
    pub duty_margin: f64,
    /// The duty needed at `vin_min_v` with the switch's drop taken off the input, plus the
    /// duty lost to the leakage: what `duty_margin` and the reset-duty limit use.
    pub duty_needed_total_at_vin_min: f64,
    /// Primary-secondary leakage referred to the primary (uH), set by the evaluation.
    pub leakage_ps_uh: Option<f64>,
    /// Primary current at turn-off: `reflected_a + magnetising_peak_a`.
    pub clamp_peak_a: Option<f64>,
    /// `1/2 L_lk I_pk^2 f`: the power the clamp or snubber must take at turn-off.
    pub clamp_loss_w: Option<f64>,
    /// `L_lk reflected_a f / (vin_min_v - switch_drop_v)`: the share of the period the
    /// primary current spends rising through the leakage before the secondary takes the load.
    pub duty_lost_to_leakage: Option<f64>,
    /// Secondary-side reset only: the steady-state duty must stay below `1 - Nr/Ns`.
    pub steady_duty_ceiling: Option<f64>,
    /// Reset time in steady state at `vin_min_v` (the longest on-time there is).
    pub reset_time_us: f64,
    /// Reset time after the longest on-time at `vin_max_v` (`duty_max`).
    pub reset_time_worst_us: f64,
    /// `vin_max_v x duty_max / (f Np Ae)`, when the bobbin has core data.
    pub flux_swing_worst_mt: Option<f64>,
    /// Steady state: `vin_min_v x D / (f Np Ae)`, D the duty used at `vin_min_v`.
    pub flux_swing_steady_mt: Option<f64>,
    /// `bsat_mt - br_mt`, when the build gives a material.
    pub flux_headroom_mt: Option<f64>,
    /// AL used for the magnetising inductance, and where it came from.
    pub al_nh: Option<f64>,
    /// Where `al_nh` came from (the core's AL, or mu_i and the gap).
    pub al_source: Option<AlSource>,
    /// `AL Np^2`.
    pub magnetising_uh: Option<f64>,
    /// Peak magnetising current in steady state at `vin_min_v`.
    pub magnetising_peak_a: Option<f64>,
    /// Peak magnetising current after the worst-case on-time (`vin_max_v`, `duty_max`).
    pub magnetising_peak_worst_a: Option<f64>,
    /// The reset winding's current: `Np/Nr` times the magnetising peak, falling to zero
    /// over the reset time (steady state at `vin_min_v`).
    pub reset_peak_a: Option<f64>,
    /// The reset winding's peak current (A) after the worst-case on-time.
    pub reset_peak_worst_a: Option<f64>,
    /// The reset winding's RMS current (A), steady state at `vin_min_v`.
    pub reset_rms_a: Option<f64>,
    /// `reset_rms_a` over the first reset winding's copper area (set by the evaluation).
    pub reset_current_density_a_mm2: Option<f64>,
    /// The duty used at `vin_min_v` for the currents: min(needed, available).
    pub duty_used_at_vin_min: f64,
    /// The load reflected to the primary during the on-time: the sum over the outputs of
    /// `Ik Nk / Np` (A).
    pub reflected_a: f64,
    /// Each output's voltage from the turns, when the build gives `[[output]]` tables.
    pub outputs: Vec<OutputEval>,
}

/// The duty the reset allows (fraction), the switch's off-state voltage at the highest input
/// (V) and, reset to the output, the steady duty ceiling 1 - Nr/Ns; `vo` is the output plus
/// the rectifier drop (V). The one definition of these figures: `evaluate` and the reset sweep
/// (`engine::reset_sweep`) both take them from here.
pub fn reset_limits(
    side: ResetSide,
    vin_max_v: f64,
    vo: f64,
    (npf, nsf, nrf): (f64, f64, f64),
) -> (f64, f64, Option<f64>) {
    match side {
        ResetSide::Primary => (npf / (npf + nrf), vin_max_v * (1.0 + npf / nrf), None),
        ResetSide::Secondary => (
            npf * vo / (npf * vo + nrf * vin_max_v),
            vin_max_v + vo * npf / nrf,
            Some(1.0 - nrf / nsf),
        ),
    }
}

/// The duties at the operating point, as [`evaluate`] reports them.
struct Duties {
    /// min(duty_limit, reset duty limit).
    max: f64,
    /// `max`, and at most the steady ceiling for secondary-side reset.
    available: f64,
    /// Needed at `vin_min_v`, ideal switch.
    needed_at_vin_min: f64,
    /// Needed at `vin_min_v` with the switch's drop taken off the input.
    needed_switch: f64,
    /// Needed at `vin_max_v`, ideal switch.
    needed_at_vin_max: f64,
    /// The duty the currents use at `vin_min_v`: min(needed, available).
    used: f64,
}

/// The duty figures from the output plus its rectifier drop (`vo`, V) and the primary and
/// secondary turns, the reset's duty limit and, reset to the output, its steady ceiling.
fn duties(
    op: &Operating,
    (vo, npf, nsf): (f64, f64, f64),
    reset_limit: f64,
    ceiling: Option<f64>,
) -> Duties {
    let max = op.duty_limit.map_or(reset_limit, |d| d.min(reset_limit));
    let available = ceiling.map_or(max, |c| max.min(c.max(0.0)));
    let needed_at_vin_min = vo * npf / (nsf * op.vin_min_v);
    let vin_on = (op.vin_min_v - op.switch_drop_v).max(f64::MIN_POSITIVE);
    Duties {
        max,
        available,
        needed_at_vin_min,
        needed_switch: vo * npf / (nsf * vin_on),
        needed_at_vin_max: vo * npf / (nsf * op.vin_max_v),
        used: needed_at_vin_min.min(available).max(0.0),
    }
}

/// `None` when the build has no operating point or lacks what it needs (validation refuses
/// those builds; this keeps `evaluate` total). `feeds` are the build's outputs as
/// [`outputs::resolve`] gives them.
pub fn evaluate(build: &Build, feeds: &[OutputAt<'_>]) -> Option<ConverterEval> {
    let op = build.operating.as_ref()?;
    let np = build.first_of(Role::Primary)?.turns;
    // The regulated output's winding sets the duty (the first secondary: validation holds
    // the first [[output]] to it).
    let regulated = feeds.first()?;
    let ns = build.windings[regulated.winding].turns;
    let nr = build.first_of(Role::Reset)?.turns;
    let f_hz = build.setup.frequency_khz? * 1e3;
    if np == 0 || ns == 0 || nr == 0 || f_hz <= 0.0 {
        return None;
    }
    let period_s = 1.0 / f_hz;
    let (npf, nsf, nrf) = (f64::from(np), f64::from(ns), f64::from(nr));
    let vo = regulated.figures.vout_v + regulated.figures.rectifier_drop_v;
    let reflected_a = feeds
        .iter()
        .map(|o| o.figures.iout_a * f64::from(build.windings[o.winding].turns) / npf)
        .sum();
    let (reset_duty_limit, switch_voltage_v, steady_duty_ceiling) =
        reset_limits(op.reset_side, op.vin_max_v, vo, (npf, nsf, nrf));
    let duty = duties(op, (vo, npf, nsf), reset_duty_limit, steady_duty_ceiling);
    // Volt-second balance: the reset voltage on the primary is Vin Np/Nr (clamped to the
    // input) or Vo' Np/Nr (clamped to the output).
    let reset_fraction = |vin: f64, on: f64| match op.reset_side {
        ResetSide::Primary => on * nrf / npf,
        ResetSide::Secondary => vin * on * nrf / (vo * npf),
    };
    let reset_used = reset_fraction(op.vin_min_v, duty.used);
    let core = build.bobbin.core.as_ref();
    let swing_mt =
        |vin: f64, on: f64| core.map(|c| vin * on / (f_hz * npf * c.ae_mm2 * 1e-6) * 1e3);
    let al = core.and_then(|c| magnetics::al_nh(c, build.material.as_ref()));
    let lm_h = al.map(|(al, _)| al * 1e-9 * npf * npf).filter(|l| *l > 0.0);
    // The magnetising current's peak: V t_on / Lm, steady at vin_min_v and worst at vin_max_v.
    let peak = |vin: f64, on: f64| lm_h.map(|l| vin * on * period_s / l);
    let (im_steady, im_worst) = (peak(op.vin_min_v, duty.used), peak(op.vin_max_v, duty.max));
    let reset_peak_a = im_steady.map(|i| i * npf / nrf);
    Some(ConverterEval {
        reset_side: op.reset_side,
        np,
        ns,
        nr,
        reset_duty_limit,
        reset_duty_limit_primary_side: npf / (npf + nrf),
        duty_max: duty.max,
        duty_available: duty.available,
        switch_voltage_v,
        switch_rating_v: op.switch_rating_v,
        duty_needed_at_vin_min: duty.needed_at_vin_min,
        duty_needed_at_vin_max: duty.needed_at_vin_max,
        duty_margin: duty.available - duty.needed_switch,
        duty_needed_total_at_vin_min: duty.needed_switch,
        leakage_ps_uh: None,
        clamp_peak_a: None,
        clamp_loss_w: None,
        duty_lost_to_leakage: None,
        steady_duty_ceiling,
        reset_time_us: reset_used * period_s * 1e6,
        reset_time_worst_us: reset_fraction(op.vin_max_v, duty.max) * period_s * 1e6,
        flux_swing_worst_mt: swing_mt(op.vin_max_v, duty.max),
        flux_swing_steady_mt: swing_mt(op.vin_min_v, duty.used),
        flux_headroom_mt: build.material.as_ref().map(|m| m.bsat_mt - m.br_mt),
        al_nh: al.map(|a| a.0),
        al_source: al.map(|a| a.1),
        magnetising_uh: lm_h.map(|l| l * 1e6),
        magnetising_peak_a: im_steady,
        magnetising_peak_worst_a: im_worst,
        reset_peak_a,
        reset_peak_worst_a: im_worst.map(|i| i * npf / nrf),
        // A triangle from the peak to zero over the reset time.
        reset_rms_a: reset_peak_a.map(|i| i * (reset_used.min(1.0) / 3.0).sqrt()),
        reset_current_density_a_mm2: None,
        duty_used_at_vin_min: duty.used,
        reflected_a,
        outputs: outputs::evaluate(build, feeds),
    })
}

/// The turn-off figures from the primary-secondary leakage `leakage_uh` (referred to the
/// primary): the peak the switch turns off, the clamp's loss, the duty lost while the primary
/// current rises through the leakage, and the duty margin less that duty.
pub fn apply_leakage(c: &mut ConverterEval, build: &Build, leakage_uh: f64) {
    let (Some(op), Some(f_khz)) = (build.operating.as_ref(), build.setup.frequency_khz) else {
        return;
    };
    let f_hz = f_khz * 1e3;
    let l_h = leakage_uh.max(0.0) * 1e-6;
    // Every output's load flows through the primary-secondary leakage at turn-on and off.
    let reflected = c.reflected_a;
    let peak = reflected + c.magnetising_peak_a.unwrap_or(0.0);
    let vin_on = (op.vin_min_v - op.switch_drop_v).max(f64::MIN_POSITIVE);
    let lost = l_h * reflected * f_hz / vin_on;
    c.leakage_ps_uh = Some(leakage_uh);
    c.clamp_peak_a = Some(peak);
    c.clamp_loss_w = Some(0.5 * l_h * peak * peak * f_hz);
    c.duty_lost_to_leakage = Some(lost);
    c.duty_needed_total_at_vin_min += lost;
    c.duty_margin = c.duty_available - c.duty_needed_total_at_vin_min;
}
