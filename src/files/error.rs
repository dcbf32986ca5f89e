//! The one error a user can cause by a file: where it is and what was expected.

use std::fmt;
use std::path::{Path, PathBuf};

/// A problem with a build, bobbin or readings file: the file, line:column and key where it
/// is, and what was expected, printed as one line (`file:line:col: key: message`).
#[derive(Debug, Clone, PartialEq)]
pub struct LoadError {
    /// The file, when the text came from one.
    pub path: Option<PathBuf>,
    /// 1-based line and column, where known.
    pub line: Option<usize>,
    /// 1-based column, where known.
    pub column: Option<usize>,
    /// The key the problem is about, e.g. `winding #2 turns`.
    pub key: Option<String>,
    /// What is wrong and what was expected, in words a user can act on.
    pub message: String,
    /// The offending source line, for a caret display.
    pub source_line: Option<String>,
    /// Further problems found in the same file, one line each.
    pub also: Vec<String>,
}

impl std::error::Error for LoadError {}

impl LoadError {
    /// The error of a file that cannot be read ("no such file" for a missing one).
    pub fn io(path: &Path, e: &std::io::Error) -> Self {
        let why = match e.kind() {
            std::io::ErrorKind::NotFound => "no such file".to_string(),
            _ => e.to_string(),
        };
        LoadError {
            path: Some(path.to_path_buf()),
            line: None,
            column: None,
            key: None,
            message: format!("cannot read the file: {why}"),
            source_line: None,
            also: Vec::new(),
        }
    }

    /// An error at a byte span of `text`.
    pub fn at(
        text: &str,
        path: Option<&Path>,
        span: Option<std::ops::Range<usize>>,
        key: Option<String>,
        message: String,
    ) -> Self {
        let (line, column, source_line) = match span {
            Some(span) => {
                let start = span.start.min(text.len());
                let before = &text[..start];
                let line = before.matches('\n').count() + 1;
                let line_start = before.rfind('\n').map_or(0, |i| i + 1);
                let column = text[line_start..start].chars().count() + 1;
                let line_text = text[line_start..].lines().next().unwrap_or("").to_string();
                (Some(line), Some(column), Some(line_text))
            }
            None => (None, None, None),
        };
        LoadError {
            path: path.map(Path::to_path_buf),
            line,
            column,
            key,
            message,
            source_line,
            also: Vec::new(),
        }
    }

    /// The message with the offending line and a caret under the column.
    pub fn with_snippet(&self) -> String {
        let mut s = self.to_string();
        if let (Some(src), Some(col), Some(line)) = (&self.source_line, self.column, self.line) {
            let gutter = line.to_string();
            s.push_str(&format!(
                "\n {gutter} | {src}\n {} | {}^",
                " ".repeat(gutter.len()),
                " ".repeat(col - 1)
            ));
        }
        for more in &self.also {
            s.push_str(&format!("\nalso: {more}"));
        }
        s
    }
}

impl fmt::Display for LoadError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        if let Some(p) = &self.path {
            write!(f, "{}", p.display())?;
            if let Some(l) = self.line {
                write!(f, ":{l}")?;
                if let Some(c) = self.column {
                    write!(f, ":{c}")?;
                }
            }
            f.write_str(": ")?;
        } else if let Some(l) = self.line {
            write!(f, "line {l}")?;
            if let Some(c) = self.column {
                write!(f, ", column {c}")?;
            }
            f.write_str(": ")?;
        }
        if let Some(k) = &self.key {
            write!(f, "{k}: ")?;
        }
        f.write_str(&self.message)
    }
}
