//! The reset winding's turns against the primary's: the two limits the reset ratio sets.
//!
//! More reset turns (a smaller Np/Nr) lower the off-state voltage on the switch but lengthen
//! the reset, so the core resets only at a lower duty; fewer reset turns the other way. The
//! reset duty limit must cover the controller's duty limit (else a load step or the start
//! walks the core into saturation) and the off-state voltage must stay within the derated
//! switch rating. Both forms of reset (to the input, to the output) come from
//! `converter::reset_limits`, the one definition of those figures.

use crate::engine::converter::reset_limits;
use crate::model::ResetSide;

/// Which of the reset ratio's two limits is nearer its bound.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum ResetBind {
    /// The reset duty limit against the controller's duty limit.
    ResetDuty,
    /// The off-state switch voltage against the derated rating.
    SwitchVoltage,
}

impl ResetBind {
    /// A stable key for JSON and tests.
    pub fn key(self) -> &'static str {
        match self {
            ResetBind::ResetDuty => "reset-duty",
            ResetBind::SwitchVoltage => "switch-voltage",
        }
    }
}

/// The reset turns chosen for a primary, with the figures they give.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ResetChoice {
    /// Reset turns.
    pub nr: u32,
    /// Largest duty at which the core resets at the highest input.
    pub reset_duty_limit: f64,
    /// Off-state switch voltage at the highest input, no spike (V).
    pub switch_voltage_v: f64,
    /// `(reset_duty_limit - duty_limit) / duty_limit`.
    pub duty_headroom: f64,
    /// `(allowed_v - switch_voltage_v) / allowed_v`.
    pub voltage_headroom: f64,
    /// Which of the two limits is nearer its bound.
    pub binds: ResetBind,
}

/// What the reset must satisfy.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ResetNeeds {
    /// Where the reset winding returns the energy.
    pub side: ResetSide,
    /// Highest input (V).
    pub vin_max_v: f64,
    /// The regulated output plus its rectifier drop (V), for reset to the output.
    pub vo_v: f64,
    /// The controller's duty limit.
    pub duty_limit: f64,
    /// `derating x voltage_rating_v` (V).
    pub allowed_v: f64,
}

/// The least off-state voltage any reset ratio can give while the core still resets at
/// `duty_limit`: `vin_max / (1 - D)` for both forms of reset (the reset's volt-seconds
/// `vin_max D` must fit in `1 - D` of the period, on top of the input or of the output
/// reflected so that the sum is the same). At D = 0.5 it is twice the highest input.
pub fn least_off_state_v(vin_max_v: f64, duty_limit: f64) -> f64 {
    vin_max_v / (1.0 - duty_limit)
}

/// The figures of `nr` reset turns on `np` primary turns (and `ns` on the regulated
/// secondary, for the secondary-side ceiling), or `None` when they break a limit.
pub fn try_nr(
    needs: &ResetNeeds,
    np: u32,
    ns: u32,
    nr: u32,
    duty_needed: f64,
) -> Option<ResetChoice> {
    let (dl, v, ceiling) = reset_limits(
        needs.side,
        needs.vin_max_v,
        needs.vo_v,
        (f64::from(np), f64::from(ns), f64::from(nr)),
    );
    let ceiling_ok = ceiling.is_none_or(|c| c >= duty_needed);
    if dl + 1e-12 < needs.duty_limit || v > needs.allowed_v + 1e-9 || !ceiling_ok {
        return None;
    }
    let duty_headroom = (dl - needs.duty_limit) / needs.duty_limit;
    let voltage_headroom = (needs.allowed_v - v) / needs.allowed_v;
    Some(ResetChoice {
        nr,
        reset_duty_limit: dl,
        switch_voltage_v: v,
        duty_headroom,
        voltage_headroom,
        binds: if duty_headroom <= voltage_headroom {
            ResetBind::ResetDuty
        } else {
            ResetBind::SwitchVoltage
        },
    })
}

/// The reset turns for `np`: equal to the primary's when both limits allow it (the reset can
/// then be wound bifilar with the primary, common practice), else the whole number of turns
/// nearest Np that meets both. `None` when no whole number does.
pub fn choose_nr(needs: &ResetNeeds, np: u32, ns: u32, duty_needed: f64) -> Option<ResetChoice> {
    if let Some(c) = try_nr(needs, np, ns, np, duty_needed) {
        return Some(c);
    }
    let most = np.saturating_mul(4).max(8);
    (1..=most)
        .filter_map(|nr| try_nr(needs, np, ns, nr, duty_needed))
        .min_by_key(|c| (c.nr.abs_diff(np), c.nr))
}
