//! Temperature rise of the wound transformer from its total loss and outer surface area, by
//! McLyman's correlation for natural convection.

/// McLyman, Transformer and Inductor Design Handbook, 3rd ed. (2004): the rise in C is
/// `450 psi^0.826` with `psi` the loss per outer surface area in W/cm^2.
pub const MCLYMAN_COEFF_C: f64 = 450.0;
pub const MCLYMAN_EXPONENT: f64 = 0.826;

/// McLyman (3rd ed.), surface area from the area product: `A_t = K_s Ap^0.5` (cm^2, Ap in
/// cm^4). 33.8 is his pot-core K_s, the smallest of his core families (from memory): it errs
/// toward a smaller surface and so a higher rise.
pub const SURFACE_KS: f64 = 33.8;

/// Rise the check accepts when the build gives none (common practice: 40 C over ambient
/// keeps a 100 C hot spot in a 60 C enclosure).
pub const DEFAULT_RISE_LIMIT_C: f64 = 40.0;

/// `450 (P / A_t)^0.826`, in C.
pub fn rise_c(loss_w: f64, surface_cm2: f64) -> f64 {
    if surface_cm2 <= 0.0 || loss_w <= 0.0 {
        return 0.0;
    }
    MCLYMAN_COEFF_C * (loss_w / surface_cm2).powf(MCLYMAN_EXPONENT)
}

/// `K_s sqrt(Wa Ae)` in cm^2, with the window and core areas in mm^2.
pub fn surface_from_area_product_cm2(window_area_mm2: f64, ae_mm2: f64) -> f64 {
    let ap_cm4 = window_area_mm2 * ae_mm2 * 1e-4;
    SURFACE_KS * ap_cm4.max(0.0).sqrt()
}
