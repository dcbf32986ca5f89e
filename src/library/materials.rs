//! A small bundled library of generic ferrites with typical figures (from memory, not any
//! maker's material), so a build can name one (the file's `grade = "..."`) and override single
//! values. In code "grade" is only the enamel grade of a wire; a ferrite is a `Ferrite`.

use crate::model::Steinmetz;

/// Typical figures of one generic ferrite at the temperature its name says.
#[derive(Debug, Clone, PartialEq)]
pub struct Ferrite {
    pub id: &'static str,
    pub description: &'static str,
    pub bsat_mt: f64,
    pub br_mt: f64,
    pub mu_i: f64,
    /// P in kW/m^3 with f in kHz and B (peak) in T.
    pub steinmetz: Steinmetz,
}

/// Typical MnZn power-ferrite figures, from memory [TYP]: Bsat 0.38-0.42 T and Br about
/// 0.1 T at 100 C, mu_i 2000-3000, alpha 1.1-1.6, beta 2.5-3.0, and 50-150 kW/m^3 at
/// 100 kHz, 100 mT peak, 100 C. Each k below is set so the ferrite lands inside that band.
pub const FERRITES: &[Ferrite] = &[
    Ferrite {
        id: "mnzn-power-100c",
        description: "MnZn power ferrite for 25-200 kHz, at 100 C (its loss minimum); typical, from memory",
        bsat_mt: 380.0,
        br_mt: 100.0,
        mu_i: 2300.0,
        // 40 x 100^1.4 x 0.1^2.6 = 63 kW/m^3 at 100 kHz, 100 mT.
        steinmetz: Steinmetz {
            k: 40.0,
            alpha: 1.4,
            beta: 2.6,
        },
    },
    Ferrite {
        id: "mnzn-power-25c",
        description: "the same kind of MnZn power ferrite cold, at 25 C: more flux, more loss; typical, from memory",
        bsat_mt: 490.0,
        br_mt: 150.0,
        mu_i: 2300.0,
        // 65 x 100^1.4 x 0.1^2.6 = 103 kW/m^3 at 100 kHz, 100 mT.
        steinmetz: Steinmetz {
            k: 65.0,
            alpha: 1.4,
            beta: 2.6,
        },
    },
    Ferrite {
        id: "mnzn-hf-100c",
        description: "MnZn ferrite for 200 kHz-1 MHz, at 100 C: lower permeability, loss rising less with frequency below 100 mT; typical, from memory",
        bsat_mt: 370.0,
        br_mt: 90.0,
        mu_i: 1400.0,
        // 5 x 100^1.7 x 0.1^2.5 = 40 kW/m^3 at 100 kHz, 100 mT.
        steinmetz: Steinmetz {
            k: 5.0,
            alpha: 1.7,
            beta: 2.5,
        },
    },
];

pub fn find(id: &str) -> Option<&'static Ferrite> {
    FERRITES.iter().find(|g| g.id == id)
}

pub fn ids() -> Vec<&'static str> {
    FERRITES.iter().map(|g| g.id).collect()
}
