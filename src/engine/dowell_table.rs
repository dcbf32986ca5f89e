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
/// D's a [`Table::fill_terms`] pass takes at a time (at least `harmonics::HARMONICS`).
const BATCH: usize = 128;
/// 2^52: adding and taking it away rounds a smaller positive double to a whole number.
const TWO_52: f64 = 4_503_599_627_370_496.0;
/// The last node that has one above it, as a double.
const LAST_LOW_NODE: f64 = (NODES - 1) as f64;
/// Step of the central difference that gives each node's slopes.
const SLOPE_STEP: f64 = 1e-4;

/// The nodes: each one's terms and their slopes, `[a, b, da/dD, db/dD]`, at `i x STEP`.
/// A fixed-size array, so that the two nodes around a D are read without a bounds check.
#[derive(Debug)]
pub struct Table {
    nodes: [[f64; 4]; NODES + 1],
}

impl Table {
    /// The table, made on first use (once per process, from `ac::d_terms`; every thread
    /// reads the same values).
    pub fn get() -> &'static Table {
        static TABLE: OnceLock<Box<Table>> = OnceLock::new();
        TABLE.get_or_init(|| {
            let mut nodes = [[0.0; 4]; NODES + 1];
            for (i, node) in nodes.iter_mut().enumerate() {
                *node = if i == 0 {
                    // At D -> 0 the terms tend to (1, 1/2) with zero slope (they move as D^4).
                    [1.0, 0.5, 0.0, 0.0]
                } else {
                    let x = i as f64 * STEP;
                    let (a, b) = ac::d_terms(x);
                    let (a_hi, b_hi) = ac::d_terms(x + SLOPE_STEP);
                    let (a_lo, b_lo) = ac::d_terms(x - SLOPE_STEP);
                    let k = 0.5 / SLOPE_STEP;
                    [a, b, (a_hi - a_lo) * k, (b_hi - b_lo) * k]
                };
            }
            Box::new(Table { nodes })
        })
    }

    /// [`ac::d_terms`] from the table: the same `(D G1(D), D G2(D))` to about 1e-7.
    #[inline]
    pub fn d_terms(&self, d: f64) -> (f64, f64) {
        if (ac::D_SMALL..END).contains(&d) {
            self.between_nodes(d)
        } else if d >= END && d.is_finite() {
            (d, 0.0)
        } else {
            // Resistive, or not a D at all (NaN, infinite).
            (1.0, 0.5)
        }
    }

    /// [`Table::d_terms`] of `d x root` for each root, into `out`. The roots are in rising
    /// order, so when the first and the last product lie on the table every one does and the
    /// loop needs no test per D.
    pub fn fill_terms(&self, d: f64, roots: &[f64], out: &mut [(f64, f64)]) {
        let on_table = |x: f64| (ac::D_SMALL..END).contains(&x);
        let ends = roots.first().zip(roots.last());
        if ends.is_some_and(|(&lo, &hi)| on_table(d * lo) && on_table(d * hi)) {
            for (roots, out) in roots.chunks(BATCH).zip(out.chunks_mut(BATCH)) {
                self.batch_on_table(d, roots, out);
            }
        } else {
            for (t, &root) in out.iter_mut().zip(roots) {
                *t = self.d_terms(d * root);
            }
        }
    }

    /// [`Table::between_nodes`] of `d x root` for up to [`BATCH`] roots whose products all
    /// lie on the table, in two passes: the node and the Hermite weights of every D first
    /// (plain arithmetic, which the compiler vectorises), then the reads of the nodes. The
    /// same operations on the same values as `between_nodes`, so the same bits.
    fn batch_on_table(&self, d: f64, roots: &[f64], out: &mut [(f64, f64)]) {
        let n = roots.len().min(out.len()).min(BATCH);
        let (roots, out) = (&roots[..n], &mut out[..n]);
        let mut node = [0.0; BATCH];
        let mut h = [[0.0; BATCH]; 4];
        let [h00, h10, h01, h11] = &mut h;
        let rows = node[..n].iter_mut().zip(&mut h00[..n]).zip(&mut h10[..n]);
        let rows = rows.zip(&mut h01[..n]).zip(&mut h11[..n]).zip(roots);
        for (((((node, h00), h10), h01), h11), &root) in rows {
            let u = d * root / STEP;
            // floor(u) without a conversion to an integer (u is below 2^51): add and take away
            // 2^52 to round to the nearest whole number, then step down if that went up.
            let r = (u + TWO_52) - TWO_52;
            let below = if r > u { r - 1.0 } else { r };
            *node = if below > LAST_LOW_NODE {
                LAST_LOW_NODE
            } else {
                below
            };
            let t = u - *node;
            let t2 = t * t;
            let s = 1.0 - t;
            let s2 = s * s;
            *h00 = (1.0 + 2.0 * t) * s2;
            *h10 = t * s2 * STEP;
            *h01 = t2 * (3.0 - 2.0 * t);
            *h11 = -t2 * s * STEP;
        }
        for (k, o) in out.iter_mut().enumerate() {
            let i = (node[k] as usize).min(NODES - 1);
            let (lo, hi) = (&self.nodes[i], &self.nodes[i + 1]);
            let (h00, h10, h01, h11) = (h[0][k], h[1][k], h[2][k], h[3][k]);
            *o = (
                h00 * lo[0] + h10 * lo[2] + h01 * hi[0] + h11 * hi[2],
                h00 * lo[1] + h10 * lo[3] + h01 * hi[1] + h11 * hi[3],
            );
        }
    }

    /// The cubic Hermite interpolation between the two nodes around `d`, for `d` from
    /// `ac::D_SMALL` to below `END`.
    #[inline]
    fn between_nodes(&self, d: f64) -> (f64, f64) {
        let u = d / STEP;
        // u < NODES, so the node below is at most NODES - 1 and the one above exists.
        let i = (u as u32).min(NODES as u32 - 1) as usize;
        let t = u - i as f64;
        let (lo, hi) = (&self.nodes[i], &self.nodes[i + 1]);
        let t2 = t * t;
        let s = 1.0 - t;
        let s2 = s * s;
        let (h00, h10, h01, h11) = (
            (1.0 + 2.0 * t) * s2,
            t * s2 * STEP,
            t2 * (3.0 - 2.0 * t),
            -t2 * s * STEP,
        );
        (
            h00 * lo[0] + h10 * lo[2] + h01 * hi[0] + h11 * hi[2],
            h00 * lo[1] + h10 * lo[3] + h01 * hi[1] + h11 * hi[3],
        )
    }
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

    /// The batch that fills a layer's harmonics gives each D's terms bit for bit as one
    /// lookup does: on nodes, between them, at the table's ends and past them.
    #[test]
    fn batch_terms_equal_single_lookups() {
        let roots: Vec<f64> = (1..=100).map(|n| f64::from(n).sqrt()).collect();
        let table = Table::get();
        let mut out = vec![(0.0, 0.0); roots.len()];
        for d in [
            0.0,
            1e-4,
            0.05,
            0.1,
            0.7735,
            1.3,
            1.999_999_999,
            2.0,
            2.5,
            30.0,
        ] {
            table.fill_terms(d, &roots, &mut out);
            for (k, (&r, &t)) in roots.iter().zip(&out).enumerate() {
                assert_eq!(t, table.d_terms(d * r), "D {d}, harmonic {}", k + 1);
            }
        }
    }
}
