//! The winding temperature the resistances are taken at, and the electrical figures at it.

use super::*;
use crate::engine::outputs;

/// What depends on the winding temperature: resistances, AC figures, currents, losses.
pub(super) struct Electrical {
    pub(super) windings: Vec<WindingEval>,
    pub(super) converter: Option<ConverterEval>,
    pub(super) losses: Option<LossEval>,
    pub(super) ac_warnings: Vec<Warning>,
}

/// Where the temperature the resistances are taken at came from.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum TemperatureSource {
    /// `[setup] temperature_c`.
    Given,
    /// Ambient plus the predicted rise, solved to a fixed point.
    AmbientPlusRise,
    /// `[operating] ambient_c`, with no rise to add (no surface area to predict it from).
    Ambient,
    /// The format's default (20 C): neither a temperature nor an operating point to find one.
    Default,
}

impl TemperatureSource {
    /// The words reports and JSON show for it (`given`, `ambient + rise`, ...).
    pub fn key(self) -> &'static str {
        match self {
            TemperatureSource::Given => "given",
            TemperatureSource::AmbientPlusRise => "ambient + rise",
            TemperatureSource::Ambient => "ambient",
            TemperatureSource::Default => "default",
        }
    }
}

/// Stop the fixed point when the temperature moves less than this (C) ...
pub(super) const TEMPERATURE_TOLERANCE_C: f64 = 0.01;
/// ... or after this many rounds (it converges in a handful: the rise grows with the
/// resistance as `(1 + alpha dT)^0.826`, a contraction for any rise a winding survives).
pub(super) const TEMPERATURE_ROUNDS: usize = 30;
/// Above this the copper law and the winding are both past their use; the loop stops there.
pub(super) const TEMPERATURE_CEILING_C: f64 = 250.0;

/// The temperature the resistances are taken at, where it came from, and every figure that
/// depends on it. A given `temperature_c` wins; else ambient + the predicted rise, found by
/// iterating `T = ambient + rise(losses at T)`.
pub(super) fn solve_temperature(
    build: &Build,
    laid: &[Laid],
    wires: &[crate::library::wires::ResolvedWire],
    valid: bool,
    leakage: &[LeakageEval],
    memo: &mut Memo,
) -> (f64, TemperatureSource, Electrical) {
    // The converter, the currents, the windings' cold figures and the core's loss do not
    // depend on the temperature: found once.
    let drive = drive(build, laid, wires, valid, leakage, memo);
    let at = |t: f64, memo: &mut Memo| electrical(build, laid, wires, &drive, t, memo);
    let (t, source, (windings, losses, ac_warnings)) = fixed_point(build, at, memo);
    let electrical = Electrical {
        windings,
        converter: drive.converter,
        losses,
        ac_warnings,
    };
    (t, source, electrical)
}

/// The figures of one temperature: the windings, the losses and the AC warnings.
type AtTemperature = (Vec<WindingEval>, Option<LossEval>, Vec<Warning>);

/// The temperature and where it came from, with the figures `at` gives there (see
/// [`solve_temperature`]).
fn fixed_point(
    build: &Build,
    at: impl Fn(f64, &mut Memo) -> AtTemperature,
    memo: &mut Memo,
) -> (f64, TemperatureSource, AtTemperature) {
    if build.setup.temperature_given || build.operating.is_none() {
        let source = if build.setup.temperature_given {
            TemperatureSource::Given
        } else {
            TemperatureSource::Default
        };
        let t = build.setup.temperature_c;
        return (t, source, at(t, memo));
    }
    let ambient = build
        .operating
        .as_ref()
        .and_then(|o| o.ambient_c)
        .unwrap_or(thermal::DEFAULT_AMBIENT_C);
    // A rise that is not a number (a loss gone non-finite) counts as none.
    let rise = |e: &AtTemperature| {
        e.1.as_ref()
            .and_then(|l| l.temperature_rise_c)
            .filter(|r| r.is_finite())
    };
    let t = ambient;
    let e = at(t, memo);
    if rise(&e).is_none() {
        let given_ambient = build.operating.as_ref().and_then(|o| o.ambient_c);
        return match given_ambient {
            Some(a) => (a, TemperatureSource::Ambient, e),
            None => {
                let t = build.setup.temperature_c;
                (t, TemperatureSource::Default, at(t, memo))
            }
        };
    }
    let (t, e) = ambient_plus_rise(ambient, (t, e), rise, |t| at(t, memo));
    (t, TemperatureSource::AmbientPlusRise, e)
}

/// `T = ambient + rise(T)` solved from the figures `e` of a first round at `t` (FORMAT.md,
/// "Winding temperature"): the plain step, then secant steps, each `T` held between the
/// ambient and the ceiling, until the next plain step would move `T` by less than the
/// tolerance or the rounds run out. `at(T)` gives a round's figures, `rise` reads the rise
/// from them. Returns the last `T` and its figures.
fn ambient_plus_rise<E>(
    ambient: f64,
    (mut t, mut e): (f64, E),
    rise: impl Fn(&E) -> Option<f64>,
    mut at: impl FnMut(f64) -> E,
) -> (f64, E) {
    // The round before: its temperature and how far the rise there moved it.
    let mut before: Option<(f64, f64)> = None;
    for _ in 0..TEMPERATURE_ROUNDS {
        let next = (ambient + rise(&e).unwrap_or(0.0)).min(TEMPERATURE_CEILING_C);
        let moved = next - t;
        if moved.abs() < TEMPERATURE_TOLERANCE_C {
            break;
        }
        let step = before.and_then(|b| secant_step((t, moved), b));
        before = Some((t, moved));
        // Never below the ambient, never past the ceiling.
        t = step.unwrap_or(next).max(ambient).min(TEMPERATURE_CEILING_C);
        e = at(t);
    }
    (t, e)
}

/// Where the line through two rounds `(T, moved)` crosses `moved = 0`: the fixed point to
/// second order, as the rise is nearly straight in `T` over a round's step. `None` where the
/// two rounds do not show a contraction (the slope of `moved` in `T` must lie between -2 and
/// 0, i.e. the rise's between -1 and 1): the plain step is taken then.
fn secant_step((t, moved): (f64, f64), (t_before, moved_before): (f64, f64)) -> Option<f64> {
    let slope = (moved - moved_before) / (t - t_before);
    (slope > -2.0 && slope < 0.0).then(|| t - moved / slope)
}

/// What the operating point drives, whatever the temperature: the converter's figures
/// (with the leakage's toll and the currents' RMS) and each winding's current; with each
/// winding's figures that do not depend on the temperature.
struct Drive {
    converter: Option<ConverterEval>,
    currents: Vec<WindingCurrent>,
    /// Every winding with its wire, length and current, its DC resistance left at zero and
    /// the AC and loss figures unset: what each temperature round starts from.
    windings: Vec<WindingEval>,
    /// The core's loss, the surface and the limits of the losses (with a converter).
    core_and_limits: Option<losses::CoreAndLimits>,
    /// The AC sums' layout (with a frequency).
    ac_plan: Option<super::ac_figures::AcPlan>,
}

/// The [`Drive`] of a build (no converter for one `validate` refuses).
fn drive(
    build: &Build,
    laid: &[Laid],
    wires: &[crate::library::wires::ResolvedWire],
    valid: bool,
    leakage: &[LeakageEval],
    memo: &mut Memo,
) -> Drive {
    // Which winding feeds each output: the converter and the currents both read them.
    let feeds = outputs::resolve(build);
    let mut converter = if valid {
        converter::evaluate(build, &feeds)
    } else {
        None
    };
    if let Some(c) = converter.as_mut()
        && let Some(l) = first_ps_leakage(build, leakage)
    {
        converter::apply_leakage(c, build, l);
    }
    let breadth = layout::usable_width_mm(build);
    if let Some(c) = converter.as_mut()
        && let Some(r) = build.windings.iter().position(|w| w.role == Role::Reset)
    {
        let area = conductor::copper_area_mm2(&build.windings[r], &wires[r], breadth);
        if area > 0.0 {
            c.reset_current_density_a_mm2 = c.reset_rms_a.map(|i| i / area);
        }
    }
    let currents = currents::winding_currents(build, converter.as_ref(), &feeds);
    if let Some(c) = converter.as_mut() {
        // The outputs' figures follow `feeds` one for one (a valid build names each winding
        // once), so each output's winding is its feed's.
        for (o, feed) in c.outputs.iter_mut().zip(&feeds) {
            o.current_rms_a = currents[feed.winding].rms_a;
        }
    }
    let windings = cold_windings(build, laid, wires, &currents);
    let core_and_limits = converter
        .as_ref()
        .map(|c| losses::without_copper(build, c, memo));
    let inputs = super::ac_figures::AcInputs {
        build,
        laid,
        wires,
        currents: &currents,
    };
    let ac_plan = super::ac_figures::AcPlan::of(&inputs, memo);
    Drive {
        converter,
        currents,
        windings,
        core_and_limits,
        ac_plan,
    }
}

/// The figures of [`AtTemperature`] with the windings at `temperature_c`.
fn electrical(
    build: &Build,
    laid: &[Laid],
    wires: &[crate::library::wires::ResolvedWire],
    drive: &Drive,
    temperature_c: f64,
    memo: &mut Memo,
) -> AtTemperature {
    let mut windings = windings_at(build, wires, &drive.windings, temperature_c);
    let mut ac_warnings = Vec::new();
    if let Some(plan) = &drive.ac_plan {
        let inputs = super::ac_figures::AcInputs {
            build,
            laid,
            wires,
            currents: &drive.currents,
        };
        ac_figures(
            plan,
            &inputs,
            temperature_c,
            &mut windings,
            &mut ac_warnings,
            memo,
        );
    }
    for w in windings.iter_mut() {
        let r =
            w.ac.as_ref()
                .map_or(w.dcr_ohm, |a| a.rac_waveform_ohm.unwrap_or(a.rac_ohm));
        w.copper_loss_w = match (w.current_rms_a, w.proximity_loss_w) {
            (Some(i), p) => Some(i * i * r + p.unwrap_or(0.0)),
            (None, p) => p,
        };
    }
    let losses = drive
        .core_and_limits
        .as_ref()
        .map(|fixed| losses::with_copper(fixed, &windings));
    (windings, losses, ac_warnings)
}

/// The `cold` windings of [`Drive::windings`] with their DC resistance at `temperature_c`.
fn windings_at(
    build: &Build,
    wires: &[crate::library::wires::ResolvedWire],
    cold: &[WindingEval],
    temperature_c: f64,
) -> Vec<WindingEval> {
    let breadth = layout::usable_width_mm(build);
    cold.iter()
        .zip(&build.windings)
        .zip(wires)
        .map(|((e, w), wire)| WindingEval {
            dcr_ohm: conductor::ohm_per_m(w, wire, breadth, temperature_c) * e.length_m,
            ..e.clone()
        })
        .collect()
}

/// Every winding with its wire, length and current ([`Drive::windings`]).
fn cold_windings(
    build: &Build,
    laid: &[Laid],
    wires: &[crate::library::wires::ResolvedWire],
    currents: &[WindingCurrent],
) -> Vec<WindingEval> {
    let breadth = layout::usable_width_mm(build);
    build
        .windings
        .iter()
        .zip(wires)
        .zip(currents)
        .enumerate()
        .map(|(i, ((w, wire), c))| {
            let copper_area_mm2 = conductor::copper_area_mm2(w, wire, breadth);
            let length_mm = winding_length_mm(laid, i);
            WindingEval {
                name: w.name.clone(),
                role: w.role,
                turns: w.turns,
                strands: w.strands,
                bare_mm: wire.bare_mm,
                od_mm: wire.od_mm,
                copper_area_mm2,
                length_m: length_mm * MM,
                mlt_mm: if w.turns > 0 {
                    length_mm / f64::from(w.turns)
                } else {
                    0.0
                },
                dcr_ohm: 0.0,
                conductor: conductor::figures(w, wire, breadth),
                ac: None,
                current_density_a_mm2: c
                    .rms_a
                    .filter(|_| copper_area_mm2 > 0.0)
                    .map(|a| a / copper_area_mm2),
                current_rms_a: c.rms_a,
                current_source: c.source,
                current_model_rms_a: c.model_rms_a,
                copper_loss_w: None,
                layer_voltage_v: None,
                proximity_loss_w: None,
            }
        })
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Solve with `rise(T)` as the round's only figure, counting the rounds.
    fn solve(ambient: f64, rise: impl Fn(f64) -> f64) -> (f64, usize) {
        let mut rounds = 1;
        let first = rise(ambient);
        let (t, _) = ambient_plus_rise(
            ambient,
            (ambient, first),
            |r| Some(*r),
            |t| {
                rounds += 1;
                rise(t)
            },
        );
        (t, rounds)
    }

    /// A copper-like rise, `r0 (1 + 0.00393 (T - a))^0.826` (FORMAT.md's power law on a loss
    /// growing as IEC 60028's resistance), solved to 0.01 C of its own fixed point (found
    /// here by bisection) in fewer rounds than plain iteration, counted here, takes.
    #[test]
    fn a_copper_like_rise_is_solved_in_fewer_rounds_than_plain_iteration() {
        let (a, r0) = (40.0, 50.0);
        let rise = |t: f64| r0 * (1.0 + 0.00393 * (t - a)).powf(0.826);
        let (mut lo, mut hi) = (a, 250.0);
        for _ in 0..200 {
            let mid = 0.5 * (lo + hi);
            if a + rise(mid) > mid {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        let (t, rounds) = solve(a, rise);
        assert!((t - lo).abs() < 0.01, "{t} vs {lo}");
        assert!((a + rise(t) - t).abs() < 0.01);
        let (mut plain_t, mut plain_rounds) = (a, 1);
        while (a + rise(plain_t) - plain_t).abs() >= 0.01 {
            plain_t = a + rise(plain_t);
            plain_rounds += 1;
        }
        assert!(
            rounds < plain_rounds,
            "{rounds} rounds, plain {plain_rounds}"
        );
    }

    /// A rise that falls as the winding warms (a slope of -0.5) still converges, between
    /// the ambient and the ceiling; a runaway rise stops at the ceiling.
    #[test]
    fn a_falling_rise_converges_and_a_runaway_one_stops_at_the_ceiling() {
        let a = 40.0;
        // a + 30 - 0.5 (T - a) = T at T = a + 20.
        let (t, _) = solve(a, |t| 30.0 - 0.5 * (t - a));
        assert!((t - (a + 20.0)).abs() < 0.01, "{t}");
        let (t, rounds) = solve(a, |t| 3.0 * (t - a) + 100.0);
        assert_eq!(t, TEMPERATURE_CEILING_C);
        assert!(rounds <= TEMPERATURE_ROUNDS + 1, "{rounds}");
    }

    /// For a rise straight in T, `rise = r0 + k (T - a)`, the fixed point of
    /// `T = a + rise` is `a + r0 / (1 - k)` (solved by hand), and one secant step through any
    /// two rounds lands on it.
    #[test]
    fn a_secant_step_solves_a_straight_rise_at_once() {
        let (a, r0, k) = (40.0, 50.0, 0.07);
        let moved = |t: f64| a + r0 + k * (t - a) - t;
        let exact = a + r0 / (1.0 - k);
        let (t0, t1) = (a, a + r0);
        let step = secant_step((t1, moved(t1)), (t0, moved(t0))).unwrap();
        assert!((step - exact).abs() < 1e-9, "{step} vs {exact}");
    }

    /// Two rounds that do not contract (the rise growing faster than T, or the slope lost
    /// to a repeated T) give no secant step: the plain step is taken.
    #[test]
    fn no_secant_step_without_a_contraction() {
        // moved rises with T: slope +0.5.
        assert_eq!(secant_step((50.0, 5.0), (40.0, 0.0)), None);
        // Slope -3: the rise falls by more than T rises.
        assert_eq!(secant_step((50.0, -25.0), (40.0, 5.0)), None);
        // The same T twice: no slope at all.
        assert_eq!(secant_step((40.0, 1.0), (40.0, 2.0)), None);
    }
}
