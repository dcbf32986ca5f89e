//! The notes: what a figure had to leave out, or what the model cannot see.

use super::*;

/// A remark that is not a warning: what a figure had to leave out, or what the model cannot
/// see.
#[derive(Debug, Clone, PartialEq)]
pub enum Note {
    /// Bifilar sections, as (winding, with) in stack order, a repeat of the one before left out.
    BifilarPairs(Vec<(Name, Name)>),
    /// The bobbin has no core data: flux, magnetising current and core loss are left out.
    NoCoreData,
    /// Neither AL nor mu_i is known: the magnetising current is taken as zero.
    NoInductance,
    /// The material has no Steinmetz coefficients: core loss is left out.
    NoSteinmetz,
    /// The surface area for the temperature rise was estimated from the window and Ae.
    SurfaceEstimated,
    /// These windings have no current: their copper loss is not counted.
    NoCurrent(Vec<Name>),
}

impl fmt::Display for Note {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Note::BifilarPairs(pairs) => {
                f.write_str("bifilar sections (")?;
                for (i, (a, b)) in pairs.iter().enumerate() {
                    if i > 0 {
                        f.write_str(", ")?;
                    }
                    write!(f, "{a} with {b}")?;
                }
                f.write_str(
                    ") share their layers: the 1-D model across the build sees no leakage between the two windings \
                     of a pair; what they have comes from the spacing of the wires' centres (small)",
                )
            }
            Note::NoCoreData => f.write_str(
                "the bobbin has no [core] data (ae_mm2, le_mm): flux swing, magnetising current, core loss and \
                 the surface-area estimate for the temperature rise are left out",
            ),
            Note::NoInductance => f.write_str(
                "no al_nh in [core] and no mu_i in [material]: the magnetising current is taken as zero",
            ),
            Note::NoSteinmetz => {
                f.write_str("no steinmetz coefficients in [material]: core loss is left out")
            }
            Note::SurfaceEstimated => write!(
                f,
                "surface area estimated as {SURFACE_KS:.1} x sqrt(Wa Ae) with the bobbin window as Wa \
                 (McLyman; errs toward a higher rise); give [operating] surface_area_cm2 to use a measured one"
            ),
            Note::NoCurrent(windings) => {
                f.write_str("no current for ")?;
                for (i, w) in windings.iter().enumerate() {
                    if i > 0 {
                        f.write_str(", ")?;
                    }
                    f.write_str(w)?;
                }
                f.write_str(": its copper loss is not counted (give current_rms_a)")
            }
        }
    }
}
