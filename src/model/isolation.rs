//! What a build declares about the insulation between its primary and secondary sides.
//! A declaration only: the engine checks the stack against it and warns; it certifies nothing.

/// The insulation class the builder intends (IEC 60664-1 / IEC 62368-1 vocabulary).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum IsolationClass {
    /// Needed for the circuit to work; no protection against shock.
    Functional,
    /// One level of protection against shock.
    Basic,
    /// A single system equal to two levels (double insulation); what mains-to-user needs.
    Reinforced,
}

impl IsolationClass {
    /// Every class, from the least to the most protection.
    pub const ALL: [IsolationClass; 3] = [
        IsolationClass::Functional,
        IsolationClass::Basic,
        IsolationClass::Reinforced,
    ];

    /// The word used in build files (`functional`, `basic`, `reinforced`).
    pub fn key(self) -> &'static str {
        match self {
            IsolationClass::Functional => "functional",
            IsolationClass::Basic => "basic",
            IsolationClass::Reinforced => "reinforced",
        }
    }

    /// The class a build file's word names; `None` for an unknown word.
    pub fn from_key(s: &str) -> Option<Self> {
        Self::ALL.into_iter().find(|c| c.key() == s)
    }
}

/// `[isolation]` in a build file.
#[derive(Debug, Clone, PartialEq)]
pub struct Isolation {
    /// The class the builder intends between primary and secondary sides.
    pub class: IsolationClass,
    /// Working voltage across the barrier, as the builder states it (peak or DC).
    pub working_voltage_v: Option<f64>,
    /// The creepage distance the builder has taken from the applicable standard.
    pub creepage_mm: Option<f64>,
}
