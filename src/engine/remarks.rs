//! What the engine remarks on a build: warnings (a code, what they are about, the figures
//! that raised them) and notes (what the figures had to leave out). Both are plain data; the
//! sentence a person reads is rendered from it only when a front end shows it, so that an
//! evaluation nobody reads (the search's candidates) spends nothing on text.

use super::thermal::SURFACE_KS;
use super::validate::Invalid;
use super::warnings::FILL_FACTOR_HAND_LIMIT;
use crate::model::{IsolationClass, Name};
use std::fmt;

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
            WarningKind::Saturation { .. } => "saturation",
            WarningKind::CurrentDensity { .. } => "current-density",
            WarningKind::TemperatureRise { .. } => "temperature-rise",
            WarningKind::HotSpot { .. } => "hot-spot",
            WarningKind::LayerVoltage { .. } => "layer-voltage",
            WarningKind::BifilarVoltage { .. } => "bifilar-voltage",
            WarningKind::SectionVoltage { .. } => "section-voltage",
            WarningKind::AcBifilarPs { .. } => "ac-bifilar-ps",
            WarningKind::IsolationBifilar { .. } => "isolation-bifilar",
            WarningKind::IsolationWraps { .. } => "isolation-wraps",
            WarningKind::IsolationMargin { .. } => "isolation-margin",
            WarningKind::IsolationCreepageUnset { .. } => "isolation-creepage-unset",
        }
    }
}

impl fmt::Display for WarningKind {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            WarningKind::Invalid(problem) => write!(f, "{problem}"),
            WarningKind::DoesNotFit {
                height_with_allowance_mm,
                bulge,
                window_height_mm,
                over_mm,
            } => write!(
                f,
                "does not fit: {height_with_allowance_mm:.2} mm with the {:.0} % allowance against a \
                 {window_height_mm:.2} mm window, {over_mm:.2} mm too tall",
                (bulge - 1.0) * 100.0,
            ),
            WarningKind::PastWindow { section, winding } => write!(
                f,
                "section {} ({winding}) reaches past the window limit",
                section + 1
            ),
            WarningKind::PartialLayer {
                section,
                winding,
                last_layer_turns,
                turns_per_layer,
            } => write!(
                f,
                "section {} ({winding}): the last layer holds {last_layer_turns} of {turns_per_layer} turns, \
                 so the section above sits on a step and the finish lead crosses over it \
                 (spread the turns across the width, or change the turns)",
                section + 1
            ),
            WarningKind::MarginCrowded {
                section,
                winding,
                spare_mm,
            } => write!(
                f,
                "section {} ({winding}): full layers leave {spare_mm:.2} mm to the margin tape; the end turns \
                 can climb onto it and shorten the creepage path (wind one turn fewer per layer)",
                section + 1
            ),
            WarningKind::FillHigh { fill_factor } => write!(
                f,
                "fill factor {fill_factor:.2} is above the {FILL_FACTOR_HAND_LIMIT:.2} that hand winding on a \
                 bobbin usually reaches"
            ),
            WarningKind::TiwStrands { winding } => write!(
                f,
                "\"{winding}\": strands of triple-insulated wire in parallel are unusual; check the pitch"
            ),
            WarningKind::ResetBelowController {
                duty_limit,
                reset_duty_limit,
            } => write!(
                f,
                "the controller may command {:.0} % but the core resets only up to {:.0} %: in a load step at \
                 high input it walks up the B-H loop into saturation (lower duty_limit, or fewer reset turns)",
                duty_limit * 100.0,
                reset_duty_limit * 100.0
            ),
            WarningKind::DutyShort { needed, available } => write!(
                f,
                "the output needs {:.0} % duty at the lowest input but the most available is {:.0} %: \
                 the converter cannot reach its output (more secondary turns or fewer primary turns)",
                needed * 100.0,
                available * 100.0
            ),
            WarningKind::ResetImpossible { nr, ns } => write!(
                f,
                "reset turns ({nr}) are not fewer than the secondary's ({ns}): the core can never reset"
            ),
            WarningKind::ResetSteady { ceiling, needed } => write!(
                f,
                "reset from the output side takes {:.0} % of every period, so the duty must stay below \
                 {:.0} %, but {:.0} % is needed",
                (1.0 - ceiling) * 100.0,
                ceiling * 100.0,
                needed * 100.0
            ),
            WarningKind::ResetStartup => f.write_str(
                "with the reset returned to the output, the core cannot reset at start-up while the output is \
                 near zero: the controller must limit the duty until the output is up",
            ),
            WarningKind::Saturation {
                swing_mt,
                headroom_mt,
            } => write!(
                f,
                "worst-case flux swing {swing_mt:.0} mT exceeds the {headroom_mt:.0} mT between saturation and \
                 remanence: the core saturates (more primary turns, a larger core or a lower duty limit)"
            ),
            WarningKind::CurrentDensity {
                winding,
                density_a_mm2: j,
                reset: true,
                ..
            } => write!(
                f,
                "\"{winding}\" runs at {j:.1} A/mm2: a reset winding is thin because it carries only the \
                 magnetising current, but this one is large (a low AL, a gapped core, or few primary turns): \
                 use a thicker wire"
            ),
            WarningKind::CurrentDensity {
                winding,
                density_a_mm2: j,
                band,
                reset: false,
            } => write!(
                f,
                "\"{winding}\" runs at {j:.1} A/mm2 RMS, above the {:.0}-{:.0} A/mm2 that small transformers \
                 usually run at (common practice): expect it to run hot",
                band.0, band.1
            ),
            WarningKind::TemperatureRise {
                rise_c,
                limit_c,
                loss_w,
                surface_cm2,
            } => write!(
                f,
                "estimated temperature rise {rise_c:.0} C is above the {limit_c:.0} C limit ({loss_w:.2} W over \
                 {surface_cm2:.1} cm2): less loss (thinner strands, interleaving, more copper) or a larger core"
            ),
            WarningKind::HotSpot {
                hot_c,
                ambient_c,
                class_c,
                part,
            } => write!(
                f,
                "hot spot about {hot_c:.0} C ({ambient_c:.0} C air + the rise) is above the {class_c:.0} C \
                 thermal class of the {part} (IEC 60085): less loss, a larger core, or parts of a higher class"
            ),
            WarningKind::LayerVoltage {
                section,
                winding,
                volts,
                limit_v,
                layer_tape,
            } => write!(
                f,
                "section {} ({winding}): up to {volts:.0} V between adjacent layers, above the {limit_v:.0} V \
                 that two enamel films and {layer_tape} wrap(s) of tape are usually good for (from memory): \
                 tape between the layers (layer_tape), or fewer turns a layer",
                section + 1
            ),
            WarningKind::BifilarVoltage {
                section,
                a,
                b,
                volts,
                limit_v,
            } => write!(
                f,
                "section {} winds {a} bifilar with {b}: neighbouring turns hold off up to {volts:.0} V with \
                 only their two enamel films between, usually good for {limit_v:.0} V (from memory): wind \
                 them apart with tape between (no bifilar primary and reset on a mains input)",
                section + 1
            ),
            WarningKind::SectionVoltage {
                inner,
                outer,
                volts,
                limit_v,
                wraps,
            } => write!(
                f,
                "up to {volts:.0} V between stack #{} ({}) and stack #{} ({}), above the {limit_v:.0} V that \
                 the enamel and {wraps} wrap(s) of tape between are usually good for (from memory): more \
                 tape between them",
                inner.0 + 1,
                inner.1,
                outer.0 + 1,
                outer.1
            ),
            WarningKind::AcBifilarPs { primary, secondary } => write!(
                f,
                "\"{primary}\" and \"{secondary}\" are wound bifilar together: the layer model cannot give them \
                 AC figures, so their copper loss is taken at DC resistance and understated"
            ),
            WarningKind::IsolationBifilar {
                class,
                section,
                a,
                b,
            } => write!(
                f,
                "stack #{}: {a} and {b} are wound bifilar across the {} barrier: only the enamel separates \
                 them (wind them as separate sections with tape between)",
                section + 1,
                class.key()
            ),
            WarningKind::IsolationWraps {
                class,
                wraps,
                need,
                inner,
                outer,
            } => write!(
                f,
                "{} isolation: {wraps} wrap(s) of tape between stack #{} ({}) and stack #{} ({}); the usual \
                 layout is at least {need} (or triple-insulated wire on one side)",
                class.key(),
                inner.0 + 1,
                inner.1,
                outer.0 + 1,
                outer.1
            ),
            WarningKind::IsolationMargin {
                class,
                margin_mm,
                creepage_mm,
            } => write!(
                f,
                "{} isolation: margins of {margin_mm:.2} mm at each flange are narrower than half the \
                 {creepage_mm:.2} mm creepage you set ({:.2} mm): the surface path round the tape edge is about \
                 the sum of the two margins",
                class.key(),
                creepage_mm / 2.0
            ),
            WarningKind::IsolationCreepageUnset { class } => write!(
                f,
                "{} isolation declared without creepage_mm: the margins cannot be checked (take the distance \
                 from the applicable standard for your working voltage)",
                class.key()
            ),
        }
    }
}

/// A remark that is not a warning: what a figure had to leave out, or what the model cannot
/// see.
#[derive(Debug, Clone, PartialEq)]
pub enum Note {
    /// Bifilar sections, as (winding, with) in stack order, a repeat of the one before left out.
    BifilarPairs(Vec<(Name, Name)>),
    NoCoreData,
    NoInductance,
    NoSteinmetz,
    SurfaceEstimated,
    NoCurrent(Vec<Name>),
}

impl fmt::Display for Note {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Note::BifilarPairs(pairs) => {
                f.write_str("bifilar sections (")?;
                for (i, (a, b)) in pairs.iter().enumerate() {
                    if i > 0 {
                        f.write_str(", ")?;
                    }
                    write!(f, "{a} with {b}")?;
                }
                f.write_str(
                    ") share their layers: the 1-D model across the build sees no leakage between the two windings \
                     of a pair; what they have comes from the spacing of the wires' centres (small)",
                )
            }
            Note::NoCoreData => f.write_str(
                "the bobbin has no [core] data (ae_mm2, le_mm): flux swing, magnetising current, core loss and \
                 the surface-area estimate for the temperature rise are left out",
            ),
            Note::NoInductance => f.write_str(
                "no al_nh in [core] and no mu_i in [material]: the magnetising current is taken as zero",
            ),
            Note::NoSteinmetz => {
                f.write_str("no steinmetz coefficients in [material]: core loss is left out")
            }
            Note::SurfaceEstimated => write!(
                f,
                "surface area estimated as {SURFACE_KS:.1} x sqrt(Wa Ae) with the bobbin window as Wa \
                 (McLyman; errs toward a higher rise); give [operating] surface_area_cm2 to use a measured one"
            ),
            Note::NoCurrent(windings) => {
                f.write_str("no current for ")?;
                for (i, w) in windings.iter().enumerate() {
                    if i > 0 {
                        f.write_str(", ")?;
                    }
                    f.write_str(w)?;
                }
                f.write_str(": its copper loss is not counted (give current_rms_a)")
            }
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
        }
    }
    const KINDS: usize = 24;

    /// Every kind has a sample, a code of its own, a sentence, and a row in FORMAT.md's
    /// table of warning codes (the codes are a stable interface, documented there).
    #[test]
    fn every_warning_code_is_unique_rendered_and_documented() {
        let format = include_str!("../../FORMAT.md");
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
