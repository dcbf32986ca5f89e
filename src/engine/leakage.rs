//! Leakage inductance by the 1-D MMF energy integral across the build.
//!
//! Drive winding X with unit current, return the same ampere-turns in Y; the MMF F(y) rises
//! linearly across each layer by the turns it holds and is flat across tape and gaps.
//! `L = mu0 / b_w * integral F(y)^2 MLT(y) dy` (Lee, Electronic Transformers and Circuits,
//! energy form; it reduces to mu0 N^2 MLT (a/3 + b/3 + c) / b_w for two plain sections).

use super::constants::{MM, MU0_H_PER_M};
use super::geometry::mlt_at_mm;
use super::layout::{Laid, LaidKind};
use crate::model::Tube;

/// A slice of the build with the MMF at its inner (`f_a`) and outer (`f_b`) faces.
#[derive(Debug, Clone, PartialEq)]
pub struct Slab {
    /// Height of the slab's inner face above the tube surface (mm).
    pub y0_mm: f64,
    /// Height of the slab's outer face (mm).
    pub y1_mm: f64,
    /// MMF at the inner face (ampere-turns, primary referred).
    pub f_a: f64,
    /// MMF at the outer face (ampere-turns).
    pub f_b: f64,
    /// (section index, layer index) when the slab is a winding layer.
    pub layer: Option<(usize, usize)>,
}

/// MMF profile across the build for an excitation given as ampere-turns per turn of each
/// winding (per unit drive current), indexed like `build.windings`.
pub fn mmf_profile(laid: &[Laid], weights: &[f64]) -> Vec<Slab> {
    let mut slabs = Vec::new();
    for_each_slab(laid, weights, |s| slabs.push(s));
    slabs
}

/// The slabs of [`mmf_profile`], handed one by one to `visit` (no list is built).
pub fn for_each_slab(laid: &[Laid], weights: &[f64], visit: impl FnMut(Slab)) {
    for_each_slab_by(laid, |i| weights.get(i).copied().unwrap_or(0.0), visit);
}

/// [`for_each_slab`] with the weights as a function of the winding index.
pub fn for_each_slab_by(
    laid: &[Laid],
    weight_of: impl Fn(usize) -> f64,
    mut visit: impl FnMut(Slab),
) {
    let weight = |i: Option<usize>| i.map_or(0.0, &weight_of);
    let mut f = 0.0;
    for (si, section) in laid.iter().enumerate() {
        match &section.kind {
            LaidKind::Tape { .. } => {
                if section.height_mm > 0.0 {
                    visit(Slab {
                        y0_mm: section.y_mm,
                        y1_mm: section.y_mm + section.height_mm,
                        f_a: f,
                        f_b: f,
                        layer: None,
                    });
                }
            }
            LaidKind::Winding {
                winding,
                partner,
                layers,
                ..
            } => {
                let per_turn = weight(*winding) + weight(*partner);
                let mut top = section.y_mm;
                for (li, layer) in layers.iter().enumerate() {
                    if layer.y_mm > top {
                        visit(Slab {
                            y0_mm: top,
                            y1_mm: layer.y_mm,
                            f_a: f,
                            f_b: f,
                            layer: None,
                        });
                    }
                    let f_b = f + per_turn * f64::from(layer.turns);
                    visit(Slab {
                        y0_mm: layer.y_mm,
                        y1_mm: layer.y_mm + layer.height_mm,
                        f_a: f,
                        f_b,
                        layer: Some((si, li)),
                    });
                    f = f_b;
                    top = layer.y_mm + layer.height_mm;
                }
            }
        }
    }
}

/// One slab's share of [`energy_integral_m2`].
fn slab_energy_m2(s: &Slab, tube: &Tube) -> f64 {
    let h = (s.y1_mm - s.y0_mm) * MM;
    let ym = 0.5 * (s.y0_mm + s.y1_mm);
    let fm = 0.5 * (s.f_a + s.f_b);
    let g = |f: f64, y: f64| f * f * mlt_at_mm(tube, y) * MM;
    h / 6.0 * (g(s.f_a, s.y0_mm) + 4.0 * g(fm, ym) + g(s.f_b, s.y1_mm))
}

/// `integral F(y)^2 MLT(y) dy` over the profile, in turns^2 m^2 (per unit current squared).
/// F is linear and MLT is linear in y on every slab, so Simpson's rule is exact.
pub fn energy_integral_m2(slabs: &[Slab], tube: &Tube) -> f64 {
    slabs.iter().map(|s| slab_energy_m2(s, tube)).sum()
}

/// The weights of a pair excitation: unit current in winding `x`, `y_per_turn` ampere-turns
/// per turn in winding `y` (which wins should the two be one), nothing elsewhere.
pub fn pair_weights(x: usize, y: usize, y_per_turn: f64) -> impl Fn(usize) -> f64 {
    move |i| match i {
        _ if i == y => y_per_turn,
        _ if i == x => 1.0,
        _ => 0.0,
    }
}

/// Leakage inductance (H) between windings `x` and `y` (index, turns), referred to `x`.
/// `wound_breadth_mm` is `b_w`, the breadth the turns occupy (the window width less both
/// margins); `winding_count` is the number of windings the indices count.
pub fn leakage_h(
    laid: &[Laid],
    tube: &Tube,
    wound_breadth_mm: f64,
    winding_count: usize,
    x: (usize, u32),
    y: (usize, u32),
) -> f64 {
    let (xi, nx) = x;
    let (yi, ny) = y;
    if ny == 0 || wound_breadth_mm <= 0.0 || xi >= winding_count || yi >= winding_count {
        return 0.0;
    }
    let weight = pair_weights(xi, yi, -f64::from(nx) / f64::from(ny));
    let mut energy = 0.0;
    for_each_slab_by(laid, weight, |s| energy += slab_energy_m2(&s, tube));
    MU0_H_PER_M / (wound_breadth_mm * MM) * energy
}

/// Leakage (H, referred to `x`) between two windings wound bifilar in the same layers, which
/// the 1-D field across the build cannot see: the field between neighbouring wires along each
/// layer. A bifilar layer is a row of conductors carrying +I (x) and -I (y) alternately at the
/// spacing `s` of their centres; the vector potential of an infinite row of alternating line
/// currents is `A = (mu0 I / 2 pi) ln|tan(pi z / 2 s)|` (2-D magnetostatics, by conformal
/// mapping), so the flux per unit length between a wire of radius r1 and its neighbour of
/// radius r2 is `(mu0 I / 2 pi) ln(4 s^2 / (pi^2 r1 r2))`, and each pair of turns adds that
/// times its MLT. Strands side by side count as one conductor of their summed copper area.
/// `conductor(k)` gives winding k's (equivalent radius, pitch) in mm.
pub fn bifilar_leakage_h(
    laid: &[Laid],
    x: usize,
    y: usize,
    conductor: impl Fn(usize) -> (f64, f64),
) -> f64 {
    let mut l = 0.0;
    for section in laid {
        let LaidKind::Winding {
            winding: Some(a),
            partner: Some(b),
            layers,
            ..
        } = &section.kind
        else {
            continue;
        };
        if !((*a == x && *b == y) || (*a == y && *b == x)) {
            continue;
        }
        let ((r1, p1), (r2, p2)) = (conductor(*a), conductor(*b));
        let s = 0.5 * (p1 + p2);
        if r1 <= 0.0 || r2 <= 0.0 || s <= 0.0 {
            continue;
        }
        // s >= r1 + r2 >= 2 sqrt(r1 r2), so the ratio is at least 16 / pi^2: never negative.
        let per_m = MU0_H_PER_M / (2.0 * std::f64::consts::PI)
            * (4.0 * s * s / (std::f64::consts::PI.powi(2) * r1 * r2))
                .ln()
                .max(0.0);
        for layer in layers {
            l += per_m * f64::from(layer.turns) * layer.mlt_mm * MM;
        }
    }
    l
}
