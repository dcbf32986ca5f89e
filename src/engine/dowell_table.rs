//! Dowell's two layer terms `(D G1(D), D G2(D))` (Dowell 1966) read from a table by cubic
//! Hermite interpolation, for the harmonic sums that need them at a hundred D's per layer.
//! The table is made once per process from `ac::d_terms`; it agrees with it to about 1e-7.

use super::ac;
use std::sync::OnceLock;

/// Spacing of the table's nodes in D. The Hermite error is `STEP^4 / 384` times the fourth
/// derivative, below 1e-7 of the terms here (the tests hold it to 1e-6).
const STEP: f64 = 0.05;
/// Nodes above zero; the table ends at `NODES x STEP` = D of 20.
const NODES: usize = 400;
/// Above this D the terms are `(D, 0)` to within `D e^-D`, below 1e-7 of `D`.
const END: f64 = STEP * NODES as f64;
/// Step of the central difference that gives each node's slopes.
const SLOPE_STEP: f64 = 1e-4;

/// The intervals between the nodes, each as the two cubics in `t` (0 at the node below, 1 at
/// the one above) that Hermite interpolation from the nodes' terms and slopes makes, their
/// coefficients side by side: `[[a0, b0], [a1, b1], [a2, b2], [a3, b3]]` with
/// `a(t) = a0 + t (a1 + t (a2 + t a3))`. One cache line per interval, read in one go, and the
/// two Horner steps taken together, a pair of terms at a time.
#[derive(Debug)]
pub struct Table {
    intervals: [[[f64; 2]; 4]; NODES],
}

/// One term's cubic between two nodes, from its values `y0`, `y1` and slopes `m0`, `m1` (per
/// unit D) at them: `y0 + m0 h t + (3 dy - (2 m0 + m1) h) t^2 + ((m0 + m1) h - 2 dy) t^3`.
fn hermite_cubic(y0: f64, m0: f64, y1: f64, m1: f64) -> [f64; 4] {
    let (m0, m1) = (m0 * STEP, m1 * STEP);
    let dy = y1 - y0;
    [y0, m0, 3.0 * dy - 2.0 * m0 - m1, m0 + m1 - 2.0 * dy]
}

impl Table {
    /// The table, made on first use (once per process, from `ac::d_terms`; every thread
    /// reads the same values).
    pub fn get() -> &'static Table {
        static TABLE: OnceLock<Box<Table>> = OnceLock::new();
        TABLE.get_or_init(|| {
            // Each node's terms and their slopes, `[a, b, da/dD, db/dD]`, at `i x STEP`.
            let node = |i: usize| {
                if i == 0 {
                    // At D -> 0 the terms tend to (1, 1/2) with zero slope (they move as D^4).
                    [1.0, 0.5, 0.0, 0.0]
                } else {
                    let x = i as f64 * STEP;
                    let (a, b) = ac::d_terms(x);
                    let (a_hi, b_hi) = ac::d_terms(x + SLOPE_STEP);
                    let (a_lo, b_lo) = ac::d_terms(x - SLOPE_STEP);
                    let k = 0.5 / SLOPE_STEP;
                    [a, b, (a_hi - a_lo) * k, (b_hi - b_lo) * k]
                }
            };
            let mut intervals = [[[0.0; 2]; 4]; NODES];
            let mut lo = node(0);
            for (i, cubics) in intervals.iter_mut().enumerate() {
                let hi = node(i + 1);
                let a = hermite_cubic(lo[0], lo[2], hi[0], hi[2]);
                let b = hermite_cubic(lo[1], lo[3], hi[1], hi[3]);
                *cubics = std::array::from_fn(|k| [a[k], b[k]]);
                lo = hi;
            }
            Box::new(Table { intervals })
        })
    }

    /// [`ac::d_terms`] from the table: the same `(D G1(D), D G2(D))` to about 1e-7.
    #[inline]
    pub fn d_terms(&self, d: f64) -> (f64, f64) {
        if (ac::D_SMALL..END).contains(&d) {
            self.on_table(d)
        } else if d >= END && d.is_finite() {
            (d, 0.0)
        } else {
            // Resistive, or not a D at all (NaN, infinite).
            (1.0, 0.5)
        }
    }

    /// `sum_k weights[k] x` [`Table::d_terms`]`(d x roots[k])`, both terms: a harmonic sum in
    /// one pass, with four running sums side by side so that the additions do not wait on
    /// each other. The roots are in rising order, so when the first and the last product lie
    /// on the table every one does and the loop needs no test per D.
    pub fn weighted_sum(&self, d: f64, roots: &[f64], weights: &[f64]) -> (f64, f64) {
        let on_table = |x: f64| (ac::D_SMALL..END).contains(&x);
        let ends = roots.first().zip(roots.last());
        if ends.is_some_and(|(&lo, &hi)| on_table(d * lo) && on_table(d * hi)) {
            lanes(roots, weights, |root| self.on_table(d * root))
        } else {
            lanes(roots, weights, |root| self.d_terms(d * root))
        }
    }

    /// The two cubics of the interval around `d`, for `d` from `ac::D_SMALL` to below `END`.
    #[inline]
    fn on_table(&self, d: f64) -> (f64, f64) {
        let u = d * (1.0 / STEP);
        // u < NODES, so the interval is at most the last one.
        let i = (u as u32).min(NODES as u32 - 1) as usize;
        let t = u - i as f64;
        let [c0, c1, c2, c3] = &self.intervals[i];
        let pair = |k: usize| c0[k] + t * (c1[k] + t * (c2[k] + t * c3[k]));
        (pair(0), pair(1))
    }
}

/// `sum_k weights[k] x terms(roots[k])` in four running sums, added up at the end.
#[inline]
fn lanes(roots: &[f64], weights: &[f64], terms: impl Fn(f64) -> (f64, f64)) -> (f64, f64) {
    const LANES: usize = 4;
    let (mut a, mut b) = ([0.0; LANES], [0.0; LANES]);
    let (r4, w4) = (roots.chunks_exact(LANES), weights.chunks_exact(LANES));
    let (r_rest, w_rest) = (r4.remainder(), w4.remainder());
    for (r, w) in r4.zip(w4) {
        for k in 0..LANES {
            let t = terms(r[k]);
            a[k] += w[k] * t.0;
            b[k] += w[k] * t.1;
        }
    }
    for (&r, &w) in r_rest.iter().zip(w_rest) {
        let t = terms(r);
        a[0] += w * t.0;
        b[0] += w * t.1;
    }
    ((a[0] + a[1]) + (a[2] + a[3]), (b[0] + b[1]) + (b[2] + b[3]))
}

/// [`ac::d_terms`] from the table: the same `(D G1(D), D G2(D))` to about 1e-7. A loop over
/// many D's takes [`Table::get`] once and calls [`Table::d_terms`].
pub fn d_terms(d: f64) -> (f64, f64) {
    Table::get().d_terms(d)
}

#[cfg(test)]
mod tests {
    use super::*;

    /// The table gives Dowell's terms as `ac::d_terms` computes them from sinh, cosh, sin and
    /// cos, to 1e-6 of the layer's resistive term, from a resistive layer to a very thick one.
    #[test]
    fn table_terms_agree_with_the_formula() {
        let mut d = 0.0005;
        while d < 40.0 {
            let (a, b) = d_terms(d);
            let (ea, eb) = ac::d_terms(d);
            assert!((a - ea).abs() <= 1e-6 * ea, "a at {d}: {a} vs {ea}");
            assert!((b - eb).abs() <= 1e-6 * ea, "b at {d}: {b} vs {eb}");
            d *= 1.0137;
        }
    }

    /// The one-pass weighted sum gives what the lookups one by one give, summed plainly: on
    /// nodes, between them, at the table's ends and past them.
    #[test]
    fn weighted_sum_equals_single_lookups_summed() {
        let roots: Vec<f64> = (1..=37).map(|n| f64::from(n).sqrt()).collect();
        let weights: Vec<f64> = (1..=37).map(|n| 1.0 / f64::from(n * n)).collect();
        let table = Table::get();
        for d in [0.0, 1e-4, 0.05, 0.1, 0.7735, 1.3, 2.0, 2.5, 3.4, 30.0] {
            let (a, b) = table.weighted_sum(d, &roots, &weights);
            let (mut pa, mut pb) = (0.0, 0.0);
            for (&r, &w) in roots.iter().zip(&weights) {
                let t = table.d_terms(d * r);
                pa += w * t.0;
                pb += w * t.1;
            }
            assert!(
                (a - pa).abs() <= 1e-14 * pa.abs(),
                "a at D {d}: {a} vs {pa}"
            );
            assert!(
                (b - pb).abs() <= 1e-14 * pa.abs(),
                "b at D {d}: {b} vs {pb}"
            );
        }
    }
}
