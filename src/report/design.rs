//! `turnstack design` in words and as JSON: the ranked designs, and the sentence that says
//! what binds when nothing meets the requirements. Reads the engine's outcome only.

use crate::engine::design::{BobbinVerdict, Design, DesignBinding, DesignOutcome};
use crate::report::search::binding_sentence;
use serde::Serialize;
use std::collections::BTreeMap;
use std::fmt::Write as _;

/// `design --json` (FORMAT.md, "turnstack design").
#[derive(Serialize)]
pub struct DesignOutcomeJson {
    pub designs: Vec<DesignJson>,
    /// Why nothing meets the requirements; `null` when something does.
    pub binding: Option<String>,
}

/// One design, best first.
#[derive(Serialize)]
pub struct DesignJson {
    pub bobbin: String,
    /// Turns by winding name.
    pub turns: BTreeMap<String, u32>,
    /// Nr / Np.
    pub reset_ratio: f64,
    pub reset_duty_limit: f64,
    pub duty_limit: f64,
    pub switch_voltage_v: f64,
    /// `derating x voltage_rating_v`.
    pub switch_allowed_v: f64,
    pub duty_margin: f64,
    pub flux_swing_worst_mt: Option<f64>,
    pub flux_headroom_mt: Option<f64>,
    pub total_loss_w: f64,
    pub temperature_rise_c: Option<f64>,
    pub spare_height_mm: f64,
    /// The requirement with the least margin (a limit key, as `check --json` names them).
    pub binding_limit: String,
    pub binding_margin: f64,
    /// Which of the reset ratio's two limits is nearer its bound.
    pub reset_binds: String,
    pub outputs: Vec<OutputJson>,
    pub description: String,
}

#[derive(Serialize)]
pub struct OutputJson {
    pub winding: String,
    pub turns: u32,
    pub vout_v: f64,
    pub vout_from_turns_v: f64,
}

pub fn json(outcome: &DesignOutcome, allowed_v: f64) -> DesignOutcomeJson {
    DesignOutcomeJson {
        designs: outcome
            .designs
            .iter()
            .map(|d| design_json(d, allowed_v))
            .collect(),
        binding: outcome.binding.as_ref().map(binding_words),
    }
}

fn design_json(d: &Design, allowed_v: f64) -> DesignJson {
    let c = d.eval.converter.as_ref();
    DesignJson {
        bobbin: d.bobbin.clone(),
        turns: d
            .build
            .windings
            .iter()
            .map(|w| (w.name.to_string(), w.turns))
            .collect(),
        reset_ratio: reset_ratio(d),
        reset_duty_limit: c.map_or(d.reset.reset_duty_limit, |c| c.reset_duty_limit),
        duty_limit: d
            .build
            .operating
            .as_ref()
            .and_then(|o| o.duty_limit)
            .unwrap_or(0.0),
        switch_voltage_v: c.map_or(d.reset.switch_voltage_v, |c| c.switch_voltage_v),
        switch_allowed_v: allowed_v,
        duty_margin: c.map_or(0.0, |c| c.duty_margin),
        flux_swing_worst_mt: c.and_then(|c| c.flux_swing_worst_mt),
        flux_headroom_mt: c.and_then(|c| c.flux_headroom_mt),
        total_loss_w: d.total_loss_w,
        temperature_rise_c: d.eval.losses.as_ref().and_then(|l| l.temperature_rise_c),
        spare_height_mm: d.spare_height_mm,
        binding_limit: d.binding.constraint.key().to_string(),
        binding_margin: d.binding.margin,
        reset_binds: d.reset.binds.key().to_string(),
        outputs: d
            .outputs
            .iter()
            .map(|o| OutputJson {
                winding: o.winding.to_string(),
                turns: o.turns,
                vout_v: o.vout_v,
                vout_from_turns_v: o.vout_from_turns_v,
            })
            .collect(),
        description: d.description.clone(),
    }
}

/// A number without needless decimals: 40, 0.8, 2.5.
fn num(x: f64) -> String {
    let s = format!("{x:.3}");
    s.trim_end_matches('0').trim_end_matches('.').to_string()
}

/// The plain sentence naming what binds.
pub fn binding_words(b: &DesignBinding) -> String {
    match b {
        DesignBinding::SwitchRating {
            duty_limit,
            vin_max_v,
            least_v,
            rating_v,
            derating,
            allowed_v,
        } => {
            let times = 1.0 / (1.0 - duty_limit);
            let how = if (times - 2.0).abs() < 1e-9 {
                "twice".to_string()
            } else {
                format!("{} times", num(times))
            };
            format!(
                "the switch rating binds: at a duty limit of {} the off-state voltage is at least {how} the highest input ({} x {} V = {} V), more than the {} V switch allows at {} derating ({} V) by {} V; choose a switch rated at least {} V, or a lower duty limit",
                num(*duty_limit),
                num(times),
                num(*vin_max_v),
                num(*least_v),
                num(*rating_v),
                num(*derating),
                num(*allowed_v),
                num(least_v - allowed_v),
                num((least_v / derating).ceil()),
            )
        }
        DesignBinding::NoBobbins => "no bobbin to try: the library has none with core data".into(),
        DesignBinding::Bobbins(list) => {
            let parts: Vec<String> = list
                .iter()
                .map(|(id, v)| format!("{id}: {}", verdict_words(v)))
                .collect();
            format!(
                "no bobbin holds a design that meets every requirement; {}",
                parts.join("; ")
            )
        }
    }
}

fn verdict_words(v: &BobbinVerdict) -> String {
    match v {
        BobbinVerdict::NoCoreData => "no [core] figures, so the flux cannot be known".into(),
        BobbinVerdict::NoResetTurns => {
            "no whole number of reset turns meets both the duty limit and the switch rating".into()
        }
        BobbinVerdict::Search(b) => binding_sentence(b),
        BobbinVerdict::Breaks(c) if c.is_empty() => "the search could not start".into(),
        BobbinVerdict::Breaks(c) => {
            let keys: Vec<&str> = c.iter().map(|c| c.key()).collect();
            format!("the builds found break {}", keys.join(", "))
        }
    }
}

/// A design's turns in winding order: "24/6/24".
pub fn turns_text(d: &Design) -> String {
    let turns: Vec<String> = d
        .build
        .windings
        .iter()
        .map(|w| w.turns.to_string())
        .collect();
    turns.join("/")
}

/// Nr / Np.
pub fn reset_ratio(d: &Design) -> f64 {
    f64::from(d.turns.nr) / f64::from(d.turns.np)
}

/// The requirement with the least margin and what is left of it: "rise (35 % left)".
pub fn binds_text(d: &Design) -> String {
    format!(
        "{} ({:.0} % left)",
        d.binding.constraint.key(),
        d.binding.margin * 100.0
    )
}

/// The designs as a table, 80 columns, best first; or the binding sentence.
pub fn render(title: &str, outcome: &DesignOutcome) -> String {
    let mut s = String::new();
    let _ = writeln!(
        s,
        "Designs for {}",
        if title.is_empty() {
            "the requirements"
        } else {
            title
        }
    );
    let _ = writeln!(
        s,
        "  {} bobbins tried, {} designs meet every requirement{}",
        outcome.tried,
        outcome.designs.len(),
        if outcome.cancelled {
            " (stopped early)"
        } else {
            ""
        }
    );
    if let Some(b) = &outcome.binding {
        let _ = writeln!(s, "\nNothing meets the requirements.");
        for l in crate::report::wrap(&binding_words(b), 76, "  ") {
            let _ = writeln!(s, "  {l}");
        }
        return s;
    }
    let _ = writeln!(
        s,
        "\n  #  bobbin     turns        Nr/Np  Vsw V  duty+  B mT  loss W  rise C  spare"
    );
    for (i, d) in outcome.designs.iter().enumerate() {
        design_rows(&mut s, i + 1, d);
    }
    let _ = writeln!(
        s,
        "\nduty+: duty margin at the lowest input; B: worst-case flux swing; loss: copper + core."
    );
    let _ = writeln!(
        s,
        "Write one as a build file: turnstack design REQ.toml --out NEW.toml --pick N"
    );
    s
}

/// One design's row of the table (number `n`), and under it the line that names its turns,
/// outputs, what binds and its reset, wrapped.
fn design_rows(s: &mut String, n: usize, d: &Design) {
    let c = d.eval.converter.as_ref();
    let _ = writeln!(
        s,
        "{:>3}  {:<10} {:<12} {:>5.2}  {:>5.1}  {:>5.3}  {:>4.0}  {:>6.3}  {:>6}  {:>5.2}",
        n,
        crate::report::textfmt::truncate(&d.bobbin, 10),
        crate::report::textfmt::truncate(&turns_text(d), 12),
        reset_ratio(d),
        c.map_or(0.0, |c| c.switch_voltage_v),
        c.map_or(0.0, |c| c.duty_margin),
        c.and_then(|c| c.flux_swing_worst_mt).unwrap_or(0.0),
        d.total_loss_w,
        d.eval
            .losses
            .as_ref()
            .and_then(|l| l.temperature_rise_c)
            .map_or("-".to_string(), |r| format!("{r:.1}")),
        d.spare_height_mm,
    );
    let names: Vec<&str> = d.build.windings.iter().map(|w| w.name.as_str()).collect();
    let outs: Vec<String> = d
        .outputs
        .iter()
        .map(|o| {
            format!(
                "{} {} V",
                o.winding,
                num((o.vout_from_turns_v * 100.0).round() / 100.0)
            )
        })
        .collect();
    let line = format!(
        "turns {}; {}; binds: {}; reset: {}; {}",
        names.join("/"),
        outs.join(", "),
        binds_text(d),
        d.reset.binds.key(),
        d.description
    );
    for l in crate::report::wrap(&line, 72, "") {
        let _ = writeln!(s, "     {l}");
    }
}
