//! The yes/no questions: quit with unsaved edits, drop them for another file or a new build,
//! and write over a file that is there.

use super::{Overlay, PickPurpose, PromptPurpose};
use crate::tui::action::Action;
use crate::tui::app::{App, Effect};

/// A question waiting for its answer.
#[derive(Debug, Clone, PartialEq)]
pub enum Question {
    /// Quit with unsaved edits (or save first).
    Quit,
    /// Open another file and drop the unsaved edits.
    DiscardForOpen,
    /// Start a new build and drop the unsaved edits.
    DiscardForNew,
    /// The file a write would go to exists: replace it (the write is carried out) or cancel.
    Overwrite(Box<Effect>),
}

impl App {
    /// The loop found a file where `effect` would write: ask before replacing it.
    pub fn ask_overwrite(&mut self, effect: Effect) {
        self.ui
            .overlays
            .push(Overlay::Question(Question::Overwrite(Box::new(effect))));
    }

    /// An answer: yes, no (or Esc), or "save, then quit" to the quit question.
    pub(crate) fn question_key(&mut self, action: Action, q: &Question) -> Option<Effect> {
        match action {
            Action::Yes => {
                self.ui.overlays.pop();
                match q {
                    Question::Quit => return Some(Effect::Quit),
                    Question::DiscardForOpen => {
                        self.prompt("open build file", "", PromptPurpose::OpenPath)
                    }
                    Question::DiscardForNew => self.open_bobbin_picker(PickPurpose::NewBuild),
                    Question::Overwrite(e) => return Some(Effect::Confirmed(e.clone())),
                }
            }
            Action::SaveThenQuit if *q == Question::Quit => {
                self.ui.overlays.pop();
                match self.doc.path.clone() {
                    Some(p) => return Some(Effect::SaveThenQuit(p)),
                    None => self.ask_save_path(true),
                }
            }
            Action::No | Action::Cancel => {
                self.ui.overlays.pop();
                if let Question::Overwrite(e) = q {
                    let what = match **e {
                        Effect::SaveBobbin { .. } => "the bobbin file",
                        _ => "the file",
                    };
                    self.info(format!("kept {what} that was there; nothing written"));
                }
            }
            _ => {}
        }
        None
    }
}
