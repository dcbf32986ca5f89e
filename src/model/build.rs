//! A winding build: the bobbin, the setup, the windings and the stack from the tube outward.

use super::{Bobbin, Insulation, Isolation, Material, Operating, WireSize};

#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Role {
    Primary,
    Secondary,
    Reset,
    Auxiliary,
}

impl Role {
    pub const ALL: [Role; 4] = [Role::Primary, Role::Secondary, Role::Reset, Role::Auxiliary];

    pub fn key(self) -> &'static str {
        match self {
            Role::Primary => "primary",
            Role::Secondary => "secondary",
            Role::Reset => "reset",
            Role::Auxiliary => "auxiliary",
        }
    }

    pub fn from_key(s: &str) -> Option<Self> {
        Self::ALL.into_iter().find(|r| r.key() == s)
    }
}

/// Where the bobbin came from: a library id (saved as `bobbin = "id"`) or written inline.
#[derive(Debug, Clone, PartialEq)]
pub enum BobbinSource {
    Id(String),
    Inline,
}

/// Every key optional in the file; these are the values after defaults.
#[derive(Debug, Clone, PartialEq)]
pub struct Setup {
    pub temperature_c: f64,
    pub bulge: f64,
    pub margin_mm: f64,
    pub tape_mm: f64,
    pub frequency_khz: Option<f64>,
}

impl Default for Setup {
    fn default() -> Self {
        Setup {
            temperature_c: 20.0,
            bulge: 1.10,
            margin_mm: 0.0,
            tape_mm: 0.06,
            frequency_khz: None,
        }
    }
}

#[derive(Debug, Clone, PartialEq)]
pub struct Winding {
    pub name: String,
    pub role: Role,
    pub turns: u32,
    pub wire: WireSize,
    pub insulation: Insulation,
    pub strands: u32,
    pub current_rms_a: Option<f64>,
    pub start_pin: Option<String>,
    pub finish_pin: Option<String>,
}

/// One winding section of the stack (optionally bifilar with a second winding).
#[derive(Debug, Clone, PartialEq)]
pub struct WindingSection {
    pub winding: String,
    /// This section's share; `None` takes what is left (see `Build::section_turns`).
    pub turns: Option<u32>,
    pub with: Option<String>,
    /// Wraps of tape between the layers of this section.
    pub layer_tape: u32,
}

#[derive(Debug, Clone, PartialEq)]
pub enum Section {
    Winding(WindingSection),
    Tape { wraps: u32 },
}

#[derive(Debug, Clone, PartialEq)]
pub struct Build {
    pub title: String,
    pub bobbin_source: BobbinSource,
    pub bobbin: Bobbin,
    pub setup: Setup,
    pub windings: Vec<Winding>,
    pub stack: Vec<Section>,
    pub operating: Option<Operating>,
    pub material: Option<Material>,
    /// The declared insulation between primary and secondary sides, when the file gives one.
    pub isolation: Option<Isolation>,
}

impl Build {
    pub fn winding(&self, name: &str) -> Option<&Winding> {
        self.windings.iter().find(|w| w.name == name)
    }

    pub fn winding_index(&self, name: &str) -> Option<usize> {
        self.windings.iter().position(|w| w.name == name)
    }

    /// The first winding of a role, in file order.
    pub fn first_of(&self, role: Role) -> Option<&Winding> {
        self.windings.iter().find(|w| w.role == role)
    }

    /// The windings each stack section names, as indices into `windings`: (the winding, its
    /// bifilar partner); `None` for tape and for a name no winding has.
    pub fn section_windings(&self) -> Vec<(Option<usize>, Option<usize>)> {
        self.stack
            .iter()
            .map(|s| match s {
                Section::Tape { .. } => (None, None),
                Section::Winding(ws) => (
                    self.winding_index(&ws.winding),
                    ws.with.as_deref().and_then(|w| self.winding_index(w)),
                ),
            })
            .collect()
    }

    /// Resolved turns of every section (tape sections get 0).
    ///
    /// A section that states its turns gets them. One that does not takes what is left of
    /// its winding after every section that states turns for that winding (anywhere in the
    /// stack, bifilar `with` sections included) and every earlier section that did not.
    pub fn section_turns(&self) -> Vec<u32> {
        self.section_turns_of(&self.section_windings())
    }

    /// [`Build::section_turns`], given what [`Build::section_windings`] gives.
    pub fn section_turns_of(&self, indices: &[(Option<usize>, Option<usize>)]) -> Vec<u32> {
        // Per winding: (turns stated by sections, turns taken by defaulted sections so far).
        // A name no winding has (refused by validation) counts nowhere.
        let mut taken = vec![(0u64, 0u64); self.windings.len()];
        for (s, &(a, b)) in self.stack.iter().zip(indices) {
            if let Section::Winding(ws) = s
                && let Some(t) = ws.turns
            {
                for i in [a, b].into_iter().flatten() {
                    taken[i].0 += u64::from(t);
                }
            }
        }
        self.stack
            .iter()
            .zip(indices)
            .map(|(s, &(a, b))| match s {
                Section::Tape { .. } => 0,
                Section::Winding(ws) => match ws.turns {
                    Some(t) => t,
                    None => {
                        let Some(i) = a else {
                            return 0;
                        };
                        let total = u64::from(self.windings[i].turns);
                        let left = total.saturating_sub(taken[i].0 + taken[i].1);
                        taken[i].1 += left;
                        if let Some(j) = b {
                            taken[j].1 += left;
                        }
                        u32::try_from(left).unwrap_or(u32::MAX)
                    }
                },
            })
            .collect()
    }
}
