//! What the bench measured on a finished part: the `[measured]` table of a build file.
//! Plain data; `engine::verify` sets each reading against its prediction.

use super::Name;

/// Readings of a wound part. Every key is optional; a reading left out is not checked.
#[derive(Debug, Clone, Default, PartialEq)]
pub struct Measured {
    /// The part's temperature when the resistances were read (C); 20 C when not given.
    pub reading_c: Option<f64>,
    /// The frequency the inductances were measured at (kHz), kept for the record.
    pub frequency_khz: Option<f64>,
    /// DC resistance by winding, in the order of the build's windings.
    pub dcr_ohm: Vec<(Name, f64)>,
    /// Inductance at the first primary, every other winding open (uH).
    pub magnetising_uh: Option<f64>,
    /// Inductance at the first primary with the first secondary shorted (uH).
    pub leakage_uh: Option<f64>,
    /// A winding's open-circuit voltage over the first primary's, by winding, build order.
    pub ratio: Vec<(Name, f64)>,
    /// The electric-strength (hipot) result in words, kept as a note; not judged.
    pub hipot: Option<String>,
    /// Anything else the technician wrote down.
    pub note: Option<String>,
}

/// Temperature assumed for resistance readings that do not say theirs (C): the bench.
pub const DEFAULT_READING_C: f64 = 20.0;

impl Measured {
    /// The part's temperature at the resistance readings (C), 20 when not given.
    pub fn reading_temperature_c(&self) -> f64 {
        self.reading_c.unwrap_or(DEFAULT_READING_C)
    }

    /// True when the table holds no reading that can be checked.
    pub fn has_no_reading(&self) -> bool {
        self.dcr_ohm.is_empty()
            && self.ratio.is_empty()
            && self.magnetising_uh.is_none()
            && self.leakage_uh.is_none()
    }
}
