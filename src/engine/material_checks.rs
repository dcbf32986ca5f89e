//! The checks on a build's core material (`[material]`), apart from the rest of validation.

use super::layout::Resolved;
use super::validate::{Place, positive};
use crate::model::Build;

/// The core material: saturation, remanence, permeability, Steinmetz figures and gap.
pub(super) fn check_material(
    build: &Build,
    _resolved: &Resolved,
    bad: &mut dyn FnMut(Place, String),
) {
    if let Some(m) = &build.material {
        if !positive(m.bsat_mt) {
            bad(
                Place::Material("bsat_mt"),
                format!("must be positive, got {}", m.bsat_mt),
            );
        }
        if !(m.br_mt.is_finite() && m.br_mt >= 0.0 && m.br_mt < m.bsat_mt) {
            bad(
                Place::Material("br_mt"),
                format!("expected 0 <= br_mt < bsat_mt, got {}", m.br_mt),
            );
        }
        if let Some(mu) = m.mu_i
            && !positive(mu)
        {
            bad(
                Place::Material("mu_i"),
                format!("must be positive, got {mu}"),
            );
        }
        if let Some(st) = m.steinmetz
            && !(positive(st.k) && positive(st.alpha) && positive(st.beta))
        {
            bad(
                Place::Material("steinmetz"),
                "k, alpha and beta must all be positive".into(),
            );
        }
        if let Some(g) = m.gap_mm
            && !(g.is_finite() && g >= 0.0)
        {
            bad(
                Place::Material("gap_mm"),
                format!("must be zero or a positive length in mm, got {g}"),
            );
        }
    }
}
