//! Design the transformer from its requirements: for each bobbin with core data, the reset
//! turns against the primary's (the two limits the reset ratio sets), the primary from the
//! flux and the balance of core and copper loss, the secondaries from the duty, then the
//! wires, strands and order by the search; the designs that meet every requirement, ranked.
//!
//! Pure: no I/O. `design` is the one entry point (the CLI and the planner call it); it
//! reports progress through a callback and stops early when the cancel flag is set.

mod candidate;
mod rank;
pub mod reset_ratio;
mod spread;
pub mod turns;

pub use candidate::{build_for, winding_names};
pub use rank::{DesignLimit, binding_limit};
pub use reset_ratio::{ResetBind, ResetChoice, ResetNeeds, choose_nr, least_off_state_v};

use super::search::{self, Binding, Settings};
use super::{Constraint, Evaluation, evaluate};
use crate::model::{Bobbin, Build, Name, Requirements};
use std::sync::atomic::AtomicBool;

/// Threads a design uses by default: the two cores of a small desktop machine; one bobbin's
/// search is the unit of work, so more threads than bobbins would only wait.
pub const DESIGN_THREADS: usize = 2;

/// How hard the design looks.
#[derive(Debug, Clone, PartialEq)]
pub struct DesignSettings {
    /// The search each primary's build goes through.
    pub search: Settings,
    /// Primaries weighed per bobbin, from the least the flux allows upward.
    pub primaries_weighed: u32,
    /// Of those, how many (least first-build loss first) go through the search.
    pub primaries_searched: usize,
    /// Threads the bobbins are shared out over (1 or more); the designs and their order
    /// do not depend on it.
    pub threads: usize,
}

impl Default for DesignSettings {
    fn default() -> Self {
        DesignSettings {
            search: Settings {
                max_strands: 2,
                ..Settings::default()
            },
            primaries_weighed: 24,
            primaries_searched: 1,
            threads: DESIGN_THREADS,
        }
    }
}

/// The turns of one design: primary, each output's secondary (regulated first), reset.
#[derive(Debug, Clone, PartialEq)]
pub struct Turns {
    /// Primary turns.
    pub np: u32,
    /// Each output's secondary turns, the regulated output first.
    pub outputs: Vec<u32>,
    /// Reset turns.
    pub nr: u32,
}

/// One output as the turns make it.
#[derive(Debug, Clone, PartialEq)]
pub struct DesignOutput {
    /// The secondary winding that feeds it.
    pub winding: Name,
    /// Its turns.
    pub turns: u32,
    /// Its target voltage (V).
    pub vout_v: f64,
    /// The voltage the turns give (the target itself for the regulated output).
    pub vout_from_turns_v: f64,
}

/// A design that meets every requirement.
#[derive(Debug, Clone, PartialEq)]
pub struct Design {
    /// The bobbin's id.
    pub bobbin: String,
    /// The build this design writes (`--out`).
    pub build: Build,
    /// The build's evaluation, every figure the listing shows.
    pub eval: Evaluation,
    /// The search's words for the wires and the order.
    pub description: String,
    /// The turns chosen.
    pub turns: Turns,
    /// The reset turns and what they give.
    pub reset: ResetChoice,
    /// Each output's voltage as the turns make it, regulated first.
    pub outputs: Vec<DesignOutput>,
    /// Copper plus core loss (W).
    pub total_loss_w: f64,
    /// Window height left over (mm).
    pub spare_height_mm: f64,
    /// The requirement with the least margin left.
    pub binding: DesignLimit,
}

/// Why a bobbin gave no design.
#[derive(Debug, Clone, PartialEq)]
pub enum BobbinVerdict {
    /// The bobbin file has no `[core]`: the flux cannot be known.
    NoCoreData,
    /// No whole number of reset turns meets both limits on any primary weighed.
    NoResetTurns,
    /// The search found nothing: its binding constraint for the least-loss primary.
    Search(Binding),
    /// Builds were found but each breaks a requirement: those of the least-loss one.
    Breaks(Vec<Constraint>),
}

/// Why nothing meets the requirements.
#[derive(Debug, Clone, PartialEq)]
pub enum DesignBinding {
    /// At the duty limit the least off-state voltage is over the derated switch rating.
    SwitchRating {
        /// The controller's duty limit.
        duty_limit: f64,
        /// Highest input (V).
        vin_max_v: f64,
        /// `vin_max / (1 - duty_limit)`: the least off-state voltage that duty allows (V).
        least_v: f64,
        /// The switch's rating (V).
        rating_v: f64,
        /// The share of the rating allowed.
        derating: f64,
        /// `derating x rating` (V).
        allowed_v: f64,
    },
    /// No bobbin to try (the `bobbins` list and the library give none).
    NoBobbins,
    /// Every bobbin tried was turned down, each for its reason (by id).
    Bobbins(Vec<(String, BobbinVerdict)>),
}

/// What `design` found.
#[derive(Debug, Clone, PartialEq)]
pub struct DesignOutcome {
    /// Best first: least total loss, then most spare height.
    pub designs: Vec<Design>,
    /// Why nothing was found, when nothing was.
    pub binding: Option<DesignBinding>,
    /// Bobbins tried (with core data or not).
    pub tried: usize,
    /// The cancel flag stopped the design before every bobbin was tried.
    pub cancelled: bool,
}

/// Design on every bobbin of `bobbins` (id, bobbin), shared out over `settings.threads`.
/// `progress(done, total)` is called after each bobbin; setting `cancel` stops the searches
/// under way within a few milliseconds, and the outcome then holds only the bobbins finished.
pub fn design(
    req: &Requirements,
    bobbins: &[(String, Bobbin)],
    settings: &DesignSettings,
    progress: &(dyn Fn(usize, usize) + Sync),
    cancel: &AtomicBool,
) -> DesignOutcome {
    let needs = reset_needs(req);
    let least_v = least_off_state_v(needs.vin_max_v, needs.duty_limit);
    if least_v > needs.allowed_v {
        return DesignOutcome {
            designs: Vec::new(),
            binding: Some(DesignBinding::SwitchRating {
                duty_limit: needs.duty_limit,
                vin_max_v: needs.vin_max_v,
                least_v,
                rating_v: req.switch.voltage_rating_v,
                derating: req.switch.derating,
                allowed_v: needs.allowed_v,
            }),
            tried: 0,
            cancelled: false,
        };
    }
    let answers = spread::over(
        bobbins,
        settings.threads,
        progress,
        cancel,
        |(id, bobbin)| design_on(req, &needs, id, bobbin, settings, cancel),
    );
    let mut designs = Vec::new();
    let mut verdicts = Vec::new();
    let mut tried = 0;
    for ((id, _), answer) in bobbins.iter().zip(answers) {
        match answer {
            Some(Ok(d)) => designs.push(d),
            Some(Err(v)) => verdicts.push((id.clone(), v)),
            None => continue,
        }
        tried += 1;
    }
    let cancelled = tried < bobbins.len();
    rank::sort(&mut designs);
    let binding = if !designs.is_empty() {
        None
    } else if bobbins.is_empty() {
        Some(DesignBinding::NoBobbins)
    } else {
        Some(DesignBinding::Bobbins(verdicts))
    };
    DesignOutcome {
        designs,
        binding,
        tried,
        cancelled,
    }
}

/// The reset's needs from the requirements.
pub fn reset_needs(req: &Requirements) -> ResetNeeds {
    let op = &req.operating;
    let reg = op.regulated();
    ResetNeeds {
        side: op.reset_side,
        vin_max_v: op.vin_max_v,
        vo_v: reg.vout_v + reg.rectifier_drop_v,
        // The loader requires it; 0.5 would be the usual figure with an equal reset.
        duty_limit: op.duty_limit.unwrap_or(0.5),
        allowed_v: req.switch.allowed_v(),
    }
}

/// The turns for a primary of `np`: the regulated secondary from the duty, each further
/// output from its volts per turn, and the reset from its two limits.
pub fn turns_for(req: &Requirements, needs: &ResetNeeds, np: u32) -> Option<(Turns, ResetChoice)> {
    let op = &req.operating;
    let vin_on = op.vin_min_v - op.switch_drop_v;
    let outs = op.outputs_or_shorthand();
    let vo_reg = outs[0].vout_v + outs[0].rectifier_drop_v;
    let ns = turns::secondary_for_duty(np, vo_reg, vin_on, needs.duty_limit * turns::DUTY_SHARE);
    let mut outputs = vec![ns];
    for o in &outs[1..] {
        outputs.push(turns::further_output_turns(
            ns,
            vo_reg,
            o.vout_v + o.rectifier_drop_v,
        ));
    }
    let duty_needed = f64::from(np) * vo_reg / (f64::from(ns) * vin_on);
    let reset = choose_nr(needs, np, ns, duty_needed)?;
    Some((
        Turns {
            np,
            outputs,
            nr: reset.nr,
        },
        reset,
    ))
}

/// One bobbin's best design, or why it has none; `None` when `cancel` stopped it.
fn design_on(
    req: &Requirements,
    needs: &ResetNeeds,
    id: &str,
    bobbin: &Bobbin,
    settings: &DesignSettings,
    cancel: &AtomicBool,
) -> Option<Result<Design, BobbinVerdict>> {
    let Some(core) = bobbin.core.as_ref() else {
        return Some(Err(BobbinVerdict::NoCoreData));
    };
    let f_hz = req.setup.frequency_khz.unwrap_or(100.0) * 1e3;
    let headroom = req.material.bsat_mt - req.material.br_mt;
    let np0 = turns::least_primary_for_flux(
        needs.vin_max_v,
        needs.duty_limit,
        f_hz,
        core.ae_mm2,
        headroom,
    );
    // Weigh each primary by a first build (wire by current density): core loss falls and
    // copper loss rises with the turns; the least total that fits goes to the search.
    let mut weighed: Vec<(bool, f64, Turns, ResetChoice, Build)> = Vec::new();
    for np in np0..np0.saturating_add(settings.primaries_weighed) {
        let Some((turns, reset)) = turns_for(req, needs, np) else {
            continue;
        };
        let mut build = build_for(req, id, bobbin, &turns);
        let first = evaluate(&build);
        let currents = search::winding_currents(&first);
        candidate::size_wires(&mut build, &currents, first.temperature_c);
        let eval = evaluate(&build);
        weighed.push((eval.fits, search::total_loss_w(&eval), turns, reset, build));
    }
    if weighed.is_empty() {
        return Some(Err(BobbinVerdict::NoResetTurns));
    }
    weighed.sort_by(|a, b| b.0.cmp(&a.0).then(a.1.total_cmp(&b.1)));
    let on = OnBobbin {
        req,
        needs,
        id,
        settings: &settings.search,
        cancel,
    };
    let mut best: Option<Design> = None;
    let mut first_verdict = None;
    for (_, _, turns, reset, build) in weighed.into_iter().take(settings.primaries_searched.max(1))
    {
        match searched(&on, &build, &turns, reset)? {
            Ok(d) => {
                if best.as_ref().is_none_or(|b| rank::better(&d, b)) {
                    best = Some(d);
                }
            }
            Err(v) => {
                first_verdict.get_or_insert(v);
            }
        }
    }
    Some(best.ok_or_else(|| first_verdict.unwrap_or(BobbinVerdict::NoResetTurns)))
}

/// What the searches on one bobbin share: the requirements, the reset's needs, the bobbin's
/// id, the search settings and the cancel flag.
struct OnBobbin<'a> {
    /// The requirements designed for.
    req: &'a Requirements,
    /// The reset's needs from the requirements.
    needs: &'a ResetNeeds,
    /// The bobbin's id, as a design names it.
    id: &'a str,
    /// What each search may try and must meet.
    settings: &'a Settings,
    /// Stops the search under way when set.
    cancel: &'a AtomicBool,
}

/// The search on one primary's build (of `turns`, with the `reset` chosen) on the bobbin
/// `on` describes; its best candidate that meets every requirement. `None` when `cancel`
/// stopped the search.
fn searched(
    on: &OnBobbin,
    build: &Build,
    turns: &Turns,
    reset: ResetChoice,
) -> Option<Result<Design, BobbinVerdict>> {
    let OnBobbin {
        req,
        needs,
        id,
        settings,
        cancel,
    } = *on;
    let outcome = match search::search_cancellable(build, settings, &|_, _| {}, cancel) {
        Ok(o) => o,
        Err(search::SearchError::Cancelled { .. }) => return None,
        Err(_) => return Some(Err(BobbinVerdict::Breaks(Vec::new()))),
    };
    if let Some(b) = outcome.binding {
        return Some(Err(BobbinVerdict::Search(b)));
    }
    let mut broken = None;
    let mut best: Option<Design> = None;
    for c in outcome.candidates {
        let fails = c.eval.failures();
        if !fails.is_empty() {
            broken.get_or_insert(fails);
            continue;
        }
        let d = Design {
            bobbin: id.to_string(),
            total_loss_w: c.objectives.loss_w,
            spare_height_mm: c.eval.spare_height_mm,
            binding: binding_limit(&c.eval, needs.allowed_v),
            outputs: outputs_of(req, &c.build, turns),
            description: c.description,
            turns: turns.clone(),
            reset,
            build: c.build,
            eval: c.eval,
        };
        if best.as_ref().is_none_or(|b| rank::better(&d, b)) {
            best = Some(d);
        }
    }
    // The search's candidates come with their partial last layers already spaced where
    // that is sound (`engine::spacing`), so the design is too.
    Some(best.ok_or_else(|| BobbinVerdict::Breaks(broken.unwrap_or_default())))
}

/// Each output's turns and the voltage they give.
fn outputs_of(req: &Requirements, build: &Build, turns: &Turns) -> Vec<DesignOutput> {
    let (_, names, _) = winding_names(req);
    let outs = req.operating.outputs_or_shorthand();
    let vo_reg = outs[0].vout_v + outs[0].rectifier_drop_v;
    names
        .iter()
        .zip(&outs)
        .zip(&turns.outputs)
        .enumerate()
        .map(|(k, ((name, o), &n))| DesignOutput {
            winding: build
                .winding(name)
                .map_or_else(|| Name::from(name.as_str()), |w| w.name.clone()),
            turns: n,
            vout_v: o.vout_v,
            vout_from_turns_v: if k == 0 {
                o.vout_v
            } else {
                turns::output_voltage_v(turns.outputs[0], vo_reg, n, o.rectifier_drop_v)
            },
        })
        .collect()
}
