//! The planner's state: a `Document` (the build, its figures, its file and history) and a
//! `Ui` (focus, selections, overlays, status). `update` turns an Action into a change; each
//! overlay handles its own keys (`tui::overlay`), the main screen's are in `main_keys.rs`.
//! File I/O is returned as an `Effect` for the run loop to carry out.

use super::action::Action;
use super::document::Document;
use super::edit::{self, Refusal};
use super::keymap::{self, Context};
use super::theme::Theme;
use crate::engine::{Evaluation, validate};
use crate::files::{BobbinEntry, BobbinLibrary};
use crate::model::{Build, Section};
use ratatui::crossterm::event::KeyEvent;
use std::path::{Path, PathBuf};

pub use super::core_form::{CoreDraft, LegShape};
pub use super::document::UndoStep;
pub use super::fields::FormKind;
pub use super::overlay::{
    Form, Overlay, PickItem, PickPurpose, PickValue, Picker, Prompt, PromptPurpose, Question,
};
pub use super::ui::{Focus, Status, StatusKind, Ui};

/// What the loop must do outside the state: file I/O, or stop.
#[derive(Debug, Clone, PartialEq)]
pub enum Effect {
    /// Save the build to this file.
    Save(PathBuf),
    /// Save the build to this file, then quit if that worked.
    SaveThenQuit(PathBuf),
    /// Open this build file.
    Open(PathBuf),
    /// Write the winding sheet of the current build (HTML when the name ends in .html).
    WriteSheet(PathBuf),
    /// Write a bobbin file into the user's bobbin folder.
    SaveBobbin { path: PathBuf, text: String },
    /// Start the search on the current build, in the background.
    Search,
    /// Start the design from these requirements over the library, in the background.
    Design(Box<crate::model::Requirements>),
    /// Stop the planner.
    Quit,
    /// A write the user agreed may replace the file there: carried out without asking.
    Confirmed(Box<Effect>),
}

impl Effect {
    /// The file this effect would write, when an existing one there must be asked about
    /// first: a save to the document's own file (`own`) is not, any other write is.
    pub fn replaces(&self, own: Option<&Path>) -> Option<&Path> {
        match self {
            Effect::Save(p) | Effect::SaveThenQuit(p) => (own != Some(p.as_path())).then_some(p),
            Effect::WriteSheet(p) => Some(p),
            Effect::SaveBobbin { path, .. } => Some(path),
            Effect::Open(_)
            | Effect::Search
            | Effect::Design(_)
            | Effect::Quit
            | Effect::Confirmed(_) => None,
        }
    }
}

/// The planner: the document being edited and the screen's state.
pub struct App {
    /// The build, its figures, its file and its history.
    pub doc: Document,
    /// Focus, selections, overlays, status line, theme.
    pub ui: Ui,
    /// Where bobbins are saved: the user's bobbin folder (tests point it elsewhere).
    pub bobbin_dir: Option<PathBuf>,
    /// The bobbins the build can use (bundled, the user's, beside its file), as the run loop
    /// last read them (`run::read_library`); the bobbin lists are made from these.
    pub library: Vec<BobbinEntry>,
    /// The search or design under way, if any; its result comes back through `poll_job`.
    pub job: Option<super::job::Job>,
}

impl App {
    /// The planner on `build`, from `path` (or the demo, with none).
    pub fn new(build: Build, path: Option<PathBuf>) -> Self {
        App {
            doc: Document::new(build, path),
            ui: Ui::new(Theme::from_env()),
            bobbin_dir: crate::files::user_bobbin_dir(),
            library: Vec::new(),
            job: None,
        }
    }

    /// A build for a file that does not exist yet, on the first bobbin of `library` (as
    /// `run::read_library` reads it): the bobbin is picked first.
    pub fn new_file(path: PathBuf, library: Vec<BobbinEntry>) -> Self {
        let (id, bobbin) = first_bobbin(&library);
        let mut app = App::new(edit::new_build(&id, bobbin), Some(path));
        app.library = library;
        app.doc.saved = None;
        app.open_new_chooser();
        app.info("a new build: from a bobbin or from requirements (Esc keeps the one shown)");
        app
    }

    /// True when the build has edits not saved.
    pub fn dirty(&self) -> bool {
        self.doc.dirty()
    }

    /// The file's name for the header.
    pub fn file_label(&self) -> String {
        self.doc.file_label()
    }

    /// The figures to compare the current ones with, and a word for what they are.
    pub fn reference(&self) -> Option<(&Evaluation, String)> {
        self.doc.reference()
    }

    /// The key tables that apply now: the top overlay's, or the focused panel's and the
    /// main screen's.
    pub fn contexts(&self) -> Vec<Context> {
        if self.job.is_some() {
            return vec![Context::Job];
        }
        match self.ui.overlays.last() {
            Some(Overlay::Help { .. }) => vec![Context::HelpScreen],
            Some(Overlay::Readings { .. }) => vec![Context::Readings],
            Some(Overlay::ResetRatio) => vec![Context::ResetRatio],
            Some(Overlay::Picker(_) | Overlay::Form(_)) => vec![Context::List],
            Some(Overlay::Prompt(_)) => vec![Context::Prompt],
            Some(Overlay::Question(_)) => vec![Context::Question],
            None => match self.ui.focus {
                Focus::Stack => vec![Context::Stack, Context::Main],
                Focus::Windings => vec![Context::Windings, Context::Main],
            },
        }
    }

    /// One key press (the loop has already dropped releases and repeats).
    pub fn handle_key(&mut self, key: &KeyEvent) -> Option<Effect> {
        let action = keymap::lookup(&self.contexts(), key)?;
        self.update(action)
    }

    /// Carry out an action: the top overlay takes it, or the main screen.
    pub fn update(&mut self, action: Action) -> Option<Effect> {
        if self.job.is_some() {
            self.job_key(action);
            return None;
        }
        self.ui.status = None;
        match self.ui.overlays.last().cloned() {
            Some(Overlay::Help { scroll }) => self.help_key(action, scroll),
            Some(Overlay::Readings { scroll }) => self.readings_key(action, scroll),
            Some(Overlay::ResetRatio) => self.reset_ratio_key(action),
            Some(Overlay::Picker(p)) => self.picker_key(action, p),
            Some(Overlay::Form(f)) => return self.form_key(action, f),
            Some(Overlay::Prompt(p)) => return self.prompt_key(action, p),
            Some(Overlay::Question(q)) => return self.question_key(action, &q),
            None => return self.main_key(action),
        }
        None
    }

    fn set_status(&mut self, text: String, kind: StatusKind) {
        self.ui.status = Some(Status { text, kind });
    }

    /// Say what happened.
    pub(crate) fn info(&mut self, text: impl Into<String>) {
        self.set_status(text.into(), StatusKind::Info);
    }

    /// Say that an edit was not made, and why.
    pub(crate) fn refuse(&mut self, text: impl Into<String>) {
        self.set_status(format!("refused: {}", text.into()), StatusKind::Refused);
    }

    /// Say that something failed.
    pub fn error(&mut self, text: impl Into<String>) {
        self.set_status(text.into(), StatusKind::Error);
    }

    /// Apply an edit to a copy of the build; keep it only if the engine finds it valid.
    pub fn edit<T>(
        &mut self,
        label: impl Into<String>,
        f: impl FnOnce(&mut Build) -> Result<T, Refusal>,
    ) -> Option<T> {
        let label = label.into();
        let mut next = self.doc.build.clone();
        let v = match f(&mut next) {
            Ok(v) => v,
            Err(msg) => {
                self.refuse(msg);
                return None;
            }
        };
        if let Some(p) = validate(&next).first() {
            self.refuse(p.to_string());
            return None;
        }
        if next == self.doc.build {
            self.info("no change");
            return Some(v);
        }
        self.doc.commit(next, label.clone());
        self.clamp();
        self.info(label);
        Some(v)
    }

    /// An edit of the stack that gives the section to select after it.
    pub(crate) fn edit_stack(
        &mut self,
        label: impl Into<String>,
        f: impl FnOnce(&mut Build) -> Result<usize, Refusal>,
    ) {
        if let Some(sel) = self.edit(label, f) {
            self.ui.stack_sel = sel;
        }
    }

    /// After an undo or redo: the selections stay in range and the status says what.
    pub(crate) fn undone(&mut self, text: String) {
        self.clamp();
        self.info(text);
    }

    fn clamp(&mut self) {
        let b = &self.doc.build;
        self.ui.stack_sel = self.ui.stack_sel.min(b.stack.len().saturating_sub(1));
        self.ui.winding_sel = self.ui.winding_sel.min(b.windings.len().saturating_sub(1));
    }

    /// The loop saved the build to `path`.
    pub fn saved_to(&mut self, path: PathBuf) {
        self.info(format!("saved {}", path.display()));
        self.doc.saved_to(path);
    }

    /// The loop opened `build` from `path`: a new document with a fresh history.
    pub fn opened(&mut self, build: Build, path: PathBuf) {
        let theme = self.ui.theme;
        let library = std::mem::take(&mut self.library);
        *self = App::new(build, Some(path.clone()));
        self.ui.theme = theme;
        self.library = library;
        self.info(format!("opened {}", path.display()));
    }

    /// A section as the status line names it: "#3 P+R", "#2 tape".
    pub(crate) fn section_name(&self, i: usize) -> String {
        match self.doc.build.stack.get(i) {
            Some(Section::Winding(ws)) => match &ws.partner {
                Some(w) => format!("#{} {}+{w}", i + 1, ws.winding),
                None => format!("#{} {}", i + 1, ws.winding),
            },
            Some(Section::Tape { .. }) => format!("#{} tape", i + 1),
            None => String::new(),
        }
    }

    /// The selected winding's name.
    pub(crate) fn winding_name(&self) -> String {
        self.doc
            .build
            .windings
            .get(self.ui.winding_sel)
            .map(|w| w.name.to_string())
            .unwrap_or_default()
    }

    /// Ask for the file to save to, starting from the document's.
    pub(crate) fn ask_save_path(&mut self, then_quit: bool) {
        let suggestion = match &self.doc.path {
            Some(p) => p.display().to_string(),
            None => "my-build.toml".into(),
        };
        self.prompt(
            "save the build as",
            suggestion,
            PromptPurpose::SavePath { then_quit },
        );
    }
}

/// The first readable bobbin of the library, for a build that has none yet.
fn first_bobbin(library: &[BobbinEntry]) -> (String, crate::model::Bobbin) {
    library
        .iter()
        .filter(|e| !matches!(e.origin, crate::files::BobbinOrigin::BesideBuild(_)))
        .find_map(|e| e.bobbin.as_ref().ok().map(|b| (e.id.clone(), b.clone())))
        .unwrap_or_else(|| {
            // The bundled library is compiled in; reaching this means it is empty.
            let id = "e25-13-7".to_string();
            let b = BobbinLibrary::bundled_only()
                .find(&id)
                .and_then(Result::ok)
                .expect("the bundled bobbin library holds e25-13-7");
            (id, b)
        })
}
