//! AC resistance of litz by Sullivan's low-frequency proximity model (C. R. Sullivan,
//! "Optimal choice for number of strands in a litz-wire transformer winding", IEEE Trans.
//! Power Electronics 14(2), 1999, pp. 283-291), with each strand in the winding's 1-D field
//! and, as in Bartoli, Noferi, Reatti and Kazimierczuk (PESC 1996), in its own bundle's
//! field; and the skin effect of the strand itself. Every term grows as `(d / delta)^4`.

use std::f64::consts::PI;

/// The geometry of one litz winding that its AC factor needs (all mm).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LitzGeometry {
    /// Bare diameter of a strand, `d`.
    pub strand_mm: f64,
    /// Strands in one bundle, `n_b`.
    pub strands_per_bundle: f64,
    /// Strands carrying one turn's current (bundles in parallel x strands), `n`.
    pub strands_per_turn: f64,
    /// Bundle diameter under the serving, `2 R`.
    pub bundle_mm: f64,
    /// Wound breadth, `b`.
    pub breadth_mm: f64,
}

/// `G` of `F_R = 1 + G (d / delta)^4`, with `mean_f2` the length-weighted mean square of the
/// MMF (in turns of this winding) across its layers:
/// `G = 1/768 + pi^2 n^2 d^2 <F^2> / (64 b^2) + n_b^2 d^2 / (128 (2R)^2)`.
///
/// - skin: a round strand's `1 + (r/delta)^4 / 48`, `r = d/2` (low-frequency Bessel series);
/// - the winding's field: `H = F I / b`, each strand loses `pi omega^2 mu0^2 sigma d^4 H^2 / 128`
///   per metre; over DC this is the term above (Sullivan's eq. with `k = 1` when the field
///   runs from zero to `N` across the winding, `<F^2> = N^2 / 3`);
/// - the bundle's own field: `H = I r / (2 pi R^2)` inside it, `<H^2> = I^2 / (8 pi^2 R^2)`.
pub fn g_coefficient(g: &LitzGeometry, mean_f2: f64) -> f64 {
    let d = g.strand_mm;
    let n = g.strands_per_turn;
    let skin = 1.0 / 768.0;
    let winding = if g.breadth_mm > 0.0 {
        PI * PI * n * n * d * d * mean_f2 / (64.0 * g.breadth_mm * g.breadth_mm)
    } else {
        0.0
    };
    let bundle = if g.bundle_mm > 0.0 {
        g.strands_per_bundle * g.strands_per_bundle * d * d / (128.0 * g.bundle_mm * g.bundle_mm)
    } else {
        0.0
    };
    skin + winding + bundle
}

/// `F_R` at a strand diameter over skin depth `x = d / delta`: `1 + G x^4` while the low-
/// frequency model holds (`x <= 1`); beyond, `1 + G x`, continuous at 1 and growing as the
/// square root of frequency like a thick conductor's proximity loss (our choice: the model
/// gives no more there, and litz is not worth winding there anyway).
pub fn factor(g_coeff: f64, x: f64) -> f64 {
    if !(x.is_finite() && x > 0.0) {
        return 1.0;
    }
    if x <= 1.0 {
        1.0 + g_coeff * x.powi(4)
    } else {
        1.0 + g_coeff * x
    }
}
