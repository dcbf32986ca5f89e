//! A memo of the costly, pure parts of an evaluation (a waveform's spectrum and its
//! harmonic-summed Dowell terms per layer D), kept across evaluations of builds that share
//! them, as the search's candidates do. It changes no figure: `evaluate` starts an empty one.

use super::harmonics::{self, HARMONICS, Spectrum, Waveform};

/// Entries kept before the memo starts afresh; a search visits a few dozen distinct wires.
const MAX_ENTRIES: usize = 4096;

#[derive(Debug, Default, Clone)]
pub struct Memo {
    spectra: Vec<(Waveform, Spectrum)>,
    /// (index into `spectra`, D bits) -> the summed terms.
    terms: Vec<(usize, u64, (f64, f64))>,
}

impl Memo {
    pub fn new() -> Self {
        Self::default()
    }

    /// The spectrum of a waveform (index, for [`Memo::summed_terms`]).
    pub fn spectrum(&mut self, wave: &Waveform) -> usize {
        if let Some(i) = self.spectra.iter().position(|(w, _)| w == wave) {
            return i;
        }
        if self.spectra.len() >= MAX_ENTRIES {
            self.spectra.clear();
            self.terms.clear();
        }
        self.spectra
            .push((wave.clone(), harmonics::spectrum(wave, HARMONICS)));
        self.spectra.len() - 1
    }

    pub fn spectrum_of(&self, index: usize) -> &Spectrum {
        &self.spectra[index].1
    }

    /// [`harmonics::summed_terms`] of a memoised spectrum.
    pub fn summed_terms(&mut self, spectrum: usize, d: f64) -> (f64, f64) {
        let key = d.to_bits();
        if let Some((_, _, t)) = self
            .terms
            .iter()
            .find(|(s, k, _)| *s == spectrum && *k == key)
        {
            return *t;
        }
        if self.terms.len() >= MAX_ENTRIES {
            self.terms.clear();
        }
        let t = harmonics::summed_terms(&self.spectra[spectrum].1, d);
        self.terms.push((spectrum, key, t));
        t
    }
}
