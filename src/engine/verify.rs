//! The wound part against its plan: each bench reading of the `[measured]` table beside the
//! figure the plan predicts, with a stated tolerance, and what a reading out of tolerance most
//! likely means, as data (`Finding`) a front end words.
//!
//! Relations used:
//! - Copper resistance against temperature: R(T2) = R(T1) (1 + 0.00393/K (T2 - 20)) /
//!   (1 + 0.00393/K (T1 - 20)), IEC 60028 (`resistance::temperature_ratio`).
//! - The core as a magnetic circuit: L = AL N^2, AL = mu0 Ae / (sum of reluctance lengths), so
//!   a lower AL means an added gap of mu0 Ae (1/AL_measured - 1/AL_planned); mu_e = AL le /
//!   (mu0 Ae) and l_gap ~ le (1/mu_e - 1/mu_i), IEC 60205's effective permeability
//!   (`core_test`).
//! - The open-circuit voltage ratio of two windings on one core is their turns ratio (the
//!   ideal transformer; the primary's share of the leakage and its resistance lower it by far
//!   less than the tolerance below for the meters and parts this tool plans).

use super::Evaluation;
use super::constants::{MM, MM2, MU0_H_PER_M};
use super::magnetics::{self, AlSource};
use super::measured_core as core_test;
use super::resistance::temperature_ratio;
use super::verify_conductor::{ImpliedConductor, implied_conductor};
use crate::library::wires;
use crate::model::{Build, Measured, Name, Role, WireSize};

/// Tolerance on a winding's DC resistance, either way: the copper diameter tolerance of
/// IEC 60317 (about +/-1 % of the nominal diameter for the sizes wound by hand, from memory;
/// so about +/-2 % on the resistance) and the length, which the layer model estimates from the
/// mean turn and which hand winding loosens (the build carries a 10 % allowance on height; the
/// turn length takes most of the rest). Common practice puts the two at about 10 %.
pub const DCR_TOLERANCE: f64 = 0.10;

/// Tolerance on the magnetising inductance, either way: the spread of AL of an ungapped
/// ferrite pair as sold, +/-25 % (common practice; from memory). A gapped pair is held
/// tighter, but the gap relation used here neglects fringing (which adds inductance), so the
/// same band is kept.
pub const AL_SPREAD: f64 = 0.25;

/// The measured leakage may be this much below the 1-D estimate...
pub const LEAKAGE_BELOW: f64 = 0.30;
/// ... or this much above it: the 1-D field leaves out the end turns outside the core and the
/// leads, which only add (a wide band, since the estimate is rough; common practice puts a 1-D
/// estimate within some tens of per cent of a hand-wound part).
pub const LEAKAGE_ABOVE: f64 = 0.50;

/// The ratio's tolerance as a fraction of one turn of the larger of the two windings: one
/// turn more or less on either winding moves the ratio by at least 1/N of the larger winding,
/// 2.5 times this band, so a miscounted turn always shows.
pub const RATIO_TURN_FRACTION: f64 = 0.4;

/// A turns count implied by a ratio is taken as whole when it is this close to one.
pub const WHOLE_TURN_SLACK: f64 = 0.25;

/// A wire size is named as the likely one when the diameter implied by a resistance is
/// within this fraction of it (sizes of a series lie 5 to 12 % apart).
pub const WIRE_MATCH: f64 = 0.03;

/// What a reading is of.
#[derive(Debug, Clone, PartialEq)]
pub enum Quantity {
    /// DC resistance of a winding (ohm).
    Dcr {
        /// The winding measured.
        winding: Name,
    },
    /// Inductance at the first primary, the others open (uH).
    Magnetising {
        /// The first primary, where the meter is.
        primary: Name,
    },
    /// Inductance at the first primary with the first secondary shorted (uH).
    Leakage {
        /// The first primary, where the meter is.
        primary: Name,
        /// The first secondary, shorted.
        secondary: Name,
    },
    /// A winding's open-circuit voltage over the first primary's.
    Ratio {
        /// The winding whose voltage is read.
        winding: Name,
        /// The first primary, driven.
        primary: Name,
    },
}

/// Where a tolerance comes from (the report says it in words).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Basis {
    /// IEC 60317 diameter tolerance and the length estimate; `DCR_TOLERANCE`.
    WireAndLength,
    /// AL's usual spread, `AL_SPREAD`, with where the AL came from.
    AlSpread(AlSource),
    /// The 1-D leakage estimate's band, `LEAKAGE_BELOW` / `LEAKAGE_ABOVE`.
    LeakageModel,
    /// A fraction of one turn, `RATIO_TURN_FRACTION`.
    FractionOfTurn,
}

/// What the plan predicts for one reading, and the band a good part falls in.
#[derive(Debug, Clone, PartialEq)]
pub struct Prediction {
    /// What the reading is of.
    pub quantity: Quantity,
    /// The value the plan predicts (ohm, uH, or a ratio).
    pub expected: f64,
    /// Lowest value a part wound as planned reads.
    pub low: f64,
    /// Highest value a part wound as planned reads.
    pub high: f64,
    /// Where the band comes from.
    pub basis: Basis,
}

impl Prediction {
    /// True when `x` falls within the band (ends included).
    pub fn contains(&self, x: f64) -> bool {
        x >= self.low && x <= self.high
    }
}

/// What a reading out of tolerance (or the leakage, always) most likely means.
#[derive(Debug, Clone, PartialEq)]
pub enum Finding {
    /// Less inductance than planned: the core's path has more gap than the plan says.
    GapLarger {
        /// AL as measured (nH): L / Np^2.
        al_nh: f64,
        /// mu_e = AL le / (mu0 Ae) of the part as measured (IEC 60205).
        mu_e: f64,
        /// Gap added to the planned magnetic circuit: mu0 Ae (1/AL_measured - 1/AL_planned).
        extra_gap_mm: f64,
        /// The whole effective gap le (1/mu_e - 1/mu_i), when the material's mu_i is known.
        total_gap_mm: Option<f64>,
        /// The plan has no gap: the mating faces need cleaning (dust, glue, a burr).
        ungapped: bool,
    },
    /// More inductance than planned: AL is above the figure used (another ferrite, a smaller
    /// gap than stated, or core figures that are off).
    AlHigher {
        /// AL as measured (nH): L / Np^2.
        al_nh: f64,
        /// mu_e = AL le / (mu0 Ae) of the part as measured (IEC 60205).
        mu_e: f64,
        /// The whole effective gap (mm), when the material's mu_i is known.
        total_gap_mm: Option<f64>,
        /// The plan has a gap (so a smaller one explains the reading).
        gapped: bool,
    },
    /// The ratio points at a whole turns count other than the plan's on `winding`.
    TurnsOff {
        /// The winding whose turns are off.
        winding: Name,
        /// Its turns in the plan.
        planned: u32,
        /// The whole turns count the ratio points at.
        likely: u32,
    },
    /// The ratio matches no whole turns count on either winding (meter, wiring, a short).
    RatioUnexplained {
        /// The turns the ratio implies on the winding (not a whole number).
        implied_turns: f64,
    },
    /// The resistance of a winding is off: a wire size or a length.
    ResistanceOff {
        /// Measured over expected, both at the reading temperature.
        factor: f64,
        /// The plan's bare diameter (mm).
        planned_bare_mm: f64,
        /// The diameter that gives the measured resistance over the planned length.
        implied_bare_mm: f64,
        /// A wire size of the plan's series within `WIRE_MATCH` of the implied diameter
        /// (round wire only: foil and litz say what `conductor` holds instead).
        likely_wire: Option<WireSize>,
        /// Foil: the thickness implied; litz: the strands implied; `None` for round wire.
        conductor: Option<ImpliedConductor>,
        /// The plan's wire length of the winding (m).
        planned_length_m: f64,
        /// The length that gives the measured resistance with the planned wire.
        implied_length_m: f64,
    },
    /// Measured over estimated leakage: a correction the user may keep for the next build on
    /// this bobbin with the same arrangement.
    LeakageFactor {
        /// Measured over estimated leakage inductance.
        factor: f64,
    },
}

/// One reading set against its prediction.
#[derive(Debug, Clone, PartialEq)]
pub struct ReadingCheck {
    /// What the reading is of.
    pub quantity: Quantity,
    /// The reading (ohm, uH, or a ratio).
    pub measured: f64,
    /// `None` when the plan cannot predict it (no core figures for an inductance).
    pub prediction: Option<Prediction>,
    /// What the reading most likely means, when it is out (and the leakage correction).
    pub findings: Vec<Finding>,
}

impl ReadingCheck {
    /// `Some(true)` within tolerance, `Some(false)` out, `None` when not predicted.
    pub fn within(&self) -> Option<bool> {
        self.prediction.as_ref().map(|p| p.contains(self.measured))
    }

    /// measured / expected - 1.
    pub fn deviation(&self) -> Option<f64> {
        self.prediction
            .as_ref()
            .filter(|p| p.expected > 0.0)
            .map(|p| self.measured / p.expected - 1.0)
    }
}

/// The `[measured]` table's readings, each against the plan's prediction.
#[derive(Debug, Clone, PartialEq)]
pub struct Verification {
    /// Temperature the resistances are compared at (C).
    pub reading_c: f64,
    /// The table gave no `reading_c`; the bench default was taken.
    pub reading_c_assumed: bool,
    /// The inductance meter's test frequency (kHz), when given.
    pub frequency_khz: Option<f64>,
    /// Every reading: the DCRs, magnetising, leakage, then the ratios.
    pub checks: Vec<ReadingCheck>,
    /// The hipot result as recorded (not judged).
    pub hipot: Option<String>,
    /// The user's note on the readings.
    pub note: Option<String>,
}

impl Verification {
    /// Every predicted reading within its tolerance.
    pub fn all_within(&self) -> bool {
        self.checks.iter().all(|c| c.within() != Some(false))
    }

    /// The readings out of their tolerance.
    pub fn out_of_tolerance(&self) -> impl Iterator<Item = &ReadingCheck> {
        self.checks.iter().filter(|c| c.within() == Some(false))
    }
}

/// Every reading the plan can predict, resistances at `at_c`: each winding's DC resistance,
/// the magnetising inductance (with core figures), the leakage of the first primary to the
/// first secondary, and each other winding's ratio to the first primary.
pub fn predictions(build: &Build, eval: &Evaluation, at_c: f64) -> Vec<Prediction> {
    let mut out = Vec::new();
    let t_ratio = temperature_ratio(eval.temperature_c, at_c);
    for e in &eval.windings {
        let r = e.dcr_ohm * t_ratio;
        out.push(Prediction {
            quantity: Quantity::Dcr {
                winding: e.name.clone(),
            },
            expected: r,
            low: r * (1.0 - DCR_TOLERANCE),
            high: r * (1.0 + DCR_TOLERANCE),
            basis: Basis::WireAndLength,
        });
    }
    let primary = build.first_of(Role::Primary);
    if let Some(p) = primary
        && let Some((l, source)) = magnetising_uh(build, p.turns)
    {
        out.push(Prediction {
            quantity: Quantity::Magnetising {
                primary: p.name.clone(),
            },
            expected: l,
            low: l * (1.0 - AL_SPREAD),
            high: l * (1.0 + AL_SPREAD),
            basis: Basis::AlSpread(source),
        });
    }
    if let (Some(p), Some(s)) = (primary, build.first_of(Role::Secondary))
        && let Some(l) = eval
            .leakage
            .iter()
            .find(|l| l.from == p.name && l.to == s.name)
    {
        out.push(Prediction {
            quantity: Quantity::Leakage {
                primary: p.name.clone(),
                secondary: s.name.clone(),
            },
            expected: l.uh,
            low: l.uh * (1.0 - LEAKAGE_BELOW),
            high: l.uh * (1.0 + LEAKAGE_ABOVE),
            basis: Basis::LeakageModel,
        });
    }
    if let Some(p) = primary.filter(|p| p.turns > 0) {
        for w in build.windings.iter().filter(|w| w.name != p.name) {
            let r = f64::from(w.turns) / f64::from(p.turns);
            let band = ratio_tolerance(p.turns, w.turns);
            out.push(Prediction {
                quantity: Quantity::Ratio {
                    winding: w.name.clone(),
                    primary: p.name.clone(),
                },
                expected: r,
                low: r * (1.0 - band),
                high: r * (1.0 + band),
                basis: Basis::FractionOfTurn,
            });
        }
    }
    out
}

/// The ratio's relative tolerance: `RATIO_TURN_FRACTION` of one turn of the larger winding.
pub fn ratio_tolerance(primary_turns: u32, winding_turns: u32) -> f64 {
    RATIO_TURN_FRACTION / f64::from(primary_turns.max(winding_turns).max(1))
}

/// L = AL Np^2 (uH) with the AL the plan uses, and where that AL came from.
pub fn magnetising_uh(build: &Build, turns: u32) -> Option<(f64, AlSource)> {
    let core = build.bobbin.core.as_ref()?;
    let (al, source) = magnetics::al_nh(core, build.material.as_ref())?;
    (al > 0.0).then(|| (core_test::inductance_uh(al, turns), source))
}

/// The readings of the build's `[measured]` table against the plan; `None` without a table.
pub fn verify(build: &Build, eval: &Evaluation) -> Option<Verification> {
    let m = build.measured.as_ref()?;
    let at_c = m.reading_temperature_c();
    let preds = predictions(build, eval, at_c);
    let find = |q: &Quantity| preds.iter().find(|p| p.quantity == *q).cloned();
    let mut checks = Vec::new();
    dcr_checks(build, eval, m, &find, &mut checks);
    let primary = build.first_of(Role::Primary);
    if let (Some(l), Some(p)) = (m.magnetising_uh, primary) {
        let quantity = Quantity::Magnetising {
            primary: p.name.clone(),
        };
        let prediction = find(&quantity);
        let mut findings = Vec::new();
        if let Some(pr) = &prediction
            && !pr.contains(l)
            && let Some(f) = gap_finding(build, p.turns, l, pr.expected)
        {
            findings.push(f);
        }
        checks.push(ReadingCheck {
            quantity,
            measured: l,
            prediction,
            findings,
        });
    }
    if let (Some(l), Some(p), Some(s)) = (m.leakage_uh, primary, build.first_of(Role::Secondary)) {
        let quantity = Quantity::Leakage {
            primary: p.name.clone(),
            secondary: s.name.clone(),
        };
        let prediction = find(&quantity);
        let findings = prediction
            .as_ref()
            .filter(|pr| pr.expected > 0.0)
            .map(|pr| Finding::LeakageFactor {
                factor: l / pr.expected,
            })
            .into_iter()
            .collect();
        checks.push(ReadingCheck {
            quantity,
            measured: l,
            prediction,
            findings,
        });
    }
    if let Some(p) = primary {
        for (name, r) in &m.ratio {
            let quantity = Quantity::Ratio {
                winding: name.clone(),
                primary: p.name.clone(),
            };
            let prediction = find(&quantity);
            let mut findings = Vec::new();
            if let (Some(pr), Some(w)) = (&prediction, build.winding(name))
                && !pr.contains(*r)
            {
                findings.push(turns_finding(&p.name, p.turns, name, w.turns, *r));
            }
            checks.push(ReadingCheck {
                quantity,
                measured: *r,
                prediction,
                findings,
            });
        }
    }
    Some(Verification {
        reading_c: at_c,
        reading_c_assumed: m.reading_c.is_none(),
        frequency_khz: m.frequency_khz,
        checks,
        hipot: m.hipot.clone(),
        note: m.note.clone(),
    })
}

/// Each DCR reading (ohm) against its prediction; one off its tolerance says what bare
/// diameter (mm) or length (m) of wire would read so.
fn dcr_checks(
    build: &Build,
    eval: &Evaluation,
    m: &Measured,
    find: &dyn Fn(&Quantity) -> Option<Prediction>,
    checks: &mut Vec<ReadingCheck>,
) {
    for (name, r) in &m.dcr_ohm {
        let quantity = Quantity::Dcr {
            winding: name.clone(),
        };
        let prediction = find(&quantity);
        let mut findings = Vec::new();
        if let (Some(p), Some(e)) = (&prediction, eval.windings.iter().find(|e| e.name == *name))
            && !p.contains(*r)
            && p.expected > 0.0
        {
            let factor = r / p.expected;
            let implied_bare_mm = e.bare_mm / factor.sqrt();
            let conductor = implied_conductor(&e.conductor, factor);
            // A foil or a bundle has no round size to be mistaken for.
            let size = build
                .winding(name)
                .map(|w| w.wire)
                .filter(|_| conductor.is_none());
            findings.push(Finding::ResistanceOff {
                factor,
                planned_bare_mm: e.bare_mm,
                implied_bare_mm,
                likely_wire: size.and_then(|s| likely_wire(s, e.bare_mm, implied_bare_mm)),
                conductor,
                planned_length_m: e.length_m,
                implied_length_m: e.length_m * factor,
            });
        }
        checks.push(ReadingCheck {
            quantity,
            measured: *r,
            prediction,
            findings,
        });
    }
}

/// What a magnetising inductance `measured_uh` off its prediction says of the core's gap.
pub fn gap_finding(
    build: &Build,
    primary_turns: u32,
    measured_uh: f64,
    expected_uh: f64,
) -> Option<Finding> {
    let core = build.bobbin.core.as_ref()?;
    if primary_turns == 0 || measured_uh <= 0.0 || expected_uh <= 0.0 {
        return None;
    }
    let al_nh = core_test::al_nh(measured_uh, primary_turns);
    let al_plan_nh = core_test::al_nh(expected_uh, primary_turns);
    let mu_e = core_test::mu_e(al_nh, core.le_mm, core.ae_mm2);
    let mu_i = build.material.as_ref().and_then(|m| m.mu_i);
    let total_gap_mm = mu_i.map(|mu| core_test::equivalent_gap_mm(mu_e, mu, core.le_mm));
    let gapped = build
        .material
        .as_ref()
        .and_then(|m| m.gap_mm)
        .is_some_and(|g| g > 0.0);
    Some(if measured_uh < expected_uh {
        Finding::GapLarger {
            al_nh,
            mu_e,
            extra_gap_mm: extra_gap_mm(core.ae_mm2, al_nh, al_plan_nh),
            total_gap_mm,
            ungapped: !gapped,
        }
    } else {
        Finding::AlHigher {
            al_nh,
            mu_e,
            total_gap_mm,
            gapped,
        }
    })
}

/// The gap (mm) that, put in series with a magnetic circuit of factor `al_plan_nh`, brings it
/// down to `al_nh`: the reluctances add, R = 1/AL, and a gap of length g over the area Ae is
/// g / (mu0 Ae), so g = mu0 Ae (1/AL - 1/AL_plan). Fringing neglected.
pub fn extra_gap_mm(ae_mm2: f64, al_nh: f64, al_plan_nh: f64) -> f64 {
    MU0_H_PER_M * ae_mm2 * MM2 * (1.0 / (al_nh * 1e-9) - 1.0 / (al_plan_nh * 1e-9)) / MM
}

/// Which winding's turns a ratio out of tolerance points at: the winding's own count first
/// (`ratio x Np`), then the primary's (`Nw / ratio`), when either lands near a whole number
/// other than the plan's.
pub fn turns_finding(
    primary: &Name,
    primary_turns: u32,
    winding: &Name,
    winding_turns: u32,
    ratio: f64,
) -> Finding {
    let near_whole = |x: f64, planned: u32| {
        let n = x.round();
        ((x - n).abs() <= WHOLE_TURN_SLACK && n >= 1.0 && n != f64::from(planned))
            .then_some(n as u32)
    };
    let implied_w = ratio * f64::from(primary_turns);
    if let Some(likely) = near_whole(implied_w, winding_turns) {
        return Finding::TurnsOff {
            winding: winding.clone(),
            planned: winding_turns,
            likely,
        };
    }
    if ratio > 0.0
        && let Some(likely) = near_whole(f64::from(winding_turns) / ratio, primary_turns)
    {
        return Finding::TurnsOff {
            winding: primary.clone(),
            planned: primary_turns,
            likely,
        };
    }
    Finding::RatioUnexplained {
        implied_turns: implied_w,
    }
}

/// A size of the planned wire's series whose bare diameter lies within `WIRE_MATCH` of
/// `implied_mm`, other than the planned one.
fn likely_wire(planned: WireSize, planned_mm: f64, implied_mm: f64) -> Option<WireSize> {
    let candidates: Vec<(WireSize, f64)> = match planned {
        WireSize::Awg(_) => wires::AWG_RANGE
            .map(|g| (WireSize::Awg(g), wires::awg_bare_mm(g)))
            .collect(),
        _ => wires::metric_rows()
            .iter()
            .map(|r| {
                (
                    WireSize::Metric {
                        bare_mm: r.nominal_mm,
                    },
                    r.nominal_mm,
                )
            })
            .collect(),
    };
    candidates
        .into_iter()
        .filter(|(_, d)| (d / planned_mm - 1.0).abs() > WIRE_MATCH)
        .map(|(s, d)| (s, (d / implied_mm - 1.0).abs()))
        .filter(|(_, off)| *off <= WIRE_MATCH)
        .min_by(|a, b| a.1.total_cmp(&b.1))
        .map(|(s, _)| s)
}
