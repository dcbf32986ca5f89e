//! What a DC resistance reading off its prediction implies for a foil or a litz winding, where
//! no round wire size applies: the foil's thickness, or how many strands carry the current.
//! Pure figures; `report::verify` words them.

use super::conductor::ConductorFigures;

/// The conductor a foil or litz winding's measured resistance implies, the length and the
/// rest of the conductor as planned.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum ImpliedConductor {
    /// Foil: `R = rho MLT N / (t w)` (IEC 60028 resistivity), so at the planned width and
    /// length the foil is `t / factor` thick.
    FoilThickness {
        /// The plan's foil thickness (mm).
        planned_mm: f64,
        /// The thickness that gives the measured resistance (mm).
        implied_mm: f64,
        /// The foil width the plan uses (mm).
        width_mm: f64,
    },
    /// Litz: `R = rho lay MLT N / (n pi d^2 / 4)`, so with strands of the planned size
    /// `n / factor` of them carry the current.
    LitzStrands {
        /// The plan's strands in the bundle.
        planned: u32,
        /// The strands of the planned size that give the measured resistance.
        implied: f64,
        /// The plan's strand bare diameter (mm).
        strand_mm: f64,
    },
}

/// The foil thickness or litz strand count that `factor` (measured over expected resistance)
/// implies; `None` for round wire, whose likely size the wire series names instead.
pub fn implied_conductor(c: &ConductorFigures, factor: f64) -> Option<ImpliedConductor> {
    if !(factor.is_finite() && factor > 0.0) {
        return None;
    }
    match *c {
        ConductorFigures::Round => None,
        ConductorFigures::Foil {
            thickness_mm,
            width_mm,
            ..
        } => Some(ImpliedConductor::FoilThickness {
            planned_mm: thickness_mm,
            implied_mm: thickness_mm / factor,
            width_mm,
        }),
        ConductorFigures::Litz {
            strands, strand_mm, ..
        } => Some(ImpliedConductor::LitzStrands {
            planned: strands,
            implied: f64::from(strands) / factor,
            strand_mm,
        }),
    }
}
