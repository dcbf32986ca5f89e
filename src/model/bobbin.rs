//! A coil former's winding space and, optionally, the core that goes with it.

/// The winding space between the flanges and out from the tube.
#[derive(Debug, Clone, PartialEq)]
pub struct Window {
    /// Between the flanges, along the centre leg (the breadth).
    pub width_mm: f64,
    /// From the tube's outer surface out to the usable limit.
    pub height_mm: f64,
}

/// The outer surface of the bobbin's tube, where the first layer sits.
#[derive(Debug, Clone, PartialEq)]
pub enum Tube {
    /// A rectangular tube (for E, EF, EFD cores) with rounded corners.
    Rect {
        /// Outer width across the tube (mm).
        width_mm: f64,
        /// Outer depth across the tube, the other way (mm).
        depth_mm: f64,
        /// Radius of the tube's outer corners (mm); 0 for sharp corners.
        corner_radius_mm: f64,
    },
    /// A round tube (for pot, RM, ETD cores).
    Round {
        /// Outer diameter of the tube (mm).
        diameter_mm: f64,
    },
}

/// Effective core parameters (IEC 60205 sense) and the inductance factor as assembled.
#[derive(Debug, Clone, PartialEq)]
pub struct Core {
    /// Effective cross-section Ae (mm2).
    pub ae_mm2: f64,
    /// Effective magnetic path length le (mm).
    pub le_mm: f64,
    /// Effective volume Ve (mm3); `None` takes Ae x le.
    pub ve_mm3: Option<f64>,
    /// Inductance factor AL of the assembled core (nH per turn squared).
    pub al_nh: Option<f64>,
}

/// A coil former: its winding window, its tube and, when known, the core it fits.
#[derive(Debug, Clone, PartialEq)]
pub struct Bobbin {
    /// The name shown in lists and on sheets.
    pub name: String,
    /// Where the figures come from (measured, or typical for a size family).
    pub origin: String,
    /// The winding space between the flanges.
    pub window: Window,
    /// The tube the first layer sits on.
    pub tube: Tube,
    /// The core's effective figures, when known.
    pub core: Option<Core>,
    /// Number of pins on the bobbin, when known.
    pub pin_count: Option<u32>,
}

impl Tube {
    /// Perimeter of the tube surface itself (mean turn length at height zero).
    pub fn perimeter_mm(&self) -> f64 {
        match *self {
            Tube::Rect {
                width_mm,
                depth_mm,
                corner_radius_mm: r,
            } => 2.0 * (width_mm + depth_mm) - 8.0 * r + 2.0 * std::f64::consts::PI * r,
            Tube::Round { diameter_mm } => std::f64::consts::PI * diameter_mm,
        }
    }
}
