//! A memo of the costly, pure parts of an evaluation (a waveform's spectrum and its
//! harmonic-summed Dowell terms per layer D), kept across evaluations of builds that share
//! them, as the search's candidates do. It changes no figure: `evaluate` starts an empty one.

use super::ac;
use super::harmonics::{self, HARMONICS, Phasors, Spectrum, Waveform};
use std::collections::HashMap;
use std::hash::{BuildHasherDefault, Hasher};

/// Entries kept before the memo starts afresh; a search visits a few dozen distinct wires.
pub const MAX_ENTRIES: usize = 4096;

// The memo starts afresh only between evaluations (`trim`), never during one: an evaluation
// holds the spectrum indices it was handed until it ends.

/// What stays the same between evaluations of one search or one planner session: each
/// waveform's spectrum, the summed and sinusoidal Dowell terms per D, the last core-loss
/// density. Results are identical with or without it.
#[derive(Debug, Default, Clone)]
pub struct Memo {
    spectra: Vec<(Waveform, Spectrum)>,
    /// (index into `spectra`, D bits) -> the summed terms.
    terms: HashMap<(usize, u64), (f64, f64), BuildHasherDefault<WordHasher>>,
    /// D bits -> the terms of D at the switching frequency alone.
    sine_terms: HashMap<u64, (f64, f64), BuildHasherDefault<WordHasher>>,
    /// The last core-loss density asked for, by the bits of its inputs: the candidates of a
    /// search share their operating point, so one entry serves them all.
    core_loss: Option<([u64; 7], f64)>,
    /// The phasor powers the spectra found asked for (`harmonics::phasor_times`), by the
    /// bits of the time: a primary and a secondary share their on-time.
    phasors: Vec<(u64, Phasors)>,
}

/// Times whose phasor powers are kept: the waveforms of one operating point need a few.
const PHASORS_KEPT: usize = 64;

impl Memo {
    /// An empty memo.
    pub fn new() -> Self {
        Self::default()
    }

    /// Spectra held now (at most [`MAX_ENTRIES`] between evaluations).
    pub fn spectrum_count(&self) -> usize {
        self.spectra.len()
    }

    /// Start afresh where the memo has grown past its size; called before an evaluation, so
    /// that the indices handed out during one stay valid to its end.
    pub(super) fn trim(&mut self) {
        if self.spectra.len() >= MAX_ENTRIES {
            self.spectra.clear();
            self.terms.clear();
        }
        if self.terms.len() >= MAX_ENTRIES {
            self.terms.clear();
        }
        if self.sine_terms.len() >= MAX_ENTRIES {
            self.sine_terms.clear();
        }
    }

    /// The spectrum of a waveform (index, for [`Memo::summed_terms`]; valid until the
    /// evaluation ends).
    pub fn spectrum(&mut self, wave: &Waveform) -> usize {
        if let Some(i) = self.spectra.iter().position(|(w, _)| w == wave) {
            return i;
        }
        if self.phasors.len() >= PHASORS_KEPT {
            self.phasors.clear();
        }
        for t in harmonics::phasor_times(wave) {
            if !self.phasors.iter().any(|(b, _)| *b == t.to_bits()) {
                if self.phasors.capacity() == 0 {
                    // Room for the on-times and reset times of a few waveforms at once.
                    self.phasors.reserve(4);
                }
                self.phasors.push((t.to_bits(), Phasors::at(t)));
            }
        }
        let known = &self.phasors;
        let spectrum = harmonics::spectrum_with(wave, HARMONICS, |t| {
            known
                .iter()
                .find(|(b, _)| *b == t.to_bits())
                .map(|(_, p)| p)
        });
        if self.spectra.capacity() == 0 {
            // A primary, a secondary, a reset and a second output's, in one allocation.
            self.spectra.reserve(4);
        }
        self.spectra.push((wave.clone(), spectrum));
        self.spectra.len() - 1
    }

    /// The spectrum stored at `index` (as `Memo::spectrum` returned it).
    pub fn spectrum_of(&self, index: usize) -> &Spectrum {
        &self.spectra[index].1
    }

    /// [`ac::layer_factor_fast`], the terms of each D found once.
    pub fn layer_factor(&mut self, d: f64, f_a: f64, f_b: f64) -> f64 {
        ac::layer_factor_by(d, f_a, f_b, |d| {
            if self.sine_terms.capacity() == 0 {
                self.sine_terms.reserve(16);
            }
            *self
                .sine_terms
                .entry(d.to_bits())
                .or_insert_with(|| ac::d_terms(d))
        })
    }

    /// A core-loss density computed by `compute` from the figures in `inputs`, reused while
    /// the inputs stay the same.
    pub fn core_loss(&mut self, inputs: [f64; 7], compute: impl FnOnce() -> f64) -> f64 {
        let key = inputs.map(f64::to_bits);
        match self.core_loss {
            Some((k, v)) if k == key => v,
            _ => {
                let v = compute();
                self.core_loss = Some((key, v));
                v
            }
        }
    }

    /// [`harmonics::summed_terms`] of a memoised spectrum.
    pub fn summed_terms(&mut self, spectrum: usize, d: f64) -> (f64, f64) {
        let key = (spectrum, d.to_bits());
        if let Some(t) = self.terms.get(&key) {
            return *t;
        }
        let t = harmonics::summed_terms(&self.spectra[spectrum].1, d);
        // One allocation for the handful an evaluation adds, rather than growing 3, 7, 14.
        if self.terms.capacity() == 0 {
            self.terms.reserve(16);
        }
        self.terms.insert(key, t);
        t
    }
}

/// A hasher for keys made of a few machine words that no one outside chooses (an index and
/// the bits of a computed D): a multiply-rotate per word instead of SipHash, which guards
/// against crafted keys that cannot occur here.
#[derive(Debug, Default, Clone, Copy)]
pub struct WordHasher(u64);

impl Hasher for WordHasher {
    fn finish(&self) -> u64 {
        self.0
    }

    fn write(&mut self, bytes: &[u8]) {
        for b in bytes {
            self.write_u64(u64::from(*b));
        }
    }

    fn write_u64(&mut self, word: u64) {
        // The 64-bit golden-ratio constant spreads the low bits of D over the whole word.
        self.0 = (self.0.rotate_left(5) ^ word).wrapping_mul(0x9E37_79B9_7F4A_7C15);
    }

    fn write_usize(&mut self, word: usize) {
        self.write_u64(word as u64);
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// The memo gives what a fresh computation gives, for a repeat and for a new D.
    #[test]
    fn memoised_terms_equal_fresh_ones() {
        let wave = Waveform::pulse(2.0, 0.4);
        let mut memo = Memo::new();
        let s = memo.spectrum(&wave);
        let fresh = harmonics::spectrum(&wave, HARMONICS);
        for d in [0.3, 1.7, 0.3, 2.5, 1.7] {
            assert_eq!(memo.summed_terms(s, d), harmonics::summed_terms(&fresh, d));
        }
        assert_eq!(memo.spectrum(&wave), s);
    }

    /// Waveforms that share a piece end (a primary, a secondary and a reset at one duty)
    /// get the spectra a fresh computation gives, bit for bit.
    #[test]
    fn spectra_sharing_an_end_equal_fresh_ones() {
        let waves = [
            Waveform::ramp(1.0, 1.4, 0.0, 0.41),
            Waveform::pulse(3.0, 0.41),
            Waveform::ramp(0.3, 0.0, 0.41, 0.77),
        ];
        let mut memo = Memo::new();
        for w in &waves {
            let i = memo.spectrum(w);
            assert_eq!(memo.spectrum_of(i), &harmonics::spectrum(w, HARMONICS));
        }
    }

    /// Two spectra of the same on-time (their phasor powers shared), summed at many D's,
    /// give what a fresh computation gives.
    #[test]
    fn spectra_sharing_an_on_time_sum_as_fresh_ones() {
        let waves = [
            Waveform::pulse(2.0, 0.4),
            Waveform::ramp(1.0, 1.5, 0.0, 0.4),
        ];
        let mut memo = Memo::new();
        let ids = waves.each_ref().map(|w| memo.spectrum(w));
        for i in 0..24 {
            let d = 0.2 + 0.37 * i as f64;
            for (w, &s) in waves.iter().zip(&ids) {
                let fresh = harmonics::summed_terms(&harmonics::spectrum(w, HARMONICS), d);
                assert_eq!(memo.summed_terms(s, d), fresh, "D {d}");
            }
        }
    }

    /// The memoised sinusoidal layer factor is the plain one, for resistive, thin and thick
    /// layers alike.
    #[test]
    fn memoised_layer_factor_equals_fresh_one() {
        let mut memo = Memo::new();
        for (d, f_a, f_b) in [
            (0.5, 0.0, 3.0),
            (2.0, -1.0, 2.0),
            (2.0, 1.0, 1.0),
            (1e-5, 0.0, 1.0),
        ] {
            for _ in 0..2 {
                assert_eq!(
                    memo.layer_factor(d, f_a, f_b),
                    ac::layer_factor_fast(d, f_a, f_b)
                );
            }
        }
    }

    /// The core-loss entry is recomputed when any input changes, and only then.
    #[test]
    fn core_loss_entry_follows_its_inputs() {
        let mut memo = Memo::new();
        let a = [1.0, 1.5, 2.5, 100.0, 0.1, 0.4, 0.4];
        assert_eq!(memo.core_loss(a, || 1.0), 1.0);
        assert_eq!(memo.core_loss(a, || 2.0), 1.0);
        let mut b = a;
        b[4] = 0.2;
        assert_eq!(memo.core_loss(b, || 3.0), 3.0);
    }
}
