//! The planner's state: the Build being edited, its Evaluation, the selection, the pop-ups,
//! the undo history and the file it belongs to. `update` turns an Action into a change; file
//! I/O is returned as an `Effect` for the loop to carry out.

use super::action::Action;
pub use super::core_form::{CoreDraft, LegShape};
use super::edit::{self, Refusal};
use super::keymap::{self, Context};
use super::theme::Theme;
use crate::engine::search::Candidate;
use crate::engine::{Evaluation, evaluate, validate};
use crate::files::BobbinLibrary;
use crate::library::wires::catalogue;
use crate::model::{BobbinSource, Build, Section, Tube, WireSize, trim_mm};
use ratatui::crossterm::event::KeyEvent;
use std::path::PathBuf;

/// Which list on the main screen has the keys.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Focus {
    Stack,
    Windings,
}

#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum StatusKind {
    Info,
    Refused,
    Error,
}

#[derive(Debug, Clone, PartialEq)]
pub struct Status {
    pub text: String,
    pub kind: StatusKind,
}

/// What the loop must do outside the state: file I/O, or stop.
#[derive(Debug, Clone, PartialEq)]
pub enum Effect {
    Save(PathBuf),
    SaveThenQuit(PathBuf),
    Open(PathBuf),
    /// Write the winding sheet of the current build (HTML when the name ends in .html).
    WriteSheet(PathBuf),
    /// Write a bobbin file into the user's bobbin folder.
    SaveBobbin {
        path: PathBuf,
        text: String,
    },
    /// Run the search on the current build (the loop draws "searching..." first).
    Search,
    Quit,
    /// A write the user agreed may replace the file there: carried out without asking.
    Confirmed(Box<Effect>),
}

impl Effect {
    /// The file this effect would write and whether an existing one there must be asked
    /// about first: a save to the document's own file is not, any other write is.
    pub fn replaces(&self, own: Option<&std::path::Path>) -> Option<&std::path::Path> {
        match self {
            Effect::Save(p) | Effect::SaveThenQuit(p) => (own != Some(p.as_path())).then_some(p),
            Effect::WriteSheet(p) => Some(p),
            Effect::SaveBobbin { path, .. } => Some(path),
            _ => None,
        }
    }
}

#[derive(Debug, Clone, PartialEq)]
pub enum PickValue {
    Wire(WireSize),
    MeasuredWire,
    /// A bobbin of the library the list was made from (bundled, the user's, or beside the
    /// build), carried whole so choosing it needs no second lookup.
    Bobbin {
        id: String,
        bobbin: Box<crate::model::Bobbin>,
    },
    MeasuredBobbin,
    Section(usize),
    Partner(Option<String>),
    AddTape,
    AddShare(String),
    /// Index into `App::found`.
    Candidate(usize),
    /// A bundled ferrite grade, or `None` for the user's own figures.
    Grade(Option<String>),
}

#[derive(Debug, Clone, Copy, PartialEq)]
pub enum PickPurpose {
    Wire(usize),
    Bobbin,
    NewBuild,
    SplitAround(usize),
    Partner(usize),
    AddSection(usize),
    Search,
    Grade,
}

#[derive(Debug, Clone, PartialEq)]
pub struct PickItem {
    pub label: String,
    pub value: PickValue,
}

#[derive(Debug, Clone, PartialEq)]
pub struct Picker {
    pub title: String,
    pub header: String,
    pub purpose: PickPurpose,
    pub items: Vec<PickItem>,
    /// Index into `visible()`.
    pub selected: usize,
    pub filter: String,
}

impl PickValue {
    /// The id of a bobbin item, `None` for any other item.
    pub fn bobbin_id(&self) -> Option<&str> {
        match self {
            PickValue::Bobbin { id, .. } => Some(id),
            _ => None,
        }
    }
}

impl Picker {
    /// Items that match the typed filter (case-insensitive, anywhere in the label).
    pub fn visible(&self) -> Vec<&PickItem> {
        let f = self.filter.to_lowercase();
        self.items
            .iter()
            .filter(|it| f.is_empty() || it.label.to_lowercase().contains(&f))
            .collect()
    }
}

#[derive(Debug, Clone, Copy, PartialEq)]
pub enum FormKind {
    Setup,
    Winding(usize),
    Bobbin,
    Operating,
    Material,
    Isolation,
}

#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Field {
    Title,
    Temperature,
    Allowance,
    Margin,
    TapeMm,
    Frequency,
    WName(usize),
    WRole(usize),
    WTurns(usize),
    WWire(usize),
    WGrade(usize),
    WStrands(usize),
    WCurrent(usize),
    WPins(usize),
    BName,
    BWidth,
    BHeight,
    BShape,
    BTubeWidth,
    BTubeDepth,
    BTubeRadius,
    BTubeDiameter,
    // `[operating]`; `OpAdd` is the only row while the build has none.
    OpAdd,
    OpResetSide,
    OpVinMin,
    OpVinMax,
    OpVout,
    OpIout,
    OpDrop,
    OpDuty,
    OpRise,
    OpSurface,
    OpResetTurns,
    OpRemove,
    // `[material]`.
    MatAdd,
    MatGrade,
    MatBsat,
    MatBr,
    MatMuI,
    MatSteinmetz,
    MatGap,
    MatRemove,
    // `[isolation]`.
    IsoAdd,
    IsoClass,
    IsoVolts,
    IsoCreepage,
    IsoRemove,
    // The measured bobbin's core: calliper readings and a test winding, kept in
    // `App::core_draft` until applied.
    CLegShape,
    CLegWidth,
    CLegDepth,
    CLegDiameter,
    CLe,
    CTestTurns,
    CTestUh,
    CMuI,
    CApply,
    CSave,
}

impl Field {
    /// The form a field belongs to.
    pub fn form(self) -> FormKind {
        use Field as F;
        match self {
            F::Title | F::Temperature | F::Allowance | F::Margin | F::TapeMm | F::Frequency => {
                FormKind::Setup
            }
            F::WName(k)
            | F::WRole(k)
            | F::WTurns(k)
            | F::WWire(k)
            | F::WGrade(k)
            | F::WStrands(k)
            | F::WCurrent(k)
            | F::WPins(k) => FormKind::Winding(k),
            F::OpAdd
            | F::OpResetSide
            | F::OpVinMin
            | F::OpVinMax
            | F::OpVout
            | F::OpIout
            | F::OpDrop
            | F::OpDuty
            | F::OpRise
            | F::OpSurface
            | F::OpResetTurns
            | F::OpRemove => FormKind::Operating,
            F::MatAdd
            | F::MatGrade
            | F::MatBsat
            | F::MatBr
            | F::MatMuI
            | F::MatSteinmetz
            | F::MatGap
            | F::MatRemove => FormKind::Material,
            F::IsoAdd | F::IsoClass | F::IsoVolts | F::IsoCreepage | F::IsoRemove => {
                FormKind::Isolation
            }
            _ => FormKind::Bobbin,
        }
    }
}

#[derive(Debug, Clone, PartialEq)]
pub struct Form {
    pub kind: FormKind,
    pub selected: usize,
}

#[derive(Debug, Clone, PartialEq)]
pub enum PromptPurpose {
    SectionTurns(usize),
    Wraps(usize),
    Field(Field),
    MeasuredWire(usize),
    SavePath { then_quit: bool },
    OpenPath,
    SheetPath,
    BobbinId,
}

#[derive(Debug, Clone, PartialEq)]
pub struct Prompt {
    pub label: String,
    pub hint: String,
    pub text: String,
    pub purpose: PromptPurpose,
}

#[derive(Debug, Clone, PartialEq)]
pub enum Question {
    Quit,
    DiscardForOpen,
    DiscardForNew,
    /// The file a write would go to exists: replace it (the write is carried out) or cancel.
    Overwrite(Box<Effect>),
}

#[derive(Debug, Clone, PartialEq)]
pub enum Overlay {
    Help { scroll: u16 },
    Picker(Picker),
    Form(Form),
    Prompt(Prompt),
    Question(Question),
}

/// One step of the undo history: the build before an edit and what the edit was.
#[derive(Debug, Clone)]
pub struct Step {
    pub build: Build,
    pub label: String,
}

pub struct App {
    pub build: Build,
    pub eval: Evaluation,
    pub path: Option<PathBuf>,
    /// The build as last opened or saved; `None` for one never saved.
    pub saved: Option<Build>,
    pub undo: Vec<Step>,
    pub redo: Vec<Step>,
    pub focus: Focus,
    /// Index into `build.stack` (file order, tube first).
    pub stack_sel: usize,
    pub winding_sel: usize,
    pub overlays: Vec<Overlay>,
    pub status: Option<Status>,
    /// The figures before the last edit (or undo/redo), and what it was.
    pub before: Option<(Evaluation, String)>,
    /// Figures pinned by the user as the reference; wins over `before` while set.
    pub pinned: Option<Evaluation>,
    pub theme: Theme,
    /// The measured core being typed in the measured-bobbin form, not yet applied.
    pub core_draft: CoreDraft,
    /// The candidates of the last search, for its pick list.
    pub found: Vec<Candidate>,
    /// Where bobbins are saved: the user's bobbin folder (tests point it elsewhere).
    pub bobbin_dir: Option<PathBuf>,
}

fn parse_f64(s: &str) -> Option<f64> {
    let v: f64 = s.trim().parse().ok()?;
    v.is_finite().then_some(v)
}

fn parse_u32(s: &str) -> Option<u32> {
    s.trim().parse().ok()
}

impl App {
    pub fn new(build: Build, path: Option<PathBuf>) -> Self {
        let eval = evaluate(&build);
        App {
            saved: Some(build.clone()),
            build,
            eval,
            path,
            undo: Vec::new(),
            redo: Vec::new(),
            focus: Focus::Stack,
            stack_sel: 0,
            winding_sel: 0,
            overlays: Vec::new(),
            status: None,
            before: None,
            pinned: None,
            theme: Theme::from_env(),
            core_draft: CoreDraft::default(),
            found: Vec::new(),
            bobbin_dir: crate::files::user_bobbin_dir(),
        }
    }

    /// A build for a file that does not exist yet: the bobbin is picked first.
    pub fn new_file(path: PathBuf) -> Self {
        let (id, bobbin) = first_bobbin();
        let mut app = App::new(edit::new_build(&id, bobbin), Some(path));
        app.saved = None;
        app.open_bobbin_picker(PickPurpose::NewBuild);
        app.info("a new build: pick its bobbin (Esc keeps the one shown)");
        app
    }

    pub fn dirty(&self) -> bool {
        self.saved.as_ref() != Some(&self.build)
    }

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

    pub fn contexts(&self) -> Vec<Context> {
        match self.overlays.last() {
            Some(Overlay::Help { .. }) => vec![Context::HelpScreen],
            Some(Overlay::Picker(_) | Overlay::Form(_)) => vec![Context::List],
            Some(Overlay::Prompt(_)) => vec![Context::Prompt],
            Some(Overlay::Question(_)) => vec![Context::Question],
            None => match self.focus {
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

    pub(super) fn info(&mut self, text: impl Into<String>) {
        self.status = Some(Status {
            text: text.into(),
            kind: StatusKind::Info,
        });
    }

    pub(super) fn refuse(&mut self, text: impl Into<String>) {
        self.status = Some(Status {
            text: format!("refused: {}", text.into()),
            kind: StatusKind::Refused,
        });
    }

    pub fn error(&mut self, text: impl Into<String>) {
        self.status = Some(Status {
            text: text.into(),
            kind: StatusKind::Error,
        });
    }

    /// Apply an edit to a copy of the build; keep it only if the engine finds it valid.
    pub fn edit<T>(
        &mut self,
        label: impl Into<String>,
        f: impl FnOnce(&mut Build) -> Result<T, Refusal>,
    ) -> Option<T> {
        let label = label.into();
        let mut next = self.build.clone();
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
        if next == self.build {
            self.info("no change");
            return Some(v);
        }
        let old = std::mem::replace(&mut self.build, next);
        self.undo.push(Step {
            build: old,
            label: label.clone(),
        });
        self.redo.clear();
        self.recompute(label.clone());
        self.info(label);
        Some(v)
    }

    fn recompute(&mut self, label: String) {
        let new = evaluate(&self.build);
        let old = std::mem::replace(&mut self.eval, new);
        self.before = Some((old, label));
        self.clamp();
    }

    fn clamp(&mut self) {
        self.stack_sel = self.stack_sel.min(self.build.stack.len().saturating_sub(1));
        self.winding_sel = self
            .winding_sel
            .min(self.build.windings.len().saturating_sub(1));
    }

    fn undo(&mut self) {
        let Some(step) = self.undo.pop() else {
            self.info("nothing to undo");
            return;
        };
        let current = std::mem::replace(&mut self.build, step.build);
        self.redo.push(Step {
            build: current,
            label: step.label.clone(),
        });
        self.recompute(format!("undo of {}", step.label));
        self.info(format!("undid: {}", step.label));
    }

    fn redo(&mut self) {
        let Some(step) = self.redo.pop() else {
            self.info("nothing to redo");
            return;
        };
        let current = std::mem::replace(&mut self.build, step.build);
        self.undo.push(Step {
            build: current,
            label: step.label.clone(),
        });
        self.recompute(format!("redo of {}", step.label));
        self.info(format!("redid: {}", step.label));
    }

    /// The loop saved the build to `path`.
    pub fn saved_to(&mut self, path: PathBuf) {
        self.info(format!("saved {}", path.display()));
        self.path = Some(path);
        self.saved = Some(self.build.clone());
    }

    /// The loop opened `build` from `path`: a new document with a fresh history.
    pub fn opened(&mut self, build: Build, path: PathBuf) {
        let theme = self.theme;
        *self = App::new(build, Some(path.clone()));
        self.theme = theme;
        self.info(format!("opened {}", path.display()));
    }

    fn section_name(&self, i: usize) -> String {
        match self.build.stack.get(i) {
            Some(Section::Winding(ws)) => match &ws.with {
                Some(w) => format!("#{} {}+{w}", i + 1, ws.winding),
                None => format!("#{} {}", i + 1, ws.winding),
            },
            Some(Section::Tape { .. }) => format!("#{} tape", i + 1),
            None => String::new(),
        }
    }

    fn winding_name(&self) -> String {
        self.build
            .windings
            .get(self.winding_sel)
            .map(|w| w.name.to_string())
            .unwrap_or_default()
    }

    pub(super) fn prompt(
        &mut self,
        label: impl Into<String>,
        text: impl Into<String>,
        purpose: PromptPurpose,
    ) {
        let hint = match purpose {
            PromptPurpose::MeasuredWire(_) => "bare and overall diameter in mm, e.g. 0.40 0.452",
            PromptPurpose::Field(Field::WPins(_)) => "start and finish pin, e.g. 1 2 (empty: none)",
            PromptPurpose::Field(Field::WCurrent(_) | Field::Frequency) => "a number; empty: none",
            PromptPurpose::SavePath { .. } | PromptPurpose::OpenPath => "a file path",
            PromptPurpose::SheetPath => {
                "a file path; a name ending in .html gives a printable page"
            }
            PromptPurpose::BobbinId => {
                "letters, digits, - _ . (the file name in your bobbin folder)"
            }
            PromptPurpose::Field(f) => super::forms::hint(f),
            _ => "",
        };
        self.overlays.push(Overlay::Prompt(Prompt {
            label: label.into(),
            hint: hint.into(),
            text: text.into(),
            purpose,
        }));
    }

    pub fn update(&mut self, action: Action) -> Option<Effect> {
        self.status = None;
        match self.overlays.last().cloned() {
            Some(Overlay::Help { scroll }) => {
                self.help_key(action, scroll);
                None
            }
            Some(Overlay::Picker(p)) => self.picker_key(action, p),
            Some(Overlay::Form(f)) => {
                self.form_key(action, f);
                None
            }
            Some(Overlay::Prompt(p)) => self.prompt_key(action, p),
            Some(Overlay::Question(q)) => self.question_key(action, &q),
            None => self.main_key(action),
        }
    }

    fn help_key(&mut self, action: Action, scroll: u16) {
        let top = self.overlays.len() - 1;
        match action {
            Action::Down => self.overlays[top] = Overlay::Help { scroll: scroll + 1 },
            Action::Up => {
                self.overlays[top] = Overlay::Help {
                    scroll: scroll.saturating_sub(1),
                }
            }
            _ => {
                self.overlays.pop();
            }
        }
    }

    fn main_key(&mut self, action: Action) -> Option<Effect> {
        let i = self.stack_sel;
        let k = self.winding_sel;
        match action {
            Action::Quit => {
                if self.dirty() {
                    self.overlays.push(Overlay::Question(Question::Quit));
                } else {
                    return Some(Effect::Quit);
                }
            }
            Action::Help => self.overlays.push(Overlay::Help { scroll: 0 }),
            Action::SwitchPanel => {
                self.focus = match self.focus {
                    Focus::Stack => Focus::Windings,
                    Focus::Windings => Focus::Stack,
                }
            }
            // The stack list shows the outermost section on top, like the drawing.
            Action::Up => match self.focus {
                Focus::Stack => {
                    self.stack_sel = (i + 1).min(self.build.stack.len().saturating_sub(1))
                }
                Focus::Windings => self.winding_sel = k.saturating_sub(1),
            },
            Action::Down => match self.focus {
                Focus::Stack => self.stack_sel = i.saturating_sub(1),
                Focus::Windings => {
                    self.winding_sel = (k + 1).min(self.build.windings.len().saturating_sub(1))
                }
            },
            Action::Undo => self.undo(),
            Action::Redo => self.redo(),
            Action::Pin => {
                if self.pinned.take().is_some() {
                    self.info("unpinned: comparing with the figures before the last edit");
                } else {
                    self.pinned = Some(self.eval.clone());
                    self.info("pinned these figures: the check panel now compares against them");
                }
            }
            Action::Save => match self.path.clone() {
                Some(p) => return Some(Effect::Save(p)),
                None => self.ask_save_path(false),
            },
            Action::SaveAs => self.ask_save_path(false),
            Action::Open => {
                if self.dirty() {
                    self.overlays
                        .push(Overlay::Question(Question::DiscardForOpen));
                } else {
                    self.prompt("open build file", "", PromptPurpose::OpenPath);
                }
            }
            Action::NewBuild => {
                if self.dirty() {
                    self.overlays
                        .push(Overlay::Question(Question::DiscardForNew));
                } else {
                    self.open_bobbin_picker(PickPurpose::NewBuild);
                }
            }
            Action::Bobbin => self.open_bobbin_picker(PickPurpose::Bobbin),
            Action::Setup => self.open_form(FormKind::Setup),
            Action::Operating => self.open_form(FormKind::Operating),
            Action::Material => self.open_form(FormKind::Material),
            Action::Isolation => self.open_form(FormKind::Isolation),
            Action::Search => {
                self.info("searching... (wires, strands and section orders on this bobbin)");
                return Some(Effect::Search);
            }
            Action::Sheet => {
                let suggestion = match &self.path {
                    Some(p) => p.with_extension("sheet.txt").display().to_string(),
                    None => "winding-sheet.txt".into(),
                };
                self.prompt(
                    "write the winding sheet to",
                    suggestion,
                    PromptPurpose::SheetPath,
                );
            }
            Action::EditSection => match self.build.stack.get(i) {
                Some(Section::Winding(_)) => {
                    let t = self.build.section_turns()[i];
                    let name = self.section_name(i);
                    self.prompt(
                        format!("turns of section {name}"),
                        t.to_string(),
                        PromptPurpose::SectionTurns(i),
                    );
                }
                Some(Section::Tape { wraps }) => {
                    let w = *wraps;
                    self.prompt(
                        format!("wraps of tape in section #{}", i + 1),
                        w.to_string(),
                        PromptPurpose::Wraps(i),
                    );
                }
                None => {}
            },
            Action::AddSection => self.open_add_picker(),
            Action::DeleteSection => {
                let name = self.section_name(i);
                if let Some(sel) =
                    self.edit(format!("delete {name}"), |b| edit::delete_section(b, i))
                {
                    self.stack_sel = sel;
                }
            }
            Action::MoveOut | Action::MoveIn => {
                let out = action == Action::MoveOut;
                let name = self.section_name(i);
                let word = if out { "outward" } else { "inward" };
                if let Some(sel) = self.edit(format!("move {name} {word}"), |b| {
                    edit::move_section(b, i, out)
                }) {
                    self.stack_sel = sel;
                }
            }
            Action::Split => self.open_split_picker(),
            Action::Partner => self.open_partner_picker(),
            Action::More | Action::Less => {
                let up = action == Action::More;
                match self.focus {
                    Focus::Stack => {
                        let now = edit::wraps_of(&self.build, i);
                        let n = if up { now + 1 } else { now.saturating_sub(1) };
                        let what = match self.build.stack.get(i) {
                            Some(Section::Tape { .. }) => "tape wraps",
                            _ => "tape between layers",
                        };
                        let name = self.section_name(i);
                        self.edit(format!("{what} of {name}: {n}"), |b| {
                            if !up && now == 0 {
                                return Err("there is no tape between its layers".into());
                            }
                            edit::set_wraps(b, i, n)
                        });
                    }
                    Focus::Windings => {
                        let now = self.build.windings.get(k).map(|w| w.strands)?;
                        let n = if up { now + 1 } else { now.saturating_sub(1) };
                        let name = self.winding_name();
                        self.edit(format!("strands of {name}: {n}"), |b| {
                            if n == 0 {
                                return Err("a winding needs at least one strand".into());
                            }
                            b.windings[k].strands = n;
                            Ok(())
                        });
                    }
                }
            }
            Action::EditWinding if k < self.build.windings.len() => {
                self.overlays.push(Overlay::Form(Form {
                    kind: FormKind::Winding(k),
                    selected: 0,
                }));
            }
            Action::WindingTurns => self.activate(Field::WTurns(k)),
            Action::Rename => self.activate(Field::WName(k)),
            Action::Role => self.activate(Field::WRole(k)),
            Action::Wire => self.activate(Field::WWire(k)),
            Action::Grade => self.activate(Field::WGrade(k)),
            Action::Current => self.activate(Field::WCurrent(k)),
            Action::Pins => self.activate(Field::WPins(k)),
            Action::AddWinding => {
                if let Some(k) = self.edit("add a winding", edit::add_winding) {
                    self.winding_sel = k;
                }
            }
            Action::DeleteWinding => {
                let name = self.winding_name();
                if let Some(k) = self.edit(format!("delete winding {name}"), |b| {
                    edit::delete_winding(b, k)
                }) {
                    self.winding_sel = k;
                }
            }
            _ => {}
        }
        None
    }

    fn open_form(&mut self, kind: FormKind) {
        self.overlays
            .push(Overlay::Form(Form { kind, selected: 0 }));
    }

    fn ask_save_path(&mut self, then_quit: bool) {
        let suggestion = match &self.path {
            Some(p) => p.display().to_string(),
            None => "my-build.toml".into(),
        };
        self.prompt(
            "save the build as",
            suggestion,
            PromptPurpose::SavePath { then_quit },
        );
    }

    fn open_bobbin_picker(&mut self, purpose: PickPurpose) {
        let lib = match &self.path {
            Some(p) => BobbinLibrary::for_build(p),
            None => BobbinLibrary::standard(),
        };
        if purpose == PickPurpose::Bobbin {
            self.open_ranked_bobbin_picker(&lib);
            return;
        }
        let mut items: Vec<PickItem> = lib
            .entries()
            .into_iter()
            .filter_map(|e| {
                let b = e.bobbin.ok()?;
                Some(PickItem {
                    label: format!(
                        "{:<10} {:>5.2} x {:<5.2} {:<9} {}",
                        e.id,
                        b.window.width_mm,
                        b.window.height_mm,
                        e.origin.label(),
                        b.name
                    ),
                    value: PickValue::Bobbin {
                        id: e.id,
                        bobbin: Box::new(b),
                    },
                })
            })
            .collect();
        if purpose == PickPurpose::Bobbin {
            items.push(PickItem {
                label: "measured: type your own bobbin's figures".into(),
                value: PickValue::MeasuredBobbin,
            });
        }
        let selected = match &self.build.bobbin_source {
            BobbinSource::Id(id) => items
                .iter()
                .position(|it| it.value.bobbin_id() == Some(id.as_str()))
                .unwrap_or(0),
            BobbinSource::Inline => items.len().saturating_sub(1),
        };
        let title = if purpose == PickPurpose::NewBuild {
            "start a new build on which bobbin?"
        } else {
            "bobbin"
        };
        self.overlays.push(Overlay::Picker(Picker {
            title: title.into(),
            header: format!(
                "{:<10} {:>5} x {:<5} {:<9} name",
                "id", "width", "height", "from"
            ),
            purpose,
            items,
            selected,
            filter: String::new(),
        }));
    }

    /// The library ranked by how this build's windings and stack fit each bobbin
    /// (`report::fit::rank`), the current bobbin marked, a measured one last.
    fn open_ranked_bobbin_picker(&mut self, lib: &BobbinLibrary) {
        let bobbins: Vec<(String, crate::model::Bobbin)> = lib
            .entries()
            .into_iter()
            .filter_map(|e| e.bobbin.ok().map(|b| (e.id, b)))
            .collect();
        let current = match &self.build.bobbin_source {
            BobbinSource::Id(id) => Some(id.clone()),
            BobbinSource::Inline => None,
        };
        let mut items: Vec<PickItem> = crate::report::fit::rank(&self.build, &bobbins)
            .into_iter()
            .filter_map(|r| {
                let bobbin = bobbins.iter().find(|(id, _)| *id == r.bobbin)?.1.clone();
                let mark = if current.as_deref() == Some(r.bobbin.as_str()) {
                    '*'
                } else {
                    ' '
                };
                let (fits, spare) = match (r.fits, r.valid) {
                    (true, _) => ("yes", format!("{:>6.2}", r.spare_height_mm)),
                    (false, true) => ("no", format!("{:>6.2}", r.spare_height_mm)),
                    (false, false) => ("no", format!("{:>6}", "-")),
                };
                let why = r.reasons.first().cloned().unwrap_or(r.name);
                Some(PickItem {
                    label: format!(
                        "{mark}{:<10} {fits:<4} {spare} {:>5.2}  {why}",
                        r.bobbin, r.fill_factor
                    ),
                    value: PickValue::Bobbin {
                        id: r.bobbin,
                        bobbin: Box::new(bobbin),
                    },
                })
            })
            .collect();
        items.push(PickItem {
            label: " measured: type your own bobbin's figures".into(),
            value: PickValue::MeasuredBobbin,
        });
        let selected = match &current {
            Some(id) => items
                .iter()
                .position(|it| it.value.bobbin_id() == Some(id.as_str()))
                .unwrap_or(0),
            None => items.len() - 1,
        };
        self.overlays.push(Overlay::Picker(Picker {
            title: "bobbin: fitting first, most spare first (* now)".into(),
            header: format!(
                " {:<10} {:<4} {:>6} {:>5}  why not, or name",
                "id", "fits", "spare", "fill"
            ),
            purpose: PickPurpose::Bobbin,
            items,
            selected,
            filter: String::new(),
        }));
    }

    fn open_wire_picker(&mut self, k: usize) {
        let Some(w) = self.build.windings.get(k) else {
            return;
        };
        let current = w.wire;
        let mut items: Vec<PickItem> = catalogue()
            .into_iter()
            .map(|r| PickItem {
                label: format!(
                    "{:<8} {:>6.3}  {:>6.3} {:>6.3} {:>6.3} {:>6.3}  {:>8.4}",
                    r.size.key().unwrap_or_default(),
                    r.bare_mm,
                    r.od_mm[0],
                    r.od_mm[1],
                    r.od_mm[2],
                    r.od_mm[3],
                    crate::engine::resistance::ohm_per_m(r.bare_mm, 1, 20.0)
                ),
                value: PickValue::Wire(r.size),
            })
            .collect();
        items.push(PickItem {
            label: "measured: type the bare and overall diameters".into(),
            value: PickValue::MeasuredWire,
        });
        let selected = items
            .iter()
            .position(|it| it.value == PickValue::Wire(current))
            .unwrap_or(items.len() - 1);
        self.overlays.push(Overlay::Picker(Picker {
            title: format!("wire for {} (now {}; type to filter)", w.name, w.wire),
            header: format!(
                "{:<8} {:>6}  {:>6} {:>6} {:>6} {:>6}  {:>8}",
                "wire", "bare", "od g1", "od g2", "od g3", "od TIW", "ohm/m 20C"
            ),
            purpose: PickPurpose::Wire(k),
            items,
            selected,
            filter: String::new(),
        }));
    }

    fn open_split_picker(&mut self) {
        let x = self.stack_sel;
        let Some(Section::Winding(me)) = self.build.stack.get(x).cloned() else {
            self.refuse("select a winding section to split");
            return;
        };
        let turns = self.build.section_turns();
        let mut cands: Vec<usize> = (0..self.build.stack.len())
            .filter(|&j| match &self.build.stack[j] {
                Section::Winding(o) => {
                    o.winding != me.winding && Some(&o.winding) != me.with.as_ref()
                }
                _ => false,
            })
            .collect();
        if cands.is_empty() {
            self.refuse("there is no section of another winding to split around");
            return;
        }
        cands.sort_by_key(|&j| (j.abs_diff(x), j));
        let items = cands
            .iter()
            .map(|&j| PickItem {
                label: format!("{} ({} turns)", self.section_name(j), turns[j]),
                value: PickValue::Section(j),
            })
            .collect();
        let name = self.section_name(x);
        self.overlays.push(Overlay::Picker(Picker {
            title: format!("split {name} into halves around which section?"),
            header: "nearest first".into(),
            purpose: PickPurpose::SplitAround(x),
            items,
            selected: 0,
            filter: String::new(),
        }));
    }

    fn open_partner_picker(&mut self) {
        let i = self.stack_sel;
        let Some(Section::Winding(me)) = self.build.stack.get(i).cloned() else {
            self.refuse("select a winding section to wind bifilar");
            return;
        };
        let mut items = vec![PickItem {
            label: format!("{} alone (no bifilar partner)", me.winding),
            value: PickValue::Partner(None),
        }];
        for w in self.build.windings.iter().filter(|w| w.name != me.winding) {
            items.push(PickItem {
                label: format!(
                    "{} with {} ({}, {}, {} turns)",
                    me.winding,
                    w.name,
                    w.role.key(),
                    w.wire,
                    w.turns
                ),
                value: PickValue::Partner(Some(w.name.to_string())),
            });
        }
        let selected = items
            .iter()
            .position(|it| it.value == PickValue::Partner(me.with.clone()))
            .unwrap_or(0);
        let name = self.section_name(i);
        self.overlays.push(Overlay::Picker(Picker {
            title: format!("wind section {name} bifilar with"),
            header: "the partner's turns come from its own sections".into(),
            purpose: PickPurpose::Partner(i),
            items,
            selected,
            filter: String::new(),
        }));
    }

    fn open_add_picker(&mut self) {
        let at = (self.stack_sel + 1).min(self.build.stack.len());
        let mut items = vec![PickItem {
            label: "tape, 1 wrap".into(),
            value: PickValue::AddTape,
        }];
        for w in &self.build.windings {
            items.push(PickItem {
                label: format!("a share of {} (half of its outermost section)", w.name),
                value: PickValue::AddShare(w.name.to_string()),
            });
        }
        self.overlays.push(Overlay::Picker(Picker {
            title: "add a section above the selected one".into(),
            header: String::new(),
            purpose: PickPurpose::AddSection(at),
            items,
            selected: 0,
            filter: String::new(),
        }));
    }

    fn picker_key(&mut self, action: Action, mut p: Picker) -> Option<Effect> {
        let top = self.overlays.len() - 1;
        let n = p.visible().len();
        match action {
            Action::Up => p.selected = p.selected.saturating_sub(1),
            Action::Down => p.selected = (p.selected + 1).min(n.saturating_sub(1)),
            Action::PageUp => p.selected = p.selected.saturating_sub(10),
            Action::PageDown => p.selected = (p.selected + 10).min(n.saturating_sub(1)),
            Action::Input(c) => {
                p.filter.push(c);
                p.selected = 0;
            }
            Action::Backspace => {
                p.filter.pop();
                p.selected = 0;
            }
            Action::Cancel => {
                self.overlays.pop();
                return None;
            }
            Action::Confirm => {
                let Some(value) = p.visible().get(p.selected).map(|it| it.value.clone()) else {
                    self.refuse("nothing matches the filter");
                    return None;
                };
                self.overlays.pop();
                self.choose(p.purpose, value);
                return None;
            }
            _ => {}
        }
        self.overlays[top] = Overlay::Picker(p);
        None
    }

    fn choose(&mut self, purpose: PickPurpose, value: PickValue) {
        match (purpose, value) {
            (PickPurpose::Wire(k), PickValue::Wire(w)) => {
                let name = self.build.windings[k].name.clone();
                self.edit(format!("wire of {name}: {w}"), |b| {
                    b.windings[k].wire = w;
                    Ok(())
                });
            }
            (PickPurpose::Wire(k), PickValue::MeasuredWire) => {
                let text = match self.build.windings[k].wire {
                    WireSize::Measured { bare_mm, od_mm } => {
                        format!("{} {}", trim_mm(bare_mm), trim_mm(od_mm))
                    }
                    _ => String::new(),
                };
                let name = self.build.windings[k].name.clone();
                self.prompt(
                    format!("measured wire of {name}"),
                    text,
                    PromptPurpose::MeasuredWire(k),
                );
            }
            (PickPurpose::Bobbin, PickValue::Bobbin { id, bobbin }) => {
                self.edit(format!("bobbin {id}"), |b| {
                    b.bobbin_source = BobbinSource::Id(id.clone());
                    b.bobbin = *bobbin;
                    Ok(())
                });
            }
            (PickPurpose::Bobbin, PickValue::MeasuredBobbin) => {
                let ok = self.edit("measured bobbin", |b| {
                    if b.bobbin_source != BobbinSource::Inline {
                        b.bobbin_source = BobbinSource::Inline;
                        b.bobbin.origin = "measured".into();
                        b.bobbin.name = format!("measured, started from {}", b.bobbin.name);
                    }
                    Ok(())
                });
                if ok.is_some() {
                    self.start_core_draft();
                    self.open_form(FormKind::Bobbin);
                }
            }
            (PickPurpose::NewBuild, PickValue::Bobbin { id, bobbin }) => {
                let bob = *bobbin;
                let path = if self.saved.is_none() {
                    self.path.clone()
                } else {
                    None
                };
                let theme = self.theme;
                *self = App::new(edit::new_build(&id, bob), path);
                self.saved = None;
                self.theme = theme;
                self.info(format!(
                    "new build on {id}: a primary and a secondary to start from; W saves"
                ));
            }
            (PickPurpose::SplitAround(x), PickValue::Section(y)) => {
                let a = self.section_name(x);
                let c = self.section_name(y);
                if let Some(sel) = self.edit(format!("split {a} around {c}"), |b| {
                    edit::split_around(b, x, y)
                }) {
                    self.stack_sel = sel;
                }
            }
            (PickPurpose::Partner(i), PickValue::Partner(p)) => {
                let name = self.section_name(i);
                let label = match &p {
                    Some(p) => format!("wind {name} bifilar with {p}"),
                    None => format!("wind {name} alone"),
                };
                if let Some(sel) = self.edit(label, |b| edit::set_partner(b, i, p.as_deref())) {
                    self.stack_sel = sel;
                }
            }
            (PickPurpose::AddSection(at), PickValue::AddTape) => {
                if let Some(sel) = self.edit("add a tape section", |b| edit::add_tape(b, at)) {
                    self.stack_sel = sel;
                }
            }
            (PickPurpose::Search, PickValue::Candidate(n)) => self.take_candidate(n),
            (PickPurpose::Grade, PickValue::Grade(g)) => self.set_grade(g),
            (PickPurpose::AddSection(at), PickValue::AddShare(w)) => {
                if let Some(sel) = self.edit(format!("add a section of {w}"), |b| {
                    edit::add_share(b, at, &w)
                }) {
                    self.stack_sel = sel;
                }
            }
            _ => {}
        }
    }

    /// The rows of a form: the field, its label and its value as text.
    pub fn form_rows(&self, kind: FormKind) -> Vec<(Field, &'static str, String)> {
        let b = &self.build;
        let opt =
            |v: Option<f64>, unit: &str| v.map_or("none".to_string(), |v| format!("{v} {unit}"));
        match kind {
            FormKind::Setup => {
                let s = &b.setup;
                vec![
                    (Field::Title, "title", b.title.clone()),
                    (
                        Field::Temperature,
                        "winding temperature",
                        format!("{} C", s.temperature_c),
                    ),
                    (
                        Field::Allowance,
                        "hand-winding allowance",
                        format!("x {}", s.bulge),
                    ),
                    (
                        Field::Margin,
                        "margin tape at each flange",
                        format!("{} mm", s.margin_mm),
                    ),
                    (
                        Field::TapeMm,
                        "tape thickness per wrap",
                        format!("{} mm", s.tape_mm),
                    ),
                    (
                        Field::Frequency,
                        "switching frequency",
                        opt(s.frequency_khz, "kHz"),
                    ),
                ]
            }
            FormKind::Winding(k) => {
                let Some(w) = b.windings.get(k) else {
                    return Vec::new();
                };
                let pins = format!(
                    "{} to {}",
                    w.start_pin.as_deref().unwrap_or("-"),
                    w.finish_pin.as_deref().unwrap_or("-")
                );
                vec![
                    (Field::WName(k), "name", w.name.to_string()),
                    (Field::WRole(k), "role", w.role.key().to_string()),
                    (Field::WTurns(k), "turns", w.turns.to_string()),
                    (Field::WWire(k), "wire", w.wire.to_string()),
                    (Field::WGrade(k), "insulation", w.insulation.to_string()),
                    (
                        Field::WStrands(k),
                        "strands in parallel",
                        w.strands.to_string(),
                    ),
                    (Field::WCurrent(k), "RMS current", opt(w.current_rms_a, "A")),
                    (Field::WPins(k), "pins (start, finish)", pins),
                ]
            }
            FormKind::Bobbin => {
                let bb = &b.bobbin;
                let mut rows = vec![
                    (Field::BName, "name", bb.name.clone()),
                    (
                        Field::BWidth,
                        "window width (flange to flange)",
                        format!("{} mm", bb.window.width_mm),
                    ),
                    (
                        Field::BHeight,
                        "window height (tube to limit)",
                        format!("{} mm", bb.window.height_mm),
                    ),
                ];
                match bb.tube {
                    Tube::Rect {
                        width_mm,
                        depth_mm,
                        corner_radius_mm,
                    } => {
                        rows.push((Field::BShape, "tube shape", "rectangular".into()));
                        rows.push((Field::BTubeWidth, "tube width", format!("{width_mm} mm")));
                        rows.push((Field::BTubeDepth, "tube depth", format!("{depth_mm} mm")));
                        rows.push((
                            Field::BTubeRadius,
                            "tube corner radius",
                            format!("{corner_radius_mm} mm"),
                        ));
                    }
                    Tube::Round { diameter_mm } => {
                        rows.push((Field::BShape, "tube shape", "round".into()));
                        rows.push((
                            Field::BTubeDiameter,
                            "tube diameter",
                            format!("{diameter_mm} mm"),
                        ));
                    }
                }
                rows.extend(self.core_rows());
                rows
            }
            FormKind::Operating => self.operating_rows(),
            FormKind::Material => self.material_rows(),
            FormKind::Isolation => self.isolation_rows(),
        }
    }

    fn form_key(&mut self, action: Action, mut f: Form) {
        let top = self.overlays.len() - 1;
        let rows = self.form_rows(f.kind);
        match action {
            Action::Up => f.selected = f.selected.saturating_sub(1),
            Action::Down => f.selected = (f.selected + 1).min(rows.len().saturating_sub(1)),
            Action::Cancel => {
                self.overlays.pop();
                return;
            }
            Action::Confirm => {
                self.overlays[top] = Overlay::Form(f.clone());
                if let Some((field, _, _)) = rows.get(f.selected) {
                    self.activate(*field);
                }
                return;
            }
            _ => {}
        }
        self.overlays[top] = Overlay::Form(f);
    }

    /// Change a field: cycle it, open its pick list, or ask for its value.
    fn activate(&mut self, field: Field) {
        let b = &self.build;
        let k_ok = |k: usize| k < b.windings.len();
        match field {
            Field::WRole(k) if k_ok(k) => {
                let r = edit::next_role(b.windings[k].role);
                let name = b.windings[k].name.clone();
                self.edit(format!("role of {name}: {}", r.key()), |b| {
                    b.windings[k].role = r;
                    Ok(())
                });
            }
            Field::WGrade(k) if k_ok(k) => {
                let g = edit::next_grade(b.windings[k].insulation);
                let name = b.windings[k].name.clone();
                self.edit(format!("insulation of {name}: {g}"), |b| {
                    b.windings[k].insulation = g;
                    Ok(())
                });
            }
            Field::WWire(k) if k_ok(k) => self.open_wire_picker(k),
            Field::BShape => {
                let tube = match b.bobbin.tube {
                    Tube::Rect { width_mm, .. } => Tube::Round {
                        diameter_mm: width_mm,
                    },
                    Tube::Round { diameter_mm } => Tube::Rect {
                        width_mm: diameter_mm,
                        depth_mm: diameter_mm,
                        corner_radius_mm: 0.0,
                    },
                };
                self.edit("tube shape", |b| {
                    b.bobbin.tube = tube;
                    Ok(())
                });
            }
            Field::WName(k)
            | Field::WTurns(k)
            | Field::WStrands(k)
            | Field::WCurrent(k)
            | Field::WPins(k)
                if !k_ok(k) => {}
            _ if self.activate_more(field) => {}
            _ => {
                let kind = field.form();
                let Some((_, label, _)) = self
                    .form_rows(kind)
                    .into_iter()
                    .find(|(f, _, _)| *f == field)
                else {
                    return;
                };
                let text = self.field_text(field);
                self.prompt(label, text, PromptPurpose::Field(field));
            }
        }
    }

    /// A field's value as the text to start editing from.
    fn field_text(&self, field: Field) -> String {
        let b = &self.build;
        let w = |k: usize| &b.windings[k];
        let tube = &b.bobbin.tube;
        match field {
            Field::Title => b.title.clone(),
            Field::Temperature => b.setup.temperature_c.to_string(),
            Field::Allowance => b.setup.bulge.to_string(),
            Field::Margin => b.setup.margin_mm.to_string(),
            Field::TapeMm => b.setup.tape_mm.to_string(),
            Field::Frequency => b
                .setup
                .frequency_khz
                .map(|f| f.to_string())
                .unwrap_or_default(),
            Field::WName(k) => w(k).name.to_string(),
            Field::WTurns(k) => w(k).turns.to_string(),
            Field::WStrands(k) => w(k).strands.to_string(),
            Field::WCurrent(k) => w(k)
                .current_rms_a
                .map(|c| c.to_string())
                .unwrap_or_default(),
            Field::WPins(k) => format!(
                "{} {}",
                w(k).start_pin.as_deref().unwrap_or(""),
                w(k).finish_pin.as_deref().unwrap_or("")
            )
            .trim()
            .to_string(),
            Field::BName => b.bobbin.name.clone(),
            Field::BWidth => b.bobbin.window.width_mm.to_string(),
            Field::BHeight => b.bobbin.window.height_mm.to_string(),
            Field::BTubeWidth => match tube {
                Tube::Rect { width_mm, .. } => width_mm.to_string(),
                _ => String::new(),
            },
            Field::BTubeDepth => match tube {
                Tube::Rect { depth_mm, .. } => depth_mm.to_string(),
                _ => String::new(),
            },
            Field::BTubeRadius => match tube {
                Tube::Rect {
                    corner_radius_mm, ..
                } => corner_radius_mm.to_string(),
                _ => String::new(),
            },
            Field::BTubeDiameter => match tube {
                Tube::Round { diameter_mm } => diameter_mm.to_string(),
                _ => String::new(),
            },
            _ => self.field_text_more(field),
        }
    }

    fn prompt_key(&mut self, action: Action, mut p: Prompt) -> Option<Effect> {
        let top = self.overlays.len() - 1;
        match action {
            Action::Input(c) => p.text.push(c),
            Action::Backspace => {
                p.text.pop();
            }
            Action::Cancel => {
                self.overlays.pop();
                return None;
            }
            Action::Confirm => {
                self.overlays.pop();
                return self.submit(p.purpose, p.text);
            }
            _ => {}
        }
        self.overlays[top] = Overlay::Prompt(p);
        None
    }

    /// A typed value: parse it, then edit (or hand the file name to the loop).
    fn submit(&mut self, purpose: PromptPurpose, text: String) -> Option<Effect> {
        let t = text.trim();
        let bad_number = |app: &mut App, what: &str| {
            app.refuse(format!("\"{t}\" is not {what}"));
        };
        match purpose {
            PromptPurpose::SavePath { then_quit } => {
                if t.is_empty() {
                    self.refuse("no file name given");
                    return None;
                }
                let p = PathBuf::from(t);
                return Some(if then_quit {
                    Effect::SaveThenQuit(p)
                } else {
                    Effect::Save(p)
                });
            }
            PromptPurpose::OpenPath => {
                if t.is_empty() {
                    return None;
                }
                return Some(Effect::Open(PathBuf::from(t)));
            }
            PromptPurpose::SheetPath => {
                if t.is_empty() {
                    self.refuse("no file name given");
                    return None;
                }
                return Some(Effect::WriteSheet(PathBuf::from(t)));
            }
            PromptPurpose::BobbinId => return self.save_bobbin_as(t),
            PromptPurpose::SectionTurns(i) => match parse_u32(t) {
                Some(n) => {
                    let name = self.section_name(i);
                    self.edit(format!("turns of {name}: {n}"), |b| {
                        edit::set_section_turns(b, i, n)
                    });
                }
                None => bad_number(self, "a whole number of turns"),
            },
            PromptPurpose::Wraps(i) => match parse_u32(t) {
                Some(n) => {
                    self.edit(format!("tape wraps of #{}: {n}", i + 1), |b| {
                        edit::set_wraps(b, i, n)
                    });
                }
                None => bad_number(self, "a whole number of wraps"),
            },
            PromptPurpose::MeasuredWire(k) => {
                let nums: Vec<Option<f64>> = t
                    .split(|c: char| c.is_whitespace() || c == ',' || c == '/')
                    .filter(|s| !s.is_empty())
                    .map(parse_f64)
                    .collect();
                match nums.as_slice() {
                    [Some(bare_mm), Some(od_mm)] => {
                        let (bare_mm, od_mm) = (*bare_mm, *od_mm);
                        let name = self.build.windings[k].name.clone();
                        self.edit(format!("measured wire of {name}"), |b| {
                            b.windings[k].wire = WireSize::Measured { bare_mm, od_mm };
                            Ok(())
                        });
                    }
                    _ => self.refuse(format!(
                        "\"{t}\" is not two diameters in mm (bare, then overall)"
                    )),
                }
            }
            PromptPurpose::Field(field) => self.submit_field(field, t),
        }
        None
    }

    fn submit_field(&mut self, field: Field, t: &str) {
        let num = parse_f64(t);
        if self.submit_more(field, t) {
            return;
        }
        let label = self
            .form_rows(field.form())
            .into_iter()
            .find(|(f, _, _)| *f == field)
            .map(|(_, l, _)| l)
            .unwrap_or("value");
        let need_num = |app: &mut App| app.refuse(format!("\"{t}\" is not a number"));
        let setter: Option<Setter> = match field {
            Field::Title => {
                let s = t.to_string();
                Some(Box::new(move |b| {
                    b.title = s;
                    Ok(())
                }))
            }
            Field::WName(k) => {
                let s = t.to_string();
                Some(Box::new(move |b| edit::rename(b, k, &s)))
            }
            Field::WTurns(k) => match parse_u32(t) {
                Some(n) => Some(Box::new(move |b| edit::set_winding_turns(b, k, n))),
                None => {
                    self.refuse(format!("\"{t}\" is not a whole number of turns"));
                    return;
                }
            },
            Field::WStrands(k) => match parse_u32(t) {
                Some(n) if n > 0 => Some(Box::new(move |b| {
                    b.windings[k].strands = n;
                    Ok(())
                })),
                _ => {
                    self.refuse(format!(
                        "\"{t}\" is not a whole number of strands (1 or more)"
                    ));
                    return;
                }
            },
            Field::WCurrent(k) if t.is_empty() || t == "none" => Some(Box::new(move |b| {
                b.windings[k].current_rms_a = None;
                Ok(())
            })),
            Field::Frequency if t.is_empty() || t == "none" => Some(Box::new(|b| {
                b.setup.frequency_khz = None;
                Ok(())
            })),
            Field::WPins(k) => {
                let mut it = t.split(|c: char| c.is_whitespace() || c == ',');
                let mut next = || it.find(|s| !s.is_empty()).map(str::to_string);
                let (s, f) = (next(), next());
                Some(Box::new(move |b| {
                    b.windings[k].start_pin = s;
                    b.windings[k].finish_pin = f;
                    Ok(())
                }))
            }
            Field::BName => {
                let s = t.to_string();
                Some(Box::new(move |b| {
                    b.bobbin.name = s;
                    Ok(())
                }))
            }
            _ => match num {
                None => {
                    need_num(self);
                    return;
                }
                Some(v) => Some(Box::new(move |b: &mut Build| {
                    set_number(b, field, v);
                    Ok(())
                })),
            },
        };
        if let Some(f) = setter {
            let text = if t.is_empty() { "none" } else { t };
            self.edit(format!("{label}: {text}"), f);
        }
    }

    /// The loop found a file where `effect` would write: ask before replacing it.
    pub fn ask_overwrite(&mut self, effect: Effect) {
        self.overlays
            .push(Overlay::Question(Question::Overwrite(Box::new(effect))));
    }

    fn question_key(&mut self, action: Action, q: &Question) -> Option<Effect> {
        match action {
            Action::Yes => {
                self.overlays.pop();
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
                self.overlays.pop();
                match self.path.clone() {
                    Some(p) => return Some(Effect::SaveThenQuit(p)),
                    None => self.ask_save_path(true),
                }
            }
            Action::No | Action::Cancel => {
                self.overlays.pop();
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

/// An edit made from a typed field value.
type Setter = Box<dyn FnOnce(&mut Build) -> Result<(), Refusal>>;

/// Set a numeric field of the setup or the bobbin.
fn set_number(b: &mut Build, field: Field, v: f64) {
    let s = &mut b.setup;
    match field {
        Field::Temperature => s.temperature_c = v,
        Field::Allowance => s.bulge = v,
        Field::Margin => s.margin_mm = v,
        Field::TapeMm => s.tape_mm = v,
        Field::Frequency => s.frequency_khz = Some(v),
        Field::WCurrent(k) => b.windings[k].current_rms_a = Some(v),
        Field::BWidth => b.bobbin.window.width_mm = v,
        Field::BHeight => b.bobbin.window.height_mm = v,
        Field::BTubeWidth | Field::BTubeDepth | Field::BTubeRadius => {
            if let Tube::Rect {
                width_mm,
                depth_mm,
                corner_radius_mm,
            } = &mut b.bobbin.tube
            {
                match field {
                    Field::BTubeWidth => *width_mm = v,
                    Field::BTubeDepth => *depth_mm = v,
                    _ => *corner_radius_mm = v,
                }
            }
        }
        Field::BTubeDiameter => {
            if let Tube::Round { diameter_mm } = &mut b.bobbin.tube {
                *diameter_mm = v;
            }
        }
        _ => {}
    }
}

/// The first readable bobbin of the library, for a build that has none yet.
fn first_bobbin() -> (String, crate::model::Bobbin) {
    let lib = BobbinLibrary::standard();
    lib.entries()
        .into_iter()
        .find_map(|e| e.bobbin.ok().map(|b| (e.id, b)))
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
