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
    /// The build as a whole.
    Build,
    /// A section of the stack (0-based index).
    Section(usize),
    /// A winding (index into `build.windings`).
    Winding(usize),
    /// The converter's figures.
    Converter,
}

/// A warning: where the fronts show it and what it is, with its figures.
#[derive(Debug, Clone, PartialEq)]
pub struct Warning {
    /// What it is about.
    pub at: WarningAt,
    /// Which warning, with the figures its sentence quotes.
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
    /// The height with allowance is above the window height.
    DoesNotFit {
        /// Build height times the allowance (mm).
        height_with_allowance_mm: f64,
        /// The allowance factor.
        allowance_factor: f64,
        /// The window height (mm).
        window_height_mm: f64,
        /// How much too high (mm).
        over_mm: f64,
    },
    /// A section lies (partly) beyond the window height.
    PastWindow {
        /// The section.
        section: usize,
        /// Its winding.
        winding: Name,
    },
    /// A section's last layer is not full: the section above sits on a step.
    PartialLayer {
        /// The section.
        section: usize,
        /// Its winding.
        winding: Name,
        /// Turns in its last layer.
        last_layer_turns: u32,
        /// Turns a full layer holds.
        turns_per_layer: u32,
    },
    /// A full layer leaves too little room to the margin tape; its end turns climb onto it.
    MarginCrowded {
        /// The section.
        section: usize,
        /// Its winding.
        winding: Name,
        /// Width left over in a full layer (mm).
        spare_mm: f64,
    },
    /// The fill factor is above what hand winding reaches (`FILL_FACTOR_HAND_LIMIT`).
    FillHigh {
        /// The build's fill factor.
        fill_factor: f64,
    },
    /// Triple-insulated wire in parallel strands: unusual; the pitch wants checking.
    TiwStrands {
        /// The winding.
        winding: Name,
    },
    /// The controller's duty limit is above the reset limit: a transient can saturate the core.
    ResetBelowController {
        /// The controller's maximum duty.
        duty_limit: f64,
        /// The largest duty at which the core still resets.
        reset_duty_limit: f64,
    },
    /// The duty needed at the lowest input is above the duty available.
    DutyShort {
        /// Duty needed at `vin_min_v`.
        needed: f64,
        /// Duty the converter may use.
        available: f64,
    },
    /// Secondary-side reset with reset turns not fewer than the secondary's: the core never resets.
    ResetImpossible {
        /// Reset turns.
        nr: u32,
        /// Secondary turns.
        ns: u32,
    },
    /// Secondary-side reset: the duty needed is above the steady-state ceiling `1 - Nr/Ns`.
    ResetSteady {
        /// The steady-state duty ceiling.
        ceiling: f64,
        /// Duty needed at `vin_min_v`.
        needed: f64,
    },
    /// Secondary-side reset: at start-up, with the output low, the core does not reset.
    ResetStartup,
    /// A further output's turns make a voltage off its target by more than
    /// `engine::outputs::OUTPUT_TOLERANCE_FRACTION`; `step_v` is what one turn moves it.
    OutputOffTarget {
        /// The output's winding.
        winding: Name,
        /// Target voltage (V).
        target_v: f64,
        /// The voltage its turns make (V).
        from_turns_v: f64,
        /// `(from_turns_v - target_v) / target_v`.
        error_fraction: f64,
        /// What one turn moves the voltage (V).
        step_v: f64,
    },
    /// The worst-case flux swing is above the headroom `Bsat - Br`.
    Saturation {
        /// Worst-case flux swing (mT).
        swing_mt: f64,
        /// Headroom to saturation (mT).
        headroom_mt: f64,
    },
    /// A winding's current density is above the band.
    CurrentDensity {
        /// The winding.
        winding: Name,
        /// Its current density (A/mm^2 RMS).
        density_a_mm2: f64,
        /// The band's ends (A/mm^2), quoted for windings other than a reset winding.
        band: (f64, f64),
        /// It is a reset winding (thin by design, carrying the magnetising current: the band is not
        /// quoted).
        reset: bool,
    },
    /// The temperature rise is above the limit.
    TemperatureRise {
        /// The predicted rise (C).
        rise_c: f64,
        /// The rise allowed (C).
        limit_c: f64,
        /// The total loss that makes it (W).
        loss_w: f64,
        /// The surface it leaves by (cm2).
        surface_cm2: f64,
    },
    /// Primary and secondary wound bifilar: the layer model gives them no AC figures, so their
    /// copper loss is taken at DC resistance.
    AcBifilarPs {
        /// The primary.
        primary: Name,
        /// The secondary.
        secondary: Name,
    },
    /// A litz winding's strand is thicker than the skin depth: litz no longer pays.
    LitzStrandThick {
        /// The litz winding.
        winding: Name,
        /// Strand bare diameter (mm).
        strand_mm: f64,
        /// Skin depth at the frequency (mm).
        skin_depth_mm: f64,
    },
    /// A litz winding's AC factor passes `LITZ_FACTOR_LIMIT`: too many strands for the field.
    LitzTooManyStrands {
        /// The litz winding.
        winding: Name,
        /// Strands in the bundle.
        strands: u32,
        /// The litz AC factor it reaches.
        ac_factor: f64,
    },
    /// A section winds a primary-side and a secondary-side winding together: no barrier.
    IsolationBifilar {
        /// The declared class.
        class: IsolationClass,
        /// The section.
        section: usize,
        /// One winding.
        a: Name,
        /// The other.
        b: Name,
    },
    /// Fewer wraps of tape between the two sides than the class asks.
    IsolationWraps {
        /// The declared class.
        class: IsolationClass,
        /// Wraps between the two sections.
        wraps: u32,
        /// Wraps the class asks for.
        need: u32,
        /// The inner section and its winding.
        inner: (usize, Name),
        /// The outer section and its winding.
        outer: (usize, Name),
    },
    /// The margin tape is narrower than half the creepage distance.
    IsolationMargin {
        /// The declared class.
        class: IsolationClass,
        /// The margin at each flange (mm).
        margin_mm: f64,
        /// The creepage distance declared (mm).
        creepage_mm: f64,
    },
    /// An isolation class is declared without a creepage distance to check the margins by.
    IsolationCreepageUnset {
        /// The declared class.
        class: IsolationClass,
    },
    /// The hot spot (ambient + rise) is above the lowest thermal class of the insulation.
    HotSpot {
        /// The hot-spot temperature (C).
        hot_c: f64,
        /// The ambient (C).
        ambient_c: f64,
        /// The lowest class (C).
        class_c: f64,
        /// Whose class it is (`wire`, `tape`, `bobbin`).
        part: &'static str,
    },
    /// The voltage between two layers is above what their films and layer tape stand.
    LayerVoltage {
        /// The section.
        section: usize,
        /// Its winding.
        winding: Name,
        /// The voltage (V).
        volts: f64,
        /// What the films and tape stand (V).
        limit_v: f64,
        /// Wraps of layer tape.
        layer_tape: u32,
    },
    /// The voltage between the wires of a bifilar pair is above what their films stand.
    BifilarVoltage {
        /// The section.
        section: usize,
        /// One winding.
        a: Name,
        /// The other.
        b: Name,
        /// The voltage (V).
        volts: f64,
        /// What the two films stand (V).
        limit_v: f64,
    },
    /// The voltage between two sections on one side is above what films and tape stand.
    SectionVoltage {
        /// The inner section and its winding.
        inner: (usize, Name),
        /// The outer section and its winding.
        outer: (usize, Name),
        /// The voltage (V).
        volts: f64,
        /// What the films and tape stand (V).
        limit_v: f64,
        /// Wraps of tape between them.
        wraps: u32,
    },
}

impl WarningKind {
    /// The stable code of the warning (FORMAT.md's table).
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
                allowance_factor: 1.1,
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
             and the finish lead crosses over it (space its turns across the width: spread = true \
             on the section; or change the turns)"
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
