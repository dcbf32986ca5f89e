//! Temperature rise of the wound transformer from its total loss and outer surface area, by
//! McLyman's correlation for natural convection.

/// McLyman, Transformer and Inductor Design Handbook, 3rd ed. (2004): the rise in C is
/// `450 psi^0.826` with `psi` the loss per outer surface area in W/cm^2.
pub const MCLYMAN_COEFF_C: f64 = 450.0;
/// The exponent of `psi` in McLyman's correlation (same source).
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

/// The air around the transformer when `[operating] ambient_c` is not given (common
/// practice: power supplies are usually rated for full load in 40 C air).
pub const DEFAULT_AMBIENT_C: f64 = 40.0;

/// IEC 60085 thermal classes by their temperature index (C): B 130, F 155, H 180 (also
/// A 105, E 120, N 200, R 220).
pub const IEC_60085_CLASSES: [(&str, f64); 7] = [
    ("A", 105.0),
    ("E", 120.0),
    ("B", 130.0),
    ("F", 155.0),
    ("H", 180.0),
    ("N", 200.0),
    ("R", 220.0),
];

/// Default class of the enamel: F, 155 C (common practice: the solderable polyurethane
/// enamels of IEC 60317-20 carry a temperature index of 155).
pub const DEFAULT_WIRE_CLASS_C: f64 = 155.0;
/// Default class of the tape: B, 130 C (from memory: polyester film tape with an acrylic
/// adhesive is usually rated 130 C; polyimide tape is rated higher).
pub const DEFAULT_TAPE_CLASS_C: f64 = 130.0;
/// Default class of the bobbin: B, 130 C (from memory: glass-filled thermoplastic bobbins are
/// often rated 130 C or better; the maker's rating is the figure to use).
pub const DEFAULT_BOBBIN_CLASS_C: f64 = 130.0;

/// The letter of an IEC 60085 class by its temperature index, when it is one.
pub fn class_letter(index_c: f64) -> Option<&'static str> {
    IEC_60085_CLASSES
        .iter()
        .find(|(_, t)| (t - index_c).abs() < 1e-9)
        .map(|(l, _)| *l)
}

/// The part of the insulation system whose class binds the hot spot.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum InsulationPart {
    /// The wire's enamel.
    Wire,
    /// The insulation tape.
    Tape,
    /// The bobbin's plastic.
    Bobbin,
}

impl InsulationPart {
    /// The word reports and JSON show for it (`wire`, `tape`, `bobbin`).
    pub fn key(self) -> &'static str {
        match self {
            InsulationPart::Wire => "wire",
            InsulationPart::Tape => "tape",
            InsulationPart::Bobbin => "bobbin",
        }
    }
}

/// The lowest class of wire, tape and bobbin (defaults where `None`), and the part it
/// belongs to; the first of equals in that order.
pub fn binding_class(
    wire_c: Option<f64>,
    tape_c: Option<f64>,
    bobbin_c: Option<f64>,
) -> (f64, InsulationPart) {
    let parts = [
        (wire_c.unwrap_or(DEFAULT_WIRE_CLASS_C), InsulationPart::Wire),
        (tape_c.unwrap_or(DEFAULT_TAPE_CLASS_C), InsulationPart::Tape),
        (
            bobbin_c.unwrap_or(DEFAULT_BOBBIN_CLASS_C),
            InsulationPart::Bobbin,
        ),
    ];
    parts
        .into_iter()
        .fold(parts[0], |best, p| if p.0 < best.0 { p } else { best })
}
