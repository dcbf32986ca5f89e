//! Voltage stress inside the winding: between adjacent layers of a section, across a bifilar
//! pair, and between adjacent sections on the same side of the isolation barrier, against what
//! the enamel and the tape between are usually good for.

use super::converter::ConverterEval;
use super::layout::{Laid, LaidKind, Layer};
use crate::model::{Build, Insulation, Name, Operating, ResetSide, Role, Winding};

/// A working figure for one enamel film (V), well below the IEC 60317-0-1 breakdown minimums
/// (room-temperature type tests of one to several kV) and below the partial-discharge
/// inception of roughly 400-600 V peak between enamelled turns (from memory): grade 1 75 V,
/// grade 2 150 V, grade 3 225 V; triple-insulated wire 500 V. Two touching turns have two films
/// between them.
pub fn film_working_v(grade: Insulation) -> f64 {
    match grade {
        Insulation::Grade1 => 75.0,
        Insulation::Grade2 => 150.0,
        Insulation::Grade3 => 225.0,
        Insulation::Tiw => 500.0,
    }
}

/// A working figure for one wrap of insulating tape (V): a 25-60 um polyester film breaks
/// down at several kV; 500 V a wrap is a conservative working figure (from memory).
pub const TAPE_WRAP_WORKING_V: f64 = 500.0;

/// Two things side by side in the build and the voltage between them.
#[derive(Debug, Clone, PartialEq)]
pub struct PairStress {
    /// Stack indices (0-based) of the two sections (the same for a bifilar pair).
    pub inner_section: usize,
    /// Stack index of the outer section.
    pub outer_section: usize,
    /// The winding of the inner section (the first of a bifilar pair).
    pub inner: Name,
    /// The winding of the outer section (the partner of a bifilar pair).
    pub outer: Name,
    /// The highest voltage between them (V).
    pub voltage_v: f64,
    /// What the films and the tape between are usually good for (see above).
    pub limit_v: f64,
    /// Wraps of tape between them.
    pub wraps: u32,
}

/// The highest voltage between two adjacent layers of one section.
#[derive(Debug, Clone, PartialEq)]
pub struct LayerStress {
    /// Stack index (0-based) of the section.
    pub section: usize,
    /// The section's winding.
    pub winding: Name,
    /// The highest voltage between two adjacent layers (V): `(2 min(a, b) - 1)` volts per turn.
    pub voltage_v: f64,
    /// What the two films and the layer tape are usually good for (V).
    pub limit_v: f64,
    /// Wraps of tape between the layers.
    pub layer_tape: u32,
}

/// Voltages inside the build against what enamel and tape stand: between layers, between
/// the wires of a bifilar pair, and between sections on the same side of the barrier.
#[derive(Debug, Clone, PartialEq)]
pub struct StressEval {
    /// The highest volts per turn on the core: on-state `vin_max/Np`, reset `vin_max/Nr`
    /// (primary-side) or `Vo'/Nr` (secondary-side).
    pub volts_per_turn_v: f64,
    /// Per winding (indexed like `build.windings`): the highest adjacent-layer voltage.
    pub layer_voltage_v: Vec<Option<f64>>,
    /// The worst layer pair of each multi-layer section.
    pub layers: Vec<LayerStress>,
    /// Each bifilar section's pair of wires.
    pub bifilar: Vec<PairStress>,
    /// Each winding section against the winding section below it, same side of the barrier.
    pub between_sections: Vec<PairStress>,
}

/// `(2 min(a, b) - 1) V_turn`: two adjacent layers of `a` and `b` turns wound with the usual
/// return at the flange; the first turn of one layer lies over the last of the one below, and
/// the turns at the far flange are `2 min(a, b) - 1` turns apart along the wire.
pub fn adjacent_layers_v(a: u32, b: u32, volts_per_turn: f64) -> f64 {
    let m = a.min(b);
    if m == 0 {
        return 0.0;
    }
    f64::from(2 * m - 1) * volts_per_turn
}

/// A last layer of `b` turns spaced evenly across the width over a close-wound layer of
/// `a` (`b < a`): wound back from the far flange, its last turn lies half a spacing in from
/// the start flange, over turn `floor(a / 2b)` of the layer below (at least the first), so
/// the two are `a + b - max(1, floor(a / 2b))` turns apart along the wire. Spacing a partial
/// layer so raises its worst voltage to the layer below from `2b - 1` turns towards a whole
/// layer's; for `b >= a` the close-wound figure holds.
pub fn spread_layer_v(a: u32, b: u32, volts_per_turn: f64) -> f64 {
    if b >= a || b == 0 {
        return adjacent_layers_v(a, b, volts_per_turn);
    }
    let under = (a / (2 * b)).max(1);
    f64::from(a + b - under) * volts_per_turn
}

/// The worst voltage between adjacent layers of a section's `layers` (from the tube out),
/// its last layer spaced across the width when `spread`.
fn section_layers_v(layers: &[Layer], spread: bool, volts_per_turn: f64) -> f64 {
    let pairs = layers.len().saturating_sub(1);
    (0..pairs)
        .map(|i| {
            let (a, b) = (layers[i].turns, layers[i + 1].turns);
            if spread && i + 1 == pairs {
                spread_layer_v(a, b, volts_per_turn)
            } else {
                adjacent_layers_v(a, b, volts_per_turn)
            }
        })
        .fold(0.0, f64::max)
}

/// On the primary side of the barrier: the primary, and the reset winding when it clamps to
/// the input.
fn primary_side(role: Role, reset: ResetSide) -> Option<bool> {
    match role {
        Role::Primary => Some(true),
        Role::Reset => Some(reset == ResetSide::Primary),
        Role::Secondary => Some(false),
        Role::Auxiliary => None,
    }
}

/// The stress figures at `vin_max_v`; `None` without an operating point.
pub fn evaluate(build: &Build, laid: &[Laid], c: &ConverterEval) -> Option<StressEval> {
    let op = build.operating.as_ref()?;
    let (np, nr) = (f64::from(c.np), f64::from(c.nr));
    // Reset to the output returns to the regulated one.
    let reg = op.regulated();
    let vo = reg.vout_v + reg.rectifier_drop_v;
    let reset_vpt = match op.reset_side {
        ResetSide::Primary => op.vin_max_v / nr,
        ResetSide::Secondary => vo / nr,
    };
    let vpt = (op.vin_max_v / np).max(reset_vpt);
    let w = &build.windings;
    let film = |k: usize| film_working_v(w[k].insulation);
    let mut layer_voltage_v = vec![None::<f64>; w.len()];
    let mut layers = Vec::new();
    let mut bifilar = Vec::new();
    let mut between_sections = Vec::new();
    // The last winding section seen, and the tape wraps laid since.
    let mut last: Option<(usize, usize, u32)> = None;
    let mut wraps_since = 0u32;
    for (si, l) in laid.iter().enumerate() {
        match &l.kind {
            LaidKind::Tape { wraps } => wraps_since += wraps,
            LaidKind::Winding {
                winding: Some(k),
                partner,
                turns,
                layers: ls,
                layer_tape,
                spread,
                ..
            } => {
                let k = *k;
                let worst = section_layers_v(ls, *spread, vpt);
                let films = partner.map_or(2.0 * film(k), |j| film(k).min(film(j)) * 2.0);
                if ls.len() > 1 {
                    layers.push(LayerStress {
                        section: si,
                        winding: w[k].name.clone(),
                        voltage_v: worst,
                        limit_v: films + f64::from(*layer_tape) * TAPE_WRAP_WORKING_V,
                        layer_tape: *layer_tape,
                    });
                }
                for i in [Some(k), *partner].into_iter().flatten() {
                    let v = layer_voltage_v[i].get_or_insert(0.0);
                    *v = v.max(worst);
                }
                if let Some(j) = *partner {
                    bifilar.push(bifilar_pair(w, op, c, si, (k, j), vpt));
                }
                if let Some(prev) = last {
                    between_sections.extend(section_pair(
                        w,
                        op.reset_side,
                        prev,
                        (si, k, *turns),
                        wraps_since,
                        vpt,
                    ));
                }
                last = Some((si, k, *turns));
                wraps_since = 0;
            }
            LaidKind::Winding { winding: None, .. } => {}
        }
    }
    Some(StressEval {
        volts_per_turn_v: vpt,
        layer_voltage_v,
        layers,
        bifilar,
        between_sections,
    })
}

/// The voltage (V) between the turns of a bifilar pair `(k, j)` in section `si`, against
/// what the two enamel films stand: the switch's off-state voltage for a primary wound with
/// a reset that clamps to the input, otherwise both windings' turns at the worst V per turn.
fn bifilar_pair(
    w: &[Winding],
    op: &Operating,
    c: &ConverterEval,
    si: usize,
    (k, j): (usize, usize),
    vpt: f64,
) -> PairStress {
    let film = |k: usize| film_working_v(w[k].insulation);
    let pr = [w[k].role, w[j].role];
    let v = if op.reset_side == ResetSide::Primary
        && pr.contains(&Role::Primary)
        && pr.contains(&Role::Reset)
    {
        // The switch end of the primary lies beside the reset's end at the
        // input rail or ground: the off-state voltage between neighbours.
        c.switch_voltage_v
    } else {
        f64::from(w[k].turns + w[j].turns) * vpt
    };
    PairStress {
        inner_section: si,
        outer_section: si,
        inner: w[k].name.clone(),
        outer: w[j].name.clone(),
        voltage_v: v,
        limit_v: film(k) + film(j),
        wraps: 0,
    }
}

/// The voltage (V) between two winding sections on the same side of the barrier, each
/// `(section, winding, turns)`, against their films and the `wraps` of tape between them;
/// `None` across the barrier, where the isolation checks rule.
fn section_pair(
    w: &[Winding],
    reset_side: ResetSide,
    (pi, pk, pturns): (usize, usize, u32),
    (si, k, turns): (usize, usize, u32),
    wraps_since: u32,
    vpt: f64,
) -> Option<PairStress> {
    let film = |k: usize| film_working_v(w[k].insulation);
    let sides = (
        primary_side(w[pk].role, reset_side),
        primary_side(w[k].role, reset_side),
    );
    // Across the barrier the isolation checks and the working voltage rule.
    let across = matches!(sides, (Some(a), Some(b)) if a != b);
    if across {
        return None;
    }
    Some(PairStress {
        inner_section: pi,
        outer_section: si,
        inner: w[pk].name.clone(),
        outer: w[k].name.clone(),
        // No shared reference is assumed: at worst the two add.
        voltage_v: f64::from(pturns + turns) * vpt,
        limit_v: film(pk) + film(k) + f64::from(wraps_since) * TAPE_WRAP_WORKING_V,
        wraps: wraps_since,
    })
}
