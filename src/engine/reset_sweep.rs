//! The reset ratio's trade-off for a build's primary turns: across a sweep of reset turns,
//! the duty the reset allows against the controller's `duty_limit`, and the switch's
//! off-state voltage against its rating, with the range of reset turns where both hold.
//! Pure; every figure comes from `converter::reset_limits`.

use super::converter::reset_limits;
use crate::model::{Build, ResetSide, Role};

/// Most reset turns the allowed range is looked for up to: far beyond any hand winding.
const NR_SEARCH_MAX: u32 = 1_000_000;

/// What the sweep needs: the converter's side of reset, its inputs and the two limits.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ResetInputs {
    /// Where the reset winding returns the energy.
    pub reset_side: ResetSide,
    /// Highest input (V).
    pub vin_max_v: f64,
    /// `vout_v + rectifier_drop_v` (V).
    pub vo_v: f64,
    /// Primary turns.
    pub np: u32,
    /// Regulated secondary turns.
    pub ns: u32,
    /// The reset turns the build has now.
    pub nr: u32,
    /// The controller's `duty_limit`, when given.
    pub duty_limit: Option<f64>,
    /// The switch's rated off-state voltage, when given.
    pub switch_rating_v: Option<f64>,
    /// The share of the rating the off-state voltage may use (1 for a build: the rating as
    /// given).
    pub derating: f64,
}

/// The two figures at one number of reset turns.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SweepPoint {
    /// Reset turns.
    pub nr: u32,
    /// Largest duty at which the core resets at the highest input.
    pub reset_duty_limit: f64,
    /// Off-state switch voltage at the highest input, no spike (V).
    pub switch_voltage_v: f64,
}

/// Which of the two limits a reset ratio meets with the least room.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum ResetLimit {
    /// The reset duty limit must cover the controller's `duty_limit`.
    Duty,
    /// The off-state voltage must stay within the (derated) switch rating.
    SwitchVoltage,
}

/// The sweep and what it says about the build's reset turns.
#[derive(Debug, Clone, PartialEq)]
pub struct ResetSweep {
    /// What the sweep was worked from.
    pub inputs: ResetInputs,
    /// `rating x derating` (V), when a rating is given.
    pub switch_allowed_v: Option<f64>,
    /// One point per reset-turn step from `Np/4` (at least 1) to `3 Np`, widened to take in
    /// the current Nr; at most about 200 points.
    pub points: Vec<SweepPoint>,
    /// The figures at the current Nr.
    pub current: SweepPoint,
    /// `reset_duty_limit / duty_limit - 1` at the current Nr (negative: not met).
    pub duty_room: Option<f64>,
    /// `1 - switch_voltage_v / switch_allowed_v` at the current Nr (negative: not met).
    pub voltage_room: Option<f64>,
    /// The limit with the least room at the current Nr (`None` when neither is given).
    pub binding: Option<ResetLimit>,
    /// Least and most reset turns meeting both limits (`None` for the most: no upper
    /// bound, no duty limit given); `None` when no whole number of turns meets both.
    pub allowed: Option<(u32, Option<u32>)>,
}

impl ResetInputs {
    /// The build's, when it has an operating point and the three windings; the switch
    /// rating is used as given.
    pub fn of_build(build: &Build) -> Option<ResetInputs> {
        let op = build.operating.as_ref()?;
        let np = build.first_of(Role::Primary)?.turns;
        let ns = build.first_of(Role::Secondary)?.turns;
        let nr = build.first_of(Role::Reset)?.turns;
        (np > 0 && ns > 0 && nr > 0).then_some(ResetInputs {
            reset_side: op.reset_side,
            vin_max_v: op.vin_max_v,
            vo_v: op.vout_v + op.rectifier_drop_v,
            np,
            ns,
            nr,
            duty_limit: op.duty_limit,
            switch_rating_v: op.switch_rating_v,
            derating: 1.0,
        })
    }

    /// The two figures at `nr` reset turns.
    pub fn at(&self, nr: u32) -> SweepPoint {
        let (d, v, _) = reset_limits(
            self.reset_side,
            self.vin_max_v,
            self.vo_v,
            (f64::from(self.np), f64::from(self.ns), f64::from(nr.max(1))),
        );
        SweepPoint {
            nr,
            reset_duty_limit: d,
            switch_voltage_v: v,
        }
    }

    fn duty_ok(&self, nr: u32) -> bool {
        self.duty_limit
            .is_none_or(|d| self.at(nr).reset_duty_limit >= d)
    }

    fn voltage_ok(&self, nr: u32) -> bool {
        self.switch_rating_v
            .is_none_or(|r| self.at(nr).switch_voltage_v <= r * self.derating)
    }
}

/// The first `n` in `lo..=hi` where `pred` holds, for a `pred` false then true.
fn first_true(lo: u32, hi: u32, pred: impl Fn(u32) -> bool) -> Option<u32> {
    if !pred(hi) {
        return None;
    }
    let (mut a, mut b) = (lo, hi);
    while a < b {
        let m = a + (b - a) / 2;
        if pred(m) { b = m } else { a = m + 1 }
    }
    Some(a)
}

/// The sweep of `inputs` (see `ResetSweep`). The reset duty limit falls and the switch
/// voltage falls as Nr rises, so the duty limit bounds Nr from above and the rating from
/// below.
pub fn sweep(inputs: ResetInputs) -> ResetSweep {
    let np = inputs.np.max(1);
    let lo = (np / 4).max(1).min(inputs.nr.max(1));
    let hi = (3 * np).max(inputs.nr);
    let step = ((hi - lo) / 200).max(1);
    let mut points: Vec<SweepPoint> = (lo..=hi)
        .step_by(step as usize)
        .map(|n| inputs.at(n))
        .collect();
    if points.last().is_some_and(|p| p.nr != hi) {
        points.push(inputs.at(hi));
    }
    let current = inputs.at(inputs.nr);
    let switch_allowed_v = inputs.switch_rating_v.map(|r| r * inputs.derating);
    let duty_room = inputs
        .duty_limit
        .map(|d| current.reset_duty_limit / d - 1.0);
    let voltage_room = switch_allowed_v.map(|a| 1.0 - current.switch_voltage_v / a);
    let binding = match (duty_room, voltage_room) {
        (Some(d), Some(v)) if v < d => Some(ResetLimit::SwitchVoltage),
        (Some(_), _) => Some(ResetLimit::Duty),
        (None, Some(_)) => Some(ResetLimit::SwitchVoltage),
        (None, None) => None,
    };
    let low = first_true(1, NR_SEARCH_MAX, |n| inputs.voltage_ok(n));
    let allowed = low.and_then(|low| {
        if !inputs.duty_ok(low) {
            return None;
        }
        let high = inputs.duty_limit.map(|_| {
            first_true(low, NR_SEARCH_MAX, |n| !inputs.duty_ok(n)).map_or(NR_SEARCH_MAX, |n| n - 1)
        });
        Some((low, high))
    });
    ResetSweep {
        inputs,
        switch_allowed_v,
        points,
        current,
        duty_room,
        voltage_room,
        binding,
        allowed,
    }
}

/// The sweep of the build's reset ratio, or `None` without an operating point and the
/// primary, secondary and reset windings.
pub fn reset_sweep(build: &Build) -> Option<ResetSweep> {
    ResetInputs::of_build(build).map(sweep)
}
