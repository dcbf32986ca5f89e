//! Core data from a test winding and bobbin figures from calliper readings, for salvaged
//! parts. Pure magnetic-circuit relations; no I/O.
//!
//! Relations (reluctance of a core path of length le and area Ae in series with an air gap lg,
//! no fringing): L = AL N^2; AL = mu0 Ae / (lg + le / mu_i); so mu_e = AL le / (mu0 Ae) and
//! mu_e = mu_i / (1 + mu_i lg / le), that is lg = le (1/mu_e - 1/mu_i). McLyman, Transformer
//! and Inductor Design Handbook, 3rd ed. (2004), inductor design chapter (from memory), and
//! the effective-permeability note of IEC 60205.

use super::constants::{MM, MM2, MU0_H_PER_M};
use crate::model::{Bobbin, Core, Tube, Window};
use std::f64::consts::PI;

/// Inductance factor (nH per turn squared) from a test winding: AL = L / N^2.
pub fn al_nh(inductance_uh: f64, turns: u32) -> f64 {
    let n = f64::from(turns);
    inductance_uh * 1e3 / (n * n)
}

/// Inductance (uH) of `turns` turns on a core of factor `al_nh`: L = AL N^2.
pub fn inductance_uh(al_nh: f64, turns: u32) -> f64 {
    let n = f64::from(turns);
    al_nh * n * n * 1e-3
}

/// Effective permeability of the assembled core: mu_e = AL le / (mu0 Ae).
pub fn mu_e(al_nh: f64, le_mm: f64, ae_mm2: f64) -> f64 {
    al_nh * 1e-9 * le_mm * MM / (MU0_H_PER_M * ae_mm2 * MM2)
}

/// Effective permeability of a core of material permeability `mu_i` with an air gap `lg_mm`
/// in its path: mu_e = mu_i / (1 + mu_i lg / le) (IEC 60205 note).
pub fn mu_e_with_gap(mu_i: f64, le_mm: f64, lg_mm: f64) -> f64 {
    mu_i / (1.0 + mu_i * lg_mm / le_mm)
}

/// The air gap (mm) that takes a material of `mu_i` down to `mu_e`: lg = le (1/mu_e - 1/mu_i).
/// Negative when `mu_e` exceeds `mu_i` (the stated material permeability is too low, or le or
/// Ae is off).
pub fn equivalent_gap_mm(mu_e: f64, mu_i: f64, le_mm: f64) -> f64 {
    le_mm * (1.0 / mu_e - 1.0 / mu_i)
}

/// Gapped inductance factor (nH): AL = mu0 Ae / (lg + le / mu_i), no fringing.
pub fn al_with_gap_nh(ae_mm2: f64, le_mm: f64, mu_i: f64, lg_mm: f64) -> f64 {
    MU0_H_PER_M * ae_mm2 * MM2 / ((lg_mm + le_mm / mu_i) * MM) * 1e9
}

/// Effective area of a centre leg measured with callipers: rect `w x d`, round `pi d^2 / 4`.
/// Taking Ae as the centre leg's own section is the usual first estimate for an E or ETD pair
/// (common practice); the real Ae of IEC 60205 is a little smaller where the path narrows.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Leg {
    /// A rectangular leg.
    Rect {
        /// Width of the leg across the tube (mm).
        width_mm: f64,
        /// Depth of the leg the other way (mm).
        depth_mm: f64,
    },
    /// A round leg.
    Round {
        /// Diameter of the leg (mm).
        diameter_mm: f64,
    },
}

impl Leg {
    /// The leg's section (mm2), taken as Ae.
    pub fn area_mm2(self) -> f64 {
        match self {
            Leg::Rect { width_mm, depth_mm } => width_mm * depth_mm,
            Leg::Round { diameter_mm } => PI * diameter_mm * diameter_mm / 4.0,
        }
    }
}

/// Estimate of le from the mean flux path measured round one window, from the middle of the
/// centre leg to the middle of the outer leg (`across_mm`) and from the middle of one yoke to the
/// middle of the other (`along_mm`): le ~ 2 (along + across). Square corners make it a slight
/// over-estimate (IEC 60205 takes a circular path at corners).
pub fn le_from_path_mm(along_mm: f64, across_mm: f64) -> f64 {
    2.0 * (along_mm + across_mm)
}

/// What an equivalent gap says about a core sold or salvaged as ungapped.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum GapReading {
    /// mu_e above mu_i: the stated material permeability, le or Ae is off.
    Negative,
    /// Under 10 um: as expected of clean, ground mating faces.
    Clean,
    /// A gap: deliberately gapped, or dirt, glue or a chipped face at the mating faces.
    Gapped,
}

/// Residual gap of clean ground faces, under which a pair reads as ungapped (common practice,
/// a few micrometres per face).
pub const CLEAN_FACE_GAP_MM: f64 = 0.010;

/// What an equivalent gap (mm) says: negative, clean (under `CLEAN_FACE_GAP_MM`) or gapped.
pub fn read_gap(lg_mm: f64) -> GapReading {
    if lg_mm < 0.0 {
        GapReading::Negative
    } else if lg_mm < CLEAN_FACE_GAP_MM {
        GapReading::Clean
    } else {
        GapReading::Gapped
    }
}

/// Calliper readings of a salvaged bobbin and its core.
#[derive(Debug, Clone, PartialEq)]
pub struct Measured {
    /// The name the bobbin file gets.
    pub name: String,
    /// Where the figures come from, written into the file's `origin`.
    pub origin: String,
    /// Window width between the flanges (mm).
    pub window_width_mm: f64,
    /// Window height from the tube surface to the usable limit (mm).
    pub window_height_mm: f64,
    /// The tube's outer surface as measured.
    pub tube: Tube,
    /// The centre leg's section, when measured.
    pub leg: Option<Leg>,
    /// Effective path length (mm), entered or estimated from the path.
    pub le_mm: Option<f64>,
    /// AL (nH) from a test winding: L / N^2.
    pub al_nh: Option<f64>,
    /// Number of pins, when counted.
    pub pin_count: Option<u32>,
}

/// The bobbin those readings describe; core data only when both Ae (from the leg) and le are
/// known. Ve is le x Ae (IEC 60205).
pub fn bobbin_from(m: &Measured) -> Bobbin {
    let core = match (m.leg, m.le_mm) {
        (Some(leg), Some(le_mm)) => {
            // Calliper readings carry two decimals at best; so do the figures saved from them.
            let ae_mm2 = (leg.area_mm2() * 100.0).round() / 100.0;
            Some(Core {
                ae_mm2,
                le_mm,
                ve_mm3: Some((ae_mm2 * le_mm).round()),
                al_nh: m.al_nh,
            })
        }
        _ => None,
    };
    Bobbin {
        name: m.name.clone(),
        origin: m.origin.clone(),
        window: Window {
            width_mm: m.window_width_mm,
            height_mm: m.window_height_mm,
        },
        tube: m.tube.clone(),
        core,
        pin_count: m.pin_count,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Algebra: AL and inductance are inverse (L = AL N^2).
    #[test]
    fn al_and_inductance_invert() {
        assert!((inductance_uh(al_nh(560.0, 20), 20) - 560.0).abs() < 1e-9);
    }
}
