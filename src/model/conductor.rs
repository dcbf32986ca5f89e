//! What a winding is wound with beyond round magnet wire: copper foil or litz. Plain data;
//! the engine turns it into layers, resistance and AC figures.
//!
//! Shape: `Winding::conductor` says which kind. For [`Conductor::Round`] the winding's
//! `wire`, `insulation` and `strands` are the whole story, exactly as before. For
//! [`Conductor::Litz`] `wire` holds the strand's size (`Metric { bare_mm: strand_mm }`), the
//! strand enamel comes from `insulation` and `strands` counts bundles wound side by side in
//! parallel (normally 1). For [`Conductor::Foil`] `wire` holds `Metric { bare_mm: foil_mm }`
//! only so that code reading a round wire stays total; `insulation` and `strands` do not apply.

/// The default gap between each foil edge and the wound breadth's edge when `width_mm` is
/// left out: the interleaf overhang (common practice: 1 mm a side keeps the foil's burred
/// edge off the margin and lets the interleaf fold over it).
pub const FOIL_OVERHANG_MM: f64 = 1.0;
/// Foil thinner than this is refused: 25 um copper tears and kinks when wound by hand
/// (common practice; the thinnest foil sold by the roll for transformers is about this).
pub const FOIL_MIN_MM: f64 = 0.025;
/// Foil thicker than this is refused: beyond 1 mm it no longer bends round a small tube.
pub const FOIL_MAX_MM: f64 = 1.0;
/// Default interleaf (the insulating film laid under each turn): 50 um polyester film
/// (common practice).
pub const FOIL_INTERLEAF_MM: f64 = 0.05;
/// Default length of each lead tab out of the winding to its pin.
pub const FOIL_TAB_MM: f64 = 20.0;

/// Default packing factor of a litz bundle: strands' overall area over the bundle's circle,
/// `n d_o^2 / D^2`. 0.75 is the factor behind the litz makers' rule `D = 1.155 d_o sqrt(n)`
/// for a bunched bundle (from memory).
pub const LITZ_PACKING: f64 = 0.75;
/// Default serving (the textile or film wrap over the bundle), added to the bundle's
/// diameter: a single nylon serving adds about 0.05 mm (from memory).
pub const LITZ_SERVING_MM: f64 = 0.05;
/// Default lay factor: each strand runs longer than the bundle by the twist; about 1.5 % per
/// bunching operation, 2 to 3 % for a usual construction (from memory); 1.03 is taken.
pub const LITZ_LAY_FACTOR: f64 = 1.03;
/// Strand counts a litz winding may have.
pub const LITZ_STRANDS: std::ops::RangeInclusive<u32> = 2..=5000;
/// Strand bare diameters (mm) a litz winding may have: the metric table's range for fine wire.
pub const LITZ_STRAND_MM: std::ops::RangeInclusive<f64> = 0.02..=0.5;

/// The conductor kind of a winding.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub enum Conductor {
    /// Round magnet wire: `Winding::wire`, `strands`, `insulation`.
    #[default]
    Round,
    /// Copper foil, one turn a layer across the breadth.
    Foil(Foil),
    /// Litz: many fine enamelled strands twisted into one bundle.
    Litz(Litz),
}

impl Conductor {
    /// The word reports and JSON use: `round`, `foil`, `litz`.
    pub fn kind_key(&self) -> &'static str {
        match self {
            Conductor::Round => "round",
            Conductor::Foil(_) => "foil",
            Conductor::Litz(_) => "litz",
        }
    }
}

/// A foil conductor, as given in the file (`None` takes the default).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Foil {
    /// Copper thickness (`foil_mm`).
    pub thickness_mm: f64,
    /// Copper width across the breadth (`width_mm`); `None`: the wound breadth less
    /// `2 x overhang`.
    pub width_mm: Option<f64>,
    /// Insulating film laid under each turn (`interleaf_mm`); `None`: [`FOIL_INTERLEAF_MM`].
    pub interleaf_mm: Option<f64>,
    /// The interleaf's overhang beyond each foil edge (`overhang_mm`); `None`:
    /// [`FOIL_OVERHANG_MM`].
    pub overhang_mm: Option<f64>,
    /// Length of each lead tab from the winding to its pin (`tab_mm`); `None`: [`FOIL_TAB_MM`].
    pub tab_mm: Option<f64>,
}

impl Foil {
    /// A foil of this thickness with every other key left to its default.
    pub fn of(thickness_mm: f64) -> Self {
        Foil {
            thickness_mm,
            width_mm: None,
            interleaf_mm: None,
            overhang_mm: None,
            tab_mm: None,
        }
    }
    /// The interleaf thickness used.
    pub fn interleaf(&self) -> f64 {
        self.interleaf_mm.unwrap_or(FOIL_INTERLEAF_MM)
    }
    /// The overhang used.
    pub fn overhang(&self) -> f64 {
        self.overhang_mm.unwrap_or(FOIL_OVERHANG_MM)
    }
    /// The tab length used.
    pub fn tab(&self) -> f64 {
        self.tab_mm.unwrap_or(FOIL_TAB_MM)
    }
    /// The copper width used on a wound breadth of `breadth_mm` (the window width less both
    /// margins): `width_mm`, or `breadth - 2 x overhang`.
    pub fn width_on(&self, breadth_mm: f64) -> f64 {
        self.width_mm.unwrap_or(breadth_mm - 2.0 * self.overhang())
    }
}

/// A litz conductor, as given in the file (`None` takes the default).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Litz {
    /// Strands in the bundle (`litz_strands`).
    pub strands: u32,
    /// Bare diameter of one strand (`strand_mm`).
    pub strand_mm: f64,
    /// Serving build on the bundle's diameter (`serving_mm`); `None`: [`LITZ_SERVING_MM`].
    pub serving_mm: Option<f64>,
    /// Packing factor (`packing`); `None`: [`LITZ_PACKING`].
    pub packing: Option<f64>,
    /// Strand length over bundle length (`lay_factor`); `None`: [`LITZ_LAY_FACTOR`].
    pub lay_factor: Option<f64>,
}

impl Litz {
    /// A litz of `strands` strands of `strand_mm` with the other keys left to defaults.
    pub fn of(strands: u32, strand_mm: f64) -> Self {
        Litz {
            strands,
            strand_mm,
            serving_mm: None,
            packing: None,
            lay_factor: None,
        }
    }
    /// The serving used.
    pub fn serving(&self) -> f64 {
        self.serving_mm.unwrap_or(LITZ_SERVING_MM)
    }
    /// The packing factor used.
    pub fn packing_factor(&self) -> f64 {
        self.packing.unwrap_or(LITZ_PACKING)
    }
    /// The lay factor used.
    pub fn lay(&self) -> f64 {
        self.lay_factor.unwrap_or(LITZ_LAY_FACTOR)
    }
}
