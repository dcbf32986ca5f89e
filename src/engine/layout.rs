//! Turns into layers: turns per layer, layers, the last layer, heights and MLT per layer.

use super::constants::TURNS_PER_LAYER_EPS;
use super::geometry::mlt_at_mm;
use crate::library::wires::ResolvedWire;
use crate::model::{Build, Section, SectionRef};

/// One layer of a winding section, as laid.
#[derive(Debug, Clone, PartialEq)]
pub struct Layer {
    /// Height of the layer's inner face above the tube surface.
    pub y_mm: f64,
    /// Height of the layer (mm): the wire's overall diameter (the larger of a bifilar pair).
    pub height_mm: f64,
    /// Turns of the section's winding in this layer (and of the partner's, if bifilar).
    pub turns: u32,
    /// MLT at the layer's centre.
    pub mlt_mm: f64,
}

/// A section as laid in the window.
#[derive(Debug, Clone, PartialEq)]
pub struct Laid {
    /// Height of the section's inner face above the tube surface (mm).
    pub y_mm: f64,
    /// Height of the section (mm), every layer and its tape.
    pub height_mm: f64,
    /// Tape, or a winding section with its layers.
    pub kind: LaidKind,
}

/// What a laid section holds.
#[derive(Debug, Clone, PartialEq)]
pub enum LaidKind {
    /// Insulation tape over the whole width.
    Tape {
        /// Wraps of tape.
        wraps: u32,
    },
    /// Turns of a winding, in layers.
    Winding {
        /// Index into `build.windings`; `None` only for a name validation refuses.
        winding: Option<usize>,
        /// The bifilar partner, as an index into `build.windings`.
        partner: Option<usize>,
        /// Turns of this section (each bifilar turn counts once).
        turns: u32,
        /// Width one turn takes along the layer (mm): the overall diameter times the strands,
        /// wound side by side (both wires' together when bifilar).
        pitch_mm: f64,
        /// Turns that fit across the usable width.
        turns_per_layer: u32,
        /// Height of one layer of wire (mm), the larger overall diameter, without the layer tape.
        layer_height_mm: f64,
        /// Wraps of tape between the layers.
        layer_tape: u32,
        /// The last layer space-wound (`WindingSection::spread`).
        spread: bool,
        /// The layers from the inside outward.
        layers: Vec<Layer>,
    },
}

/// What the layout and the checks need of a build's names and defaults, found once: the
/// wire diameters, the windings each section names, and each section's turns.
#[derive(Debug, Clone, PartialEq)]
pub struct Resolved {
    /// In `build.windings` order.
    pub wires: Vec<ResolvedWire>,
    /// In `build.stack` order.
    pub sections: Vec<SectionRef>,
}

impl Resolved {
    /// The wires and the stack's names of a build, resolved.
    pub fn new(build: &Build) -> Self {
        Resolved {
            wires: resolved_wires(build),
            sections: build.section_refs(),
        }
    }
}

/// Diameters of every winding's conductor (`engine::conductor::resolve`), in
/// `build.windings` order.
pub fn resolved_wires(build: &Build) -> Vec<ResolvedWire> {
    build
        .windings
        .iter()
        .map(super::conductor::resolve)
        .collect()
}

/// Usable width between the margin tapes: `window.width_mm - 2 margin_mm`.
pub fn usable_width_mm(build: &Build) -> f64 {
    build.bobbin.window.width_mm - 2.0 * build.setup.margin_mm
}

/// Turns per layer for a pitch: `floor(w_u / pitch + 1e-9)`; 0 when the wire does not fit.
pub fn turns_per_layer(usable_width_mm: f64, pitch_mm: f64) -> u32 {
    if pitch_mm.is_nan() || pitch_mm <= 0.0 || usable_width_mm.is_nan() || usable_width_mm <= 0.0 {
        return 0;
    }
    let n = (usable_width_mm / pitch_mm + TURNS_PER_LAYER_EPS).floor();
    if n >= f64::from(u32::MAX) {
        u32::MAX
    } else {
        n as u32
    }
}

/// Lay out the whole stack, from the tube outward. Unknown windings (refused by validation)
/// are laid as empty sections so the result stays aligned with `build.stack`.
pub fn lay_out(build: &Build, resolved: &Resolved) -> Vec<Laid> {
    let w_u = usable_width_mm(build);
    let tape_mm = build.setup.tape_mm;
    let wires = &resolved.wires;
    let mut y = 0.0;
    let mut out = Vec::with_capacity(build.stack.len());
    for (section, r) in build.stack.iter().zip(&resolved.sections) {
        let (wi, partner, turns) = (r.winding, r.partner, r.turns);
        let laid = match section {
            Section::Tape { wraps } => Laid {
                y_mm: y,
                height_mm: f64::from(*wraps) * tape_mm,
                kind: LaidKind::Tape { wraps: *wraps },
            },
            Section::Winding(ws) => {
                let pitch_of =
                    |i: usize| super::conductor::pitch_mm(&build.windings[i], &wires[i], w_u);
                let od_of = |i: usize| wires[i].od_mm;
                let (pitch, layer_h) = match (wi, partner) {
                    (Some(a), Some(b)) => (pitch_of(a) + pitch_of(b), od_of(a).max(od_of(b))),
                    (Some(a), None) => (pitch_of(a), od_of(a)),
                    _ => (0.0, 0.0),
                };
                let n_l = turns_per_layer(w_u, pitch);
                let gap = f64::from(ws.layer_tape) * tape_mm;
                let mut layers = Vec::new();
                if n_l > 0 && wi.is_some() {
                    let count = turns.div_ceil(n_l);
                    for k in 0..count {
                        let in_layer = if k + 1 == count { turns - k * n_l } else { n_l };
                        let ly = y + f64::from(k) * (layer_h + gap);
                        layers.push(Layer {
                            y_mm: ly,
                            height_mm: layer_h,
                            turns: in_layer,
                            mlt_mm: mlt_at_mm(&build.bobbin.tube, ly + layer_h / 2.0),
                        });
                    }
                }
                let n = layers.len() as f64;
                let height = if layers.is_empty() {
                    0.0
                } else {
                    n * layer_h + (n - 1.0) * gap
                };
                Laid {
                    y_mm: y,
                    height_mm: height,
                    kind: LaidKind::Winding {
                        winding: wi,
                        partner,
                        turns,
                        pitch_mm: pitch,
                        turns_per_layer: n_l,
                        layer_height_mm: layer_h,
                        layer_tape: ws.layer_tape,
                        spread: ws.spread,
                        layers,
                    },
                }
            }
        };
        y += laid.height_mm;
        out.push(laid);
    }
    out
}
