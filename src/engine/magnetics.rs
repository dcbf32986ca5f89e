//! The core as a magnetic circuit: the inductance factor AL that sets the magnetising
//! inductance, from the bobbin's figure or from the material's permeability and a gap.

use super::constants::{MM, MM2, MU0_H_PER_M};
use crate::model::{Core, Material};

/// Where the AL used came from.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum AlSource {
    /// The bobbin's `[core] al_nh` (as assembled, measured or typical).
    Core,
    /// `mu0 Ae / (l_g + le / mu_i)` with the material's `gap_mm`.
    Gapped,
    /// The same with no gap: `mu0 mu_i Ae / le` (a real core's mating faces lower it).
    Ungapped,
}

impl AlSource {
    /// The words reports and JSON show for it.
    pub fn key(self) -> &'static str {
        match self {
            AlSource::Core => "core",
            AlSource::Gapped => "mu_i and gap",
            AlSource::Ungapped => "mu_i, no gap",
        }
    }
}

/// AL in nH per turn squared of a core with an air gap `gap_mm` in its path, fringing
/// neglected: `mu0 Ae / (l_g + le / mu_i)` (the magnetic-circuit relation; with the gap
/// it gives IEC 60205's effective permeability `mu_i / (1 + mu_i l_g / le)`).
pub fn al_from_gap_nh(ae_mm2: f64, le_mm: f64, mu_i: f64, gap_mm: f64) -> f64 {
    let reluctance_len = gap_mm * MM + le_mm * MM / mu_i;
    if reluctance_len <= 0.0 {
        return 0.0;
    }
    MU0_H_PER_M * ae_mm2 * MM2 / reluctance_len * 1e9
}

/// The AL to use: a stated gap (with `mu_i`) wins, since it says how this core is
/// assembled; then the bobbin's `al_nh`; then `mu_i` with no gap.
pub fn al_nh(core: &Core, material: Option<&Material>) -> Option<(f64, AlSource)> {
    let mu_i = material.and_then(|m| m.mu_i);
    if let (Some(mu), Some(gap)) = (mu_i, material.and_then(|m| m.gap_mm)) {
        return Some((
            al_from_gap_nh(core.ae_mm2, core.le_mm, mu, gap),
            AlSource::Gapped,
        ));
    }
    if let Some(al) = core.al_nh {
        return Some((al, AlSource::Core));
    }
    mu_i.map(|mu| {
        (
            al_from_gap_nh(core.ae_mm2, core.le_mm, mu, 0.0),
            AlSource::Ungapped,
        )
    })
}

/// Effective volume: the core's `ve_mm3`, or `le x Ae` (IEC 60205: Ve = le Ae).
pub fn volume_mm3(core: &Core) -> f64 {
    core.ve_mm3.unwrap_or(core.le_mm * core.ae_mm2)
}
