//! The document the planner edits: the Build, its Evaluation, the file it belongs to, the
//! state last saved, the undo history of Build snapshots and the figures to compare with.
//! Nothing here knows about keys, overlays or the terminal.

use crate::engine::{Evaluation, evaluate};
use crate::model::Build;
use std::path::PathBuf;

/// One step of the undo history: the build before an edit and what the edit was.
#[derive(Debug, Clone)]
pub struct UndoStep {
    /// The whole build as it was before the edit.
    pub build: Build,
    /// What the edit was, as the status line said it.
    pub label: String,
    /// The file the build belonged to, for an edit that left it (a design opened as a new
    /// build): undoing goes back to that file too. `None` for an edit of the same document.
    pub file: Option<FileState>,
}

/// The document's file and the build as last saved there.
#[derive(Debug, Clone, PartialEq)]
pub struct FileState {
    /// The file, or none.
    pub path: Option<PathBuf>,
    /// The build as last opened or saved; `None` for one never saved.
    pub saved: Option<Build>,
}

/// The build being edited and everything that belongs to it rather than to the screen.
pub struct Document {
    /// The build as it stands.
    pub build: Build,
    /// The engine's figures of `build`, recomputed after every change.
    pub eval: Evaluation,
    /// The file the build was opened from or saved to; `None` for the demo.
    pub path: Option<PathBuf>,
    /// The build as last opened or saved; `None` for one never saved.
    pub saved: Option<Build>,
    /// Edits to undo, the latest last.
    pub undo: Vec<UndoStep>,
    /// Undone edits to redo, the latest undone last.
    pub redo: Vec<UndoStep>,
    /// The figures before the last edit (or undo/redo), and what it was.
    pub before: Option<(Evaluation, String)>,
    /// Figures pinned by the user as the reference; wins over `before` while set.
    pub pinned: Option<Evaluation>,
}

impl Document {
    /// A document on `build`, counted as saved (it came from `path`, or is the demo).
    pub fn new(build: Build, path: Option<PathBuf>) -> Self {
        Document {
            eval: evaluate(&build),
            saved: Some(build.clone()),
            build,
            path,
            undo: Vec::new(),
            redo: Vec::new(),
            before: None,
            pinned: None,
        }
    }

    /// True when the build differs from the one last opened or saved.
    pub fn dirty(&self) -> bool {
        self.saved.as_ref() != Some(&self.build)
    }

    /// The file's name for the header, or what the build is when it has none.
    pub fn file_label(&self) -> String {
        match &self.path {
            Some(p) => p.display().to_string(),
            None => "demo, no file yet".into(),
        }
    }

    /// The figures to compare the current ones with, and a word for what they are.
    pub fn reference(&self) -> Option<(&Evaluation, String)> {
        if let Some(p) = &self.pinned {
            return Some((p, "pinned".into()));
        }
        self.before
            .as_ref()
            .map(|(e, l)| (e, format!("before {l}")))
    }

    /// Take `next` as the build (already validated), remembering the old one for undo.
    pub fn commit(&mut self, next: Build, label: String) {
        let old = std::mem::replace(&mut self.build, next);
        self.undo.push(UndoStep {
            build: old,
            label: label.clone(),
            file: None,
        });
        self.redo.clear();
        self.recompute(label);
    }

    /// Take `next` as a build of its own, not of the document's file: one undo step that
    /// also leaves the file. A file already written is let go (the path is unset, so saving
    /// asks where); a file not yet written keeps its path. Undo returns to the old build
    /// and its file.
    pub fn commit_apart(&mut self, next: Build, label: String) {
        let file = FileState {
            path: self.path.clone(),
            saved: self.saved.take(),
        };
        if file.saved.is_some() {
            self.path = None;
        }
        self.commit(next, label);
        if let Some(step) = self.undo.last_mut() {
            step.file = Some(file);
        }
    }

    /// Put back the file of a step that left it; what it replaces goes to the other step.
    fn swap_file(&mut self, file: Option<FileState>) -> Option<FileState> {
        let f = file?;
        Some(FileState {
            path: std::mem::replace(&mut self.path, f.path),
            saved: std::mem::replace(&mut self.saved, f.saved),
        })
    }

    /// Go back one edit; the label of the edit undone, `None` when there is none.
    pub fn undo(&mut self) -> Option<String> {
        let step = self.undo.pop()?;
        let current = std::mem::replace(&mut self.build, step.build);
        let file = self.swap_file(step.file);
        self.redo.push(UndoStep {
            build: current,
            label: step.label.clone(),
            file,
        });
        self.recompute(format!("undo of {}", step.label));
        Some(step.label)
    }

    /// Do again the edit last undone; its label, `None` when there is none.
    pub fn redo(&mut self) -> Option<String> {
        let step = self.redo.pop()?;
        let current = std::mem::replace(&mut self.build, step.build);
        let file = self.swap_file(step.file);
        self.undo.push(UndoStep {
            build: current,
            label: step.label.clone(),
            file,
        });
        self.recompute(format!("redo of {}", step.label));
        Some(step.label)
    }

    /// The build was written to `path`: it is the document's file and counts as saved.
    pub fn saved_to(&mut self, path: PathBuf) {
        self.path = Some(path);
        self.saved = Some(self.build.clone());
    }

    /// The pinned figures go; or the current ones are pinned. True when now pinned.
    pub fn toggle_pin(&mut self) -> bool {
        if self.pinned.take().is_some() {
            return false;
        }
        self.pinned = Some(self.eval.clone());
        true
    }

    fn recompute(&mut self, label: String) {
        let new = evaluate(&self.build);
        let old = std::mem::replace(&mut self.eval, new);
        self.before = Some((old, label));
    }
}
