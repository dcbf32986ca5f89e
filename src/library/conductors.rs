//! Common copper foil thicknesses and litz constructions, for `turnstack wires` and the
//! search. Foil thicknesses as sold by the roll for transformer work and litz constructions
//! as commonly stocked (common practice); the litz strands are rows of the metric wire table
//! (`wires::metric_rows`), so their overall diameters come from it.

/// Copper foil thicknesses (mm), thinnest first (common practice).
pub const FOIL_THICKNESSES_MM: [f64; 9] = [0.035, 0.05, 0.07, 0.1, 0.15, 0.2, 0.3, 0.4, 0.5];

/// One litz construction: strands of one bare diameter.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LitzConstruction {
    pub strands: u32,
    /// A nominal size of the metric wire table.
    pub strand_mm: f64,
}

const fn litz(strands: u32, strand_mm: f64) -> LitzConstruction {
    LitzConstruction { strands, strand_mm }
}

/// Litz constructions, by strand size then count (common practice).
pub const LITZ_CONSTRUCTIONS: [LitzConstruction; 12] = [
    litz(100, 0.05),
    litz(250, 0.05),
    litz(400, 0.05),
    litz(40, 0.071),
    litz(100, 0.071),
    litz(200, 0.071),
    litz(20, 0.1),
    litz(60, 0.1),
    litz(120, 0.1),
    litz(10, 0.2),
    litz(30, 0.2),
    litz(60, 0.2),
];
