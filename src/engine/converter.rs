//! Single-switch forward converter figures from the operating point: reset duty limit,
//! switch voltage, duty needed, worst-case flux swing (definitions in the format spec).

use crate::model::{Build, ResetSide, Role};

#[derive(Debug, Clone, PartialEq)]
pub struct ConverterEval {
    pub reset_side: ResetSide,
    pub np: u32,
    pub ns: u32,
    pub nr: u32,
    /// Largest duty at which the core fully resets within a period at `vin_max_v`.
    pub reset_duty_limit: f64,
    /// The duty the converter may use: min(duty_limit, reset_duty_limit).
    pub duty_max: f64,
    /// Switch off-state voltage at `vin_max_v` (no leakage spike).
    pub switch_voltage_v: f64,
    /// Duty needed at `vin_min_v`, continuous conduction, ideal switch.
    pub duty_needed_at_vin_min: f64,
    /// Secondary-side reset only: the steady-state duty must stay below `1 - Nr/Ns`.
    pub steady_duty_ceiling: Option<f64>,
    /// `vin_max_v x duty_max / (f Np Ae)`, when the bobbin has core data.
    pub flux_swing_worst_mt: Option<f64>,
    /// `bsat_mt - br_mt`, when the build gives a material.
    pub flux_headroom_mt: Option<f64>,
}

/// `None` when the build has no operating point or lacks what it needs (validation refuses
/// those builds; this keeps `evaluate` total).
pub fn evaluate(build: &Build) -> Option<ConverterEval> {
    let op = build.operating.as_ref()?;
    let np = build.first_of(Role::Primary)?.turns;
    let ns = build.first_of(Role::Secondary)?.turns;
    let nr = build.first_of(Role::Reset)?.turns;
    let f_hz = build.setup.frequency_khz? * 1e3;
    let (npf, nsf, nrf) = (f64::from(np), f64::from(ns), f64::from(nr));
    let vo = op.vout_v + op.rectifier_drop_v;
    let (reset_duty_limit, switch_voltage_v, steady_duty_ceiling) = match op.reset_side {
        ResetSide::Primary => (npf / (npf + nrf), op.vin_max_v * (1.0 + npf / nrf), None),
        ResetSide::Secondary => (
            npf * vo / (npf * vo + nrf * op.vin_max_v),
            op.vin_max_v + vo * npf / nrf,
            Some(1.0 - nrf / nsf),
        ),
    };
    let duty_max = op
        .duty_limit
        .map_or(reset_duty_limit, |d| d.min(reset_duty_limit));
    let flux_swing_worst_mt = build
        .bobbin
        .core
        .as_ref()
        .map(|core| op.vin_max_v * duty_max / (f_hz * npf * core.ae_mm2 * 1e-6) * 1e3);
    Some(ConverterEval {
        reset_side: op.reset_side,
        np,
        ns,
        nr,
        reset_duty_limit,
        duty_max,
        switch_voltage_v,
        duty_needed_at_vin_min: vo * npf / (nsf * op.vin_min_v),
        steady_duty_ceiling,
        flux_swing_worst_mt,
        flux_headroom_mt: build.material.as_ref().map(|m| m.bsat_mt - m.br_mt),
    })
}
