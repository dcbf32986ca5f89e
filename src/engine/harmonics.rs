//! Fourier series of piecewise-linear current waveforms over one period, and the AC factor
//! of a winding summed over them (Hurley, Gath and Breslin 2000). Pure arithmetic.

use std::f64::consts::PI;
use std::sync::OnceLock;

/// Harmonics summed one by one; the power above the last is taken at the last one's factor
/// (see `waveform_factor`). At 100 kHz this reaches 10 MHz, where real switching edges of
/// some tens of nanoseconds have long cut the spectrum off.
pub const HARMONICS: usize = 100;

/// A straight piece of a waveform: from `y0` at `t0` to `y1` at `t1`, times as fractions
/// of the period. A jump is the step between two pieces.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Piece {
    /// Start of the piece, as a fraction of the period (0 to 1).
    pub t0: f64,
    /// End of the piece, as a fraction of the period (0 to 1).
    pub t1: f64,
    /// Value at `t0` (A).
    pub y0: f64,
    /// Value at `t1` (A).
    pub y1: f64,
}

/// A current over one period (zero wherever no piece covers it).
#[derive(Debug, Clone, PartialEq, Default)]
pub struct Waveform {
    /// The straight pieces, in time order, not overlapping.
    pub pieces: Vec<Piece>,
}

impl Waveform {
    /// A rectangular pulse of height `i_a` from 0 to `duty`.
    pub fn pulse(i_a: f64, duty: f64) -> Self {
        Self::ramp(i_a, i_a, 0.0, duty)
    }

    /// A piece from `i0` to `i1` between the fractions `t0` and `t1`, zero elsewhere.
    pub fn ramp(i0: f64, i1: f64, t0: f64, t1: f64) -> Self {
        let (t0, t1) = (t0.clamp(0.0, 1.0), t1.clamp(0.0, 1.0));
        let pieces = if t1 > t0 {
            vec![Piece {
                t0,
                t1,
                y0: i0,
                y1: i1,
            }]
        } else {
            Vec::new()
        };
        Waveform { pieces }
    }

    /// The same waveform with every value multiplied by `by` (a turns ratio, say).
    pub fn scaled(mut self, by: f64) -> Self {
        for p in &mut self.pieces {
            p.y0 *= by;
            p.y1 *= by;
        }
        self
    }

    /// Mean over the period.
    pub fn dc(&self) -> f64 {
        self.pieces
            .iter()
            .map(|p| 0.5 * (p.y0 + p.y1) * (p.t1 - p.t0))
            .sum()
    }

    /// RMS over the period, exact: a straight piece contributes `(y0^2 + y0 y1 + y1^2)/3 dt`.
    pub fn rms(&self) -> f64 {
        self.pieces
            .iter()
            .map(|p| (p.y0 * p.y0 + p.y0 * p.y1 + p.y1 * p.y1) / 3.0 * (p.t1 - p.t0))
            .sum::<f64>()
            .max(0.0)
            .sqrt()
    }

    /// Complex Fourier coefficient `c_n = integral over the period of i(t) e^(-j 2 pi n t)`
    /// (t in periods), for n >= 1, as (re, im). Per piece, with `w = 2 pi n` and slope `s`,
    /// the integral is `[e^(-j w t) (j i(t) / w + s / w^2)]` from t0 to t1.
    pub fn coefficient(&self, n: usize) -> (f64, f64) {
        let w = 2.0 * PI * n as f64;
        let (mut re, mut im) = (0.0, 0.0);
        for p in &self.pieces {
            let dt = p.t1 - p.t0;
            if dt <= 0.0 {
                continue;
            }
            let s = (p.y1 - p.y0) / dt;
            let at = |t: f64, y: f64| {
                let (sn, c) = (w * t).sin_cos();
                // (c - j sn) (s/w^2 + j y/w)
                (c * s / (w * w) + sn * y / w, c * y / w - sn * s / (w * w))
            };
            let (r1, i1) = at(p.t1, p.y1);
            let (r0, i0) = at(p.t0, p.y0);
            re += r1 - r0;
            im += i1 - i0;
        }
        (re, im)
    }

    /// Peak amplitude of the n-th harmonic: `2 |c_n|`.
    pub fn amplitude(&self, n: usize) -> f64 {
        let (re, im) = self.coefficient(n);
        2.0 * (re * re + im * im).sqrt()
    }
}

/// The DC part, the squared RMS of each harmonic 1..=`count`, and the whole RMS squared.
#[derive(Debug, Clone, PartialEq)]
pub struct Spectrum {
    /// The mean over the period (A).
    pub dc: f64,
    /// The squared RMS (A^2) of harmonic n at index n - 1.
    pub harmonic_rms_sq: Vec<f64>,
    /// The whole waveform's RMS squared (A^2), DC and every harmonic together.
    pub rms_sq: f64,
}

/// The Fourier series of a piecewise-straight waveform: its DC part and the first `count`
/// harmonics, in closed form per piece.
pub fn spectrum(w: &Waveform, count: usize) -> Spectrum {
    spectrum_with(w, count, |_| None)
}

/// [`spectrum`], with the phasor powers of a piece end at `t` taken from `phasors(t)` where
/// it has them (`Memo::spectrum` keeps those its waveforms share: a primary, a secondary and
/// a reset that end or start at the same duty). The same figures either way.
pub fn spectrum_with<'a>(
    w: &Waveform,
    count: usize,
    phasors: impl Fn(f64) -> Option<&'a Phasors>,
) -> Spectrum {
    // c_n for every n at once, one piece end after the other: the end's phasor
    // e^(-j 2 pi t) is raised to the n-th power by one complex product per harmonic instead
    // of a sin_cos. `re` becomes the squared RMS in place; `im` stays on the stack.
    let mut re = vec![0.0; count];
    let mut im_heap = Vec::new();
    let mut im_stack = [0.0; HARMONICS];
    let im: &mut [f64] = if count <= HARMONICS {
        &mut im_stack[..count]
    } else {
        im_heap.resize(count, 0.0);
        &mut im_heap
    };
    for p in w.pieces.iter().filter(|p| p.t1 > p.t0) {
        let s = (p.y1 - p.y0) / (p.t1 - p.t0);
        // The integral is [..] at t1 minus [..] at t0.
        add_end(&mut re, im, (p.t1, p.y1, s), 1.0, phasors(p.t1));
        add_end(&mut re, im, (p.t0, p.y0, s), -1.0, phasors(p.t0));
    }
    for (r, i) in re.iter_mut().zip(im.iter()) {
        *r = 2.0 * (*r * *r + i * i);
    }
    Spectrum {
        dc: w.dc(),
        harmonic_rms_sq: re,
        rms_sq: w.rms().powi(2),
    }
}

/// `1 / (2 pi n)` for n = 1 to [`HARMONICS`], worked out by the compiler.
const INV_OMEGA: [f64; HARMONICS] = {
    let mut t = [0.0; HARMONICS];
    let mut k = 0;
    while k < HARMONICS {
        t[k] = 1.0 / (2.0 * PI * (k + 1) as f64);
        k += 1;
    }
    t
};

/// The powers `e^(-j 2 pi n t)` of a piece end's phasor for n = 1 to [`HARMONICS`] (index
/// n - 1), each the one before times `e^(-j 2 pi t)`: a chain of products, the slow part of
/// a spectrum, shared by the waveforms with an end at the same `t`.
#[derive(Debug, Clone, PartialEq)]
pub struct Phasors {
    re: [f64; HARMONICS],
    im: [f64; HARMONICS],
}

impl Phasors {
    /// The powers of `e^(-j 2 pi t)`.
    pub fn at(t: f64) -> Self {
        let mut p = Phasors {
            re: [0.0; HARMONICS],
            im: [0.0; HARMONICS],
        };
        powers(phasor_step(t), &mut (1.0, 0.0), &mut p.re, &mut p.im);
        p
    }
}

/// `e^(-j 2 pi t)`, as (re, im).
fn phasor_step(t: f64) -> (f64, f64) {
    let (sn, c) = (2.0 * PI * t).sin_cos();
    (c, -sn)
}

/// The next powers of the phasor `step` after `z` into `re` and `im`; `z` ends at the last.
/// Four chains side by side: the first four powers one product at a time, then each power is
/// the one four before times `step^4`, so that four products are in flight at once instead
/// of one waiting on the last (a single chain of products was the slowest part of a
/// spectrum). The same bits wherever it is called from.
fn powers((sr, si): (f64, f64), z: &mut (f64, f64), re: &mut [f64], im: &mut [f64]) {
    let n = re.len().min(im.len());
    let (re, im) = (&mut re[..n], &mut im[..n]);
    let (mut zr, mut zi) = *z;
    for k in 0..n.min(CHAINS) {
        (zr, zi) = (zr * sr - zi * si, zr * si + zi * sr);
        (re[k], im[k]) = (zr, zi);
    }
    // step^4 as (step^2)^2.
    let (s2r, s2i) = (sr * sr - si * si, 2.0 * sr * si);
    let (s4r, s4i) = (s2r * s2r - s2i * s2i, 2.0 * s2r * s2i);
    for k in CHAINS..n {
        let (r, i) = (re[k - CHAINS], im[k - CHAINS]);
        (re[k], im[k]) = (r * s4r - i * s4i, r * s4i + i * s4r);
    }
    if n > 0 {
        *z = (re[n - 1], im[n - 1]);
    }
}

/// Chains of products [`powers`] keeps going side by side.
const CHAINS: usize = 4;

/// One piece end's share of every harmonic's coefficient: `sign e^(-j w t) (s / w^2 + j y / w)`
/// with `w = 2 pi n`, added to `re[n - 1]` and `im[n - 1]`; `(t, y, s)` are the end's time,
/// value and the piece's slope, `given` its phasor powers when already found. [`HARMONICS`]
/// at a time: the phasor's powers first, then the shares, element by element, which the
/// compiler can vectorise.
fn add_end(
    re: &mut [f64],
    im: &mut [f64],
    (t, y, s): (f64, f64, f64),
    sign: f64,
    given: Option<&Phasors>,
) {
    let mut z = (1.0, 0.0);
    // The powers worked out here when not given (made, and zeroed, only then).
    let mut found: Option<(Phasors, (f64, f64))> = None;
    let chunks = re.chunks_mut(HARMONICS).zip(im.chunks_mut(HARMONICS));
    for (chunk, (re, im)) in chunks.enumerate() {
        let len = re.len();
        let inv_buf: [f64; HARMONICS];
        let inv = if chunk == 0 {
            &INV_OMEGA[..len]
        } else {
            inv_buf =
                std::array::from_fn(|k| 1.0 / (2.0 * PI * (chunk * HARMONICS + k + 1) as f64));
            &inv_buf[..len]
        };
        if t == 0.0 {
            // The phasor stays 1 + j0 at every power: the same sums without the products.
            for ((re, im), &inv_w) in re.iter_mut().zip(im.iter_mut()).zip(inv) {
                *re += sign * (s * (inv_w * inv_w));
                *im += sign * (y * inv_w);
            }
            continue;
        }
        let p = match given.filter(|_| chunk == 0) {
            Some(p) => {
                z = (p.re[HARMONICS - 1], p.im[HARMONICS - 1]);
                p
            }
            None => {
                let (f, step) = found.get_or_insert_with(|| {
                    let blank = Phasors {
                        re: [0.0; HARMONICS],
                        im: [0.0; HARMONICS],
                    };
                    (blank, phasor_step(t))
                });
                powers(*step, &mut z, &mut f.re[..len], &mut f.im[..len]);
                &*f
            }
        };
        let phasors = p.re[..len].iter().zip(&p.im[..len]);
        for (((re, im), &inv_w), (&zr, &zi)) in
            re.iter_mut().zip(im.iter_mut()).zip(inv).zip(phasors)
        {
            // e^(-j w t) = zr + j zi.
            let (a, b) = (s * (inv_w * inv_w), y * inv_w);
            *re += sign * (zr * a - zi * b);
            *im += sign * (zr * b + zi * a);
        }
    }
}

/// `sqrt(n)` for n = 1 to [`HARMONICS`] (index n - 1), worked out once per process: a
/// harmonic's D is the fundamental's times it.
fn harmonic_roots() -> &'static [f64; HARMONICS] {
    static ROOTS: OnceLock<[f64; HARMONICS]> = OnceLock::new();
    ROOTS.get_or_init(|| std::array::from_fn(|k| ((k + 1) as f64).sqrt()))
}

/// Dowell's two terms `(D_n G1(D_n), D_n G2(D_n))` of each harmonic n = 1 to [`HARMONICS`]
/// (index n - 1) of a layer whose D at the fundamental is `d`: `D_n = d sqrt(n)`.
pub type HarmonicTerms = [(f64, f64); HARMONICS];

/// The [`HarmonicTerms`] of a layer of D `d`, from the table (to about 1e-7): an exp and a
/// sin_cos per harmonic were most of a cold evaluation's time. Spectra summed at the same D
/// share them (`Memo::summed_terms`).
pub fn fill_harmonic_terms(d: f64, out: &mut HarmonicTerms) {
    crate::engine::dowell_table::Table::get().fill_terms(d, harmonic_roots(), out);
}

/// The two Dowell terms of a layer of D `d` (at the fundamental) summed over a spectrum:
/// `sum_n I_n^2 (D_n G1(D_n), D_n G2(D_n))` with `D_n = d sqrt(n)`, and what Parseval leaves
/// above the last harmonic taken at the last one's terms. With [`crate::engine::ac::layer_factor_from`]
/// this gives a layer's share of `waveform_factor` without a loop over harmonics per layer.
pub fn summed_terms(s: &Spectrum, d: f64) -> (f64, f64) {
    let mut terms = [(0.0, 0.0); HARMONICS];
    fill_harmonic_terms(d, &mut terms);
    summed_terms_with(s, d, &terms)
}

/// [`summed_terms`] with the harmonics' terms at `d` already found (`fill_harmonic_terms`);
/// a spectrum longer than [`HARMONICS`] has the terms of the rest worked out here.
pub fn summed_terms_with(s: &Spectrum, d: f64, terms: &HarmonicTerms) -> (f64, f64) {
    let floor = 1e-12 * s.rms_sq;
    let (head, tail) = s
        .harmonic_rms_sq
        .split_at(s.harmonic_rms_sq.len().min(HARMONICS));
    // The harmonics below the floor add nothing (their power counts as zero); the last one
    // above it gives the terms the rest is taken at.
    let mut last = head
        .iter()
        .rposition(|&p| p > floor)
        .map_or((1.0, 0.5), |k| terms[k]);
    // Four running sums of each, side by side, so that the additions do not wait on each
    // other; added up at the end.
    let (mut a, mut b, mut summed) = ([0.0; LANES], [0.0; LANES], [0.0; LANES]);
    let (powers, terms) = (
        head.chunks_exact(LANES),
        terms[..head.len()].chunks_exact(LANES),
    );
    let (rest_p, rest_t) = (powers.remainder(), terms.remainder());
    for (p, t) in powers.zip(terms) {
        for k in 0..LANES {
            let p = if p[k] > floor { p[k] } else { 0.0 };
            a[k] += p * t[k].0;
            b[k] += p * t[k].1;
            summed[k] += p;
        }
    }
    for (&p, &t) in rest_p.iter().zip(rest_t) {
        let p = if p > floor { p } else { 0.0 };
        a[0] += p * t.0;
        b[0] += p * t.1;
        summed[0] += p;
    }
    let total = |x: [f64; LANES]| (x[0] + x[1]) + (x[2] + x[3]);
    let (mut a, mut b) = (total(a), total(b));
    let mut summed = s.dc * s.dc + total(summed);
    for (k, &p) in tail.iter().enumerate() {
        if p <= floor {
            continue;
        }
        let n = HARMONICS + k + 1;
        last = crate::engine::dowell_table::d_terms(d * (n as f64).sqrt());
        a += p * last.0;
        b += p * last.1;
        summed += p;
    }
    let rest = (s.rms_sq - summed).max(0.0);
    (a + rest * last.0, b + rest * last.1)
}

/// Running sums [`summed_terms_with`] keeps side by side.
const LANES: usize = 4;

/// `R_eff / R_dc = [I_dc^2 + sum_n I_n^2 F_R(n)] / I_rms^2` (Hurley, Gath and Breslin, IEEE
/// Trans. Power Electron. 15(2), 2000), with `factor_at(n)` the winding's AC factor at the
/// n-th harmonic. What Parseval leaves above the last harmonic summed is taken at that
/// harmonic's factor: a lower bound for an ideal edge, about right for a real one.
pub fn waveform_factor(s: &Spectrum, mut factor_at: impl FnMut(usize) -> f64) -> f64 {
    if s.rms_sq <= 0.0 {
        return 1.0;
    }
    let mut loss = s.dc * s.dc;
    let mut summed = loss;
    let mut last = 1.0;
    for (k, &p) in s.harmonic_rms_sq.iter().enumerate() {
        // Harmonics a pulse's duty zeroes carry nothing: skip their (costly) factor.
        if p <= 1e-12 * s.rms_sq {
            continue;
        }
        last = factor_at(k + 1);
        loss += p * last;
        summed += p;
    }
    loss += (s.rms_sq - summed).max(0.0) * last;
    loss / s.rms_sq
}
