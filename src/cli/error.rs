//! The command line's one error type and its one printer.
//!
//! Every command returns `Result<ExitCode, Error>`: `Ok` carries the exit code of a run that
//! worked (0 fits, 1 does not fit), `Err` what went wrong with the input or the output; the
//! printer writes it to stderr as `turnstack: ...` and the exit code is 2.

use crate::engine::search::SearchError;
use crate::files::LoadError;
use std::path::PathBuf;

/// Why a command could not do its job. Each is something a user can cause or fix.
#[derive(Debug, thiserror::Error)]
pub enum Error {
    /// A build or bobbin file cannot be read or is not valid (with the line and a caret).
    #[error("{}", .0.with_snippet())]
    Load(#[from] LoadError),
    /// An option or argument the command cannot use, said in words.
    #[error("{0}")]
    Input(String),
    /// The search cannot start on this build.
    #[error(transparent)]
    Search(#[from] SearchError),
    /// A file the command was asked to write could not be written.
    #[error("cannot write {}: {source}", path.display())]
    Write {
        /// The file asked for.
        path: PathBuf,
        /// What the system said.
        source: std::io::Error,
    },
    /// Standard output could not be written (a closed pipe is not an error).
    #[error("cannot write the output: {0}")]
    Output(std::io::Error),
    /// The planner was started without a terminal.
    #[error("the planner needs a terminal; for a report use `turnstack check [FILE]`")]
    NoTerminal,
    /// The terminal failed while the planner ran.
    #[error("terminal error: {0}")]
    Terminal(std::io::Error),
}

impl Error {
    /// A message about the input, for `Err(Error::input(...))`.
    pub fn input(message: impl Into<String>) -> Self {
        Error::Input(message.into())
    }
}

/// The one place the command line writes a line to stderr: errors, notices and what was
/// written where.
pub(crate) fn say(line: &str) {
    eprintln!("{line}");
}

/// A notice on stderr, `turnstack: ...` (the output on stdout stays clean for a pipe).
pub(crate) fn notice(message: &str) {
    say(&format!("turnstack: {message}"));
}

/// The printer of every error: `turnstack: ` and the message.
pub(crate) fn print_error(e: &Error) {
    notice(&e.to_string());
}
