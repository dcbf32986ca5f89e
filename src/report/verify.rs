//! The bench readings against the plan in words (`turnstack verify`) and as JSON (the
//! `measured` and `verify` keys of `check --json` and of `verify --json`). Reads
//! `engine::verify`; computes no figure of its own.

use super::sheet::{henries, ohms};
pub use super::verify_findings::finding_words;
use super::wrap;
use crate::engine::Evaluation;
use crate::engine::magnetics::AlSource;
use crate::engine::verify::{
    self, AL_SPREAD, Basis, DCR_TOLERANCE, Finding, LEAKAGE_ABOVE, LEAKAGE_BELOW, Prediction,
    Quantity, RATIO_TURN_FRACTION, ReadingCheck, Verification,
};
use crate::engine::verify_conductor::ImpliedConductor;
use crate::model::{Build, Measured};
use serde::Serialize;
use serde_json::Value;
use std::collections::BTreeMap;
use std::fmt::Write as _;

/// "DC resistance of P", "Ratio S / P", ...
pub fn what(q: &Quantity) -> String {
    match q {
        Quantity::Dcr { winding } => format!("DC resistance of {winding}"),
        Quantity::Magnetising { primary } => format!("Magnetising inductance at {primary}"),
        Quantity::Leakage { primary, secondary } => {
            format!("Leakage inductance at {primary}, {secondary} shorted")
        }
        Quantity::Ratio { winding, primary } => format!("Voltage ratio {winding} / {primary}"),
    }
}

/// A value in the unit of its quantity.
pub fn value(q: &Quantity, x: f64) -> String {
    match q {
        Quantity::Dcr { .. } => ohms(x),
        Quantity::Magnetising { .. } | Quantity::Leakage { .. } => henries(x),
        Quantity::Ratio { .. } => format!("{x:.4}"),
    }
}

/// "+/-10 %" or "-30 % / +50 %", with the band.
pub fn tolerance(p: &Prediction) -> String {
    let pct = match p.basis {
        Basis::LeakageModel => format!(
            "-{:.0} % / +{:.0} %",
            LEAKAGE_BELOW * 100.0,
            LEAKAGE_ABOVE * 100.0
        ),
        _ => {
            let rel = if p.expected > 0.0 {
                (p.high / p.expected - 1.0) * 100.0
            } else {
                0.0
            };
            if rel >= 9.95 {
                format!("+/-{rel:.0} %")
            } else if rel >= 1.0 {
                format!("+/-{rel:.1} %")
            } else {
                format!("+/-{rel:.2} %")
            }
        }
    };
    format!(
        "{pct}: {} to {}",
        value(&p.quantity, p.low),
        value(&p.quantity, p.high)
    )
}

/// Where the tolerance comes from, in one sentence.
pub fn basis_words(b: Basis) -> String {
    match b {
        Basis::WireAndLength => format!(
            "+/-{:.0} %: the copper diameter tolerance of IEC 60317 and the length the layer \
             model estimates (common practice)",
            DCR_TOLERANCE * 100.0
        ),
        Basis::AlSpread(source) => format!(
            "+/-{:.0} %: the usual spread of AL (common practice), AL from {}",
            AL_SPREAD * 100.0,
            match source {
                AlSource::Core => "the bobbin's core figure",
                AlSource::Gapped => "mu_i and the gap (fringing neglected, it adds inductance)",
                AlSource::Ungapped => "mu_i with no gap",
            }
        ),
        Basis::LeakageModel => format!(
            "-{:.0} % / +{:.0} %: a wide band, since the 1-D estimate is rough and leaves out \
             the end turns and the leads",
            LEAKAGE_BELOW * 100.0,
            LEAKAGE_ABOVE * 100.0
        ),
        Basis::FractionOfTurn => format!(
            "{RATIO_TURN_FRACTION} of one turn of the larger winding, so one turn more or \
             less always shows; it needs a meter better than that"
        ),
    }
}

fn result_word(c: &ReadingCheck) -> &'static str {
    match c.within() {
        Some(true) => "within tolerance",
        Some(false) => "OUT OF TOLERANCE",
        None => "not predicted (the plan lacks the core figures)",
    }
}

/// The `verify` report, 80 columns.
pub fn render(build: &Build, v: &Verification) -> String {
    let mut out = String::new();
    let title = if build.title.is_empty() {
        "(untitled build)"
    } else {
        &build.title
    };
    for line in wrap(&format!("Readings against the plan: {title}"), 80, "  ") {
        let _ = writeln!(out, "{line}");
    }
    let _ = writeln!(
        out,
        "Resistances compared at {:.1} C{}.",
        v.reading_c,
        if v.reading_c_assumed {
            " (no reading_c given; the bench default)"
        } else {
            ""
        }
    );
    if let Some(f) = v.frequency_khz {
        let _ = writeln!(out, "Inductances measured at {f} kHz.");
    }
    for c in &v.checks {
        check_lines(&mut out, c);
    }
    let mut bases: Vec<Basis> = Vec::new();
    for p in v.checks.iter().filter_map(|c| c.prediction.as_ref()) {
        if !bases.contains(&p.basis) {
            bases.push(p.basis);
        }
    }
    if !bases.is_empty() {
        let _ = writeln!(out, "\nTolerances:");
        for b in bases {
            for line in wrap(&format!("- {}", basis_words(b)), 78, "  ") {
                let _ = writeln!(out, "  {line}");
            }
        }
    }
    if let Some(h) = &v.hipot {
        out.push('\n');
        for line in wrap(
            &format!(
                "Hipot (recorded, not judged): {h}. The test voltage and time are set by the \
                 applicable standard and local codes; this tool certifies nothing."
            ),
            80,
            "  ",
        ) {
            let _ = writeln!(out, "{line}");
        }
    }
    if let Some(n) = &v.note {
        out.push('\n');
        for line in wrap(&format!("Note: {n}"), 80, "  ") {
            let _ = writeln!(out, "{line}");
        }
    }
    verdict_lines(&mut out, v);
    out
}

/// One reading's lines: measured, expected with its deviation (%), tolerance and findings.
fn check_lines(out: &mut String, c: &ReadingCheck) {
    out.push('\n');
    let _ = writeln!(out, "{}: {}", what(&c.quantity), result_word(c));
    let _ = writeln!(out, "  measured  {}", value(&c.quantity, c.measured));
    if let Some(p) = &c.prediction {
        let dev = c.deviation().map_or(String::new(), |d| match c.quantity {
            Quantity::Ratio { .. } => format!(" ({:+.2} %)", d * 100.0),
            _ => format!(" ({:+.1} %)", d * 100.0),
        });
        let _ = writeln!(out, "  expected  {}{dev}", value(&c.quantity, p.expected));
        let _ = writeln!(out, "  tolerance {}", tolerance(p));
    }
    for f in &c.findings {
        for line in wrap(&format!("- {}", finding_words(f)), 78, "    ") {
            let _ = writeln!(out, "  {line}");
        }
    }
}

/// The closing verdict: how many readings are out of tolerance, and which.
fn verdict_lines(out: &mut String, v: &Verification) {
    out.push('\n');
    let off: Vec<String> = v.out_of_tolerance().map(|c| what(&c.quantity)).collect();
    let verdict = if v.checks.is_empty() {
        "The [measured] table holds no reading to check.".to_string()
    } else if off.is_empty() {
        "Verdict: every reading is within tolerance; the part is as planned.".to_string()
    } else {
        format!(
            "Verdict: {} of {} readings out of tolerance: {}.",
            off.len(),
            v.checks.len(),
            off.join("; ")
        )
    };
    for line in wrap(&verdict, 80, "  ") {
        let _ = writeln!(out, "{line}");
    }
}

#[derive(Serialize)]
struct MeasuredJson {
    #[serde(skip_serializing_if = "Option::is_none")]
    reading_c: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    frequency_khz: Option<f64>,
    dcr_ohm: BTreeMap<String, f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    magnetising_uh: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    leakage_uh: Option<f64>,
    ratio: BTreeMap<String, f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    hipot: Option<String>,
    #[serde(skip_serializing_if = "Option::is_none")]
    note: Option<String>,
}

#[derive(Serialize)]
struct VerifyJson {
    reading_c: f64,
    reading_c_assumed: bool,
    all_within: bool,
    checks: Vec<CheckJson>,
}

#[derive(Serialize)]
struct CheckJson {
    /// `dcr`, `magnetising`, `leakage`, `ratio`.
    kind: &'static str,
    /// The winding read (the first primary for the inductances).
    winding: String,
    /// The other winding involved: the shorted secondary, or the ratio's primary.
    #[serde(skip_serializing_if = "Option::is_none")]
    other: Option<String>,
    unit: &'static str,
    measured: f64,
    expected: Option<f64>,
    low: Option<f64>,
    high: Option<f64>,
    tolerance_basis: Option<&'static str>,
    within: Option<bool>,
    deviation: Option<f64>,
    findings: Vec<FindingJson>,
}

#[derive(Serialize)]
#[serde(tag = "kind", rename_all = "snake_case")]
enum FindingJson {
    GapLarger {
        al_nh: f64,
        mu_e: f64,
        extra_gap_mm: f64,
        total_gap_mm: Option<f64>,
        ungapped: bool,
        words: String,
    },
    AlHigher {
        al_nh: f64,
        mu_e: f64,
        total_gap_mm: Option<f64>,
        words: String,
    },
    TurnsOff {
        winding: String,
        planned: u32,
        likely: u32,
        by: i64,
        words: String,
    },
    RatioUnexplained {
        implied_turns: f64,
        words: String,
    },
    ResistanceOff {
        factor: f64,
        implied_bare_mm: f64,
        likely_wire: Option<String>,
        implied_length_m: f64,
        #[serde(skip_serializing_if = "Option::is_none")]
        implied_foil_mm: Option<f64>,
        #[serde(skip_serializing_if = "Option::is_none")]
        implied_strands: Option<f64>,
        words: String,
    },
    LeakageFactor {
        factor: f64,
        words: String,
    },
}

fn finding_json(f: &Finding) -> FindingJson {
    let words = finding_words(f);
    match f.clone() {
        Finding::GapLarger {
            al_nh,
            mu_e,
            extra_gap_mm,
            total_gap_mm,
            ungapped,
        } => FindingJson::GapLarger {
            al_nh,
            mu_e,
            extra_gap_mm,
            total_gap_mm,
            ungapped,
            words,
        },
        Finding::AlHigher {
            al_nh,
            mu_e,
            total_gap_mm,
            ..
        } => FindingJson::AlHigher {
            al_nh,
            mu_e,
            total_gap_mm,
            words,
        },
        Finding::TurnsOff {
            winding,
            planned,
            likely,
        } => FindingJson::TurnsOff {
            winding: winding.to_string(),
            planned,
            likely,
            by: i64::from(likely) - i64::from(planned),
            words,
        },
        Finding::RatioUnexplained { implied_turns } => FindingJson::RatioUnexplained {
            implied_turns,
            words,
        },
        Finding::ResistanceOff {
            factor,
            implied_bare_mm,
            likely_wire,
            implied_length_m,
            conductor,
            ..
        } => FindingJson::ResistanceOff {
            factor,
            implied_bare_mm,
            likely_wire: likely_wire.and_then(|w| w.key()),
            implied_length_m,
            implied_foil_mm: match conductor {
                Some(ImpliedConductor::FoilThickness { implied_mm, .. }) => Some(implied_mm),
                _ => None,
            },
            implied_strands: match conductor {
                Some(ImpliedConductor::LitzStrands { implied, .. }) => Some(implied),
                _ => None,
            },
            words,
        },
        Finding::LeakageFactor { factor } => FindingJson::LeakageFactor { factor, words },
    }
}

fn check_json(c: &ReadingCheck) -> CheckJson {
    let (kind, winding, other, unit) = match &c.quantity {
        Quantity::Dcr { winding } => ("dcr", winding.to_string(), None, "ohm"),
        Quantity::Magnetising { primary } => ("magnetising", primary.to_string(), None, "uH"),
        Quantity::Leakage { primary, secondary } => (
            "leakage",
            primary.to_string(),
            Some(secondary.to_string()),
            "uH",
        ),
        Quantity::Ratio { winding, primary } => {
            ("ratio", winding.to_string(), Some(primary.to_string()), "")
        }
    };
    let p = c.prediction.as_ref();
    CheckJson {
        kind,
        winding,
        other,
        unit,
        measured: c.measured,
        expected: p.map(|p| p.expected),
        low: p.map(|p| p.low),
        high: p.map(|p| p.high),
        tolerance_basis: p.map(|p| match p.basis {
            Basis::WireAndLength => "iec60317_diameter_and_length",
            Basis::AlSpread(_) => "al_spread",
            Basis::LeakageModel => "leakage_1d_estimate",
            Basis::FractionOfTurn => "fraction_of_one_turn",
        }),
        within: c.within(),
        deviation: c.deviation(),
        findings: c.findings.iter().map(finding_json).collect(),
    }
}

/// The table as the file gave it (JSON key `measured`).
pub fn measured_json(m: &Measured) -> Value {
    let map = |pairs: &[(crate::model::Name, f64)]| {
        pairs
            .iter()
            .map(|(n, x)| (n.to_string(), *x))
            .collect::<BTreeMap<_, _>>()
    };
    serde_json::to_value(MeasuredJson {
        reading_c: m.reading_c,
        frequency_khz: m.frequency_khz,
        dcr_ohm: map(&m.dcr_ohm),
        magnetising_uh: m.magnetising_uh,
        leakage_uh: m.leakage_uh,
        ratio: map(&m.ratio),
        hipot: m.hipot.clone(),
        note: m.note.clone(),
    })
    .unwrap_or(Value::Null)
}

/// Each reading against the plan (JSON key `verify`).
pub fn verify_json(v: &Verification) -> Value {
    serde_json::to_value(VerifyJson {
        reading_c: v.reading_c,
        reading_c_assumed: v.reading_c_assumed,
        all_within: v.all_within(),
        checks: v.checks.iter().map(check_json).collect(),
    })
    .unwrap_or(Value::Null)
}

/// Add `measured` and `verify` to a JSON report when the build has a `[measured]` table;
/// a build without one gets no new key.
pub fn add_json(build: &Build, eval: &Evaluation, out: &mut Value) {
    let (Some(m), Some(v)) = (&build.measured, verify::verify(build, eval)) else {
        return;
    };
    if let Some(obj) = out.as_object_mut() {
        obj.insert("measured".into(), measured_json(m));
        obj.insert("verify".into(), verify_json(&v));
    }
}
