//! A spectrum's harmonics summed against Dowell's two layer terms, `sum_n I_n^2 (D_n G1(D_n),
//! D_n G2(D_n))` with `D_n = D sqrt(n)` (Hurley, Gath and Breslin 2000), at forty points in
//! `sqrt(n)` instead of a hundred harmonics.
//!
//! The first [`EXACT`] harmonics, which carry most of the power, are taken one by one. Above
//! them the terms are a smooth function of `sqrt(n)` (the skin effect deepens as the square
//! root of the frequency): over each block of harmonics they are replaced by the cubic through
//! their values at four Chebyshev points of the block, so that the block's sum is four
//! products, with weights (the block's powers times the cubic's Lagrange weights) that depend
//! only on the spectrum and are found once with it. The sum agrees with the harmonic-by-
//! harmonic one to a few parts in a million (the tests hold it to 1e-5), far inside the model's
//! own accuracy, and costs two fifths of it per layer.

use super::dowell_table::Table;
use super::harmonics::{HARMONICS, Spectrum};
use std::sync::OnceLock;

/// Harmonics taken one by one.
const EXACT: usize = 12;
/// Points per block above [`EXACT`]: the cubic's four.
const PER_BLOCK: usize = 4;
/// The blocks above [`EXACT`], first and last harmonic of each, a little under one in
/// `sqrt(n)` wide.
const BLOCKS: [(usize, usize); 7] = [
    (13, 20),
    (21, 30),
    (31, 42),
    (43, 56),
    (57, 72),
    (73, 90),
    (91, HARMONICS),
];
/// The points a sum takes the terms at: the exact harmonics' and the blocks' nodes.
const SUM_POINTS: usize = EXACT + BLOCKS.len() * PER_BLOCK;

/// The points, in rising order, and each interpolated harmonic's weights on its block's
/// nodes; made once per process.
struct Points {
    /// `sqrt(n)` of the exact harmonics, then the blocks' Chebyshev nodes.
    roots: [f64; SUM_POINTS],
    /// For harmonic `EXACT + 1 + k`: the cubic's Lagrange weight of each of its block's four
    /// nodes at `sqrt(n)`.
    lagrange: [[f64; PER_BLOCK]; HARMONICS - EXACT],
}

fn points() -> &'static Points {
    static POINTS: OnceLock<Points> = OnceLock::new();
    POINTS.get_or_init(|| {
        let mut roots = [0.0; SUM_POINTS];
        for (n, r) in roots[..EXACT].iter_mut().enumerate() {
            *r = ((n + 1) as f64).sqrt();
        }
        let mut lagrange = [[0.0; PER_BLOCK]; HARMONICS - EXACT];
        for (b, &(first, last)) in BLOCKS.iter().enumerate() {
            let nodes = chebyshev_nodes((first as f64).sqrt(), (last as f64).sqrt());
            roots[EXACT + b * PER_BLOCK..][..PER_BLOCK].copy_from_slice(&nodes);
            for n in first..=last {
                let x = (n as f64).sqrt();
                lagrange[n - EXACT - 1] = std::array::from_fn(|i| {
                    let others = (0..PER_BLOCK).filter(|&j| j != i);
                    others
                        .map(|j| (x - nodes[j]) / (nodes[i] - nodes[j]))
                        .product()
                });
            }
        }
        Points { roots, lagrange }
    })
}

/// The four Chebyshev points of `[lo, hi]`, in rising order: the nodes that keep a cubic's
/// interpolation error smallest over the interval.
fn chebyshev_nodes(lo: f64, hi: f64) -> [f64; PER_BLOCK] {
    let (mid, half) = (0.5 * (lo + hi), 0.5 * (hi - lo));
    std::array::from_fn(|i| {
        let k = (PER_BLOCK - 1 - i) as f64;
        mid + half * ((2.0 * k + 1.0) * std::f64::consts::PI / (2.0 * PER_BLOCK as f64)).cos()
    })
}

/// What a spectrum of [`HARMONICS`] brings to every sum, found once with it: the weight of
/// each point's terms, where the rest of the power is taken, and how much that is.
#[derive(Debug, Clone, PartialEq)]
pub struct SumWeights {
    /// The power of each exact harmonic, then each block's powers times the Lagrange weights
    /// of its nodes. Harmonics below the floor (1e-12 of the power) count as carrying none.
    at_points: [f64; SUM_POINTS],
    /// `sqrt(n)` of the highest harmonic above the floor: what Parseval leaves above the
    /// last harmonic is taken at its terms (none above the floor: a resistive layer's).
    last_root: Option<f64>,
    /// That power: the RMS squared less the DC part's and the harmonics' above the floor.
    rest: f64,
}

impl SumWeights {
    /// The weights of the squared RMS `powers` of harmonics 1 to [`HARMONICS`], of a waveform
    /// with mean `dc` and RMS squared `rms_sq`.
    pub fn of(powers: &[f64; HARMONICS], dc: f64, rms_sq: f64) -> Self {
        let floor = 1e-12 * rms_sq;
        let kept = |p: f64| if p > floor { p } else { 0.0 };
        let mut at_points = [0.0; SUM_POINTS];
        for (w, &p) in at_points.iter_mut().zip(&powers[..EXACT]) {
            *w = kept(p);
        }
        let lagrange = &points().lagrange;
        for (b, &(first, last)) in BLOCKS.iter().enumerate() {
            let mut block = [0.0; PER_BLOCK];
            let rows = powers[first - 1..last]
                .iter()
                .zip(&lagrange[first - 1 - EXACT..]);
            for (&p, l) in rows {
                let p = kept(p);
                for (w, l) in block.iter_mut().zip(l) {
                    *w += p * l;
                }
            }
            at_points[EXACT + b * PER_BLOCK..][..PER_BLOCK].copy_from_slice(&block);
        }
        // A block's Lagrange weights add up to one at each harmonic, so the weights add up to
        // the power summed.
        let summed = dc * dc + at_points.iter().sum::<f64>();
        let last = powers.iter().rposition(|&p| p > floor);
        SumWeights {
            at_points,
            last_root: last.map(|k| ((k + 1) as f64).sqrt()),
            rest: (rms_sq - summed).max(0.0),
        }
    }
}

/// The two Dowell terms of a layer of D `d` (at the fundamental) summed over a spectrum:
/// `sum_n I_n^2 (D_n G1(D_n), D_n G2(D_n))` with `D_n = d sqrt(n)`, and what Parseval leaves
/// above the last harmonic taken at the last one's terms. With [`crate::engine::ac::layer_factor_from`]
/// this gives a layer's share of `waveform_factor` without a loop over harmonics per layer.
/// A spectrum of another length than [`HARMONICS`] is summed harmonic by harmonic.
pub fn summed_terms(s: &Spectrum, d: f64) -> (f64, f64) {
    let Some(w) = &s.sum_weights else {
        return harmonic_by_harmonic(s, d);
    };
    let table = Table::get();
    let (a, b) = table.weighted_sum(d, &points().roots, &w.at_points);
    let last = w.last_root.map_or((1.0, 0.5), |r| table.d_terms(d * r));
    (a + w.rest * last.0, b + w.rest * last.1)
}

/// The sum one harmonic at a time, the terms of each from the table: the definition, for a
/// spectrum of any length.
fn harmonic_by_harmonic(s: &Spectrum, d: f64) -> (f64, f64) {
    let table = Table::get();
    let floor = 1e-12 * s.rms_sq;
    let (mut a, mut b) = (0.0, 0.0);
    let mut summed = s.dc * s.dc;
    let mut last = (1.0, 0.5);
    for (k, &p) in s.harmonic_rms_sq.iter().enumerate() {
        if p <= floor {
            continue;
        }
        last = table.d_terms(d * ((k + 1) as f64).sqrt());
        a += p * last.0;
        b += p * last.1;
        summed += p;
    }
    let rest = (s.rms_sq - summed).max(0.0);
    (a + rest * last.0, b + rest * last.1)
}

#[cfg(test)]
mod tests {
    use super::*;

    /// The points rise (the table's fill checks only the first and the last), and each block's
    /// Lagrange weights reproduce a cubic in `sqrt(n)` exactly at every harmonic of the block.
    #[test]
    fn points_rise_and_weights_reproduce_cubics() {
        let p = points();
        assert!(p.roots.windows(2).all(|w| w[0] < w[1]));
        let cubic = |x: f64| 0.7 - 1.3 * x + 0.4 * x * x - 0.05 * x * x * x;
        for (k, weights) in p.lagrange.iter().enumerate() {
            let n = EXACT + 1 + k;
            let x = (n as f64).sqrt();
            let b = BLOCKS.iter().position(|&(_, last)| n <= last).unwrap_or(0);
            let nodes = &p.roots[EXACT + b * PER_BLOCK..][..PER_BLOCK];
            let by_weights: f64 = nodes.iter().zip(weights).map(|(&r, l)| l * cubic(r)).sum();
            assert!((by_weights - cubic(x)).abs() < 1e-12, "harmonic {n}");
        }
    }

    /// The interpolated sum against the plain one over every harmonic (the definition, with
    /// the same table): ramps and pulses, thin to thick layers, both terms (b beside a, as it
    /// enters a factor) and the proximity combination `2 a - 4 b` (where they nearly cancel)
    /// within 5e-6.
    #[test]
    fn interpolated_sum_holds_the_plain_sum() {
        use crate::engine::harmonics::{Waveform, spectrum};
        let waves = [
            Waveform::pulse(1.0, 0.4),
            Waveform::pulse(1.0, 0.5),
            Waveform::pulse(1.0, 0.03),
            Waveform::ramp(1.0, 1.3, 0.0, 0.38),
            Waveform::ramp(0.3, 0.0, 0.41, 0.77),
            Waveform::ramp(0.0, 2.0, 0.2, 0.9),
        ];
        let mut worst = (0.0_f64, 0, 0.0, 0);
        for (wi, w) in waves.iter().enumerate() {
            let s = spectrum(w, HARMONICS);
            let mut d = 0.01;
            while d < 40.0 {
                let (a, b) = summed_terms(&s, d);
                let (pa, pb) = harmonic_by_harmonic(&s, d);
                // b against a: it enters a layer's factor beside a, never alone.
                let pairs = [
                    (a, pa, pa),
                    (b, pb, pa),
                    (2.0 * a - 4.0 * b, 2.0 * pa - 4.0 * pb, 2.0 * pa - 4.0 * pb),
                ];
                for (k, (x, y, scale)) in pairs.into_iter().enumerate() {
                    let rel = (x - y).abs() / scale.abs().max(1e-300);
                    if rel > worst.0 {
                        worst = (rel, wi, d, k);
                    }
                }
                d *= 1.13;
            }
        }
        assert!(worst.0 <= 5e-6, "worst {worst:?}");
    }
}
