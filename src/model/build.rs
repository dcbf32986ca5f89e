//! A winding build: the bobbin, the setup, the windings and the stack from the tube outward.

use super::{
    Bobbin, Conductor, Insulation, Isolation, Material, Measured, Name, Operating, WireSize,
};

/// What a winding does in the forward converter; the engine finds the primary, secondary
/// and reset by it.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Role {
    /// Driven by the switch from the input.
    Primary,
    /// Feeds the output rectifier.
    Secondary,
    /// Returns the magnetising energy each cycle (wound bifilar with the primary as a rule).
    Reset,
    /// Any other winding (bias supply, sense); carries no current in the converter figures.
    Auxiliary,
}

impl Role {
    /// Every role, in the order the planner cycles through them.
    pub const ALL: [Role; 4] = [Role::Primary, Role::Secondary, Role::Reset, Role::Auxiliary];

    /// The word used in build files (`primary`, `secondary`, `reset`, `auxiliary`).
    pub fn key(self) -> &'static str {
        match self {
            Role::Primary => "primary",
            Role::Secondary => "secondary",
            Role::Reset => "reset",
            Role::Auxiliary => "auxiliary",
        }
    }

    /// The role a build file's word names; `None` for an unknown word.
    pub fn from_key(s: &str) -> Option<Self> {
        Self::ALL.into_iter().find(|r| r.key() == s)
    }
}

/// Where the bobbin came from: a library id (saved as `bobbin = "id"`) or written inline.
#[derive(Debug, Clone, PartialEq)]
pub enum BobbinSource {
    /// A bobbin looked up by id (beside the build, the user's folder, then the bundled set).
    Id(String),
    /// Written out in the build file's own `[bobbin]` table.
    Inline,
}

/// Every key optional in the file; these are the values after defaults.
#[derive(Debug, Clone, PartialEq)]
pub struct Setup {
    /// Winding temperature at which resistances are worked out (C); default 20.
    pub temperature_c: f64,
    /// The file (or the user) gave `temperature_c`; without it, and with an operating point
    /// whose rise can be predicted, the engine takes the windings at ambient + rise.
    pub temperature_given: bool,
    /// Thermal class (IEC 60085 temperature index, C) of the wire's enamel, the tape and the
    /// bobbin; `None` takes the engine's defaults (`engine::thermal`).
    pub wire_class_c: Option<f64>,
    /// Thermal class of the insulation tape (C); `None` takes the engine's default.
    pub tape_class_c: Option<f64>,
    /// Thermal class of the bobbin's plastic (C); `None` takes the engine's default.
    pub bobbin_class_c: Option<f64>,
    /// The hand-winding allowance: a factor multiplied onto the build height (1.0-2.0;
    /// default 1.10; the file's key `bulge`).
    pub allowance_factor: f64,
    /// Width of margin tape at each flange (mm); winding sections lose twice this of width.
    pub margin_mm: f64,
    /// Thickness of one wrap of insulation tape (mm); default 0.06.
    pub tape_mm: f64,
    /// Switching frequency (kHz) for the AC figures; `None` leaves them out.
    pub frequency_khz: Option<f64>,
}

impl Default for Setup {
    fn default() -> Self {
        Setup {
            temperature_c: 20.0,
            temperature_given: false,
            wire_class_c: None,
            tape_class_c: None,
            bobbin_class_c: None,
            allowance_factor: 1.10,
            margin_mm: 0.0,
            tape_mm: 0.06,
            frequency_khz: None,
        }
    }
}

/// One winding: its name, role, turns and conductor.
#[derive(Debug, Clone, PartialEq)]
pub struct Winding {
    /// The name sections and readings refer to it by (unique in a build).
    pub name: Name,
    /// What it does in the converter.
    pub role: Role,
    /// Total turns, over every section that carries it.
    pub turns: u32,
    /// Round wire's size; for litz the strand's, for foil a placeholder (see [`Conductor`]).
    pub wire: WireSize,
    /// The enamel grade, or triple-insulated wire.
    pub insulation: Insulation,
    /// Round wires in parallel; for litz, bundles in parallel; 1 for foil.
    pub strands: u32,
    /// Round wire, foil or litz (see [`Conductor`] for how `wire` and `strands` read).
    pub conductor: Conductor,
    /// RMS current (A) when the file gives it; otherwise the operating point sets it.
    pub current_rms_a: Option<f64>,
    /// Label of the pin the winding starts on, for the sheet.
    pub start_pin: Option<String>,
    /// Label of the pin the winding finishes on, for the sheet.
    pub finish_pin: Option<String>,
}

/// A stack section as the engine reads it: the windings it names, as indices into
/// `Build::windings` (`None` for tape and for a name no winding has), and its turns (0 for
/// tape).
#[derive(Debug, Clone, Copy, Default, PartialEq, Eq)]
pub struct SectionRef {
    /// The section's winding.
    pub winding: Option<usize>,
    /// The bifilar partner.
    pub partner: Option<usize>,
    /// Turns of this section (0 for tape).
    pub turns: u32,
}

/// One winding section of the stack (optionally bifilar with a second winding).
#[derive(Debug, Clone, PartialEq)]
pub struct WindingSection {
    /// Name of the winding whose turns this section carries.
    pub winding: String,
    /// This section's share; `None` takes what is left (see `Build::section_turns`).
    pub turns: Option<u32>,
    /// Name of the bifilar partner wound in the same turns, when there is one (the file's
    /// key `with`).
    pub partner: Option<String>,
    /// Wraps of tape between the layers of this section.
    pub layer_tape: u32,
    /// The last layer's turns spaced evenly across the width (space-wound) instead of
    /// close-wound from the start flange: the file's `spread = true`. A partial last layer
    /// so wound leaves no step for the section above.
    pub spread: bool,
}

/// One entry of the stack, from the tube outward.
#[derive(Debug, Clone, PartialEq)]
pub enum Section {
    /// Turns of a winding (and its bifilar partner).
    Winding(WindingSection),
    /// Insulation tape wrapped over the whole width.
    Tape {
        /// Wraps of insulation tape, each `Setup::tape_mm` thick.
        wraps: u32,
    },
}

/// A whole transformer build: the bobbin, the setup, the windings, the stack of sections from
/// the tube outward, and optionally the operating point, the core material and the declared
/// isolation.
#[derive(Debug, Clone, PartialEq)]
pub struct Build {
    /// The build's title, as printed on reports and sheets.
    pub title: String,
    /// Whether the bobbin was named by id or written inline (saving keeps the same).
    pub bobbin_source: BobbinSource,
    /// The bobbin (and its core, when known), resolved.
    pub bobbin: Bobbin,
    /// Temperature, allowance, margins, tape and frequency, after defaults.
    pub setup: Setup,
    /// The windings, in file order.
    pub windings: Vec<Winding>,
    /// The sections from the tube outward.
    pub stack: Vec<Section>,
    /// The converter's operating point, when the file gives one.
    pub operating: Option<Operating>,
    /// The core's ferrite, when the file gives one.
    pub material: Option<Material>,
    /// The declared insulation between primary and secondary sides, when the file gives one.
    pub isolation: Option<Isolation>,
    /// The bench readings of the part wound from this build (the `[measured]` table), when
    /// the file has them. Not part of the plan: the build id and the search leave them out.
    pub measured: Option<Measured>,
}

impl Build {
    /// The winding of that name.
    pub fn winding(&self, name: &str) -> Option<&Winding> {
        self.windings.iter().find(|w| w.name == name)
    }

    /// The position in `windings` of the winding of that name.
    pub fn winding_index(&self, name: &str) -> Option<usize> {
        self.windings.iter().position(|w| w.name == name)
    }

    /// The first winding of a role, in file order.
    pub fn first_of(&self, role: Role) -> Option<&Winding> {
        self.windings.iter().find(|w| w.role == role)
    }

    /// Every stack section with its names resolved and its turns found (see
    /// [`Build::section_turns`]).
    pub fn section_refs(&self) -> Vec<SectionRef> {
        let mut refs: Vec<SectionRef> = self
            .stack
            .iter()
            .map(|s| match s {
                Section::Tape { .. } => SectionRef::default(),
                Section::Winding(ws) => SectionRef {
                    winding: self.winding_index(&ws.winding),
                    partner: ws.partner.as_deref().and_then(|p| self.winding_index(p)),
                    turns: ws.turns.unwrap_or(0),
                },
            })
            .collect();
        // Per winding: (turns stated by sections, turns taken by defaulted sections so far).
        // A name no winding has (refused by validation) counts nowhere.
        let mut taken = vec![(0u64, 0u64); self.windings.len()];
        let stated = |s: &Section| matches!(s, Section::Winding(ws) if ws.turns.is_some());
        for (s, r) in self.stack.iter().zip(&refs) {
            if stated(s) {
                for i in [r.winding, r.partner].into_iter().flatten() {
                    taken[i].0 += u64::from(r.turns);
                }
            }
        }
        for (s, r) in self.stack.iter().zip(&mut refs) {
            if !matches!(s, Section::Winding(_)) || stated(s) {
                continue;
            }
            let Some(i) = r.winding else {
                continue;
            };
            let total = u64::from(self.windings[i].turns);
            let left = total.saturating_sub(taken[i].0 + taken[i].1);
            taken[i].1 += left;
            if let Some(j) = r.partner {
                taken[j].1 += left;
            }
            r.turns = u32::try_from(left).unwrap_or(u32::MAX);
        }
        refs
    }

    /// Resolved turns of every section (tape sections get 0).
    ///
    /// A section that states its turns gets them. One that does not takes what is left of
    /// its winding after every section that states turns for that winding (anywhere in the
    /// stack, sections that wind it as the bifilar partner included) and every earlier section that did not.
    pub fn section_turns(&self) -> Vec<u32> {
        self.section_refs().into_iter().map(|r| r.turns).collect()
    }
}
