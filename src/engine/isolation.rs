//! Checks of the stack against the build's declared isolation, as warnings. Pure; it can only
//! say where the plan falls short of the usual layout, never that a build is safe or compliant.

use super::remarks::{Warning, WarningAt, WarningKind};
use super::validate::{Invalid, Place};
use crate::model::{Build, Insulation, IsolationClass, Role, Section, SectionRef};

/// Tape wraps between primary and secondary for reinforced insulation of thin sheet: three
/// layers, any two of which pass the test (IEC 60950-1 cl. 2.10.5.6; kept in IEC 62368-1).
pub const REINFORCED_TAPE_WRAPS: u32 = 3;

/// Tape wraps for basic insulation: at least one, since enamel alone is not relied on as
/// insulation between circuits (common practice).
pub const BASIC_TAPE_WRAPS: u32 = 1;

/// Which side of the barrier a winding belongs to.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Side {
    /// Primary side: the primary, and the reset winding when it clamps to the input.
    Primary,
    /// Secondary side: the secondary, and the reset winding when it returns to the output.
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

/// One section's windings (the winding, then its bifilar partner), as (index, side,
/// triple-insulated); empty for tape and for names no winding has.
fn section_windings(build: &Build, s: &SectionRef) -> SectionWindings {
    let of = |k: Option<usize>| {
        let w = &build.windings[k?];
        Some((k?, side_of(build, w.role), w.insulation == Insulation::Tiw))
    };
    let (a, b) = (of(s.winding), of(s.partner));
    if a.is_none() { [b, None] } else { [a, b] }
}

type SectionWindings = [Option<(usize, Side, bool)>; 2];

fn windings(s: &SectionWindings) -> impl Iterator<Item = (usize, Side, bool)> + '_ {
    s.iter().flatten().copied()
}

/// Warnings where the stack as planned cannot hold the declared isolation, added to `out`;
/// `sections` are the stack's resolved names ([`Build::section_refs`]).
pub fn warnings(build: &Build, sections: &[SectionRef], out: &mut Vec<Warning>) {
    let Some(iso) = &build.isolation else {
        return;
    };
    let need = match iso.class {
        IsolationClass::Functional => return,
        IsolationClass::Basic => BASIC_TAPE_WRAPS,
        IsolationClass::Reinforced => REINFORCED_TAPE_WRAPS,
    };
    let class = iso.class;
    let sections: Vec<SectionWindings> = sections
        .iter()
        .map(|s| section_windings(build, s))
        .collect();
    let name = |k: usize| build.windings[k].name.clone();

    for (i, ws) in sections.iter().enumerate() {
        let has = |side: Side| windings(ws).any(|w| w.1 == side);
        if has(Side::Primary)
            && has(Side::Secondary)
            && let [Some(a), Some(b)] = ws
        {
            out.push(Warning {
                at: WarningAt::Section(i),
                kind: WarningKind::IsolationBifilar {
                    class,
                    section: i,
                    a: name(a.0),
                    b: name(b.0),
                },
            });
        }
    }

    wraps_warnings(build, &sections, class, need, out);

    let secondary_all_tiw = build
        .windings
        .iter()
        .filter(|w| side_of(build, w.role) == Side::Secondary)
        .all(|w| w.insulation == Insulation::Tiw);
    match iso.creepage_mm {
        Some(creepage) if !secondary_all_tiw && build.setup.margin_mm < creepage / 2.0 => {
            out.push(Warning {
                at: WarningAt::Build,
                kind: WarningKind::IsolationMargin {
                    class,
                    margin_mm: build.setup.margin_mm,
                    creepage_mm: creepage,
                },
            });
        }
        None => out.push(Warning {
            at: WarningAt::Build,
            kind: WarningKind::IsolationCreepageUnset { class },
        }),
        _ => {}
    }
}

/// Every pair of a primary-side and a secondary-side section with fewer than `need` wraps of
/// tape between them (unless one side is wound all in triple-insulated wire).
fn wraps_warnings(
    build: &Build,
    sections: &[SectionWindings],
    class: IsolationClass,
    need: u32,
    out: &mut Vec<Warning>,
) {
    let name = |k: usize| build.windings[k].name.clone();
    // Every pair of a primary-side and a secondary-side section, however far apart.
    for a in 0..sections.len() {
        for b in a + 1..sections.len() {
            let (pa, pb) = (&sections[a], &sections[b]);
            let (Some(first_a), Some(first_b)) = (pa[0], pb[0]) else {
                continue;
            };
            let crosses = windings(pa).any(|x| windings(pb).any(|y| x.1 != y.1));
            if !crosses {
                continue;
            }
            // Triple-insulated wire is its own barrier: a side wound all in it waives the tape.
            let all_tiw = |s: &SectionWindings| windings(s).all(|w| w.2);
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
                    at: WarningAt::Section(b),
                    kind: WarningKind::IsolationWraps {
                        class,
                        wraps,
                        need,
                        inner: (a, name(first_a.0)),
                        outer: (b, name(first_b.0)),
                    },
                });
            }
        }
    }
}
