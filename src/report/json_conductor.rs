//! The `foil` and `litz` objects of a winding in the JSON report (see FORMAT.md, "Foil and
//! litz"); they only copy `engine::conductor::ConductorFigures`.

use crate::engine::conductor::ConductorFigures;
use serde::Serialize;

/// `foil` of a winding: the figures of `engine::conductor::ConductorFigures::Foil`.
#[derive(Debug, Serialize)]
pub struct FoilJson {
    pub thickness_mm: f64,
    pub width_mm: f64,
    pub interleaf_mm: f64,
    pub layer_height_mm: f64,
    pub porosity: f64,
}

/// `litz` of a winding: the figures of `engine::conductor::ConductorFigures::Litz`.
#[derive(Debug, Serialize)]
pub struct LitzJson {
    pub strands: u32,
    pub strand_mm: f64,
    pub strand_od_mm: f64,
    pub bundle_mm: f64,
    pub od_mm: f64,
    pub packing: f64,
    pub lay_factor: f64,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub strand_over_skin: Option<f64>,
}

/// The `foil` object of a foil winding.
pub fn foil(c: &ConductorFigures) -> Option<FoilJson> {
    match *c {
        ConductorFigures::Foil {
            thickness_mm,
            width_mm,
            interleaf_mm,
            layer_height_mm,
            porosity,
        } => Some(FoilJson {
            thickness_mm,
            width_mm,
            interleaf_mm,
            layer_height_mm,
            porosity,
        }),
        _ => None,
    }
}

/// The `litz` object of a litz winding.
pub fn litz(c: &ConductorFigures) -> Option<LitzJson> {
    match *c {
        ConductorFigures::Litz {
            strands,
            strand_mm,
            strand_od_mm,
            bundle_mm,
            od_mm,
            packing,
            lay_factor,
            strand_over_skin,
        } => Some(LitzJson {
            strands,
            strand_mm,
            strand_od_mm,
            bundle_mm,
            od_mm,
            packing,
            lay_factor,
            strand_over_skin,
        }),
        _ => None,
    }
}
