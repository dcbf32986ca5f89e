//! The bench checks of the sheet and its cautions.

use super::*;

pub(super) fn checks(build: &Build, eval: &Evaluation, measure_at_c: f64) -> Vec<Check> {
    let mut out = Vec::new();
    for (w, dcr) in build
        .windings
        .iter()
        .zip(bench::dcr_at_bench(eval, measure_at_c))
    {
        let r = dcr.expected;
        let pins = match (&w.start_pin, &w.finish_pin) {
            (Some(a), Some(b)) => format!("between pins {a} and {b}"),
            _ => "between its start and finish".into(),
        };
        let kelvin = if r < 1.0 {
            "; under 1 ohm use a four-wire (Kelvin) meter or subtract the lead resistance"
        } else {
            ""
        };
        out.push(Check {
            what: format!("DC resistance of {}", w.name),
            value: Some(r),
            expected: format!(
                "{} at {measure_at_c:.0} C ({} to {}, +/-{:.0} %)",
                ohms(r),
                ohms(dcr.low),
                ohms(dcr.high),
                DCR_TOLERANCE * 100.0
            ),
            how: format!(
                "{pins}, leads trimmed to the pins, the part at {measure_at_c:.0} C{kelvin}; \
                 copper changes 0.393 % per kelvin (IEC 60028){}",
                super::conductor_steps::litz_dcr_note(w)
            ),
        });
    }
    out.extend(inductance_checks(build, eval));
    out.push(polarity_check(build));
    out.extend(hipot_check(build));
    out
}

/// The magnetising inductance (from AL) and the primary-secondary leakage, where known.
pub(super) fn inductance_checks(build: &Build, eval: &Evaluation) -> Vec<Check> {
    let mut out = Vec::new();
    let primary = build.first_of(Role::Primary);
    if let (Some(p), Some(al), Some(spread)) = (
        primary,
        build.bobbin.core.as_ref().and_then(|c| c.al_nh),
        bench::magnetising_at_bench(build),
    ) {
        let l = spread.expected;
        out.push(Check {
            what: format!("Magnetising inductance of {}", p.name),
            value: Some(l),
            expected: format!(
                "{} (AL {al:.0} nH x {}^2; {} to {} for the usual +/-{:.0} % of AL)",
                henries(l),
                p.turns,
                henries(spread.low),
                henries(spread.high),
                AL_TOLERANCE * 100.0
            ),
            how: "at the primary, every other winding open, core assembled and clamped, at a \
                  low test level (for example 10 kHz); much lower means a gap or a dirty \
                  mating face"
                .into(),
        });
    }
    if let (Some(p), Some(s)) = (primary, build.first_of(Role::Secondary))
        && let Some(l) = primary_secondary_leakage(build, eval)
    {
        out.push(Check {
            what: format!("Leakage inductance {} - {}", p.name, s.name),
            value: Some(l.uh),
            expected: format!(
                "about {} (an estimate from a 1-D field; leads and end turns add to it)",
                henries(l.uh)
            ),
            how: format!(
                "at the primary {} with the secondary {} shorted by a short thick link, other \
                 windings open, at the switching frequency or the meter's highest",
                p.name, s.name
            ),
        });
    }
    out
}

/// The polarity: every start pin in phase with the primary's.
pub(super) fn polarity_check(build: &Build) -> Check {
    let starts: Vec<String> = build
        .windings
        .iter()
        .filter_map(|w| w.start_pin.as_ref().map(|p| format!("{} pin {p}", w.name)))
        .collect();
    Check {
        what: "Polarity".into(),
        value: None,
        expected: format!(
            "every start pin in phase with the primary's start ({})",
            if starts.is_empty() {
                "the start pins you wrote down".into()
            } else {
                starts.join(", ")
            }
        ),
        how: "drive the primary with a small sine (a signal generator, a few volts) and \
              compare each winding on a two-channel scope, grounds on the finish pins; or use \
              the meter's phase test"
            .into(),
    }
}

/// The electric-strength test, for basic or reinforced isolation.
pub(super) fn hipot_check(build: &Build) -> Option<Check> {
    if let Some(iso) = &build.isolation
        && iso.class != IsolationClass::Functional
    {
        return Some(Check {
            what: "Electric strength (hipot), primary side to secondary side".into(),
            value: None,
            expected: format!(
                "no breakdown at the test voltage and time the applicable standard sets for \
                 {} insulation{}",
                iso.class.key(),
                iso.working_voltage_v
                    .map_or(String::new(), |v| format!(" at {v:.0} V working voltage"))
            ),
            how: "join all primary-side pins, join all secondary-side pins (and the core to \
                  the side the design says); only a trained person, with a current-limited \
                  hipot tester, an interlocked fixture and hands clear; discharge before \
                  touching; a part that fails is scrapped, never rewound and reused"
                .into(),
        });
    }
    None
}

pub(super) fn cautions(build: &Build) -> Vec<String> {
    let no_substitute = "This sheet is no substitute for the applicable safety standard (for \
        example IEC 62368-1 or IEC 61558), local codes and the approval of a qualified person. \
        turnstack plans the layers; it does not certify anything and claims compliance with \
        nothing."
        .to_string();
    match build.isolation.as_ref().map(|i| i.class) {
        None | Some(IsolationClass::Functional) => vec![
            "Functional insulation only: this build provides no protection against electric \
             shock. Do not use it to separate mains or any hazardous voltage from anything a \
             person can touch."
                .into(),
        ],
        Some(IsolationClass::Basic) => vec![
            "Basic insulation: one level of protection against shock. Tape between primary and \
             secondary, margins for the creepage distance, sleeving on leads that cross \
             windings, and a hipot test of every part."
                .into(),
            no_substitute,
        ],
        Some(IsolationClass::Reinforced) => {
            let creepage = build
                .isolation
                .as_ref()
                .and_then(|i| i.creepage_mm)
                .map_or("the creepage distance the standard sets".to_string(), |c| {
                    format!("the {c:.1} mm creepage set in the file (half of it at each flange)")
                });
            vec![
                "Reinforced insulation between mains and what a person can touch: a fault here \
                 can kill. Wind it only if you are qualified to."
                    .into(),
                "Three layers of tape between every primary-side and secondary-side winding, \
                 flange to flange, no gaps and no wrinkles; the insulation relies on any two of \
                 the three passing the electric-strength test (thin-sheet rule), so a nicked \
                 wrap is a failed part (or triple-insulated wire on one side)."
                    .into(),
                format!("Margin tape at both flanges for {creepage}; no turn may climb onto it."),
                "Sleeving on every lead that crosses another winding or the margins, from \
                 inside the winding to the pin."
                    .into(),
                "A hipot test of every finished part, primary side to secondary side, at the \
                 level and time the standard sets, with proper equipment."
                    .into(),
                no_substitute,
            ]
        }
    }
}
