//! Mean length of a turn at a height above the tube surface.

use crate::model::Tube;
use std::f64::consts::PI;

/// MLT (mm) of a turn whose centre lies `y_mm` above the tube's outer surface.
/// Rect tube: `2(w + d) - 8r + 2 pi (r + y)`; round tube: `pi (D + 2y)`.
pub fn mlt_at_mm(tube: &Tube, y_mm: f64) -> f64 {
    match *tube {
        Tube::Rect {
            width_mm,
            depth_mm,
            corner_radius_mm: r,
        } => 2.0 * (width_mm + depth_mm) - 8.0 * r + 2.0 * PI * (r + y_mm),
        Tube::Round { diameter_mm } => PI * (diameter_mm + 2.0 * y_mm),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Geometry: a round tube's turn at height y has circumference pi (D + 2y).
    #[test]
    fn round_tube_mlt_is_circumference() {
        let t = Tube::Round { diameter_mm: 10.0 };
        assert!((mlt_at_mm(&t, 0.5) - PI * 11.0).abs() < 1e-12);
    }

    /// Geometry: a square-cornered rect tube adds 8y per turn per mm of height (2 pi y with r = 0
    /// is the rounded-corner form the spec uses; corner radius r replaces 8r of straight by 2 pi r).
    #[test]
    fn rect_tube_mlt_with_and_without_corner_radius() {
        let sharp = Tube::Rect {
            width_mm: 8.0,
            depth_mm: 6.0,
            corner_radius_mm: 0.0,
        };
        assert!((mlt_at_mm(&sharp, 0.0) - 28.0).abs() < 1e-12);
        let round = Tube::Rect {
            width_mm: 8.0,
            depth_mm: 6.0,
            corner_radius_mm: 1.0,
        };
        assert!((mlt_at_mm(&round, 0.0) - (28.0 - 8.0 + 2.0 * PI)).abs() < 1e-12);
        assert!((mlt_at_mm(&round, 1.0) - mlt_at_mm(&round, 0.0) - 2.0 * PI).abs() < 1e-12);
    }
}
