//! The overlays over the main screen, each in its own module with its own key handling:
//! the pick lists, the forms, the line editor (prompt), the questions and the search's
//! list. The help screen is small enough to live here.

mod design;
pub mod form;
pub mod picker;
mod pickers;
pub mod prompt;
pub mod question;
mod search;

pub use form::Form;
pub use picker::{PickItem, PickPurpose, PickValue, Picker};
pub use prompt::{Prompt, PromptPurpose};
pub use question::Question;

use super::action::Action;
use super::app::App;

/// One overlay; the last of `Ui::overlays` has the keys.
#[derive(Debug, Clone, PartialEq)]
pub enum Overlay {
    /// The key help, scrolled down by `scroll` lines.
    Help { scroll: u16 },
    /// A pick list.
    Picker(Picker),
    /// A form of fields.
    Form(Form),
    /// The line editor.
    Prompt(Prompt),
    /// A yes/no question.
    Question(Question),
    /// The bench readings against the plan, scrolled down by `scroll` lines.
    Readings { scroll: u16 },
    /// The reset ratio's sweep against the reset turns.
    ResetRatio,
}

impl App {
    /// The readings view's keys: up and down scroll, any other closes it.
    pub(super) fn readings_key(&mut self, action: Action, scroll: u16) {
        let top = self.ui.overlays.len() - 1;
        match action {
            Action::Down => self.ui.overlays[top] = Overlay::Readings { scroll: scroll + 1 },
            Action::Up => {
                self.ui.overlays[top] = Overlay::Readings {
                    scroll: scroll.saturating_sub(1),
                }
            }
            _ => {
                self.ui.overlays.pop();
            }
        }
    }

    /// The reset-ratio view's keys: it only closes.
    pub(super) fn reset_ratio_key(&mut self, action: Action) {
        if action == Action::Cancel {
            self.ui.overlays.pop();
        }
    }

    /// The help screen's keys: up and down scroll, any other closes it.
    pub(super) fn help_key(&mut self, action: Action, scroll: u16) {
        let top = self.ui.overlays.len() - 1;
        match action {
            Action::Down => self.ui.overlays[top] = Overlay::Help { scroll: scroll + 1 },
            Action::Up => {
                self.ui.overlays[top] = Overlay::Help {
                    scroll: scroll.saturating_sub(1),
                }
            }
            _ => {
                self.ui.overlays.pop();
            }
        }
    }
}
