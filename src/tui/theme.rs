//! Colours and emphasis. Only the terminal's own foreground/background and the 16 named
//! colours, so light and dark terminals both read; with NO_COLOR every colour is dropped and
//! the modifiers (bold, reverse, underline) stay. Nothing is told by colour alone.

use ratatui::style::{Color, Modifier, Style};

#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Theme {
    pub color: bool,
}

/// One colour per winding, in winding order; the drawing also gives each a letter.
const WINDING_COLORS: [Color; 6] = [
    Color::Blue,
    Color::Magenta,
    Color::Cyan,
    Color::Green,
    Color::Red,
    Color::Yellow,
];

impl Theme {
    /// Colour unless NO_COLOR is set to something non-empty (no-color.org).
    pub fn from_env() -> Self {
        let no_color = std::env::var_os("NO_COLOR").is_some_and(|v| !v.is_empty());
        Theme { color: !no_color }
    }

    pub fn plain() -> Self {
        Theme { color: false }
    }

    fn fg(self, c: Color) -> Style {
        if self.color {
            Style::new().fg(c)
        } else {
            Style::new()
        }
    }

    pub fn base(self) -> Style {
        Style::new()
    }

    pub fn dim(self) -> Style {
        Style::new().add_modifier(Modifier::DIM)
    }

    pub fn title(self) -> Style {
        Style::new().add_modifier(Modifier::BOLD)
    }

    /// The selected row: inverted cells read without colour.
    pub fn selected(self) -> Style {
        Style::new().add_modifier(Modifier::REVERSED)
    }

    pub fn focused_border(self) -> Style {
        self.fg(Color::Cyan).add_modifier(Modifier::BOLD)
    }

    pub fn border(self) -> Style {
        Style::new()
    }

    pub fn winding(self, k: usize) -> Style {
        self.fg(WINDING_COLORS[k % WINDING_COLORS.len()])
    }

    pub fn tape(self) -> Style {
        self.dim()
    }

    pub fn good(self) -> Style {
        self.fg(Color::Green).add_modifier(Modifier::BOLD)
    }

    /// A failed fit or overflow: bold and reversed as well, so it shows without colour.
    pub fn bad(self) -> Style {
        self.fg(Color::Red)
            .add_modifier(Modifier::BOLD | Modifier::REVERSED)
    }

    pub fn warn(self) -> Style {
        self.fg(Color::Red).add_modifier(Modifier::BOLD)
    }

    pub fn limit(self) -> Style {
        self.fg(Color::Red).add_modifier(Modifier::BOLD)
    }

    pub fn refused(self) -> Style {
        self.fg(Color::Red).add_modifier(Modifier::BOLD)
    }

    pub fn key(self) -> Style {
        Style::new().add_modifier(Modifier::BOLD)
    }
}
