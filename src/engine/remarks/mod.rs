//! What the engine remarks on a build: warnings (a code, what they are about, the figures
//! that raised them) and notes (what the figures had to leave out). Both are plain data; the
//! sentence a person reads is rendered from it only when a front end shows it, so that an
//! evaluation nobody reads (the search's candidates) spends nothing on text.

use super::thermal::SURFACE_KS;
use super::validate::Invalid;
use super::warnings::FILL_FACTOR_HAND_LIMIT;
use crate::model::{IsolationClass, Name};
use std::fmt;

mod note;
mod warning_text;

pub use note::Note;

/// What a warning is about, so that every front end can show it next to that thing.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum WarningAt {
    Build,
    Section(usize),
    Winding(usize),
    Converter,
}

#[derive(Debug, Clone, PartialEq)]
pub struct Warning {
    pub at: WarningAt,
    pub kind: WarningKind,
}

impl Warning {
    /// The stable code (see FORMAT.md); the text may improve, the code does not change.
    pub fn code(&self) -> &'static str {
        self.kind.code()
    }

    /// The sentence a person reads.
    pub fn message(&self) -> String {
        self.kind.to_string()
    }
}

/// Each warning the engine gives, with the figures its sentence quotes. Sections are numbered
/// from 0 (`stack #1` is section 0); percentages are fractions.
#[derive(Debug, Clone, PartialEq)]
pub enum WarningKind {
    /// The build is refused by validation; its figures are best effort.
    Invalid(Invalid),
    DoesNotFit {
        height_with_allowance_mm: f64,
        bulge: f64,
        window_height_mm: f64,
        over_mm: f64,
    },
    PastWindow {
        section: usize,
        winding: Name,
    },
    PartialLayer {
        section: usize,
        winding: Name,
        last_layer_turns: u32,
        turns_per_layer: u32,
    },
    MarginCrowded {
        section: usize,
        winding: Name,
        spare_mm: f64,
    },
    FillHigh {
        fill_factor: f64,
    },
    TiwStrands {
        winding: Name,
    },
    ResetBelowController {
        duty_limit: f64,
        reset_duty_limit: f64,
    },
    DutyShort {
        needed: f64,
        available: f64,
    },
    ResetImpossible {
        nr: u32,
        ns: u32,
    },
    ResetSteady {
        ceiling: f64,
        needed: f64,
    },
    ResetStartup,
    /// A further output's turns make a voltage off its target by more than
    /// `engine::outputs::OUTPUT_TOLERANCE_FRACTION`; `step_v` is what one turn moves it.
    OutputOffTarget {
        winding: Name,
        target_v: f64,
        from_turns_v: f64,
        error_fraction: f64,
        step_v: f64,
    },
    Saturation {
        swing_mt: f64,
        headroom_mt: f64,
    },
    CurrentDensity {
        winding: Name,
        density_a_mm2: f64,
        /// The band's ends (A/mm^2), quoted for windings other than a reset winding.
        band: (f64, f64),
        reset: bool,
    },
    TemperatureRise {
        rise_c: f64,
        limit_c: f64,
        loss_w: f64,
        surface_cm2: f64,
    },
    AcBifilarPs {
        primary: Name,
        secondary: Name,
    },
    /// A litz winding's strand is thicker than the skin depth: litz no longer pays.
    LitzStrandThick {
        winding: Name,
        strand_mm: f64,
        skin_depth_mm: f64,
    },
    /// A litz winding's AC factor passes `LITZ_FACTOR_LIMIT`: too many strands for the field.
    LitzTooManyStrands {
        winding: Name,
        strands: u32,
        ac_factor: f64,
    },
    IsolationBifilar {
        class: IsolationClass,
        section: usize,
        a: Name,
        b: Name,
    },
    IsolationWraps {
        class: IsolationClass,
        wraps: u32,
        need: u32,
        inner: (usize, Name),
        outer: (usize, Name),
    },
    IsolationMargin {
        class: IsolationClass,
        margin_mm: f64,
        creepage_mm: f64,
    },
    IsolationCreepageUnset {
        class: IsolationClass,
    },
    HotSpot {
        hot_c: f64,
        ambient_c: f64,
        class_c: f64,
        part: &'static str,
    },
    LayerVoltage {
        section: usize,
        winding: Name,
        volts: f64,
        limit_v: f64,
        layer_tape: u32,
    },
    BifilarVoltage {
        section: usize,
        a: Name,
        b: Name,
        volts: f64,
        limit_v: f64,
    },
    SectionVoltage {
        inner: (usize, Name),
        outer: (usize, Name),
        volts: f64,
        limit_v: f64,
        wraps: u32,
    },
}

impl WarningKind {
    pub fn code(&self) -> &'static str {
        match self {
            WarningKind::Invalid(_) => "invalid",
            WarningKind::DoesNotFit { .. } => "does-not-fit",
            WarningKind::PastWindow { .. } => "past-window",
            WarningKind::PartialLayer { .. } => "partial-layer",
            WarningKind::MarginCrowded { .. } => "margin-crowded",
            WarningKind::FillHigh { .. } => "fill-high",
            WarningKind::TiwStrands { .. } => "tiw-strands",
            WarningKind::ResetBelowController { .. } => "reset-below-controller",
            WarningKind::DutyShort { .. } => "duty-short",
            WarningKind::ResetImpossible { .. } => "reset-impossible",
            WarningKind::ResetSteady { .. } => "reset-steady",
            WarningKind::ResetStartup => "reset-startup",
            WarningKind::OutputOffTarget { .. } => "output-off-target",
            WarningKind::Saturation { .. } => "saturation",
            WarningKind::CurrentDensity { .. } => "current-density",
            WarningKind::TemperatureRise { .. } => "temperature-rise",
            WarningKind::HotSpot { .. } => "hot-spot",
            WarningKind::LayerVoltage { .. } => "layer-voltage",
            WarningKind::BifilarVoltage { .. } => "bifilar-voltage",
            WarningKind::SectionVoltage { .. } => "section-voltage",
            WarningKind::AcBifilarPs { .. } => "ac-bifilar-ps",
            WarningKind::LitzStrandThick { .. } => "litz-strand-thick",
            WarningKind::LitzTooManyStrands { .. } => "litz-too-many-strands",
            WarningKind::IsolationBifilar { .. } => "isolation-bifilar",
            WarningKind::IsolationWraps { .. } => "isolation-wraps",
            WarningKind::IsolationMargin { .. } => "isolation-margin",
            WarningKind::IsolationCreepageUnset { .. } => "isolation-creepage-unset",
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::engine::validate::Place;

    /// One warning of every kind. The match makes adding a kind without a sample here fail
    /// to compile (its arm is missing), and the count below fails if a sample is missing.
    pub(super) fn samples() -> Vec<WarningKind> {
        let n = || Name::from("P");
        let class = IsolationClass::Reinforced;
        vec![
            WarningKind::Invalid(Invalid {
                place: Place::Top("stack"),
                message: "a build needs at least one [[stack]] section".into(),
            }),
            WarningKind::DoesNotFit {
                height_with_allowance_mm: 4.4,
                bulge: 1.1,
                window_height_mm: 4.0,
                over_mm: 0.4,
            },
            WarningKind::PastWindow {
                section: 2,
                winding: n(),
            },
            WarningKind::PartialLayer {
                section: 0,
                winding: n(),
                last_layer_turns: 3,
                turns_per_layer: 21,
            },
            WarningKind::MarginCrowded {
                section: 0,
                winding: n(),
                spare_mm: 0.05,
            },
            WarningKind::FillHigh { fill_factor: 0.5 },
            WarningKind::TiwStrands { winding: n() },
            WarningKind::ResetBelowController {
                duty_limit: 0.6,
                reset_duty_limit: 0.5,
            },
            WarningKind::DutyShort {
                needed: 0.6,
                available: 0.5,
            },
            WarningKind::ResetImpossible { nr: 12, ns: 10 },
            WarningKind::ResetSteady {
                ceiling: 0.4,
                needed: 0.45,
            },
            WarningKind::ResetStartup,
            WarningKind::Saturation {
                swing_mt: 320.0,
                headroom_mt: 280.0,
            },
            WarningKind::CurrentDensity {
                winding: n(),
                density_a_mm2: 7.0,
                band: (3.0, 6.0),
                reset: false,
            },
            WarningKind::TemperatureRise {
                rise_c: 60.0,
                limit_c: 40.0,
                loss_w: 1.66,
                surface_cm2: 19.0,
            },
            WarningKind::AcBifilarPs {
                primary: n(),
                secondary: Name::from("S"),
            },
            WarningKind::IsolationBifilar {
                class,
                section: 1,
                a: n(),
                b: Name::from("S"),
            },
            WarningKind::IsolationWraps {
                class,
                wraps: 1,
                need: 3,
                inner: (0, n()),
                outer: (2, Name::from("S")),
            },
            WarningKind::IsolationMargin {
                class,
                margin_mm: 2.0,
                creepage_mm: 6.0,
            },
            WarningKind::IsolationCreepageUnset { class },
            WarningKind::HotSpot {
                hot_c: 140.0,
                ambient_c: 60.0,
                class_c: 130.0,
                part: "tape",
            },
            WarningKind::LayerVoltage {
                section: 0,
                winding: n(),
                volts: 400.0,
                limit_v: 300.0,
                layer_tape: 0,
            },
            WarningKind::BifilarVoltage {
                section: 0,
                a: n(),
                b: Name::from("R"),
                volts: 750.0,
                limit_v: 300.0,
            },
            WarningKind::SectionVoltage {
                inner: (0, Name::from("R")),
                outer: (2, n()),
                volts: 900.0,
                limit_v: 800.0,
                wraps: 1,
            },
            WarningKind::OutputOffTarget {
                winding: Name::from("S12"),
                target_v: 12.0,
                from_turns_v: 13.05,
                error_fraction: 0.0875,
                step_v: 0.34,
            },
            WarningKind::LitzStrandThick {
                winding: n(),
                strand_mm: 0.3,
                skin_depth_mm: 0.12,
            },
            WarningKind::LitzTooManyStrands {
                winding: n(),
                strands: 400,
                ac_factor: 2.6,
            },
        ]
    }

    fn ordinal(k: &WarningKind) -> usize {
        match k {
            WarningKind::Invalid(_) => 0,
            WarningKind::DoesNotFit { .. } => 1,
            WarningKind::PastWindow { .. } => 2,
            WarningKind::PartialLayer { .. } => 3,
            WarningKind::MarginCrowded { .. } => 4,
            WarningKind::FillHigh { .. } => 5,
            WarningKind::TiwStrands { .. } => 6,
            WarningKind::ResetBelowController { .. } => 7,
            WarningKind::DutyShort { .. } => 8,
            WarningKind::ResetImpossible { .. } => 9,
            WarningKind::ResetSteady { .. } => 10,
            WarningKind::ResetStartup => 11,
            WarningKind::Saturation { .. } => 12,
            WarningKind::CurrentDensity { .. } => 13,
            WarningKind::TemperatureRise { .. } => 14,
            WarningKind::AcBifilarPs { .. } => 15,
            WarningKind::IsolationBifilar { .. } => 16,
            WarningKind::IsolationWraps { .. } => 17,
            WarningKind::IsolationMargin { .. } => 18,
            WarningKind::IsolationCreepageUnset { .. } => 19,
            WarningKind::HotSpot { .. } => 20,
            WarningKind::LayerVoltage { .. } => 21,
            WarningKind::BifilarVoltage { .. } => 22,
            WarningKind::SectionVoltage { .. } => 23,
            WarningKind::OutputOffTarget { .. } => 24,
            WarningKind::LitzStrandThick { .. } => 25,
            WarningKind::LitzTooManyStrands { .. } => 26,
        }
    }
    const KINDS: usize = 27;

    /// Every kind has a sample, a code of its own, a sentence, and a row in FORMAT.md's
    /// table of warning codes (the codes are a stable interface, documented there).
    #[test]
    fn every_warning_code_is_unique_rendered_and_documented() {
        let format = include_str!("../../../FORMAT.md");
        let samples = samples();
        let mut seen: Vec<usize> = samples.iter().map(ordinal).collect();
        seen.sort_unstable();
        assert_eq!(seen, (0..KINDS).collect::<Vec<_>>());
        let mut codes: Vec<&str> = samples.iter().map(WarningKind::code).collect();
        codes.sort_unstable();
        codes.dedup();
        assert_eq!(codes.len(), KINDS);
        for k in &samples {
            let text = k.to_string();
            assert!(
                text.len() > 20 && !text.contains('{'),
                "{}: {text}",
                k.code()
            );
            assert!(
                format.contains(&format!("`{}`", k.code())),
                "{} is not in FORMAT.md",
                k.code()
            );
        }
    }

    /// The sentences quote their figures at the precision a winder reads (the project's own
    /// wording; a regression check of the rendering, no outside source).
    #[test]
    fn sentences_quote_their_figures() {
        let s = samples();
        assert_eq!(
            s[1].to_string(),
            "does not fit: 4.40 mm with the 10 % allowance against a 4.00 mm window, 0.40 mm too tall"
        );
        assert_eq!(
            s[3].to_string(),
            "section 1 (P): the last layer holds 3 of 21 turns, so the section above sits on a step \
             and the finish lead crosses over it (spread the turns across the width, or change the turns)"
        );
        assert_eq!(
            s[17].to_string(),
            "reinforced isolation: 1 wrap(s) of tape between stack #1 (P) and stack #3 (S); the usual \
             layout is at least 3 (or triple-insulated wire on one side)"
        );
        let w = Warning {
            at: WarningAt::Section(0),
            kind: s[3].clone(),
        };
        assert_eq!(w.code(), "partial-layer");
        assert_eq!(w.message(), s[3].to_string());
        let pairs = Note::BifilarPairs(vec![(Name::from("P"), Name::from("R"))]);
        assert!(
            pairs
                .to_string()
                .starts_with("bifilar sections (P with R) share")
        );
        let none = Note::NoCurrent(vec![Name::from("A"), Name::from("B")]);
        assert!(none.to_string().starts_with("no current for A, B: "));
    }
}
