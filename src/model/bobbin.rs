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
    Rect {
        width_mm: f64,
        depth_mm: f64,
        corner_radius_mm: f64,
    },
    Round {
        diameter_mm: f64,
    },
}

/// Effective core parameters (IEC 60205 sense) and the inductance factor as assembled.
#[derive(Debug, Clone, PartialEq)]
pub struct Core {
    pub ae_mm2: f64,
    pub le_mm: f64,
    pub ve_mm3: Option<f64>,
    pub al_nh: Option<f64>,
}

#[derive(Debug, Clone, PartialEq)]
pub struct Bobbin {
    pub name: String,
    pub origin: String,
    pub window: Window,
    pub tube: Tube,
    pub core: Option<Core>,
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
