//! Every command the planner understands, as one enum; keys map to these in `keymap.rs`.
//! Actions carry no figures: they say what the user asked for, `App::update` does it.

#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Action {
    // Anywhere on the main screen.
    Quit,
    Help,
    SwitchPanel,
    Up,
    Down,
    Undo,
    Redo,
    Save,
    SaveAs,
    Open,
    NewBuild,
    Bobbin,
    Setup,
    Pin,
    // The stack panel.
    EditSection,
    AddSection,
    DeleteSection,
    MoveOut,
    MoveIn,
    Split,
    Partner,
    More,
    Less,
    // The windings panel.
    EditWinding,
    WindingTurns,
    Rename,
    Role,
    Wire,
    Grade,
    Current,
    Pins,
    AddWinding,
    DeleteWinding,
    // Pop-ups: lists, forms, the line editor, questions.
    Confirm,
    Cancel,
    Backspace,
    Input(char),
    Yes,
    No,
    SaveThenQuit,
    PageUp,
    PageDown,
}
