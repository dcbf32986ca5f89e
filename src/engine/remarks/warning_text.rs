//! The sentence of each warning kind, rendered only when a front end shows it.

use super::*;

impl fmt::Display for WarningKind {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            WarningKind::Invalid(problem) => write!(f, "{problem}"),
            WarningKind::DoesNotFit { .. }
            | WarningKind::PastWindow { .. }
            | WarningKind::PartialLayer { .. }
            | WarningKind::MarginCrowded { .. }
            | WarningKind::FillHigh { .. }
            | WarningKind::TiwStrands { .. } => self.write_fit(f),
            WarningKind::ResetBelowController { .. }
            | WarningKind::DutyShort { .. }
            | WarningKind::ResetImpossible { .. }
            | WarningKind::ResetSteady { .. }
            | WarningKind::ResetStartup
            | WarningKind::OutputOffTarget { .. }
            | WarningKind::Saturation { .. } => self.write_converter(f),
            WarningKind::CurrentDensity { .. }
            | WarningKind::TemperatureRise { .. }
            | WarningKind::HotSpot { .. }
            | WarningKind::AcBifilarPs { .. }
            | WarningKind::LitzStrandThick { .. }
            | WarningKind::LitzTooManyStrands { .. } => self.write_heat(f),
            WarningKind::LayerVoltage { .. }
            | WarningKind::BifilarVoltage { .. }
            | WarningKind::SectionVoltage { .. } => self.write_voltage(f),
            WarningKind::IsolationBifilar { .. }
            | WarningKind::IsolationWraps { .. }
            | WarningKind::IsolationMargin { .. }
            | WarningKind::IsolationCreepageUnset { .. } => self.write_isolation(f),
        }
    }
}

/// The sentences by kind of warning, each group one match; `fmt` above sends every kind to
/// its group, so the catch-all arms are never reached.
impl WarningKind {
    /// The sentence of a warning on the fit and the layout of the sections.
    fn write_fit(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            WarningKind::DoesNotFit {
                height_with_allowance_mm,
                allowance_factor,
                window_height_mm,
                over_mm,
            } => write!(
                f,
                "does not fit: {height_with_allowance_mm:.2} mm with the {:.0} % allowance against a \
                 {window_height_mm:.2} mm window, {over_mm:.2} mm too tall",
                (allowance_factor - 1.0) * 100.0,
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
                 (space its turns across the width: spread = true on the section; or change the \
                 turns)",
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
            _ => unreachable!("not a warning on the fit and the layout of the sections"),
        }
    }

    /// The sentence of a warning on the converter: duty, reset, outputs and flux.
    fn write_converter(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
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
            WarningKind::OutputOffTarget {
                winding,
                target_v,
                from_turns_v,
                error_fraction,
                step_v,
            } => write!(
                f,
                "output {winding}: its turns make {from_turns_v:.2} V against a {target_v} V target \
                 ({:+.1} %); one turn more or less moves it by {step_v:.2} V",
                error_fraction * 100.0
            ),
            WarningKind::Saturation {
                swing_mt,
                headroom_mt,
            } => write!(
                f,
                "worst-case flux swing {swing_mt:.0} mT exceeds the {headroom_mt:.0} mT between saturation and \
                 remanence: the core saturates (more primary turns, a larger core or a lower duty limit)"
            ),
            _ => unreachable!("not a warning on the converter: duty, reset, outputs and flux"),
        }
    }

    /// The sentence of a warning on current density, loss and heat.
    fn write_heat(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
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
            WarningKind::AcBifilarPs { primary, secondary } => write!(
                f,
                "\"{primary}\" and \"{secondary}\" are wound bifilar together: the layer model cannot give them \
                 AC figures, so their copper loss is taken at DC resistance and understated"
            ),
            WarningKind::LitzStrandThick {
                winding,
                strand_mm,
                skin_depth_mm,
            } => write!(
                f,
                "\"{winding}\": litz strands of {strand_mm} mm are thicker than the skin depth \
                 ({skin_depth_mm:.3} mm), so the litz no longer pays: take finer strands"
            ),
            WarningKind::LitzTooManyStrands {
                winding,
                strands,
                ac_factor,
            } => write!(
                f,
                "\"{winding}\": {strands} strands give an AC factor of {ac_factor:.2}, more loss \
                 to proximity than to DC: fewer strands, or finer ones, would lose less"
            ),
            _ => unreachable!("not a warning on current density, loss and heat"),
        }
    }

    /// The sentence of a warning on the voltage between layers, turns and sections.
    fn write_voltage(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
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
            _ => unreachable!("not a warning on the voltage between layers, turns and sections"),
        }
    }

    /// The sentence of a warning on the declared isolation class.
    fn write_isolation(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
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
            _ => unreachable!("not a warning on the declared isolation class"),
        }
    }
}
