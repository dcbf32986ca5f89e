//! The one table of keys: key -> action, with the words the help screen and the status-line
//! hints show. Nothing else in the planner decides what a key does.

use super::action::Action;
use ratatui::crossterm::event::{KeyCode, KeyEvent, KeyModifiers};

/// Where a binding applies.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Context {
    /// The main screen, whichever panel has the focus.
    Main,
    /// The main screen with the stack panel focused.
    Stack,
    /// The main screen with the windings panel focused.
    Windings,
    /// A pick list or a form.
    List,
    /// The line editor.
    Prompt,
    /// A yes/no question.
    Question,
    /// The help screen.
    HelpScreen,
    /// The readings against the plan.
    Readings,
    /// The reset-ratio view.
    ResetRatio,
    /// While a search or a design runs.
    Job,
}

impl Context {
    pub fn title(self) -> &'static str {
        match self {
            Context::Main => "anywhere",
            Context::Stack => "stack panel",
            Context::Windings => "windings panel",
            Context::List => "pick lists and forms",
            Context::Prompt => "typing a value",
            Context::Question => "questions",
            Context::HelpScreen => "this help",
            Context::Readings => "readings against the plan",
            Context::ResetRatio => "reset-ratio view",
            Context::Job => "while a search or a design runs",
        }
    }
}

/// A key as the table names it.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Key {
    Char(char),
    Ctrl(char),
    Up,
    Down,
    ShiftUp,
    ShiftDown,
    PageUp,
    PageDown,
    Enter,
    Esc,
    Tab,
    BackTab,
    Backspace,
    Delete,
}

impl Key {
    pub fn label(self) -> String {
        match self {
            Key::Char(' ') => "Space".into(),
            Key::Char(c) => c.to_string(),
            Key::Ctrl(c) => format!("Ctrl-{c}"),
            Key::Up => "↑".into(),
            Key::Down => "↓".into(),
            Key::ShiftUp => "Shift-↑".into(),
            Key::ShiftDown => "Shift-↓".into(),
            Key::PageUp => "PgUp".into(),
            Key::PageDown => "PgDn".into(),
            Key::Enter => "Enter".into(),
            Key::Esc => "Esc".into(),
            Key::Tab => "Tab".into(),
            Key::BackTab => "Shift-Tab".into(),
            Key::Backspace => "Backspace".into(),
            Key::Delete => "Del".into(),
        }
    }

    fn matches(self, ev: &KeyEvent) -> bool {
        let ctrl = ev.modifiers.contains(KeyModifiers::CONTROL);
        let shift = ev.modifiers.contains(KeyModifiers::SHIFT);
        match (self, ev.code) {
            (Key::Char(c), KeyCode::Char(k)) => !ctrl && c == k,
            (Key::Ctrl(c), KeyCode::Char(k)) => ctrl && c == k.to_ascii_lowercase(),
            (Key::Up, KeyCode::Up) => !shift,
            (Key::Down, KeyCode::Down) => !shift,
            (Key::ShiftUp, KeyCode::Up) => shift,
            (Key::ShiftDown, KeyCode::Down) => shift,
            (Key::PageUp, KeyCode::PageUp) => true,
            (Key::PageDown, KeyCode::PageDown) => true,
            (Key::Enter, KeyCode::Enter) => true,
            (Key::Esc, KeyCode::Esc) => true,
            (Key::Tab, KeyCode::Tab) => true,
            (Key::BackTab, KeyCode::BackTab) => true,
            (Key::Backspace, KeyCode::Backspace) => true,
            (Key::Delete, KeyCode::Delete) => true,
            _ => false,
        }
    }
}

pub struct Binding {
    pub context: Context,
    pub keys: &'static [Key],
    pub action: Action,
    /// A word or two for the status-line hint; empty keeps it out of the hints.
    pub hint: &'static str,
    /// One line for the help screen.
    pub help: &'static str,
}

const fn b(
    context: Context,
    keys: &'static [Key],
    action: Action,
    hint: &'static str,
    help: &'static str,
) -> Binding {
    Binding {
        context,
        keys,
        action,
        hint,
        help,
    }
}

use Context as C;
use Key as K;

/// The key map. Order matters only for the help screen and the hints.
pub const BINDINGS: &[Binding] = &[
    b(
        C::Main,
        &[K::Char('?')],
        Action::Help,
        "help",
        "show this help (every key)",
    ),
    b(
        C::Main,
        &[K::Tab, K::BackTab],
        Action::SwitchPanel,
        "panel",
        "switch between the stack and the windings panels",
    ),
    b(
        C::Main,
        &[K::Up, K::Char('k')],
        Action::Up,
        "",
        "select the item above",
    ),
    b(
        C::Main,
        &[K::Down, K::Char('j')],
        Action::Down,
        "",
        "select the item below",
    ),
    b(
        C::Main,
        &[K::Char('u')],
        Action::Undo,
        "undo",
        "undo the last edit",
    ),
    b(
        C::Main,
        &[K::Char('U'), K::Ctrl('r')],
        Action::Redo,
        "redo",
        "redo the edit undone last",
    ),
    b(
        C::Main,
        &[K::Char('p')],
        Action::Pin,
        "pin",
        "pin the figures now as the reference to compare against (again: unpin)",
    ),
    b(
        C::Main,
        &[K::Char('B')],
        Action::Bobbin,
        "",
        "change the bobbin: pick one from the library or enter a measured one",
    ),
    b(
        C::Main,
        &[K::Char('G')],
        Action::Setup,
        "",
        "setup: title, temperature, allowance, margin, tape thickness, frequency",
    ),
    b(
        C::Main,
        &[K::Char('V')],
        Action::Operating,
        "",
        "operating point: voltages, reset turns, duty limit, switch rating, ambient",
    ),
    b(
        C::Main,
        &[K::Char('M')],
        Action::Material,
        "",
        "core material: ferrite grade, saturation and remanent flux, mu_i, loss, gap",
    ),
    b(
        C::Main,
        &[K::Char('I')],
        Action::Isolation,
        "",
        "isolation: functional, basic or reinforced, working voltage, creepage",
    ),
    b(
        C::Main,
        &[K::Char('R')],
        Action::Readings,
        "",
        "bench readings of the wound part; its last row: predicted vs measured",
    ),
    b(
        C::Main,
        &[K::Char('D')],
        Action::ResetRatio,
        "",
        "reset ratio: duty limit and switch voltage against the reset turns",
    ),
    b(
        C::Main,
        &[K::Char('S')],
        Action::Search,
        "search",
        "search wires, strands and section orders; Enter takes a candidate",
    ),
    b(
        C::Main,
        &[K::Char('E')],
        Action::Sheet,
        "",
        "write the winding sheet to a file (.html: a printable page)",
    ),
    b(
        C::Main,
        &[K::Char('N')],
        Action::NewBuild,
        "",
        "start a new build: from a library bobbin or from requirements",
    ),
    b(
        C::Main,
        &[K::Char('O')],
        Action::Open,
        "",
        "open a build file",
    ),
    b(
        C::Main,
        &[K::Char('W'), K::Ctrl('s')],
        Action::Save,
        "save",
        "save the build (asks for a file name the first time)",
    ),
    b(
        C::Main,
        &[K::Char('A')],
        Action::SaveAs,
        "",
        "save the build under a new file name",
    ),
    b(
        C::Main,
        &[K::Char('q'), K::Ctrl('c')],
        Action::Quit,
        "quit",
        "quit (asks first when there are unsaved edits)",
    ),
    // The stack panel.
    b(
        C::Stack,
        &[K::Enter],
        Action::EditSection,
        "turns",
        "set the turns of the section (a tape section: its wraps)",
    ),
    b(
        C::Stack,
        &[K::Char('s')],
        Action::Split,
        "split",
        "split the winding section into halves around another section",
    ),
    b(
        C::Stack,
        &[K::Char('b')],
        Action::Partner,
        "bifilar",
        "wind the section bifilar with another winding, or alone",
    ),
    b(
        C::Stack,
        &[K::Char('e')],
        Action::Spread,
        "",
        "space the last layer's turns evenly across the width (~), or not",
    ),
    b(
        C::Stack,
        &[K::Char('+'), K::Char('=')],
        Action::More,
        "+tape",
        "one more tape wrap (a winding section: between its layers)",
    ),
    b(
        C::Stack,
        &[K::Char('-')],
        Action::Less,
        "",
        "one tape wrap fewer",
    ),
    b(
        C::Stack,
        &[K::Char('a')],
        Action::AddSection,
        "add",
        "add a section above the selected one: tape, or a share of a winding",
    ),
    b(
        C::Stack,
        &[K::Char('d'), K::Delete],
        Action::DeleteSection,
        "delete",
        "delete the section (its turns go to the winding's nearest other section)",
    ),
    b(
        C::Stack,
        &[K::Char('K'), K::ShiftUp],
        Action::MoveOut,
        "",
        "move the section outward (away from the tube)",
    ),
    b(
        C::Stack,
        &[K::Char('J'), K::ShiftDown],
        Action::MoveIn,
        "",
        "move the section inward (toward the tube)",
    ),
    // The windings panel.
    b(
        C::Windings,
        &[K::Enter],
        Action::EditWinding,
        "edit",
        "open the winding's form: every property",
    ),
    b(
        C::Windings,
        &[K::Char('w')],
        Action::Wire,
        "wire",
        "pick the wire (AWG, metric, measured); foil: thickness, litz: strands",
    ),
    b(
        C::Windings,
        &[K::Char('t')],
        Action::WindingTurns,
        "turns",
        "set the winding's turns (the difference goes to its outermost section)",
    ),
    b(
        C::Windings,
        &[K::Char('g')],
        Action::Grade,
        "grade",
        "next insulation grade (grade 1, 2, 3, triple-insulated)",
    ),
    b(
        C::Windings,
        &[K::Char('+'), K::Char('=')],
        Action::More,
        "+strand",
        "one more strand in parallel",
    ),
    b(
        C::Windings,
        &[K::Char('-')],
        Action::Less,
        "",
        "one strand fewer",
    ),
    b(
        C::Windings,
        &[K::Char('n')],
        Action::Rename,
        "",
        "rename the winding (the stack follows)",
    ),
    b(
        C::Windings,
        &[K::Char('r')],
        Action::Role,
        "",
        "next role (primary, secondary, reset, auxiliary)",
    ),
    b(
        C::Windings,
        &[K::Char('c')],
        Action::Current,
        "",
        "set the RMS current (empty: none)",
    ),
    b(
        C::Windings,
        &[K::Char('i')],
        Action::Pins,
        "",
        "set the start and finish pins",
    ),
    b(
        C::Windings,
        &[K::Char('a')],
        Action::AddWinding,
        "add",
        "add a winding, wound outermost",
    ),
    b(
        C::Windings,
        &[K::Char('d'), K::Delete],
        Action::DeleteWinding,
        "",
        "delete the winding and its sections",
    ),
    // Pop-ups.
    b(C::List, &[K::Up], Action::Up, "", "previous entry"),
    b(C::List, &[K::Down], Action::Down, "", "next entry"),
    b(C::List, &[K::PageUp], Action::PageUp, "", "a page up"),
    b(C::List, &[K::PageDown], Action::PageDown, "", "a page down"),
    b(
        C::List,
        &[K::Enter],
        Action::Confirm,
        "choose",
        "choose the entry (in a form: change the field)",
    ),
    b(
        C::List,
        &[K::Esc],
        Action::Cancel,
        "close",
        "close without choosing",
    ),
    b(
        C::List,
        &[K::Backspace],
        Action::Backspace,
        "",
        "pick lists: typing filters the list; Backspace deletes",
    ),
    b(
        C::Prompt,
        &[K::Enter],
        Action::Confirm,
        "accept",
        "accept the value",
    ),
    b(
        C::Prompt,
        &[K::Esc],
        Action::Cancel,
        "cancel",
        "cancel, keep the old value",
    ),
    b(
        C::Prompt,
        &[K::Backspace],
        Action::Backspace,
        "",
        "delete the character before the cursor",
    ),
    b(C::Question, &[K::Char('y')], Action::Yes, "yes", "yes"),
    b(
        C::Question,
        &[K::Char('s')],
        Action::SaveThenQuit,
        "",
        "save, then quit (when quitting)",
    ),
    b(
        C::Question,
        &[K::Char('n'), K::Esc],
        Action::No,
        "no",
        "no, go back",
    ),
    b(
        C::HelpScreen,
        &[K::Down, K::Char('j'), K::PageDown],
        Action::Down,
        "",
        "scroll down",
    ),
    b(
        C::HelpScreen,
        &[K::Up, K::Char('k'), K::PageUp],
        Action::Up,
        "",
        "scroll up",
    ),
    b(
        C::HelpScreen,
        &[K::Esc, K::Char('?'), K::Char('q')],
        Action::Cancel,
        "close",
        "close the help",
    ),
    b(
        C::Readings,
        &[K::Down, K::Char('j'), K::PageDown],
        Action::Down,
        "",
        "scroll down",
    ),
    b(
        C::Readings,
        &[K::Up, K::Char('k'), K::PageUp],
        Action::Up,
        "",
        "scroll up",
    ),
    b(
        C::Readings,
        &[K::Esc, K::Char('q')],
        Action::Cancel,
        "back",
        "back to the readings form",
    ),
    b(
        C::ResetRatio,
        &[K::Esc, K::Char('D'), K::Char('q')],
        Action::Cancel,
        "close",
        "close the reset-ratio view",
    ),
    b(
        C::Job,
        &[K::Esc, K::Ctrl('c')],
        Action::Cancel,
        "cancel",
        "stop the search or design under way; the build stays as it was",
    ),
];

/// The action of a key in the given contexts (searched in order); typed characters become
/// `Input` where text is wanted.
pub fn lookup(contexts: &[Context], ev: &KeyEvent) -> Option<Action> {
    for &c in contexts {
        if let Some(bd) = BINDINGS
            .iter()
            .find(|bd| bd.context == c && bd.keys.iter().any(|k| k.matches(ev)))
        {
            return Some(bd.action);
        }
    }
    let text = contexts
        .iter()
        .any(|c| matches!(c, Context::Prompt | Context::List));
    match ev.code {
        KeyCode::Char(ch) if text && !ev.modifiers.contains(KeyModifiers::CONTROL) => {
            Some(Action::Input(ch))
        }
        _ => None,
    }
}

/// The keys of a binding as the help shows them: `W / Ctrl-s`.
pub fn keys_label(bd: &Binding) -> String {
    bd.keys
        .iter()
        .map(|k| k.label())
        .collect::<Vec<_>>()
        .join(" / ")
}

/// Status-line hints for the contexts, first key of each binding that has a hint.
pub fn hints(contexts: &[Context]) -> Vec<(String, &'static str)> {
    contexts
        .iter()
        .flat_map(|&c| BINDINGS.iter().filter(move |bd| bd.context == c))
        .filter(|bd| !bd.hint.is_empty())
        .map(|bd| (bd.keys[0].label(), bd.hint))
        .collect()
}
