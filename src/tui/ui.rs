//! What belongs to the screen rather than to the build: which panel has the keys, the
//! selections, the overlays open, the status line, the theme and the measured core being
//! typed in.

use super::core_form::CoreDraft;
use super::overlay::Overlay;
use super::theme::Theme;
use crate::model::Requirements;

/// Which list on the main screen has the keys.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Focus {
    /// The stack of sections.
    Stack,
    /// The windings.
    Windings,
}

/// What kind of message the status line shows.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum StatusKind {
    /// What happened.
    Info,
    /// An edit the planner did not make, and why.
    Refused,
    /// Something failed (a file could not be read or written).
    Error,
}

/// The status line's message.
#[derive(Debug, Clone, PartialEq)]
pub struct Status {
    /// The words shown.
    pub text: String,
    /// How they are shown.
    pub kind: StatusKind,
}

/// The planner's screen state.
pub struct Ui {
    /// The list with the keys.
    pub focus: Focus,
    /// Index into `build.stack` (file order, tube first).
    pub stack_sel: usize,
    /// Index into `build.windings`.
    pub winding_sel: usize,
    /// The overlays open, the one with the keys last.
    pub overlays: Vec<Overlay>,
    /// The status line's message, cleared by the next key.
    pub status: Option<Status>,
    /// Colours and styles.
    pub theme: Theme,
    /// The measured core being typed in the measured-bobbin form, not yet applied.
    pub core_draft: CoreDraft,
    /// The requirements typed in the "from requirements" form, kept between its openings.
    pub needs: Option<Requirements>,
    /// Why the last design found nothing (the engine's binding sentence), shown under the
    /// requirements form until a field changes.
    pub design_note: Option<String>,
}

impl Ui {
    /// The main screen with the stack's keys, nothing open.
    pub fn new(theme: Theme) -> Self {
        Ui {
            focus: Focus::Stack,
            stack_sel: 0,
            winding_sel: 0,
            overlays: Vec::new(),
            status: None,
            theme,
            core_draft: CoreDraft::default(),
            needs: None,
            design_note: None,
        }
    }
}
