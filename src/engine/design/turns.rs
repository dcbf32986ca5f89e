//! The primary's and the secondaries' whole turns from the flux and the duty.
//!
//! Faraday's law over the longest on-time sets the least primary: the worst case is the
//! highest input held for the controller's whole duty limit (a load step or the start),
//! `B = Vin_max D_max / (f Np Ae)`, which must stay within the material's headroom
//! Bsat - Br (a forward converter's core starts each period from the remanence). The
//! regulated secondary is the least whole number that reaches its output at the lowest input
//! within the duty limit; every further output follows the regulated one's volts per turn.

/// Share of the duty limit the regulated output may need at the lowest input, so the duty
/// lost while the primary current rises through the leakage still fits (the evaluation
/// checks the rest; a design over it is turned down there).
pub const DUTY_SHARE: f64 = 0.95;

/// The least whole primary turns that keep the worst-case swing `vin_max_v x duty_limit /
/// (f Np Ae)` within `headroom_mt` (Bsat - Br).
pub fn least_primary_for_flux(
    vin_max_v: f64,
    duty_limit: f64,
    frequency_hz: f64,
    ae_mm2: f64,
    headroom_mt: f64,
) -> u32 {
    let volt_seconds = vin_max_v * duty_limit / frequency_hz;
    let np = volt_seconds / (ae_mm2 * 1e-6 * headroom_mt * 1e-3);
    // A hair under a whole number is that number: the swing is then at the headroom.
    (np - 1e-9).ceil().max(1.0) as u32
}

/// The least whole secondary turns on `np` primary turns for `vo_v` (output plus rectifier
/// drop) from `vin_on_v` (lowest input less the switch's drop) within `duty` of the period:
/// `Ns >= Np vo / (D vin_on)`.
pub fn secondary_for_duty(np: u32, vo_v: f64, vin_on_v: f64, duty: f64) -> u32 {
    let ns = f64::from(np) * vo_v / (duty * vin_on_v);
    (ns - 1e-9).ceil().max(1.0) as u32
}

/// A further output's whole turns from the regulated one's: `N_reg (V_k + Vd_k) / (V_reg +
/// Vd_reg)`, rounded to the nearest whole turn (at least 1).
pub fn further_output_turns(n_reg: u32, vo_reg_v: f64, vo_k_v: f64) -> u32 {
    (f64::from(n_reg) * vo_k_v / vo_reg_v).round().max(1.0) as u32
}

/// The voltage a further output's turns give: `(V_reg + Vd_reg) N_k / N_reg - Vd_k` (the
/// relation `engine::outputs` reports for a build).
pub fn output_voltage_v(n_reg: u32, vo_reg_v: f64, n_k: u32, drop_k_v: f64) -> f64 {
    vo_reg_v * f64::from(n_k) / f64::from(n_reg) - drop_k_v
}
