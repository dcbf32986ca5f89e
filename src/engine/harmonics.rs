//! Fourier series of piecewise-linear current waveforms over one period, and the AC factor
//! of a winding summed over them (Hurley, Gath and Breslin 2000). Pure arithmetic.

pub use super::harmonic_sum::{SumWeights, summed_terms};
use std::f64::consts::PI;

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
    /// What every harmonic sum over it needs of it, found once (a spectrum of
    /// [`HARMONICS`] only; one of another length is summed harmonic by harmonic).
    pub sum_weights: Option<SumWeights>,
}

/// The Fourier series of a piecewise-straight waveform: its DC part and the first `count`
/// harmonics, in closed form per piece.
pub fn spectrum(w: &Waveform, count: usize) -> Spectrum {
    spectrum_with(w, count, |_| None)
}

/// [`spectrum`], with the phasor powers `e^(-j 2 pi n t)` of a `t` taken from `phasors(t)`
/// where it has them (`Memo::spectrum` keeps those its waveforms share: a primary and a
/// secondary of the same on-time). The `t`s asked for are [`phasor_times`]. The same figures
/// either way.
pub fn spectrum_with<'a>(
    w: &Waveform,
    count: usize,
    phasors: impl Fn(f64) -> Option<&'a Phasors>,
) -> Spectrum {
    let mut pieces = w.pieces.iter().filter(|p| p.t1 > p.t0);
    let harmonic_rms_sq = match (pieces.next(), pieces.next()) {
        (None, _) => vec![0.0; count],
        (Some(p), None) if count == HARMONICS => one_piece(p, phasors(p.t1 - p.t0)),
        _ => piece_ends(w, count, phasors),
    };
    let (dc, rms_sq) = (w.dc(), w.rms().powi(2));
    let sum_weights = <&[f64; HARMONICS]>::try_from(harmonic_rms_sq.as_slice())
        .ok()
        .map(|powers| SumWeights::of(powers, dc, rms_sq));
    Spectrum {
        dc,
        harmonic_rms_sq,
        rms_sq,
        sum_weights,
    }
}

/// The times whose phasor powers [`spectrum_with`] asks for at [`HARMONICS`]: a single
/// piece's width (where it lies in the period changes no harmonic's size), else every piece
/// end but 0.
pub fn phasor_times(w: &Waveform) -> impl Iterator<Item = f64> + '_ {
    let live = || w.pieces.iter().filter(|p| p.t1 > p.t0);
    let single = match live().count() {
        1 => live().next().map(|p| p.t1 - p.t0),
        _ => None,
    };
    let ends = live()
        .filter(move |_| single.is_none())
        .flat_map(|p| [p.t1, p.t0])
        .filter(|&t| t != 0.0);
    single.into_iter().chain(ends)
}

/// The squared RMS of harmonics 1 to [`HARMONICS`] of one straight piece, in closed form. A
/// shift in time turns every `c_n` by a phase and leaves its size, so the piece is taken from
/// 0 to its width `w`: with slope `s`, `w_n = 2 pi n` and `e^(-j w_n w) = zr + j zi`,
/// `c_n = e^(-j w_n w) (s / w_n^2 + j y1 / w_n) - (s / w_n^2 + j y0 / w_n)`, that is
/// `Re = a (zr - 1) - b1 zi` and `Im = b1 zr + a zi - b0` with `a = s / w_n^2`,
/// `b1 = y1 / w_n`, `b0 = y0 / w_n`; and `I_n^2 = 2 |c_n|^2`.
fn one_piece(p: &Piece, given: Option<&Phasors>) -> Vec<f64> {
    let width = p.t1 - p.t0;
    let s = (p.y1 - p.y0) / width;
    let found;
    let z = match given {
        Some(z) => z,
        None => {
            found = Phasors::at(width);
            &found
        }
    };
    // Slices of one length, zipped and collected: no bounds checks, no zeroing first, and
    // the compiler works two harmonics at a time.
    let rows = INV_OMEGA.iter().zip(z.re.iter().zip(&z.im));
    rows.map(|(&inv_w, (&zr, &zi))| {
        let (a, b1, b0) = (s * (inv_w * inv_w), p.y1 * inv_w, p.y0 * inv_w);
        let re = a * (zr - 1.0) - b1 * zi;
        let im = b1 * zr + a * zi - b0;
        2.0 * (re * re + im * im)
    })
    .collect()
}

/// The squared RMS of harmonics 1 to `count` of any waveform: `c_n` for every n at once, one
/// piece end after the other. The end's phasor `e^(-j 2 pi t)` is raised to the n-th power by
/// one complex product per harmonic instead of a sin_cos. `re` becomes the squared RMS in
/// place; `im` stays on the stack.
fn piece_ends<'a>(
    w: &Waveform,
    count: usize,
    phasors: impl Fn(f64) -> Option<&'a Phasors>,
) -> Vec<f64> {
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
    re
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
