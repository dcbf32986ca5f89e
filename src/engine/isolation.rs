//! Checks of the stack against the build's declared isolation, as warnings. Pure; it can only
//! say where the plan falls short of the usual layout, never that a build is safe or compliant.

use super::evaluation::{Evaluation, Warning, WarningAt};
use super::validate::{Invalid, Place};
use crate::model::{Build, Insulation, IsolationClass, Role, Section};

/// Tape wraps between primary and secondary for reinforced insulation of thin sheet: three
/// layers, any two of which pass the test (IEC 60950-1 cl. 2.10.5.6; kept in IEC 62368-1).
pub const REINFORCED_TAPE_WRAPS: u32 = 3;

/// Tape wraps for basic insulation: at least one, since enamel alone is not relied on as
/// insulation between circuits (common practice).
pub const BASIC_TAPE_WRAPS: u32 = 1;

/// Which side of the barrier a winding belongs to.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Side {
    Primary,
    Secondary,
}

/// Primary side: primary and reset (a reset winding clamps to the input, or with secondary-side
/// reset it returns energy to the output, see below). Auxiliary windings are taken as primary
/// side, since they usually feed the controller beside the switch; the file has no key for an
/// auxiliary output on the secondary side yet.
pub fn side_of(build: &Build, role: Role) -> Side {
    let reset_to_output = build
        .operating
        .as_ref()
        .is_some_and(|o| o.reset_side == crate::model::ResetSide::Secondary);
    match role {
        Role::Primary | Role::Auxiliary => Side::Primary,
        Role::Reset if reset_to_output => Side::Secondary,
        Role::Reset => Side::Primary,
        Role::Secondary => Side::Secondary,
    }
}

/// Range checks of `[isolation]`, with places the loader can point at.
pub fn validate(build: &Build) -> Vec<Invalid> {
    let mut out = Vec::new();
    let Some(iso) = &build.isolation else {
        return out;
    };
    for (key, v) in [
        ("isolation.working_voltage_v", iso.working_voltage_v),
        ("isolation.creepage_mm", iso.creepage_mm),
    ] {
        if let Some(v) = v
            && !(v.is_finite() && v > 0.0)
        {
            out.push(Invalid {
                place: Place::Top(key),
                message: format!("must be positive, got {v}"),
            });
        }
    }
    out
}

/// One winding section's windings, as (index, side, triple-insulated).
fn section_windings(build: &Build, s: &Section) -> Vec<(usize, Side, bool)> {
    let Section::Winding(ws) = s else {
        return Vec::new();
    };
    [Some(ws.winding.as_str()), ws.with.as_deref()]
        .into_iter()
        .flatten()
        .filter_map(|n| build.winding_index(n))
        .map(|k| {
            let w = &build.windings[k];
            (k, side_of(build, w.role), w.insulation == Insulation::Tiw)
        })
        .collect()
}

/// Warnings where the stack as planned cannot hold the declared isolation.
pub fn warnings(build: &Build, _eval: &Evaluation) -> Vec<Warning> {
    let mut out = Vec::new();
    let Some(iso) = &build.isolation else {
        return out;
    };
    let need = match iso.class {
        IsolationClass::Functional => return out,
        IsolationClass::Basic => BASIC_TAPE_WRAPS,
        IsolationClass::Reinforced => REINFORCED_TAPE_WRAPS,
    };
    let class = iso.class.key();
    let sections: Vec<Vec<(usize, Side, bool)>> = build
        .stack
        .iter()
        .map(|s| section_windings(build, s))
        .collect();
    let name = |k: usize| build.windings[k].name.as_str();

    for (i, ws) in sections.iter().enumerate() {
        let sides: Vec<Side> = ws.iter().map(|w| w.1).collect();
        if sides.contains(&Side::Primary) && sides.contains(&Side::Secondary) {
            out.push(Warning {
                code: "isolation-bifilar",
                message: format!(
                    "stack #{}: {} and {} are wound bifilar across the {class} barrier: only the enamel \
                     separates them (wind them as separate sections with tape between)",
                    i + 1,
                    name(ws[0].0),
                    name(ws[1].0)
                ),
                at: WarningAt::Section(i),
            });
        }
    }

    // Every pair of a primary-side and a secondary-side section, however far apart.
    for a in 0..sections.len() {
        for b in a + 1..sections.len() {
            let (pa, pb) = (&sections[a], &sections[b]);
            let crosses = pa.iter().any(|x| pb.iter().any(|y| x.1 != y.1));
            if pa.is_empty() || pb.is_empty() || !crosses {
                continue;
            }
            // Triple-insulated wire is its own barrier: a side wound all in it waives the tape.
            let all_tiw = |s: &[(usize, Side, bool)]| s.iter().all(|w| w.2);
            if all_tiw(pa) || all_tiw(pb) {
                continue;
            }
            let wraps: u32 = build.stack[a + 1..b]
                .iter()
                .map(|s| match s {
                    Section::Tape { wraps } => *wraps,
                    Section::Winding(_) => 0,
                })
                .sum();
            if wraps < need {
                out.push(Warning {
                    code: "isolation-wraps",
                    message: format!(
                        "{class} isolation: {wraps} wrap(s) of tape between stack #{} ({}) and stack #{} ({}); \
                         the usual layout is at least {need} (or triple-insulated wire on one side)",
                        a + 1,
                        name(pa[0].0),
                        b + 1,
                        name(pb[0].0)
                    ),
                    at: WarningAt::Section(b),
                });
            }
        }
    }

    let secondary_all_tiw = build
        .windings
        .iter()
        .filter(|w| side_of(build, w.role) == Side::Secondary)
        .all(|w| w.insulation == Insulation::Tiw);
    match iso.creepage_mm {
        Some(creepage) if !secondary_all_tiw && build.setup.margin_mm < creepage / 2.0 => {
            out.push(Warning {
                code: "isolation-margin",
                message: format!(
                    "{class} isolation: margins of {:.2} mm at each flange are narrower than half the \
                     {creepage:.2} mm creepage you set ({:.2} mm): the surface path round the tape edge \
                     is about the sum of the two margins",
                    build.setup.margin_mm,
                    creepage / 2.0
                ),
                at: WarningAt::Build,
            });
        }
        None => out.push(Warning {
            code: "isolation-creepage-unset",
            message: format!(
                "{class} isolation declared without creepage_mm: the margins cannot be checked \
                 (take the distance from the applicable standard for your working voltage)"
            ),
            at: WarningAt::Build,
        }),
        _ => {}
    }
    out
}
