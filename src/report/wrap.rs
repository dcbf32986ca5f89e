//! Word wrapping by display width (unicode-width), for reports that must fit 80 columns.

use unicode_width::UnicodeWidthStr;

/// Wrap `text` to `width` columns; continuation lines start with `indent`.
pub fn wrap(text: &str, width: usize, indent: &str) -> Vec<String> {
    let mut lines = Vec::new();
    let mut line = String::new();
    for word in text.split_whitespace() {
        let room = if lines.is_empty() {
            width
        } else {
            width.saturating_sub(indent.width())
        };
        if !line.is_empty() && line.width() + 1 + word.width() > room {
            lines.push(std::mem::take(&mut line));
        }
        if !line.is_empty() {
            line.push(' ');
        }
        line.push_str(word);
    }
    if !line.is_empty() || lines.is_empty() {
        lines.push(line);
    }
    lines
        .into_iter()
        .enumerate()
        .map(|(i, l)| if i == 0 { l } else { format!("{indent}{l}") })
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn wraps_within_width() {
        let t = "the quick brown fox jumps over the lazy dog again and again";
        for l in wrap(t, 20, "  ") {
            assert!(l.width() <= 20, "{l}");
        }
        assert_eq!(wrap("short", 20, "  "), vec!["short".to_string()]);
    }
}
