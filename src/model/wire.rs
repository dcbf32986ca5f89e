//! How a winding's wire is named in a build: a gauge, a nominal metric size or measured figures.

use std::fmt;

/// Enamel grade (IEC 60317: grade 1 thin, 2 medium, 3 thick) or triple-insulated wire.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Insulation {
    /// Enamel grade 1 (thin build), IEC 60317.
    Grade1,
    /// Enamel grade 2 (medium build), IEC 60317; the usual choice.
    Grade2,
    /// Enamel grade 3 (thick build), IEC 60317.
    Grade3,
    /// Triple-insulated wire: three extruded layers, each able to stand as insulation.
    Tiw,
}

impl Insulation {
    /// Every insulation, in the order the planner cycles through them.
    pub const ALL: [Insulation; 4] = [
        Insulation::Grade1,
        Insulation::Grade2,
        Insulation::Grade3,
        Insulation::Tiw,
    ];

    /// The word used in build files.
    pub fn key(self) -> &'static str {
        match self {
            Insulation::Grade1 => "grade1",
            Insulation::Grade2 => "grade2",
            Insulation::Grade3 => "grade3",
            Insulation::Tiw => "tiw",
        }
    }

    /// The insulation a build file's word names (`grade2`, `tiw`); `None` for an unknown word.
    pub fn from_key(s: &str) -> Option<Self> {
        Self::ALL.into_iter().find(|g| g.key() == s)
    }
}

impl fmt::Display for Insulation {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(match self {
            Insulation::Grade1 => "grade 1",
            Insulation::Grade2 => "grade 2",
            Insulation::Grade3 => "grade 3",
            Insulation::Tiw => "triple-insulated",
        })
    }
}

/// The conductor: by gauge, by nominal bare diameter, or as measured.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum WireSize {
    /// American Wire Gauge number (ASTM B258), 10..=44 in the bundled table.
    Awg(u32),
    /// Nominal bare diameter in millimetres (IEC 60317 series).
    Metric {
        /// Nominal bare copper diameter (mm).
        bare_mm: f64,
    },
    /// Measured bare and overall diameters; `od_mm` overrides any insulation table.
    Measured {
        /// Bare copper diameter as measured (mm).
        bare_mm: f64,
        /// Overall diameter over the insulation as measured (mm).
        od_mm: f64,
    },
}

impl WireSize {
    /// The file spelling for named sizes (`awg27`, `0.355mm`); `None` for measured wire.
    pub fn key(&self) -> Option<String> {
        match *self {
            WireSize::Awg(n) => Some(format!("awg{n}")),
            WireSize::Metric { bare_mm } => Some(format!("{}mm", trim_mm(bare_mm))),
            WireSize::Measured { .. } => None,
        }
    }

    /// Parse `awgNN` or `0.355mm`.
    pub fn parse(s: &str) -> Option<Self> {
        let s = s.trim();
        if let Some(n) = s.strip_prefix("awg").or_else(|| s.strip_prefix("AWG")) {
            return n.parse().ok().map(WireSize::Awg);
        }
        let n = s.strip_suffix("mm")?.trim();
        let bare_mm: f64 = n.parse().ok()?;
        (bare_mm.is_finite()).then_some(WireSize::Metric { bare_mm })
    }
}

impl fmt::Display for WireSize {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match *self {
            WireSize::Awg(n) => write!(f, "AWG {n}"),
            WireSize::Metric { bare_mm } => write!(f, "{} mm", trim_mm(bare_mm)),
            WireSize::Measured { bare_mm, od_mm } => {
                write!(f, "{} mm (od {} mm)", trim_mm(bare_mm), trim_mm(od_mm))
            }
        }
    }
}

/// A diameter without trailing zeros beyond three decimals: 0.355, 0.5, 1.12.
pub fn trim_mm(x: f64) -> String {
    let s = format!("{x:.4}");
    let s = s.trim_end_matches('0');
    s.trim_end_matches('.').to_string()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn wire_keys_round_trip() {
        for w in [WireSize::Awg(27), WireSize::Metric { bare_mm: 0.355 }] {
            assert_eq!(WireSize::parse(&w.key().unwrap()), Some(w));
        }
        assert_eq!(WireSize::Metric { bare_mm: 0.5 }.key().unwrap(), "0.5mm");
        assert_eq!(
            WireSize::parse("0.40mm"),
            Some(WireSize::Metric { bare_mm: 0.4 })
        );
        assert_eq!(WireSize::parse("thick"), None);
    }
}
