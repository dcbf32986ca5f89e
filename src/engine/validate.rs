//! What makes a build invalid (the spec's validation list), as data with a place, so that the
//! file loader can point at a line and the editor can refuse an edit with a message.

use super::layout::{Resolved, turns_per_layer, usable_width_mm};
use super::material_checks::check_material;
use super::operating_checks::check_operating;
use crate::library::wires::AWG_RANGE;
use crate::model::{Bobbin, Build, Conductor, Section, Tube, WindingSection, WireSize};
use std::fmt;

pub use super::build_size::{MAX_SECTIONS, MAX_WINDINGS};

/// Where in the build a problem lies; the loader maps it to a line and column.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum Place {
    /// A top-level key.
    Top(&'static str),
    /// A key of the bobbin (`window.width_mm`, `tube.diameter_mm`, ...).
    Bobbin(&'static str),
    /// A key of `[setup]`.
    Setup(&'static str),
    /// A key of the n-th `[[winding]]` (0-based).
    Winding(usize, &'static str),
    /// A key of the n-th `[[stack]]` (0-based).
    Section(usize, &'static str),
    /// A key of `[operating]` (`""` for the table as a whole).
    Operating(&'static str),
    /// A key of `[material]`.
    Material(&'static str),
    /// A key of the n-th `[[output]]` (0-based).
    Output(usize, &'static str),
}

impl fmt::Display for Place {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Place::Top(k) => write!(f, "{k}"),
            Place::Bobbin(k) => write!(f, "bobbin {k}"),
            Place::Setup(k) => write!(f, "setup.{k}"),
            Place::Winding(i, k) => write!(f, "winding #{} {k}", i + 1),
            Place::Section(i, k) => write!(f, "stack #{} {k}", i + 1),
            Place::Operating("") => write!(f, "operating"),
            Place::Operating(k) => write!(f, "operating.{k}"),
            Place::Material(k) => write!(f, "material.{k}"),
            Place::Output(i, "") => write!(f, "output #{}", i + 1),
            Place::Output(i, k) => write!(f, "output #{} {k}", i + 1),
        }
    }
}

/// One reason a build is refused.
#[derive(Debug, Clone, PartialEq)]
pub struct Invalid {
    /// Where in the build the problem is.
    pub place: Place,
    /// What is wrong and what would be accepted.
    pub message: String,
}

impl fmt::Display for Invalid {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "{}: {}", self.place, self.message)
    }
}

/// Upper bounds that keep a typing slip (an extra digit or three) from laying out millions
/// of layers: far beyond anything wound by hand on a small bobbin.
pub const MAX_TURNS: u32 = 10_000;
/// Most strands in parallel a winding may have.
pub const MAX_STRANDS: u32 = 100;
/// Most wraps of tape a tape section or a layer tape may have.
pub const MAX_WRAPS: u32 = 100;

pub(super) fn positive(v: f64) -> bool {
    v.is_finite() && v > 0.0
}

/// What makes a bobbin's figures unusable (also checked for bobbin files on their own).
pub fn validate_bobbin(b: &Bobbin) -> Vec<Invalid> {
    let mut out = Vec::new();
    let mut bad = |place: Place, message: String| out.push(Invalid { place, message });
    for (key, v) in [
        ("window.width_mm", b.window.width_mm),
        ("window.height_mm", b.window.height_mm),
    ] {
        if !positive(v) {
            bad(
                Place::Bobbin(key),
                format!("must be a positive length in mm, got {v}"),
            );
        }
    }
    match b.tube {
        Tube::Rect {
            width_mm,
            depth_mm,
            corner_radius_mm,
        } => {
            for (key, v) in [("tube.width_mm", width_mm), ("tube.depth_mm", depth_mm)] {
                if !positive(v) {
                    bad(
                        Place::Bobbin(key),
                        format!("must be a positive length in mm, got {v}"),
                    );
                }
            }
            if corner_radius_mm.is_nan()
                || corner_radius_mm < 0.0
                || corner_radius_mm > width_mm.min(depth_mm) / 2.0
            {
                bad(
                    Place::Bobbin("tube.corner_radius_mm"),
                    format!(
                        "must be between 0 and half the smaller side ({} mm), got {corner_radius_mm}",
                        width_mm.min(depth_mm) / 2.0
                    ),
                );
            }
        }
        Tube::Round { diameter_mm } => {
            if !positive(diameter_mm) {
                bad(
                    Place::Bobbin("tube.diameter_mm"),
                    format!("must be a positive length in mm, got {diameter_mm}"),
                );
            }
        }
    }
    if let Some(core) = &b.core {
        for (key, v) in [
            ("core.ae_mm2", Some(core.ae_mm2)),
            ("core.le_mm", Some(core.le_mm)),
            ("core.ve_mm3", core.ve_mm3),
            ("core.al_nh", core.al_nh),
        ] {
            if let Some(v) = v
                && !positive(v)
            {
                bad(Place::Bobbin(key), format!("must be positive, got {v}"));
            }
        }
    }

    out
}

/// Every reason the build is invalid; empty when it is valid.
pub fn validate(build: &Build) -> Vec<Invalid> {
    validate_resolved(build, &Resolved::new(build))
}

/// [`validate`], with the build's names and defaults already resolved (as `evaluate` has them).
pub(super) fn validate_resolved(build: &Build, resolved: &Resolved) -> Vec<Invalid> {
    let mut out = Vec::new();
    out.extend(validate_bobbin(&build.bobbin));
    let mut bad = |place: Place, message: String| out.push(Invalid { place, message });
    for check in [
        super::build_size::check_size,
        check_setup,
        check_windings,
        check_sections,
        check_turn_sums,
        check_operating,
        super::outputs::check_outputs,
        check_material,
    ] {
        check(build, resolved, &mut bad);
    }
    out.extend(super::isolation::validate(build));
    out
}

/// The setup: temperature, allowance, margins, tape, frequency.
fn check_setup(build: &Build, _resolved: &Resolved, bad: &mut dyn FnMut(Place, String)) {
    let b = &build.bobbin;
    // The setup.
    let s = &build.setup;
    if !(s.temperature_c.is_finite() && (-60.0..=250.0).contains(&s.temperature_c)) {
        bad(
            Place::Setup("temperature_c"),
            format!(
                "expected a winding temperature between -60 and 250 C, got {}",
                s.temperature_c
            ),
        );
    }
    if !(s.allowance_factor.is_finite() && (1.0..=2.0).contains(&s.allowance_factor)) {
        bad(
            Place::Setup("bulge"),
            format!(
                "expected an allowance factor between 1.0 and 2.0 (1.10 is usual), got {}",
                s.allowance_factor
            ),
        );
    }
    if !(s.margin_mm.is_finite() && s.margin_mm >= 0.0) {
        bad(
            Place::Setup("margin_mm"),
            format!(
                "must be zero or a positive width in mm, got {}",
                s.margin_mm
            ),
        );
    } else if positive(b.window.width_mm) && 2.0 * s.margin_mm >= b.window.width_mm {
        bad(
            Place::Setup("margin_mm"),
            format!(
                "two margins of {} mm leave no width in a {} mm window",
                s.margin_mm, b.window.width_mm
            ),
        );
    }
    if !positive(s.tape_mm) {
        bad(
            Place::Setup("tape_mm"),
            format!("must be a positive thickness in mm, got {}", s.tape_mm),
        );
    }
    for (key, v) in [
        ("wire_class_c", s.wire_class_c),
        ("tape_class_c", s.tape_class_c),
        ("bobbin_class_c", s.bobbin_class_c),
    ] {
        if let Some(v) = v
            && !(v.is_finite() && (60.0..=300.0).contains(&v))
        {
            bad(
                Place::Setup(key),
                format!("expected a thermal class in C (IEC 60085: 130 B, 155 F, 180 H), got {v}"),
            );
        }
    }
    if let Some(f) = s.frequency_khz
        && !positive(f)
    {
        bad(
            Place::Setup("frequency_khz"),
            format!("must be a positive frequency in kHz, got {f}"),
        );
    }
}

/// The windings: names, turns, strands and wire.
fn check_windings(build: &Build, _resolved: &Resolved, bad: &mut dyn FnMut(Place, String)) {
    // The windings.
    if build.windings.is_empty() {
        bad(
            Place::Top("winding"),
            "a build needs at least one [[winding]]".into(),
        );
    }
    for (i, w) in build.windings.iter().enumerate() {
        if w.name.trim().is_empty() {
            bad(Place::Winding(i, "name"), "must not be empty".into());
        }
        if build.windings[..i].iter().any(|o| o.name == w.name) {
            bad(
                Place::Winding(i, "name"),
                format!(
                    "\"{}\" is used by an earlier winding; names must be unique",
                    w.name
                ),
            );
        }
        if w.turns == 0 {
            bad(Place::Winding(i, "turns"), "must be at least 1".into());
        } else if w.turns > MAX_TURNS {
            bad(
                Place::Winding(i, "turns"),
                format!(
                    "{} turns is beyond hand winding (at most {MAX_TURNS})",
                    w.turns
                ),
            );
        }
        if w.strands == 0 {
            bad(Place::Winding(i, "strands"), "must be at least 1".into());
        } else if w.strands > MAX_STRANDS {
            bad(
                Place::Winding(i, "strands"),
                format!(
                    "{} strands is beyond hand winding (at most {MAX_STRANDS})",
                    w.strands
                ),
            );
        }
        match w.conductor {
            Conductor::Round => check_wire(i, w.wire, bad),
            _ => super::conductor::check(
                i,
                w,
                usable_width_mm(build),
                build.bobbin.window.height_mm,
                bad,
            ),
        }
        if let Some(c) = w.current_rms_a
            && !(c.is_finite() && c >= 0.0)
        {
            bad(
                Place::Winding(i, "current_rms_a"),
                format!("must be zero or positive, got {c}"),
            );
        }
    }
}

/// A winding's wire: an AWG size in the table, a metric size up to 5 mm, or measured
/// diameters that make sense.
fn check_wire(i: usize, wire: WireSize, bad: &mut dyn FnMut(Place, String)) {
    match wire {
        WireSize::Awg(n) if !AWG_RANGE.contains(&n) => bad(
            Place::Winding(i, "wire"),
            format!(
                "AWG {n} is outside the table (awg{} to awg{})",
                AWG_RANGE.start(),
                AWG_RANGE.end()
            ),
        ),
        WireSize::Metric { bare_mm } if !(bare_mm > 0.0 && bare_mm <= 5.0) => bad(
            Place::Winding(i, "wire"),
            format!("expected a bare diameter above 0 and up to 5 mm, got {bare_mm} mm"),
        ),
        WireSize::Measured { bare_mm, od_mm } => {
            if !positive(bare_mm) || !positive(od_mm) {
                bad(
                    Place::Winding(i, "wire"),
                    format!("bare_mm and od_mm must be positive, got {bare_mm} and {od_mm}"),
                );
            } else if od_mm < bare_mm {
                bad(
                    Place::Winding(i, "wire"),
                    format!("od_mm ({od_mm}) is smaller than bare_mm ({bare_mm})"),
                );
            }
        }
        _ => {}
    }
}

/// The stack's sections: tape wraps, the winding each names, its turns and fit in the width.
fn check_sections(build: &Build, resolved: &Resolved, bad: &mut dyn FnMut(Place, String)) {
    // The stack.
    if build.stack.is_empty() {
        bad(
            Place::Top("stack"),
            "a build needs at least one [[stack]] section".into(),
        );
    }
    for (i, section) in build.stack.iter().enumerate() {
        match section {
            Section::Tape { wraps } => {
                if *wraps == 0 {
                    bad(Place::Section(i, "tape"), "must be at least 1 wrap".into());
                } else if *wraps > MAX_WRAPS {
                    bad(
                        Place::Section(i, "tape"),
                        format!("{wraps} wraps is more than {MAX_WRAPS}"),
                    );
                }
            }
            Section::Winding(ws) => check_winding_section(build, resolved, i, ws, bad),
        }
    }
}

/// One winding section: the winding and partner it names, its layer tape and turns, and
/// that one turn fits in the usable width.
fn check_winding_section(
    build: &Build,
    resolved: &Resolved,
    i: usize,
    ws: &WindingSection,
    bad: &mut dyn FnMut(Place, String),
) {
    let list = || {
        build
            .windings
            .iter()
            .map(|w| w.name.as_str())
            .collect::<Vec<_>>()
            .join(", ")
    };
    let wires = &resolved.wires;
    let w_u = usable_width_mm(build);
    let r = resolved.sections[i];
    let (a, partner) = (r.winding, r.partner);
    if a.is_none() {
        bad(
            Place::Section(i, "winding"),
            format!(
                "unknown winding \"{}\"; the windings are {}",
                ws.winding,
                list()
            ),
        );
    }
    let c = match &ws.partner {
        Some(n) => {
            let c = partner;
            if c.is_none() {
                bad(
                    Place::Section(i, "with"),
                    format!("unknown winding \"{n}\"; the windings are {}", list()),
                );
            } else if c == a {
                bad(
                    Place::Section(i, "with"),
                    format!("\"{n}\" cannot be wound bifilar with itself"),
                );
            }
            c
        }
        None => None,
    };
    if ws.layer_tape > MAX_WRAPS {
        bad(
            Place::Section(i, "layer_tape"),
            format!("{} wraps is more than {MAX_WRAPS}", ws.layer_tape),
        );
    }
    if r.turns == 0 {
        let why = if ws.turns.is_some() {
            "must be at least 1".to_string()
        } else {
            format!("no turns of \"{}\" are left for this section", ws.winding)
        };
        bad(Place::Section(i, "turns"), why);
    }
    if let Some(a) = a {
        let pitch_of = |k: usize| super::conductor::pitch_mm(&build.windings[k], &wires[k], w_u);
        let pitch = pitch_of(a) + c.filter(|&c| c != a).map_or(0.0, pitch_of);
        if super::conductor::refuse_bifilar_foil(build, i, a, c, bad) {
            return;
        }
        if w_u > 0.0 && pitch > 0.0 && turns_per_layer(w_u, pitch) == 0 {
            bad(
                Place::Section(i, "winding"),
                format!(
                    "one turn needs {pitch:.3} mm of width but only {w_u:.3} mm is usable between the margins"
                ),
            );
        }
    }
}

/// Each winding's turns are those its sections wind (as the winding or the bifilar partner).
fn check_turn_sums(build: &Build, resolved: &Resolved, bad: &mut dyn FnMut(Place, String)) {
    for (k, w) in build.windings.iter().enumerate() {
        // Every section that winds it, as the winding or as the bifilar partner.
        let sum: u64 = resolved
            .sections
            .iter()
            .flat_map(|r| [(r.winding, r.turns), (r.partner, r.turns)])
            .filter(|&(i, _)| i == Some(k))
            .map(|(_, turns)| u64::from(turns))
            .sum();
        if w.turns > 0 && sum != u64::from(w.turns) {
            let msg = if sum == 0 {
                format!(
                    "\"{}\" has {} turns but no [[stack]] section winds it",
                    w.name, w.turns
                )
            } else {
                format!(
                    "the sections of \"{}\" add up to {} turns, but the winding has {}",
                    w.name, sum, w.turns
                )
            };
            bad(Place::Winding(k, "turns"), msg);
        }
    }
}
